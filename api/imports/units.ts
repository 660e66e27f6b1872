/**
 * Unit conversions for device exports, from exact definitions: the international yard and
 * pound agreement (1959) fixes 1 yd = 0.9144 m and so 1 mph = 1609.344 m / 3600 s = 0.44704 m/s;
 * 1 km/h = 1000 m / 3600 s; 1 rpm = 1/60 rev/s.
 */

/** Speed units a device may export. */
export type SpeedUnit = 'm/s' | 'km/h' | 'mph';
/** Spin units a device may export. */
export type SpinUnit = 'rev/s' | 'rpm';
/** Distance units a device may export. */
export type DistanceUnit = 'm' | 'yd';

/** Metres in one international yard (exact). */
export const METRES_PER_YARD = 0.9144;
/** Metres per second in one mile per hour (exact: 1760 yd per mile). */
export const MS_PER_MPH = (1760 * METRES_PER_YARD) / 3600;

/** Converts a speed to m/s. */
export function speedToMs(value: number, unit: SpeedUnit): number {
  return unit === 'm/s' ? value : unit === 'km/h' ? value / 3.6 : value * MS_PER_MPH;
}

/** Converts a spin rate to rev/s. */
export function spinToRps(value: number, unit: SpinUnit): number {
  return unit === 'rev/s' ? value : value / 60;
}

/** Converts a distance to metres. */
export function distanceToM(value: number, unit: DistanceUnit): number {
  return unit === 'm' ? value : value * METRES_PER_YARD;
}
