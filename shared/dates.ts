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

/**
 * One formatter per time zone, kept: building an `Intl.DateTimeFormat` costs about a hundred times more
 * than using one, and a 50,000-row device file asks for the same zone twice per row.
 */
const zoneFormatters = new Map<string, Intl.DateTimeFormat>();

function zoneFormatter(timeZone: string): Intl.DateTimeFormat {
  let format = zoneFormatters.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-GB', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
    zoneFormatters.set(timeZone, format);
  }
  return format;
}

/** Offset of `timeZone` from UTC at the instant `utcMs`, in milliseconds (from the IANA data the runtime ships). */
function zoneOffsetMs(utcMs: number, timeZone: string): number {
  const parts = zoneFormatter(timeZone).formatToParts(new Date(utcMs));
  const get = (type: string): number => Number(parts.find((p) => p.type === type)?.value ?? 0);
  const asUtc = Date.UTC(get('year'), get('month') - 1, get('day'), get('hour'), get('minute'), get('second'));
  return asUtc - Math.floor(utcMs / 1000) * 1000;
}

/**
 * A device's date and time as an instant. With an explicit offset or `Z` it is taken as written; a bare
 * wall-clock time ("2026-11-30 18:05:10") is read in `timeZone` (the club's), so an export made on a
 * pitch in winter and one in summer both land on the right hour. Null when it is not a date and time.
 */
export function parseLocalDateTime(text: string, timeZone: string): Date | null {
  const s = text.trim().replace(' ', 'T');
  if (/([zZ]|[+-]\d{2}:?\d{2})$/.test(s)) {
    const t = Date.parse(s);
    return Number.isNaN(t) ? null : new Date(t);
  }
  const m = /^(\d{4})-(\d{2})-(\d{2})(?:T(\d{2}):(\d{2})(?::(\d{2})(?:\.(\d{1,3}))?)?)?$/.exec(s);
  if (!m) return null;
  const [year, month, day, hour, minute, second, ms] = m.slice(1).map((v) => (v === undefined ? 0 : Number(v))) as number[];
  const wall = Date.UTC(year!, month! - 1, day!, hour!, minute!, second!, ms!);
  const probe = new Date(wall);
  if (probe.getUTCMonth() !== month! - 1 || probe.getUTCDate() !== day! || hour! > 23 || minute! > 59 || second! > 59) return null;
  // Two passes: the offset at the guessed instant, then at the corrected one (right across a DST change).
  let utc = wall - zoneOffsetMs(wall, timeZone);
  utc = wall - zoneOffsetMs(utc, timeZone);
  return new Date(utc);
}
