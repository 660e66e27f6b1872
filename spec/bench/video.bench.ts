/**
 * `npm run bench:video`: the video measurement's accuracy and cost on this machine, in one run.
 *
 * Accuracy: the grid (speeds 15–32 m/s × elevations 8–45° × backspin −6..10 rev/s, the phone
 * tilted 0/±10°, whole and half flights, 12 taps with uniform ±2 px noise on a 1920 px frame, filmed at
 * 240 fps by spec/flight/support/synthetic-track.ts) — the largest errors per speed and track, and the
 * share of backspins within 1.5 rev/s. Cost: ms per `solveLaunchFromTrack` call for 12 taps (median and
 * 95th percentile over the grid after a warm-up; wall and CPU time, since the machine is shared). Targets: speed 3 %, elevation 1.5°, backspin 1.5 rev/s;
 * fit ≤ 200 ms.
 */

import { solveLaunchFromTrack } from '../../shared/flight/video-track';
import { syntheticTrack, type SyntheticTrackCase } from '../flight/support/synthetic-track';

const SPEEDS_MS = [15, 20, 26, 32];
const ELEVATIONS_DEG = [8, 20, 32, 45];
const BACKSPINS_RPS = [-6, 0, 4, 10];
const TILTS_DEG = [0, 10, -10];

function percentile(values: number[], p: number): number {
  const s = values.slice().sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))]!;
}

const timesMs: number[] = [];
const cpuMs: number[] = [];
const evaluations: number[] = [];
const rows: string[] = [];
let refused = 0;
// Warm-up: the first fits pay for V8's compilation.
for (let i = 0; i < 3; i++) {
  solveLaunchFromTrack(
    syntheticTrack({ speedMs: 24, elevationDeg: 24, backspinRps: 4, tiltDeg: 0, half: false, taps: 12, noisePx: 2, seed: i }).input,
  );
}
for (const half of [false, true]) {
  for (const speedMs of SPEEDS_MS) {
    let speedErr = 0;
    let elevationErr = 0;
    let spinErr = 0;
    let spinWithin = 0;
    let n = 0;
    ELEVATIONS_DEG.forEach((elevationDeg, i) =>
      BACKSPINS_RPS.forEach((backspinRps, j) => {
        const c: SyntheticTrackCase = {
          speedMs,
          elevationDeg,
          backspinRps,
          tiltDeg: TILTS_DEG[(i + j) % TILTS_DEG.length]!,
          half,
          taps: 12,
          noisePx: 2,
          seed: 1000 * speedMs + 10 * elevationDeg + backspinRps + (half ? 7 : 0),
        };
        const { input } = syntheticTrack(c);
        const start = performance.now();
        const cpuStart = process.cpuUsage();
        const fit = solveLaunchFromTrack(input);
        timesMs.push(performance.now() - start);
        const cpu = process.cpuUsage(cpuStart);
        cpuMs.push((cpu.user + cpu.system) / 1000);
        evaluations.push(fit.ok ? fit.evaluations : 0);
        if (!fit.ok) {
          refused++;
          return;
        }
        n++;
        speedErr = Math.max(speedErr, (100 * Math.abs(fit.speedMs - speedMs)) / speedMs);
        elevationErr = Math.max(elevationErr, Math.abs(fit.elevationDeg - elevationDeg));
        const e = Math.abs(fit.backspinRps - backspinRps);
        spinErr = Math.max(spinErr, e);
        if (e <= 1.5) spinWithin++;
      }),
    );
    rows.push(
      `| ${half ? 'half' : 'whole'} | ${speedMs} | ${speedErr.toFixed(2)} | ${elevationErr.toFixed(2)} | ${spinErr.toFixed(2)} | ${spinWithin}/${n} |`,
    );
  }
}

console.log('Video measurement accuracy (12 taps, ±2 px on 1920 px, 16 tracks per row: elevations 8–45° × backspin −6..10 rev/s)');
console.log('| flight | speed m/s | max speed error % | max elevation error ° | max backspin error rev/s | backspin within 1.5 rev/s |');
console.log('|---|---|---|---|---|---|');
for (const row of rows) console.log(row);
console.log(`refused: ${refused}`);
const median = percentile(timesMs, 50);
const p95 = percentile(timesMs, 95);
// The machine is shared: wall time includes waiting for a core, CPU time is the fit's own work.
console.log(
  `CPU time per fit: median ${percentile(cpuMs, 50).toFixed(1)} ms, p95 ${percentile(cpuMs, 95).toFixed(1)} ms; flights simulated per fit: median ${percentile(evaluations, 50)}, max ${Math.max(...evaluations)}`,
);
const cpuP95 = percentile(cpuMs, 95);
console.log(
  `fit time (wall), 12 taps: median ${median.toFixed(1)} ms, p95 ${p95.toFixed(1)} ms, max ${Math.max(...timesMs).toFixed(1)} ms`,
);
// Verdict on the fit's own work (p95 CPU) and the typical wall time; p95 wall is printed for a loaded machine.
console.log(`target ≤ 200 ms per 12-tap fit (p95 CPU and median wall): ${cpuP95 <= 200 && median <= 200 ? 'PASS' : 'FAIL'}`);
