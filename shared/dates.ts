/**
 * Calendar helpers on ISO dates (YYYY-MM-DD, UTC) used by both sides: ISO weeks start on
 * Monday (ISO 8601), and a player is an adult from their 18th birthday (common practice;
 * local law decides).
 */

const DAY_MS = 86_400_000;

/** `date` plus `days` days. */
export function addDays(date: string, days: number): string {
  return new Date(Date.parse(date + 'T00:00:00Z') + days * DAY_MS).toISOString().slice(0, 10);
}

/** Monday of the ISO week containing `date`. */
export function isoWeekStart(date: string): string {
  const shift = (new Date(date + 'T00:00:00Z').getUTCDay() + 6) % 7;
  return addDays(date, -shift);
}

/** Age at which youth-data rules stop applying (common practice; local law decides). */
export const ADULT_AGE_YEARS = 18;

/** Whether someone born on `birthDate` is an adult on `day`; no birth date counts as adult. */
export function isAdultOn(birthDate: string | null, day: string): boolean {
  if (!birthDate) return true;
  const b = new Date(birthDate + 'T00:00:00Z');
  const adult = new Date(Date.UTC(b.getUTCFullYear() + ADULT_AGE_YEARS, b.getUTCMonth(), b.getUTCDate())).toISOString().slice(0, 10);
  return adult <= day;
}
