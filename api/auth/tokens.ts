/**
 * Access and refresh tokens. Access tokens are HS256 JWTs that live 15 minutes; refresh
 * tokens are random strings stored only as SHA-256 hashes, rotated on every use, grouped in
 * a family so that replaying a rotated token revokes every descendant (a stolen token dies).
 * A family also ends `refreshFamilyTtlS` after its sign-in however often it was rotated, and a
 * password reset or a disabled account ends all of the user's families at once.
 */
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import jwt from 'jsonwebtoken';
import type { AppConfig } from '../config';
import type { Db } from '../db/client';
import { refreshTokens } from '../db/schema';

/** What an access token carries. */
export interface AccessClaims {
  sub: string;
  role: string;
  clubId: string;
  typ: 'access';
  /** Expiry (seconds since the epoch), set by `expiresIn`; a token without it is refused. */
  exp?: number;
}

/** Signs a short-lived access token for a user. */
export function signAccessToken(config: AppConfig, user: { id: string; role: string; clubId: string }): string {
  const claims: AccessClaims = { sub: user.id, role: user.role, clubId: user.clubId, typ: 'access' };
  return jwt.sign(claims, config.jwtSecret, { algorithm: 'HS256', expiresIn: config.accessTokenTtlS, issuer: 'loftline' });
}

function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/**
 * Issues a new refresh token and stores its hash: a new family (a sign-in), or the next token of
 * `family` (a rotation), which never outlives the family's absolute end.
 */
export function issueRefreshToken(
  db: Db,
  config: AppConfig,
  userId: string,
  family?: { id: string; expiresAt: string },
): { token: string; id: string } {
  const token = randomBytes(32).toString('base64url');
  const id = randomUUID();
  const now = Date.now();
  const familyId = family?.id ?? randomUUID();
  const familyExpiresAt = family?.expiresAt ?? new Date(now + config.refreshFamilyTtlS * 1000).toISOString();
  const ownExpiry = new Date(now + config.refreshTokenTtlS * 1000).toISOString();
  const expiresAt = ownExpiry < familyExpiresAt ? ownExpiry : familyExpiresAt;
  db.insert(refreshTokens)
    .values({ id, userId, familyId, tokenHash: hashToken(token), expiresAt, familyExpiresAt })
    .run();
  return { token, id };
}

/** Ends every refresh family of a user (password reset, disabled or erased account): each device must sign in again. */
export function revokeAllRefreshFamilies(db: Db, userId: string): void {
  db.update(refreshTokens)
    .set({ revokedAt: new Date().toISOString() })
    .where(and(eq(refreshTokens.userId, userId), isNull(refreshTokens.revokedAt)))
    .run();
}

/** Why a refresh token was refused. */
export type RefreshFailure = 'unknown' | 'expired' | 'reused';

/**
 * Rotates a refresh token: the old one is marked revoked and replaced; a token that was
 * already rotated (or revoked) revokes its whole family and fails.
 */
export function rotateRefreshToken(
  db: Db,
  config: AppConfig,
  token: string,
): { ok: true; userId: string; token: string } | { ok: false; reason: RefreshFailure } {
  // better-sqlite3 transactions run on the one connection, so `db` inside is the transaction.
  return db.transaction(() => {
    const row = db
      .select()
      .from(refreshTokens)
      .where(eq(refreshTokens.tokenHash, hashToken(token)))
      .get();
    if (!row) return { ok: false as const, reason: 'unknown' as const };
    const now = new Date().toISOString();
    if (row.revokedAt) {
      db.update(refreshTokens)
        .set({ revokedAt: now })
        .where(and(eq(refreshTokens.familyId, row.familyId), isNull(refreshTokens.revokedAt)))
        .run();
      return { ok: false as const, reason: 'reused' as const };
    }
    const familyExpiresAt = row.familyExpiresAt ?? row.expiresAt;
    if (row.expiresAt <= now || familyExpiresAt <= now) return { ok: false as const, reason: 'expired' as const };
    const next = issueRefreshToken(db, config, row.userId, { id: row.familyId, expiresAt: familyExpiresAt });
    db.update(refreshTokens).set({ revokedAt: now, replacedById: next.id }).where(eq(refreshTokens.id, row.id)).run();
    return { ok: true as const, userId: row.userId, token: next.token };
  });
}

/** Revokes the family a refresh token belongs to (sign-out). Unknown tokens are ignored. */
export function revokeRefreshFamily(db: Db, token: string): void {
  const row = db
    .select()
    .from(refreshTokens)
    .where(eq(refreshTokens.tokenHash, hashToken(token)))
    .get();
  if (!row) return;
  db.update(refreshTokens)
    .set({ revokedAt: new Date().toISOString() })
    .where(and(eq(refreshTokens.familyId, row.familyId), isNull(refreshTokens.revokedAt)))
    .run();
}
