import { modelFromKick, derivative } from '../../shared/flight/model';
import { Solver } from '../../shared/flight/odex-solver';
const m = modelFromKick({ speed: 25, elevationDeg: 30, backspinRps: 6, sidespinRps: 4, wind: { speedMs: 4, fromDeg: 30 } });
const out = [0,0,0,0,0,0];
for (const h0 of [0.1, 0.5, 1, 2]) for (const tol of [1e-5, 1e-6]) {
const s = new Solver(6); s.denseOutput = true; s.denseComponents=[0,1,2,5]; s.relativeTolerance = tol; s.absoluteTolerance = tol; s.initialStepSize = h0; s.maxExtrapolationColumns = 6;
let ev = 0;
const f = (t: number, y: number[]) => { ev++; derivative(m, t, y, out); return out; };
const steps: string[] = [];
const r = s.solve(f, 0, m.initialState.slice(), 30, (n, a, b, y) => { steps.push(`${b.toFixed(3)}`); if (n > 1 && y[2]! < 0) return false; });
console.log(h0, tol, 'evals', ev, 'nEval', r.nEval, 'acc', r.nAccept, 'rej', r.nReject, 'steps', steps.join(' '));
}
