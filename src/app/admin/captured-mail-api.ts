import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, map, of, throwError } from 'rxjs';
import type { CapturedMailMessage, CapturedMailSummary } from '../../../shared/schemas/mail';

/** The shared shapes (`shared/schemas/mail.ts`), re-exported so screens import them from the service that fetches them. */
export type { CapturedMailMessage, CapturedMailSummary };

/**
 * The captured-mail list: either the messages, or the statement that this server has no fake
 * mail server (production sends real mail, and nothing is captured to read).
 */
export type CapturedMailbox = { readonly active: true; readonly messages: CapturedMailSummary[] } | { readonly active: false };

/** One message look-up: the message, or gone (captured mail lives only as long as the fake server). */
export type CapturedMailLookup = { readonly found: true; readonly message: CapturedMailMessage } | { readonly found: false };

/**
 * Mail caught by the local fake SMTP server, for admins checking invitations, resets and
 * digests in development and tests. A 404 is an answer here, not a failure — the endpoint does
 * not exist without the fake server — so it becomes a value the screen can explain.
 */
@Injectable({ providedIn: 'root' })
export class CapturedMailApi {
  private readonly http = inject(HttpClient);

  /** The captured messages, or `{ active: false }` when the server has no fake mail server. */
  list(): Observable<CapturedMailbox> {
    return this.http.get<{ messages: CapturedMailSummary[] }>('/api/dev/mail').pipe(
      map((body): CapturedMailbox => ({ active: true, messages: body.messages })),
      catchError((error: unknown) => (isNotFound(error) ? of<CapturedMailbox>({ active: false }) : throwError(() => error))),
    );
  }

  /** One captured message, or `{ found: false }` when it is not (or no longer) there. */
  get(id: string): Observable<CapturedMailLookup> {
    return this.http.get<{ message: CapturedMailMessage }>(`/api/dev/mail/${encodeURIComponent(id)}`).pipe(
      map((body): CapturedMailLookup => ({ found: true, message: body.message })),
      catchError((error: unknown) => (isNotFound(error) ? of<CapturedMailLookup>({ found: false }) : throwError(() => error))),
    );
  }
}

function isNotFound(error: unknown): boolean {
  return error instanceof HttpErrorResponse && error.status === 404;
}
