/**
 * Date arithmetic for the demo scenario: which eight ISO weeks it covers, when each squad
 * trains, and player birth dates relative to the load date.
 *
 * Everything works in UTC milliseconds except training times, which a club sets in local
 * (Europe/London) time; they are converted with the UK summer-time rule so an evening session
 * stays at 18:30 on the clock across the change in late March and late October.
 */

/** Milliseconds in one day. */
export const DAY_MS = 86_400_000;

/** Number of ISO weeks the demo scenario covers. */
export const DEMO_WEEKS = 8;

/** The span of training the scenario generates: eight complete ISO weeks (Monday–Sunday, UTC). */
export interface DemoPeriod {
  /** Monday 00:00 UTC of the first week. */
  firstWeekStart: Date;
  /** Monday 00:00 UTC after the last week (exclusive end; the Monday of `now`'s own week). */
  periodEnd: Date;
  /** Monday 00:00 UTC of each of the eight weeks, oldest first. */
  weekStarts: Date[];
}

/** Monday 00:00 UTC of the ISO week containing `date`. */
export function isoWeekStartUtc(date: Date): Date {
  const midnightMs = Math.floor(date.getTime() / DAY_MS) * DAY_MS;
  const isoWeekday = ((new Date(midnightMs).getUTCDay() + 6) % 7) + 1; // Monday = 1 … Sunday = 7
  return new Date(midnightMs - (isoWeekday - 1) * DAY_MS);
}

/**
 * The eight weeks ending with the last complete ISO week before `now`: a week that is still
 * running at `now` is never included, so the demo never holds sessions "in the future".
 */
export function demoPeriod(now: Date): DemoPeriod {
  const periodEnd = isoWeekStartUtc(now);
  const firstWeekStart = new Date(periodEnd.getTime() - DEMO_WEEKS * 7 * DAY_MS);
  const weekStarts = Array.from({ length: DEMO_WEEKS }, (_, i) => new Date(firstWeekStart.getTime() + i * 7 * DAY_MS));
  return { firstWeekStart, periodEnd, weekStarts };
}

/** 01:00 UTC on the last Sunday of the given month (0-based): when UK clocks change. */
function lastSundayOneAmUtc(year: number, month: number): number {
  const lastDay = new Date(Date.UTC(year, month + 1, 0));
  const back = lastDay.getUTCDay(); // days since Sunday
  return Date.UTC(year, month, lastDay.getUTCDate() - back, 1);
}

/** Offset of Europe/London from UTC in minutes at the UTC instant (60 in British Summer Time). */
export function londonOffsetMinutes(utcMs: number): number {
  const year = new Date(utcMs).getUTCFullYear();
  const start = lastSundayOneAmUtc(year, 2);
  const end = lastSundayOneAmUtc(year, 9);
  return utcMs >= start && utcMs < end ? 60 : 0;
}

/**
 * The UTC instant of a London wall-clock time on the UTC calendar day `dayStartUtc`.
 * Training never happens in the 01:00–02:00 changeover hour, so no ambiguity arises.
 */
export function londonWallClockToUtc(dayStartUtc: Date, hour: number, minute: number): Date {
  const naiveMs = dayStartUtc.getTime() + (hour * 60 + minute) * 60_000;
  return new Date(naiveMs - londonOffsetMinutes(naiveMs) * 60_000);
}

/** Calendar date (YYYY-MM-DD, UTC) that lies `ageYears` (fractional) before `now`. */
export function birthDateForAge(now: Date, ageYears: number): string {
  const ms = now.getTime() - Math.round(ageYears * 365.2425) * DAY_MS;
  return new Date(ms).toISOString().slice(0, 10);
}

/** Completed years between a YYYY-MM-DD birth date and `now` (UTC calendar). */
export function ageInYears(birthDate: string, now: Date): number {
  const [y, m, d] = birthDate.split('-').map(Number) as [number, number, number];
  let age = now.getUTCFullYear() - y;
  const beforeBirthday = now.getUTCMonth() + 1 < m || (now.getUTCMonth() + 1 === m && now.getUTCDate() < d);
  if (beforeBirthday) age -= 1;
  return age;
}

/** Day of the year (1–366, UTC) for the seasonal temperature curve. */
export function dayOfYearUtc(date: Date): number {
  return Math.floor((date.getTime() - Date.UTC(date.getUTCFullYear(), 0, 1)) / DAY_MS) + 1;
}
