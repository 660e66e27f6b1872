import { ChangeDetectionStrategy, Component, computed, input, inject } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { QuantityFormat } from '../../../shared/quantity-format';
import type { SquadWeekPlayer } from '../../../shared/schemas/analysis';
import { ClubFormat } from '../core/club-format';

const DAY: Intl.DateTimeFormatOptions = { weekday: 'short', day: 'numeric', month: 'short' };

/** A player's sessions over the limit in words, e.g. "46 on Tue 4 Mar, 41 on Thu 6 Mar" (days in the club's locale). */
export function loadSessions(flags: SquadWeekPlayer['loadFlags'], fmt: QuantityFormat): string {
  return flags.map((f) => `${f.reps} on ${fmt.dateTime(f.startedAt, DAY)}`).join(', ');
}

/** One player's sessions over the limit in words, e.g. "Bo Adeyemi (46 on Tue 4 Mar)" (days in the club's locale). */
export function loadLine(player: Pick<SquadWeekPlayer, 'displayName' | 'loadFlags'>, fmt: QuantityFormat): string {
  return `${player.displayName} (${loadSessions(player.loadFlags, fmt)})`;
}

/**
 * The kicking-load caution of Squad week (docs/design.md §10): which players passed the club's repetition
 * limit in a session this week. Repeated hard kicking strains hips and groin; Loftline only counts,
 * and leaves rest and load to the club's medical staff.
 */
@Component({
  selector: 'll-load-caution',
  imports: [MatIconModule],
  template: `
    @if (flagged().length > 0) {
      <mat-icon aria-hidden="true">warning</mat-icon>
      <div>
        <p class="load-caution__title">Kicking load</p>
        <p>
          {{ flagged().length === 1 ? 'One player' : flagged().length + ' players' }} passed {{ limit() }} repetitions in a session this
          week: {{ lines() }}.
        </p>
        <p>Repeated hard kicking strains hips and groin. Defer to the club's medical staff on rest and load.</p>
      </div>
    }
  `,
  styles: `
    :host {
      display: flex;
      gap: 12px;
      align-items: flex-start;
    }
    :host(.load-caution--shown) {
      padding: 12px 16px;
      margin-bottom: 16px;
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    mat-icon {
      flex: none;
    }
    p {
      margin: 0 0 4px;
    }
    .load-caution__title {
      font: var(--mat-sys-title-small);
    }
  `,
  host: { '[class.load-caution--shown]': 'flagged().length > 0', '[attr.role]': "flagged().length > 0 ? 'note' : null" },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadCaution {
  /** The week's players. */
  readonly players = input.required<readonly SquadWeekPlayer[]>();
  /** The club's repetition limit per session. */
  readonly limit = input.required<number>();

  protected readonly flagged = computed(() => this.players().filter((p) => p.loadFlags.length > 0));
  private readonly fmt = inject(ClubFormat).format;
  protected readonly lines = computed(() =>
    this.flagged()
      .map((p) => loadLine(p, this.fmt()))
      .join('; '),
  );
}
