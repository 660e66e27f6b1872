/**
 * Single-use account tokens for invites (7 days) and password resets (1 hour). Only a hash is
 * stored; using a token marks it used in the same transaction that sets the password.
 */
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import type { Db } from '../db/client';
import { accountTokens } from '../db/schema';
import { HttpError } from '../errors';

/** How long each kind of token lives. */
export const TOKEN_TTL_MS = { invite: 7 * 24 * 3600 * 1000, reset: 60 * 60 * 1000 } as const;

type Kind = keyof typeof TOKEN_TTL_MS;

function hash(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** Issues a token; earlier unused tokens of the same kind for the user stop working. */
export function issueAccountToken(db: Db, userId: string, kind: Kind, createdBy: string | null): { token: string; expiresAt: string } {
  const now = new Date();
  db.update(accountTokens)
    .set({ usedAt: now.toISOString() })
    .where(and(eq(accountTokens.userId, userId), eq(accountTokens.kind, kind), isNull(accountTokens.usedAt)))
    .run();
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(now.getTime() + TOKEN_TTL_MS[kind]).toISOString();
  db.insert(accountTokens)
    .values({ id: randomUUID(), userId, kind, tokenHash: hash(token), expiresAt, createdBy })
    .run();
  return { token, expiresAt };
}

const MESSAGES: Record<Kind, Record<'invalid' | 'used' | 'expired', string>> = {
  invite: {
    invalid: 'This invitation link is not valid; ask your club administrator for a new one',
    used: 'This invitation was already used; sign in, or reset your password if you forgot it',
    expired: 'This invitation has expired (links last 7 days); ask your club administrator for a new one',
  },
  reset: {
    invalid: 'This password-reset link is not valid; ask for a new one',
    used: 'This password-reset link was already used; ask for a new one if you need to',
    expired: 'This password-reset link has expired (links last 1 hour); ask for a new one',
  },
};

/** Finds a usable token or throws 400 with a clear, specific message. Does not consume it. */
export function checkAccountToken(db: Db, token: string, kind: Kind): { id: string; userId: string } {
  const row = db
    .select()
    .from(accountTokens)
    .where(and(eq(accountTokens.tokenHash, hash(token)), eq(accountTokens.kind, kind)))
    .get();
  const code = kind === 'invite' ? 'invite' : 'reset';
  if (!row) throw new HttpError(400, `${code}_invalid`, MESSAGES[kind].invalid);
  if (row.usedAt) throw new HttpError(400, `${code}_used`, MESSAGES[kind].used);
  if (row.expiresAt <= new Date().toISOString()) throw new HttpError(400, `${code}_expired`, MESSAGES[kind].expired);
  return { id: row.id, userId: row.userId };
}

/** Marks a checked token used (call inside the transaction that acts on it). */
export function consumeAccountToken(db: Db, id: string): void {
  db.update(accountTokens).set({ usedAt: new Date().toISOString() }).where(eq(accountTokens.id, id)).run();
}
