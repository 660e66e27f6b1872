/**
 * Launch speed relative to the target. A player kicking at a cone 25 m away strikes the ball softer
 * than at one 40 m away, so a player's repetitions across drills are not draws from one speed
 * distribution. The model: the speed a repetition needed — the speed that carries the target
 * distance with that repetition's launch angle and spin in standard conditions (still air, ISA sea
 * level, the same ball) — capped smoothly by the player's ceiling, times a log-normal error:
 *
 *   ln v = ln softmin(v_needed(d), v_ceiling) + ε,   ε ~ N(μ, σ²).
 *
 * Standard conditions are used for the *intention* because players judge a distance, not the air; the
 * session's wind and density then move where the ball actually lands (the censored observation of v
 * for each repetition is taken in that repetition's own conditions). A multiplicative error keeps the
 * carry spread proportional to the distance, as coaches see it.
 */

import { DEFAULT_SOLVER_SETTINGS, integrateFlight } from './integrate';
import { INVERSE_MAX_SPEED_MS, INVERSE_MIN_SPEED_MS, solveLaunchSpeed } from './inverse';
import { buildModel, resolveConditions, validateLaunch } from './model';
import type { FlightConditions } from './types';

/** Width of the smooth minimum between the needed speed and the ceiling, in ln-speed (3 %). */
export const CEILING_SOFTNESS = 0.03;

/** The launch a repetition is kicked with, apart from its speed. */
export interface AimLaunch {
  elevationDeg: number;
  backspinRps: number;
  sidespinRps: number;
}

/** Standard conditions of the intention: the same ball and aerodynamic model, still air at ISA sea level, 15 °C. */
export function intentionConditions(conditions: FlightConditions): FlightConditions {
  const standard: FlightConditions = { air: { altitudeM: 0, temperatureC: 15 } };
  if (conditions.ball) standard.ball = conditions.ball;
  if (conditions.aero) standard.aero = conditions.aero;
  return standard;
}

/** Smooth minimum of two logarithms (a log-sum-exp with width `CEILING_SOFTNESS`). */
export function softMinLog(a: number, b: number): number {
  const w = CEILING_SOFTNESS;
  const m = Math.min(a, b);
  return m - w * Math.log(Math.exp((m - a) / w) + Math.exp((m - b) / w));
}

/**
 * Memoised speed a target needs. Distances are rounded to 1 cm and the key includes the launch and
 * the conditions, so a drill's many repetitions cost one inverse.
 */
export class NeededSpeeds {
  private readonly cache = new Map<string, number>();

  /** Speed (m/s) carrying `distanceM` with `launch` in the intention conditions of `conditions`, clamped to the inverse's range. */
  neededMs(distanceM: number, launch: AimLaunch, conditions: FlightConditions): number {
    const d = Math.round(distanceM * 100) / 100;
    if (d <= 0) return INVERSE_MIN_SPEED_MS;
    const standard = intentionConditions(conditions);
    const own = { elevationDeg: launch.elevationDeg, backspinRps: launch.backspinRps, sidespinRps: launch.sidespinRps };
    const key = JSON.stringify([d, own.elevationDeg, own.backspinRps, own.sidespinRps, standard]);
    const hit = this.cache.get(key);
    if (hit !== undefined) return hit;
    let speed = solveLaunchSpeed({ ...standard, carryM: d, ...own });
    if (speed === null) {
      const model = buildModel(resolveConditions(standard), validateLaunch({ speed: INVERSE_MAX_SPEED_MS, ...own }));
      const farthest = integrateFlight(model, { settings: DEFAULT_SOLVER_SETTINGS }).carryM;
      speed = d > farthest ? INVERSE_MAX_SPEED_MS : INVERSE_MIN_SPEED_MS;
    }
    this.cache.set(key, speed);
    return speed;
  }
}

/** The fitted relation between target and launch speed; plain JSON (part of a `KickProfile`). */
export interface AimedSpeedFit {
  /** μ: mean of ln(launch speed / intended speed). Negative = tends to under-hit. */
  offsetLogMean: number;
  /** σ: spread of ln(launch speed / intended speed); 0.05 ≈ ±5 % speed. */
  offsetLogSd: number;
  offsetLogMeanSe: number;
  offsetLogSdSe: number;
  /** The player's speed ceiling for this technique, m/s (soft: targets needing more fall short). */
  ceilingMs: number;
  /** Standard error of ln(ceiling). Large when no repetition came near the ceiling (the prior speaks). */
  ceilingLogSe: number;
  /**
   * Speed the player has demonstrably reached, m/s: the ceiling's posterior is one-sided above it
   * (sampling draws the ceiling from the normal in ln speed truncated below here). Absent in old rows: 0.
   */
  ceilingFloorMs?: number;
  /** Median target distance of the repetitions, m: where the profile's absolute speed figures are quoted. */
  typicalTargetM: number;
}

/** ln of the intended speed for a needed speed under a ceiling. */
export function intendedLog(neededMs: number, ceilingMs: number): number {
  return softMinLog(Math.log(neededMs), Math.log(ceilingMs));
}
