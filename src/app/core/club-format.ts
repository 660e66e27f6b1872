import { DOCUMENT } from '@angular/common';
import { Injectable, computed, effect, inject } from '@angular/core';
import { QuantityFormat, parseDecimal } from '../../../shared/quantity-format';
import { distanceToM } from '../../../shared/units';
import { ClubSettingsStore } from './club-settings-store';
import { setDateLabelLocale } from './date-labels';

/**
 * The club's way of writing numbers, distances, dates and times, for every screen: a signal holding the
 * shared `QuantityFormat` for the club's distance unit and locale (from `ClubSettingsStore`, cached on the
 * device so a pitch without signal still reads yards and decimal commas). Screens and charts never call
 * `toFixed` or name a locale: they ask this, so a club switching to yards or to `de-DE` changes all of
 * them at once. Storage stays in metres; `toMetres` turns what a coach typed back into SI.
 */
@Injectable({ providedIn: 'root' })
export class ClubFormat {
  private readonly store = inject(ClubSettingsStore);
  private readonly document = inject(DOCUMENT);

  /** The formatter in force: read it inside templates and `computed()` so views follow a change. */
  readonly format = computed(
    () => new QuantityFormat({ locale: this.store.settings().locale, distanceUnit: this.store.settings().distanceUnit }),
  );
  /** The distance unit's symbol ("m" or "yd"), for field suffixes and axis titles. */
  readonly unit = computed(() => this.format().unit);

  constructor() {
    // Screen readers and the browser's own widgets (number spinners, hyphenation) follow the page language.
    effect(() => {
      const locale = this.format().locale;
      this.document.documentElement.setAttribute('lang', locale);
      setDateLabelLocale(locale);
    });
  }

  /** Fetches the club's settings (a failure keeps the cached ones). */
  refresh(): Promise<void> {
    return this.store.refresh();
  }

  /** A distance typed in the club's unit (either decimal mark) as metres; null when blank, NaN when not a number. */
  toMetres(text: string): number | null {
    const value = parseDecimal(text);
    return value === null || Number.isNaN(value) ? value : distanceToM(value, this.format().distanceUnit);
  }

  /** Metres as the text a field in the club's unit starts with ("32,8" in de-DE); up to 2 decimals. */
  fieldText(valueM: number | null | undefined): string {
    if (valueM === null || valueM === undefined) return '';
    return this.format().number(this.format().toUnit(valueM), 2);
  }
}
