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
import { axisBottom, axisLeft, scaleBand, scaleLinear, select } from 'd3';
import type { Outcome } from '../../../../shared/schemas/sync';
import { weekLabel } from './chart-format';
import { drawWidth, injectChartWidth } from './chart-width';
import { OUTCOMES, OUTCOME_LABELS } from '../../../../shared/vocabulary';

/** One week of outcomes: how many repetitions, and the share (0..1) of each outcome. */
export interface OutcomeWeek {
  readonly weekStart: string;
  readonly reps: number;
  readonly share: Readonly<Record<Outcome, number>>;
}

/** One drawn segment: a week's share of one outcome. */
interface Segment {
  readonly weekStart: string;
  readonly outcome: Outcome;
  readonly start: number;
  readonly share: number;
  readonly reps: number;
}

const ROW_PX = 26;
const MARGIN = { top: 4, right: 12, bottom: 24, left: 56 };

/**
 * The outcome mix per week as 100 % bars: how a player's misses change (more "short" in a
 * headwind week, more "left" after a change of technique) says more than the hit rate alone.
 * Only outcomes that happened are drawn; the legend and the table name every outcome.
 */
@Component({
  selector: 'll-outcome-mix-chart',
  template: `
    <svg #svg role="img" [attr.aria-label]="summary()"></svg>
    <ul class="ll-chart__legend" aria-hidden="true">
      @for (outcome of outcomes; track outcome) {
        <li><span class="ll-chart__swatch" [style.background]="'var(--ll-outcome-' + outcome + ')'"></span>{{ labels[outcome] }}</li>
      }
    </ul>
    <details class="ll-chart__alt">
      <summary>Show as table</summary>
      <div class="ll-chart__alt-scroll">
        <table>
          <thead>
            <tr>
              <th scope="col">Week of</th>
              <th scope="col">Reps</th>
              @for (outcome of outcomes; track outcome) {
                <th scope="col">{{ labels[outcome] }}</th>
              }
            </tr>
          </thead>
          <tbody>
            @for (row of rows(); track row.weekStart) {
              <tr>
                <td>{{ row.week }}</td>
                <td>{{ row.reps }}</td>
                @for (cell of row.cells; track $index) {
                  <td>{{ cell }}</td>
                }
              </tr>
            } @empty {
              <tr>
                <td [attr.colspan]="outcomes.length + 2">No weeks with data.</td>
              </tr>
            }
          </tbody>
        </table>
      </div>
    </details>
  `,
  styleUrl: './outcome-mix-chart.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutcomeMixChart {
  /** The weeks, oldest first (drawn top to bottom). */
  readonly weeks = input.required<readonly OutcomeWeek[]>();
  /** One sentence read by screen readers in place of the drawing. */
  readonly summary = input.required<string>();

  protected readonly outcomes = OUTCOMES;
  protected readonly labels = OUTCOME_LABELS;
  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly width = injectChartWidth();

  protected readonly rows = computed(() =>
    this.weeks().map((w) => ({
      weekStart: w.weekStart,
      week: weekLabel(w.weekStart),
      reps: w.reps,
      cells: OUTCOMES.map((o) => `${Math.round((w.share[o] ?? 0) * 100)} %`),
    })),
  );

  constructor() {
    afterRenderEffect(() => this.draw(this.svg().nativeElement, this.weeks(), drawWidth(this.width())));
  }

  private draw(element: SVGSVGElement, weeks: readonly OutcomeWeek[], width: number): void {
    const svg = select(element);
    svg.selectAll('*').remove();
    const height = MARGIN.top + MARGIN.bottom + Math.max(1, weeks.length) * ROW_PX;
    svg.attr('viewBox', `0 0 ${width} ${height}`).attr('width', width).attr('height', height);
    const innerW = Math.max(10, width - MARGIN.left - MARGIN.right);
    const innerH = height - MARGIN.top - MARGIN.bottom;
    const g = svg.append('g').attr('transform', `translate(${MARGIN.left},${MARGIN.top})`);
    if (weeks.length === 0) {
      g.append('text')
        .attr('class', 'll-chart__empty')
        .attr('x', innerW / 2)
        .attr('y', innerH / 2 + 4)
        .attr('text-anchor', 'middle')
        .text('No weeks with data yet');
      return;
    }
    const y = scaleBand<string>()
      .domain(weeks.map((w) => w.weekStart))
      .range([0, innerH])
      .padding(0.18);
    const x = scaleLinear().domain([0, 1]).range([0, innerW]);
    const segments: Segment[] = [];
    for (const w of weeks) {
      let start = 0;
      for (const outcome of OUTCOMES) {
        const share = w.share[outcome] ?? 0;
        if (share > 0) {
          segments.push({ weekStart: w.weekStart, outcome, start, share, reps: w.reps });
        }
        start += share;
      }
    }
    g.append('g')
      .attr('class', 'll-chart__axis')
      .call(
        axisLeft(y)
          .tickSize(0)
          .tickPadding(6)
          .tickFormat((d) => weekLabel(d)),
      );
    g.append('g')
      .attr('class', 'll-chart__axis')
      .attr('transform', `translate(0,${innerH})`)
      .call(
        axisBottom(x)
          .ticks(Math.min(5, Math.floor(innerW / 60)))
          .tickFormat((v) => `${Math.round(Number(v) * 100)} %`),
      );
    g.selectAll('rect.ll-outcome__segment')
      .data(segments)
      .join('rect')
      .attr('class', (s) => `ll-outcome__segment ll-outcome__segment--${s.outcome}`)
      .attr('x', (s) => x(s.start))
      .attr('width', (s) => Math.max(0, x(s.start + s.share) - x(s.start)))
      .attr('y', (s) => y(s.weekStart) ?? 0)
      .attr('height', y.bandwidth())
      .append('title')
      .text((s) => `Week of ${weekLabel(s.weekStart)}: ${OUTCOME_LABELS[s.outcome]} ${Math.round(s.share * 100)} % of ${s.reps} reps`);
  }
}
