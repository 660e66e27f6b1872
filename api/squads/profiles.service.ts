/** Every player's cached profile of one technique, for the Set-piece planner's ranking. */
import type { SquadProfilesResponse } from '../../shared/schemas/analysis';
import type { Technique } from '../../shared/schemas/sync';
import type { ProfileCache } from '../analysis/profile-cache';
import type { Db } from '../db/client';
import { NotFound } from '../errors';
import { listPlayers } from '../players/players.service';
import type { Scope } from '../scope/scope';

/** Profiles of a squad the caller may read; stale ones are served as cached and queued for refresh. */
export function squadProfiles(db: Db, profiles: ProfileCache, scope: Scope, squadId: string, technique: Technique): SquadProfilesResponse {
  if (!scope.canReadSquad(squadId)) throw new NotFound('No such squad among yours');
  const roster = listPlayers(db, scope, squadId);
  return {
    squadId,
    technique,
    players: roster.map((p) => ({ ...profiles.peek(p.id, technique), displayName: p.displayName, shirtNumber: p.shirtNumber })),
  };
}
