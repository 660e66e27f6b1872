/**
 * Warnings a profile carries: stable codes decided here from the fit, and the plain words the Player
 * file, Squad week and the planner show for them. The thresholds are common practice (no published
 * rule for when a coach should stop trusting a kicking profile); each is named and kept in one place.
 */

import type { PreparedKick } from './profile-observations';
import { PROFILE_WARNINGS, type KickProfile, type ProfileWarning } from './profile-types';

/** Fewer repetitions than this used by the fit: `few_repetitions` (common practice: two drill blocks of five). */
export const FEW_REPETITIONS = 10;
/** Share of the speed evidence that must ask for more than the cap before `speed_beyond_cap` (with at least two repetitions). */
export const BEYOND_CAP_SHARE = 0.1;
/** Share of the mean offset's precision that comes from the prior above which the profile is `prior_dominated`. */
export const PRIOR_SHARE_LIMIT = 0.5;
/** A repetition whose evidence has probability below this under the fit is surprising. */
export const SURPRISE_PROBABILITY = 0.01;
/** Share of surprising repetitions (with at least two) that makes the logs `contradictory_logs`. */
export const SURPRISE_SHARE = 0.1;
/** Reliable reach this far beyond the longest distance drilled, m, is `reach_beyond_drilled`. */
export const REACH_MARGIN_M = 1;

/** Plain words for each warning, as a coach reads them. */
export const PROFILE_WARNING_TEXT: Readonly<Record<ProfileWarning, string>> = {
  speed_beyond_cap:
    'Some logs need a faster kick than anyone is measured to strike. The launch angle or spin assumed for them is probably wrong; the figures stop at the limit.',
  few_repetitions: 'Few repetitions so far: treat these figures as a first guess.',
  reach_beyond_drilled:
    'Reliable reach lies beyond the longest distance this player has drilled: it is extrapolated, not seen. Drill farther to confirm it.',
  prior_dominated: 'The logs say little about kick speed yet, so the figures lean on a typical player of this squad.',
  contradictory_logs:
    'Some logs contradict each other or the rest (for example a paced carry that does not match the outcome). Check them.',
};

/** Whether a logged carry disagrees with the logged outcome (outcome convention of profile-observations.ts). */
export function carryContradictsOutcome(k: PreparedKick): boolean {
  if (k.carryM === null) return false;
  const d = k.targetDistanceM;
  const r = k.targetRadiusM;
  const slack = 0.5;
  switch (k.outcome) {
    case 'on_target':
      return Math.abs(k.carryM - d) > r + slack;
    case 'short':
      return k.carryM > d + slack;
    case 'long':
    case 'over':
      return k.carryM < d - slack;
    default:
      return false;
  }
}

/** What the warnings are decided from. */
export interface WarningInputs {
  repetitions: number;
  prepared: readonly PreparedKick[];
  /** ln-speed lower bounds of the speed evidence (at each repetition's assumed launch). */
  evidenceLo: readonly number[];
  evidenceProbability: readonly number[];
  capMs: number;
  /** Share of the mean offset's precision that comes from the prior (1 with no speed evidence). */
  priorShare: number;
}

/** The warnings of a fit, in PROFILE_WARNINGS order. */
export function fitWarnings(w: WarningInputs): ProfileWarning[] {
  const found = new Set<ProfileWarning>();
  const n = w.evidenceLo.length;
  const beyond = w.evidenceLo.filter((lo) => lo > Math.log(w.capMs)).length;
  if (beyond >= 2 && beyond >= BEYOND_CAP_SHARE * n) found.add('speed_beyond_cap');
  if (w.repetitions < FEW_REPETITIONS) found.add('few_repetitions');
  if (w.priorShare > PRIOR_SHARE_LIMIT) found.add('prior_dominated');
  const surprising = w.evidenceProbability.filter((p) => p < SURPRISE_PROBABILITY).length;
  if (w.prepared.some(carryContradictsOutcome) || (surprising >= 2 && surprising >= SURPRISE_SHARE * n)) found.add('contradictory_logs');
  return PROFILE_WARNINGS.filter((c) => found.has(c));
}

/**
 * The profile's warnings with `reach_beyond_drilled` decided for a reliable reach: beyond the longest
 * target drilled (plus REACH_MARGIN_M) the reach follows the model and the prior, not the logs.
 */
export function reachWarnings(profile: Pick<KickProfile, 'warnings' | 'longestTargetM'>, reliableReachM: number | null): ProfileWarning[] {
  const found = new Set<ProfileWarning>((profile.warnings ?? []).filter((c) => c !== 'reach_beyond_drilled'));
  const longest = profile.longestTargetM ?? 0;
  if (reliableReachM !== null && reliableReachM > longest + REACH_MARGIN_M) found.add('reach_beyond_drilled');
  return PROFILE_WARNINGS.filter((c) => found.has(c));
}
