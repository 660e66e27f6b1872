import { ChangeDetectionStrategy, Component, OnInit, inject, input, output, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { kickDataSchema, type Outcome } from '../../../shared/schemas/sync';
import type { DistanceUnit } from '../../../shared/units';
import { ClubFormat } from '../core/club-format';
import type { KickCorrection } from '../core/kick-store';
import type { CachedPlayer, LocalKick } from '../core/loftline-db';
import { metresValidator, optionalMetres } from './metres-field';
import { PAD_OUTCOMES } from './pitchside-labels';
import { OUTCOME_LABELS } from '../../../shared/vocabulary';
import { BackspinControl, CurlControl } from './spin-controls';

/**
 * Corrects one logged repetition — kicker, outcome, spin, landed carry, lateral offset and the
 * stopwatch's hang time (clear it to drop a mistimed reading) — or voids it. Corrections are new mutations; the server keeps the history straight.
 */
@Component({
  selector: 'll-kick-editor',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    BackspinControl,
    CurlControl,
  ],
  template: `
    <form [formGroup]="form" (ngSubmit)="save()" class="editor" aria-label="Correct repetition">
      <mat-form-field appearance="outline">
        <mat-label>Player</mat-label>
        <mat-select formControlName="playerId">
          @for (player of players(); track player.id) {
            <mat-option [value]="player.id">{{ player.shirtNumber ?? '–' }} {{ player.displayName }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-button-toggle-group formControlName="outcome" aria-label="Outcome" class="editor__outcomes" hideSingleSelectionIndicator>
        @for (outcome of outcomes; track outcome) {
          <mat-button-toggle [value]="outcome">{{ outcomeLabels[outcome] }}</mat-button-toggle>
        }
      </mat-button-toggle-group>
      <div class="editor__row">
        <ll-backspin-control name="Spin" [(value)]="backspinStep" />
        <ll-curl-control name="Curl" [(value)]="sidespinStep" />
      </div>
      <div class="editor__row">
        <mat-form-field appearance="outline">
          <mat-label>Carry</mat-label>
          <input matInput inputmode="decimal" formControlName="carry" />
          <span matTextSuffix>{{ fmt().unit }}</span>
          @if (form.controls.carry.errors?.['schema']; as message) {
            <mat-error>{{ message }}</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Lateral (+ left)</mat-label>
          <input matInput inputmode="decimal" formControlName="lateral" />
          <span matTextSuffix>{{ fmt().unit }}</span>
          @if (form.controls.lateral.errors?.['schema']; as message) {
            <mat-error>{{ message }}</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Hang time (blank = not timed)</mat-label>
          <input matInput inputmode="decimal" formControlName="hangTime" />
          <span matTextSuffix>s</span>
          @if (form.controls.hangTime.errors?.['schema']; as message) {
            <mat-error>{{ message }}</mat-error>
          }
        </mat-form-field>
      </div>
      <div class="editor__actions">
        <button mat-button type="button" class="editor__void" (click)="voided.emit()">Void</button>
        <span class="editor__spacer"></span>
        <button mat-button type="button" (click)="cancelled.emit()">Cancel</button>
        <button mat-flat-button type="submit">Save correction</button>
      </div>
    </form>
  `,
  styles: `
    .editor {
      display: flex;
      flex-direction: column;
      gap: 8px;
      padding: 12px;
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-surface-container);
    }
    .editor__outcomes {
      display: grid;
      grid-template-columns: repeat(4, 1fr);
    }
    .editor__outcomes mat-button-toggle {
      min-height: 48px;
    }
    .editor__row {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
    .editor__row mat-form-field {
      flex: 1 1 120px;
    }
    .editor__actions {
      display: flex;
      gap: 8px;
    }
    .editor__actions button {
      min-height: 48px;
    }
    .editor__spacer {
      flex: 1;
    }
    .editor__void {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KickEditor implements OnInit {
  /** The repetition being corrected. */
  readonly kick = input.required<LocalKick>();
  /** The squad's players (the kicker may be corrected). */
  readonly players = input.required<readonly CachedPlayer[]>();
  /** Emits the correction to save. */
  readonly saved = output<KickCorrection>();
  /** Emits when the coach voids the repetition. */
  readonly voided = output<void>();
  /** Emits when the coach closes the editor without saving. */
  readonly cancelled = output<void>();

  protected readonly outcomes = PAD_OUTCOMES;
  protected readonly outcomeLabels = OUTCOME_LABELS;
  protected readonly backspinStep = signal(0);
  protected readonly sidespinStep = signal(0);
  private readonly clubFormat = inject(ClubFormat);
  /** The club's formatter: carry and lateral offset are typed in its distance unit. */
  protected readonly fmt = this.clubFormat.format;
  private readonly unitWord = (): string => this.fmt().unitWord;
  private readonly distanceUnit = (): DistanceUnit => this.fmt().distanceUnit;
  protected readonly form = inject(NonNullableFormBuilder).group({
    playerId: [''],
    outcome: ['on_target' as Outcome],
    carry: ['', metresValidator(kickDataSchema.shape.carryM, this.unitWord, this.distanceUnit)],
    lateral: ['', metresValidator(kickDataSchema.shape.lateralM, this.unitWord, this.distanceUnit)],
    hangTime: ['', metresValidator(kickDataSchema.shape.hangTimeS, 'seconds')],
  });

  ngOnInit(): void {
    const kick = this.kick();
    this.form.setValue({
      playerId: kick.playerId,
      outcome: kick.outcome,
      carry: this.clubFormat.fieldText(kick.carryM),
      lateral: this.clubFormat.fieldText(kick.lateralM),
      hangTime: kick.hangTimeS === null || kick.hangTimeS === undefined ? '' : String(kick.hangTimeS),
    });
    this.backspinStep.set(kick.backspinStep);
    this.sidespinStep.set(kick.sidespinStep);
  }

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    this.saved.emit({
      playerId: value.playerId,
      outcome: value.outcome,
      backspinStep: this.backspinStep(),
      sidespinStep: this.sidespinStep(),
      carryM: this.distanceOf(value.carry, this.kick().carryM),
      lateralM: this.distanceOf(value.lateral, this.kick().lateralM),
      hangTimeS: optionalMetres(value.hangTime),
    });
  }

  /** Metres for a distance field; an untouched field keeps the stored value exactly (no unit round trip). */
  private distanceOf(text: string, storedM: number | null | undefined): number | null {
    if (text === this.clubFormat.fieldText(storedM)) return storedM ?? null;
    return optionalMetres(text, this.distanceUnit());
  }
}
