/**
 * Creates a club and its first administrator without any demo data: the only way a production
 * server gets its first account. The administrator sets a password through the ordinary invite
 * flow (`/accept-invite`), so no password ever passes through a command line or a log.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import * as z from 'zod';
import { issueAccountToken } from '../accounts/account-tokens';
import { audit } from '../audit';
import type { Db } from '../db/client';
import { clubs, users } from '../db/schema';
import { Invalid, parseOrThrow } from '../errors';

/** What `club:create` needs. */
export const clubSetupSchema = z.strictObject({
  name: z.string({ error: 'name is required' }).trim().min(2, { error: 'name must be at least 2 characters' }).max(120),
  adminEmail: z
    .string({ error: 'admin is required' })
    .trim()
    .toLowerCase()
    .pipe(z.email({ error: 'admin must be an e-mail address' })),
  adminName: z.string().trim().min(1).max(120).optional(),
  timezone: z
    .string()
    .trim()
    .refine((tz) => isTimeZone(tz), { error: 'timezone must be an IANA time zone such as Europe/London' })
    .optional(),
});
export type ClubSetup = z.input<typeof clubSetupSchema>;

function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

/** The created club, its administrator and the one-time link that lets them set a password. */
export interface CreatedClub {
  clubId: string;
  adminUserId: string;
  adminEmail: string;
  inviteLink: string;
  expiresAt: string;
}

/** Creates the club and an administrator with no password; refuses an e-mail that already has an account. */
export function createClub(db: Db, publicUrl: string, input: ClubSetup): CreatedClub {
  const req = parseOrThrow(clubSetupSchema, input, 'Club');
  if (db.select({ id: users.id }).from(users).where(eq(users.email, req.adminEmail)).get()) {
    throw new Invalid(`An account with the e-mail ${req.adminEmail} already exists`, [
      { field: 'admin', message: 'Already has an account' },
    ]);
  }
  return db.transaction(() => {
    const clubId = randomUUID();
    const adminUserId = randomUUID();
    db.insert(clubs)
      .values({ id: clubId, name: req.name, ...(req.timezone ? { timezone: req.timezone } : {}) })
      .run();
    db.insert(users)
      .values({
        id: adminUserId,
        clubId,
        email: req.adminEmail,
        displayName: req.adminName ?? req.adminEmail.split('@')[0]!,
        role: 'admin',
        passwordHash: null,
        invitedAt: new Date().toISOString(),
      })
      .run();
    const { token, expiresAt } = issueAccountToken(db, adminUserId, 'invite', null);
    audit(db, { clubId, userId: null, action: 'club.created', entity: 'club', entityId: clubId, detail: { adminUserId } });
    return {
      clubId,
      adminUserId,
      adminEmail: req.adminEmail,
      inviteLink: `${publicUrl.replace(/\/+$/, '')}/accept-invite?token=${token}`,
      expiresAt,
    };
  });
}
