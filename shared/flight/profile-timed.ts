/**
 * Stopwatch evidence for the profile fit: a repetition timed on Pitchside, with a carry, solved for its
 * launch speed and backspin (speed-spin.ts) with the club's timing calibration.
 */

import type { PreparedKick } from './profile-observations';
import type { FitOptions } from './profile-types';
import { timedCarryOf, timedKickEvidence } from './speed-spin';

/** Default stopwatch calibration when the caller gives none (the club defaults; common practice). */
const DEFAULT_TIMING = { biasS: 0.2, sdS: 0.08 };
const DEFAULT_MAX_TIMED = 60;
/** Timing samples per timed repetition inside a fit (the Player file's own estimate samples more). */
const FIT_TIMING_SAMPLES = 16;

/**
 * Speed and backspin of each timed repetition that has a carry (logged, or the target distance ± half the
 * radius for an on-target call), from its stopwatch reading and the club's calibration; null elsewhere and
 * where the reading cannot be explained. Such a repetition enters the fit as a point with its own spread:
 * stronger evidence than an outcome call, whose speed interval also leans on a spin guessed by eye.
 */
export function timedEvidence(prepared: readonly PreparedKick[], options: FitOptions): (TimedSpeed | null)[] {
  const timing = options.timing ?? DEFAULT_TIMING;
  let left = options.maxTimed ?? DEFAULT_MAX_TIMED;
  return prepared.map((k) => {
    if (k.hangTimeS === null || left <= 0) return null;
    const carry = timedCarryOf(k);
    if (carry === null) return null;
    left--;
    const evidence = timedKickEvidence({
      ...carry,
      hangTimeS: k.hangTimeS,
      elevationDeg: k.elevationDeg,
      sidespinRps: k.sidespinRps,
      conditions: k.conditions,
      timing,
      samples: FIT_TIMING_SAMPLES,
      seed: 1 + k.index,
    });
    return evidence.ok && evidence.speedSdMs > 0
      ? { speedMs: evidence.speedMs, speedSdMs: evidence.speedSdMs, backspinRps: evidence.backspinRps }
      : null;
  });
}

/** What a solved timed repetition contributes. */
export interface TimedSpeed {
  speedMs: number;
  speedSdMs: number;
  backspinRps: number;
}
