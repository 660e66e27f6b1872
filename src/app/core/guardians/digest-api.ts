import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { DigestRunResult, UnsubscribeResult } from '../../../../shared/schemas/mail';

/** The shared shapes (`shared/schemas/mail.ts`), re-exported so screens import them from the service that fetches them. */
export type { DigestRunResult, UnsubscribeResult };

/**
 * The Family digest's two calls outside the weekly job: staff sending the digests now, and the
 * signed one-click unsubscribe from a digest mail (public: the token is the credential).
 */
@Injectable({ providedIn: 'root' })
export class DigestApi {
  private readonly http = inject(HttpClient);

  /** Sends this week's digests now (admin, head coach). Safe to repeat: the job skips what was sent. */
  runNow(): Observable<DigestRunResult> {
    return this.http.post<DigestRunResult>('/api/digests/run', {});
  }

  /** Stops the digest the token was issued for. Idempotent. */
  unsubscribe(token: string): Observable<UnsubscribeResult> {
    return this.http.post<UnsubscribeResult>('/api/digests/unsubscribe', {}, { params: new HttpParams().set('token', token) });
  }
}
