import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { DateAdapter, MAT_DATE_LOCALE, MAT_NATIVE_DATE_FORMATS, provideNativeDateAdapter } from '@angular/material/core';
import { type MatDatepickerInputEvent, MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { addWeeks, localDate, localDay, mondayOf, weekRangeLabel } from './week-dates';
import { ClubFormat } from '../core/club-format';

/**
 * Picks the ISO week to review: a step back or forward, or any day in a calendar (the week that
 * contains it is taken). Weeks after `latest` cannot be picked, since they have not happened.
 */
@Component({
  selector: 'll-week-picker',
  imports: [MatButtonModule, MatDatepickerModule, MatFormFieldModule, MatIconModule, MatInputModule],
  providers: [
    // The club's locale: its date order in the field and its first day of the week in the calendar
    // (the native adapter reads CLDR week data through Intl.Locale). Review weeks stay ISO weeks, Monday first.
    { provide: MAT_DATE_LOCALE, useFactory: () => inject(ClubFormat).format().locale },
    provideNativeDateAdapter({
      ...MAT_NATIVE_DATE_FORMATS,
      display: { ...MAT_NATIVE_DATE_FORMATS.display, dateInput: { day: 'numeric', month: 'short', year: 'numeric' } },
    }),
  ],
  template: `
    <button mat-icon-button type="button" (click)="step(-1)" aria-label="Previous week">
      <mat-icon aria-hidden="true">chevron_left</mat-icon>
    </button>
    <mat-form-field appearance="outline" subscriptSizing="dynamic" class="week-picker__field">
      <mat-label>Week of</mat-label>
      <input matInput [matDatepicker]="picker" [value]="date()" [max]="maxDate()" (dateChange)="pick($event)" />
      <mat-datepicker-toggle matIconSuffix [for]="picker" aria-label="Open the calendar" />
      <mat-datepicker #picker [startAt]="date()" />
    </mat-form-field>
    <button mat-icon-button type="button" (click)="step(1)" [disabled]="atLatest()" aria-label="Next week">
      <mat-icon aria-hidden="true">chevron_right</mat-icon>
    </button>
    <span class="week-picker__range">{{ range() }}</span>
  `,
  styles: `
    :host {
      display: inline-flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 4px;
    }
    .week-picker__field {
      width: 180px;
    }
    .week-picker__range {
      flex-basis: 100%;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      padding-inline: 52px 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WeekPicker {
  /** Monday of the week shown (YYYY-MM-DD). */
  readonly week = input.required<string>();
  /** Monday of the latest week that may be picked. */
  readonly latest = input.required<string>();
  /** Emits the Monday of the newly picked week. */
  readonly weekChange = output<string>();

  protected readonly date = computed(() => localDate(this.week()));
  protected readonly maxDate = computed(() => {
    const sunday = localDate(this.latest());
    sunday.setDate(sunday.getDate() + 6);
    return sunday;
  });
  protected readonly atLatest = computed(() => this.week() >= this.latest());
  private readonly fmt = inject(ClubFormat).format;
  protected readonly range = computed(() => weekRangeLabel(this.week(), this.fmt()));

  constructor() {
    const adapter = inject<DateAdapter<Date>>(DateAdapter);
    effect(() => adapter.setLocale(this.fmt().locale));
  }

  protected step(weeks: number): void {
    const next = addWeeks(this.week(), weeks);
    if (next <= this.latest()) {
      this.weekChange.emit(next);
    }
  }

  protected pick(event: MatDatepickerInputEvent<Date>): void {
    if (!event.value) return;
    const monday = mondayOf(new Date(`${localDay(event.value)}T12:00:00Z`));
    if (monday !== this.week() && monday <= this.latest()) {
      this.weekChange.emit(monday);
    }
  }
}
