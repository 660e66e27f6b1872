import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/**
 * Where the coach is in an import: the steps in order, the finished ones ticked, the current one
 * marked (`aria-current="step"`). Only a signpost: moving between steps is done with the
 * wizard's own buttons, so the wizard alone decides when a step is finished (a preview must be
 * answered before the commit step opens) and no header can skip past a check.
 */
@Component({
  selector: 'll-wizard-steps',
  imports: [MatIconModule],
  template: `
    <ol class="steps" [attr.aria-label]="label()">
      @for (step of steps(); track step; let i = $index) {
        <li
          class="steps__step"
          [class.steps__step--done]="i < current()"
          [class.steps__step--now]="i === current()"
          [attr.aria-current]="i === current() ? 'step' : null"
        >
          <span class="steps__badge" aria-hidden="true">
            @if (i < current()) {
              <mat-icon>check</mat-icon>
            } @else {
              {{ i + 1 }}
            }
          </span>
          <span class="steps__label">{{ step }}</span>
          @if (i < current()) {
            <span class="steps__sr">(done)</span>
          }
        </li>
      }
    </ol>
  `,
  styles: `
    .steps {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 20px;
      margin: 0 0 16px;
      padding: 0;
      list-style: none;
    }
    .steps__step {
      display: flex;
      align-items: center;
      gap: 8px;
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-label-large);
    }
    .steps__badge {
      display: inline-flex;
      align-items: center;
      justify-content: center;
      width: 28px;
      height: 28px;
      border-radius: 50%;
      border: 2px solid currentColor;
      box-sizing: border-box;
    }
    .steps__badge mat-icon {
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
    .steps__step--done {
      color: var(--mat-sys-primary);
    }
    .steps__step--now {
      color: var(--mat-sys-on-surface);
    }
    .steps__step--now .steps__badge {
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
      border-color: var(--mat-sys-tertiary-container);
    }
    .steps__sr {
      position: absolute;
      width: 1px;
      height: 1px;
      overflow: hidden;
      clip-path: inset(50%);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WizardSteps {
  /** The steps' names, in order. */
  readonly steps = input.required<readonly string[]>();
  /** The index of the step on show. */
  readonly current = input.required<number>();
  /** What the list is, for screen readers, e.g. "Roster import steps". */
  readonly label = input.required<string>();
}
