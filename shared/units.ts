/**
 * Unit conversions, from exact definitions, in one place for both sides. Storage and the flight model
 * are SI (metres, m/s); a club may *show* distances in yards. The international yard and pound agreement
 * (1959) fixes 1 yd = 0.9144 m exactly, and so 1 mph = 1760 × 0.9144 m / 3600 s = 0.44704 m/s;
 * 1 km/h = 1000 m / 3600 s; 1 rpm = 1/60 rev/s.
 */

/** Distance units a club may show (and a device may export). */
export type DistanceUnit = 'm' | 'yd';
/** The distance units, in the order a picker lists them. */
export const DISTANCE_UNITS: readonly DistanceUnit[] = ['m', 'yd'];
/** Speed units a device may export. */
export type SpeedUnit = 'm/s' | 'km/h' | 'mph';
/** Spin units a device may export. */
export type SpinUnit = 'rev/s' | 'rpm';

/** Metres in one international yard (exact, by the 1959 agreement). */
export const METRES_PER_YARD = 0.9144;
/** Metres per second in one mile per hour (exact: 1760 yd per mile). */
export const MS_PER_MPH = (1760 * METRES_PER_YARD) / 3600;

/** Words for a distance unit, for labels and messages. */
export const DISTANCE_UNIT_WORDS: Readonly<Record<DistanceUnit, { symbol: string; plural: string }>> = {
  m: { symbol: 'm', plural: 'metres' },
  yd: { symbol: 'yd', plural: 'yards' },
};

/** Converts a distance in `unit` to metres. */
export function distanceToM(value: number, unit: DistanceUnit): number {
  return unit === 'm' ? value : value * METRES_PER_YARD;
}

/** Converts metres to `unit`. */
export function metresTo(valueM: number, unit: DistanceUnit): number {
  return unit === 'm' ? valueM : valueM / METRES_PER_YARD;
}

/** Converts a speed to m/s. */
export function speedToMs(value: number, unit: SpeedUnit): number {
  return unit === 'm/s' ? value : unit === 'km/h' ? value / 3.6 : value * MS_PER_MPH;
}

/** Converts a spin rate to rev/s. */
export function spinToRps(value: number, unit: SpinUnit): number {
  return unit === 'rev/s' ? value : value / 60;
}
