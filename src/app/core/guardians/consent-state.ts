import { dateTimeLabel } from '../date-labels';
import type { GuardianLinkView } from './guardian-api';

/**
 * Where one link's consent stands. A union rather than loose flags so a screen cannot show
 * "recorded" and "withdrawn" at once, and the wording lives in one place for Guardian home and
 * Club admin alike.
 */
export type ConsentStatus =
  | { readonly kind: 'none' }
  | {
      readonly kind: 'active';
      readonly at: string;
      readonly version: string | null;
      readonly byName: string | null;
      /** Whether the text in force now is a newer version than the one consented to. */
      readonly outdated: boolean;
    }
  | { readonly kind: 'withdrawn'; readonly withdrawnAt: string };

/**
 * Whether the link has consent in force: recorded and not withdrawn since. A withdrawal older
 * than a later consent does not count, so the rule holds whether the server clears the
 * withdrawal on renewed consent or keeps it.
 */
export function hasActiveConsent(link: GuardianLinkView): boolean {
  if (link.consentAt === null) {
    return false;
  }
  if (link.consentWithdrawnAt === null) {
    return true;
  }
  return new Date(link.consentWithdrawnAt).getTime() < new Date(link.consentAt).getTime();
}

/** The link's consent state, compared against the consent text version in force (when known). */
export function consentStatus(link: GuardianLinkView, currentVersion: string | null): ConsentStatus {
  if (hasActiveConsent(link) && link.consentAt !== null) {
    return {
      kind: 'active',
      at: link.consentAt,
      version: link.consentTextVersion,
      byName: link.consentRecordedByName,
      outdated: currentVersion !== null && link.consentTextVersion !== null && link.consentTextVersion !== currentVersion,
    };
  }
  if (link.consentWithdrawnAt !== null) {
    return { kind: 'withdrawn', withdrawnAt: link.consentWithdrawnAt };
  }
  return { kind: 'none' };
}

/** One sentence saying who recorded what and when, e.g. for a table cell or a screen reader. */
export function consentSentence(status: ConsentStatus): string {
  switch (status.kind) {
    case 'none':
      return 'No consent recorded.';
    case 'withdrawn':
      return `Consent withdrawn on ${dateTimeLabel(status.withdrawnAt)}.`;
    case 'active': {
      const by = status.byName ? ` by ${status.byName}` : '';
      const version = status.version ? ` (consent text version ${status.version})` : '';
      return `Consent recorded on ${dateTimeLabel(status.at)}${by}${version}.`;
    }
  }
}
