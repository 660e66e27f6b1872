import { ChangeDetectionStrategy, Component, computed, input, linkedSignal, signal } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatTableModule } from '@angular/material/table';
import type { ImportRowError } from './import-types';
import { type LocalCsv, columnIndex, rowNumberOf } from './local-csv';

/** A file column the preview shows, with the words of its header cell. */
export interface PreviewColumn {
  /** The column's name in the file's header row. */
  readonly header: string;
  /** What the table calls it, e.g. "Speed (Ball speed mph)". */
  readonly label: string;
}

/** One line of the preview table. */
interface PreviewLine {
  readonly row: number;
  readonly cells: readonly { readonly value: string; readonly bad: boolean }[];
  readonly problems: readonly ImportRowError[];
}

/** The row filter's choices. */
type RowFilter = 'problems' | 'all';

/**
 * The preview of an import: the file's rows as the server will read them, with every row the
 * server refused highlighted, the offending cell marked and the reason beside it (row number,
 * column, reason). Shows rows with problems first and on request every row, a page at a time, so
 * a 50,000-row file does not freeze a phone. Problems the file's rows cannot show (a column the
 * file lacks) are listed above the table, and player names the squad does not know are gathered
 * into one list, since one fix to the file usually clears all their rows.
 */
@Component({
  selector: 'll-import-preview',
  imports: [MatButtonToggleModule, MatIconModule, MatPaginatorModule, MatTableModule],
  templateUrl: './import-preview.html',
  styleUrl: './import-preview.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ImportPreview {
  /** The file as read on the device. */
  readonly csv = input.required<LocalCsv>();
  /** The server's row errors. */
  readonly errors = input.required<readonly ImportRowError[]>();
  /** The columns to show, in order. */
  readonly columns = input.required<readonly PreviewColumn[]>();
  /** The player column of a kick file, whose errors mean "no such player in this squad". */
  readonly playerColumn = input<string | null>(null);

  protected readonly pageSizes = [25, 100];
  protected readonly pageSize = signal(25);

  /** Row errors by row number. */
  private readonly byRow = computed(() => {
    const map = new Map<number, ImportRowError[]>();
    for (const error of this.errors()) {
      const list = map.get(error.row) ?? [];
      list.push(error);
      map.set(error.row, list);
    }
    return map;
  });

  /** Row numbers with problems that the file has, in order. */
  protected readonly problemRows = computed(() => {
    const last = rowNumberOf(this.csv().rows.length - 1);
    return [...this.byRow().keys()].filter((row) => row >= 2 && row <= last).sort((a, b) => a - b);
  });

  /** Problems no row of the table can show: outside the file's rows, or in a column it lacks. */
  protected readonly general = computed(() => {
    const csv = this.csv();
    const last = rowNumberOf(csv.rows.length - 1);
    return this.errors().filter((e) => e.row < 2 || e.row > last || (e.column !== '' && columnIndex(csv.header, e.column) < 0));
  });

  /** Player values that matched nobody, with how many rows carry each. */
  protected readonly unmatched = computed(() => {
    const column = this.playerColumn();
    const csv = this.csv();
    const index = column === null ? -1 : columnIndex(csv.header, column);
    if (column === null || index < 0) return [];
    const counts = new Map<string, number>();
    for (const error of this.errors()) {
      if (error.column.toLowerCase() !== column.toLowerCase()) continue;
      const value = csv.rows[error.row - 2]?.[index];
      if (value !== undefined) counts.set(value, (counts.get(value) ?? 0) + 1);
    }
    return [...counts].map(([value, rows]) => ({ value: value === '' ? '(empty)' : value, rows }));
  });

  /** A new answer shows the rows with problems when there are any, else every row. */
  protected readonly filter = linkedSignal<RowFilter>(() => (this.problemRows().length > 0 ? 'problems' : 'all'));
  /** A new answer or filter starts on the first page. */
  protected readonly pageIndex = linkedSignal({ source: () => [this.errors(), this.filter()] as const, computation: () => 0 });

  protected readonly rowsWithProblems = computed(() => this.problemRows().length);
  protected readonly shownCount = computed(() => (this.filter() === 'problems' ? this.problemRows().length : this.csv().rows.length));

  // The reasons come right after the row number, so they show without scrolling on a phone.
  protected readonly tableColumns = computed(() => ['row', 'problems', ...this.columns().map((_, i) => `c${i}`)]);

  /** The lines of the page on show. */
  protected readonly lines = computed<PreviewLine[]>(() => {
    const csv = this.csv();
    const start = this.pageIndex() * this.pageSize();
    const end = start + this.pageSize();
    const rows =
      this.filter() === 'problems'
        ? this.problemRows().slice(start, end)
        : Array.from({ length: Math.max(0, Math.min(end, csv.rows.length) - start) }, (_, i) => rowNumberOf(start + i));
    const indexes = this.columns().map((c) => columnIndex(csv.header, c.header));
    return rows.map((row) => {
      const values = csv.rows[row - 2] ?? [];
      const problems = this.byRow().get(row) ?? [];
      const badIndexes = new Set(problems.map((p) => columnIndex(csv.header, p.column)));
      return {
        row,
        problems,
        cells: indexes.map((index) => ({ value: index < 0 ? '' : (values[index] ?? ''), bad: index >= 0 && badIndexes.has(index) })),
      };
    });
  });

  protected chooseFilter(filter: RowFilter): void {
    this.filter.set(filter);
    this.pageIndex.set(0);
  }

  protected turnPage(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }
}
