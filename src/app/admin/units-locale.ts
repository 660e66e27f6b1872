import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { QuantityFormat } from '../../../shared/quantity-format';
import type { ClubSettings, ClubSettingsUpdate } from '../../../shared/schemas/club';
import type { DistanceUnit } from '../../../shared/units';
import { ClubSettingsSection } from './club-settings-section';
import { SectionStatus } from './section-status';

/** The fields of the units and locale form. */
interface UnitsLocaleFields {
  distanceUnit: DistanceUnit;
  locale: string;
}

/** Locales offered in the picker (any BCP 47 tag the browser formats with also round-trips through the API). */
const LOCALES: readonly string[] = [
  'en-GB',
  'en-IE',
  'en-US',
  'en-AU',
  'en-CA',
  'de-DE',
  'de-AT',
  'de-CH',
  'fr-FR',
  'es-ES',
  'it-IT',
  'nl-NL',
  'pt-PT',
  'pt-BR',
  'da-DK',
  'sv-SE',
  'nb-NO',
  'pl-PL',
];

/** A sample moment for the preview: a Tuesday evening session. */
const SAMPLE_AT = '2026-03-03T18:30:00';
const WEEKDAYS = ['', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'];

/**
 * Units and locale of the club: whether every screen, chart, export and mail shows distances in metres or
 * yards (storage stays metres), and the BCP 47 locale that decides the decimal mark, date order, clock and
 * first day of the week. A preview shows what coaches will read before the admin saves.
 */
@Component({
  selector: 'll-units-locale',
  imports: [SectionStatus, ReactiveFormsModule, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatSelectModule],
  template: `
    <section class="section__card" aria-labelledby="units-title">
      <h2 id="units-title" class="section__title">Units and locale</h2>
      <p class="section__lead">
        Distances are stored in metres; this only changes how every screen, chart, export and e-mail shows them. The locale sets the decimal
        mark, how dates and times are written and which day a calendar week starts on.
      </p>
      <form class="section__form" [formGroup]="form" (ngSubmit)="save()" aria-label="Units and locale">
        <mat-button-toggle-group formControlName="distanceUnit" aria-label="Distance unit" hideSingleSelectionIndicator>
          <mat-button-toggle value="m">Metres</mat-button-toggle>
          <mat-button-toggle value="yd">Yards</mat-button-toggle>
        </mat-button-toggle-group>
        <mat-form-field appearance="outline">
          <mat-label>Locale</mat-label>
          <mat-select formControlName="locale">
            @for (tag of locales(); track tag) {
              <mat-option [value]="tag">{{ localeName(tag) }} ({{ tag }})</mat-option>
            }
          </mat-select>
          @if (form.controls.locale.errors?.['server']; as message) {
            <mat-error>{{ message }}</mat-error>
          }
        </mat-form-field>
        <p class="section__lead" aria-live="polite">Preview: {{ preview() }}</p>
        <div class="section__form-actions">
          <button mat-flat-button type="submit" [disabled]="saving.pending()">
            {{ saving.pending() ? 'Saving…' : 'Save units and locale' }}
          </button>
        </div>
      </form>
      <ll-section-status [action]="saving" doneText="Saved. Devices pick it up when they next reach the server." />
    </section>
  `,
  styleUrl: './admin-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnitsLocale extends ClubSettingsSection<UnitsLocaleFields> {
  protected readonly form = inject(NonNullableFormBuilder).group({
    distanceUnit: [this.store.settings().distanceUnit as DistanceUnit, Validators.required],
    locale: [this.store.settings().locale, Validators.required],
  });
  private readonly value = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });

  /** The offered locales, plus the club's own when it is not among them. */
  protected readonly locales = computed(() => {
    const current = this.store.settings().locale;
    return LOCALES.includes(current) ? LOCALES : [current, ...LOCALES];
  });
  protected readonly preview = computed(() => {
    const v = this.value();
    const f = new QuantityFormat({ locale: v.locale ?? 'en-GB', distanceUnit: v.distanceUnit ?? 'm' });
    const when = f.dateTime(SAMPLE_AT, {
      weekday: 'short',
      day: 'numeric',
      month: 'short',
      year: 'numeric',
      hour: '2-digit',
      minute: '2-digit',
    });
    return `a 31.4 m carry reads ${f.distance(31.4)}; a session ${when}; weeks in the calendar start on ${WEEKDAYS[f.firstDayOfWeek()] ?? 'Monday'}.`;
  });

  protected fromSettings(settings: ClubSettings): UnitsLocaleFields {
    return { distanceUnit: settings.distanceUnit, locale: settings.locale };
  }

  protected toUpdate(value: UnitsLocaleFields, current: ClubSettings): ClubSettingsUpdate {
    return { timingBiasS: current.timingBiasS, timingSdS: current.timingSdS, ...value };
  }

  protected localeName(tag: string): string {
    try {
      return new Intl.DisplayNames(['en'], { type: 'language' }).of(tag) ?? tag;
    } catch {
      return tag;
    }
  }
}
