import { modelFromKick, derivative } from '../../shared/flight/model';
import { integrateFlight } from '../../shared/flight/integrate';
import { Solver } from '../../shared/flight/odex-solver';
const k = { speed: 25, elevationDeg: 30, backspinRps: 6, sidespinRps: 4, wind: { speedMs: 4, fromDeg: 30 } };
const m = modelFromKick(k);
const N = 20000;
function time(name: string, fn: () => void) { for (let r = 0; r < 3; r++) { const t0 = performance.now(); for (let i = 0; i < N; i++) fn(); if (r === 2) console.log(name, ((performance.now() - t0) * 1000 / N).toFixed(2), 'us'); } }
time('model', () => modelFromKick(k));
time('integrate', () => integrateFlight(m));
const out = [0,0,0,0,0,0];
const s = new Solver(6); s.denseOutput = true; s.denseComponents=[0,1,2,5]; s.relativeTolerance = 1e-6; s.absoluteTolerance = 1e-6; s.initialStepSize = 0.1; s.maxExtrapolationColumns = 6;
const f = (t: number, y: number[]) => { derivative(m, t, y, out); return out; };
time('raw solve', () => s.solve(f, 0, m.initialState.slice(), 30, (n, a, b, y) => { if (n > 1 && y[2]! < 0) return false; }));
const f0 = (t: number, y: number[]) => { out[0]=y[3]!; out[1]=y[4]!; out[2]=y[5]!; out[3]=-0.01*y[3]!; out[4]=0; out[5]=-9.8-0.01*y[5]!; return out; };
time('raw solve trivial rhs', () => s.solve(f0, 0, m.initialState.slice(), 30, (n, a, b, y) => { if (n > 1 && y[2]! < 0) return false; }));
const st = m.initialState.slice();
time('100 derivs', () => { for (let i = 0; i < 100; i++) derivative(m, i * 0.01, st, out); });
