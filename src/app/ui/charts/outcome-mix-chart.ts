import { ChangeDetectionStrategy, Component, ViewEncapsulation, computed, input } from '@angular/core';
import { axisBottom, axisLeft, scaleBand, scaleLinear } from 'd3';
import type { QuantityFormat } from '../../../../shared/quantity-format';
import type { Outcome } from '../../../../shared/schemas/sync';
import { OUTCOMES, OUTCOME_LABELS } from '../../../../shared/vocabulary';
import { weekLabel } from './chart-format';
import { chartFrame, drawAxis, drawBottomAxis, drawEmptyNote } from './chart-frame';
import { ChartTable } from './chart-table';
import { D3Chart } from './d3-chart';

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
  imports: [ChartTable],
  template: `
    <svg #svg role="img" [attr.aria-label]="summary()"></svg>
    <ul class="ll-chart__legend" aria-hidden="true">
      @for (outcome of outcomes; track outcome) {
        <li><span class="ll-chart__swatch" [style.background]="'var(--ll-outcome-' + outcome + ')'"></span>{{ labels[outcome] }}</li>
      }
    </ul>
    <ll-chart-table [headers]="headers" [rows]="rows()" empty="No weeks with data." />
  `,
  styleUrl: './outcome-mix-chart.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutcomeMixChart extends D3Chart {
  /** The weeks, oldest first (drawn top to bottom). */
  readonly weeks = input.required<readonly OutcomeWeek[]>();
  /** One sentence read by screen readers in place of the drawing. */
  readonly summary = input.required<string>();

  protected readonly outcomes = OUTCOMES;
  protected readonly labels = OUTCOME_LABELS;
  protected readonly headers = ['Week of', 'Reps', ...OUTCOMES.map((o) => OUTCOME_LABELS[o])];

  protected readonly rows = computed(() =>
    this.weeks().map((w) => ({
      key: w.weekStart,
      cells: [weekLabel(w.weekStart, this.fmt()), w.reps, ...OUTCOMES.map((o) => this.fmt().percent(w.share[o] ?? 0))],
    })),
  );

  protected override draw(element: SVGSVGElement, width: number, f: QuantityFormat): void {
    const weeks = this.weeks();
    const height = MARGIN.top + MARGIN.bottom + Math.max(1, weeks.length) * ROW_PX;
    const frame = chartFrame(element, width, height, MARGIN);
    const { plot: g, innerW, innerH } = frame;
    if (weeks.length === 0) {
      drawEmptyNote(frame, 'No weeks with data yet', 4);
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
    drawAxis(
      frame,
      axisLeft(y)
        .tickSize(0)
        .tickPadding(6)
        .tickFormat((d) => weekLabel(d, f)),
    );
    drawBottomAxis(
      frame,
      axisBottom(x)
        .ticks(Math.min(5, Math.floor(innerW / 60)))
        .tickFormat((v) => f.percent(Number(v))),
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
      .text((s) => `Week of ${weekLabel(s.weekStart, f)}: ${OUTCOME_LABELS[s.outcome]} ${f.percent(s.share)} of ${s.reps} reps`);
  }
}
