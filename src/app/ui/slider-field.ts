import { ChangeDetectionStrategy, Component, DestroyRef, forwardRef, inject, input } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { debounceTime } from 'rxjs';
import {
  type AbstractControl,
  type ControlValueAccessor,
  FormControl,
  NG_VALUE_ACCESSOR,
  ReactiveFormsModule,
  type ValidationErrors,
} from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSliderModule } from '@angular/material/slider';
import type { ErrorStateMatcher } from '@angular/material/core';
import type { QuantityFormat } from '../../../shared/quantity-format';

let nextId = 0;

/** How long typing must pause before a typed number applies, ms. */
const TYPING_PAUSE_MS = 350;

/**
 * One number edited two ways: a slider for quick what-ifs with a thumb, and a number field for an exact
 * value (typed values may go beyond the slider's usual range, up to `min`/`max`). A form control of its
 * own (ControlValueAccessor) so a screen's reactive form holds plain numbers. It passes a typed value on
 * only when it is a number in range, so the form never sees a half-typed or impossible value; the field
 * shows why instead.
 */
@Component({
  selector: 'll-slider-field',
  imports: [MatFormFieldModule, MatInputModule, MatSliderModule, ReactiveFormsModule],
  template: `
    <mat-slider [min]="sliderMin()" [max]="sliderMax()" [step]="step()" class="slider-field__slider">
      <input matSliderThumb [formControl]="slider" [attr.aria-label]="label() + ', ' + unit()" (blur)="touched()" />
    </mat-slider>
    <mat-form-field class="slider-field__number" subscriptSizing="dynamic">
      <mat-label>{{ label() }}</mat-label>
      <input
        matInput
        type="number"
        inputmode="decimal"
        [id]="inputId"
        [formControl]="typed"
        [errorStateMatcher]="whileTyping"
        [step]="step()"
        [min]="min()"
        [max]="max()"
        (blur)="commitTyped(); touched()"
        (keydown.enter)="commitTyped()"
      />
      <span matTextSuffix>{{ unit() }}</span>
      @if (typed.invalid) {
        <mat-error>{{ min() }} to {{ max() }} {{ unit() }}</mat-error>
      } @else if (hint()) {
        <mat-hint>{{ hint() }}</mat-hint>
      }
    </mat-form-field>
  `,
  styles: `
    :host {
      display: grid;
      grid-template-columns: minmax(0, 1fr) 8.5rem;
      align-items: center;
      column-gap: 8px;
    }
    .slider-field__slider {
      min-width: 0;
      margin-inline: 8px 0;
    }
    .slider-field__number {
      width: 100%;
    }
  `,
  providers: [{ provide: NG_VALUE_ACCESSOR, useExisting: forwardRef(() => SliderField), multi: true }],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SliderField implements ControlValueAccessor {
  /** Name of the value, e.g. "Speed". */
  readonly label = input.required<string>();
  /** Unit shown after the number, e.g. "m/s". */
  readonly unit = input.required<string>();
  /** The slider's range (where nearly every real value lies). */
  readonly sliderMin = input.required<number>();
  readonly sliderMax = input.required<number>();
  /** The range a typed value may use. */
  readonly min = input.required<number>();
  readonly max = input.required<number>();
  readonly step = input(1);
  /** A short note under the number, e.g. what the sign means. */
  readonly hint = input<string | undefined>(undefined);
  /**
   * Shown units per stored unit: the form holds SI (metres) while a yards club slides and types yards
   * (factor 1 / 0.9144). The ranges and the step above are in the shown unit, so a yards slider moves in
   * round yards rather than in 0.547 yd steps.
   */
  readonly factor = input(1);

  protected readonly inputId = `ll-slider-field-${nextId++}`;
  protected readonly slider = new FormControl(0, { nonNullable: true });
  protected readonly typed = new FormControl<number | null>(null, (c) => this.checkTyped(c));

  /** Shows a range error as soon as the number is edited, not only after leaving the field. */
  protected readonly whileTyping: ErrorStateMatcher = { isErrorState: (control) => !!control && control.invalid && control.dirty };

  private changed: (value: number) => void = () => undefined;
  private lastValue: number | null = null;
  private touchedFn: () => void = () => undefined;

  constructor() {
    const destroyRef = inject(DestroyRef);
    this.slider.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe((value) => {
      this.typed.setValue(value, { emitEvent: false });
      this.emit(value);
    });
    // A typed number applies once the typing pauses (or on Enter / leaving the field), so "35" does not
    // first compute a kick at 3 m/s.
    this.typed.valueChanges.pipe(debounceTime(TYPING_PAUSE_MS), takeUntilDestroyed(destroyRef)).subscribe(() => this.commitTyped());
  }

  /** Pass the typed number on if it is valid and new. */
  protected commitTyped(): void {
    const value = this.typed.value;
    if (value === null || this.typed.invalid || value === this.lastValue) return;
    this.slider.setValue(this.clampToSlider(value), { emitEvent: false });
    this.emit(value);
  }

  /** @inheritdoc */
  writeValue(value: unknown): void {
    const n = typeof value === 'number' && Number.isFinite(value) ? this.shown(value) : this.min();
    this.slider.setValue(this.clampToSlider(n), { emitEvent: false });
    this.typed.setValue(n, { emitEvent: false });
    this.lastValue = n;
  }

  /** @inheritdoc */
  registerOnChange(fn: (value: number) => void): void {
    this.changed = fn;
  }

  /** @inheritdoc */
  registerOnTouched(fn: () => void): void {
    this.touchedFn = fn;
  }

  /** @inheritdoc */
  setDisabledState(disabled: boolean): void {
    for (const control of [this.slider, this.typed]) {
      if (disabled) control.disable({ emitEvent: false });
      else control.enable({ emitEvent: false });
    }
  }

  protected touched(): void {
    this.touchedFn();
  }

  /** `value` is in the shown unit; the form receives it in the stored one. */
  private emit(value: number): void {
    this.lastValue = value;
    // toPrecision(12) drops the float noise of the division (11 yd is 10.0584 m, not 10.058399999999999).
    this.changed(this.factor() === 1 ? value : Number((value / this.factor()).toPrecision(12)));
  }

  /**
   * A stored value in the shown unit, to a hundredth of the step's precision at most, so 25 m reads
   * 27.34 yd rather than 27.340332458.
   */
  private shown(stored: number): number {
    if (this.factor() === 1) return stored;
    return Math.round(stored * this.factor() * 100) / 100;
  }

  private clampToSlider(value: number): number {
    return Math.min(this.sliderMax(), Math.max(this.sliderMin(), value));
  }

  private checkTyped(control: AbstractControl): ValidationErrors | null {
    const value: unknown = control.value;
    if (typeof value !== 'number' || !Number.isFinite(value)) return { required: true };
    return value < this.min() || value > this.max() ? { range: true } : null;
  }
}

/** A slider's ranges and step, in the unit it shows. */
export interface SliderRange {
  readonly sliderMin: number;
  readonly sliderMax: number;
  readonly min: number;
  readonly max: number;
  readonly step: number;
}

/** A distance slider as the club reads it: ranges in its unit, the unit's symbol and the `factor` to pass on. */
export interface DistanceSlider extends SliderRange {
  readonly unit: string;
  readonly factor: number;
}

/**
 * A distance slider given in metres, shown in the club's unit: the ranges are converted and kept inside
 * the metre ranges (rounded inwards to the step), the step stays a round number of the club's unit.
 */
export function distanceSlider(metres: SliderRange, format: QuantityFormat): DistanceSlider {
  const factor = format.toUnit(1);
  if (factor === 1) return { ...metres, unit: format.unit, factor };
  const step = metres.step;
  // toFixed(6) first, so a value already on the step (10 yd) is not rounded a whole step inwards by float noise.
  const inwards = (v: number, round: (x: number) => number): number =>
    Number((round(Number(((v * factor) / step).toFixed(6))) * step).toFixed(6));
  return {
    sliderMin: inwards(metres.sliderMin, Math.ceil),
    sliderMax: inwards(metres.sliderMax, Math.floor),
    min: inwards(metres.min, Math.ceil),
    max: inwards(metres.max, Math.floor),
    step,
    unit: format.unit,
    factor,
  };
}
