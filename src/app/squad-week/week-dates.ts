import type { QuantityFormat } from '../../../shared/quantity-format';
import { InjectionToken } from '@angular/core';

/*
 * ISO weeks as Squad week picks them: a week is named by its Monday (YYYY-MM-DD, UTC), as the
 * server groups sessions.
 */

const DAY_MS = 86_400_000;

/** The Monday (YYYY-MM-DD, UTC) of the ISO week that contains `date`. */
export function mondayOf(date: Date): string {
  const midnight = Math.floor(date.getTime() / DAY_MS) * DAY_MS;
  const weekday = (new Date(midnight).getUTCDay() + 6) % 7; // Monday = 0
  return new Date(midnight - weekday * DAY_MS).toISOString().slice(0, 10);
}

/** The Monday `weeks` weeks after (or before, when negative) `monday`. */
export function addWeeks(monday: string, weeks: number): string {
  return new Date(new Date(`${monday}T00:00:00Z`).getTime() + weeks * 7 * DAY_MS).toISOString().slice(0, 10);
}

/**
 * The week a review opens on: the last complete ISO week before `now`, since the week under way
 * is usually only half trained.
 */
export function lastCompleteWeek(now: Date): string {
  return addWeeks(mondayOf(now), -1);
}

/** Whether a string is a Monday in YYYY-MM-DD form. */
export function isMonday(value: string | null | undefined): value is string {
  if (!value || !/^\d{4}-\d{2}-\d{2}$/.test(value)) return false;
  const d = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === value && d.getUTCDay() === 1;
}

/** "3 Mar – 9 Mar 2025" (in the club's locale) for the week starting on `monday` (the year once, at the end, unless the week spans two). */
export function weekRangeLabel(monday: string, f: QuantityFormat): string {
  const start = new Date(`${monday}T00:00:00Z`);
  const end = new Date(start.getTime() + 6 * DAY_MS);
  const endDay = end.toISOString().slice(0, 10);
  const first = f.day(monday, start.getUTCFullYear() !== end.getUTCFullYear());
  return `${first} – ${f.day(endDay, true)}`;
}

/** The clock Squad week opens on (a token so specs can fix "today"). */
export const REVIEW_CLOCK = new InjectionToken<() => Date>('REVIEW_CLOCK', {
  providedIn: 'root',
  factory: () => () => new Date(),
});

/** The local calendar day of a date picked in the browser, as YYYY-MM-DD. */
export function localDay(date: Date): string {
  return new Date(Date.UTC(date.getFullYear(), date.getMonth(), date.getDate())).toISOString().slice(0, 10);
}

/** A YYYY-MM-DD day as a local-midnight Date, for the date picker. */
export function localDate(day: string): Date {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number];
  return new Date(y, m - 1, d);
}
