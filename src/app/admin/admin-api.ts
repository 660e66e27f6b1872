import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { Role } from '../../../shared/roles';
import type { AdminUser, InviteCreated } from '../../../shared/schemas/accounts';
import type { InviteRequest, OutboxMail } from '../../../shared/schemas/mail';

/** Delivery state of one outgoing mail. */
export type OutboxStatus = OutboxMail['status'];

/** The shared shapes (`shared/schemas/`), re-exported so screens import them from the service that fetches them. */
export type { AdminUser, InviteCreated, InviteRequest, OutboxMail };

/**
 * The Club admin calls about accounts and mail delivery: who is in the club, sending
 * invitations, and the outbox. Guardian links live in `GuardianApi` (shared with Guardian
 * home); captured mail in `CapturedMailApi` (it exists only with the fake mail server).
 */
@Injectable({ providedIn: 'root' })
export class AdminApi {
  private readonly http = inject(HttpClient);

  /** The club's accounts, optionally of one role only. */
  listUsers(role?: Role): Observable<AdminUser[]> {
    const params = role ? new HttpParams().set('role', role) : undefined;
    return this.http.get<{ users: AdminUser[] }>('/api/admin/users', { params }).pipe(map((body) => body.users));
  }

  /** Creates the account and e-mails an invitation (single use, 7 days). */
  invite(request: InviteRequest): Observable<InviteCreated> {
    return this.http.post<InviteCreated>('/api/admin/invites', request);
  }

  /** Every outgoing mail with its delivery state, newest first as the server orders it. */
  listOutbox(): Observable<OutboxMail[]> {
    return this.http.get<{ mails: OutboxMail[] }>('/api/admin/outbox').pipe(map((body) => body.mails));
  }
}
