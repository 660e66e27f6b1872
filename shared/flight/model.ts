/**
 * The equations of motion of a spinning ball in wind, reduced to precomputed constants and one allocation-free
 * right-hand side:
 *
 *   dv/dt = −g ẑ − k C_D(Re, S) |u| u + k C_L(S) |u|² (ω̂ × û),   k = ρA/(2m),   u = v − w.
 *
 * Both the ODEX integration and the benchmark's fixed-step baseline call `derivative`, so any speed-up
 * here helps every envelope.
 */

import { goffCarreCd, GOFF_CARRE_RE_CENTRE, onsetLiftCl, powerLiftCl, saturatingLiftCl } from './aero';
import { resolveAir } from './atmosphere';
import { BALL_SIZES, DEFAULT_SPIN_DECAY_TAU_S, STANDARD_GRAVITY_MS2 } from './constants';
import type { FlightConditions, KickInput } from './types';
import { LIMITS, requireFinite, requireInHalfOpen, requireInRange } from './validate';
import { logHeightRatio } from './wind-profile';

const DEG = Math.PI / 180;
const TWO_PI = 2 * Math.PI;

/** Drag model codes used inside the right-hand side (numbers keep the hot path monomorphic). */
export const DRAG_GOFF_CARRE = 0;
/** Constant drag coefficient. */
export const DRAG_CONSTANT = 1;
/** Lift: the default, linear through zero then the measured power fit (onsetLiftCl). */
export const LIFT_ONSET = 0;
/** Lift: power fit. */
export const LIFT_POWER = 1;
/** Lift: saturating form. */
export const LIFT_SATURATING = 2;
/** Lift: constant coefficient. */
export const LIFT_CONSTANT = 3;

/** Precomputed constants of one kick's equations of motion. Plain numbers only, for speed. */
export interface FlightModel {
  gravityMs2: number;
  /** ρA/(2m), 1/m. */
  aeroK: number;
  radiusM: number;
  /**
   * d/ν, times GOFF_CARRE_RE_CENTRE / (this ball's crisis Reynolds number): the Reynolds number per m/s
   * of air speed on the scale of the Goff & Carré fit, so the fit's crisis lands at this ball's.
   */
  reynoldsPerMs: number;
  /** Wind at the reference height (or everywhere, when `windLogScale` is 0), m/s. */
  windXMs: number;
  windYMs: number;
  /**
   * 1 / ln(z_ref/z₀) of the logarithmic wind profile (floored form, wind-profile.ts); 0 = the same wind at
   * every height.
   */
  windLogScale: number;
  /** Unit spin axis (constant direction; only the magnitude decays). */
  axisX: number;
  axisY: number;
  axisZ: number;
  /** |ω₀|, rad/s. */
  spinRadS: number;
  /** 1/τ, 1/s (0 = no decay). */
  spinDecayPerS: number;
  dragKind: number;
  dragConstant: number;
  liftKind: number;
  liftConstant: number;
  /** Initial state (x, y, z, vx, vy, vz). */
  initialState: number[];
}

/**
 * Validate the conditions shared by all kicks (ball, air, wind, aero) and fold them into the parts of
 * a model that do not depend on the launch. Separate so envelopes resolve the air once per call.
 */
export function resolveConditions(c: FlightConditions): Omit<FlightModel, 'axisX' | 'axisY' | 'axisZ' | 'spinRadS' | 'initialState'> {
  const massKg = c.ball ? requireInRange('ball.massKg', c.ball.massKg, LIMITS.massKg[0], LIMITS.massKg[1], 'kg') : BALL_SIZES[5].massKg;
  const radiusM = c.ball
    ? requireInRange('ball.radiusM', c.ball.radiusM, LIMITS.radiusM[0], LIMITS.radiusM[1], 'm')
    : BALL_SIZES[5].radiusM;
  const air = resolveAir(c.air);
  let windXMs = 0;
  let windYMs = 0;
  let windLogScale = 0;
  if (c.wind) {
    const speed = requireInRange('wind.speedMs', c.wind.speedMs, LIMITS.windSpeedMs[0], LIMITS.windSpeedMs[1], 'm/s');
    const from = requireFinite('wind.fromDeg', c.wind.fromDeg) * DEG;
    // Wind blows *from* `fromDeg` (0 = from the target), so it moves towards the opposite direction.
    windXMs = -speed * Math.cos(from);
    windYMs = -speed * Math.sin(from);
    if (c.wind.referenceHeightM !== undefined) {
      const h = requireInRange('wind.referenceHeightM', c.wind.referenceHeightM, LIMITS.windHeightM[0], LIMITS.windHeightM[1], 'm');
      // Still air needs no profile (and the uniform-wind solver settings are cheaper).
      if (speed > 0) windLogScale = 1 / logHeightRatio(h);
    }
  }
  const aero = c.aero ?? {};
  let dragKind = DRAG_GOFF_CARRE;
  let dragConstant = 0;
  if (aero.drag !== undefined && aero.drag !== 'goff-carre') {
    if (typeof aero.drag !== 'object' || aero.drag === null)
      throw new RangeError(`aero.drag must be 'goff-carre' or { constant } (got ${String(aero.drag)})`);
    dragKind = DRAG_CONSTANT;
    dragConstant = requireInRange('aero.drag.constant', aero.drag.constant, LIMITS.dragConstant[0], LIMITS.dragConstant[1]);
  }
  let liftKind = LIFT_ONSET;
  let liftConstant = 0;
  if (aero.lift === 'power') liftKind = LIFT_POWER;
  else if (aero.lift === 'saturating') liftKind = LIFT_SATURATING;
  else if (aero.lift !== undefined && aero.lift !== 'onset') {
    if (typeof aero.lift !== 'object' || aero.lift === null)
      throw new RangeError(`aero.lift must be 'onset', 'power', 'saturating' or { constant } (got ${String(aero.lift)})`);
    liftKind = LIFT_CONSTANT;
    liftConstant = requireInRange('aero.lift.constant', aero.lift.constant, LIMITS.liftConstant[0], LIMITS.liftConstant[1]);
  }
  const crisisRe =
    aero.dragCrisisRe === undefined
      ? GOFF_CARRE_RE_CENTRE
      : requireInRange('aero.dragCrisisRe', aero.dragCrisisRe, LIMITS.dragCrisisRe[0], LIMITS.dragCrisisRe[1]);
  const tau = aero.spinDecayTauS === undefined ? DEFAULT_SPIN_DECAY_TAU_S : aero.spinDecayTauS;
  const spinDecayPerS =
    tau === null ? 0 : 1 / requireInRange('aero.spinDecayTauS', tau, LIMITS.spinDecayTauS[0], LIMITS.spinDecayTauS[1], 's');
  return {
    gravityMs2: STANDARD_GRAVITY_MS2,
    aeroK: (air.densityKgM3 * Math.PI * radiusM * radiusM) / (2 * massKg),
    radiusM,
    reynoldsPerMs: ((2 * radiusM) / air.kinematicViscosityM2S) * (GOFF_CARRE_RE_CENTRE / crisisRe),
    windXMs,
    windYMs,
    windLogScale,
    spinDecayPerS,
    dragKind,
    dragConstant,
    liftKind,
    liftConstant,
  };
}

/** Launch parameters after validation. */
export interface LaunchSpec {
  speed: number;
  elevationDeg: number;
  azimuthDeg: number;
  backspinRps: number;
  sidespinRps: number;
}

/** Validate the launch fields of a kick; throws RangeError naming the field. */
export function validateLaunch(
  input: Pick<KickInput, 'speed' | 'elevationDeg' | 'azimuthDeg' | 'backspinRps' | 'sidespinRps'>,
): LaunchSpec {
  return {
    speed: requireInHalfOpen('speed', input.speed, LIMITS.speedMs[0], LIMITS.speedMs[1], 'm/s'),
    elevationDeg: requireInHalfOpen('elevationDeg', input.elevationDeg, LIMITS.elevationDeg[0], LIMITS.elevationDeg[1], '°'),
    azimuthDeg: requireInRange('azimuthDeg', input.azimuthDeg ?? 0, LIMITS.azimuthDeg[0], LIMITS.azimuthDeg[1], '°'),
    backspinRps: requireInRange('backspinRps', input.backspinRps ?? 0, LIMITS.spinRps[0], LIMITS.spinRps[1], 'rev/s'),
    sidespinRps: requireInRange('sidespinRps', input.sidespinRps ?? 0, LIMITS.spinRps[0], LIMITS.spinRps[1], 'rev/s'),
  };
}

/**
 * Complete a model from resolved conditions and a validated launch. The spin axis is tied to the
 * launch heading: backspin about −(left of the heading), sidespin about +z (the axes of types.ts), so a kick
 * rotated in azimuth in still air is the same kick rotated.
 */
export function buildModel(conditions: ReturnType<typeof resolveConditions>, launch: LaunchSpec): FlightModel {
  const el = launch.elevationDeg * DEG;
  const az = launch.azimuthDeg * DEG;
  const cosEl = Math.cos(el);
  const cosAz = Math.cos(az);
  const sinAz = Math.sin(az);
  const back = launch.backspinRps * TWO_PI;
  const side = launch.sidespinRps * TWO_PI;
  // Left of the heading is (−sin az, cos az, 0); backspin is ω along minus that.
  const wx = back * sinAz;
  const wy = -back * cosAz;
  const wz = side;
  const spinRadS = Math.sqrt(wx * wx + wy * wy + wz * wz);
  // Built field by field (not by spreading `conditions`) so every model has one hidden class and the
  // right-hand side stays monomorphic; spreading cost ~20 µs per kick in V8.
  return {
    gravityMs2: conditions.gravityMs2,
    aeroK: conditions.aeroK,
    radiusM: conditions.radiusM,
    reynoldsPerMs: conditions.reynoldsPerMs,
    windXMs: conditions.windXMs,
    windYMs: conditions.windYMs,
    windLogScale: conditions.windLogScale,
    spinDecayPerS: conditions.spinDecayPerS,
    dragKind: conditions.dragKind,
    dragConstant: conditions.dragConstant,
    liftKind: conditions.liftKind,
    liftConstant: conditions.liftConstant,
    axisX: spinRadS > 0 ? wx / spinRadS : 0,
    axisY: spinRadS > 0 ? wy / spinRadS : 0,
    axisZ: spinRadS > 0 ? wz / spinRadS : 0,
    spinRadS,
    initialState: [0, 0, 0, launch.speed * cosEl * cosAz, launch.speed * cosEl * sinAz, launch.speed * Math.sin(el)],
  };
}

/** Validate a whole kick and build its model. */
export function modelFromKick(input: KickInput): FlightModel {
  if (input === null || typeof input !== 'object') throw new RangeError('kick input must be an object');
  return buildModel(resolveConditions(input), validateLaunch(input));
}

/**
 * Right-hand side of the equations of motion: writes d(state)/dt into `out`. No allocation, one square
 * root, and at most four transcendental calls (spin decay, crisis sigmoid, spin drag power, wind profile).
 */
export function derivative(m: FlightModel, t: number, s: ArrayLike<number>, out: { [i: number]: number }): void {
  const vx = s[3]!;
  const vy = s[4]!;
  const vz = s[5]!;
  out[0] = vx;
  out[1] = vy;
  out[2] = vz;
  let windX = m.windXMs;
  let windY = m.windYMs;
  if (m.windLogScale > 0) {
    // Logarithmic profile at the height of the ball's centre (z is its underside's height above the grass).
    const f = logHeightRatio(s[2]! + m.radiusM) * m.windLogScale;
    windX *= f;
    windY *= f;
  }
  const ux = vx - windX;
  const uy = vy - windY;
  const uz = vz;
  const u2 = ux * ux + uy * uy + uz * uz;
  let ax = 0;
  let ay = 0;
  let az = -m.gravityMs2;
  if (u2 > 1e-18) {
    const u = Math.sqrt(u2);
    let spin = m.spinRadS;
    if (spin > 0 && m.spinDecayPerS > 0) spin *= Math.exp(-m.spinDecayPerS * t);
    const spinParameter = (m.radiusM * spin) / u;
    const cd = m.dragKind === DRAG_GOFF_CARRE ? goffCarreCd(u * m.reynoldsPerMs, spinParameter) : m.dragConstant;
    const drag = m.aeroK * cd * u;
    ax -= drag * ux;
    ay -= drag * uy;
    az -= drag * uz;
    if (spin > 0) {
      let cl: number;
      if (m.liftKind === LIFT_ONSET) cl = onsetLiftCl(spinParameter);
      else if (m.liftKind === LIFT_POWER) cl = powerLiftCl(spinParameter);
      else if (m.liftKind === LIFT_SATURATING) cl = saturatingLiftCl(spinParameter);
      else cl = m.liftConstant;
      // k C_L |u|² (ω̂ × û) = k C_L |u| (ω̂ × u)
      const lift = m.aeroK * cl * u;
      ax += lift * (m.axisY * uz - m.axisZ * uy);
      ay += lift * (m.axisZ * ux - m.axisX * uz);
      az += lift * (m.axisX * uy - m.axisY * ux);
    }
  }
  out[3] = ax;
  out[4] = ay;
  out[5] = az;
}
