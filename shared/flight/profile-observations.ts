/**
 * Turning coarse Pitchside logs into censored observations of launch speed and aim, through the
 * forward model and its inverse. Convention for outcomes (how Pitchside asks coaches to log): a miss is
 * called by its larger error — `short`/`long` when the carry error is at least the lateral one, so the
 * carry missed by at least r/√2 for a target of radius r; `left`/`right` when the lateral error is the
 * larger, so the ball landed at least r/√2 to that side and (taken as) within the radius band in carry;
 * `on_target` means within the radius; `over` means the ball was still in the air at the target line
 * (carry > target distance); `blocked` says nothing.
 */

import { DEFAULT_ELEVATION_DEG, SIDESPIN_STEP_RPS, SPIN_STEP_RPS, TECHNIQUES } from './constants';
import { intentionConditions } from './aimed-speed';
import { DEFAULT_SOLVER_SETTINGS, integrateFlight } from './integrate';
import { INVERSE_MAX_SPEED_MS, INVERSE_MIN_SPEED_MS, solveLaunchSpeed } from './inverse';
import { buildModel, resolveConditions, validateLaunch } from './model';
import type { LoggedKick } from './profile-types';
import type { BackspinStep, FlightConditions, KickOutcome, SidespinStep, Technique } from './types';
import { requireInHalfOpen, requireInRange, requireInteger, requireOneOf } from './validate';

import { OUTCOMES } from '../vocabulary';

const DEG = Math.PI / 180;
/** Half-width of the square with the area of a unit circle, √π / 2 ≈ 0.886 (first principles). */
export const EQUAL_AREA_HALF_WIDTH = Math.sqrt(Math.PI) / 2;

/** A censored observation: lo = hi is a point; infinite ends are one-sided bounds. */
export interface Censored {
  lo: number;
  hi: number;
  /** For a point: its own measurement spread as a fraction of the value (a timed repetition's speed). */
  relSd?: number;
  /** Variance added to the fitted spread for this observation alone (an aim read through an uncertain spin's curl). */
  extraVar?: number;
}

/** One repetition after validation, with the launch the model will use for it. */
export interface PreparedKick {
  index: number;
  technique: Technique;
  outcome: KickOutcome;
  targetDistanceM: number;
  targetRadiusM: number;
  elevationDeg: number;
  backspinRps: number;
  sidespinRps: number;
  lateralM: number | null;
  carryM: number | null;
  measuredSpeedMs: number | null;
  hangTimeS: number | null;
  conditions: FlightConditions;
  /** Whether the launch angle was measured (device import, video): trusted, no elevation uncertainty. */
  angleMeasured: boolean;
  /** Whether the spin was measured (device) or solved from a stopwatch reading: no eye-logging uncertainty. */
  spinMeasured: boolean;
  backspinStep: BackspinStep;
  sidespinStep: SidespinStep;
}

function optional(field: string, value: number | null | undefined, check: (f: string, v: number) => number): number | null {
  return value === null || value === undefined ? null : check(field, value);
}

/** Validate one logged kick (RangeError naming `kicks[i].field`) and resolve its launch angle and spin. */
export function prepareKick(kick: LoggedKick, index: number): PreparedKick {
  const at = (f: string): string => `kicks[${index}].${f}`;
  if (kick === null || typeof kick !== 'object') throw new RangeError(`kicks[${index}] must be an object`);
  const technique = requireOneOf(at('technique'), kick.technique, TECHNIQUES);
  const outcome = requireOneOf(at('outcome'), kick.outcome, OUTCOMES);
  const targetDistanceM = requireInHalfOpen(at('targetDistanceM'), kick.targetDistanceM, 0, 150, 'm');
  const targetRadiusM = requireInHalfOpen(at('targetRadiusM'), kick.targetRadiusM, 0, 30, 'm');
  const backStep = requireInteger(at('backspinStep'), kick.backspinStep, -3, 3) as BackspinStep;
  const sideStep = requireInteger(at('sidespinStep'), kick.sidespinStep, -2, 2) as SidespinStep;
  const carryM = optional(at('carryM'), kick.carryM, (f, v) => requireInHalfOpen(f, v, 0, 150, 'm'));
  const lateralM = optional(at('lateralM'), kick.lateralM, (f, v) => requireInRange(f, v, -60, 60, 'm'));
  const measuredSpeedMs = optional(at('measuredSpeedMs'), kick.measuredSpeedMs, (f, v) => requireInHalfOpen(f, v, 0, 60, 'm/s'));
  const angle = optional(at('launchAngleDeg'), kick.launchAngleDeg, (f, v) => requireInHalfOpen(f, v, 0, 90, '°'));
  const spin = optional(at('measuredSpinRps'), kick.measuredSpinRps, (f, v) => requireInRange(f, v, 0, 30, 'rev/s'));
  const hangTimeS = optional(at('hangTimeS'), kick.hangTimeS, (f, v) => requireInRange(f, v, 0.2, 10, 's'));
  let backspinRps = SPIN_STEP_RPS[backStep];
  let sidespinRps = SIDESPIN_STEP_RPS[sideStep];
  if (spin !== null && kick.measuredSource === 'video') {
    // A side-on video measures the backspin component only; its sign rides on the logged step (the
    // measuring screen sets the step's direction from the fit), sidespin stays the eye-logged step.
    backspinRps = backStep < 0 ? -spin : spin;
  } else if (spin !== null) {
    // A device measures the total rate; keep the logged direction (backspin if none was logged).
    const logged = Math.hypot(backspinRps, sidespinRps);
    if (logged > 0) {
      backspinRps *= spin / logged;
      sidespinRps *= spin / logged;
    } else {
      backspinRps = spin;
    }
  }
  return {
    index,
    technique,
    outcome,
    targetDistanceM,
    targetRadiusM,
    elevationDeg: angle ?? DEFAULT_ELEVATION_DEG[technique],
    backspinRps,
    sidespinRps,
    lateralM,
    carryM,
    measuredSpeedMs,
    hangTimeS,
    conditions: kick.conditions ?? {},
    angleMeasured: angle !== null,
    spinMeasured: spin !== null,
    backspinStep: backStep,
    sidespinStep: sideStep,
  };
}

/**
 * The unknown part of one repetition's launch: the elevation spread at launch-noise scale 1 (the fit
 * scales it by λ), and the spread of its real backspin about the best guess (profile-spin.ts; not scaled).
 */
export interface LaunchUnknowns {
  elevationSdDeg: number;
  backspinSdRps: number;
}

/** Mean (second order in the spread) and variance of a shift in ln speed. */
export interface ShiftMoments {
  meanLog: number;
  varLog: number;
  /**
   * The part of `varLog` from the shift's curvature, 2·meanLog² (exact for a shift quadratic in the
   * launch error): when the spread is scaled by λ it grows as λ⁴, the rest (the slope's) as λ².
   */
  curvatureVarLog?: number;
}

/**
 * How an unknown launch moves a repetition's speed evidence: Δ = ln V(carry, actual launch) − ln V(carry,
 * assumed launch), where V is the inverse (speed for a carry). The elevation part is given at
 * launch-noise scale 1 (the fit scales mean and variance by λ²); the spin part is the real backspin's
 * remaining uncertainty after the eye's error was taken out, used as it is.
 */
export interface LaunchShift extends ShiftMoments {
  spin: ShiftMoments;
}

/** Three-point Gauss–Hermite nodes for a normal variable: ±√3 σ with weight 1/6, 0 with weight 2/3 (Abramowitz & Stegun 25.4.46). */
const GH_NODE = Math.sqrt(3);

/**
 * Moments of Δ for a repetition whose evidence is a carry of `carryM` (a bound or a point), integrated
 * over its unknown elevation and backspin one dimension at a time by three-point Gauss–Hermite
 * quadrature (cross terms left out). A shift where a node cannot reach the carry uses the inverse's
 * clamp (1 or 60 m/s): large, as it should be, since such a launch cannot explain the log.
 */
export function launchShift(kick: PreparedKick, carryM: number, unknowns: LaunchUnknowns, bounds: SpeedBounds): LaunchShift {
  const none = (): ShiftMoments => ({ meanLog: 0, varLog: 0 });
  if (!(carryM > 0.5)) return { ...none(), spin: none() };
  const base = Math.log(bounds.speedFor(kick, carryM));
  const moments = (plus: PreparedKick, minus: PreparedKick): ShiftMoments => {
    const dp = Math.log(bounds.speedFor(plus, carryM)) - base;
    const dm = Math.log(bounds.speedFor(minus, carryM)) - base;
    const m = (dp + dm) / 6;
    // For Δ = a·e + b·e² (e ~ N(0, s²)), the nodes give a·s = (dp − dm)/(2√3) and b·s² = m:
    // Var Δ = a²s² + 2b²s⁴ = (dp − dm)²/12 + 2m², the same as the quadrature's own (dp² + dm²)/6 − m².
    return { meanLog: m, varLog: (dp - dm) ** 2 / 12 + 2 * m * m, curvatureVarLog: 2 * m * m };
  };
  let elevation = none();
  let spin = none();
  if (unknowns.elevationSdDeg > 0) {
    const h = GH_NODE * unknowns.elevationSdDeg;
    const at = (e: number): PreparedKick => ({ ...kick, elevationDeg: Math.min(85, Math.max(1, e)) });
    elevation = moments(at(kick.elevationDeg + h), at(kick.elevationDeg - h));
  }
  if (unknowns.backspinSdRps > 0) {
    const h = GH_NODE * unknowns.backspinSdRps;
    spin = moments({ ...kick, backspinRps: kick.backspinRps + h }, { ...kick, backspinRps: kick.backspinRps - h });
  }
  return { ...elevation, spin };
}

/** The carry a repetition's speed evidence is read at (for its launch shift), or null when it has none. */
export function evidenceCarryM(kick: PreparedKick): number | null {
  if (kick.measuredSpeedMs !== null) return null;
  if (kick.carryM !== null) return kick.carryM;
  const d = kick.targetDistanceM;
  const m = kick.targetRadiusM * Math.SQRT1_2;
  switch (kick.outcome) {
    case 'short':
      return d - m > 0 ? d - m : null;
    case 'long':
      return d + m;
    case 'blocked':
      return null;
    default:
      return d;
  }
}

/** Memoised carry → speed for repeated targets (a drill logs the same bounds again and again). */
export class SpeedBounds {
  private readonly cache = new Map<string, number>();

  /** Speed giving `carryM` for this kick's launch, clamped to the inverse's range when out of reach. */
  speedFor(kick: PreparedKick, carryM: number): number {
    if (carryM <= 0) return Number.NEGATIVE_INFINITY;
    const key = JSON.stringify([carryM, kick.elevationDeg, kick.backspinRps, kick.sidespinRps, kick.conditions]);
    const hit = this.cache.get(key);
    if (hit !== undefined) return hit;
    const query = {
      ...kick.conditions,
      carryM,
      elevationDeg: kick.elevationDeg,
      backspinRps: kick.backspinRps,
      sidespinRps: kick.sidespinRps,
    };
    let speed = solveLaunchSpeed(query);
    if (speed === null) {
      const farthest = referenceFlight(kick, INVERSE_MAX_SPEED_MS).carryM;
      speed = carryM > farthest ? INVERSE_MAX_SPEED_MS : INVERSE_MIN_SPEED_MS;
    }
    this.cache.set(key, speed);
    return speed;
  }
}

/** The kick's own flight at `speedMs` straight along the aim (azimuth 0), in its own conditions or `conditions`. */
export function referenceFlight(
  kick: PreparedKick,
  speedMs: number,
  conditions: FlightConditions = kick.conditions,
): { carryM: number; landingX: number; landingY: number } {
  const model = buildModel(
    resolveConditions(conditions),
    validateLaunch({
      speed: speedMs,
      elevationDeg: kick.elevationDeg,
      backspinRps: kick.backspinRps,
      sidespinRps: kick.sidespinRps,
    }),
  );
  const f = integrateFlight(model, { settings: DEFAULT_SOLVER_SETTINGS });
  return { carryM: f.carryM, landingX: f.landing.x, landingY: f.landing.y };
}

/** The speed observation a repetition gives, or null when it says nothing about speed. */
export function speedObservation(kick: PreparedKick, bounds: SpeedBounds): Censored | null {
  if (kick.measuredSpeedMs !== null) return { lo: kick.measuredSpeedMs, hi: kick.measuredSpeedMs };
  if (kick.carryM !== null) {
    const v = bounds.speedFor(kick, kick.carryM);
    return { lo: v, hi: v };
  }
  const d = kick.targetDistanceM;
  const r = kick.targetRadiusM;
  const m = r * Math.SQRT1_2;
  switch (kick.outcome) {
    case 'on_target':
      // Inside a circle of radius r: the carry and lateral errors are each read as within the half-width of
      // the square of equal area, r√π/2 (not r, which would credit the corners and widen the fitted spreads).
      return { lo: bounds.speedFor(kick, d - EQUAL_AREA_HALF_WIDTH * r), hi: bounds.speedFor(kick, d + EQUAL_AREA_HALF_WIDTH * r) };
    case 'left':
    case 'right':
      return { lo: bounds.speedFor(kick, d - r), hi: bounds.speedFor(kick, d + r) };
    case 'short':
      return d - m > 0 ? { lo: Number.NEGATIVE_INFINITY, hi: bounds.speedFor(kick, d - m) } : null;
    case 'long':
      return { lo: bounds.speedFor(kick, d + m), hi: Number.POSITIVE_INFINITY };
    case 'over':
      return { lo: bounds.speedFor(kick, d), hi: Number.POSITIVE_INFINITY };
    case 'blocked':
      return null;
  }
}

/** Landings turned more than this off the kick's line say nothing about aim (a ball held up or blown back by the wind), degrees. */
const MAX_AIM_READING_DEG = 45;

/** What is not known of a repetition's launch when its aim is read: spreads about the launch it is read at. */
export interface AimUnknowns {
  elevationSdDeg: number;
  backspinSdRps: number;
  sidespinSdRps: number;
}

/**
 * The aim error (launch azimuth, degrees) a repetition gives, or null. Players aim off for the curl of the
 * ball they mean to strike — `intended`, the player's usual launch, judged in still air (as sampling and
 * reach curves assume) — so the landing's bearing is the aim error plus how far this ball turned beyond
 * that: its own curl (at its best-guess spin) and the wind's drift, in its own conditions. In still air a
 * kick turned by an angle lands at its reference landing point turned by it, so lateral = ρ sin(bearing).
 *
 * How far the ball turned depends on the parts of its launch that are not known (`unknowns`): the
 * sidespin's curl, and in wind the drift of a ball that reached this carry higher or lower, with more or
 * less backspin. Their variance (one-at-a-time central differences, the carry held) is added to this
 * observation alone (`extraVar`): sampling draws those launch spreads itself, so the aim spread must not
 * carry them too.
 */
export function aimObservation(
  kick: PreparedKick,
  speedMs: number,
  intended?: AimLaunchOf,
  unknowns?: AimUnknowns,
  bounds: SpeedBounds = new SpeedBounds(),
): Censored | null {
  const r = kick.targetRadiusM;
  let lateral: Censored | null = null;
  if (kick.lateralM !== null) lateral = { lo: kick.lateralM, hi: kick.lateralM };
  else if (kick.outcome === 'on_target') lateral = { lo: -EQUAL_AREA_HALF_WIDTH * r, hi: EQUAL_AREA_HALF_WIDTH * r };
  else if (kick.outcome === 'left') lateral = { lo: r * Math.SQRT1_2, hi: Number.POSITIVE_INFINITY };
  else if (kick.outcome === 'right') lateral = { lo: Number.NEGATIVE_INFINITY, hi: -r * Math.SQRT1_2 };
  if (lateral === null) return null;
  const ref = referenceFlight(kick, speedMs);
  const rho = Math.hypot(ref.landingX, ref.landingY);
  if (!(rho > 0.5)) return null;
  const meant = intended ? { ...kick, ...intended } : kick;
  const still = referenceFlight(meant, speedMs, intentionConditions(kick.conditions));
  const [landed, aimedOff] = [bearingDeg(ref), bearingDeg(still)];
  if (Math.abs(landed) > MAX_AIM_READING_DEG || Math.abs(aimedOff) > MAX_AIM_READING_DEG) return null;
  const turnDeg = landed - aimedOff;
  const extraVar = unknowns ? turnVariance(kick, speedMs, ref.carryM, unknowns, bounds) : 0;
  const toAzimuth = (lat: number): number => {
    if (lat === Number.POSITIVE_INFINITY || lat === Number.NEGATIVE_INFINITY) return lat;
    return Math.asin(Math.max(-1, Math.min(1, lat / rho))) / DEG - turnDeg;
  };
  return { lo: toAzimuth(lateral.lo), hi: toAzimuth(lateral.hi), ...(extraVar > 0 ? { extraVar } : {}) };
}

function bearingDeg(f: { landingX: number; landingY: number }): number {
  return Math.atan2(f.landingY, f.landingX) / DEG;
}

/**
 * Variance (degrees²) of how far a repetition turned, over its unknown launch: sidespin at the reading's
 * speed; elevation and backspin with the speed re-solved so the ball still carries `carryM` (what the log
 * says), which in still air barely turns it and in a crosswind changes its drift.
 */
function turnVariance(kick: PreparedKick, speedMs: number, carryM: number, unknowns: AimUnknowns, bounds: SpeedBounds): number {
  let v = 0;
  const half = (plus: PreparedKick, minus: PreparedKick, keepCarry: boolean): number => {
    const speedOf = (k: PreparedKick): number => (keepCarry ? bounds.speedFor(k, carryM) : speedMs);
    const [sp, sm] = [speedOf(plus), speedOf(minus)];
    if (!(sp > 1 && sm > 1 && sp < 60 && sm < 60)) return 0;
    return (bearingDeg(referenceFlight(plus, sp)) - bearingDeg(referenceFlight(minus, sm))) / 2;
  };
  const h = unknowns.sidespinSdRps;
  if (h > 0) v += half({ ...kick, sidespinRps: kick.sidespinRps + h }, { ...kick, sidespinRps: kick.sidespinRps - h }, false) ** 2;
  const windy = (kick.conditions.wind?.speedMs ?? 0) > 0;
  if (windy && carryM > 0.5) {
    const e = unknowns.elevationSdDeg;
    const at = (x: number): PreparedKick => ({ ...kick, elevationDeg: Math.min(85, Math.max(1, x)) });
    if (e > 0) v += half(at(kick.elevationDeg + e), at(kick.elevationDeg - e), true) ** 2;
    const b = unknowns.backspinSdRps;
    if (b > 0) v += half({ ...kick, backspinRps: kick.backspinRps + b }, { ...kick, backspinRps: kick.backspinRps - b }, true) ** 2;
  }
  return v;
}

/** The launch a player means to strike, apart from speed. */
export type AimLaunchOf = Pick<PreparedKick, 'elevationDeg' | 'backspinRps' | 'sidespinRps'>;
