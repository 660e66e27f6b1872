/** Who the caller is (for the app shell) and an adult player's own digest choice. */
import { eq } from 'drizzle-orm';
import type { MeResponse } from '../../shared/schemas/auth';
import { audit } from '../audit';
import type { Db } from '../db/client';
import { clubs, players } from '../db/schema';
import { NotFound } from '../errors';
import type { Scope } from '../scope/scope';

/** The caller, their club and the players they are (a player) or look after (a guardian). */
export function me(db: Db, scope: Scope): MeResponse {
  const club = db.select({ id: clubs.id, name: clubs.name }).from(clubs).where(eq(clubs.id, scope.user.clubId)).get();
  if (!club) throw new NotFound('Your club no longer exists');
  return {
    user: scope.user,
    club,
    playerId: scope.user.role === 'player' ? (scope.ownPlayerIds?.[0] ?? null) : null,
    childPlayerIds: scope.user.role === 'guardian' ? [...(scope.ownPlayerIds ?? [])] : [],
  };
}

/** Whether the calling player agreed to Family digests going to their linked guardians. */
export function digestSelfOptIn(db: Db, scope: Scope): boolean {
  return ownPlayer(db, scope.ownPlayerIds).digestSelfOptIn;
}

/** Records the calling player's own digest choice, audited. */
export function setDigestSelfOptIn(db: Db, scope: Scope, optIn: boolean): void {
  const own = ownPlayer(db, scope.ownPlayerIds);
  db.update(players).set({ digestSelfOptIn: optIn, updatedAt: new Date().toISOString() }).where(eq(players.id, own.id)).run();
  audit(db, {
    clubId: scope.user.clubId,
    userId: scope.user.id,
    action: optIn ? 'digest.self_opted_in' : 'digest.self_opted_out',
    entity: 'player',
    entityId: own.id,
  });
}

function ownPlayer(db: Db, ids: readonly string[] | null): typeof players.$inferSelect {
  const id = ids?.[0];
  const row = id ? db.select().from(players).where(eq(players.id, id)).get() : undefined;
  if (!row) throw new NotFound('Your account is not linked to a player');
  return row;
}
