/**
 * What the profile fit assumes before it has seen a player: priors on speed and aim by ball size (the
 * squad's age group), the physiological cap on launch speed, and the launch spreads a repetition logged
 * without a device is assumed to carry. Each value names its source, or says "common practice" where
 * there is none.
 */

import { BALL_SIZES, SIDESPIN_STEP_RPS, SPIN_STEP_RPS } from './constants';
import { DEFAULT_CEILINGS_MS, DEFAULT_PRIORS, type ProfilePrior } from './profile-types';
import type { BallSpec, Technique } from './types';

/** Ball sizes the squads use: 5 (adults, U15 and up), 4 (about U11–U14), 3 (about U7–U10); common practice. */
export type SquadBallSize = 3 | 4 | 5;

/**
 * Physiological cap on launch speed, m/s, by ball size. Maximal instep kicks of adult players measure
 * 26–35 m/s (Andersen & Dörge 2011, Scand. J. Med. Sci. Sports 21:79); we cap at the top of that range,
 * not above it, because a log that needs more is better explained by a wrong assumed angle, spin or
 * outcome than by a kick no one has been measured to strike. Youth caps: Vieira et al. 2018 (Res. Q.
 * Exerc. Sport 89:210) measured 13.5 ± 2.3 m/s for U11 and 27.4 ± 4.5 m/s for U20; the size-4 cap (26 m/s)
 * sits well above the U13–U15 players who still use that ball, and size 3 (22 m/s) about four standard
 * deviations above U11 (common practice beyond the measured groups).
 */
export const LAUNCH_SPEED_CAP_MS: Readonly<Record<SquadBallSize, number>> = { 5: 35, 4: 26, 3: 22 };

/**
 * Prior speed ceilings by ball size and technique, m/s. Size 5: DEFAULT_CEILINGS_MS (Andersen & Dörge
 * 2011). Sizes 4 and 3: scaled from the youth ball speeds of Vieira et al. 2018 (U11 13.5 m/s rising about
 * 1.5 m/s a year to U20), the upper part of each age band since a ceiling is a maximal kick (common
 * practice for the scaling between techniques, as for adults).
 */
export const CEILINGS_BY_BALL_MS: Readonly<Record<SquadBallSize, Readonly<Record<Technique, number>>>> = {
  5: DEFAULT_CEILINGS_MS,
  4: { driven: 20, lofted: 19, curled: 18, chipped: 15 },
  3: { driven: 15, lofted: 14, curled: 13, chipped: 11 },
};

/** Speed and aim priors by ball size: the size-5 priors with speeds scaled by the ceiling ratio (common practice). */
export const PRIORS_BY_BALL: Readonly<Record<SquadBallSize, Readonly<Record<Technique, ProfilePrior>>>> = {
  5: DEFAULT_PRIORS,
  4: scaledPriors(4),
  3: scaledPriors(3),
};

function scaledPriors(size: 3 | 4): Record<Technique, ProfilePrior> {
  const scale = (t: Technique): ProfilePrior => {
    const f = CEILINGS_BY_BALL_MS[size][t] / DEFAULT_CEILINGS_MS[t];
    const p = DEFAULT_PRIORS[t];
    return { ...p, meanSpeedMs: Math.round(p.meanSpeedMs * f * 10) / 10, sdSpeedMs: Math.round(p.sdSpeedMs * f * 10) / 10 };
  };
  return { driven: scale('driven'), lofted: scale('lofted'), curled: scale('curled'), chipped: scale('chipped') };
}

/**
 * Prior spread of launch elevation between repetitions, degrees, for repetitions logged without a
 * measured angle (common practice: coaches see driven and curled balls leave within a few degrees of
 * each other, lofted and chipped balls less alike). ±4° on a driven ball moves the speed a 30 m carry
 * needs by about 17 %, so the fit must not treat the default angle as exact.
 */
export const ELEVATION_SD_PRIOR_DEG: Readonly<Record<Technique, number>> = { driven: 4, curled: 4, lofted: 5, chipped: 6 };

/**
 * Standard deviation, rev/s, of a spin rate logged by eye as `step` on a scale: the step is taken to be
 * right within one step either way, uniformly (so the spread is the width of [step − 1, step + 1] over
 * 2√3). The end steps mirror their inner gap. Measured or timed spins carry none.
 */
export function eyeLoggedSpinSdRps(scale: Readonly<Record<number, number>>, step: number): number {
  const at = (s: number): number | undefined => scale[s];
  const here = at(step) ?? 0;
  const up = at(step + 1) ?? here + (here - (at(step - 1) ?? here));
  const down = at(step - 1) ?? here - ((at(step + 1) ?? here) - here);
  return Math.abs(up - down) / (2 * Math.sqrt(3));
}

/** The eye-logged backspin spread of a step (SPIN_STEP_RPS). */
export function backspinLogSdRps(step: number): number {
  return eyeLoggedSpinSdRps(SPIN_STEP_RPS, step);
}

/** The eye-logged sidespin spread of a step (SIDESPIN_STEP_RPS). */
export function sidespinLogSdRps(step: number): number {
  return eyeLoggedSpinSdRps(SIDESPIN_STEP_RPS, step);
}

/** The squad ball size a ball specification is closest to (by radius); size 5 when none is given. */
export function ballSizeOf(ball: BallSpec | undefined): SquadBallSize {
  if (!ball || ball.radiusM === undefined) return 5;
  const sizes: SquadBallSize[] = [3, 4, 5];
  let best: SquadBallSize = 5;
  for (const s of sizes) {
    if (Math.abs(BALL_SIZES[s].radiusM - ball.radiusM) < Math.abs(BALL_SIZES[best].radiusM - ball.radiusM)) best = s;
  }
  return best;
}
