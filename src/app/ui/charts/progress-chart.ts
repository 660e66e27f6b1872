import { ChangeDetectionStrategy, Component, ViewEncapsulation, computed, input } from '@angular/core';
import { area, axisBottom, axisLeft, extent, line, max, min, scaleLinear, scaleUtc } from 'd3';
import type { QuantityFormat } from '../../../../shared/quantity-format';
import { type ValueKind, formatRange, formatValue, scaleValue, weekDate, weekLabel } from './chart-format';
import { chartFrame, drawAxis, drawBottomAxis, drawEmptyNote, drawGrid } from './chart-frame';
import { ChartTable } from './chart-table';
import { D3Chart } from './d3-chart';

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
  imports: [ChartTable],
  template: `
    <svg #svg role="img" [attr.aria-label]="summary()"></svg>
    <ll-chart-table [headers]="['Week of', valueLabel(), bandLabel(), 'Repetitions']" [rows]="rows()" empty="No weeks with data." />
  `,
  styleUrl: './progress-chart.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProgressChart extends D3Chart {
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

  protected readonly rows = computed(() =>
    this.points().map((p) => ({
      key: p.weekStart,
      cells: [
        weekLabel(p.weekStart, this.fmt()),
        formatValue(p.value, this.kind(), this.fmt()),
        formatRange(p.low, p.high, this.kind(), this.fmt()),
        p.reps,
      ],
    })),
  );

  protected override draw(element: SVGSVGElement, width: number, f: QuantityFormat): void {
    const given = this.points();
    const kind = this.kind();
    // Drawn in the club's unit, so the axis ticks fall on round yards (or metres).
    const inUnit = (v: number | null): number | null => (v === null ? null : scaleValue(v, kind, f));
    const points = given.map((p) => ({ ...p, value: scaleValue(p.value, kind, f), low: inUnit(p.low), high: inUnit(p.high) }));
    const frame = chartFrame(element, width, HEIGHT_PX, MARGIN);
    const { plot: g, innerW, innerH } = frame;
    if (points.length === 0) {
      drawEmptyNote(frame, 'No weeks with data yet');
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

    drawGrid(frame, axisLeft(y).ticks(5));
    drawAxis(
      frame,
      axisLeft(y)
        .ticks(5)
        .tickFormat((v) => (kind === 'share' ? f.percent(Number(v)) : `${f.number(Number(v))} ${f.unit}`)),
    );
    drawBottomAxis(
      frame,
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
