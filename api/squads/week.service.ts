/**
 * Squad week: per player, the week's repetitions and hit rate against the previous week, the
 * best technique and kicking-load flags, aggregated in SQLite through the sessions of the
 * squad in the two weeks (training_sessions_squad_started_idx, then kicks_session_idx).
 */
import { and, eq, isNull } from 'drizzle-orm';
import type { Technique } from '../../shared/schemas/sync';
import type { Db } from '../db/client';
import { clubs, squads } from '../db/schema';
import { NotFound } from '../errors';
import type { Scope } from '../scope/scope';

/** Fewest repetitions of a technique in a week before it can be called a player's best. */
export const MIN_REPS_FOR_BEST = 5;

/** One player's line in the Squad week table. */
export interface SquadWeekPlayer {
  playerId: string;
  displayName: string;
  shirtNumber: number | null;
  reps: number;
  hitRate: number | null;
  previousReps: number;
  previousHitRate: number | null;
  /** This week's hit rate minus last week's (null when either week has no repetitions). */
  hitRateChange: number | null;
  /** Technique with the best hit rate this week among those with ≥ MIN_REPS_FOR_BEST repetitions. */
  bestTechnique: Technique | null;
  byTechnique: { technique: Technique; reps: number; hitRate: number }[];
  /** Sessions this week in which the player passed the club's repetition limit. */
  loadFlags: { sessionId: string; startedAt: string; reps: number; limit: number }[];
}

/** The Squad week answer. */
export interface SquadWeek {
  squadId: string;
  weekStart: string;
  previousWeekStart: string;
  repLimitPerSession: number;
  players: SquadWeekPlayer[];
}

/** Monday (UTC) of the ISO week containing `date` (YYYY-MM-DD). */
export function isoWeekStart(date: string): string {
  const d = new Date(date + 'T00:00:00Z');
  const shift = (d.getUTCDay() + 6) % 7;
  d.setUTCDate(d.getUTCDate() - shift);
  return d.toISOString().slice(0, 10);
}

function addDays(date: string, days: number): string {
  const d = new Date(date + 'T00:00:00Z');
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

interface TechRow {
  player_id: string;
  technique: Technique;
  this_reps: number;
  this_hits: number;
  prev_reps: number;
  prev_hits: number;
}

/** The week of one squad the caller may read (404 otherwise). */
export function squadWeek(db: Db, scope: Scope, squadId: string, start: string): SquadWeek {
  if (!scope.canReadSquad(squadId)) throw new NotFound('No such squad among yours');
  const squad = db.select().from(squads).where(and(eq(squads.id, squadId), eq(squads.clubId, scope.user.clubId), isNull(squads.deletedAt))).get();
  if (!squad) throw new NotFound('No such squad among yours');
  const limit = db.select({ l: clubs.repLimitPerSession }).from(clubs).where(eq(clubs.id, squad.clubId)).get()?.l ?? 40;
  const weekStart = isoWeekStart(start);
  const prevStart = addDays(weekStart, -7);
  const weekEnd = addDays(weekStart, 7);
  const params = { squadId, weekStart, prevStart, weekEnd, limit };
  const sqlite = db.$client;
  const roster = sqlite
    .prepare(`SELECT id, display_name AS displayName, shirt_number AS shirtNumber FROM players WHERE squad_id = @squadId AND deleted_at IS NULL ORDER BY shirt_number, display_name`)
    .all(params) as { id: string; displayName: string; shirtNumber: number | null }[];
  const techRows = sqlite
    .prepare(
      `SELECT k.player_id, k.technique,
              SUM(k.recorded_at >= @weekStart) AS this_reps,
              SUM(k.recorded_at >= @weekStart AND k.outcome = 'on_target') AS this_hits,
              SUM(k.recorded_at < @weekStart) AS prev_reps,
              SUM(k.recorded_at < @weekStart AND k.outcome = 'on_target') AS prev_hits
         FROM training_sessions s JOIN kicks k ON k.session_id = s.id
        WHERE s.squad_id = @squadId AND s.deleted_at IS NULL AND s.started_at >= @prevStart AND s.started_at < @weekEnd
          AND k.deleted_at IS NULL AND k.recorded_at >= @prevStart AND k.recorded_at < @weekEnd
        GROUP BY k.player_id, k.technique`,
    )
    .all(params) as TechRow[];
  const loadRows = sqlite
    .prepare(
      `SELECT k.player_id, s.id AS session_id, s.started_at, COUNT(*) AS reps
         FROM training_sessions s JOIN kicks k ON k.session_id = s.id
        WHERE s.squad_id = @squadId AND s.deleted_at IS NULL AND s.started_at >= @weekStart AND s.started_at < @weekEnd AND k.deleted_at IS NULL
        GROUP BY k.player_id, s.id HAVING COUNT(*) > @limit ORDER BY s.started_at`,
    )
    .all(params) as { player_id: string; session_id: string; started_at: string; reps: number }[];

  const players = roster.map((p): SquadWeekPlayer => {
    const rows = techRows.filter((r) => r.player_id === p.id);
    const sum = (f: (r: TechRow) => number) => rows.reduce((a, r) => a + f(r), 0);
    const reps = sum((r) => r.this_reps);
    const previousReps = sum((r) => r.prev_reps);
    const hitRate = reps ? sum((r) => r.this_hits) / reps : null;
    const previousHitRate = previousReps ? sum((r) => r.prev_hits) / previousReps : null;
    const byTechnique = rows.filter((r) => r.this_reps > 0).map((r) => ({ technique: r.technique, reps: r.this_reps, hitRate: r.this_hits / r.this_reps }));
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
      loadFlags: loadRows.filter((r) => r.player_id === p.id).map((r) => ({ sessionId: r.session_id, startedAt: r.started_at, reps: r.reps, limit })),
    };
  });
  return { squadId, weekStart, previousWeekStart: prevStart, repLimitPerSession: limit, players };
}
