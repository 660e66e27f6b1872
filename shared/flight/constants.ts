/**
 * Physical constants, ball sizes, Laws-of-the-Game distances and the club-tunable defaults of the
 * spin and technique scales. Every value carries its source beside it so a reviewer can check it.
 */

import type { BackspinStep, SidespinStep, Technique } from './types';

/** Standard acceleration of gravity, m/s² (CGPM 1901; ISO 80000-3). Used as g everywhere. */
export const STANDARD_GRAVITY_MS2 = 9.80665;

/** One ball size: the Law 2 (or common-practice) ranges and the default used when none is given. */
export interface BallSize {
  /** Circumference range in metres, [min, max]. */
  readonly circumferenceRangeM: readonly [number, number];
  /** Mass range in kilograms, [min, max]. */
  readonly massRangeKg: readonly [number, number];
  /** Default circumference (midpoint of the range), metres. */
  readonly circumferenceM: number;
  /** Default mass (midpoint of the range), kilograms. */
  readonly massKg: number;
  /** Default radius, circumference / 2π, metres. */
  readonly radiusM: number;
  /** Where the ranges come from. */
  readonly source: string;
}

function ballSize(circumferenceRangeM: readonly [number, number], massRangeKg: readonly [number, number], source: string): BallSize {
  const circumferenceM = (circumferenceRangeM[0] + circumferenceRangeM[1]) / 2;
  return {
    circumferenceRangeM,
    massRangeKg,
    circumferenceM,
    massKg: (massRangeKg[0] + massRangeKg[1]) / 2,
    radiusM: circumferenceM / (2 * Math.PI),
    source,
  };
}

/**
 * Ball sizes 3, 4 and 5 with mass and circumference ranges. Sessions record the ball size, and the
 * flight model needs mass and radius; defaults are the midpoints of the ranges.
 */
export const BALL_SIZES: Readonly<Record<3 | 4 | 5, BallSize>> = {
  // Common practice (no standard): youth size 3.
  3: ballSize([0.585, 0.61], [0.3, 0.32], 'common practice (no standard)'),
  // Common practice (no standard): youth size 4.
  4: ballSize([0.635, 0.66], [0.35, 0.39], 'common practice (no standard)'),
  // IFAB Laws of the Game, Law 2: circumference 68–70 cm, mass 410–450 g.
  5: ballSize([0.68, 0.7], [0.41, 0.45], 'IFAB Laws of the Game, Law 2'),
};

/** Distance of the defending wall from the ball at a free kick, m (IFAB Laws of the Game, Law 13). */
export const WALL_DISTANCE_M = 9.15;
/** Distance between the inside edges of the goalposts, m (IFAB Laws of the Game, Law 1). */
export const GOAL_WIDTH_M = 7.32;
/** Distance from the lower edge of the crossbar to the ground, m (IFAB Laws of the Game, Law 1). */
export const GOAL_HEIGHT_M = 2.44;

/**
 * Backspin step → rev/s (+ = backspin, − = topspin). Pitchside logs a seven-step estimate; the model
 * needs a rate. Product defaults (common practice), consistent with measured free kicks of 8–17 rev/s
 * (Barber & Carré 2010, Sports Engineering 13:47). Clubs may tune these.
 */
export const SPIN_STEP_RPS: Readonly<Record<BackspinStep, number>> = {
  [-3]: -10,
  [-2]: -6,
  [-1]: -3,
  0: 0,
  1: 3,
  2: 6,
  3: 10,
};

/** Sidespin step → rev/s (+ = curls left). Five-step Pitchside scale; product defaults (common practice), clubs may tune. */
export const SIDESPIN_STEP_RPS: Readonly<Record<SidespinStep, number>> = {
  [-2]: -8,
  [-1]: -4,
  0: 0,
  1: 4,
  2: 8,
};

/**
 * Default launch elevation by technique, degrees (common coaching practice, no source). Used when a
 * kick has no measured launch angle.
 */
export const DEFAULT_ELEVATION_DEG: Readonly<Record<Technique, number>> = {
  driven: 12,
  curled: 18,
  lofted: 32,
  chipped: 48,
};

/** All techniques, in the order screens list them (the vocabulary's list). */
export { TECHNIQUES } from '../vocabulary';

/**
 * Spin-decay time constant τ in ω = ω₀ e^(−t/τ), seconds. An estimate: the golf-ball spin-down law of
 * Smits & Smith 1994 as used by Penner 2001 (American Journal of Physics 69:563), scaled to a
 * football, which puts it of the order of 20–25 s.
 */
export const DEFAULT_SPIN_DECAY_TAU_S = 22;

/** Flights longer than this are stopped and reported as not landed (no kick stays up 30 s). */
export const FLIGHT_TIME_CAP_S = 30;

/** Spacing of path samples when `path: true`, seconds. */
export const PATH_SAMPLE_INTERVAL_S = 0.02;
