/** What Club admin lists: the club's accounts (optionally of one role) and its mail outbox. */
import { and, desc, eq } from 'drizzle-orm';
import type { Role } from '../../shared/roles';
import type { AdminUser } from '../../shared/schemas/accounts';
import type { OutboxMail } from '../../shared/schemas/mail';
import type { Db } from '../db/client';
import { mailOutbox, users } from '../db/schema';

/** The club's accounts by name, with whether each has set a password and whether it is disabled. */
export function clubUsers(db: Db, clubId: string, role: Role | undefined): AdminUser[] {
  const rows = db
    .select()
    .from(users)
    .where(role ? and(eq(users.clubId, clubId), eq(users.role, role)) : eq(users.clubId, clubId))
    .orderBy(users.displayName)
    .all();
  return rows.map((u) => ({
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    role: u.role,
    invitedAt: u.invitedAt,
    activated: u.passwordHash !== null,
    disabled: u.disabledAt !== null,
  }));
}

/** The club's latest 500 outgoing mails, newest first. */
export function clubOutbox(db: Db, clubId: string): OutboxMail[] {
  return db
    .select()
    .from(mailOutbox)
    .where(eq(mailOutbox.clubId, clubId))
    .orderBy(desc(mailOutbox.createdAt))
    .limit(500)
    .all()
    .map((r) => ({
      id: r.id,
      kind: r.kind,
      toAddress: r.toAddress,
      subject: r.subject,
      status: r.status,
      attempts: r.attempts,
      lastError: r.lastError,
      createdAt: r.createdAt,
      sentAt: r.sentAt,
    }));
}
