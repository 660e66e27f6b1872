/**
 * The recovery specs' harness: seeds the demo academy into a temporary database, reads each player's
 * repetitions of a technique the way the server does (`loggedKickOf`, the same row query as
 * `ProfileCache`), and pairs them with the player's hidden truth (`seed/truth.ts`). The numbers it
 * compares come from the product's own paths (ProfileCache, fitProfile, reachCurve, the set-piece
 * check) on one side and from flying the truth directly on the other.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loggedKickOf, type SessionConditions, type StoredKick } from '../../api/analysis/flight-inputs';
import { openDatabase, type Db } from '../../api/db/client';
import type { LoggedKick, Technique } from '../../shared/flight/index';
import { DEMO_PASSWORD, demoPeriod, demoPlayerId, demoTruths, seedDemo } from '../../seed/scenario';
import { PLAYERS, SQUADS, type SquadKey } from '../../seed/roster';
import type { PlayerTruth } from '../../seed/truth';
import type { RepetitionMoment } from '../../seed/truth-reach';
import bcrypt from 'bcryptjs';

/** The load date of every recovery spec (a fixed date: the same demo every run). */
export const RECOVERY_NOW = new Date('2025-04-09T15:00:00Z');

/** One repetition as the fit reads it, with when it was kicked and with which foot. */
export interface Repetition {
  kick: LoggedKick;
  moment: RepetitionMoment;
  /** ISO week index of the period, 0…7. */
  weekIndex: number;
  sessionId: string;
}

/** A seeded demo and its truth. */
export interface DemoUnderTest {
  db: Db;
  truths: Map<string, PlayerTruth>;
  ballSize: (squad: SquadKey) => 3 | 4 | 5;
  /** The player's repetitions of a technique, newest first (at most 400, like the server's fit). */
  repetitions: (playerKey: string, technique: Technique) => Repetition[];
  /** Median target radius of those repetitions (what the server quotes reliable reach for). */
  reachRadiusM: (playerKey: string, technique: Technique) => number;
  close: () => void;
}

/** Seeds the demo into a temporary database file. */
export function seedDemoUnderTest(): DemoUnderTest {
  const dir = mkdtempSync(join(tmpdir(), 'loftline-recovery-'));
  const db = openDatabase(join(dir, 'demo.db'));
  seedDemo(db, { now: RECOVERY_NOW, passwordHash: bcrypt.hashSync(DEMO_PASSWORD, 4) });
  const period = demoPeriod(RECOVERY_NOW);
  const startMs = period.firstWeekStart.getTime();
  const lengthMs = period.periodEnd.getTime() - startMs;
  const truths = demoTruths();
  const query = db.$client.prepare(
    `SELECT k.technique, k.outcome, k.target_distance_m AS targetDistanceM, k.target_radius_m AS targetRadiusM,
            k.backspin_step AS backspinStep, k.sidespin_step AS sidespinStep, k.carry_m AS carryM, k.lateral_m AS lateralM,
            k.measured_speed_ms AS measuredSpeedMs, k.launch_angle_deg AS launchAngleDeg, k.measured_spin_rps AS measuredSpinRps,
            k.hang_time_s AS hangTimeS, s.temperature_c AS temperatureC, s.altitude_m AS altitudeM, s.relative_humidity_pct AS relativeHumidityPct,
            s.pressure_hpa AS pressureHpa, s.wind_speed_ms AS windSpeedMs, s.wind_from_deg AS windFromDeg, s.ball_size AS ballSize,
            s.conditions_source_json AS conditionsSourceJson,
            k.recorded_at AS recordedAt, k.foot AS foot, p.dominant_foot AS dominantFoot, s.id AS sessionId
       FROM kicks k JOIN training_sessions s ON s.id = k.session_id JOIN players p ON p.id = k.player_id
      WHERE k.player_id = ? AND k.technique = ? AND k.deleted_at IS NULL AND s.deleted_at IS NULL
      ORDER BY k.recorded_at DESC LIMIT 400`,
  );
  type Row = StoredKick & SessionConditions & { recordedAt: string; foot: string; dominantFoot: string; sessionId: string };
  const repetitions = (playerKey: string, technique: Technique): Repetition[] =>
    (query.all(demoPlayerId(playerKey), technique) as Row[]).map((r) => {
      const ms = Date.parse(r.recordedAt);
      return {
        kick: loggedKickOf(r, r),
        moment: { progress: Math.min(1, Math.max(0, (ms - startMs) / lengthMs)), weakFoot: r.foot !== r.dominantFoot },
        weekIndex: Math.floor((ms - startMs) / (7 * 86_400_000)),
        sessionId: r.sessionId,
      };
    });
  return {
    db,
    truths,
    ballSize: (squad) => SQUADS.find((s) => s.key === squad)?.ballSize ?? 5,
    repetitions,
    reachRadiusM: (playerKey, technique) => {
      const radii = repetitions(playerKey, technique)
        .map((r) => r.kick.targetRadiusM)
        .sort((a, b) => a - b);
      return radii.length ? radii[Math.floor(radii.length / 2)]! : 3;
    },
    close: () => {
      db.$client.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Spearman's rank correlation of two equally long lists of scores (average ranks for ties). */
export function spearman(a: readonly number[], b: readonly number[]): number {
  const ranks = (xs: readonly number[]): number[] => {
    const order = xs.map((x, i) => ({ x, i })).sort((p, q) => p.x - q.x);
    const r = new Array<number>(xs.length);
    for (let i = 0; i < order.length;) {
      let j = i;
      while (j + 1 < order.length && order[j + 1]!.x === order[i]!.x) j++;
      for (let k = i; k <= j; k++) r[order[k]!.i] = (i + j) / 2 + 1;
      i = j + 1;
    }
    return r;
  };
  const [ra, rb] = [ranks(a), ranks(b)];
  const n = a.length;
  const mean = (n + 1) / 2;
  let num = 0;
  let da = 0;
  let db = 0;
  for (let i = 0; i < n; i++) {
    num += (ra[i]! - mean) * (rb[i]! - mean);
    da += (ra[i]! - mean) ** 2;
    db += (rb[i]! - mean) ** 2;
  }
  return num / Math.sqrt(da * db);
}

/** Roster keys of a squad, in roster order. */
export function squadKeys(squad: SquadKey): string[] {
  return PLAYERS.filter((p) => p.squad === squad).map((p) => p.key);
}
