/*
 * Number and date wording shared by the charts and their table alternatives, so a value reads
 * the same in the drawing, in its tooltip and in the table beside it — in the club's distance
 * unit and locale (`QuantityFormat`, from `ClubFormat`).
 */
import type { QuantityFormat } from '../../../../shared/quantity-format';

/** What a chart's values measure: metres, or a share between 0 and 1 shown as a percentage. */
export type ValueKind = 'metres' | 'share';

/** A value as the charts print it: "31.4 m", "34,3 yd" or "62 %"; an en dash for a missing value. */
export function formatValue(value: number | null | undefined, kind: ValueKind, f: QuantityFormat): string {
  if (value === null || value === undefined || !Number.isFinite(value)) {
    return '–';
  }
  return kind === 'metres' ? f.distance(value, 1) : f.percent(value);
}

/** A range such as "28.0–33.5 m" or "40–71 %"; an en dash when either end is missing. */
export function formatRange(low: number | null | undefined, high: number | null | undefined, kind: ValueKind, f: QuantityFormat): string {
  if (low === null || low === undefined || high === null || high === undefined) {
    return '–';
  }
  return kind === 'metres' ? f.distanceRange(low, high, 1) : `${f.number(Math.round(low * 100), 0)}–${f.percent(high)}`;
}

/** A metres value in the club's unit for a chart's scale (shares pass through). */
export function scaleValue(value: number, kind: ValueKind, f: QuantityFormat): number {
  return kind === 'metres' ? f.toUnit(value) : value;
}

/** The Monday of an ISO week (YYYY-MM-DD, UTC) as a short label, e.g. "3 Mar" (the club's locale). */
export function weekLabel(weekStart: string, f: QuantityFormat): string {
  return f.day(weekStart);
}

/** The UTC midnight of a YYYY-MM-DD date. */
export function weekDate(weekStart: string): Date {
  return new Date(`${weekStart}T00:00:00Z`);
}
