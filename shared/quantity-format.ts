/**
 * How the club reads numbers, distances, dates and times: one formatter for the screens, the mail and the
 * exports, so "31,4 yd" on a phone and in a Family digest come from the same code. Values arrive in SI
 * (metres) and leave in the club's distance unit and BCP 47 locale, through `Intl` (the decimal separator,
 * digit grouping, the 12- or 24-hour clock and the first day of the week are the locale's, from CLDR).
 * No Angular, Express or Node imports: both sides use it.
 */
import { DISTANCE_UNIT_WORDS, metresTo, type DistanceUnit } from './units';

/** The locale a club starts with (and the demo uses): British English writes day-month-year and a 24-hour clock. */
export const DEFAULT_LOCALE = 'en-GB';

/** What a formatter needs to know about the club. */
export interface FormatSettings {
  /** BCP 47 language tag, e.g. `en-GB`, `de-DE`, `en-US`. */
  readonly locale: string;
  /** The unit distances are shown in (storage stays metres). */
  readonly distanceUnit: DistanceUnit;
}

/** The canonical form of a BCP 47 tag the runtime can format with, or null when it is not one. */
export function canonicalLocale(tag: string): string | null {
  try {
    const [canonical] = Intl.getCanonicalLocales(tag);
    if (!canonical) return null;
    return Intl.NumberFormat.supportedLocalesOf([canonical]).length > 0 ? canonical : null;
  } catch {
    return null;
  }
}

/** Week information as V8 exposes it (a method in newer engines, a getter in older ones). */
interface WeekInfo {
  readonly firstDay: number;
}
type LocaleWithWeekInfo = Intl.Locale & { getWeekInfo?: () => WeekInfo; weekInfo?: WeekInfo };

/** Formats quantities for one club's locale and distance unit. Cheap to keep: `Intl` formatters are cached per shape. */
export class QuantityFormat {
  /** The canonical locale in force (falls back to {@link DEFAULT_LOCALE} for a tag the runtime cannot format). */
  readonly locale: string;
  /** The distance unit in force. */
  readonly distanceUnit: DistanceUnit;
  /** The distance unit's symbol, e.g. "m" or "yd". */
  readonly unit: string;
  /** The distance unit's plural word, e.g. "metres" or "yards". */
  readonly unitWord: string;
  private readonly numbers = new Map<string, Intl.NumberFormat>();
  private readonly dates = new Map<string, Intl.DateTimeFormat>();

  constructor(settings: FormatSettings) {
    this.locale = canonicalLocale(settings.locale) ?? DEFAULT_LOCALE;
    this.distanceUnit = settings.distanceUnit;
    this.unit = DISTANCE_UNIT_WORDS[settings.distanceUnit].symbol;
    this.unitWord = DISTANCE_UNIT_WORDS[settings.distanceUnit].plural;
  }

  /** A plain number with exactly `digits` decimals (the locale's separator), e.g. "31,4"; "–" when missing. */
  fixed(value: number | null | undefined, digits = 1): string {
    if (value === null || value === undefined || !Number.isFinite(value)) return '–';
    return this.numberFormat(digits, digits).format(value);
  }

  /** A plain number with at most `maxDigits` decimals and no trailing zeros, e.g. "27,5" or "30". */
  number(value: number | null | undefined, maxDigits = 2): string {
    if (value === null || value === undefined || !Number.isFinite(value)) return '–';
    return this.numberFormat(0, maxDigits).format(value);
  }

  /** A share between 0 and 1 as whole per cent, e.g. "62 %". */
  percent(share: number | null | undefined): string {
    if (share === null || share === undefined || !Number.isFinite(share)) return '–';
    return `${this.number(Math.round(share * 100), 0)} %`;
  }

  /** Metres converted to the club's unit, as a number (charts scale with it). */
  toUnit(valueM: number): number {
    return metresTo(valueM, this.distanceUnit);
  }

  /** A distance given in metres, in the club's unit with `digits` decimals, e.g. "34,3 yd". */
  distance(valueM: number | null | undefined, digits = 1): string {
    if (valueM === null || valueM === undefined || !Number.isFinite(valueM)) return '–';
    return `${this.fixed(this.toUnit(valueM), digits)} ${this.unit}`;
  }

  /**
   * A distance set by people (a drill's target, a radius), in the club's unit without trailing zeros:
   * 30 m reads "30 m", and in yards "32,8 yd".
   */
  round(valueM: number | null | undefined, maxDigits = 1): string {
    if (valueM === null || valueM === undefined || !Number.isFinite(valueM)) return '–';
    return `${this.number(this.toUnit(valueM), maxDigits)} ${this.unit}`;
  }

  /** A range of distances in metres, e.g. "28,0–33,5 m"; "–" when either end is missing. */
  distanceRange(lowM: number | null | undefined, highM: number | null | undefined, digits = 1): string {
    if (lowM === null || lowM === undefined || highM === null || highM === undefined) return '–';
    return `${this.fixed(this.toUnit(lowM), digits)}–${this.fixed(this.toUnit(highM), digits)} ${this.unit}`;
  }

  /** A date and/or time with the given `Intl` fields (the locale decides order, separators and the clock). */
  dateTime(value: string | number | Date, options: Intl.DateTimeFormatOptions): string {
    const date = value instanceof Date ? value : new Date(value);
    if (Number.isNaN(date.getTime())) return '–';
    const key = JSON.stringify(options);
    let format = this.dates.get(key);
    if (!format) {
      format = new Intl.DateTimeFormat(this.locale, options);
      this.dates.set(key, format);
    }
    return format.format(date);
  }

  /** A calendar day given as YYYY-MM-DD (UTC midnight), e.g. "3 Mar" / "3. März"; `year` adds the year. */
  day(isoDate: string, withYear = false): string {
    return this.dateTime(`${isoDate.slice(0, 10)}T00:00:00Z`, {
      day: 'numeric',
      month: 'short',
      ...(withYear ? { year: 'numeric' as const } : {}),
      timeZone: 'UTC',
    });
  }

  /** A clock time, hours and minutes (24-hour where the locale uses it). */
  time(value: string | number | Date, withSeconds = false): string {
    return this.dateTime(value, { hour: '2-digit', minute: '2-digit', ...(withSeconds ? { second: '2-digit' as const } : {}) });
  }

  /** The first day of the locale's week, 1 = Monday … 7 = Sunday (CLDR week data; Monday when the runtime has none). */
  firstDayOfWeek(): number {
    try {
      const locale = new Intl.Locale(this.locale) as LocaleWithWeekInfo;
      return (locale.getWeekInfo?.() ?? locale.weekInfo)?.firstDay ?? 1;
    } catch {
      return 1;
    }
  }

  private numberFormat(minDigits: number, maxDigits: number): Intl.NumberFormat {
    const key = `${minDigits}:${maxDigits}`;
    let format = this.numbers.get(key);
    if (!format) {
      format = new Intl.NumberFormat(this.locale, { minimumFractionDigits: minDigits, maximumFractionDigits: maxDigits });
      this.numbers.set(key, format);
    }
    return format;
  }
}

/** Reads a decimal as typed on a phone in any locale: blank is null, one comma or point is the decimal mark. */
export function parseDecimal(text: string): number | null {
  const trimmed = text.trim().replace(/\s/g, '').replace(',', '.');
  return trimmed === '' ? null : Number(trimmed);
}
