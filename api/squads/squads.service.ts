/** Squad listings, always through the caller's scope. */
import { and, count, eq, isNull } from 'drizzle-orm';
import type { SquadSummary } from '../../shared/schemas/squads';
import type { Db } from '../db/client';
import { players, squads, trainingGrounds } from '../db/schema';
import type { Scope } from '../scope/scope';

/** Lists the squads a caller may see, with their player counts, in a stable order. */
export function listSquads(db: Db, scope: Scope): SquadSummary[] {
  return db
    .select({
      id: squads.id,
      name: squads.name,
      ageGroup: squads.ageGroup,
      ballSize: squads.ballSize,
      playerCount: count(players.id),
      groundId: trainingGrounds.id,
      groundName: trainingGrounds.name,
      groundAltitudeM: trainingGrounds.altitudeM,
      groundKickingBearingDeg: trainingGrounds.kickingBearingDeg,
    })
    .from(squads)
    .leftJoin(players, and(eq(players.squadId, squads.id), isNull(players.deletedAt)))
    .leftJoin(trainingGrounds, and(eq(trainingGrounds.id, squads.groundId), eq(trainingGrounds.clubId, squads.clubId)))
    .where(scope.squadCondition(db))
    .groupBy(squads.id)
    .orderBy(squads.name)
    .all()
    .map(({ groundId, groundName, groundAltitudeM, groundKickingBearingDeg, ...squad }) => ({
      ...squad,
      ground:
        groundId !== null && groundName !== null && groundAltitudeM !== null && groundKickingBearingDeg !== null
          ? { id: groundId, name: groundName, altitudeM: groundAltitudeM, kickingBearingDeg: groundKickingBearingDeg }
          : null,
    }));
}
