/**
 * Types of the profile fit: what a logged repetition carries, the prior a fit shrinks toward, and the
 * fitted profile. The profile is a plain JSON object because it crosses the worker boundary and is
 * cached on the server.
 */

import type { AimedSpeedFit } from './aimed-speed';
import type { BackspinStep, FlightConditions, KickOutcome, SidespinStep, Technique } from './types';

/** One logged repetition, as stored in `kicks` (optional device fields may be null). */
export interface LoggedKick {
  technique: Technique;
  outcome: KickOutcome;
  targetDistanceM: number;
  targetRadiusM: number;
  backspinStep: BackspinStep;
  sidespinStep: SidespinStep;
  /** Landed carry, m, when someone paced or measured it. */
  carryM?: number | null;
  /** Landed lateral offset from the aim line, m, + = left. */
  lateralM?: number | null;
  measuredSpeedMs?: number | null;
  launchAngleDeg?: number | null;
  /** Measured total spin, rev/s. */
  measuredSpinRps?: number | null;
  /**
   * Where the measured values came from. A device reports the total spin rate; a side-on video sees only
   * the backspin component (signed by the logged backspin step), so sidespin stays as logged.
   */
  measuredSource?: 'device' | 'video' | null;
  /** Pitchside stopwatch reading (foot contact → first bounce), s, uncorrected for the hand's delay. */
  hangTimeS?: number | null;
  /** The session's conditions; `{}` or absent = defaults (still air, ISA sea level, size 5). */
  conditions?: FlightConditions;
}

/** What the fit shrinks toward when there are few repetitions (a squad/technique average). */
export interface ProfilePrior {
  meanSpeedMs: number;
  sdSpeedMs: number;
  meanAzimuthDeg: number;
  sdAzimuthDeg: number;
  /** How many repetitions the prior is worth. */
  weightReps: number;
  /** Prior speed ceiling, m/s (default: the technique's entry in DEFAULT_CEILINGS_MS). */
  ceilingMs?: number;
}

/** How each repetition entered the fit. */
export interface ProfileObservationCounts {
  /** Speeds known exactly (measured speed, or a logged carry through the inverse). */
  speedPoints: number;
  /** Speeds known to lie in an interval (on_target, left, right). */
  speedIntervals: number;
  /** Speeds with a one-sided bound (short, long, over). */
  speedBounds: number;
  aimPoints: number;
  aimIntervals: number;
  aimBounds: number;
  /** Repetitions timed with the stopwatch whose carry and hang time solved for speed and backspin. */
  timed?: number;
}

/** Options of `fitProfile`. */
export interface FitOptions {
  /** The club's stopwatch calibration (default 0.2 s delay, 0.08 s spread: common practice). */
  timing?: { biasS: number; sdS: number };
  /** At most this many timed repetitions (the first ones given) are solved (default 60). */
  maxTimed?: number;
  /**
   * The squad's ball size, which picks the priors and the speed cap (profile-priors.ts). Default: read
   * from the first repetition's ball, else 5.
   */
  ballSize?: 3 | 4 | 5;
}

/**
 * Stable codes of what a coach should know before trusting a profile; screens turn them into plain words
 * (PROFILE_WARNING_TEXT). `speed_beyond_cap`: the logs ask for more launch speed than a kick can reach;
 * `few_repetitions`: too few repetitions to say much; `reach_beyond_drilled`: reliable reach lies beyond the
 * longest distance drilled, so it follows the model and prior rather than evidence; `prior_dominated`: the
 * prior, not the logs, sets the speed figures; `contradictory_logs`: repetitions that cannot all be true.
 */
export type ProfileWarning = 'speed_beyond_cap' | 'few_repetitions' | 'reach_beyond_drilled' | 'prior_dominated' | 'contradictory_logs';

/** Every warning code, in the order screens list them. */
export const PROFILE_WARNINGS: readonly ProfileWarning[] = [
  'contradictory_logs',
  'speed_beyond_cap',
  'few_repetitions',
  'prior_dominated',
  'reach_beyond_drilled',
];

/** Where a profile's elevation spread comes from. */
export type ElevationSpreadSource = 'logged' | 'prior';

/** A player's fitted launch distribution for one technique. JSON-serialisable. */
export interface KickProfile {
  technique: Technique;
  /** Repetitions that informed the fit. */
  repetitions: number;
  /** Repetitions that carried no usable information (e.g. blocked). */
  ignoredRepetitions: number;
  /**
   * Launch speed at the typical target (`aimedSpeed.typicalTargetM`), its spread and standard errors:
   * a description of the player's usual ball, used where no target is given (set pieces). Envelopes
   * for a target use `aimedSpeed`.
   */
  meanSpeedMs: number;
  sdSpeedMs: number;
  /** Standard error of `meanSpeedMs` (from the curvature of the log-posterior). */
  meanSpeedSeMs: number;
  /** Standard error of `sdSpeedMs`. */
  sdSpeedSeMs: number;
  /** How launch speed follows the target distance, with the player's ceiling (see aimed-speed.ts). */
  aimedSpeed: AimedSpeedFit;
  /** Mean launch azimuth relative to the aim, degrees, + = left. */
  meanAzimuthDeg: number;
  sdAzimuthDeg: number;
  meanAzimuthSeDeg: number;
  /** Mean launch elevation the fit assumed (measured angles, else the technique default), degrees. */
  elevationDeg: number;
  /**
   * Spread of launch elevation between kicks, degrees: what sampling, envelopes, reach curves and set
   * pieces draw around `elevationDeg`. From the logged angles when at least three were measured
   * (`elevationSdSource` 'logged'), else the technique's prior spread (ELEVATION_SD_PRIOR_DEG, common
   * practice) scaled by `launchNoiseScale`. The speed spread is conditional on it (the fit integrates
   * every repetition over the launch it may have had), so the two add rather than double count.
   */
  sdElevationDeg: number;
  elevationSdSource: ElevationSpreadSource;
  backspinRps: number;
  sidespinRps: number;
  /**
   * Spread of backspin between kicks, rev/s, as drawn: the player's own, estimated as the logged rates'
   * spread less the eye's logging error (a step counts as ±1 step; a measured rate pins the backspin when
   * no sidespin was logged), shrunk toward half a rev/s (profile-spin.ts). Likewise `sdSidespinRps`.
   */
  sdBackspinRps: number;
  sdSidespinRps: number;
  /**
   * Share of the assumed elevation spread (the technique's prior) the logs support,
   * fitted in [0.05, 2] with a prior centred on 1: a tight record on a small target shrinks it.
   */
  launchNoiseScale: number;
  /** The physiological launch-speed cap the fit and sampling respect, m/s (profile-priors.ts). */
  speedCapMs: number;
  /** Longest target distance among the repetitions, m (0 with none): reach beyond it is extrapolated. */
  longestTargetM: number;
  /** What a coach should know before trusting these figures (stable codes; see ProfileWarning). */
  warnings: ProfileWarning[];
  observations: ProfileObservationCounts;
  /** The prior the fit used. */
  prior: ProfilePrior;
}

/**
 * Prior speed ceilings by technique, m/s: maximal instep kicks reach 26–35 m/s (Andersen & Dörge 2011,
 * Scand. J. Med. Sci. Sports 21:79); lofted and curled balls are struck a little below that and chips
 * well below (common practice). The fit moves them when repetitions fall short of far targets.
 */
export const DEFAULT_CEILINGS_MS: Readonly<Record<Technique, number>> = { driven: 30, lofted: 29, curled: 27, chipped: 22 };

/** Spread of the prior on ln(ceiling): a factor of about e^0.2 ≈ 1.22 either way (common practice). */
export const CEILING_PRIOR_LOG_SD = 0.2;

/**
 * Default priors by technique (common practice, no source): 20–30 m/s is typical for
 * free kicks and long passes; chips are struck softer. The speed spread is the spread of a player's
 * strikes about the speed the target needed — about 6 % (the fit reads it as σ of ln speed relative to
 * need, aimed-speed.ts): not the spread of their speeds across drills at different distances, which the
 * aimed-speed model takes out; a larger prior pulls every fitted spread up and every reach down.
 * Azimuth spread 3°, worth three repetitions.
 */
export const DEFAULT_PRIORS: Readonly<Record<Technique, ProfilePrior>> = {
  driven: { meanSpeedMs: 25, sdSpeedMs: 1.5, meanAzimuthDeg: 0, sdAzimuthDeg: 3, weightReps: 3 },
  lofted: { meanSpeedMs: 23, sdSpeedMs: 1.4, meanAzimuthDeg: 0, sdAzimuthDeg: 3, weightReps: 3 },
  chipped: { meanSpeedMs: 17, sdSpeedMs: 1, meanAzimuthDeg: 0, sdAzimuthDeg: 3, weightReps: 3 },
  curled: { meanSpeedMs: 23, sdSpeedMs: 1.4, meanAzimuthDeg: 0, sdAzimuthDeg: 3, weightReps: 3 },
};
