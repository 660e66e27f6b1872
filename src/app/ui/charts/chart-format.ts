/*
 * Number and date wording shared by the charts and their table alternatives, so a value reads
 * the same in the drawing, in its tooltip and in the table beside it.
 */

/** What a chart's values measure: metres, or a share between 0 and 1 shown as a percentage. */
export type ValueKind = 'metres' | 'share';

/** A value as the charts print it: "31.4 m" or "62 %"; an en dash for a missing value. */
export function formatValue(value: number | null | undefined, kind: ValueKind): string {
  if (value === null || value === undefined || !Number.isFinite(value)) {
    return '–';
  }
  return kind === 'metres' ? `${value.toFixed(1)} m` : `${Math.round(value * 100)} %`;
}

/** A range such as "28.0–33.5 m" or "40–71 %"; an en dash when either end is missing. */
export function formatRange(low: number | null | undefined, high: number | null | undefined, kind: ValueKind): string {
  if (low === null || low === undefined || high === null || high === undefined) {
    return '–';
  }
  return kind === 'metres' ? `${low.toFixed(1)}–${high.toFixed(1)} m` : `${Math.round(low * 100)}–${Math.round(high * 100)} %`;
}

const WEEK_LABEL = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });

/** The Monday of an ISO week (YYYY-MM-DD, UTC) as a short label, e.g. "3 Mar". */
export function weekLabel(weekStart: string): string {
  return WEEK_LABEL.format(weekDate(weekStart));
}

/** The UTC midnight of a YYYY-MM-DD date. */
export function weekDate(weekStart: string): Date {
  return new Date(`${weekStart}T00:00:00Z`);
}
