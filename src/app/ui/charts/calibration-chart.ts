import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  ViewEncapsulation,
  afterRenderEffect,
  computed,
  input,
  viewChild,
} from '@angular/core';
import { axisBottom, axisLeft, max, scaleLinear, scaleSqrt, select } from 'd3';
import { drawWidth, injectChartWidth } from './chart-width';

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
  template: `
    <svg #svg role="img" [attr.aria-label]="summary()"></svg>
    <details class="ll-chart__alt">
      <summary>Show as table</summary>
      <div class="ll-chart__alt-scroll">
        <table>
          <thead>
            <tr>
              <th scope="col">Player</th>
              <th scope="col">Repetitions</th>
              <th scope="col">Predicted</th>
              <th scope="col">Observed</th>
            </tr>
          </thead>
          <tbody>
            @for (row of rows(); track row.id) {
              <tr>
                <td>{{ row.label }}</td>
                <td>{{ row.reps }}</td>
                <td>{{ row.predicted }}</td>
                <td>{{ row.observed }}</td>
              </tr>
            } @empty {
              <tr>
                <td colspan="4">No predictions for this week yet.</td>
              </tr>
            }
          </tbody>
        </table>
      </div>
    </details>
  `,
  styleUrl: './calibration-chart.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalibrationChart {
  /** The dots. */
  readonly marks = input.required<readonly CalibrationMark[]>();
  /** One sentence read by screen readers in place of the drawing. */
  readonly summary = input.required<string>();

  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly width = injectChartWidth();

  protected readonly rows = computed(() =>
    this.marks().map((m) => ({
      id: m.id,
      label: m.label,
      reps: m.reps,
      // Counts beside the rates: a 100 % from three kicks is not a 100 % from thirty.
      predicted: `${Math.round(m.predicted * 100)} % (${(m.predicted * m.reps).toFixed(1)} of ${m.reps})`,
      observed: `${Math.round(m.observed * 100)} % (${Math.round(m.observed * m.reps)} of ${m.reps})`,
    })),
  );

  constructor() {
    afterRenderEffect(() => this.draw(this.svg().nativeElement, this.marks(), drawWidth(this.width())));
  }

  private draw(element: SVGSVGElement, marks: readonly CalibrationMark[], available: number): void {
    const side = Math.min(available, MAX_SIDE_PX);
    const svg = select(element);
    svg.selectAll('*').remove();
    svg.attr('viewBox', `0 0 ${side} ${side}`).attr('width', side).attr('height', side);
    const innerW = Math.max(10, side - MARGIN.left - MARGIN.right);
    const innerH = Math.max(10, side - MARGIN.top - MARGIN.bottom);
    const g = svg.append('g').attr('transform', `translate(${MARGIN.left},${MARGIN.top})`);
    const x = scaleLinear().domain([0, 1]).range([0, innerW]);
    const y = scaleLinear().domain([0, 1]).range([innerH, 0]);
    const r = scaleSqrt()
      .domain([0, Math.max(1, max(marks, (m) => m.reps) ?? 1)])
      .range([2, 11]);
    const pct = (v: unknown): string => `${Math.round(Number(v) * 100)} %`;
    g.append('g')
      .attr('class', 'll-chart__grid')
      .call(
        axisLeft(y)
          .ticks(5)
          .tickSize(-innerW)
          .tickFormat(() => ''),
      );
    g.append('g').attr('class', 'll-chart__axis').call(axisLeft(y).ticks(5).tickFormat(pct));
    g.append('g').attr('class', 'll-chart__axis').attr('transform', `translate(0,${innerH})`).call(axisBottom(x).ticks(5).tickFormat(pct));
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
      g.append('text')
        .attr('class', 'll-chart__empty')
        .attr('x', innerW / 2)
        .attr('y', innerH / 2)
        .attr('text-anchor', 'middle')
        .text('No predictions yet');
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
