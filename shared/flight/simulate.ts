/**
 * `simulateKick`: the public forward model. Validates the kick, builds its equations of motion and
 * integrates them; everything else in shared/flight is built on this call.
 */

import { DEFAULT_SOLVER_SETTINGS, integrateFlight, type SolverSettings, type VerticalPlane } from './integrate';
import { modelFromKick } from './model';
import type { Flight, KickInput } from './types';
import { LIMITS, requireInHalfOpen } from './validate';

function planesFrom(input: KickInput): VerticalPlane[] {
  if (input.planes === undefined) return [];
  if (!Array.isArray(input.planes) || input.planes.length > LIMITS.maxPlanes) {
    throw new RangeError(`planes must be an array of at most ${LIMITS.maxPlanes} distances`);
  }
  return input.planes.map((x, i) => ({ nx: 1, ny: 0, d: requireInHalfOpen(`planes[${i}]`, x, 0, 1000, 'm') }));
}

/**
 * Simulate one kick: carry, landing point, flight time, apex, landing speed, plane crossings and
 * (with `path: true`) the path every 20 ms. Throws RangeError naming the field for bad input.
 * `settings` is for tests and benchmarks that need a tighter or looser integration.
 */
export function simulateKick(input: KickInput, settings: Readonly<SolverSettings> = DEFAULT_SOLVER_SETTINGS): Flight {
  const model = modelFromKick(input);
  const flight = integrateFlight(model, { planes: planesFrom(input), path: input.path === true, settings });
  return {
    carryM: flight.carryM,
    landing: flight.landing,
    flightTimeS: flight.flightTimeS,
    apexM: flight.apexM,
    apexXM: flight.apexXM,
    apexTimeS: flight.apexTimeS,
    landingSpeedMs: flight.landingSpeedMs,
    crossings: flight.crossings,
    path: flight.path,
    landed: flight.landed,
    rhsEvaluations: flight.rhsEvaluations,
  };
}
