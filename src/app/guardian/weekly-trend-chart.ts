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
import { axisBottom, axisLeft, axisRight, line, max, scaleBand, scaleLinear, select } from 'd3';
import { weekLabel } from '../ui/charts/chart-format';
import { drawWidth, injectChartWidth } from '../ui/charts/chart-width';
import { describeTrend, percentLabel } from './child-trend';
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
  template: `
    <!-- The sentence and the table below carry the same content, so the drawing is hidden from screen readers. -->
    <svg #svg aria-hidden="true" focusable="false"></svg>
    <ul class="ll-chart__legend" aria-hidden="true">
      <li><span class="ll-chart__swatch ll-trend__swatch--reps"></span>Repetitions</li>
      <li><span class="ll-chart__swatch ll-trend__swatch--rate"></span>Hit rate</li>
    </ul>
    <p class="ll-trend__summary">{{ summary() }}</p>
    <details class="ll-chart__alt">
      <summary>Show as table</summary>
      <div class="ll-chart__alt-scroll">
        <table>
          <thead>
            <tr>
              <th scope="col">Week of</th>
              <th scope="col">Repetitions</th>
              <th scope="col">Hit rate</th>
            </tr>
          </thead>
          <tbody>
            @for (row of rows(); track row.weekStart) {
              <tr>
                <td>{{ row.week }}</td>
                <td>{{ row.reps }}</td>
                <td>{{ row.hitRate }}</td>
              </tr>
            } @empty {
              <tr>
                <td colspan="3">No weeks with data.</td>
              </tr>
            }
          </tbody>
        </table>
      </div>
    </details>
  `,
  styleUrl: './weekly-trend-chart.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WeeklyTrendChart {
  /** The weeks to draw, oldest first. */
  readonly weeks = input.required<readonly ChildWeek[]>();
  /** The child's first name, for the summary sentence. */
  readonly firstName = input.required<string>();

  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly width = injectChartWidth();

  protected readonly summary = computed(() => describeTrend(this.firstName(), this.weeks()));
  protected readonly rows = computed(() =>
    this.weeks().map((week) => ({
      weekStart: week.weekStart,
      week: weekLabel(week.weekStart),
      reps: week.reps,
      hitRate: week.hitRate === null ? '–' : percentLabel(week.hitRate),
    })),
  );

  constructor() {
    afterRenderEffect(() => this.draw(this.svg().nativeElement, this.weeks(), drawWidth(this.width())));
  }

  private draw(element: SVGSVGElement, weeks: readonly ChildWeek[], width: number): void {
    const svg = select(element);
    svg.selectAll('*').remove();
    svg.attr('viewBox', `0 0 ${width} ${HEIGHT_PX}`).attr('width', width).attr('height', HEIGHT_PX);
    const innerW = Math.max(10, width - MARGIN.left - MARGIN.right);
    const innerH = HEIGHT_PX - MARGIN.top - MARGIN.bottom;
    const g = svg.append('g').attr('transform', `translate(${MARGIN.left},${MARGIN.top})`);
    if (weeks.length === 0) {
      g.append('text')
        .attr('class', 'll-chart__empty')
        .attr('x', innerW / 2)
        .attr('y', innerH / 2)
        .attr('text-anchor', 'middle')
        .text('No weeks with data yet');
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

    g.append('g')
      .attr('class', 'll-chart__grid')
      .call(
        axisLeft(reps)
          .ticks(4)
          .tickSize(-innerW)
          .tickFormat(() => ''),
      );
    g.append('g').attr('class', 'll-chart__axis').call(axisLeft(reps).ticks(4));
    g.append('g')
      .attr('class', 'll-chart__axis')
      .attr('transform', `translate(${innerW},0)`)
      .call(
        axisRight(rate)
          .ticks(2)
          .tickFormat((v) => `${Math.round(Number(v) * 100)} %`),
      );
    g.append('g')
      .attr('class', 'll-chart__axis')
      .attr('transform', `translate(0,${innerH})`)
      .call(
        axisBottom(x)
          .tickValues(weeks.map((week) => week.weekStart).filter((_, i) => i % tickEvery === 0))
          .tickFormat((weekStart) => weekLabel(weekStart)),
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
      .text((week) => `Week of ${weekLabel(week.weekStart)}: ${week.reps} repetitions`);

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
      .text((week) => `Week of ${weekLabel(week.weekStart)}: hit rate ${percentLabel(week.hitRate ?? 0)}`);
  }
}
