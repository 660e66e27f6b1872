/** Player listings, always through the caller's scope. */
import { and, eq } from 'drizzle-orm';
import type { PlayerSummary } from '../../shared/schemas/squads';
import type { Db } from '../db/client';
import { players, squads } from '../db/schema';
import { NotFound } from '../errors';
import type { Scope } from '../scope/scope';

/** Age at which a player stops being a minor for youth-data purposes (common practice; local law decides). */
const ADULT_AGE_YEARS = 18;

function isMinor(birthDate: string | null, now: Date): boolean {
  if (!birthDate) return false;
  const b = new Date(birthDate + 'T00:00:00Z');
  const adult = new Date(Date.UTC(b.getUTCFullYear() + ADULT_AGE_YEARS, b.getUTCMonth(), b.getUTCDate()));
  return now < adult;
}

/** Lists the players a caller may see, optionally one squad's, ordered by squad then shirt number. */
export function listPlayers(db: Db, scope: Scope, squadId?: string, now = new Date()): PlayerSummary[] {
  const condition = squadId ? and(scope.playerCondition(), eq(players.squadId, squadId)) : scope.playerCondition();
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
    .map(({ birthDate, ...p }) => ({ ...p, isMinor: isMinor(birthDate, now) }));
}

/** One player the caller may see, or 404 (never 403, so ids of others are not confirmed). */
export function getPlayer(db: Db, scope: Scope, id: string): PlayerSummary {
  const found = listPlayers(db, scope).find((p) => p.id === id);
  if (!found) throw new NotFound('No such player in your squads');
  return found;
}
