import { simulateKick } from '../../shared/flight/simulate';
import { TIGHT_SOLVER_SETTINGS, type SolverSettings } from '../../shared/flight/integrate';
import type { KickInput } from '../../shared/flight/types';
let seed = 12345; const rnd = () => { seed = (seed * 1664525 + 1013904223) >>> 0; return seed / 2 ** 32; };
const kicks: KickInput[] = [];
for (let i = 0; i < 400; i++) kicks.push({ speed: 12 + 24 * rnd(), elevationDeg: 4 + 50 * rnd(), azimuthDeg: -10 + 20 * rnd(),
  backspinRps: -10 + 20 * rnd(), sidespinRps: -8 + 16 * rnd(), wind: { speedMs: 8 * rnd(), fromDeg: 360 * rnd() }, air: { altitudeM: 2000 * rnd() } });
const ref = kicks.map(k => simulateKick(k, TIGHT_SOLVER_SETTINGS).carryM);
function run(s: SolverSettings) {
  let maxErr = 0, evals = 0;
  for (let i = 0; i < kicks.length; i++) { const f = simulateKick(kicks[i]!, s); maxErr = Math.max(maxErr, Math.abs(f.carryM - ref[i]!)); evals += f.rhsEvaluations; }
  const reps = 5; const t0 = performance.now();
  for (let r = 0; r < reps; r++) for (const k of kicks) simulateKick(k, s);
  const us = (performance.now() - t0) * 1000 / (reps * kicks.length);
  console.log(JSON.stringify(s), 'maxErr mm', (maxErr * 1000).toFixed(4), 'evals', (evals / kicks.length).toFixed(0), 'us', us.toFixed(1));
}
const base: SolverSettings = { relativeTolerance: 1e-7, absoluteTolerance: 1e-7, initialStepS: 0.1, maxExtrapolationColumns: 6 };
for (let w = 0; w < 2; w++) run(base);
for (const tol of [1e-4, 1e-5, 1e-6, 1e-7, 1e-8]) run({ ...base, relativeTolerance: tol, absoluteTolerance: tol });
for (const h of [0.01, 0.05, 0.2, 0.5]) run({ ...base, relativeTolerance: 1e-6, absoluteTolerance: 1e-6, initialStepS: h });
for (const km of [4, 5, 7, 9]) run({ ...base, relativeTolerance: 1e-6, absoluteTolerance: 1e-6, maxExtrapolationColumns: km });
for (const d of [5, 6]) run({ ...base, relativeTolerance: 1e-6, absoluteTolerance: 1e-6, interpolationDegree: d });
run({ ...base, relativeTolerance: 1e-6, absoluteTolerance: 1e-6, denseErrorEstimator: false });
run({ ...base, relativeTolerance: 1e-6, absoluteTolerance: 1e-6, stepSizeSequence: 5 });
