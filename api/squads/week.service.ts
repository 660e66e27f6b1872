/**
 * Squad week: per player, the week's repetitions and hit rate against the previous week, the
 * best technique and kicking-load flags, aggregated in SQLite through the sessions of the
 * squad in the two weeks (training_sessions_squad_started_idx, then kicks_session_idx).
 */
import { DEFAULT_REP_LIMIT_PER_SESSION } from '../../shared/schemas/club';
import { and, eq, isNull } from 'drizzle-orm';
import type { CalibrationPoint, CarryBasis, SquadWeek, SquadWeekPlayer, ZoneHitRate } from '../../shared/schemas/analysis';
import type { Technique } from '../../shared/schemas/sync';
import type { ProfileCache } from '../analysis/profile-cache';
import type { Db } from '../db/client';
import { cachedStatement } from '../db/statements';
import { addDays, isoWeekStart } from '../../shared/dates';
import { clubs, squads } from '../db/schema';
import { NotFound } from '../errors';
import type { Scope } from '../scope/scope';

/** Fewest repetitions of a technique in a week before it can be called a player's best. */
export const MIN_REPS_FOR_BEST = 5;
/** Width of the target-distance bands of the zone hit-rate chart, metres. */
export const ZONE_BAND_M = 5;

/** Monday (UTC) of the ISO week containing `date`; re-exported for callers of the week API. */
export { isoWeekStart };

interface TechRow {
  player_id: string;
  technique: Technique;
  this_reps: number;
  this_hits: number;
  prev_reps: number;
  prev_hits: number;
}

/** The week of one squad the caller may read (404 otherwise). */
export function squadWeek(
  db: Db,
  profiles: ProfileCache,
  scope: Scope,
  squadId: string,
  start: string,
  carryBasis: CarryBasis = 'logged',
): SquadWeek {
  if (!scope.canReadSquad(squadId)) throw new NotFound('No such squad among yours');
  const squad = db
    .select()
    .from(squads)
    .where(and(eq(squads.id, squadId), eq(squads.clubId, scope.user.clubId), isNull(squads.deletedAt)))
    .get();
  if (!squad) throw new NotFound('No such squad among yours');
  const limit =
    db.select({ l: clubs.repLimitPerSession }).from(clubs).where(eq(clubs.id, squad.clubId)).get()?.l ?? DEFAULT_REP_LIMIT_PER_SESSION;
  const weekStart = isoWeekStart(start);
  const prevStart = addDays(weekStart, -7);
  const weekEnd = addDays(weekStart, 7);
  const params = { squadId, weekStart, prevStart, weekEnd, limit };
  const sqlite = db.$client;
  const roster = cachedStatement(
    sqlite,
    `SELECT id, display_name AS displayName, shirt_number AS shirtNumber FROM players WHERE squad_id = @squadId AND deleted_at IS NULL ORDER BY shirt_number, display_name`,
  ).all(params) as { id: string; displayName: string; shirtNumber: number | null }[];
  const techRows = cachedStatement(
    sqlite,

    `SELECT k.player_id, k.technique,
              SUM(k.recorded_at >= @weekStart) AS this_reps,
              SUM(k.recorded_at >= @weekStart AND k.outcome = 'on_target') AS this_hits,
              SUM(k.recorded_at < @weekStart) AS prev_reps,
              SUM(k.recorded_at < @weekStart AND k.outcome = 'on_target') AS prev_hits
         FROM training_sessions s JOIN kicks k ON k.session_id = s.id
        WHERE s.squad_id = @squadId AND s.deleted_at IS NULL AND s.started_at >= @prevStart AND s.started_at < @weekEnd
          AND k.deleted_at IS NULL AND k.recorded_at >= @prevStart AND k.recorded_at < @weekEnd
        GROUP BY k.player_id, k.technique`,
  ).all(params) as TechRow[];
  const loadRows = cachedStatement(
    sqlite,

    `SELECT k.player_id, s.id AS session_id, s.started_at, COUNT(*) AS reps
         FROM training_sessions s JOIN kicks k ON k.session_id = s.id
        WHERE s.squad_id = @squadId AND s.deleted_at IS NULL AND s.started_at >= @weekStart AND s.started_at < @weekEnd AND k.deleted_at IS NULL
        GROUP BY k.player_id, s.id HAVING COUNT(*) > @limit ORDER BY s.started_at`,
  ).all(params) as { player_id: string; session_id: string; started_at: string; reps: number }[];

  const carry = carryBasis === 'still-air' ? 'k.still_air_carry_m' : 'k.carry_m';
  const thisWeek = `FROM training_sessions s JOIN kicks k ON k.session_id = s.id
        WHERE s.squad_id = @squadId AND s.deleted_at IS NULL AND s.started_at >= @weekStart AND s.started_at < @weekEnd
          AND k.deleted_at IS NULL AND k.recorded_at >= @weekStart AND k.recorded_at < @weekEnd`;
  const medians = cachedStatement(
    sqlite,

    `WITH ranked AS (SELECT k.player_id, k.technique, ${carry} AS carry,
              ROW_NUMBER() OVER (PARTITION BY k.player_id, k.technique ORDER BY ${carry}) AS i,
              COUNT(*) OVER (PARTITION BY k.player_id, k.technique) AS n
         ${thisWeek} AND ${carry} IS NOT NULL)
       SELECT player_id, technique, AVG(carry) AS median FROM ranked
        WHERE i = (n + 1) / 2 OR (n % 2 = 0 AND i = n / 2 + 1) GROUP BY player_id, technique`,
  ).all(params) as { player_id: string; technique: Technique; median: number }[];
  const zones = cachedStatement(
    sqlite,

    `SELECT k.technique, CAST(k.target_distance_m / ${ZONE_BAND_M} AS INTEGER) AS band, COUNT(*) AS reps, AVG(k.outcome = 'on_target') AS hit_rate
         ${thisWeek} GROUP BY k.technique, band ORDER BY k.technique, band`,
  ).all(params) as { technique: Technique; band: number; reps: number; hit_rate: number }[];

  const players = roster.map((p): SquadWeekPlayer => {
    const rows = techRows.filter((r) => r.player_id === p.id);
    const sum = (f: (r: TechRow) => number) => rows.reduce((a, r) => a + f(r), 0);
    const reps = sum((r) => r.this_reps);
    const previousReps = sum((r) => r.prev_reps);
    const hitRate = reps ? sum((r) => r.this_hits) / reps : null;
    const previousHitRate = previousReps ? sum((r) => r.prev_hits) / previousReps : null;
    const byTechnique = rows
      .filter((r) => r.this_reps > 0)
      .map((r) => ({
        technique: r.technique,
        reps: r.this_reps,
        hitRate: r.this_hits / r.this_reps,
        medianCarryM: medians.find((m) => m.player_id === p.id && m.technique === r.technique)?.median ?? null,
      }));
    const reach = rows.map((r) => {
      const entry = profiles.peek(p.id, r.technique);
      return {
        technique: r.technique,
        reliableReachM: entry.reliableReachM,
        reachRadiusM: entry.reachRadiusM,
        repetitions: entry.repetitions,
        pending: entry.pending,
        warnings: entry.profile?.warnings ?? [],
      };
    });
    const calibration = calibrationOf(
      profiles,
      p.id,
      weekStart,
      byTechnique.map((t) => t.technique),
    );
    const eligible = byTechnique.filter((r) => r.reps >= MIN_REPS_FOR_BEST).sort((a, b) => b.hitRate - a.hitRate || b.reps - a.reps);
    return {
      playerId: p.id,
      displayName: p.displayName,
      shirtNumber: p.shirtNumber,
      reps,
      hitRate,
      previousReps,
      previousHitRate,
      hitRateChange: hitRate !== null && previousHitRate !== null ? hitRate - previousHitRate : null,
      bestTechnique: eligible[0]?.technique ?? null,
      byTechnique,
      reach,
      calibration: calibration.points,
      calibrationPending: calibration.pending,
      loadFlags: loadRows
        .filter((r) => r.player_id === p.id)
        .map((r) => ({ sessionId: r.session_id, startedAt: r.started_at, reps: r.reps, limit })),
    };
  });
  const zoneRows: ZoneHitRate[] = zones.map((z) => ({
    technique: z.technique,
    bandStartM: z.band * ZONE_BAND_M,
    bandEndM: (z.band + 1) * ZONE_BAND_M,
    reps: z.reps,
    hitRate: z.hit_rate,
  }));
  return {
    squadId,
    squadName: squad.name,
    weekStart,
    previousWeekStart: prevStart,
    carryBasis,
    repLimitPerSession: limit,
    players,
    zones: zoneRows,
  };
}

/**
 * Predicted against observed hits of each technique the player kicked this week: predicted by a profile
 * fitted on the repetitions *before* the week, each repetition in its own session's conditions
 * (api/analysis/calibration.ts). Computed by the refresher; techniques still being computed are counted
 * in `pending`, and a technique with no earlier repetitions has nothing to predict from.
 */
function calibrationOf(
  profiles: ProfileCache,
  playerId: string,
  weekStart: string,
  techniques: readonly Technique[],
): { points: CalibrationPoint[]; pending: number } {
  const points: CalibrationPoint[] = [];
  let pending = 0;
  for (const technique of techniques) {
    const c = profiles.calibration(playerId, technique, weekStart);
    if (c === 'pending') pending++;
    else if (c.predictedHits !== null && c.reps > 0) {
      points.push({
        technique,
        reps: c.reps,
        hits: c.hits,
        predictedHits: c.predictedHits,
        predictedHitRate: c.predictedHits / c.reps,
        observedHitRate: c.hits / c.reps,
      });
    }
  }
  return { points, pending };
}
