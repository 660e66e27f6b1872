import { ChangeDetectionStrategy, Component, OnInit, inject, input, output, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { kickDataSchema, type Outcome } from '../../../shared/schemas/sync';
import type { KickCorrection } from '../core/kick-store';
import type { CachedPlayer, LocalKick } from '../core/loftline-db';
import { metresValidator, optionalMetres } from './metres-field';
import { PAD_OUTCOMES } from './pitchside-labels';
import { OUTCOME_LABELS, backspinLabel, sidespinLabel } from '../../../shared/vocabulary';
import { StepControl } from './step-control';

/**
 * Corrects one logged repetition — kicker, outcome, spin, landed carry, lateral offset and the
 * stopwatch's hang time (clear it to drop a mistimed reading) — or voids it. Corrections are new mutations; the server keeps the history straight.
 */
@Component({
  selector: 'll-kick-editor',
  imports: [ReactiveFormsModule, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatInputModule, MatSelectModule, StepControl],
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
        <ll-step-control
          name="Spin"
          [(value)]="backspinStep"
          [min]="-3"
          [max]="3"
          [describe]="backspinLabel"
          leftLabel="More topspin"
          rightLabel="More backspin"
        />
        <ll-step-control
          name="Curl"
          [(value)]="sidespinStep"
          [min]="-2"
          [max]="2"
          [describe]="sidespinLabel"
          [leftStep]="1"
          leftLabel="More left curl"
          rightLabel="More right curl"
        />
      </div>
      <div class="editor__row">
        <mat-form-field appearance="outline">
          <mat-label>Carry</mat-label>
          <input matInput inputmode="decimal" formControlName="carry" />
          <span matTextSuffix>m</span>
          @if (form.controls.carry.errors?.['schema']; as message) {
            <mat-error>{{ message }}</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Lateral (+ left)</mat-label>
          <input matInput inputmode="decimal" formControlName="lateral" />
          <span matTextSuffix>m</span>
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
  protected readonly backspinLabel = backspinLabel;
  protected readonly sidespinLabel = sidespinLabel;
  protected readonly backspinStep = signal(0);
  protected readonly sidespinStep = signal(0);
  protected readonly form = inject(NonNullableFormBuilder).group({
    playerId: [''],
    outcome: ['on_target' as Outcome],
    carry: ['', metresValidator(kickDataSchema.shape.carryM)],
    lateral: ['', metresValidator(kickDataSchema.shape.lateralM)],
    hangTime: ['', metresValidator(kickDataSchema.shape.hangTimeS, 'seconds')],
  });

  ngOnInit(): void {
    const kick = this.kick();
    this.form.setValue({
      playerId: kick.playerId,
      outcome: kick.outcome,
      carry: kick.carryM === null || kick.carryM === undefined ? '' : String(kick.carryM),
      lateral: kick.lateralM === null || kick.lateralM === undefined ? '' : String(kick.lateralM),
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
      carryM: optionalMetres(value.carry),
      lateralM: optionalMetres(value.lateral),
      hangTimeS: optionalMetres(value.hangTime),
    });
  }
}
