/**
 * Response shapes of the analysis endpoints (Player file, Squad week, planner), shared so the
 * client and the server cannot drift apart.
 */
import type { KickProfile, ProfileWarning } from '../flight/profile-types';
import type { Outcome, Technique } from './sync';

/** Which carry the figures use: as logged, or normalised to still air at ISA sea level, 15 °C. */
export type CarryBasis = 'logged' | 'still-air';

/** One week × technique row of a player's progress (`GET /api/players/:id/progress`). */
export interface ProgressWeek {
  /** Monday of the ISO week, YYYY-MM-DD. */
  weekStart: string;
  technique: Technique;
  reps: number;
  /** Share of repetitions logged `on_target` (0..1). */
  hitRate: number;
  /** Share of each outcome (0..1), every outcome present. */
  outcomeShare: Record<Outcome, number>;
  /** How many repetitions had a carry on the chosen basis. */
  carryCount: number;
  medianCarryM: number | null;
  /** Nearest-rank quartiles of carry, metres. */
  carryP25M: number | null;
  carryP75M: number | null;
  /** Population standard deviation of carry, metres. */
  carrySdM: number | null;
}

/** `GET /api/players/:id/progress`. */
export interface ProgressResponse {
  playerId: string;
  carryBasis: CarryBasis;
  weeks: ProgressWeek[];
}

/** One kick in a player's recent-kicks table (`GET /api/players/:id/kicks`). */
export interface PlayerKick {
  id: string;
  sessionId: string;
  recordedAt: string;
  technique: Technique;
  foot: 'left' | 'right';
  backspinStep: number;
  sidespinStep: number;
  targetDistanceM: number;
  targetRadiusM: number;
  outcome: Outcome;
  carryM: number | null;
  /** The logged carry normalised to still air at ISA sea level, 15 °C (null without a carry). */
  stillAirCarryM: number | null;
  lateralM: number | null;
  measuredSpeedMs: number | null;
  launchAngleDeg: number | null;
  measuredSpinRps: number | null;
  /** Where the measured values came from ('device' import or phone 'video'); null when none were measured. */
  measuredSource: 'device' | 'video' | null;
  /** Pitchside stopwatch reading (contact to first bounce), s, uncorrected; null when not timed. */
  hangTimeS: number | null;
}

/** `GET /api/players/:id/kicks`. */
export interface PlayerKicksResponse {
  playerId: string;
  total: number;
  kicks: PlayerKick[];
}

/** A cached launch profile of one player and technique. */
export interface ProfileEntry {
  playerId: string;
  technique: Technique;
  /** Null while it has not been computed yet (`pending`) or when there are no repetitions. */
  profile: KickProfile | null;
  repetitions: number;
  /** Reliable reach at standard conditions for `reachRadiusM` (null: no distance reaches 60 %). */
  reliableReachM: number | null;
  reachRadiusM: number;
  computedAt: string | null;
  /** Whether newer kicks exist than the cached profile used (a background job is refreshing it). */
  pending: boolean;
  /** Stored kicks the fit left out because the flight model cannot use them (outside its domain). */
  skippedKicks: number;
}

/** `GET /api/players/:id/profile?technique=`. */
export type ProfileResponse = ProfileEntry;

/** `GET /api/squads/:id/profiles?technique=`: every player's profile for the planner ranking. */
export interface SquadProfilesResponse {
  squadId: string;
  technique: Technique;
  players: (ProfileEntry & { displayName: string; shirtNumber: number | null })[];
}

/**
 * Predicted against observed hits of one player and technique over a week, out of sample: predicted by a
 * profile fitted on the repetitions before the week, each repetition in its own session's conditions.
 */
export interface CalibrationPoint {
  technique: Technique;
  reps: number;
  /** Repetitions logged on target. */
  hits: number;
  /** Sum of the repetitions' predicted hit probabilities (expected hits). */
  predictedHits: number;
  /** predictedHits / reps. */
  predictedHitRate: number;
  /** hits / reps. */
  observedHitRate: number;
}

/** One player's line in Squad week (`GET /api/squads/:id/week`). */
export interface SquadWeekPlayer {
  playerId: string;
  displayName: string;
  shirtNumber: number | null;
  reps: number;
  hitRate: number | null;
  previousReps: number;
  previousHitRate: number | null;
  /** This week's hit rate minus last week's (null when either week has no repetitions). */
  hitRateChange: number | null;
  /** Technique with the best hit rate this week among those with enough repetitions. */
  bestTechnique: Technique | null;
  byTechnique: { technique: Technique; reps: number; hitRate: number; medianCarryM: number | null }[];
  /** Current reliable reach per technique (from the cached profile). */
  reach: {
    technique: Technique;
    reliableReachM: number | null;
    reachRadiusM: number;
    repetitions: number;
    pending: boolean;
    /** The cached profile's warning codes (PROFILE_WARNING_TEXT gives the words). */
    warnings: ProfileWarning[];
  }[];
  calibration: CalibrationPoint[];
  /** Techniques whose held-out calibration the server is still computing (they join `calibration` when done). */
  calibrationPending: number;
  /** Sessions this week in which the player passed the club's repetition limit. */
  loadFlags: { sessionId: string; startedAt: string; reps: number; limit: number }[];
}

/** Hit rate of the squad's repetitions in one band of target distance. */
export interface ZoneHitRate {
  technique: Technique;
  bandStartM: number;
  bandEndM: number;
  reps: number;
  hitRate: number;
}

/** `GET /api/squads/:id/week?start=`. */
export interface SquadWeek {
  squadId: string;
  squadName: string;
  weekStart: string;
  previousWeekStart: string;
  carryBasis: CarryBasis;
  repLimitPerSession: number;
  players: SquadWeekPlayer[];
  zones: ZoneHitRate[];
}

/** Why a timed repetition gave no spin estimate. */
export type SpinEstimateSkip = 'no_carry' | 'time_too_short' | 'time_too_long' | 'carry_out_of_reach' | 'spread_unresolved';

/** Spin inferred from hang time for one technique of one player. */
export interface TechniqueSpinEstimate {
  technique: Technique;
  /** Timed repetitions (a stopwatch reading attached). */
  timedCount: number;
  /** Of those, the ones the estimate used (a carry was known and the pair was possible). */
  solvedCount: number;
  /** Timed repetitions left out, by reason. */
  skipped: Record<SpinEstimateSkip, number>;
  /** Inverse-variance weighted mean backspin, rev/s (negative = topspin); null when nothing solved. */
  backspinRps: number | null;
  /** One standard deviation of that mean, rev/s: timing spread, widened by the kick-to-kick scatter. */
  backspinUncertaintyRps: number | null;
  /** Scatter of the per-repetition estimates, rev/s (null below two). */
  backspinScatterRps: number | null;
  /** Weighted mean launch speed, m/s, and its standard deviation. */
  speedMs: number | null;
  speedUncertaintyMs: number | null;
  /** Mean of the spin logged by eye (the step scale) on the solved repetitions, rev/s, for comparison. */
  eyeBackspinRps: number | null;
}

/** `GET /api/players/:id/spin-estimates`. */
export interface SpinEstimatesResponse {
  playerId: string;
  /** The club calibration used: reading − bias = flight time, spread = one standard deviation. */
  timing: { biasS: number; sdS: number };
  /** Most recent timed repetitions read per technique. */
  perTechniqueLimit: number;
  techniques: TechniqueSpinEstimate[];
}
