import { ChangeDetectionStrategy, Component, OnInit, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { DEFAULT_TIMING, clubSettingsSchema } from '../../../shared/schemas/club';
import { describeApiError } from '../core/api-error';
import { ClubSettingsStore } from '../core/club-settings-store';
import { zodValidator } from '../core/zod-validator';
import { applyServerErrors } from './server-errors';

/**
 * The club's stopwatch calibration: how much a hand-timed hang time runs long (bias) and how much it
 * varies (spread). The flight model subtracts the bias and carries the spread into every spin it infers
 * from hang time, so a wrong bias shifts every estimate alike; hence the prompt to calibrate from video.
 */
@Component({
  selector: 'll-stopwatch-timing',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
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
          <button mat-flat-button type="submit" [disabled]="pending()">{{ pending() ? 'Saving…' : 'Save timing' }}</button>
        </div>
      </form>
      @if (failure(); as message) {
        <p class="section__message section__message--failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
      }
      @if (saved()) {
        <p class="section__message section__message--ok" role="status">
          <mat-icon aria-hidden="true">check_circle</mat-icon>Saved. Spin estimates from hang time now use these values.
        </p>
      }
    </section>
  `,
  styleUrl: './admin-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StopwatchTiming implements OnInit {
  private readonly store = inject(ClubSettingsStore);

  protected readonly defaults = DEFAULT_TIMING;
  protected readonly pending = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly saved = signal(false);
  protected readonly form = inject(NonNullableFormBuilder).group({
    timingBiasS: [this.store.settings().timingBiasS, [Validators.required, zodValidator(clubSettingsSchema.shape.timingBiasS)]],
    timingSdS: [this.store.settings().timingSdS, [Validators.required, zodValidator(clubSettingsSchema.shape.timingSdS)]],
  });

  async ngOnInit(): Promise<void> {
    await this.store.refresh();
    if (!this.form.dirty) {
      const { timingBiasS, timingSdS } = this.store.settings();
      this.form.setValue({ timingBiasS, timingSdS });
    }
  }

  protected async save(): Promise<void> {
    this.saved.set(false);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.pending.set(true);
    try {
      const value = await this.store.save(this.form.getRawValue());
      this.form.reset(value);
      this.failure.set(null);
      this.saved.set(true);
    } catch (error) {
      this.failure.set(applyServerErrors(this.form, describeApiError(error)));
    } finally {
      this.pending.set(false);
    }
  }
}
