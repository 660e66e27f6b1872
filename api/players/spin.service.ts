/**
 * Spin from hang time for the Player file: every timed repetition of a player with a known carry is solved
 * for launch speed and backspin (`timedKickEvidence` in shared/flight), and the repetitions of a technique
 * are combined by inverse-variance weighting. Computed here rather than in the browser's worker because it
 * needs the club's timing calibration and every session's conditions, which the server already holds
 * scoped, and because the answer is small: the Player file fetches one short JSON instead of the kicks.
 */
import {
  DEFAULT_ELEVATION_DEG,
  SIDESPIN_STEP_RPS,
  SPIN_STEP_RPS,
  timedCarryOf,
  timedKickEvidence,
  type BackspinStep,
  type SidespinStep,
  type TimedKickInput,
  type TimedKickEvidence,
} from '../../shared/flight/index';
import type { SpinEstimateSkip, SpinEstimatesResponse, TechniqueSpinEstimate } from '../../shared/schemas/analysis';
import { TECHNIQUES, type Outcome, type Technique } from '../../shared/schemas/sync';
import { conditionsOf, type SessionConditions } from '../analysis/flight-inputs';
import type { Db } from '../db/client';
import { cachedStatement } from '../db/statements';
import { NotFound } from '../errors';
import type { Scope } from '../scope/scope';

/**
 * Most recent timed repetitions read per technique: recent form is what a coach asks about, and each one
 * costs ~10–20 ms of flight-model sampling the first time it is seen.
 */
export const SPIN_ESTIMATE_LIMIT = 60;

/** Smallest per-repetition standard deviation used as a weight (keeps one near-exact kick from taking over). */
const MIN_SD_RPS = 0.05;
const MIN_SD_MS = 0.05;

interface TimedRow extends SessionConditions {
  technique: Technique;
  outcome: Outcome;
  targetDistanceM: number;
  targetRadiusM: number;
  backspinStep: number;
  sidespinStep: number;
  carryM: number | null;
  launchAngleDeg: number | null;
  hangTimeS: number;
}

const SELECT_TIMED = `SELECT technique, outcome, targetDistanceM, targetRadiusM, backspinStep, sidespinStep, carryM, launchAngleDeg, hangTimeS,
       temperatureC, altitudeM, relativeHumidityPct, pressureHpa, windSpeedMs, windFromDeg, ballSize, conditionsSourceJson
  FROM (SELECT k.technique, k.outcome, k.target_distance_m AS targetDistanceM, k.target_radius_m AS targetRadiusM,
               k.backspin_step AS backspinStep, k.sidespin_step AS sidespinStep, k.carry_m AS carryM, k.launch_angle_deg AS launchAngleDeg,
               k.hang_time_s AS hangTimeS, s.temperature_c AS temperatureC, s.altitude_m AS altitudeM,
               s.relative_humidity_pct AS relativeHumidityPct, s.pressure_hpa AS pressureHpa, s.wind_speed_ms AS windSpeedMs,
               s.wind_from_deg AS windFromDeg, s.ball_size AS ballSize, s.conditions_source_json AS conditionsSourceJson,
               ROW_NUMBER() OVER (PARTITION BY k.technique ORDER BY k.recorded_at DESC) AS n
          FROM kicks k JOIN training_sessions s ON s.id = k.session_id
         WHERE k.player_id = ? AND k.club_id = ? AND k.deleted_at IS NULL AND k.hang_time_s IS NOT NULL AND s.deleted_at IS NULL)
 WHERE n <= ?`;

/** Memo of solved repetitions keyed by every input of the solve, so a result can never be stale. */
const solved = new Map<string, TimedKickEvidence>();
const MEMO_LIMIT = 20_000;

function evidenceOf(input: TimedKickInput): TimedKickEvidence {
  const key = JSON.stringify(input);
  const hit = solved.get(key);
  if (hit) return hit;
  const evidence = timedKickEvidence(input);
  if (solved.size >= MEMO_LIMIT) solved.delete(solved.keys().next().value as string);
  solved.set(key, evidence);
  return evidence;
}

interface Weighted {
  value: number;
  sd: number;
}

/**
 * Inverse-variance weighted mean; its uncertainty is the larger of the timing-only standard error and the
 * one the kick-to-kick scatter implies (a player does not strike every ball with the same spin).
 */
function combine(points: readonly Weighted[], floor: number): { mean: number; uncertainty: number; scatter: number | null } {
  const weights = points.map((p) => 1 / Math.max(p.sd, floor) ** 2);
  const total = weights.reduce((a, b) => a + b, 0);
  const mean = points.reduce((a, p, i) => a + weights[i]! * p.value, 0) / total;
  const timingSe = Math.sqrt(1 / total);
  if (points.length < 2) return { mean, uncertainty: timingSe, scatter: null };
  const spread = points.reduce((a, p, i) => a + weights[i]! * (p.value - mean) ** 2, 0);
  const scatterSe = Math.sqrt(spread / ((points.length - 1) * total));
  const plainMean = points.reduce((a, p) => a + p.value, 0) / points.length;
  const scatter = Math.sqrt(points.reduce((a, p) => a + (p.value - plainMean) ** 2, 0) / (points.length - 1));
  return { mean, uncertainty: Math.max(timingSe, scatterSe), scatter };
}

function emptySkips(): Record<SpinEstimateSkip, number> {
  return { no_carry: 0, time_too_short: 0, time_too_long: 0, carry_out_of_reach: 0, spread_unresolved: 0 };
}

/** Spin estimates per technique for one player (visibility already checked by the caller through `getPlayer`). */
export function playerSpinEstimates(db: Db, scope: Scope, playerId: string): SpinEstimatesResponse {
  const club = cachedStatement(db.$client, 'SELECT timing_bias_s AS biasS, timing_sd_s AS sdS FROM clubs WHERE id = ?').get(
    scope.user.clubId,
  ) as { biasS: number; sdS: number } | undefined;
  if (!club) throw new NotFound('Your club no longer exists');
  const timing = { biasS: club.biasS, sdS: club.sdS };
  const rows = cachedStatement(db.$client, SELECT_TIMED).all(playerId, scope.user.clubId, SPIN_ESTIMATE_LIMIT) as TimedRow[];
  const techniques: TechniqueSpinEstimate[] = [];
  for (const technique of TECHNIQUES) {
    const timed = rows.filter((r) => r.technique === technique);
    if (timed.length === 0) continue;
    const skipped = emptySkips();
    const spins: Weighted[] = [];
    const speeds: Weighted[] = [];
    let eyeSum = 0;
    for (const row of timed) {
      const carry = timedCarryOf(row);
      if (!carry) {
        skipped.no_carry++;
        continue;
      }
      const e = evidenceOf({
        ...carry,
        hangTimeS: row.hangTimeS,
        elevationDeg: row.launchAngleDeg ?? DEFAULT_ELEVATION_DEG[technique],
        sidespinRps: SIDESPIN_STEP_RPS[row.sidespinStep as SidespinStep] ?? 0,
        conditions: conditionsOf(row),
        timing,
      });
      if (!e.ok) {
        skipped[e.reason]++;
        continue;
      }
      spins.push({ value: e.backspinRps, sd: e.backspinSdRps });
      speeds.push({ value: e.speedMs, sd: e.speedSdMs });
      eyeSum += SPIN_STEP_RPS[row.backspinStep as BackspinStep] ?? 0;
    }
    const spin = spins.length ? combine(spins, MIN_SD_RPS) : null;
    const speed = speeds.length ? combine(speeds, MIN_SD_MS) : null;
    techniques.push({
      technique,
      timedCount: timed.length,
      solvedCount: spins.length,
      skipped,
      backspinRps: spin?.mean ?? null,
      backspinUncertaintyRps: spin?.uncertainty ?? null,
      backspinScatterRps: spin?.scatter ?? null,
      speedMs: speed?.mean ?? null,
      speedUncertaintyMs: speed?.uncertainty ?? null,
      eyeBackspinRps: spins.length ? eyeSum / spins.length : null,
    });
  }
  return { playerId, timing, perTechniqueLimit: SPIN_ESTIMATE_LIMIT, techniques };
}
