/**
 * The player's own spin, read through a coach's eye. A spin step logged by eye is the real rate plus a
 * judging error (classical measurement error: the coach sees the real spin and calls the nearest step,
 * sometimes the next one), so the logged steps vary *more* than the player's spin does. Taking their
 * spread as the player's would count the coach's error as the player's inconsistency, and reading each
 * repetition at its logged step would turn that error into spurious speed and aim scatter.
 *
 * Per spin axis: the player's spread is the logged rates' variance less the mean logging variance
 * (method of moments for additive measurement error, e.g. Fuller 1987, *Measurement Error Models*,
 * Wiley, §1.1), shrunk toward a prior spread worth a few repetitions; each repetition's best guess of
 * its real rate is its logged rate pulled toward the mean by the reliability ratio κ = s² / (s² + e²),
 * with the remaining uncertainty κ e² (the normal–normal posterior).
 */

import { backspinLogSdRps, sidespinLogSdRps } from './profile-priors';
import type { PreparedKick } from './profile-observations';

/**
 * Prior spread of a player's real spin between repetitions of one strike, rev/s, worth
 * `SPIN_PRIOR_WEIGHT_REPS` repetitions (common practice: well under a step of the spin scale, which is
 * 3–4 rev/s; an eye cannot tell the difference, so a record that says nothing about it must not be read
 * as a player whose spin wanders). With a linear lift law even ±0.4 rev/s of backspin moves a driven
 * ball's carry by metres, so this prior is what a perfect record is up against.
 */
export const SPIN_SD_PRIOR_RPS = 0.5;
export const SPIN_PRIOR_WEIGHT_REPS = 3;
/** The player's spread is never taken below this, rev/s (common practice: no two strikes carry exactly the same spin). */
export const SPIN_SD_FLOOR_RPS = 0.1;

/** The player's spin on one axis and each repetition's best guess of its real rate. */
export interface SpinAxis {
  /** Mean rate, rev/s (the logged rates' mean: the eye's error averages out). */
  mean: number;
  /** The player's own spread between repetitions, rev/s (logging error removed). */
  sd: number;
  /** Per repetition: best guess of the real rate, rev/s. */
  best: number[];
  /** Per repetition: standard deviation of the real rate about `best`, rev/s. */
  postSd: number[];
}

/** One axis from logged rates and each one's logging error (0 when measured). */
export function spinAxis(rates: readonly number[], errorSd: readonly number[]): SpinAxis {
  const n = rates.length;
  if (n === 0) return { mean: 0, sd: SPIN_SD_PRIOR_RPS, best: [], postSd: [] };
  const mean = rates.reduce((a, b) => a + b, 0) / n;
  const observedVar = n > 1 ? rates.reduce((a, v) => a + (v - mean) ** 2, 0) / (n - 1) : 0;
  const errorVar = errorSd.reduce((a, e) => a + e * e, 0) / n;
  const excess = Math.max(0, observedVar - errorVar);
  const pooled = (SPIN_PRIOR_WEIGHT_REPS * SPIN_SD_PRIOR_RPS ** 2 + (n - 1) * excess) / (SPIN_PRIOR_WEIGHT_REPS + n - 1);
  const sd = Math.max(SPIN_SD_FLOOR_RPS, Math.sqrt(pooled));
  const best: number[] = [];
  const postSd: number[] = [];
  rates.forEach((v, i) => {
    const e2 = errorSd[i]! ** 2;
    const kappa = (sd * sd) / (sd * sd + e2);
    best.push(mean + kappa * (v - mean));
    postSd.push(Math.sqrt(kappa * e2));
  });
  return { mean, sd, best, postSd };
}

/**
 * Both spin axes of a player's repetitions. Eye-logged steps carry their step's uncertainty. A device
 * or a stopwatch gives a rate, not an axis: it pins the backspin only when no sidespin was logged (the
 * rate is then the backspin's), and the sidespin — split off the measured rate by the logged direction
 * when one was logged — keeps the eye's uncertainty.
 */
export function playerSpin(prepared: readonly PreparedKick[]): { back: SpinAxis; side: SpinAxis } {
  return {
    back: spinAxis(
      prepared.map((k) => k.backspinRps),
      prepared.map((k) => (k.spinMeasured && k.sidespinStep === 0 ? 0 : backspinLogSdRps(k.backspinStep))),
    ),
    side: spinAxis(
      prepared.map((k) => k.sidespinRps),
      prepared.map((k) => sidespinLogSdRps(k.sidespinStep)),
    ),
  };
}
