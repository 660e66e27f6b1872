/**
 * Local typings for the parts of odex 2.0.4 that the specs use: the flight model runs on our own port
 * (shared/flight/extrapolation.ts), and spec/flight/extrapolation.spec.ts checks it against the
 * package, step by step. odex ships its TypeScript source (src/odex.ts), which fails strict
 * type-checking; importing it through this declaration keeps `tsc --strict` clean while tsx loads the
 * real CommonJS module via odex-reference.js.
 */

/** Right-hand side y' = f(x, y); odex copies the returned values immediately. */
export type OdexDerivative = (x: number, y: number[]) => ArrayLike<number>;

/** Dense interpolator handed to the observer: component index (0-based) and x in [xOld, x]. */
export type OdexDense = (component: number, x: number) => number;

/**
 * Observer called after each accepted step (and once at the start, with `nr === 1` and no dense
 * interpolator). Returning `false` halts the integration.
 */
export type OdexObserver = (nr: number, xOld: number, x: number, y: number[], dense?: OdexDense) => boolean | void;

/** What `Solver.solve` returns: final state, how it ended and its work counters. */
export interface OdexResult {
  y: number[];
  /** 0 = converged to xEnd, 1 = maxSteps exceeded, 2 = the observer stopped it. */
  outcome: number;
  nStep: number;
  xEnd: number;
  nAccept: number;
  nReject: number;
  nEval: number;
}

/** Gragg–Bulirsch–Stoer extrapolation integrator (Hairer & Wanner's ODEX) with dense output. */
export declare class Solver {
  constructor(n: number);
  n: number;
  maxSteps: number;
  initialStepSize: number;
  maxStepSize: number;
  maxExtrapolationColumns: number;
  stepSizeSequence: number;
  stabilityCheckCount: number;
  stabilityCheckTableLines: number;
  denseOutput: boolean;
  denseOutputErrorEstimator: boolean;
  denseComponents: number[] | undefined;
  interpolationFormulaDegree: number;
  relativeTolerance: number | number[];
  absoluteTolerance: number | number[];
  solve(f: OdexDerivative, x: number, y0: number[], xEnd: number, solOut?: OdexObserver): OdexResult;
}
