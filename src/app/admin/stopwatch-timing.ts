import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { DEFAULT_TIMING, clubSettingsSchema, type ClubSettings, type ClubSettingsUpdate } from '../../../shared/schemas/club';
import { zodValidator } from '../core/zod-validator';
import { ClubSettingsSection } from './club-settings-section';
import { SectionStatus } from './section-status';

/** The fields of the stopwatch timing form, seconds. */
interface StopwatchTimingFields {
  timingBiasS: number;
  timingSdS: number;
}

/**
 * The club's stopwatch calibration: how much a hand-timed hang time runs long (bias) and how much it
 * varies (spread). The flight model subtracts the bias and carries the spread into every spin it infers
 * from hang time, so a wrong bias shifts every estimate alike; hence the prompt to calibrate from video.
 */
@Component({
  selector: 'll-stopwatch-timing',
  imports: [SectionStatus, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <section class="section__card" aria-labelledby="timing-title">
      <h2 id="timing-title" class="section__title">Pitchside stopwatch timing</h2>
      <p class="section__lead">
        A coach taps once at foot contact and once at the first bounce. The second tap usually lags by a reaction time, so a reading runs
        long. The defaults ({{ defaults.biasS }} s bias, {{ defaults.sdS }} s spread) are common practice, not a measurement: calibrate them
        by timing a few kicks on Pitchside while filming them, then reading the true contact and bounce frames from your own video. Enter
        the mean of (tapped − filmed) as the bias and its standard deviation as the spread.
      </p>
      <form class="section__form" [formGroup]="form" (ngSubmit)="save()" aria-label="Stopwatch timing">
        <mat-form-field appearance="outline">
          <mat-label>Timing bias</mat-label>
          <input matInput type="number" step="0.01" formControlName="timingBiasS" />
          <span matTextSuffix>s</span>
          <mat-hint>Subtracted from every reading (0–1 s)</mat-hint>
          @if (form.controls.timingBiasS.errors; as errors) {
            <mat-error>{{ errors['server'] ?? errors['schema'] ?? 'Enter the bias in seconds' }}</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Timing spread (one standard deviation)</mat-label>
          <input matInput type="number" step="0.01" formControlName="timingSdS" />
          <span matTextSuffix>s</span>
          <mat-hint>How much readings vary (0.01–0.5 s)</mat-hint>
          @if (form.controls.timingSdS.errors; as errors) {
            <mat-error>{{ errors['server'] ?? errors['schema'] ?? 'Enter the spread in seconds' }}</mat-error>
          }
        </mat-form-field>
        <div class="section__form-actions">
          <button mat-flat-button type="submit" [disabled]="saving.pending()">{{ saving.pending() ? 'Saving…' : 'Save timing' }}</button>
        </div>
      </form>
      <ll-section-status [action]="saving" doneText="Saved. Spin estimates from hang time now use these values." />
    </section>
  `,
  styleUrl: './admin-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StopwatchTiming extends ClubSettingsSection<StopwatchTimingFields> {
  protected readonly defaults = DEFAULT_TIMING;
  protected readonly form = inject(NonNullableFormBuilder).group({
    timingBiasS: [this.store.settings().timingBiasS, [Validators.required, zodValidator(clubSettingsSchema.shape.timingBiasS)]],
    timingSdS: [this.store.settings().timingSdS, [Validators.required, zodValidator(clubSettingsSchema.shape.timingSdS)]],
  });

  protected fromSettings(settings: ClubSettings): StopwatchTimingFields {
    return { timingBiasS: settings.timingBiasS, timingSdS: settings.timingSdS };
  }

  protected toUpdate(value: StopwatchTimingFields): ClubSettingsUpdate {
    return value;
  }
}
