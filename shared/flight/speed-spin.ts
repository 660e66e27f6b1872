/**
 * Launch speed and backspin from two observations of one kick: its carry (cones) and its time in the air
 * (a phone stopwatch). Spin estimated by eye is the weakest input of the reach envelope; the flight time
 * pins it down because backspin holds the ball up (Magnus lift) while the carry pins the speed. A hand
 * timer is coarse, so every answer carries the spread that the timing (and carry) uncertainty leaves,
 * propagated through the flight model by seeded sampling rather than by a linearisation — near zero spin
 * the map from time to spin is far from linear.
 */

import { DEFAULT_SOLVER_SETTINGS, type SolverSettings } from './integrate';
import { SeededRandom } from './random';
import {
  curveGrid,
  requireCarryAndTime,
  solveOnProblem,
  speedSpinProblem,
  type CurvePoint,
  type SpeedSpinFailure,
  type SpeedSpinNoSolution,
  type SpeedSpinQuery,
} from './speed-spin-roots';
import { percentileSorted } from './stats';
import { requireInRange, requireInteger } from './validate';

export { SPEED_SPIN_BACKSPIN_RANGE_RPS } from './speed-spin-roots';
export type { SpeedSpinFailure, SpeedSpinNoSolution, SpeedSpinQuery } from './speed-spin-roots';

/** Samples drawn by default to propagate the timing spread. */
export const SPEED_SPIN_DEFAULT_SAMPLES = 200;
/** Fewer solved samples than this share (or than 2) and the spread is not reported. */
const MIN_SOLVED_SHARE = 0.1;

/** A query with the spreads to propagate. */
export interface SpeedSpinEstimateQuery extends SpeedSpinQuery {
  /** Standard deviation of the (bias-corrected) flight time, s; 0 or absent = exact. */
  timingSdS?: number;
  /** Standard deviation of the carry, m (e.g. half the target radius for an on-target call); 0 = exact. */
  carrySdM?: number;
  /** Samples of the spreads (default 200). */
  samples?: number;
  /** Seed of the sampling, so the same kick always reports the same spread. */
  seed?: number;
}

/** Spread of one estimated quantity over the solved samples. */
export interface SampledSpread {
  /** Sample standard deviation. */
  sd: number;
  p05: number;
  p16: number;
  p50: number;
  p84: number;
  p95: number;
}

/** How well the timing spread pins the answer down. */
export interface SpeedSpinUncertainty {
  /** Samples drawn (0 when no spread was given). */
  samples: number;
  /** Share of the samples that had a solution; the spreads describe only those. */
  solvedShare: number;
  /** Null when too few samples solved to say (the pair sits at the edge of what is possible). */
  speedMs: SampledSpread | null;
  backspinRps: SampledSpread | null;
}

/** A solved kick: the point estimate (from the observed pair itself) and its spread. */
export interface SpeedSpinEstimate {
  ok: true;
  speedMs: number;
  backspinRps: number;
  method: 'newton' | 'bracket';
  uncertainty: SpeedSpinUncertainty;
  /** Forward simulations spent, samples included. */
  evaluations: number;
}

/** Result of `solveSpeedAndSpin`. */
export type SpeedSpinResult = SpeedSpinEstimate | SpeedSpinNoSolution;

function spreadOf(values: number[]): SampledSpread {
  const sorted = values.slice().sort((a, b) => a - b);
  const mean = values.reduce((s, v) => s + v, 0) / values.length;
  const variance = values.reduce((s, v) => s + (v - mean) * (v - mean), 0) / (values.length - 1);
  return {
    sd: Math.sqrt(variance),
    p05: percentileSorted(sorted, 5),
    p16: percentileSorted(sorted, 16),
    p50: percentileSorted(sorted, 50),
    p84: percentileSorted(sorted, 84),
    p95: percentileSorted(sorted, 95),
  };
}

const exactSpread = (x: number): SampledSpread => ({ sd: 0, p05: x, p16: x, p50: x, p84: x, p95: x });

/**
 * Launch speed (m/s) and backspin (rev/s, negative = topspin) that explain a carry and a flight time at
 * a launch angle, with the spread left by the timing (and carry) uncertainty; or a clear "no solution"
 * saying whether the time is too short or too long for that carry and angle, with the times that are
 * possible. Never throws for an impossible pair, only for malformed input (RangeError naming the field).
 */
export function solveSpeedAndSpin(
  query: SpeedSpinEstimateQuery,
  settings: Readonly<SolverSettings> = DEFAULT_SOLVER_SETTINGS,
): SpeedSpinResult {
  const problem = speedSpinProblem(query, settings);
  const { carryM, timeS } = requireCarryAndTime(query);
  const timingSdS = requireInRange('timingSdS', query.timingSdS ?? 0, 0, 1, 's');
  const carrySdM = requireInRange('carrySdM', query.carrySdM ?? 0, 0, 20, 'm');
  const samples = timingSdS > 0 || carrySdM > 0 ? requireInteger('samples', query.samples ?? SPEED_SPIN_DEFAULT_SAMPLES, 2, 5000) : 0;
  const seed = requireInteger('seed', query.seed ?? 1, 0, 0xffffffff);

  // Every solve on the observed carry walks the same iso-carry curve, so the fallback's grid is shared.
  let grid: readonly (CurvePoint | null)[] | undefined;
  const sharedGrid = (): readonly (CurvePoint | null)[] => (grid ??= curveGrid(problem, carryM));
  const nominal = solveOnProblem(problem, carryM, timeS, undefined, sharedGrid);
  if (!nominal.ok) return { ...nominal, evaluations: problem.evaluations };
  const start = { speedMs: nominal.speedMs, backspinRps: nominal.backspinRps };
  if (samples === 0) {
    const uncertainty = { samples: 0, solvedShare: 1, speedMs: exactSpread(start.speedMs), backspinRps: exactSpread(start.backspinRps) };
    return { ...nominal, uncertainty, evaluations: problem.evaluations };
  }

  const random = new SeededRandom(seed);
  const speeds: number[] = [];
  const spins: number[] = [];
  for (let i = 0; i < samples; i++) {
    const t = timeS + timingSdS * random.normal();
    const c = carrySdM > 0 ? Math.max(0.5, carryM + carrySdM * random.normal()) : carryM;
    const solved = solveOnProblem(problem, c, t, start, carrySdM > 0 ? undefined : sharedGrid);
    if (solved.ok) {
      speeds.push(solved.speedMs);
      spins.push(solved.backspinRps);
    }
  }
  const enough = speeds.length >= Math.max(2, Math.ceil(MIN_SOLVED_SHARE * samples));
  return {
    ...nominal,
    uncertainty: {
      samples,
      solvedShare: speeds.length / samples,
      speedMs: enough ? spreadOf(speeds) : null,
      backspinRps: enough ? spreadOf(spins) : null,
    },
    evaluations: problem.evaluations,
  };
}

/** A timed repetition as the profile fit and the Player file read it. */
export interface TimedKickInput {
  /** Carry, m (logged, or the target distance for an on-target call). */
  carryM: number;
  /** Carry uncertainty, m (e.g. half the target radius for an on-target call); absent = exact. */
  carrySdM?: number;
  /** The stopwatch reading, s, uncorrected (as stored in `kicks.hang_time_s`). */
  hangTimeS: number;
  elevationDeg: number;
  sidespinRps?: number;
  conditions?: SpeedSpinQuery['conditions'];
  /** The club's stopwatch calibration: mean delay the hand adds to the reading, and its spread, s. */
  timing: { biasS: number; sdS: number };
  /** Samples (default 64: a fit may read dozens of timed kicks). */
  samples?: number;
  seed?: number;
}

/** What one timed repetition says about its launch, for a likelihood or a weighted mean. */
export type TimedKickEvidence =
  | {
      ok: true;
      speedMs: number;
      speedSdMs: number;
      backspinRps: number;
      backspinSdRps: number;
      /** The bias-corrected flight time that was solved, s. */
      flightTimeS: number;
      /** Share of the timing samples that had a solution. */
      solvedShare: number;
    }
  | {
      ok: false;
      /** `spread_unresolved`: the pair solves, but most of its timing spread falls outside what is possible. */
      reason: SpeedSpinFailure | 'spread_unresolved';
      message: string;
      flightTimeS: number;
      feasibleTimeS: { min: number; max: number } | null;
    };

/**
 * The carry a timed repetition is solved on: the logged carry (exact), or for an on-target call the target
 * distance with the spread of a landing spread evenly over the target circle (along the line, r/2); null
 * when the repetition says no more than that it missed.
 */
export function timedCarryOf(kick: {
  carryM: number | null;
  outcome: string;
  targetDistanceM: number;
  targetRadiusM: number;
}): { carryM: number; carrySdM: number } | null {
  if (kick.carryM !== null && kick.carryM > 0) return { carryM: kick.carryM, carrySdM: 0 };
  if (kick.outcome === 'on_target') return { carryM: kick.targetDistanceM, carrySdM: kick.targetRadiusM / 2 };
  return null;
}

/** Default samples for one timed repetition. */
export const TIMED_KICK_DEFAULT_SAMPLES = 64;

/**
 * Turns one timed repetition into evidence about its launch: the stopwatch reading corrected by the club's
 * timing bias (flight time = hang time − bias), solved for speed and backspin, with standard deviations
 * from the club's timing spread (and the carry's). A fit weighs such a kick more than an untimed one,
 * because its speed no longer leans on a spin guessed by eye.
 */
export function timedKickEvidence(input: TimedKickInput, settings: Readonly<SolverSettings> = DEFAULT_SOLVER_SETTINGS): TimedKickEvidence {
  if (input === null || typeof input !== 'object') throw new RangeError('timed kick must be an object');
  const hangTimeS = requireInRange('hangTimeS', input.hangTimeS, 0, 30, 's');
  if (input.timing === null || typeof input.timing !== 'object') throw new RangeError('timing must be { biasS, sdS }');
  const biasS = requireInRange('timing.biasS', input.timing.biasS, -1, 1, 's');
  const sdS = requireInRange('timing.sdS', input.timing.sdS, 0, 1, 's');
  const flightTimeS = hangTimeS - biasS;
  const result = solveSpeedAndSpin(
    {
      carryM: input.carryM,
      flightTimeS,
      elevationDeg: input.elevationDeg,
      ...(input.sidespinRps !== undefined ? { sidespinRps: input.sidespinRps } : {}),
      ...(input.conditions !== undefined ? { conditions: input.conditions } : {}),
      timingSdS: sdS,
      carrySdM: input.carrySdM ?? 0,
      samples: input.samples ?? TIMED_KICK_DEFAULT_SAMPLES,
      ...(input.seed !== undefined ? { seed: input.seed } : {}),
    },
    settings,
  );
  if (!result.ok) return { ok: false, reason: result.reason, message: result.message, flightTimeS, feasibleTimeS: result.feasibleTimeS };
  const { speedMs, backspinRps, solvedShare } = result.uncertainty;
  if (!speedMs || !backspinRps) {
    return {
      ok: false,
      reason: 'spread_unresolved',
      message: `Only ${Math.round(solvedShare * 100)} % of the timing spread around ${flightTimeS.toFixed(2)} s is possible for this carry and angle`,
      flightTimeS,
      feasibleTimeS: null,
    };
  }
  return {
    ok: true,
    speedMs: result.speedMs,
    speedSdMs: speedMs.sd,
    backspinRps: result.backspinRps,
    backspinSdRps: backspinRps.sd,
    flightTimeS,
    solvedShare,
  };
}
