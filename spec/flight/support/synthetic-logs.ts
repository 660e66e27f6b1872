/**
 * Synthetic Pitchside logs for the profile-fit specs: kicks drawn from a known launch distribution,
 * flown through the model, and logged the way a coach would (outcome only, no carry), following the
 * outcome convention of shared/flight/profile-observations.ts.
 */

import { simulateKick, type KickOutcome, type LoggedKick } from '../../../shared/flight';
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
