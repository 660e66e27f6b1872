import { ChangeDetectionStrategy, Component, OnInit, inject, input, output, signal } from '@angular/core';
import { type AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, type ValidatorFn, Validators } from '@angular/forms';
import type * as z from 'zod';
import { distanceToM } from '../../../shared/units';
import { ClubFormat } from '../core/club-format';
import { DrillSuggestion } from '../core/drill-suggestion';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { drillDataSchema, type Technique } from '../../../shared/schemas/sync';
import type { LocalDrill } from '../core/loftline-db';
import type { NewDrill } from '../core/session-store';
import { zodValidator } from '../core/zod-validator';
import { BackspinControl, CurlControl } from './spin-controls';
import { TECHNIQUES, TECHNIQUE_LABELS } from '../../../shared/vocabulary';

/**
 * Sets up a drill: technique, target distance and radius, and the spin the coach asks for
 * (which each logged repetition starts from). Starts from the previous drill's values, since
 * a session usually steps the same drill out by a few metres.
 */
@Component({
  selector: 'll-drill-form',
  imports: [ReactiveFormsModule, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatInputModule, BackspinControl, CurlControl],
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
          <input matInput type="number" inputmode="decimal" step="any" formControlName="targetDistance" />
          <span matTextSuffix>{{ fmt().unit }}</span>
          @if (form.controls.targetDistance.errors; as e) {
            <mat-error>{{ e['schema'] ?? 'Enter the distance in ' + fmt().unitWord }}</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Target radius</mat-label>
          <input matInput type="number" inputmode="decimal" step="any" formControlName="targetRadius" />
          <span matTextSuffix>{{ fmt().unit }}</span>
          @if (form.controls.targetRadius.errors; as e) {
            <mat-error>{{ e['schema'] ?? 'Enter the radius in ' + fmt().unitWord }}</mat-error>
          }
        </mat-form-field>
      </div>
      <div class="drill-form__row">
        <ll-backspin-control name="Default spin" [(value)]="backspinStep" />
        <ll-curl-control name="Default curl" [(value)]="sidespinStep" />
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
  protected readonly backspinStep = signal(0);
  protected readonly sidespinStep = signal(0);
  private readonly clubFormat = inject(ClubFormat);
  /** The club's formatter: the fields are in its distance unit (metres or yards); storage stays metres. */
  protected readonly fmt = this.clubFormat.format;
  /** `zodValidator` on the metres the typed value stands for (the shared schema is in SI). */
  private readonly inMetres = (schema: z.ZodType): ValidatorFn => {
    const check = zodValidator(schema);
    return (control) => {
      const value: unknown = control.value;
      if (value === null || value === undefined || value === '') return null;
      return check({ value: distanceToM(Number(value), this.fmt().distanceUnit) } as AbstractControl);
    };
  };
  /** Distances in the club's unit (a new club starts from 30 and 3 of them). */
  protected readonly form = inject(NonNullableFormBuilder).group({
    technique: ['lofted' as Technique, Validators.required],
    targetDistance: [30, [Validators.required, this.inMetres(drillDataSchema.shape.targetDistanceM)]],
    targetRadius: [3, [Validators.required, this.inMetres(drillDataSchema.shape.targetRadiusM)]],
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
        targetDistance: this.inUnit(suggested.targetDistanceM),
        targetRadius: this.inUnit(suggested.targetRadiusM),
        label: 'Next target',
      });
      this.backspinStep.set(previous?.backspinStep ?? 0);
      this.sidespinStep.set(previous?.sidespinStep ?? 0);
      this.suggested.set(true);
    } else if (previous) {
      this.form.patchValue({
        technique: previous.technique,
        targetDistance: this.inUnit(previous.targetDistanceM),
        targetRadius: this.inUnit(previous.targetRadiusM),
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
      targetDistanceM: distanceToM(Number(value.targetDistance), this.fmt().distanceUnit),
      targetRadiusM: distanceToM(Number(value.targetRadius), this.fmt().distanceUnit),
      backspinStep: this.backspinStep(),
      sidespinStep: this.sidespinStep(),
      label: value.label.trim() === '' ? null : value.label.trim(),
    });
  }

  /** Metres in the club's unit, to 2 decimals (a 30 m drill shows 32.81 in a yards club). */
  private inUnit(valueM: number): number {
    return Math.round(this.fmt().toUnit(valueM) * 100) / 100;
  }
}
