import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  ViewEncapsulation,
  afterRenderEffect,
  computed,
  inject,
  input,
  viewChild,
} from '@angular/core';
import { area, axisBottom, axisLeft, extent, line, max, min, scaleLinear, scaleUtc, select } from 'd3';
import { ClubFormat } from '../../core/club-format';
import { type ValueKind, formatRange, formatValue, scaleValue, weekDate, weekLabel } from './chart-format';
import { drawWidth, injectChartWidth } from './chart-width';
import type { QuantityFormat } from '../../../../shared/quantity-format';

/** One week of a progress line: the value, the band around it (both ends or neither), and the reps behind it. */
export interface ProgressPoint {
  /** Monday of the ISO week, YYYY-MM-DD. */
  readonly weekStart: string;
  readonly value: number;
  readonly low: number | null;
  readonly high: number | null;
  readonly reps: number;
}

const HEIGHT_PX = 220;
const MARGIN = { top: 12, right: 16, bottom: 28, left: 48 };

/**
 * A line over weeks with a shaded band, for a player's progress in one technique: median carry
 * with its middle half, or hit rate with its confidence interval. A band says how much one
 * week's figure can be trusted, so a coach does not read a 6-repetition week as a breakthrough.
 * Every point is listed in the table below the drawing.
 */
@Component({
  selector: 'll-progress-chart',
  template: `
    <svg #svg role="img" [attr.aria-label]="summary()"></svg>
    <details class="ll-chart__alt">
      <summary>Show as table</summary>
      <div class="ll-chart__alt-scroll">
        <table>
          <thead>
            <tr>
              <th scope="col">Week of</th>
              <th scope="col">{{ valueLabel() }}</th>
              <th scope="col">{{ bandLabel() }}</th>
              <th scope="col">Repetitions</th>
            </tr>
          </thead>
          <tbody>
            @for (row of rows(); track row.weekStart) {
              <tr>
                <td>{{ row.week }}</td>
                <td>{{ row.value }}</td>
                <td>{{ row.band }}</td>
                <td>{{ row.reps }}</td>
              </tr>
            } @empty {
              <tr>
                <td colspan="4">No weeks with data.</td>
              </tr>
            }
          </tbody>
        </table>
      </div>
    </details>
  `,
  styleUrl: './progress-chart.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProgressChart {
  /** The weeks to draw, oldest first. */
  readonly points = input.required<readonly ProgressPoint[]>();
  /** What the line shows, e.g. "Median carry". */
  readonly valueLabel = input.required<string>();
  /** What the band shows, e.g. "Middle half (P25–P75)". */
  readonly bandLabel = input.required<string>();
  /** Whether values are metres or shares (0..1). */
  readonly kind = input<ValueKind>('metres');
  /** A fixed value axis (e.g. [0, 1] for hit rate); by default it fits the data. */
  readonly yDomain = input<readonly [number, number] | null>(null);
  /** One sentence read by screen readers in place of the drawing. */
  readonly summary = input.required<string>();

  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly width = injectChartWidth();
  /** The club's formatter: metres are drawn and labelled in its unit, dates in its locale. */
  private readonly fmt = inject(ClubFormat).format;

  protected readonly rows = computed(() =>
    this.points().map((p) => ({
      weekStart: p.weekStart,
      week: weekLabel(p.weekStart, this.fmt()),
      value: formatValue(p.value, this.kind(), this.fmt()),
      band: formatRange(p.low, p.high, this.kind(), this.fmt()),
      reps: p.reps,
    })),
  );

  constructor() {
    afterRenderEffect(() => this.draw(this.svg().nativeElement, this.points(), drawWidth(this.width()), this.fmt()));
  }

  private draw(element: SVGSVGElement, given: readonly ProgressPoint[], width: number, f: QuantityFormat): void {
    const kind = this.kind();
    // Drawn in the club's unit, so the axis ticks fall on round yards (or metres).
    const inUnit = (v: number | null): number | null => (v === null ? null : scaleValue(v, kind, f));
    const points = given.map((p) => ({ ...p, value: scaleValue(p.value, kind, f), low: inUnit(p.low), high: inUnit(p.high) }));
    const svg = select(element);
    svg.selectAll('*').remove();
    svg.attr('viewBox', `0 0 ${width} ${HEIGHT_PX}`).attr('width', width).attr('height', HEIGHT_PX);
    const innerW = Math.max(10, width - MARGIN.left - MARGIN.right);
    const innerH = HEIGHT_PX - MARGIN.top - MARGIN.bottom;
    const g = svg.append('g').attr('transform', `translate(${MARGIN.left},${MARGIN.top})`);
    if (points.length === 0) {
      g.append('text')
        .attr('class', 'll-chart__empty')
        .attr('x', innerW / 2)
        .attr('y', innerH / 2)
        .attr('text-anchor', 'middle')
        .text('No weeks with data yet');
      return;
    }
    const dates = points.map((p) => weekDate(p.weekStart));
    const [first, last] = extent(dates) as [Date, Date];
    const halfWeekMs = 3.5 * 86_400_000;
    const x = scaleUtc()
      .domain([new Date(first.getTime() - halfWeekMs), new Date(last.getTime() + halfWeekMs)])
      .range([0, innerW]);
    const fixed = this.yDomain();
    let domain: [number, number];
    if (fixed) {
      domain = [fixed[0], fixed[1]];
    } else {
      const lo = min(points, (p) => Math.min(p.value, p.low ?? p.value)) ?? 0;
      const hi = max(points, (p) => Math.max(p.value, p.high ?? p.value)) ?? 1;
      const pad = Math.max(1, (hi - lo) * 0.1);
      domain = [Math.max(0, lo - pad), hi + pad];
    }
    const y = scaleLinear().domain(domain).nice().range([innerH, 0]);
    const tickEvery = Math.max(1, Math.ceil(points.length / Math.max(1, Math.floor(innerW / 64))));
    const tickDates = dates.filter((_, i) => i % tickEvery === 0);

    g.append('g')
      .attr('class', 'll-chart__grid')
      .call(
        axisLeft(y)
          .ticks(5)
          .tickSize(-innerW)
          .tickFormat(() => ''),
      );
    g.append('g')
      .attr('class', 'll-chart__axis')
      .call(
        axisLeft(y)
          .ticks(5)
          .tickFormat((v) => (kind === 'share' ? f.percent(Number(v)) : `${f.number(Number(v))} ${f.unit}`)),
      );
    g.append('g')
      .attr('class', 'll-chart__axis')
      .attr('transform', `translate(0,${innerH})`)
      .call(
        axisBottom(x)
          .tickValues(tickDates)
          .tickFormat((d) => weekLabel((d as Date).toISOString().slice(0, 10), f)),
      );

    const band = area<ProgressPoint>()
      .defined((p) => p.low !== null && p.high !== null)
      .x((p) => x(weekDate(p.weekStart)))
      .y0((p) => y(p.low ?? p.value))
      .y1((p) => y(p.high ?? p.value));
    g.append('path')
      .attr('class', 'll-progress__band')
      .attr('d', band([...points]));
    const path = line<ProgressPoint>()
      .x((p) => x(weekDate(p.weekStart)))
      .y((p) => y(p.value));
    g.append('path')
      .attr('class', 'll-progress__line')
      .attr('d', path([...points]));
    g.selectAll('circle.ll-progress__point')
      .data(points)
      .join('circle')
      .attr('class', 'll-progress__point')
      .attr('cx', (p) => x(weekDate(p.weekStart)))
      .attr('cy', (p) => y(p.value))
      .attr('r', 4)
      .append('title')
      .text((_, i) => {
        const p = given[i]!;
        return `Week of ${weekLabel(p.weekStart, f)}: ${formatValue(p.value, kind, f)} (${formatRange(p.low, p.high, kind, f)}), ${p.reps} reps`;
      });
  }
}
