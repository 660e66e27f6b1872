import { ChangeDetectionStrategy, Component, ViewEncapsulation, computed, input } from '@angular/core';
import { axisBottom, axisLeft, max, scaleLinear, scaleSqrt } from 'd3';
import type { QuantityFormat } from '../../../../shared/quantity-format';
import { chartFrame, drawAxis, drawBottomAxis, drawEmptyNote, drawGrid } from './chart-frame';
import { ChartTable } from './chart-table';
import { D3Chart } from './d3-chart';

/** One player's predicted against observed hit rate over a week. */
export interface CalibrationMark {
  /** Stable identity for the table (e.g. player id and technique). */
  readonly id: string;
  /** Who, e.g. "7 Ada Okafor". */
  readonly label: string;
  readonly reps: number;
  /** Mean predicted hit probability (0..1). */
  readonly predicted: number;
  /** Share of repetitions on target (0..1). */
  readonly observed: number;
}

const MAX_SIDE_PX = 420;
const MARGIN = { top: 12, right: 12, bottom: 40, left: 48 };

/**
 * Calibration: the flight model's predicted hit rate against what happened, one dot per player,
 * sized by repetitions. Dots on the diagonal mean the envelopes can be trusted to set targets;
 * a cloud above it means players beat their predictions (the model is too pessimistic), below
 * it the reverse. The table lists each dot.
 */
@Component({
  selector: 'll-calibration-chart',
  imports: [ChartTable],
  template: `
    <svg #svg role="img" [attr.aria-label]="summary()"></svg>
    <ll-chart-table
      [headers]="['Player', 'Repetitions', 'Predicted', 'Observed']"
      [rows]="rows()"
      empty="No predictions for this week yet."
    />
  `,
  styleUrl: './calibration-chart.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalibrationChart extends D3Chart {
  /** The dots. */
  readonly marks = input.required<readonly CalibrationMark[]>();
  /** One sentence read by screen readers in place of the drawing. */
  readonly summary = input.required<string>();

  protected readonly rows = computed(() =>
    this.marks().map((m) => ({
      key: m.id,
      cells: [
        m.label,
        m.reps,
        // Counts beside the rates: a 100 % from three kicks is not a 100 % from thirty.
        `${this.fmt().percent(m.predicted)} (${this.fmt().fixed(m.predicted * m.reps, 1)} of ${m.reps})`,
        `${this.fmt().percent(m.observed)} (${Math.round(m.observed * m.reps)} of ${m.reps})`,
      ],
    })),
  );

  protected override draw(element: SVGSVGElement, available: number, f: QuantityFormat): void {
    const marks = this.marks();
    const side = Math.min(available, MAX_SIDE_PX);
    const frame = chartFrame(element, side, side, MARGIN);
    const { plot: g, innerW, innerH } = frame;
    const x = scaleLinear().domain([0, 1]).range([0, innerW]);
    const y = scaleLinear().domain([0, 1]).range([innerH, 0]);
    const r = scaleSqrt()
      .domain([0, Math.max(1, max(marks, (m) => m.reps) ?? 1)])
      .range([2, 11]);
    const pct = (v: unknown): string => f.percent(Number(v));
    drawGrid(frame, axisLeft(y).ticks(5));
    drawAxis(frame, axisLeft(y).ticks(5).tickFormat(pct));
    drawBottomAxis(frame, axisBottom(x).ticks(5).tickFormat(pct));
    g.append('line').attr('class', 'll-calibration__diagonal').attr('x1', x(0)).attr('y1', y(0)).attr('x2', x(1)).attr('y2', y(1));
    g.append('text')
      .attr('class', 'll-chart__label')
      .attr('x', innerW / 2)
      .attr('y', innerH + 32)
      .attr('text-anchor', 'middle')
      .text('Predicted hit rate');
    g.append('text')
      .attr('class', 'll-chart__label')
      .attr('transform', `translate(${-38},${innerH / 2}) rotate(-90)`)
      .attr('text-anchor', 'middle')
      .text('Observed hit rate');
    if (marks.length === 0) {
      drawEmptyNote(frame, 'No predictions yet');
      return;
    }
    g.selectAll('circle.ll-calibration__point')
      .data(marks)
      .join('circle')
      .attr('class', 'll-calibration__point')
      .attr('cx', (m) => x(m.predicted))
      .attr('cy', (m) => y(m.observed))
      .attr('r', (m) => r(m.reps))
      .append('title')
      .text((m) => `${m.label}: predicted ${pct(m.predicted)}, observed ${pct(m.observed)} over ${m.reps} reps`);
  }
}
