import { ChangeDetectionStrategy, Component, computed, input, model } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

let nextId = 0;

/**
 * A ◀ value ▶ stepper for a small whole-number scale (spin steps, metres): two 48 px thumb
 * targets and the value in words between them. A slider would need a steady hand and a look
 * at the screen; a stepper works with a wet thumb and one glance.
 */
@Component({
  selector: 'll-step-control',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <span class="step__name" [id]="nameId">{{ name() }}</span>
    <button mat-icon-button type="button" [attr.aria-label]="leftLabel()" [disabled]="!canMove(leftStep())" (click)="move(leftStep())">
      <mat-icon aria-hidden="true">chevron_left</mat-icon>
    </button>
    <output class="step__value" [attr.aria-labelledby]="nameId" aria-live="polite">{{ text() }}</output>
    <button mat-icon-button type="button" [attr.aria-label]="rightLabel()" [disabled]="!canMove(-leftStep())" (click)="move(-leftStep())">
      <mat-icon aria-hidden="true">chevron_right</mat-icon>
    </button>
  `,
  styles: `
    :host {
      display: inline-grid;
      grid-template-columns: 48px minmax(6.5em, 1fr) 48px;
      grid-template-rows: auto 48px;
      align-items: center;
      column-gap: 2px;
    }
    .step__name {
      grid-column: 1 / -1;
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    .step__value {
      text-align: center;
      font: var(--mat-sys-title-small);
      white-space: nowrap;
      overflow: hidden;
      text-overflow: ellipsis;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StepControl {
  /** What is being set, e.g. "Spin". */
  readonly name = input.required<string>();
  /** The value, two-way bound. */
  readonly value = model.required<number>();
  /** Lowest allowed value. */
  readonly min = input.required<number>();
  /** Highest allowed value. */
  readonly max = input.required<number>();
  /** Words for a value, e.g. 2 → "backspin". */
  readonly describe = input<(value: number) => string>(String);
  /** Change applied by the left button (−1, or +1 for a scale where left means "more"). */
  readonly leftStep = input(-1);
  /** Accessible name of the left button. */
  readonly leftLabel = input.required<string>();
  /** Accessible name of the right button. */
  readonly rightLabel = input.required<string>();

  protected readonly nameId = `ll-step-${nextId++}`;
  protected readonly text = computed(() => this.describe()(this.value()));

  protected canMove(delta: number): boolean {
    const next = this.value() + delta;
    return next >= this.min() && next <= this.max();
  }

  protected move(delta: number): void {
    if (this.canMove(delta)) {
      this.value.set(this.value() + delta);
    }
  }
}
