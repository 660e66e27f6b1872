import { ChangeDetectionStrategy, Component, ViewEncapsulation, computed, input } from '@angular/core';
import { axisBottom, axisLeft, axisRight, line, max, scaleBand, scaleLinear } from 'd3';
import type { QuantityFormat } from '../../../shared/quantity-format';
import { weekLabel } from '../ui/charts/chart-format';
import { chartFrame, drawAxis, drawBottomAxis, drawEmptyNote, drawGrid } from '../ui/charts/chart-frame';
import { ChartTable } from '../ui/charts/chart-table';
import { D3Chart } from '../ui/charts/d3-chart';
import { describeTrend } from './child-trend';
import type { ChildWeek } from '../core/guardians/guardian-api';

const HEIGHT_PX = 168;
const MARGIN = { top: 10, right: 40, bottom: 24, left: 32 };

/**
 * A child's weeks for their guardian: repetitions as bars, hit rate as a line on its own
 * 0–100 % scale. Deliberately small and plain — a parent wants "is it going up", not a coach's
 * analysis — with a one-sentence summary for screen readers and a table for the exact figures.
 */
@Component({
  selector: 'll-weekly-trend-chart',
  imports: [ChartTable],
  template: `
    <!-- The sentence and the table below carry the same content, so the drawing is hidden from screen readers. -->
    <svg #svg aria-hidden="true" focusable="false"></svg>
    <ul class="ll-chart__legend" aria-hidden="true">
      <li><span class="ll-chart__swatch ll-trend__swatch--reps"></span>Repetitions</li>
      <li><span class="ll-chart__swatch ll-trend__swatch--rate"></span>Hit rate</li>
    </ul>
    <p class="ll-trend__summary">{{ summary() }}</p>
    <ll-chart-table [headers]="['Week of', 'Repetitions', 'Hit rate']" [rows]="rows()" empty="No weeks with data." />
  `,
  styleUrl: './weekly-trend-chart.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WeeklyTrendChart extends D3Chart {
  /** The weeks to draw, oldest first. */
  readonly weeks = input.required<readonly ChildWeek[]>();
  /** The child's first name, for the summary sentence. */
  readonly firstName = input.required<string>();

  protected readonly summary = computed(() => describeTrend(this.firstName(), this.weeks()));
  protected readonly rows = computed(() =>
    this.weeks().map((week) => ({
      key: week.weekStart,
      cells: [weekLabel(week.weekStart, this.fmt()), week.reps, this.fmt().percent(week.hitRate)],
    })),
  );

  protected override draw(element: SVGSVGElement, width: number, f: QuantityFormat): void {
    const weeks = this.weeks();
    const frame = chartFrame(element, width, HEIGHT_PX, MARGIN);
    const { plot: g, innerW, innerH } = frame;
    if (weeks.length === 0) {
      drawEmptyNote(frame, 'No weeks with data yet');
      return;
    }
    const x = scaleBand<string>()
      .domain(weeks.map((week) => week.weekStart))
      .range([0, innerW])
      .paddingInner(0.3)
      .paddingOuter(0.15);
    const reps = scaleLinear()
      .domain([0, Math.max(1, max(weeks, (week) => week.reps) ?? 1)])
      .nice()
      .range([innerH, 0]);
    const rate = scaleLinear().domain([0, 1]).range([innerH, 0]);
    const tickEvery = Math.max(1, Math.ceil(weeks.length / Math.max(1, Math.floor(innerW / 56))));

    drawGrid(frame, axisLeft(reps).ticks(4));
    drawAxis(frame, axisLeft(reps).ticks(4));
    drawAxis(
      frame,
      axisRight(rate)
        .ticks(2)
        .tickFormat((v) => f.percent(Number(v))),
      { x: innerW },
    );
    drawBottomAxis(
      frame,
      axisBottom(x)
        .tickValues(weeks.map((week) => week.weekStart).filter((_, i) => i % tickEvery === 0))
        .tickFormat((weekStart) => weekLabel(weekStart, f)),
    );

    const bandWidth = x.bandwidth();
    g.selectAll('rect.ll-trend__bar')
      .data(weeks)
      .join('rect')
      .attr('class', 'll-trend__bar')
      .attr('x', (week) => x(week.weekStart) ?? 0)
      .attr('y', (week) => reps(week.reps))
      .attr('width', bandWidth)
      .attr('height', (week) => innerH - reps(week.reps))
      .append('title')
      .text((week) => `Week of ${weekLabel(week.weekStart, f)}: ${week.reps} repetitions`);

    const centre = (week: ChildWeek): number => (x(week.weekStart) ?? 0) + bandWidth / 2;
    const rateLine = line<ChildWeek>()
      .defined((week) => week.hitRate !== null)
      .x(centre)
      .y((week) => rate(week.hitRate ?? 0));
    g.append('path')
      .attr('class', 'll-trend__line')
      .attr('d', rateLine([...weeks]));
    g.selectAll('circle.ll-trend__point')
      .data(weeks.filter((week) => week.hitRate !== null))
      .join('circle')
      .attr('class', 'll-trend__point')
      .attr('cx', centre)
      .attr('cy', (week) => rate(week.hitRate ?? 0))
      .attr('r', 3.5)
      .append('title')
      .text((week) => `Week of ${weekLabel(week.weekStart, f)}: hit rate ${f.percent(week.hitRate)}`);
  }
}
