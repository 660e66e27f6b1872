/**
 * Public types of the flight model. Axes: x forward along the kicker's aim, y to the
 * kicker's left, z up; origin at the ball on the ground. z is the height of the ball's centre above
 * its height at rest, so z = 0 is ground contact, the ball's underside is at z and its top at z + 2r.
 */

import type { Outcome } from '../vocabulary';

/** Technique, spin steps: the product's vocabulary (docs/design.md §3), defined once. */
export type { BackspinStep, SidespinStep, Technique } from '../vocabulary';

/** Outcome of a repetition as logged on Pitchside. */
export type KickOutcome = Outcome;

/** Ball mass and radius. */
export interface BallSpec {
  massKg: number;
  radiusM: number;
}

/**
 * Air state. A given density wins; otherwise density follows from temperature, pressure (or ISA
 * pressure at the altitude) and relative humidity. Omitted values default to the ISA at the altitude,
 * dry air.
 */
export interface AirSpec {
  densityKgM3?: number;
  temperatureC?: number;
  altitudeM?: number;
  relativeHumidityPct?: number;
  pressureHpa?: number;
}

/**
 * Horizontal wind. `fromDeg`: 0 = from the target (headwind), 90 = from the left, 180 = tailwind.
 * `speedMs` is the wind at `referenceHeightM` above the grass: 10 m for a weather-service value (the WMO
 * standard anemometer height), head height (~1.8 m, common practice) for a coach's estimate. The model
 * scales it to the ball's height with a logarithmic profile over grass (see wind-profile.ts). Absent =
 * the same wind at every height (what-ifs and tests that give the wind at the ball).
 */
export interface WindSpec {
  speedMs: number;
  fromDeg: number;
  referenceHeightM?: number;
}

/** Drag coefficient model: Goff & Carré 2010 fits with the crisis in Reynolds number, or a constant. */
export type DragModel = 'goff-carre' | { constant: number };

/**
 * Lift coefficient model: `onset` (default: linear through zero, the measured power fit above S ≈ 0.1),
 * the bare power fit, the saturating form, or a constant (applied only with spin).
 */
export type LiftModel = 'onset' | 'power' | 'saturating' | { constant: number };

/** Aerodynamic settings; published coefficients disagree, so these are settings, not constants. */
export interface AeroSpec {
  drag?: DragModel;
  lift?: LiftModel;
  /** Spin-decay time constant in seconds; `null` = no decay. */
  spinDecayTauS?: number | null;
  /**
   * Reynolds number at the centre of this ball's drag crisis (default GOFF_CARRE_RE_CENTRE ≈ 1.83 × 10⁵,
   * the Goff & Carré 2010 ball). Balls differ: Asai et al. 2007 (Sports Engineering 10:101) report
   * critical Reynolds numbers of 2.2–3.0 × 10⁵. The whole crisis moves with it.
   */
  dragCrisisRe?: number;
}

/** Conditions shared by every kick of an envelope or set-piece check. `{}` = defaults. */
export interface FlightConditions {
  ball?: BallSpec;
  air?: AirSpec;
  wind?: WindSpec;
  aero?: AeroSpec;
}

/** One kick to simulate. */
export interface KickInput extends FlightConditions {
  /** Launch speed, m/s. */
  speed: number;
  /** Launch elevation above the ground, degrees, in (−10, 90]. */
  elevationDeg: number;
  /** Launch azimuth, degrees, + = left of aim. */
  azimuthDeg?: number;
  /** Backspin, rev/s; negative = topspin. */
  backspinRps?: number;
  /** Sidespin, rev/s; + curls left. */
  sidespinRps?: number;
  /** x distances (m) at which to report the crossing. */
  planes?: number[];
  /** Sample the path every 20 ms (default false). */
  path?: boolean;
}

/** Where the ball crossed a reporting plane x = const. */
export interface PlaneCrossing {
  x: number;
  t: number;
  y: number;
  z: number;
}

/** One path sample. */
export interface PathPoint {
  t: number;
  x: number;
  y: number;
  z: number;
}

/** Result of one simulated kick. */
export interface Flight {
  /** Horizontal distance from the kick spot to first ground contact, m. */
  carryM: number;
  /** Ground-contact point (x, y), m. */
  landing: { x: number; y: number };
  /** Time of ground contact, s. */
  flightTimeS: number;
  /** Highest z reached, m. */
  apexM: number;
  /** x at the apex, m. */
  apexXM: number;
  /** Time of the apex, s. */
  apexTimeS: number;
  /** Speed over ground at contact, m/s. */
  landingSpeedMs: number;
  /** Crossings of the requested planes reached before landing, in the order requested. */
  crossings: PlaneCrossing[];
  /** Path every 20 ms plus the landing point when `path: true`; otherwise empty. */
  path: PathPoint[];
  /**
   * False when the ball was still in the air at the time cap (30 s); the landing fields then describe
   * the ball at the cap.
   */
  landed: boolean;
  /** Right-hand-side evaluations the integrator spent on this kick. */
  rhsEvaluations: number;
}
