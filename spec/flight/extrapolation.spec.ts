import { GBS_CONVERGED, GBS_STOPPED, GbsSolver, type GbsSettings } from '../../shared/flight/extrapolation';
import { DEFAULT_SOLVER_SETTINGS, TIGHT_SOLVER_SETTINGS, type SolverSettings } from '../../shared/flight/integrate';
import { derivative, modelFromKick, type FlightModel } from '../../shared/flight/model';
import type { KickInput } from '../../shared/flight/types';
import { Solver, type OdexDense } from './support/odex-reference';

/**
 * Our port of ODEX against the odex 2.0.4 package it derives from: the same algorithm with the same
 * arithmetic in the same order must give the same steps, states, dense output and work, to the bit.
 */

const DENSE = [0, 1, 2, 5];

interface Step {
  xOld: number;
  x: number;
  y: number[];
  /** Dense output of each component at a quarter, half and three quarters of the step. */
  dense: number[];
}

function record(steps: Step[], xOld: number, x: number, y: ArrayLike<number>, dense: OdexDense): false | undefined {
  const values: number[] = [];
  for (const c of DENSE) for (const q of [0.25, 0.5, 0.75]) values.push(dense(c, xOld + q * (x - xOld)));
  steps.push({ xOld, x, y: Array.from(y), dense: values });
  // Stop below ground like the flight integrator does, so both halt on the same observer answer.
  return y[2]! < 0 ? false : undefined;
}

function withOdex(model: FlightModel, s: Readonly<SolverSettings>, xEnd: number): { steps: Step[]; evals: number; outcome: number } {
  const solver = new Solver(6);
  solver.denseOutput = true;
  solver.denseComponents = DENSE;
  solver.relativeTolerance = s.relativeTolerance;
  solver.absoluteTolerance = s.absoluteTolerance;
  solver.initialStepSize = s.initialStepS;
  solver.maxExtrapolationColumns = s.maxExtrapolationColumns;
  solver.maxSteps = 5000;
  solver.interpolationFormulaDegree = s.interpolationDegree;
  solver.stabilityCheckCount = s.stabilityCheckCount;
  solver.maxStepSize = s.maxStepS ?? 0;
  const steps: Step[] = [];
  let evals = 0;
  const out = [0, 0, 0, 0, 0, 0];
  const result = solver.solve(
    (t, y) => {
      evals++;
      derivative(model, t, y, out);
      return out;
    },
    0,
    model.initialState,
    xEnd,
    (nr, xOld, x, y, dense) => (nr === 1 || !dense ? undefined : record(steps, xOld, x, y, dense)),
  );
  return { steps, evals, outcome: result.outcome };
}

function withPort(solver: GbsSolver<FlightModel>, model: FlightModel, xEnd: number): { steps: Step[]; evals: number; outcome: number } {
  const steps: Step[] = [];
  const outcome = solver.solve(derivative, model, 0, model.initialState, xEnd, (nr, xOld, x, y, dense) =>
    nr === 1 || !dense ? undefined : record(steps, xOld, x, y, dense),
  );
  return { steps, evals: solver.rhsCalls, outcome };
}

function portSettings(s: Readonly<SolverSettings>): GbsSettings {
  return {
    n: 6,
    denseComponents: DENSE,
    relativeTolerance: s.relativeTolerance,
    absoluteTolerance: s.absoluteTolerance,
    initialStepSize: s.initialStepS,
    maxStepSize: s.maxStepS ?? 0,
    maxExtrapolationColumns: s.maxExtrapolationColumns,
    maxSteps: 5000,
    interpolationFormulaDegree: s.interpolationDegree,
    stabilityCheckCount: s.stabilityCheckCount,
  };
}

const kicks: KickInput[] = [
  { speed: 26, elevationDeg: 28, backspinRps: 6, sidespinRps: 4, wind: { speedMs: 5, fromDeg: 30 } },
  { speed: 31, elevationDeg: 14, backspinRps: -6, sidespinRps: -8, wind: { speedMs: 7, fromDeg: 200, referenceHeightM: 10 } },
  { speed: 18, elevationDeg: 50, backspinRps: 10, wind: { speedMs: 3, fromDeg: 90, referenceHeightM: 1.8 }, air: { altitudeM: 1500 } },
  { speed: 34, elevationDeg: 6, azimuthDeg: -6, sidespinRps: 8, aero: { lift: 'saturating' } },
  { speed: 13, elevationDeg: 40, backspinRps: 0.5, wind: { speedMs: 8, fromDeg: 0, referenceHeightM: 10 } },
];

const cases: [string, Readonly<SolverSettings>][] = [
  ['uniform-wind defaults', DEFAULT_SOLVER_SETTINGS],
  ['wind-profile defaults', DEFAULT_SOLVER_SETTINGS.windProfile!],
  ['1e-12 reference settings (9 columns, stability checks)', TIGHT_SOLVER_SETTINGS],
];

describe('ODEX port (extrapolation.ts) against odex 2.0.4', () => {
  for (const [name, settings] of cases) {
    it(`takes the same steps with the same states, dense output and evaluations: ${name}`, () => {
      // One solver reused across kicks, as the flight integrator does: no state may leak between solves.
      const solver = new GbsSolver<FlightModel>(portSettings(settings));
      for (const kick of kicks) {
        const model = modelFromKick(kick);
        const ours = withPort(solver, model, 30);
        const theirs = withOdex(model, settings, 30);
        expect(ours.outcome).toBe(GBS_STOPPED);
        expect(ours.outcome).toBe(theirs.outcome);
        expect(ours.steps.length).toBeGreaterThanOrEqual(2);
        expect(ours.steps).toEqual(theirs.steps);
        expect(ours.evals).toBe(theirs.evals);
      }
    });
  }

  it('runs to the end of the interval and reports convergence like odex', () => {
    const solver = new GbsSolver<FlightModel>(portSettings(DEFAULT_SOLVER_SETTINGS));
    // Half a second of a high ball: it is still climbing at the end, so the solve converges at xEnd.
    const model = modelFromKick({ speed: 30, elevationDeg: 60, backspinRps: 4 });
    const ours = withPort(solver, model, 0.5);
    const theirs = withOdex(model, DEFAULT_SOLVER_SETTINGS, 0.5);
    expect(ours.outcome).toBe(GBS_CONVERGED);
    expect(theirs.outcome).toBe(GBS_CONVERGED);
    expect(ours.steps).toEqual(theirs.steps);
    expect(ours.steps[ours.steps.length - 1]!.x).toBe(0.5);
    expect(Array.from(solver.state)).toEqual(ours.steps[ours.steps.length - 1]!.y);
  });

  it('refuses what ODEX refuses', () => {
    const base = portSettings(DEFAULT_SOLVER_SETTINGS);
    expect(() => new GbsSolver({ ...base, maxExtrapolationColumns: 2 })).toThrowError(/maxExtrapolationColumns/);
    expect(() => new GbsSolver({ ...base, interpolationFormulaDegree: 7 })).toThrowError(/interpolationFormulaDegree/);
    expect(() => new GbsSolver({ ...base, denseComponents: [6] })).toThrowError(/dense component/);
  });
});
