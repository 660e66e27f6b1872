import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/** One row of a chart's table: a stable key and its cells in column order. */
export interface ChartTableRow {
  readonly key: string;
  readonly cells: readonly (string | number)[];
}

/**
 * A chart's table alternative behind "Show as table": the same figures as the drawing, for screen
 * readers, for exact values and for printing. Every chart in Loftline carries one.
 */
@Component({
  selector: 'll-chart-table',
  template: `
    <details class="ll-chart__alt">
      <summary>Show as table</summary>
      <div class="ll-chart__alt-scroll">
        <table>
          @if (headers().length > 0) {
            <thead>
              <tr>
                @for (header of headers(); track $index) {
                  <th scope="col">{{ header }}</th>
                }
              </tr>
            </thead>
          }
          <tbody>
            @for (row of rows(); track row.key) {
              <tr>
                @for (cell of row.cells; track $index) {
                  @if ($first && rowHeaders()) {
                    <th scope="row">{{ cell }}</th>
                  } @else {
                    <td>{{ cell }}</td>
                  }
                }
              </tr>
            } @empty {
              <tr>
                <td [attr.colspan]="headers().length">{{ empty() }}</td>
              </tr>
            }
          </tbody>
        </table>
      </div>
    </details>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChartTable {
  /** Column headings; none for a table of labelled rows. */
  readonly headers = input<readonly string[]>([]);
  /** The rows. */
  readonly rows = input.required<readonly ChartTableRow[]>();
  /** Whether each row's first cell names the row (a row heading) rather than holding a value. */
  readonly rowHeaders = input(false);
  /** What the table says when there are no rows. */
  readonly empty = input('No data.');
}
