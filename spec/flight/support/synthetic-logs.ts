/**
 * Synthetic Pitchside logs for the profile-fit specs: kicks drawn from a known launch distribution,
 * flown through the model, and logged the way a coach would (outcome only, no carry), following the
 * outcome convention of shared/flight/profile-observations.ts.
 */

import { simulateKick, solveLaunchSpeed, type KickOutcome, type LoggedKick } from '../../../shared/flight';
import { SeededRandom } from '../../../shared/flight/random';

/** The true distribution behind the synthetic logs. */
export interface SyntheticTruth {
  meanSpeedMs: number;
  sdSpeedMs: number;
  meanAzimuthDeg: number;
  sdAzimuthDeg: number;
}

/** `n` lofted kicks (32°, backspin step 2 = 6 rev/s) at targets cycling through `targetsM`, radius 3 m. */
export function syntheticLofted(
  n: number,
  seed: number,
  truth: SyntheticTruth,
  targetsM: readonly number[],
  blockedEvery = 0,
): LoggedKick[] {
  const rng = new SeededRandom(seed);
  const logs: LoggedKick[] = [];
  for (let i = 0; i < n; i++) {
    const speed = truth.meanSpeedMs + truth.sdSpeedMs * rng.normal();
    const azimuthDeg = truth.meanAzimuthDeg + truth.sdAzimuthDeg * rng.normal();
    const f = simulateKick({ speed, elevationDeg: 32, azimuthDeg, backspinRps: 6 });
    const d = targetsM[i % targetsM.length]!;
    const r = 3;
    let outcome: KickOutcome;
    if (blockedEvery > 0 && i % blockedEvery === blockedEvery - 1) outcome = 'blocked';
    else if (f.carryM < d - r) outcome = 'short';
    else if (f.carryM > d + r) outcome = 'long';
    else if (f.landing.y > r) outcome = 'left';
    else if (f.landing.y < -r) outcome = 'right';
    else outcome = 'on_target';
    logs.push({ technique: 'lofted', outcome, targetDistanceM: d, targetRadiusM: r, backspinStep: 2, sidespinStep: 0 });
  }
  return logs;
}

/** The true aimed-speed model behind `syntheticAimed` (see shared/flight/aimed-speed.ts). */
export interface AimedTruth {
  offsetLogMean: number;
  offsetLogSd: number;
  /** Hard speed ceiling, m/s (Infinity = none). */
  ceilingMs: number;
  meanAzimuthDeg: number;
  sdAzimuthDeg: number;
}

/**
 * `n` lofted kicks (32°, 6 rev/s backspin) by a player who strikes the speed each target needs (still
 * air, ISA sea level), capped at a ceiling, times a log-normal error; targets cycle through `targetsM`,
 * radius 3 m. Outcomes are called by the larger error, as Pitchside asks coaches to.
 */
export function syntheticAimed(n: number, seed: number, truth: AimedTruth, targetsM: readonly number[]): LoggedKick[] {
  const rng = new SeededRandom(seed);
  const needs = new Map<number, number>();
  const logs: LoggedKick[] = [];
  for (let i = 0; i < n; i++) {
    const d = targetsM[i % targetsM.length]!;
    if (!needs.has(d)) needs.set(d, solveLaunchSpeed({ carryM: d, elevationDeg: 32, backspinRps: 6 }) ?? 60);
    const intended = Math.min(needs.get(d)!, truth.ceilingMs);
    const speed = intended * Math.exp(truth.offsetLogMean + truth.offsetLogSd * rng.normal());
    const azimuthDeg = truth.meanAzimuthDeg + truth.sdAzimuthDeg * rng.normal();
    const f = simulateKick({ speed, elevationDeg: 32, azimuthDeg, backspinRps: 6 });
    const r = 3;
    const carryError = f.carryM - d;
    const lateral = f.landing.y;
    let outcome: KickOutcome;
    if (Math.hypot(carryError, lateral) <= r) outcome = 'on_target';
    else if (Math.abs(carryError) >= Math.abs(lateral)) outcome = carryError < 0 ? 'short' : 'long';
    else outcome = lateral > 0 ? 'left' : 'right';
    logs.push({ technique: 'lofted', outcome, targetDistanceM: d, targetRadiusM: r, backspinStep: 2, sidespinStep: 0 });
  }
  return logs;
}
