import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { CachedPlayer } from '../core/loftline-db';
import { isOverLoadLimit } from './kicking-load';

/**
 * The squad as a grid of big chips — shirt number, name and this session's repetition count —
 * so the first tap of a log picks the kicker. A chip turns amber with a warning mark once the
 * player passes the club's repetition limit (docs/design.md §10).
 */
@Component({
  selector: 'll-player-chips',
  imports: [MatButtonModule, MatIconModule],
  template: `
    @for (player of players(); track player.id) {
      @let reps = counts().get(player.id) ?? 0;
      @let over = overLimit(reps);
      <button
        mat-stroked-button
        type="button"
        class="chip"
        [class.chip--selected]="player.id === selectedId()"
        [class.chip--caution]="over"
        [attr.aria-pressed]="player.id === selectedId()"
        [attr.aria-label]="chipLabel(player, reps, over)"
        [attr.data-testid]="'player-chip'"
        (click)="selected.emit(player.id)"
      >
        <span class="chip__number" aria-hidden="true">{{ player.shirtNumber ?? '–' }}</span>
        <span class="chip__reps" aria-hidden="true">
          @if (over) {
            <mat-icon class="chip__warn">warning</mat-icon>
          }
          {{ reps }}
        </span>
        <span class="chip__name" aria-hidden="true">{{ shortName(player.displayName) }}</span>
      </button>
    } @empty {
      <p class="chips__empty">No players cached for this squad yet. Connect once to load the squad.</p>
    }
  `,
  styles: `
    :host {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(104px, 1fr));
      gap: 8px;
    }
    .chip {
      min-height: 56px;
      height: auto;
      padding: 6px 8px;
      border-radius: var(--mat-sys-corner-medium);
      --mat-button-outlined-label-text-color: var(--mat-sys-on-surface);
    }
    .chip ::ng-deep .mdc-button__label {
      display: grid;
      grid-template-columns: 1fr auto;
      grid-template-rows: auto auto;
      align-items: center;
      column-gap: 4px;
      width: 100%;
      text-align: left;
      line-height: 1.15;
    }
    .chip__number {
      font: var(--mat-sys-title-large);
      font-weight: 700;
      min-width: 1.4em;
    }
    .chip__name {
      grid-column: 1 / -1;
      font: var(--mat-sys-label-large);
      overflow: hidden;
      text-overflow: ellipsis;
      white-space: nowrap;
    }
    .chip__reps {
      display: inline-flex;
      align-items: center;
      gap: 2px;
      font: var(--mat-sys-title-medium);
    }
    .chip__warn {
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
    .chip--selected {
      background: var(--mat-sys-primary);
      --mat-button-outlined-label-text-color: var(--mat-sys-on-primary);
      outline: 3px solid var(--mat-sys-tertiary-container);
    }
    .chip--caution:not(.chip--selected) {
      background: var(--mat-sys-tertiary-container);
      --mat-button-outlined-label-text-color: var(--mat-sys-on-tertiary-container);
    }
    .chips__empty {
      grid-column: 1 / -1;
      margin: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlayerChips {
  /** The squad's players, in display order. */
  readonly players = input.required<readonly CachedPlayer[]>();
  /** Repetitions per player id in this session. */
  readonly counts = input.required<ReadonlyMap<string, number>>();
  /** The selected player's id, or null. */
  readonly selectedId = input<string | null>(null);
  /** The club's repetition limit per player per session. */
  readonly limit = input.required<number>();
  /** Emits the id of the tapped player. */
  readonly selected = output<string>();

  protected overLimit(reps: number): boolean {
    return isOverLoadLimit(reps, this.limit());
  }

  /** "Priya Raghunathan" → "Priya R.": enough to tell players apart on a 104 px chip. */
  protected shortName(displayName: string): string {
    const parts = displayName.trim().split(/\s+/);
    return parts.length < 2 ? displayName : `${parts[0]} ${parts.at(-1)?.charAt(0)}.`;
  }

  protected chipLabel(player: CachedPlayer, reps: number, over: boolean): string {
    const number = player.shirtNumber === null ? '' : `${player.shirtNumber} `;
    const caution = over ? ', over the repetition limit' : '';
    return `${number}${player.displayName}, ${reps} ${reps === 1 ? 'repetition' : 'repetitions'}${caution}`;
  }
}
