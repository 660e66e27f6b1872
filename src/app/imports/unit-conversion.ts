import type { DistanceUnit, SpeedUnit, SpinUnit } from './import-types';

/*
 * Conversions for the mapping step's "how the first rows will read" check, so a coach who picks
 * the wrong unit sees a 90 m/s kick before importing it. The server converts on its own; these
 * use the same exact definitions: the international yard and pound agreement (1959) fixes
 * 1 yd = 0.9144 m, so 1 mph = 1760 × 0.9144 m / 3600 s = 0.44704 m/s; 1 km/h = 1000 m / 3600 s;
 * 1 rpm = 1/60 rev/s.
 */

/** Metres in one international yard (exact). */
export const METRES_PER_YARD = 0.9144;
/** Metres per second in one mile per hour (exact). */
export const MS_PER_MPH = (1760 * METRES_PER_YARD) / 3600;

/** A speed in m/s. */
export function toMetresPerSecond(value: number, unit: SpeedUnit): number {
  return unit === 'm/s' ? value : unit === 'km/h' ? value / 3.6 : value * MS_PER_MPH;
}

/** A spin rate in rev/s. */
export function toRevsPerSecond(value: number, unit: SpinUnit): number {
  return unit === 'rev/s' ? value : value / 60;
}

/** A distance in metres. */
export function toMetres(value: number, unit: DistanceUnit): number {
  return unit === 'm' ? value : value * METRES_PER_YARD;
}

/**
 * A cell's number, or null for an empty cell or anything that is not a number. A file separated
 * by semicolons comes from a spreadsheet set to a decimal comma ("24,5"), and is read that way, as
 * the server reads it.
 */
export function parseDeviceNumber(raw: string, decimalComma = false): number | null {
  const text = raw.trim();
  if (text === '') return null;
  const value = Number(decimalComma ? text.replace(',', '.') : text);
  return Number.isFinite(value) ? value : null;
}
