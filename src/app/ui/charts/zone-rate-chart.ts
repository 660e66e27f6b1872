import { ChangeDetectionStrategy, Component, ViewEncapsulation, computed, input } from '@angular/core';
import { axisBottom, axisLeft, scaleBand, scaleLinear } from 'd3';
import type { QuantityFormat } from '../../../../shared/quantity-format';
import { chartFrame, drawAxis, drawBottomAxis, drawEmptyNote, drawGrid } from './chart-frame';
import { ChartTable } from './chart-table';
import { D3Chart } from './d3-chart';

/** The hit rate of one band of target distance. */
export interface ZoneRate {
  readonly bandStartM: number;
  readonly bandEndM: number;
  readonly reps: number;
  /** Share of repetitions on target (0..1). */
  readonly hitRate: number;
}

const HEIGHT_PX = 220;
const MARGIN = { top: 20, right: 8, bottom: 30, left: 44 };

/** "20–25 m", or in a yards club "21,9–27,3 yd" (bands are metres on the server). */
function bandLabel(z: ZoneRate, f: QuantityFormat): string {
  return `${f.number(f.toUnit(z.bandStartM), 1)}–${f.round(z.bandEndM)}`;
}

/** The bands from the nearest to the farthest in steps of the narrowest band, with or without data. */
export function bandSlots(zones: readonly ZoneRate[]): ZoneRate[] {
  if (zones.length === 0) return [];
  const step = Math.min(...zones.map((z) => z.bandEndM - z.bandStartM));
  const first = Math.min(...zones.map((z) => z.bandStartM));
  const last = Math.max(...zones.map((z) => z.bandEndM));
  if (!(step > 0) || (last - first) / step > 40) return [...zones].sort((a, b) => a.bandStartM - b.bandStartM);
  const slots: ZoneRate[] = [];
  const count = Math.round((last - first) / step);
  for (let i = 0; i < count; i++) {
    const start = first + i * step;
    const found = zones.find((z) => Math.abs(z.bandStartM - start) < 1e-6);
    slots.push(found ?? { bandStartM: start, bandEndM: start + step, reps: 0, hitRate: 0 });
  }
  return slots;
}

/**
 * Hit rate by band of target distance for one technique across a squad: where the squad is
 * comfortable and where its hit rate falls away, which is where next week's drills belong.
 * Each bar is labelled with the repetitions behind it, so a 100 % from two kicks reads as such.
 */
@Component({
  selector: 'll-zone-rate-chart',
  imports: [ChartTable],
  template: `
    <svg #svg role="img" [attr.aria-label]="summary()"></svg>
    <ll-chart-table [headers]="['Target distance', 'Repetitions', 'Hit rate']" [rows]="rows()" empty="No repetitions in this week." />
  `,
  styleUrl: './zone-rate-chart.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ZoneRateChart extends D3Chart {
  /** The bands, nearest first. */
  readonly zones = input.required<readonly ZoneRate[]>();
  /** One sentence read by screen readers in place of the drawing. */
  readonly summary = input.required<string>();

  protected readonly rows = computed(() =>
    this.zones().map((z) => {
      const band = bandLabel(z, this.fmt());
      return { key: band, cells: [band, z.reps, this.fmt().percent(z.hitRate)] };
    }),
  );

  protected override draw(element: SVGSVGElement, width: number, f: QuantityFormat): void {
    const zones = this.zones();
    const frame = chartFrame(element, width, HEIGHT_PX, MARGIN);
    const { plot: g, innerW, innerH } = frame;
    if (zones.length === 0) {
      drawEmptyNote(frame, 'No repetitions of this technique this week');
      return;
    }
    // Every band from the nearest to the farthest, so a distance nobody trained at shows as a gap.
    const slots = bandSlots(zones);
    const x = scaleBand<string>()
      .domain(slots.map((z) => bandLabel(z, f)))
      .range([0, innerW])
      .padding(0.2);
    const y = scaleLinear().domain([0, 1]).range([innerH, 0]);
    drawGrid(frame, axisLeft(y).ticks(4));
    drawAxis(
      frame,
      axisLeft(y)
        .ticks(4)
        .tickFormat((v) => f.percent(Number(v))),
    );
    const every = Math.max(1, Math.ceil(slots.length / Math.max(1, Math.floor(innerW / 56))));
    drawBottomAxis(frame, axisBottom(x).tickValues(slots.map((z) => bandLabel(z, f)).filter((_, i) => i % every === 0)));
    const bars = g.selectAll('g.ll-zone').data(zones).join('g').attr('class', 'll-zone');
    bars
      .append('rect')
      .attr('class', 'll-zone__bar')
      .attr('x', (z) => x(bandLabel(z, f)) ?? 0)
      .attr('width', x.bandwidth())
      .attr('y', (z) => y(z.hitRate))
      .attr('height', (z) => innerH - y(z.hitRate))
      .append('title')
      .text((z) => `${bandLabel(z, f)}: ${f.percent(z.hitRate)} of ${z.reps} reps on target`);
    bars
      .append('text')
      .attr('class', 'll-chart__label ll-zone__reps')
      .attr('x', (z) => (x(bandLabel(z, f)) ?? 0) + x.bandwidth() / 2)
      .attr('y', (z) => y(z.hitRate) - 4)
      .attr('text-anchor', 'middle')
      .text((z) => (x.bandwidth() >= 22 ? `n ${z.reps}` : `${z.reps}`));
  }
}
