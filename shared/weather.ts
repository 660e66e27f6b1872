/**
 * Weather-service values turned into what the flight model and Pitchside use. Shared, so the server
 * (which answers `GET /api/grounds/:id/conditions`) and the phone (which shows and stores the values)
 * convert the same way.
 *
 * Wind direction follows the meteorological convention (WMO, Guide to Meteorological Instruments and
 * Methods of Observation, WMO-No. 8): the direction the wind blows *from*, in degrees clockwise from
 * true north (90 = an east wind). The flight model's `wind.fromDeg` is relative to the kick instead
 * (docs/design.md §6 axes: x forward, y to the kicker's left): 0 = from the target (headwind), 90 = from the
 * kicker's left, 180 = tailwind, 270 = from the right — i.e. measured counter-clockwise seen from
 * above, while compass bearings run clockwise. Hence the subtraction below runs kicking − wind.
 */

/** Metres per second in one kilometre per hour: exactly 1000 m / 3600 s (SI definition). */
export const MS_PER_KMH = 1000 / 3600;

/** Wind speed in m/s from km/h (exact: 1 km/h = 1000/3600 m/s). */
export function kmhToMs(kmh: number): number {
  return kmh * MS_PER_KMH;
}

/** An angle brought into [0, 360). */
export function normaliseDeg(deg: number): number {
  const d = deg % 360;
  const positive = d < 0 ? d + 360 : d;
  // −0 and floating-point 360 both mean north.
  return positive === 0 || positive >= 360 ? 0 : positive;
}

/**
 * The model's relative wind direction (0 = headwind, 90 = from the kicker's left) from the compass
 * bearing the wind comes from (WMO convention) and the compass bearing the drill kicks towards.
 * Example: a north wind (from 0°) on a pitch kicked towards the east (90°) comes from the kicker's left → 90.
 */
export function relativeWindFromDeg(windFromBearingDeg: number, kickingBearingDeg: number): number {
  return normaliseDeg(kickingBearingDeg - windFromBearingDeg);
}

/** A wind split along and across the kick. */
export interface WindComponents {
  /** Component blowing against the kick, m/s (negative = tailwind). */
  headwindMs: number;
  /** Component blowing from the kicker's left towards the right, m/s (negative = from the right). */
  fromLeftMs: number;
}

/** Splits a wind (speed, relative from-direction as the model takes it) into head and cross components. */
export function windComponents(speedMs: number, relativeFromDeg: number): WindComponents {
  const rad = (relativeFromDeg * Math.PI) / 180;
  // Tidy the last bits so exact quadrants read 0 rather than 3.7e-16.
  const tidy = (v: number): number => (Math.abs(v) < 1e-9 ? 0 : v);
  return { headwindMs: tidy(speedMs * Math.cos(rad)), fromLeftMs: tidy(speedMs * Math.sin(rad)) };
}

/** How a relative wind reads to a coach: the nearest of the four directions the Pitchside taps use. */
export type RelativeWindName = 'headwind' | 'from_left' | 'tailwind' | 'from_right';

/** The nearest of headwind / from the left / tailwind / from the right for a relative direction. */
export function relativeWindName(relativeFromDeg: number): RelativeWindName {
  const names: readonly RelativeWindName[] = ['headwind', 'from_left', 'tailwind', 'from_right'];
  return names[Math.round(normaliseDeg(relativeFromDeg) / 90) % 4];
}
