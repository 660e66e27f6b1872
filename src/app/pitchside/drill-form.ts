import { ChangeDetectionStrategy, Component, OnInit, inject, input, output, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { DrillSuggestion } from '../core/drill-suggestion';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { drillDataSchema, type Technique } from '../../../shared/schemas/sync';
import type { LocalDrill } from '../core/loftline-db';
import type { NewDrill } from '../core/session-store';
import { zodValidator } from '../core/zod-validator';
import { StepControl } from './step-control';
import { TECHNIQUES, TECHNIQUE_LABELS, backspinLabel, sidespinLabel } from '../../../shared/vocabulary';

/**
 * Sets up a drill: technique, target distance and radius, and the spin the coach asks for
 * (which each logged repetition starts from). Starts from the previous drill's values, since
 * a session usually steps the same drill out by a few metres.
 */
@Component({
  selector: 'll-drill-form',
  imports: [ReactiveFormsModule, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatInputModule, StepControl],
  template: `
    <form [formGroup]="form" (ngSubmit)="submit()" class="drill-form">
      <h2 class="drill-form__title">
        {{ suggested() ? 'Suggested drill (from Next targets)' : previous() ? 'Next drill' : 'First drill' }}
      </h2>
      <mat-button-toggle-group
        formControlName="technique"
        aria-label="Technique"
        class="drill-form__techniques"
        hideSingleSelectionIndicator
      >
        @for (technique of techniques; track technique) {
          <mat-button-toggle [value]="technique">{{ techniqueLabels[technique] }}</mat-button-toggle>
        }
      </mat-button-toggle-group>
      <div class="drill-form__row">
        <mat-form-field appearance="outline">
          <mat-label>Target distance</mat-label>
          <input matInput type="number" inputmode="decimal" formControlName="targetDistanceM" />
          <span matTextSuffix>m</span>
          @if (form.controls.targetDistanceM.errors; as e) {
            <mat-error>{{ e['schema'] ?? 'Enter the distance in metres' }}</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Target radius</mat-label>
          <input matInput type="number" inputmode="decimal" formControlName="targetRadiusM" />
          <span matTextSuffix>m</span>
          @if (form.controls.targetRadiusM.errors; as e) {
            <mat-error>{{ e['schema'] ?? 'Enter the radius in metres' }}</mat-error>
          }
        </mat-form-field>
      </div>
      <div class="drill-form__row">
        <ll-step-control
          name="Default spin"
          [(value)]="backspinStep"
          [min]="-3"
          [max]="3"
          [describe]="backspinLabel"
          [leftStep]="-1"
          leftLabel="More topspin"
          rightLabel="More backspin"
        />
        <ll-step-control
          name="Default curl"
          [(value)]="sidespinStep"
          [min]="-2"
          [max]="2"
          [describe]="sidespinLabel"
          [leftStep]="1"
          leftLabel="More left curl"
          rightLabel="More right curl"
        />
      </div>
      <mat-form-field appearance="outline" class="drill-form__label">
        <mat-label>Name (optional)</mat-label>
        <input matInput formControlName="label" maxlength="120" />
      </mat-form-field>
      <div class="drill-form__actions">
        @if (cancellable()) {
          <button mat-button type="button" (click)="cancelled.emit()">Cancel</button>
        }
        <button mat-flat-button type="submit">Use this drill</button>
      </div>
    </form>
  `,
  styles: `
    .drill-form {
      display: flex;
      flex-direction: column;
      gap: 12px;
    }
    .drill-form__title {
      margin: 0;
      font: var(--mat-sys-title-medium);
    }
    .drill-form__techniques {
      display: grid;
      grid-template-columns: repeat(4, 1fr);
    }
    .drill-form__techniques mat-button-toggle {
      min-height: 48px;
    }
    .drill-form__row {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
    .drill-form__row mat-form-field {
      flex: 1 1 140px;
    }
    .drill-form__actions {
      display: flex;
      justify-content: flex-end;
      gap: 8px;
    }
    .drill-form__actions button {
      min-height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DrillForm implements OnInit {
  /** The drill before this one, whose values the form starts from. */
  readonly previous = input<LocalDrill | null>(null);
  /** Whether the coach may close the form without adding a drill. */
  readonly cancellable = input(false);
  /** Emits the drill to add. */
  readonly submitted = output<NewDrill>();
  /** Emits when the coach closes the form. */
  readonly cancelled = output<void>();

  protected readonly techniques = TECHNIQUES;
  protected readonly techniqueLabels = TECHNIQUE_LABELS;
  protected readonly backspinLabel = backspinLabel;
  protected readonly sidespinLabel = sidespinLabel;
  protected readonly backspinStep = signal(0);
  protected readonly sidespinStep = signal(0);
  protected readonly form = inject(NonNullableFormBuilder).group({
    technique: ['lofted' as Technique, Validators.required],
    targetDistanceM: [30, [Validators.required, zodValidator(drillDataSchema.shape.targetDistanceM)]],
    targetRadiusM: [3, [Validators.required, zodValidator(drillDataSchema.shape.targetRadiusM)]],
    label: ['', zodValidator(drillDataSchema.shape.label)],
  });

  private readonly suggestion = inject(DrillSuggestion);
  /** Whether the form was prefilled from a Next-targets suggestion. */
  protected readonly suggested = signal(false);

  ngOnInit(): void {
    const previous = this.previous();
    const suggested = this.suggestion.pending();
    if (suggested) {
      this.form.patchValue({
        technique: suggested.technique,
        targetDistanceM: suggested.targetDistanceM,
        targetRadiusM: suggested.targetRadiusM,
        label: 'Next target',
      });
      this.backspinStep.set(previous?.backspinStep ?? 0);
      this.sidespinStep.set(previous?.sidespinStep ?? 0);
      this.suggested.set(true);
    } else if (previous) {
      this.form.patchValue({
        technique: previous.technique,
        targetDistanceM: previous.targetDistanceM,
        targetRadiusM: previous.targetRadiusM,
      });
      this.backspinStep.set(previous.backspinStep ?? 0);
      this.sidespinStep.set(previous.sidespinStep ?? 0);
    }
  }

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    if (this.suggested()) this.suggestion.clear();
    this.submitted.emit({
      technique: value.technique,
      targetDistanceM: Number(value.targetDistanceM),
      targetRadiusM: Number(value.targetRadiusM),
      backspinStep: this.backspinStep(),
      sidespinStep: this.sidespinStep(),
      label: value.label.trim() === '' ? null : value.label.trim(),
    });
  }
}
