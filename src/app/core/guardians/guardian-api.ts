import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type * as z from 'zod';
import type { ChildSummary, ConsentText, GuardianLinkView, createLinkSchema } from '../../../../shared/schemas/mail';

/** One ISO week of a child's training (Monday `weekStart`, reps, share on target or null). */
export type ChildWeek = ChildSummary['weeks'][number];

/** Body of `POST /api/guardians/links`, as the shared schema accepts it. */
export type LinkGuardianRequest = z.input<typeof createLinkSchema>;

/** The shared shapes (`shared/schemas/mail.ts`), re-exported so screens import them from the service that fetches them. */
export type { ChildSummary, ConsentText, GuardianLinkView };

/**
 * Guardian links, consent and the child summary: the one place that knows these URLs. Guardian
 * home uses it for the guardian's own links, Club admin for every link of the club — the server
 * scopes each answer to the caller, so the same calls serve both.
 */
@Injectable({ providedIn: 'root' })
export class GuardianApi {
  private readonly http = inject(HttpClient);

  /** The consent text in force now. */
  consentText(): Observable<ConsentText> {
    return this.http.get<ConsentText>('/api/guardians/consent-text');
  }

  /** The caller's links: a guardian's own, or (admin) all of the club. */
  listLinks(): Observable<GuardianLinkView[]> {
    return this.http.get<{ links: GuardianLinkView[] }>('/api/guardians/links').pipe(map((body) => body.links));
  }

  /** Links a guardian account to a player (admin). */
  linkGuardian(request: LinkGuardianRequest): Observable<GuardianLinkView> {
    return this.http.post<{ link: GuardianLinkView }>('/api/guardians/links', request).pipe(map((body) => body.link));
  }

  /** Removes a link (admin). */
  removeLink(linkId: string): Observable<void> {
    return this.http.delete<void>(`/api/guardians/links/${encodeURIComponent(linkId)}`);
  }

  /** Records the guardian's consent to the given text version. */
  recordConsent(linkId: string, textVersion: string): Observable<GuardianLinkView> {
    return this.http
      .post<{ link: GuardianLinkView }>(`/api/guardians/links/${encodeURIComponent(linkId)}/consent`, {
        consent: true,
        textVersion,
      })
      .pipe(map((body) => body.link));
  }

  /** Withdraws the guardian's consent (which also stops the digest on the server). */
  withdrawConsent(linkId: string): Observable<GuardianLinkView> {
    return this.http
      .post<{ link: GuardianLinkView }>(`/api/guardians/links/${encodeURIComponent(linkId)}/consent`, { consent: false })
      .pipe(map((body) => body.link));
  }

  /** Turns the Family digest on or off for one link (400 `consent_required` without consent). */
  setDigestOptIn(linkId: string, optIn: boolean): Observable<GuardianLinkView> {
    return this.http
      .put<{ link: GuardianLinkView }>(`/api/guardians/links/${encodeURIComponent(linkId)}/digest`, { optIn })
      .pipe(map((body) => body.link));
  }

  /** One linked child's weekly summary. */
  childSummary(playerId: string): Observable<ChildSummary> {
    return this.http.get<ChildSummary>(`/api/guardians/children/${encodeURIComponent(playerId)}/summary`);
  }
}
