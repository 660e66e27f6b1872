import { ChangeDetectionStrategy, Component, input, model } from '@angular/core';
import { backspinLabel, sidespinLabel } from '../../../shared/vocabulary';
import { StepControl } from './step-control';

/**
 * The backspin step (heavy topspin −3 … heavy backspin +3, docs/design.md §3) as Pitchside, the drill
 * form and the kick editor all show it: one place for its range, words and arrows.
 */
@Component({
  selector: 'll-backspin-control',
  imports: [StepControl],
  template: `<ll-step-control
    [name]="name()"
    [(value)]="value"
    [min]="-3"
    [max]="3"
    [describe]="label"
    leftLabel="More topspin"
    rightLabel="More backspin"
  />`,
  host: { style: 'display: contents' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BackspinControl {
  /** What the control is called on this screen ("Spin", "Default spin"). */
  readonly name = input.required<string>();
  /** The backspin step. */
  readonly value = model.required<number>();
  protected readonly label = backspinLabel;
}

/** The sidespin (curl) step, strong left curl +2 … strong right curl −2: left arrow adds left curl. */
@Component({
  selector: 'll-curl-control',
  imports: [StepControl],
  template: `<ll-step-control
    [name]="name()"
    [(value)]="value"
    [min]="-2"
    [max]="2"
    [describe]="label"
    [leftStep]="1"
    leftLabel="More left curl"
    rightLabel="More right curl"
  />`,
  host: { style: 'display: contents' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CurlControl {
  /** What the control is called on this screen ("Curl", "Default curl"). */
  readonly name = input.required<string>();
  /** The sidespin step. */
  readonly value = model.required<number>();
  protected readonly label = sidespinLabel;
}
