import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { PROFILE_WARNING_TEXT } from '../../../shared/flight';
import type { SquadWeekPlayer } from '../../../shared/schemas/analysis';
import { TECHNIQUE_LABELS } from '../../../shared/vocabulary';
import { ClubFormat } from '../core/club-format';
import { loadSessions } from './load-caution';
import { changeMark } from './squad-week-rows';

/** One technique's line on a printed player sheet. */
interface SheetLine {
  readonly technique: string;
  readonly reps: string;
  readonly hitRate: string;
  readonly medianCarry: string;
  readonly reach: string;
  readonly warnings: string;
}

/** One player's printed page of the week. */
interface Sheet {
  readonly playerId: string;
  readonly title: string;
  readonly summary: string;
  readonly lines: readonly SheetLine[];
  readonly load: string | null;
}

/**
 * The printed Squad week's player pages: after the squad table and charts, one A4 page per player who kicked
 * this week (every technique, not only the one on screen), to hand round at the staff meeting. Screens never
 * show it (`.ll-print-only`); the print stylesheet starts each sheet on a new page. Figures follow the club's
 * units and locale; a player over the repetition limit carries the kicking-load caution.
 */
@Component({
  selector: 'll-player-sheets',
  template: `
    @for (sheet of sheets(); track sheet.playerId) {
      <section class="player-sheet" [attr.aria-label]="sheet.title">
        <h2 class="player-sheet__title">{{ sheet.title }}</h2>
        <p>{{ sheet.summary }}</p>
        <table class="player-sheet__table">
          <thead>
            <tr>
              <th scope="col">Technique</th>
              <th scope="col">Reps</th>
              <th scope="col">Hit rate</th>
              <th scope="col">Median carry</th>
              <th scope="col">Reliable reach</th>
              <th scope="col">Before trusting the reach</th>
            </tr>
          </thead>
          <tbody>
            @for (line of sheet.lines; track line.technique) {
              <tr>
                <th scope="row">{{ line.technique }}</th>
                <td>{{ line.reps }}</td>
                <td>{{ line.hitRate }}</td>
                <td>{{ line.medianCarry }}</td>
                <td>{{ line.reach }}</td>
                <td>{{ line.warnings }}</td>
              </tr>
            }
          </tbody>
        </table>
        @if (sheet.load; as load) {
          <p class="player-sheet__load">
            Kicking load: passed {{ limit() }} repetitions in a session ({{ load }}). Repeated hard kicking strains hips and groin; defer to
            the club's medical staff on rest and load.
          </p>
        }
      </section>
    }
  `,
  styles: `
    :host {
      display: none;
    }
    @media print {
      :host {
        display: block;
      }
    }
    .player-sheet {
      break-before: page;
    }
    .player-sheet__title {
      margin: 0 0 8px;
    }
    .player-sheet__table {
      border-collapse: collapse;
    }
    .player-sheet__table th,
    .player-sheet__table td {
      padding: 4px 8px;
      border-bottom: 1px solid #999;
      text-align: left;
      vertical-align: top;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlayerSheets {
  private readonly fmt = inject(ClubFormat).format;

  readonly players = input.required<readonly SquadWeekPlayer[]>();
  readonly squadName = input.required<string>();
  readonly weekStart = input.required<string>();
  readonly limit = input.required<number>();

  protected readonly sheets = computed<Sheet[]>(() => {
    const f = this.fmt();
    const week = f.day(this.weekStart(), true);
    return this.players()
      .filter((p) => p.reps > 0)
      .map((p) => {
        const change = changeMark(p.hitRateChange);
        const before = p.previousReps > 0 ? `; the week before ${f.percent(p.previousHitRate)}` : '';
        return {
          playerId: p.playerId,
          title: `${p.shirtNumber === null ? '' : `${p.shirtNumber} `}${p.displayName} · ${this.squadName()} · week of ${week}`,
          summary:
            `${p.reps} ${p.reps === 1 ? 'repetition' : 'repetitions'}, hit rate ${f.percent(p.hitRate)}${before}` +
            `${change ? ` (${change.words})` : ''}.` +
            (p.bestTechnique ? ` Best technique this week: ${TECHNIQUE_LABELS[p.bestTechnique].toLowerCase()}.` : ''),
          lines: p.byTechnique.map((t) => {
            const reach = p.reach.find((r) => r.technique === t.technique);
            return {
              technique: TECHNIQUE_LABELS[t.technique],
              reps: f.number(t.reps, 0),
              hitRate: f.percent(t.hitRate),
              medianCarry: f.distance(t.medianCarryM),
              reach: !reach
                ? '–'
                : reach.pending
                  ? 'being computed'
                  : reach.reliableReachM === null
                    ? 'none yet'
                    : `${f.distance(reach.reliableReachM)} (${f.round(reach.reachRadiusM)} target)`,
              warnings: reach ? reach.warnings.map((w) => PROFILE_WARNING_TEXT[w]).join(' ') : '',
            };
          }),
          load: p.loadFlags.length > 0 ? loadSessions(p.loadFlags, f) : null,
        };
      });
  });
}
