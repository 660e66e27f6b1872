import { InjectionToken } from '@angular/core';

/** The clock the export screen's default range starts from; specs give a fixed day. */
export const EXPORT_CLOCK = new InjectionToken<() => Date>('EXPORT_CLOCK', {
  providedIn: 'root',
  factory: () => () => new Date(),
});

/**
 * A day as YYYY-MM-DD in the device's own time zone: what a coach means by "today", and what a
 * date field holds. (`toISOString()` would give yesterday's date late in the evening west of UTC.)
 */
export function localDate(at: Date): string {
  const pad = (n: number): string => String(n).padStart(2, '0');
  return `${at.getFullYear()}-${pad(at.getMonth() + 1)}-${pad(at.getDate())}`;
}

/** The local day `days` days before `at`, as YYYY-MM-DD. */
export function daysBefore(at: Date, days: number): string {
  const earlier = new Date(at.getFullYear(), at.getMonth(), at.getDate() - days, 12);
  return localDate(earlier);
}
