/**
 * The root-finding behind `solveSpeedAndSpin` (speed-spin.ts): launch speed and backspin from a kick's
 * carry and its time in the air.
 *
 * Two equations, two unknowns: carry(v, ω) = C and time(v, ω) = T at the technique's launch angle.
 * Solved by Newton's method with a finite-difference Jacobian and a backtracking line search; when Newton
 * does not converge (the power-law lift has a vertical tangent at zero spin, so steps across ω = 0 can
 * overshoot) a bracketing fallback walks the iso-carry curve: for each backspin the launch speed that
 * gives the carry (Brent), then Brent in backspin on the flight time along that curve. The fallback also
 * decides infeasibility: along the iso-carry curve the flight time rises with backspin (checked on a grid
 * of angles 8–55°, carries 8–75 m and spins −20 … 20 rev/s), so a time outside the curve's range is
 * impossible for that carry and angle, too short or too long.
 */

import { DEFAULT_SOLVER_SETTINGS, integrateFlight, type SolverSettings } from './integrate';
import { INVERSE_MAX_SPEED_MS, INVERSE_MIN_SPEED_MS } from './inverse';
import { buildModel, resolveConditions, validateLaunch } from './model';
import { brentRoot } from './roots';
import type { FlightConditions } from './types';
import { requireFinite, requireInHalfOpen } from './validate';

/**
 * Backspin search box, rev/s (+ = backspin, − = topspin). Measured free kicks reach 8–17 rev/s (Barber &
 * Carré 2010, Sports Engineering 13:47); ±20 leaves headroom without letting the solver explain a bad
 * time with an absurd spin.
 */
export const SPEED_SPIN_BACKSPIN_RANGE_RPS: readonly [number, number] = [-20, 20];

/** A kick to explain: carry and flight time at a launch angle, in the session's conditions. */
export interface SpeedSpinQuery {
  /** Carry to first ground contact, m. */
  carryM: number;
  /** Time from foot contact to first ground contact, s (already corrected for the timer's bias). */
  flightTimeS: number;
  /** Launch elevation, degrees (the technique's default or a measured angle). */
  elevationDeg: number;
  /** Sidespin estimate, rev/s (+ curls left); it adds to the spin magnitude that sets lift and drag. */
  sidespinRps?: number;
  conditions?: FlightConditions;
}

/** Why a carry and time pair has no solution. */
export type SpeedSpinFailure = 'time_too_short' | 'time_too_long' | 'carry_out_of_reach';

/** A solved pair. */
export interface SpeedSpinPoint {
  ok: true;
  speedMs: number;
  backspinRps: number;
  /** Which root-finder produced it. */
  method: 'newton' | 'bracket';
  /** Forward simulations spent. */
  evaluations: number;
}

/** No launch in the search box explains the pair; says which way the time is off and what was possible. */
export interface SpeedSpinNoSolution {
  ok: false;
  reason: SpeedSpinFailure;
  /** One sentence for a coach. */
  message: string;
  /** Flight times the model allows for this carry and angle (null when the carry itself is out of reach). */
  feasibleTimeS: { min: number; max: number } | null;
  evaluations: number;
}

/** Result of the point solve. */
export type SpeedSpinSolution = SpeedSpinPoint | SpeedSpinNoSolution;

/** Carry residual accepted as solved, m (the integrator is tuned to ~0.5 mm, DEFAULT_SOLVER_SETTINGS). */
const CARRY_TOL_M = 1e-3;
/** Flight-time residual accepted as solved, s (a stopwatch is good to ~0.05 s; this is far below it). */
const TIME_TOL_S = 5e-5;
/** Residual scales of the Newton merit function: 1 m of carry weighs like 0.05 s of time. */
const MERIT_CARRY_M = 1;
const MERIT_TIME_S = 0.05;
const NEWTON_MAX_ITERATIONS = 20;
/** Finite-difference steps: small next to the answer's precision, large next to the integrator's noise. */
const FD_SPEED_MS = 0.02;
const FD_SPIN_RPS = 0.02;
/** Largest Newton step, so a poor Jacobian cannot fling the iterate across the box. */
const MAX_STEP_SPEED_MS = 10;
const MAX_STEP_SPIN_RPS = 6;
/** Backspin grid of the bracketing fallback; brackets between neighbours are refined by Brent. */
const GRID_RPS = [-20, -10, -5, -2, 0, 2, 5, 10, 20];
/** Bisections used to locate the edge of the reachable spins when the carry needs > 60 m/s somewhere. */
const EDGE_BISECTIONS = 6;

/** Resolved problem shared by every evaluation of one solve. */
export interface SpeedSpinProblem {
  readonly conditions: ReturnType<typeof resolveConditions>;
  readonly elevationDeg: number;
  readonly sidespinRps: number;
  readonly settings: Readonly<SolverSettings>;
  evaluations: number;
}

interface Evaluated {
  carryM: number;
  timeS: number;
}

/** One point of the iso-carry curve: the speed that gives the carry at this backspin, and the flight time. */
export interface CurvePoint {
  backspinRps: number;
  speedMs: number;
  timeS: number;
}

/** Validates the conditions and launch once; throws RangeError naming the field. */
export function speedSpinProblem(
  query: Pick<SpeedSpinQuery, 'elevationDeg' | 'sidespinRps' | 'conditions'>,
  settings: Readonly<SolverSettings> = DEFAULT_SOLVER_SETTINGS,
): SpeedSpinProblem {
  if (query === null || typeof query !== 'object') throw new RangeError('speed and spin query must be an object');
  const launch = validateLaunch({ speed: INVERSE_MIN_SPEED_MS, elevationDeg: query.elevationDeg, sidespinRps: query.sidespinRps });
  if (!(launch.elevationDeg > 0)) throw new RangeError(`elevationDeg must be above 0 ° to time a flight (got ${launch.elevationDeg})`);
  return {
    conditions: resolveConditions(query.conditions ?? {}),
    elevationDeg: launch.elevationDeg,
    sidespinRps: launch.sidespinRps,
    settings,
    evaluations: 0,
  };
}

function fly(p: SpeedSpinProblem, speedMs: number, backspinRps: number): Evaluated {
  p.evaluations++;
  const model = buildModel(p.conditions, {
    speed: speedMs,
    elevationDeg: p.elevationDeg,
    azimuthDeg: 0,
    backspinRps,
    sidespinRps: p.sidespinRps,
  });
  const f = integrateFlight(model, { settings: p.settings });
  // A ball still up at the 30 s cap has, for this purpose, an endless flight.
  return { carryM: f.carryM, timeS: f.landed ? f.flightTimeS : Number.POSITIVE_INFINITY };
}

const clamp = (x: number, lo: number, hi: number): number => Math.min(hi, Math.max(lo, x));

/**
 * The slowest launch speed that carries `carryM` at this backspin, with its flight time; null when no
 * speed up to 60 m/s does. Strong backspin at steep angles makes carry fall again at high speed (the
 * ball balloons), so the bracket tries 60, 40 and 30 m/s as its top and keeps the slower root.
 */
export function curvePoint(p: SpeedSpinProblem, carryM: number, backspinRps: number): CurvePoint | null {
  const lo = fly(p, INVERSE_MIN_SPEED_MS, backspinRps).carryM - carryM;
  if (lo > 0) return null;
  for (const top of [INVERSE_MAX_SPEED_MS, 40, 30]) {
    const hi = fly(p, top, backspinRps).carryM - carryM;
    if (hi < 0) continue;
    let best: CurvePoint = { backspinRps, speedMs: top, timeS: Number.NaN };
    let bestResidual = Number.POSITIVE_INFINITY;
    const residual = (v: number): number => {
      const e = fly(p, v, backspinRps);
      const r = e.carryM - carryM;
      if (Math.abs(r) < bestResidual) {
        bestResidual = Math.abs(r);
        best = { backspinRps, speedMs: v, timeS: e.timeS };
      }
      return r;
    };
    const speedMs = brentRoot(residual, INVERSE_MIN_SPEED_MS, top, lo, hi, 1e-7);
    if (!Number.isFinite(speedMs)) return null;
    return best.speedMs === speedMs && Number.isFinite(best.timeS)
      ? best
      : { backspinRps, speedMs, timeS: fly(p, speedMs, backspinRps).timeS };
  }
  return null;
}

/** Finite-difference step in backspin: away from ω = 0 (towards the target time at 0), inside the box. */
function spinStep(w: number, wantLonger: boolean): number {
  const [wMin, wMax] = SPEED_SPIN_BACKSPIN_RANGE_RPS;
  const up = w > 0 || (w === 0 && wantLonger);
  if (up) return w + FD_SPIN_RPS > wMax ? -FD_SPIN_RPS : FD_SPIN_RPS;
  return w - FD_SPIN_RPS < wMin ? FD_SPIN_RPS : -FD_SPIN_RPS;
}

function merit(e: Evaluated, carryM: number, timeS: number): number {
  const rc = (e.carryM - carryM) / MERIT_CARRY_M;
  const rt = (e.timeS - timeS) / MERIT_TIME_S;
  return rc * rc + rt * rt;
}

/**
 * Newton's method on (carry, time) − (C, T) from `start`, inside the search box. Null when it stalls
 * (no descent along the step), leaves the box or runs out of iterations; the caller then brackets.
 */
export function newtonSpeedSpin(
  p: SpeedSpinProblem,
  carryM: number,
  timeS: number,
  start: { speedMs: number; backspinRps: number },
): { speedMs: number; backspinRps: number } | null {
  const [wMin, wMax] = SPEED_SPIN_BACKSPIN_RANGE_RPS;
  let v = clamp(start.speedMs, INVERSE_MIN_SPEED_MS, INVERSE_MAX_SPEED_MS);
  let w = clamp(start.backspinRps, wMin, wMax);
  let f = fly(p, v, w);
  let m = merit(f, carryM, timeS);
  for (let iteration = 0; iteration < NEWTON_MAX_ITERATIONS; iteration++) {
    const rc = f.carryM - carryM;
    const rt = f.timeS - timeS;
    if (!Number.isFinite(rt)) return null;
    if (Math.abs(rc) <= CARRY_TOL_M && Math.abs(rt) <= TIME_TOL_S) return { speedMs: v, backspinRps: w };
    // One-sided differences that stay inside the box and on this side of ω = 0 (lift ∝ S^¼ has a kink there).
    const hv = v + FD_SPEED_MS > INVERSE_MAX_SPEED_MS ? -FD_SPEED_MS : FD_SPEED_MS;
    const hw = spinStep(w, timeS > f.timeS);
    const fv = fly(p, v + hv, w);
    const fw = fly(p, v, w + hw);
    const a = (fv.carryM - f.carryM) / hv;
    const b = (fw.carryM - f.carryM) / hw;
    const c = (fv.timeS - f.timeS) / hv;
    const d = (fw.timeS - f.timeS) / hw;
    const det = a * d - b * c;
    if (!Number.isFinite(det) || det === 0) return null;
    let dv = -(d * rc - b * rt) / det;
    let dw = -(a * rt - c * rc) / det;
    const shrink = Math.min(1, MAX_STEP_SPEED_MS / Math.abs(dv), MAX_STEP_SPIN_RPS / Math.abs(dw));
    dv *= shrink;
    dw *= shrink;
    let accepted = false;
    for (let lambda = 1; lambda > 1 / 200; lambda /= 2) {
      const nv = clamp(v + lambda * dv, INVERSE_MIN_SPEED_MS, INVERSE_MAX_SPEED_MS);
      const nw = clamp(w + lambda * dw, wMin, wMax);
      const nf = fly(p, nv, nw);
      const nm = merit(nf, carryM, timeS);
      if (nm < m) {
        v = nv;
        w = nw;
        f = nf;
        m = nm;
        accepted = true;
        break;
      }
    }
    if (!accepted) return null;
  }
  return null;
}

/** The iso-carry curve sampled on the fallback grid (null entries: the carry is out of reach there). */
export function curveGrid(p: SpeedSpinProblem, carryM: number): (CurvePoint | null)[] {
  return GRID_RPS.map((w) => curvePoint(p, carryM, w));
}

/** Brent in backspin on the flight time along the iso-carry curve, inside a bracket of two curve points. */
function solveAlongCurve(p: SpeedSpinProblem, carryM: number, timeS: number, a: CurvePoint, b: CurvePoint): CurvePoint | null {
  const seen: { last: CurvePoint | null } = { last: null };
  const g = (w: number): number => {
    const point = curvePoint(p, carryM, w);
    // Unreachable inside a reachable bracket: NaN fails every sign test, so Brent's result is checked below.
    if (!point) return Number.NaN;
    seen.last = point;
    return point.timeS - timeS;
  };
  const w = brentRoot(g, a.backspinRps, b.backspinRps, a.timeS - timeS, b.timeS - timeS, 1e-6);
  if (!Number.isFinite(w)) return null;
  const point = seen.last?.backspinRps === w ? seen.last : w === a.backspinRps ? a : w === b.backspinRps ? b : curvePoint(p, carryM, w);
  // Brent converges in backspin to 1e-6 rev/s; the time then matches except where lift ∝ S^¼ makes the time
  // jump at ω ≈ 0, so only a gross miss (a bracket spoiled by an unreachable spin) is refused.
  return point && Math.abs(point.timeS - timeS) < 0.05 ? point : null;
}

/**
 * Walks from the last reachable grid point towards an unreachable neighbour, looking for a bracket of the
 * time inside the reachable part. Returns the solved point, or the outermost reachable point seen.
 */
function searchEdge(
  p: SpeedSpinProblem,
  carryM: number,
  timeS: number,
  reachable: CurvePoint,
  unreachableRps: number,
): { solved: CurvePoint | null; extreme: CurvePoint } {
  let inside = reachable;
  let outside = unreachableRps;
  for (let i = 0; i < EDGE_BISECTIONS; i++) {
    const point = curvePoint(p, carryM, (inside.backspinRps + outside) / 2);
    if (!point) {
      outside = (inside.backspinRps + outside) / 2;
      continue;
    }
    if ((point.timeS - timeS) * (inside.timeS - timeS) <= 0)
      return { solved: solveAlongCurve(p, carryM, timeS, point, inside), extreme: point };
    inside = point;
  }
  return { solved: null, extreme: inside };
}

/**
 * The bracketing solve: sample the iso-carry curve, find the grid interval whose times straddle T and
 * refine it; otherwise report which way T is off, with the range of times the curve allows.
 */
export function bracketSpeedSpin(
  p: SpeedSpinProblem,
  carryM: number,
  timeS: number,
  grid: readonly (CurvePoint | null)[] = curveGrid(p, carryM),
): CurvePoint | Omit<SpeedSpinNoSolution, 'evaluations'> {
  const firstIndex = grid.findIndex((g) => g !== null);
  if (firstIndex < 0) {
    return {
      ok: false,
      reason: 'carry_out_of_reach',
      message: `No launch up to ${INVERSE_MAX_SPEED_MS} m/s at ${p.elevationDeg}° carries ${carryM.toFixed(1)} m with spin between ${SPEED_SPIN_BACKSPIN_RANGE_RPS[0]} and ${SPEED_SPIN_BACKSPIN_RANGE_RPS[1]} rev/s`,
      feasibleTimeS: null,
    };
  }
  let lastIndex = firstIndex;
  for (let i = firstIndex; i < grid.length; i++) if (grid[i]) lastIndex = i;
  for (let i = firstIndex; i < lastIndex; i++) {
    const a = grid[i];
    const b = grid[i + 1];
    if (a && b && (a.timeS - timeS) * (b.timeS - timeS) <= 0) {
      const solved = solveAlongCurve(p, carryM, timeS, a, b);
      if (solved) return solved;
    }
  }
  let low = grid[firstIndex]!;
  let high = grid[lastIndex]!;
  if (timeS < low.timeS && firstIndex > 0) {
    const edge = searchEdge(p, carryM, timeS, low, GRID_RPS[firstIndex - 1]!);
    if (edge.solved) return edge.solved;
    low = edge.extreme;
  }
  if (timeS > high.timeS && lastIndex < grid.length - 1) {
    const edge = searchEdge(p, carryM, timeS, high, GRID_RPS[lastIndex + 1]!);
    if (edge.solved) return edge.solved;
    high = edge.extreme;
  }
  const range = { min: low.timeS, max: high.timeS };
  const tooShort = timeS < low.timeS;
  const what = `${timeS.toFixed(2)} s is too ${tooShort ? 'short' : 'long'} a flight for ${carryM.toFixed(1)} m at ${p.elevationDeg}°`;
  const bound = tooShort
    ? `the shortest the model allows is ${low.timeS.toFixed(2)} s, with ${spinWords(low.backspinRps)}`
    : `the longest the model allows is ${high.timeS.toFixed(2)} s, with ${spinWords(high.backspinRps)}`;
  return { ok: false, reason: tooShort ? 'time_too_short' : 'time_too_long', message: `${what}: ${bound}`, feasibleTimeS: range };
}

function spinWords(backspinRps: number): string {
  const rate = Math.abs(backspinRps).toFixed(1);
  return backspinRps < 0 ? `${rate} rev/s of topspin` : `${rate} rev/s of backspin`;
}

/** Validated carry and time; a time of zero or less is a result (too short), not an error. */
export function requireCarryAndTime(query: Pick<SpeedSpinQuery, 'carryM' | 'flightTimeS'>): { carryM: number; timeS: number } {
  return { carryM: requireInHalfOpen('carryM', query.carryM, 0, 500, 'm'), timeS: requireFinite('flightTimeS', query.flightTimeS) };
}

/** Starting point for Newton: the drag-free speed for the carry, a little faster, with light backspin. */
export function defaultStart(p: SpeedSpinProblem, carryM: number): { speedMs: number; backspinRps: number } {
  const vacuum = Math.sqrt((carryM * p.conditions.gravityMs2) / Math.sin((2 * p.elevationDeg * Math.PI) / 180));
  return { speedMs: clamp(1.15 * vacuum, INVERSE_MIN_SPEED_MS + 1, INVERSE_MAX_SPEED_MS - 1), backspinRps: 3 };
}

/**
 * Solve one (carry, time) pair on a prepared problem: Newton from `start`, then the bracketing fallback.
 * `gridOf` lets a caller that solves many times on one carry share the fallback's curve grid.
 */
export function solveOnProblem(
  p: SpeedSpinProblem,
  carryM: number,
  timeS: number,
  start: { speedMs: number; backspinRps: number } = defaultStart(p, carryM),
  gridOf: () => readonly (CurvePoint | null)[] = () => curveGrid(p, carryM),
): SpeedSpinSolution {
  const before = p.evaluations;
  if (timeS > 0) {
    const newton = newtonSpeedSpin(p, carryM, timeS, start);
    if (newton) return { ok: true, ...newton, method: 'newton', evaluations: p.evaluations - before };
  }
  const bracket = bracketSpeedSpin(p, carryM, Math.max(timeS, 0), gridOf());
  if ('ok' in bracket) {
    const message = timeS <= 0 ? `A flight time of ${timeS.toFixed(2)} s is not a flight: ${bracket.message}` : bracket.message;
    return {
      ...bracket,
      reason: timeS <= 0 && bracket.reason !== 'carry_out_of_reach' ? 'time_too_short' : bracket.reason,
      message,
      evaluations: p.evaluations - before,
    };
  }
  return { ok: true, speedMs: bracket.speedMs, backspinRps: bracket.backspinRps, method: 'bracket', evaluations: p.evaluations - before };
}
