/**
 * The inverse problem: which launch speed gives an observed carry? Logs record where balls came down,
 * not how hard they were struck, so the profile fit maps every carry bound through this.
 */

import { DEFAULT_SOLVER_SETTINGS, integrateFlight, type SolverSettings } from './integrate';
import { buildModel, resolveConditions, validateLaunch } from './model';
import { brentRoot } from './roots';
import type { FlightConditions } from './types';
import { requireInHalfOpen, requireInRange } from './validate';

/** Slowest launch speed the inverse considers, m/s. */
export const INVERSE_MIN_SPEED_MS = 1;
/** Fastest launch speed the inverse considers, m/s (well above any measured instep kick). */
export const INVERSE_MAX_SPEED_MS = 60;

/** A carry to explain, with the launch angle, spin and conditions it was kicked with. */
export interface LaunchSpeedQuery extends FlightConditions {
  carryM: number;
  elevationDeg: number;
  azimuthDeg?: number;
  backspinRps?: number;
  sidespinRps?: number;
  /**
   * Fastest speed to consider, m/s (default INVERSE_MAX_SPEED_MS). Pass the physiological cap
   * (LAUNCH_SPEED_CAP_MS) to get null where no kick a player can strike explains the carry.
   */
  maxSpeedMs?: number;
}

/**
 * Launch speed (m/s) whose simulated carry equals `carryM`, by Brent's method on the forward model over
 * [1, maxSpeedMs] m/s; `null` when no speed in that range reaches (or stays short of) the carry. Round-trips
 * `simulateKick` to well under 1 mm.
 */
export function solveLaunchSpeed(query: LaunchSpeedQuery, settings: Readonly<SolverSettings> = DEFAULT_SOLVER_SETTINGS): number | null {
  if (query === null || typeof query !== 'object') throw new RangeError('launch speed query must be an object');
  const carryM = requireInHalfOpen('carryM', query.carryM, 0, 500, 'm');
  const conditions = resolveConditions(query);
  const maxSpeedMs = requireInRange('maxSpeedMs', query.maxSpeedMs ?? INVERSE_MAX_SPEED_MS, 2, INVERSE_MAX_SPEED_MS, 'm/s');
  const { maxSpeedMs: _, ...rest } = query;
  const launch = validateLaunch({ ...rest, speed: INVERSE_MIN_SPEED_MS });
  const carryAt = (speed: number): number => integrateFlight(buildModel(conditions, { ...launch, speed }), { settings }).carryM - carryM;
  const lo = carryAt(INVERSE_MIN_SPEED_MS);
  const hi = carryAt(maxSpeedMs);
  if (lo > 0 || hi < 0) return null;
  const speed = brentRoot(carryAt, INVERSE_MIN_SPEED_MS, maxSpeedMs, lo, hi, 1e-8);
  return Number.isFinite(speed) ? speed : null;
}
