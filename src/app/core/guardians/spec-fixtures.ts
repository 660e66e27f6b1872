import type { ConsentText, GuardianLinkView } from './guardian-api';

/*
 * Shapes shared by the guardian and admin specs, in the API's own form. Nothing in the app
 * imports this file.
 */

/** The consent text the specs' server serves. */
export const SPEC_CONSENT_TEXT: ConsentText = {
  version: '2026-12-01',
  text: 'I agree that the club may e-mail me a weekly summary of my child’s training.',
};

/** A link without consent; pass overrides for the state under test. */
export function specLink(overrides: Partial<GuardianLinkView> = {}): GuardianLinkView {
  return {
    id: '0b8c5a0e-8d1f-4a52-9d0e-6f3b0b6a1c01',
    guardianUserId: '0b8c5a0e-8d1f-4a52-9d0e-6f3b0b6a1c02',
    guardianName: 'Morgan Reyes',
    guardianEmail: 'morgan@example.org',
    playerId: '0b8c5a0e-8d1f-4a52-9d0e-6f3b0b6a1c03',
    playerName: 'Nia Reyes',
    playerFirstName: 'Nia',
    squadName: 'U14',
    relationship: 'parent',
    consentAt: null,
    consentTextVersion: null,
    consentRecordedByName: null,
    consentWithdrawnAt: null,
    digestOptIn: false,
    ...overrides,
  };
}

/** The same link with consent in force, recorded by the guardian. */
export function specConsentedLink(overrides: Partial<GuardianLinkView> = {}): GuardianLinkView {
  return specLink({
    consentAt: '2026-11-20T12:40:00.000Z',
    consentTextVersion: SPEC_CONSENT_TEXT.version,
    consentRecordedByName: 'Morgan Reyes',
    ...overrides,
  });
}
