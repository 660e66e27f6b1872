/**
 * Input guards. Bad input must fail loudly with a RangeError naming the field, never turn into NaN
 * somewhere downstream.
 */

/** Throws a RangeError naming `field` unless `value` is a finite number within [min, max]. */
export function requireInRange(field: string, value: unknown, min: number, max: number, unit = ''): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < min || value > max) {
    throw new RangeError(`${field} must be a finite number in [${min}, ${max}]${unit ? ' ' + unit : ''} (got ${String(value)})`);
  }
  return value;
}

/** Throws a RangeError naming `field` unless `value` is finite and lo < value ≤ hi. */
export function requireInHalfOpen(field: string, value: unknown, lo: number, hi: number, unit = ''): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= lo || value > hi) {
    throw new RangeError(`${field} must be a finite number in (${lo}, ${hi}]${unit ? ' ' + unit : ''} (got ${String(value)})`);
  }
  return value;
}

/** Throws a RangeError naming `field` unless `value` is a finite number. */
export function requireFinite(field: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${field} must be a finite number (got ${String(value)})`);
  }
  return value;
}

/** Throws a RangeError naming `field` unless `value` is an integer within [min, max]. */
export function requireInteger(field: string, value: unknown, min: number, max: number): number {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min || value > max) {
    throw new RangeError(`${field} must be an integer in [${min}, ${max}] (got ${String(value)})`);
  }
  return value;
}

/** Throws a RangeError naming `field` unless `value` is one of `allowed`. */
export function requireOneOf<T extends string>(field: string, value: unknown, allowed: readonly T[]): T {
  if (typeof value !== 'string' || !(allowed as readonly string[]).includes(value)) {
    throw new RangeError(`${field} must be one of ${allowed.join(', ')} (got ${String(value)})`);
  }
  return value as T;
}

/** Limits applied to kick inputs; exported so forms can show the same bounds. */
export const LIMITS = {
  speedMs: [0, 60],
  elevationDeg: [-10, 90],
  azimuthDeg: [-90, 90],
  spinRps: [-30, 30],
  massKg: [0.2, 0.6],
  radiusM: [0.08, 0.13],
  densityKgM3: [0.5, 1.5],
  temperatureC: [-40, 50],
  altitudeM: [-500, 11000],
  relativeHumidityPct: [0, 100],
  pressureHpa: [500, 1100],
  windSpeedMs: [0, 40],
  windHeightM: [0.5, 100],
  dragCrisisRe: [1e5, 5e5],
  dragConstant: [0, 2],
  liftConstant: [-1.5, 1.5],
  spinDecayTauS: [0.5, 1e6],
  maxPlanes: 32,
} as const;
