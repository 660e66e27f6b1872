/**
 * Honest calibration for Squad week: a player's predicted hit count for a week comes from a profile
 * fitted on their repetitions *before* that week (the judged week is held out of the fit), and each
 * repetition is predicted in its own session's conditions (wind at its reference height, air, ball),
 * as it was kicked. Heavy (a fit and a table per session), so the refresher computes it off the request
 * path and `ProfileCache` keeps the answer until the player's kicks change.
 */
import { AimedSamples } from '../../shared/flight/reach-curve';
import { fitProfile } from '../../shared/flight/index';
import type { Technique } from '../../shared/schemas/sync';
import { addDays } from '../../shared/dates';
import type { Db } from '../db/client';
import { conditionsOf, loggedKickOf, type SessionConditions, type StoredKick } from './flight-inputs';

/** Samples per session of the held-out prediction (as the cached reach curves). */
const CALIBRATION_SAMPLES = 1000;
const CALIBRATION_SEED = 20_261_203;

/** A week's held-out calibration of one player and technique. */
export interface HeldOutCalibration {
  reps: number;
  /** Repetitions logged on target. */
  hits: number;
  /** Sum over the week's repetitions of the predicted hit probability; null when nothing before the week could be fitted. */
  predictedHits: number | null;
}

const KICK_COLUMNS = `k.technique, k.outcome, k.target_distance_m AS targetDistanceM, k.target_radius_m AS targetRadiusM,
  k.backspin_step AS backspinStep, k.sidespin_step AS sidespinStep, k.carry_m AS carryM, k.lateral_m AS lateralM,
  k.measured_speed_ms AS measuredSpeedMs, k.launch_angle_deg AS launchAngleDeg, k.measured_spin_rps AS measuredSpinRps, k.measured_source AS measuredSource,
  k.hang_time_s AS hangTimeS, s.id AS sessionId, s.temperature_c AS temperatureC, s.altitude_m AS altitudeM,
  s.relative_humidity_pct AS relativeHumidityPct, s.pressure_hpa AS pressureHpa, s.wind_speed_ms AS windSpeedMs,
  s.wind_from_deg AS windFromDeg, s.ball_size AS ballSize, s.conditions_source_json AS conditionsSourceJson`;

type Row = StoredKick & SessionConditions & { sessionId: string };

/** The held-out calibration of `playerId`'s `technique` for the week starting `weekStart` (YYYY-MM-DD). */
export function heldOutCalibration(
  db: Db,
  playerId: string,
  technique: Technique,
  weekStart: string,
  timing: { biasS: number; sdS: number },
): HeldOutCalibration {
  const weekEnd = addDays(weekStart, 7);
  const live = `k.player_id = ? AND k.technique = ? AND k.deleted_at IS NULL AND s.deleted_at IS NULL`;
  const week = db.$client
    .prepare(
      `SELECT ${KICK_COLUMNS} FROM kicks k JOIN training_sessions s ON s.id = k.session_id WHERE ${live} AND k.recorded_at >= ? AND k.recorded_at < ?`,
    )
    .all(playerId, technique, weekStart, weekEnd) as Row[];
  const hits = week.filter((k) => k.outcome === 'on_target').length;
  const before = db.$client
    .prepare(
      `SELECT ${KICK_COLUMNS} FROM kicks k JOIN training_sessions s ON s.id = k.session_id WHERE ${live} AND k.recorded_at < ?
        ORDER BY k.recorded_at DESC LIMIT 400`,
    )
    .all(playerId, technique, weekStart) as Row[];
  if (week.length === 0 || before.length === 0) return { reps: week.length, hits, predictedHits: null };
  const ballSize = before[0]!.ballSize === 3 || before[0]!.ballSize === 4 ? (before[0]!.ballSize as 3 | 4) : 5;
  const profile = fitProfile(
    before.map((r) => loggedKickOf(r, r)),
    undefined,
    { timing, ballSize },
  );
  const bySession = new Map<string, Row[]>();
  for (const k of week) bySession.set(k.sessionId, [...(bySession.get(k.sessionId) ?? []), k]);
  let predictedHits = 0;
  for (const rows of bySession.values()) {
    const samples = new AimedSamples(profile, conditionsOf(rows[0]!), CALIBRATION_SAMPLES, CALIBRATION_SEED);
    const shares = new Map<string, number>();
    for (const k of rows) {
      const key = `${k.targetDistanceM}|${k.targetRadiusM}`;
      let share = shares.get(key);
      if (share === undefined) {
        const r2 = k.targetRadiusM * k.targetRadiusM;
        const landings = samples.landingsAt(k.targetDistanceM);
        share = landings.filter((p) => (p.x - k.targetDistanceM) ** 2 + p.y * p.y <= r2).length / landings.length;
        shares.set(key, share);
      }
      predictedHits += share;
    }
  }
  return { reps: week.length, hits, predictedHits };
}
