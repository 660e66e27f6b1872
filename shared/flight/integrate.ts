/**
 * One trajectory with ODEX (Gragg–Bulirsch–Stoer, dense output; our allocation-free port of odex in
 * extrapolation.ts). Ground contact, apex and plane crossings are roots of its dense-output polynomials found with Brent's method inside the step
 * that contains them, so their accuracy is the integrator's, not that of a linear interpolation.
 */

import { FLIGHT_TIME_CAP_S, PATH_SAMPLE_INTERVAL_S } from './constants';
import { derivative, type FlightModel } from './model';
import { GBS_CONVERGED, GbsSolver, type GbsDense } from './extrapolation';
import { brentRoot } from './roots';
import type { Flight, PathPoint, PlaneCrossing } from './types';

/** Integrator settings. The defaults are tuned to 1 mm of carry, not to odex's 1e-5 defaults. */
export interface SolverSettings {
  relativeTolerance: number;
  absoluteTolerance: number;
  /** First step tried, s. odex's 1e-4 s start costs several tiny steps on a 1–5 s flight. */
  initialStepS: number;
  /** Longest step allowed, s (absent or 0: no limit beyond the flight-time cap). */
  maxStepS?: number;
  /** Extrapolation table size (KM); a smaller table caps the order and the work per step. */
  maxExtrapolationColumns: number;
  /** odex interpolationFormulaDegree (1..6): higher = cheaper, less accurate dense output. */
  interpolationDegree: number;
  /** odex stabilityCheckCount: midpoint-rule stability checks per table line (0 = none; non-stiff problem). */
  stabilityCheckCount: number;
  /**
   * Settings used instead when the model's wind grows with height (the logarithmic profile). Its shape
   * within a metre of the grass, crossed in a few hundredths of a second at launch and landing, is what
   * the integrator's error estimate misjudges on long steps; these settings keep steps short enough.
   */
  windProfile?: Readonly<SolverSettings>;
}

/**
 * Default settings, chosen by sweeps over tolerance, first step, longest step, table size and
 * interpolation degree against 1e-12 solutions of 2,000 varied kicks (three seeds), and checked by
 * spec/bench/flight.bench.ts: the cheapest combinations that stay well inside 1 mm of carry.
 *
 * Uniform wind (or none): tolerance in effect absolute, 1e-4 (rtol 1e-7 adds at most 1e-5 for states of
 * order 1–100 and sets odex's starting order); a first step of 0.6 s (flights last 1–5 s); a small
 * extrapolation table (a lower order cap); no stability checks (the problem is not
 * stiff). Worst carry error 0.40 mm, ~61 right-hand-side evaluations per kick.
 *
 * Wind growing with height: on those settings the worst carry error was 22 mm (the landing and launch
 * steps, up to a second long, cross the steep part of the profile; odex's error estimate and its dense
 * output both misjudge it). A first step of 0.05 s and steps of at most 0.25 s cure it at a looser
 * tolerance (3e-4) and a three-column table: worst 0.39–0.59 mm over three seeds of 2,000 kicks, ~101
 * evaluations. (Capping steps only near the grass, by restarting odex there, saved nothing: each restart
 * costs a first step.)
 */
export const DEFAULT_SOLVER_SETTINGS: Readonly<SolverSettings> = {
  relativeTolerance: 1e-7,
  absoluteTolerance: 1e-4,
  initialStepS: 0.6,
  maxExtrapolationColumns: 4,
  interpolationDegree: 5,
  stabilityCheckCount: 0,
  windProfile: {
    relativeTolerance: 1e-7,
    absoluteTolerance: 3e-4,
    initialStepS: 0.05,
    maxStepS: 0.25,
    maxExtrapolationColumns: 3,
    interpolationDegree: 5,
    stabilityCheckCount: 0,
  },
};

/** Settings for reference solutions in tests and the benchmark. */
export const TIGHT_SOLVER_SETTINGS: Readonly<SolverSettings> = {
  relativeTolerance: 1e-12,
  absoluteTolerance: 1e-12,
  initialStepS: 1e-3,
  maxExtrapolationColumns: 9,
  interpolationDegree: 4,
  stabilityCheckCount: 1,
};

/** A vertical plane n·(x, y) = d in kick axes; a crossing is reported when n·(x, y) − d turns ≥ 0. */
export interface VerticalPlane {
  nx: number;
  ny: number;
  d: number;
}

/** Options for one integration. */
export interface IntegrateOptions {
  planes?: readonly VerticalPlane[];
  path?: boolean;
  settings?: Readonly<SolverSettings>;
  /**
   * Whether to stop as soon as every plane has been crossed (set pieces need only the wall and the goal
   * line; the rest of the flight into the net or the stand is wasted work). The landing fields then
   * describe the ball at that moment, with `landed` false.
   */
  stopAfterPlanes?: boolean;
}

/** Crossing of a general vertical plane (kick axes). */
export interface GeneralCrossing extends PlaneCrossing {
  /** Index of the plane in the request. */
  plane: number;
}

/**
 * Running totals of the integrator's work in this thread: flights integrated and right-hand-side
 * evaluations. Benchmarks read them, because counts do not depend on how busy the machine is.
 */
export const integratorWork = { flights: 0, rhsEvaluations: 0 };

const solvers = new WeakMap<Readonly<SolverSettings>, GbsSolver<FlightModel>>();

/** One reusable solver per settings object: its tables are allocated once, not per flight. */
function solverFor(settings: Readonly<SolverSettings>): GbsSolver<FlightModel> {
  let solver = solvers.get(settings);
  if (!solver) {
    solver = new GbsSolver<FlightModel>({
      n: 6,
      // x, y, z and vz only: horizontal velocity at landing comes from the position polynomials.
      denseComponents: [0, 1, 2, 5],
      relativeTolerance: settings.relativeTolerance,
      absoluteTolerance: settings.absoluteTolerance,
      initialStepSize: settings.initialStepS,
      maxExtrapolationColumns: settings.maxExtrapolationColumns,
      maxSteps: 5000,
      interpolationFormulaDegree: settings.interpolationDegree,
      stabilityCheckCount: settings.stabilityCheckCount,
      maxStepSize: settings.maxStepS ?? 0,
    });
    solvers.set(settings, solver);
  }
  return solver;
}

const ROOT_TOL_S = 1e-10;

/** Integrate one kick to ground contact (or the 30 s cap). Throws nothing for valid models. */
export function integrateFlight(model: FlightModel, options: IntegrateOptions = {}): Flight & { generalCrossings: GeneralCrossing[] } {
  const s0 = model.initialState;
  const planes = options.planes ?? [];
  const wantPath = options.path === true;
  const stopAfterPlanes = options.stopAfterPlanes === true && planes.length > 0;
  const speed0 = Math.hypot(s0[3]!, s0[4]!, s0[5]!);
  if (!(s0[5]! > 0)) {
    // No upward launch: the ball never leaves the ground, so there is no flight to integrate.
    return {
      carryM: 0,
      landing: { x: 0, y: 0 },
      flightTimeS: 0,
      apexM: 0,
      apexXM: 0,
      apexTimeS: 0,
      landingSpeedMs: speed0,
      crossings: [],
      generalCrossings: [],
      path: wantPath ? [{ t: 0, x: 0, y: 0, z: 0 }] : [],
      landed: true,
      rhsEvaluations: 0,
    };
  }

  let prevT = 0;
  let prevZ = 0;
  let prevVz = s0[5]!;
  const prevState = s0.slice();
  let landed = false;
  let tLand = 0;
  const landState = [0, 0, 0, 0, 0, 0];
  let apexM = 0;
  let apexXM = 0;
  let apexTimeS = 0;
  const prevG = planes.map((p) => -p.d);
  const crossed: (GeneralCrossing | null)[] = planes.map(() => null);
  const path: PathPoint[] = [];
  let sampleIndex = 1;
  if (wantPath) path.push({ t: 0, x: 0, y: 0, z: 0 });

  const observer = (nr: number, tOld: number, t: number, y: Float64Array, dense?: GbsDense): boolean | void => {
    if (nr === 1 || !dense) return;
    const zEnd = y[2]!;
    const vzEnd = y[5]!;
    let lowT = tOld;
    let lowZ = prevZ;
    if (prevVz > 0 && vzEnd <= 0) {
      const ta = brentRoot((tt) => dense(5, tt), tOld, t, prevVz, vzEnd, ROOT_TOL_S);
      const za = dense(2, ta);
      if (za > apexM) {
        apexM = za;
        apexXM = dense(0, ta);
        apexTimeS = ta;
      }
      if (za > 0) {
        lowT = ta;
        lowZ = za;
      }
    }
    let tEnd = t;
    let xEnd = y[0]!;
    let yEnd = y[1]!;
    if (zEnd <= 0 && lowZ > 0) {
      tLand = brentRoot((tt) => dense(2, tt), lowT, t, lowZ, zEnd, ROOT_TOL_S);
      landed = true;
      tEnd = tLand;
      landState[0] = dense(0, tLand);
      landState[1] = dense(1, tLand);
      landState[2] = 0;
      landState[5] = dense(5, tLand);
      // Horizontal velocity from the dense position polynomials (odex is asked for x, y, z, vz only,
      // which keeps its per-step interpolation work down); central difference inside the step.
      const dt = Math.min(1e-4, 0.25 * (tLand - tOld));
      landState[3] = (dense(0, tLand + dt) - dense(0, tLand - dt)) / (2 * dt);
      landState[4] = (dense(1, tLand + dt) - dense(1, tLand - dt)) / (2 * dt);
      xEnd = landState[0]!;
      yEnd = landState[1]!;
    }
    for (let i = 0; i < planes.length; i++) {
      if (crossed[i] !== null) continue;
      const p = planes[i]!;
      const gEnd = p.nx * xEnd + p.ny * yEnd - p.d;
      if (prevG[i]! < 0 && gEnd >= 0) {
        const g = (tt: number): number => p.nx * dense(0, tt) + p.ny * dense(1, tt) - p.d;
        const tc = brentRoot(g, tOld, tEnd, prevG[i]!, gEnd, ROOT_TOL_S);
        crossed[i] = { plane: i, x: dense(0, tc), t: tc, y: dense(1, tc), z: dense(2, tc) };
      }
      prevG[i] = gEnd;
    }
    if (wantPath) {
      for (let ts = sampleIndex * PATH_SAMPLE_INTERVAL_S; ts <= tEnd; ts = ++sampleIndex * PATH_SAMPLE_INTERVAL_S) {
        path.push({ t: ts, x: dense(0, ts), y: dense(1, ts), z: dense(2, ts) });
      }
    }
    prevT = t;
    for (let i = 0; i < 6; i++) prevState[i] = y[i]!;
    prevZ = zEnd;
    prevVz = vzEnd;
    if (landed) return false;
    if (stopAfterPlanes && crossed.every((c) => c !== null)) return false;
  };

  const given = options.settings ?? DEFAULT_SOLVER_SETTINGS;
  const settings = model.windLogScale > 0 && given.windProfile ? given.windProfile : given;
  const solver = solverFor(settings);
  const outcome = solver.solve(derivative, model, 0, s0, FLIGHT_TIME_CAP_S, observer);
  const evaluations = solver.rhsCalls;
  let state: ArrayLike<number>;
  let flightTimeS: number;
  if (landed) {
    state = landState;
    flightTimeS = tLand;
    if (wantPath && path[path.length - 1]!.t < tLand) path.push({ t: tLand, x: landState[0]!, y: landState[1]!, z: 0 });
  } else {
    // Still airborne at the cap (or the solver gave up): report where the ball was, flagged as not landed.
    state = outcome === GBS_CONVERGED ? solver.state.slice() : prevState;
    flightTimeS = outcome === GBS_CONVERGED ? FLIGHT_TIME_CAP_S : prevT;
  }
  integratorWork.flights++;
  integratorWork.rhsEvaluations += evaluations;
  const generalCrossings = crossed.filter((c): c is GeneralCrossing => c !== null);
  return {
    carryM: Math.hypot(state[0]!, state[1]!),
    landing: { x: state[0]!, y: state[1]! },
    flightTimeS,
    apexM,
    apexXM,
    apexTimeS,
    landingSpeedMs: Math.hypot(state[3]!, state[4]!, state[5]!),
    crossings: generalCrossings.map((c) => ({ x: c.x, t: c.t, y: c.y, z: c.z })),
    generalCrossings,
    path,
    landed,
    rhsEvaluations: evaluations,
  };
}
