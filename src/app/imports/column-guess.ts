import type { DistanceUnit, KickField, KickUnits, SpeedUnit, SpinUnit } from './import-types';

/** A proposed column for each field (absent when no header looked like it). */
export type ColumnGuess = Partial<Record<KickField, string>>;

/**
 * Words in header names that point at each field, most telling first. Measuring devices name
 * their columns in all sorts of ways ("Ball speed", "V0", "Launch elev."), so this is only a first
 * proposal the coach confirms; the saved per-device mapping is what makes the second import quick.
 * Lateral is tried before carry because "side distance" would otherwise read as a carry.
 */
const FIELD_PATTERNS: readonly (readonly [KickField, RegExp])[] = [
  ['player', /\b(player|kicker|athlete|shirt|name)\b|^(no\.?|#|number)$/i],
  ['time', /\b(time|date|timestamp|recorded|when)\b/i],
  ['speed', /\b(speed|velocity|pace|v0)\b/i],
  ['launchAngle', /\b(launch|angle|elevation|elev)\b/i],
  ['spin', /\b(spin|rpm|rotation)\b/i],
  ['lateral', /\b(lateral|side|sideways|offline|deviation|left\/right)\b/i],
  ['carry', /\b(carry|distance|range|length)\b/i],
];

/**
 * Proposes a column for each field from the header names. A column is proposed for one field
 * only, and a field takes the first column that matches it, in file order.
 */
export function guessColumns(header: readonly string[]): ColumnGuess {
  const guess: ColumnGuess = {};
  const taken = new Set<string>();
  for (const [field, pattern] of FIELD_PATTERNS) {
    const column = header.find((name) => !taken.has(name) && pattern.test(name));
    if (column !== undefined) {
      guess[field] = column;
      taken.add(column);
    }
  }
  return guess;
}

/** The speed unit a header names, e.g. "Ball speed (mph)". */
export function speedUnitIn(name: string): SpeedUnit | null {
  if (/\bmph\b|miles/i.test(name)) return 'mph';
  if (/km\s*\/\s*h|\bkph\b|\bkmh\b/i.test(name)) return 'km/h';
  if (/\bm\s*\/\s*s\b|\bmps\b/i.test(name)) return 'm/s';
  return null;
}

/** The spin unit a header names, e.g. "Spin [rpm]". */
export function spinUnitIn(name: string): SpinUnit | null {
  if (/\brpm\b|per\s+minute/i.test(name)) return 'rpm';
  if (/rev\s*\/\s*s|\brps\b|\bhz\b/i.test(name)) return 'rev/s';
  return null;
}

/** The distance unit a header names, e.g. "Carry (yd)". */
export function distanceUnitIn(name: string): DistanceUnit | null {
  if (/\b(yd|yds|yards?)\b/i.test(name)) return 'yd';
  if (/\((m)\)|\[m\]|\bmetres?\b|\bmeters?\b|\bm$/i.test(name)) return 'm';
  return null;
}

/**
 * Units read from the header names of the chosen columns, falling back to `fallback` (metric
 * unless the coach chose otherwise) for any the headers do not name.
 */
export function guessUnits(columns: ColumnGuess, fallback: KickUnits): KickUnits {
  const distanceColumn = columns.carry ?? columns.lateral;
  return {
    speed: (columns.speed && speedUnitIn(columns.speed)) || fallback.speed,
    spin: (columns.spin && spinUnitIn(columns.spin)) || fallback.spin,
    distance: (distanceColumn && distanceUnitIn(distanceColumn)) || fallback.distance,
  };
}

/** SI units: what Loftline stores, and the default when a file does not say. */
export const METRIC_UNITS: KickUnits = { speed: 'm/s', spin: 'rev/s', distance: 'm' };
