/**
 * `npm run bench:flight`: cost of the flight model on this machine, in one run.
 *
 * Prints the median µs per trajectory (no path) over 2,000 varied kicks in wind with its reference
 * height (the logarithmic profile on the hot path), the right-hand-side evaluations per trajectory and
 * the worst carry error against a 1e-12 odex solution (itself checked against a 1 ms RK4); the same for
 * those kicks in uniform wind; the same kicks through an allocation-free fixed-step RK4 with cubic
 * Hermite ground contact at the largest step that keeps every carry within 1 mm, its µs and evaluations,
 * and the ratio; ms (wall and CPU) and evaluations for one 2,000-sample envelope, without and with its
 * reach curve (what the Player file waits for); peak memory; the load average and commit. Targets
 * (issue 14): ≤ 25 µs per trajectory, ≤ 3× the RK4 baseline, ≤ 1 mm, envelope with its curve ≤ 100 ms.
 * Timings on a shared machine are noisy: the evaluation counts are the load-independent figures.
 */

import { execSync } from 'node:child_process';
import { loadavg } from 'node:os';

import { DEFAULT_SOLVER_SETTINGS, integratorWork, TIGHT_SOLVER_SETTINGS } from '../../shared/flight/integrate';
import { modelFromKick } from '../../shared/flight/model';
import { SeededRandom } from '../../shared/flight/random';
import { reachEnvelope, simulateKick, type KickInput, type KickProfile } from '../../shared/flight';
import { Rk4Baseline } from './rk4-baseline';

const KICKS = 2000;
const ROUNDS = 9;
const CARRY_TOLERANCE_M = 1e-3;
const TARGET_US = 25;
const TARGET_RK4_RATIO = 3;
const TARGET_ENVELOPE_MS = 100;
const loadAtStart = loadavg();

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
      // Half weather-service winds (10 m), half coach estimates (head height): the log profile is on the hot path.
      wind: { speedMs: u(0, 8), fromDeg: u(0, 360), referenceHeightM: i % 2 ? 10 : 1.8 },
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

// The reference itself, against a fine fixed-step RK4 on the same right-hand side (every 10th kick).
const rk4 = new Rk4Baseline();
let referenceCheckM = 0;
for (let i = 0; i < KICKS; i += 10) referenceCheckM = Math.max(referenceCheckM, Math.abs(rk4.carry(models[i]!, 1e-3) - reference[i]!));

/** Worst carry error against `ref` and mean evaluations per kick at default settings. */
function accuracy(list: readonly KickInput[], ref: readonly number[]): { maxErrM: number; evals: number } {
  let maxErrM = 0;
  let evals = 0;
  list.forEach((k, i) => {
    const f = simulateKick(k);
    maxErrM = Math.max(maxErrM, Math.abs(f.carryM - ref[i]!));
    evals += f.rhsEvaluations;
  });
  return { maxErrM, evals: evals / list.length };
}
const odex = accuracy(kicks, reference);
// The same kicks in uniform wind (no reference height): the cheaper path still-air and uniform-wind kicks take.
const uniformKicks = kicks.map((k) => ({ ...k, wind: { speedMs: k.wind!.speedMs, fromDeg: k.wind!.fromDeg } }));
const uniformReference = uniformKicks.map((k) => simulateKick(k, TIGHT_SOLVER_SETTINGS).carryM);
const uniform = accuracy(uniformKicks, uniformReference);

// RK4: the largest step (on a 5 % geometric grid) whose carry error stays ≤ 1 mm for every kick, and for
// the next three smaller steps too, so a lucky cancellation cannot pick the step.
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
const uniformTimes: number[][] = kicks.map(() => []);
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
    sink += simulateKick(uniformKicks[i]!).carryM;
    uniformTimes[i]!.push(performance.now() - t0);
  }
  for (let i = 0; i < KICKS; i++) {
    const t0 = performance.now();
    sink += rk4.carry(modelFromKick(kicks[i]!), rk4StepS);
    rk4Times[i]!.push(performance.now() - t0);
  }
}
const odexUs = median(odexTimes.map(median)) * 1000;
const rk4Us = median(rk4Times.map(median)) * 1000;
const uniformUs = median(uniformTimes.map(median)) * 1000;

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
/** Wall ms, CPU ms and integrator work of one envelope. */
function timedEnvelope(seed: number, withCurve: boolean): { ms: number; cpuMs: number; flights: number; evals: number } {
  const [f0, e0] = [integratorWork.flights, integratorWork.rhsEvaluations];
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  sink += reachEnvelope(profile, conditions, { samples: 2000, seed, target: { distanceM: 40, radiusM: 3 }, withCurve }).carryM.p50;
  const ms = performance.now() - t0;
  const c = process.cpuUsage(c0);
  return { ms, cpuMs: (c.user + c.system) / 1000, flights: integratorWork.flights - f0, evals: integratorWork.rhsEvaluations - e0 };
}
const plain: ReturnType<typeof timedEnvelope>[] = [];
const withCurve: ReturnType<typeof timedEnvelope>[] = [];
for (let r = 0; r < 7; r++) {
  plain.push(timedEnvelope(11 + r, false));
  // What the Player file waits for: the same envelope with its reach curve.
  withCurve.push(timedEnvelope(11 + r, true));
}
const envelopeMs = median(plain.map((e) => e.ms));
const envelopeCurveMs = median(withCurve.map((e) => e.ms));
const envelopeLine = (runs: ReturnType<typeof timedEnvelope>[]): string =>
  `median ${median(runs.map((e) => e.ms)).toFixed(1)} ms (min ${Math.min(...runs.map((e) => e.ms)).toFixed(1)}; CPU ${median(runs.map((e) => e.cpuMs)).toFixed(1)} ms)   ` +
  `${runs[0]!.flights} flights, ${(runs[0]!.evals / 1000).toFixed(1)}k RHS evals`;
const memory = process.memoryUsage();

let commit = 'unknown';
try {
  commit = execSync('git rev-parse --short HEAD', { encoding: 'utf8' }).trim();
  if (execSync('git status --porcelain --untracked-files=no', { encoding: 'utf8' }).trim()) commit += ' (+ uncommitted changes)';
} catch {
  // Not a git checkout: the commit stays unknown.
}
const verdict = (ok: boolean): string => (ok ? 'PASS' : 'FAIL');
const ratio = odexUs / rk4Us;
const load = (l: number[]): string => l.map((x) => x.toFixed(2)).join(' ');
const lines = [
  `flight bench — ${KICKS} varied kicks, median of ${ROUNDS} timed rounds per kick (node ${process.version}, commit ${commit})`,
  `load average at start ${load(loadAtStart)}, at end ${load(loadavg())} (2 cores: timings above ~1 load are inflated; counts are not)`,
  `reference (odex 1e-12) vs RK4 h=1 ms on every 10th kick: max |Δcarry| ${(referenceCheckM * 1000).toFixed(4)} mm`,
  `odex, wind with its height   median ${odexUs.toFixed(1)} µs/trajectory   ${odex.evals.toFixed(1)} RHS evals/trajectory   max |carry − ref| ${(odex.maxErrM * 1000).toFixed(3)} mm`,
  `odex, uniform wind           median ${uniformUs.toFixed(1)} µs/trajectory   ${uniform.evals.toFixed(1)} RHS evals/trajectory   max |carry − ref| ${(uniform.maxErrM * 1000).toFixed(3)} mm`,
  `  settings ${JSON.stringify(DEFAULT_SOLVER_SETTINGS)}`,
  `RK4 fixed step h=${(rk4StepS * 1000).toFixed(2)} ms   median ${rk4Us.toFixed(1)} µs/trajectory   ${(rk4Evals / KICKS).toFixed(1)} RHS evals/trajectory   max |carry − ref| ${(errors[pick]! * 1000).toFixed(3)} mm`,
  `ratio odex / RK4             ${ratio.toFixed(2)}×`,
  `envelope, 2000 samples       ${envelopeLine(plain)}`,
  `envelope + reach curve       ${envelopeLine(withCurve)}`,
  `peak memory                  max RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(1)} MB   heap used now ${(memory.heapUsed / 2 ** 20).toFixed(1)} MB`,
  `${verdict(odexUs <= TARGET_US)}  ≤ ${TARGET_US} µs/trajectory (wind with its height): ${odexUs.toFixed(1)}`,
  `${verdict(ratio <= TARGET_RK4_RATIO)}  ≤ ${TARGET_RK4_RATIO}× the RK4 baseline: ${ratio.toFixed(2)}×`,
  `${verdict(odex.maxErrM <= CARRY_TOLERANCE_M && uniform.maxErrM <= CARRY_TOLERANCE_M)}  worst carry error ≤ 1 mm: ${(odex.maxErrM * 1000).toFixed(3)} / ${(uniform.maxErrM * 1000).toFixed(3)} mm`,
  `${verdict(envelopeCurveMs <= TARGET_ENVELOPE_MS)}  envelope with its reach curve ≤ ${TARGET_ENVELOPE_MS} ms: ${envelopeCurveMs.toFixed(1)} ms (without the curve ${envelopeMs.toFixed(1)} ms)`,
];
console.log(lines.join('\n'));
if (!Number.isFinite(sink)) throw new Error('benchmark produced a non-finite result');
