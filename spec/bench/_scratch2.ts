import { Solver } from '../../shared/flight/odex-solver';
const s = new Solver(6); s.denseOutput = true; s.relativeTolerance = 1e-6; s.absoluteTolerance = 1e-6; s.initialStepSize = 0.1; s.maxExtrapolationColumns = 6;
const out = [0,0,0,0,0,0];
const f = (t: number, y: number[]) => { out[0]=y[3]!; out[1]=y[4]!; out[2]=y[5]!; out[3]=-0.01*y[3]!; out[4]=0; out[5]=-9.8-0.01*y[5]!; return out; };
let steps = 0;
for (let rep = 0; rep < 3; rep++) {
  const N = 20000; const t0 = performance.now(); let ev = 0;
  for (let i = 0; i < N; i++) { steps = 0; const r = s.solve(f, 0, [0,0,0,20,0,15], 3, (n) => { steps++; }); ev += r.nEval; }
  console.log('us/solve', ((performance.now() - t0) * 1000 / N).toFixed(2), 'nEval', ev / N, 'steps', steps);
}
