import { modelFromKick, derivative } from '../../shared/flight/model';
import { Solver } from '../../shared/flight/odex-solver';
const m = modelFromKick({ speed: 25, elevationDeg: 30, backspinRps: 6, sidespinRps: 4, wind: { speedMs: 4, fromDeg: 30 } });
const out = [0,0,0,0,0,0]; const st = [1,2,3,20,1,10];
for (let rep = 0; rep < 3; rep++) {
  const N = 2e6; const t0 = performance.now();
  for (let i = 0; i < N; i++) { st[3] = 20 + (i & 15); derivative(m, i * 1e-6, st, out); }
  console.log('ns/deriv', ((performance.now() - t0) * 1e6 / N).toFixed(1));
}
const s = new Solver(6); s.denseOutput = true; s.relativeTolerance = 1e-6; s.absoluteTolerance = 1e-6; s.initialStepSize = 0.1; s.maxExtrapolationColumns = 6;
const f = (t: number, y: number[]) => { derivative(m, t, y, out); return out; };
for (let rep = 0; rep < 3; rep++) {
  const N = 5000; const t0 = performance.now(); let ev = 0;
  for (let i = 0; i < N; i++) { const r = s.solve(f, 0, m.initialState.slice(), 3, (n, a, b, y) => { if (n > 1 && y[2]! < 0) return false; }); ev += r.nEval; }
  console.log('us/solve', ((performance.now() - t0) * 1000 / N).toFixed(2), 'nEval', ev / N);
}
