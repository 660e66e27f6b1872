import { ChangeDetectionStrategy, Component, computed, effect, input, viewChild, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { QuantityFormat } from '../../../shared/quantity-format';
import type { CarryBasis, PlayerKick } from '../../../shared/schemas/analysis';
import { OUTCOME_LABELS, TECHNIQUE_LABELS, backspinLabel, sidespinLabel } from '../../../shared/vocabulary';
import { ClubFormat } from '../core/club-format';

/** One row of the table: the kick plus the words the table shows and filters on. */
export interface KickRow {
  readonly kick: PlayerKick;
  readonly when: string;
  readonly technique: string;
  readonly target: string;
  readonly outcome: string;
  /** Carry on the chosen basis, metres. */
  readonly carryM: number | null;
  /** Carry as shown, in the club's unit ("31,4 yd"), or "–". */
  readonly carry: string;
  readonly lateral: string;
  readonly spin: string;
  /** The measured launch in words with its source ("video: 24.3 m/s, 11.8°"), or "–". */
  readonly measured: string;
}

const WHEN: Intl.DateTimeFormatOptions = { weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' };

/** Column ids in display order. */
export const KICK_COLUMNS = ['recordedAt', 'technique', 'target', 'outcome', 'carry', 'lateral', 'spin', 'measured'] as const;

/** A kick as the table shows it, on the chosen carry basis. */
export function kickRow(kick: PlayerKick, basis: CarryBasis, f: QuantityFormat): KickRow {
  const lateral =
    kick.lateralM === null
      ? '–'
      : Math.abs(kick.lateralM) < 0.05
        ? 'on line'
        : `${f.distance(Math.abs(kick.lateralM))} ${kick.lateralM > 0 ? 'L' : 'R'}`;
  const spin = [backspinLabel(kick.backspinStep), kick.sidespinStep === 0 ? null : sidespinLabel(kick.sidespinStep)]
    .filter((s) => s !== null)
    .join(', ');
  const carryM = basis === 'still-air' ? kick.stillAirCarryM : kick.carryM;
  const launch = [
    kick.measuredSpeedMs === null ? null : `${f.number(kick.measuredSpeedMs)} m/s`,
    kick.launchAngleDeg === null ? null : `${f.number(kick.launchAngleDeg)}°`,
  ].filter((s) => s !== null);
  const measured = launch.length ? `${kick.measuredSource ?? 'device'}: ${launch.join(', ')}` : '–';
  return {
    kick,
    when: f.dateTime(kick.recordedAt, WHEN),
    technique: TECHNIQUE_LABELS[kick.technique],
    target: `${f.round(kick.targetDistanceM)} · r ${f.round(kick.targetRadiusM)}`,
    outcome: OUTCOME_LABELS[kick.outcome],
    carryM,
    carry: f.distance(carryM),
    lateral,
    spin,
    measured,
  };
}

/**
 * The player's recent kicks in a Material table: sort any column, filter by any word shown
 * (technique, outcome, day, spin), page through. Carries follow the screen's still-air toggle;
 * the column header says which basis is shown.
 */
@Component({
  selector: 'll-recent-kicks',
  imports: [
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatSortModule,
    MatTableModule,
    ReactiveFormsModule,
    RouterLink,
  ],
  template: `
    <mat-form-field appearance="outline" class="recent-kicks__filter" subscriptSizing="dynamic">
      <mat-label>Filter kicks</mat-label>
      <mat-icon matPrefix aria-hidden="true">filter_list</mat-icon>
      <input matInput [formControl]="filter" placeholder="e.g. lofted, short, Tue" />
    </mat-form-field>
    <div class="recent-kicks__scroll">
      <table mat-table [dataSource]="dataSource" matSort matSortActive="recordedAt" matSortDirection="desc" class="recent-kicks__table">
        <ng-container matColumnDef="recordedAt">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>When</th>
          <td mat-cell *matCellDef="let row">{{ row.when }}</td>
        </ng-container>
        <ng-container matColumnDef="technique">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Technique</th>
          <td mat-cell *matCellDef="let row">{{ row.technique }}</td>
        </ng-container>
        <ng-container matColumnDef="target">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Target</th>
          <td mat-cell *matCellDef="let row">{{ row.target }}</td>
        </ng-container>
        <ng-container matColumnDef="outcome">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Outcome</th>
          <td mat-cell *matCellDef="let row">{{ row.outcome }}</td>
        </ng-container>
        <ng-container matColumnDef="carry">
          <th mat-header-cell *matHeaderCellDef mat-sort-header arrowPosition="before" class="recent-kicks__num">
            {{ basis() === 'still-air' ? 'Still-air carry' : 'Carry' }}
          </th>
          <td mat-cell *matCellDef="let row" class="recent-kicks__num">{{ row.carry }}</td>
        </ng-container>
        <ng-container matColumnDef="lateral">
          <th mat-header-cell *matHeaderCellDef mat-sort-header arrowPosition="before" class="recent-kicks__num">Lateral</th>
          <td mat-cell *matCellDef="let row" class="recent-kicks__num">{{ row.lateral }}</td>
        </ng-container>
        <ng-container matColumnDef="spin">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Spin</th>
          <td mat-cell *matCellDef="let row">{{ row.spin }}</td>
        </ng-container>
        <ng-container matColumnDef="measured">
          <th mat-header-cell *matHeaderCellDef>Measured launch</th>
          <td mat-cell *matCellDef="let row">
            {{ row.measured }}
            @if (canMeasure()) {
              <a mat-button [routerLink]="['/measure', row.kick.id]" [attr.aria-label]="'Measure from video: kick of ' + row.when">
                <mat-icon aria-hidden="true">videocam</mat-icon> Measure
              </a>
            }
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns; sticky: true"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="mat-mdc-cell recent-kicks__empty" [attr.colspan]="columns.length">
            {{ filterText() ? 'No kicks match “' + filterText() + '”.' : 'No kicks logged yet.' }}
          </td>
        </tr>
      </table>
    </div>
    <mat-paginator [pageSizeOptions]="[10, 25, 50]" [pageSize]="10" aria-label="Pages of kicks" />
    @if (measuredCounts(); as m) {
      <p class="recent-kicks__note" data-testid="measured-count">
        Measured launches in this list: {{ m.video }} from video, {{ m.device }} from a device, of {{ kicks().length }}.
      </p>
    }
    @if (total() > kicks().length) {
      <p class="recent-kicks__note">Showing the latest {{ kicks().length }} of {{ total() }} kicks.</p>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .recent-kicks__filter {
      width: 100%;
      max-width: 360px;
      margin-bottom: 8px;
    }
    .recent-kicks__scroll {
      overflow-x: auto;
      max-height: 560px;
    }
    .recent-kicks__table {
      width: 100%;
      min-width: 640px;
    }
    .recent-kicks__table td,
    .recent-kicks__table th {
      white-space: nowrap;
      padding-inline: 8px;
    }
    .recent-kicks__num {
      text-align: right;
    }
    .recent-kicks__empty {
      padding: 16px;
    }
    .recent-kicks__note {
      margin: 4px 0 0;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecentKicks {
  /** The kicks, newest first. */
  readonly kicks = input.required<readonly PlayerKick[]>();
  /** How many kicks the player has in all (the table may hold only the latest). */
  readonly total = input(0);
  /** Which carry to show. */
  readonly basis = input<CarryBasis>('logged');
  /** Whether each kick offers "Measure from video" (staff only: the route is theirs). */
  readonly canMeasure = input(false);

  protected readonly columns = [...KICK_COLUMNS];
  protected readonly filter = new FormControl('', { nonNullable: true });
  protected readonly filterText = toSignal(this.filter.valueChanges, { initialValue: '' });
  protected readonly dataSource = new MatTableDataSource<KickRow>([]);

  private readonly sort = viewChild.required(MatSort);
  private readonly paginator = viewChild.required(MatPaginator);
  /** The club's formatter (distance unit, locale). */
  private readonly fmt = inject(ClubFormat).format;
  /** How many of the listed kicks carry a measured launch, by source; null when none do. */
  protected readonly measuredCounts = computed(() => {
    const measured = this.kicks().filter((k) => k.measuredSpeedMs !== null || k.launchAngleDeg !== null);
    if (measured.length === 0) return null;
    const video = measured.filter((k) => k.measuredSource === 'video').length;
    return { video, device: measured.length - video };
  });
  private readonly rows = computed(() => this.kicks().map((k) => kickRow(k, this.basis(), this.fmt())));

  constructor() {
    this.dataSource.sortingDataAccessor = (row, column): string | number => {
      switch (column) {
        case 'recordedAt':
          return row.kick.recordedAt;
        case 'target':
          return row.kick.targetDistanceM * 1000 + row.kick.targetRadiusM;
        case 'carry':
          // Kicks without a carry sort below every measured one.
          return row.carryM ?? Number.NEGATIVE_INFINITY;
        case 'lateral':
          return row.kick.lateralM ?? Number.NEGATIVE_INFINITY;
        case 'spin':
          return row.kick.backspinStep * 10 + row.kick.sidespinStep;
        case 'technique':
          return row.technique;
        case 'outcome':
          return row.outcome;
        default:
          return '';
      }
    };
    this.dataSource.filterPredicate = (row, filter) =>
      [row.when, row.technique, row.target, row.outcome, row.lateral, row.spin, row.carry, row.measured]
        .join(' ')
        .toLowerCase()
        .includes(filter);
    effect(() => {
      this.dataSource.data = this.rows();
    });
    effect(() => {
      this.dataSource.sort = this.sort();
      this.dataSource.paginator = this.paginator();
    });
    effect(() => {
      this.dataSource.filter = this.filterText().trim().toLowerCase();
      this.dataSource.paginator?.firstPage();
    });
  }
}
