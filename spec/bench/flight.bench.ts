/**
 * `npm run bench:flight`: cost of the flight model on this machine, in one run.
 *
 * Prints the median µs per trajectory (no path) over 2,000 varied kicks and the right-hand-side
 * evaluations per trajectory; the same kicks through an allocation-free fixed-step RK4 with cubic
 * Hermite ground contact at the largest step that keeps every carry within 1 mm (found here, against a
 * 1e-12 odex solution), its µs and evaluations, and the ratio; ms for one 2,000-sample envelope, without
 * and with its reach curve (what the Player file waits for); and peak memory. Targets: ≤ 25 µs per
 * trajectory, ≤ 4× the RK4 baseline, envelope with its reach curve ≤ 100 ms.
 */

import { DEFAULT_SOLVER_SETTINGS, TIGHT_SOLVER_SETTINGS } from '../../shared/flight/integrate';
import { modelFromKick } from '../../shared/flight/model';
import { SeededRandom } from '../../shared/flight/random';
import { reachEnvelope, simulateKick, type KickInput, type KickProfile } from '../../shared/flight';
import { Rk4Baseline } from './rk4-baseline';

const KICKS = 2000;
const ROUNDS = 9;
const CARRY_TOLERANCE_M = 1e-3;

function variedKicks(n: number, seed: number): KickInput[] {
  const rng = new SeededRandom(seed);
  const u = (lo: number, hi: number): number => lo + (hi - lo) * rng.uniform();
  const sizes = [
    { massKg: 0.43, radiusM: 0.69 / (2 * Math.PI) },
    { massKg: 0.37, radiusM: 0.6475 / (2 * Math.PI) },
    { massKg: 0.31, radiusM: 0.5975 / (2 * Math.PI) },
  ];
  const kicks: KickInput[] = [];
  for (let i = 0; i < n; i++) {
    kicks.push({
      speed: u(12, 36),
      elevationDeg: u(4, 54),
      azimuthDeg: u(-10, 10),
      backspinRps: u(-10, 10),
      sidespinRps: u(-8, 8),
      ball: sizes[i % 3]!,
      air: { altitudeM: u(0, 2000), temperatureC: u(0, 30), relativeHumidityPct: u(0, 90) },
      wind: { speedMs: u(0, 8), fromDeg: u(0, 360) },
    });
  }
  return kicks;
}

function median(values: number[]): number {
  const s = values.slice().sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : 0.5 * (s[m - 1]! + s[m]!);
}

const kicks = variedKicks(KICKS, 20260);
const models = kicks.map(modelFromKick);
const reference = kicks.map((k) => simulateKick(k, TIGHT_SOLVER_SETTINGS).carryM);

// odex at default settings: accuracy and work.
let odexMaxErrM = 0;
let odexEvals = 0;
kicks.forEach((k, i) => {
  const f = simulateKick(k);
  odexMaxErrM = Math.max(odexMaxErrM, Math.abs(f.carryM - reference[i]!));
  odexEvals += f.rhsEvaluations;
});

// RK4: the largest step (on a 5 % geometric grid) whose carry error stays ≤ 1 mm for every kick, and for
// the next three smaller steps too, so a lucky cancellation cannot pick the step.
const rk4 = new Rk4Baseline();
const rk4MaxErr = (h: number): number => models.reduce((m, model, i) => Math.max(m, Math.abs(rk4.carry(model, h) - reference[i]!)), 0);
const grid = Array.from({ length: 80 }, (_, k) => 0.25 * Math.pow(0.95, k));
const errors = grid.map(rk4MaxErr);
const pick = grid.findIndex((_, k) => k + 3 < grid.length && [0, 1, 2, 3].every((j) => errors[k + j]! <= CARRY_TOLERANCE_M));
if (pick < 0) throw new Error('no RK4 step on the grid keeps 1 mm');
const rk4StepS = grid[pick]!;
let rk4Evals = 0;
for (const model of models) {
  rk4.carry(model, rk4StepS);
  rk4Evals += rk4.evaluations;
}

// Timing: every kick timed individually, rounds interleaved between the two integrators.
const odexTimes: number[][] = kicks.map(() => []);
const rk4Times: number[][] = kicks.map(() => []);
let sink = 0;
for (let r = 0; r < ROUNDS; r++) {
  for (let i = 0; i < KICKS; i++) {
    const t0 = performance.now();
    sink += simulateKick(kicks[i]!).carryM;
    odexTimes[i]!.push(performance.now() - t0);
  }
  for (let i = 0; i < KICKS; i++) {
    const t0 = performance.now();
    sink += rk4.carry(modelFromKick(kicks[i]!), rk4StepS);
    rk4Times[i]!.push(performance.now() - t0);
  }
}
const odexUs = median(odexTimes.map(median)) * 1000;
const rk4Us = median(rk4Times.map(median)) * 1000;

// One envelope of 2,000 samples for a typical lofted-pass profile.
const profile: KickProfile = {
  technique: 'lofted',
  repetitions: 40,
  ignoredRepetitions: 0,
  meanSpeedMs: 24,
  sdSpeedMs: 2,
  meanSpeedSeMs: 0.3,
  sdSpeedSeMs: 0.25,
  aimedSpeed: {
    offsetLogMean: 0,
    offsetLogSd: 0.08,
    offsetLogMeanSe: 0.012,
    offsetLogSdSe: 0.01,
    ceilingMs: 29,
    ceilingLogSe: 0.1,
    typicalTargetM: 40,
  },
  meanAzimuthDeg: 0.5,
  sdAzimuthDeg: 2,
  meanAzimuthSeDeg: 0.4,
  elevationDeg: 32,
  sdElevationDeg: 2,
  elevationSdSource: 'prior',
  backspinRps: 6,
  sidespinRps: 0,
  sdBackspinRps: 1.5,
  sdSidespinRps: 1,
  launchNoiseScale: 0.5,
  speedCapMs: 35,
  longestTargetM: 45,
  warnings: [],
  observations: { speedPoints: 0, speedIntervals: 30, speedBounds: 10, aimPoints: 0, aimIntervals: 30, aimBounds: 4 },
  prior: { meanSpeedMs: 23, sdSpeedMs: 2.5, meanAzimuthDeg: 0, sdAzimuthDeg: 3, weightReps: 3 },
};
const conditions = { air: { temperatureC: 12, altitudeM: 150 }, wind: { speedMs: 3, fromDeg: 20 } };
const envelopeMs: number[] = [];
const envelopeCurveMs: number[] = [];
for (let r = 0; r < 7; r++) {
  const t0 = performance.now();
  sink += reachEnvelope(profile, conditions, { samples: 2000, seed: 11 + r, target: { distanceM: 40, radiusM: 3 }, withCurve: false })
    .carryM.p50;
  envelopeMs.push(performance.now() - t0);
  // What the Player file waits for: the same envelope with its reach curve (the curve reuses the samples).
  const t1 = performance.now();
  sink += reachEnvelope(profile, conditions, { samples: 2000, seed: 11 + r, target: { distanceM: 40, radiusM: 3 } }).carryM.p50;
  envelopeCurveMs.push(performance.now() - t1);
}
const memory = process.memoryUsage();

const lines = [
  `flight bench — ${KICKS} varied kicks, median of ${ROUNDS} timed rounds per kick (node ${process.version})`,
  `odex (GBS, dense output)   median ${odexUs.toFixed(1)} µs/trajectory   ${(odexEvals / KICKS).toFixed(1)} RHS evals/trajectory   max |carry − 1e-12 ref| ${(odexMaxErrM * 1000).toFixed(3)} mm`,
  `  settings ${JSON.stringify(DEFAULT_SOLVER_SETTINGS)}`,
  `RK4 fixed step h=${(rk4StepS * 1000).toFixed(2)} ms   median ${rk4Us.toFixed(1)} µs/trajectory   ${(rk4Evals / KICKS).toFixed(1)} RHS evals/trajectory   max |carry − ref| ${(errors[pick]! * 1000).toFixed(3)} mm`,
  `ratio odex / RK4            ${(odexUs / rk4Us).toFixed(2)}×   (target ≤ 4×)`,
  `envelope, 2000 samples      median ${median(envelopeMs).toFixed(1)} ms   (min ${Math.min(...envelopeMs).toFixed(1)} ms)`,
  `envelope + reach curve      median ${median(envelopeCurveMs).toFixed(1)} ms   (min ${Math.min(...envelopeCurveMs).toFixed(1)} ms; target ≤ 100 ms)`,
  `peak memory                 max RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(1)} MB   heap used now ${(memory.heapUsed / 2 ** 20).toFixed(1)} MB`,
  `targets: ≤ 25 µs/trajectory ${odexUs <= 25 ? 'met' : 'NOT met'}; ≤ 4× RK4 ${odexUs / rk4Us <= 4 ? 'met' : 'NOT met'}; envelope with curve ≤ 100 ms ${median(envelopeCurveMs) <= 100 ? 'met' : 'NOT met'}; 1 mm ${odexMaxErrM <= CARRY_TOLERANCE_M ? 'met' : 'NOT met'}`,
];
console.log(lines.join('\n'));
if (!Number.isFinite(sink)) throw new Error('benchmark produced a non-finite result');
