import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import type { Outcome } from '../../../shared/schemas/sync';
import { PAD_OUTCOMES } from './pitchside-labels';
import { OUTCOME_LABELS } from '../../../shared/vocabulary';

/**
 * The outcome buttons at the bottom of Pitchside, in the thumb's reach: one tap saves the
 * repetition. The three results along the target line get the wide top row because they are
 * the common ones; the misses sit below.
 */
@Component({
  selector: 'll-outcome-pad',
  imports: [MatButtonModule],
  template: `
    @for (outcome of outcomes; track outcome) {
      <button
        mat-flat-button
        type="button"
        class="pad__button"
        [class.pad__button--main]="outcome === 'on_target'"
        [class.pad__button--wide]="$index < 3"
        [disabled]="disabled()"
        (click)="picked.emit(outcome)"
      >
        {{ labels[outcome] }}
      </button>
    }
  `,
  styles: `
    :host {
      display: grid;
      grid-template-columns: repeat(12, 1fr);
      gap: 8px;
    }
    .pad__button {
      grid-column: span 3;
      min-height: 56px;
      font: var(--mat-sys-title-small);
      text-transform: uppercase;
      letter-spacing: 0.02em;
      padding-inline: 4px;
    }
    .pad__button--wide {
      grid-column: span 4;
      min-height: 64px;
    }
    .pad__button--main {
      --mat-button-filled-container-color: var(--mat-sys-tertiary-container);
      --mat-button-filled-label-text-color: var(--mat-sys-on-tertiary-container);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutcomePad {
  /** Whether the pad is off (no player or drill picked yet, or a save is under way). */
  readonly disabled = input(false);
  /** Emits the outcome the coach tapped. */
  readonly picked = output<Outcome>();

  protected readonly outcomes = PAD_OUTCOMES;
  protected readonly labels = OUTCOME_LABELS;
}
