/** Player listings, always through the caller's scope. */
import { and, eq } from 'drizzle-orm';
import type { PlayerSummary } from '../../shared/schemas/squads';
import { isAdultOn } from '../../shared/dates';
import type { Db } from '../db/client';
import { players, squads } from '../db/schema';
import { NotFound } from '../errors';
import type { Scope } from '../scope/scope';

/** Lists the players a caller may see, optionally one squad's, ordered by squad then shirt number. */
export function listPlayers(db: Db, scope: Scope, squadId?: string, now = new Date(), playerId?: string): PlayerSummary[] {
  const condition = and(
    scope.playerCondition(),
    squadId ? eq(players.squadId, squadId) : undefined,
    playerId ? eq(players.id, playerId) : undefined,
  );
  return db
    .select({
      id: players.id,
      squadId: players.squadId,
      squadName: squads.name,
      displayName: players.displayName,
      shirtNumber: players.shirtNumber,
      dominantFoot: players.dominantFoot,
      birthDate: players.birthDate,
    })
    .from(players)
    .innerJoin(squads, eq(squads.id, players.squadId))
    .where(condition)
    .orderBy(squads.name, players.shirtNumber, players.displayName)
    .all()
    .map(({ birthDate, ...p }) => ({ ...p, isMinor: !isAdultOn(birthDate, now.toISOString().slice(0, 10)) }));
}

/** One player the caller may see, or 404 (never 403, so ids of others are not confirmed). */
export function getPlayer(db: Db, scope: Scope, id: string): PlayerSummary {
  const found = listPlayers(db, scope, undefined, new Date(), id)[0];
  if (!found) throw new NotFound('No such player in your squads');
  return found;
}
