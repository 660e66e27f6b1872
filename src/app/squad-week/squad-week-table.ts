import { ChangeDetectionStrategy, Component, computed, effect, inject, input, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink } from '@angular/router';
import type { CarryBasis } from '../../../shared/schemas/analysis';
import type { Technique } from '../../../shared/schemas/sync';
import { describeNextTarget, drillLink, type NextTargetResult } from '../core/analysis/next-target';
import { TECHNIQUE_LABELS } from '../../../shared/vocabulary';
import { type SquadRow, changeMark, csvFileName, squadWeekCsv } from './squad-week-rows';
import { FileDownload } from '../core/file-download';
import { ClubFormat } from '../core/club-format';

/** Column ids in display order. */
export const SQUAD_COLUMNS = [
  'shirt',
  'player',
  'reps',
  'hitRate',
  'change',
  'best',
  'techReps',
  'techHitRate',
  'techCarry',
  'reach',
  'next',
  'load',
] as const;

/**
 * The Squad week table: one line per player with the week's repetitions and hit rate, the change
 * from last week, the best technique, and for the chosen technique the hit rate, median carry,
 * reliable reach and next target (with "add as drill"). Sort any column, filter by name or shirt
 * number, export what is shown as CSV. On a phone the player column stays put while the figures
 * scroll sideways.
 */
@Component({
  selector: 'll-squad-week-table',
  imports: [
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSortModule,
    MatTableModule,
    MatTooltipModule,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './squad-week-table.html',
  styleUrl: './squad-week-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SquadWeekTable {
  /** The club's formatter (distance unit, locale). */
  protected readonly fmt = inject(ClubFormat).format;
  private readonly download = inject(FileDownload);

  /** The players' lines. */
  readonly rows = input.required<readonly SquadRow[]>();
  /** The technique of the technique columns. */
  readonly technique = input.required<Technique>();
  /** Which carry the median carry uses. */
  readonly basis = input<CarryBasis>('logged');
  /** For the export's file name. */
  readonly squadName = input('');
  /** Monday of the week shown (YYYY-MM-DD), for the export's file name. */
  readonly weekStart = input('');
  /** The club's repetition limit per session. */
  readonly repLimit = input(0);

  protected readonly columns = [...SQUAD_COLUMNS];
  protected readonly techniqueLabel = computed(() => TECHNIQUE_LABELS[this.technique()]);
  protected readonly filter = new FormControl('', { nonNullable: true });
  protected readonly filterText = toSignal(this.filter.valueChanges, { initialValue: '' });
  protected readonly dataSource = new MatTableDataSource<SquadRow>([]);
  protected readonly changeMark = changeMark;
  protected describeNext(result: NextTargetResult): string {
    return describeNextTarget(result, this.fmt());
  }

  private readonly sort = viewChild.required(MatSort);

  constructor() {
    this.dataSource.sortingDataAccessor = (row, column): string | number => {
      const num = (v: number | null): number => v ?? Number.NEGATIVE_INFINITY;
      switch (column) {
        case 'shirt':
          return num(row.shirtNumber);
        case 'player':
          return row.displayName.toLowerCase();
        case 'reps':
          return row.reps;
        case 'hitRate':
          return num(row.hitRate);
        case 'change':
          return num(row.hitRateChange);
        case 'best':
          return row.bestTechnique ? TECHNIQUE_LABELS[row.bestTechnique] : '';
        case 'techReps':
          return row.techniqueReps;
        case 'techHitRate':
          return num(row.techniqueHitRate);
        case 'techCarry':
          return num(row.techniqueMedianCarryM);
        case 'reach':
          return num(row.reliableReachM);
        case 'next':
          return row.next.status === 'ready' && row.next.result.kind === 'target' ? row.next.result.distanceM : Number.NEGATIVE_INFINITY;
        case 'load':
          return row.loadFlags;
        default:
          return '';
      }
    };
    this.dataSource.filterPredicate = (row, filter) => `${row.shirtNumber ?? ''} ${row.displayName}`.toLowerCase().includes(filter);
    effect(() => {
      this.dataSource.data = [...this.rows()];
    });
    effect(() => {
      this.dataSource.sort = this.sort();
    });
    effect(() => {
      this.dataSource.filter = this.filterText().trim().toLowerCase();
    });
  }

  /** The rows as shown: filtered, in the current sort order. */
  shownRows(): SquadRow[] {
    return this.dataSource.sortData(this.dataSource.filteredData.slice(), this.sort());
  }

  protected exportCsv(): void {
    const csv = squadWeekCsv(this.shownRows(), this.technique(), this.basis(), this.fmt().distanceUnit);
    this.download.saveText(csvFileName(this.squadName(), this.weekStart(), this.technique()), csv);
  }

  protected bestLabel(row: SquadRow): string {
    return row.bestTechnique ? TECHNIQUE_LABELS[row.bestTechnique] : '–';
  }

  protected percent(value: number | null): string {
    return this.fmt().percent(value);
  }

  protected metres(value: number | null): string {
    return this.fmt().distance(value);
  }

  protected link(row: SquadRow): ReturnType<typeof drillLink> | null {
    return row.next.status === 'ready' && row.next.result.kind === 'target'
      ? drillLink(this.technique(), row.next.result.distanceM, row.next.result.radiusM)
      : null;
  }
}
