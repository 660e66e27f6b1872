import { HttpClient, HttpHeaders, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { InviteView } from '../../../shared/schemas/accounts';
import type { AuthTokens } from '../../../shared/schemas/auth';

/** Who an invitation is for (`GET /api/auth/invite?token=`), shown before the password is set (shape in shared/). */
export type { InviteView };

/**
 * The public account calls behind e-mailed links: looking up and accepting an invitation, and
 * asking for and using a password reset. No bearer goes with them (the interceptor leaves them
 * alone): the one-time token in the link is the credential.
 */
@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly http = inject(HttpClient);

  /** Who the invitation is for; fails with 400 `invite_expired`, `invite_used` or `invite_invalid`. */
  invite(token: string): Observable<InviteView> {
    return this.http.get<InviteView>('/api/auth/invite', { params: new HttpParams().set('token', token) });
  }

  /** Sets the invited account's password; the answer is a sign-in (tokens and user). */
  acceptInvite(token: string, password: string): Observable<AuthTokens> {
    return this.http.post<AuthTokens>('/api/auth/accept-invite', { token, password });
  }

  /** Asks for a reset link. The server answers the same whether or not the address has an account. */
  forgotPassword(email: string): Observable<void> {
    return this.http.post<{ message: string }>('/api/auth/forgot-password', { email }).pipe(map(() => undefined));
  }

  /** Sets a new password with a reset token (204 on success). */
  resetPassword(token: string, password: string): Observable<void> {
    return this.http.post<void>('/api/auth/reset-password', { token, password });
  }

  /**
   * Revokes a token pair this page will not keep (best effort, errors ignored). Accepting an
   * invitation answers with a sign-in, but the session is started through `AuthSession.signIn`
   * so it is stored the one usual way; the spare pair must not stay valid for 30 days unused.
   */
  discardTokens(tokens: AuthTokens): void {
    const headers = new HttpHeaders({ Authorization: `Bearer ${tokens.accessToken}` });
    this.http.post('/api/auth/logout', { refreshToken: tokens.refreshToken }, { headers }).subscribe({ error: () => undefined });
  }
}
