import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  ViewEncapsulation,
  afterRenderEffect,
  computed,
  input,
  viewChild,
  inject,
} from '@angular/core';
import { axisBottom, axisLeft, scaleBand, scaleLinear, select } from 'd3';
import { drawWidth, injectChartWidth } from './chart-width';
import type { QuantityFormat } from '../../../../shared/quantity-format';
import { ClubFormat } from '../../core/club-format';

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
  template: `
    <svg #svg role="img" [attr.aria-label]="summary()"></svg>
    <details class="ll-chart__alt">
      <summary>Show as table</summary>
      <div class="ll-chart__alt-scroll">
        <table>
          <thead>
            <tr>
              <th scope="col">Target distance</th>
              <th scope="col">Repetitions</th>
              <th scope="col">Hit rate</th>
            </tr>
          </thead>
          <tbody>
            @for (row of rows(); track row.band) {
              <tr>
                <td>{{ row.band }}</td>
                <td>{{ row.reps }}</td>
                <td>{{ row.hitRate }}</td>
              </tr>
            } @empty {
              <tr>
                <td colspan="3">No repetitions in this week.</td>
              </tr>
            }
          </tbody>
        </table>
      </div>
    </details>
  `,
  styleUrl: './zone-rate-chart.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ZoneRateChart {
  /** The bands, nearest first. */
  readonly zones = input.required<readonly ZoneRate[]>();
  /** One sentence read by screen readers in place of the drawing. */
  readonly summary = input.required<string>();

  private readonly svg = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly width = injectChartWidth();
  /** The club's formatter (distance unit, locale). */
  private readonly fmt = inject(ClubFormat).format;

  protected readonly rows = computed(() =>
    this.zones().map((z) => ({ band: bandLabel(z, this.fmt()), reps: z.reps, hitRate: this.fmt().percent(z.hitRate) })),
  );

  constructor() {
    afterRenderEffect(() => this.draw(this.svg().nativeElement, this.zones(), drawWidth(this.width())));
  }

  private draw(element: SVGSVGElement, zones: readonly ZoneRate[], width: number): void {
    const svg = select(element);
    svg.selectAll('*').remove();
    svg.attr('viewBox', `0 0 ${width} ${HEIGHT_PX}`).attr('width', width).attr('height', HEIGHT_PX);
    const innerW = Math.max(10, width - MARGIN.left - MARGIN.right);
    const innerH = HEIGHT_PX - MARGIN.top - MARGIN.bottom;
    const g = svg.append('g').attr('transform', `translate(${MARGIN.left},${MARGIN.top})`);
    if (zones.length === 0) {
      g.append('text')
        .attr('class', 'll-chart__empty')
        .attr('x', innerW / 2)
        .attr('y', innerH / 2)
        .attr('text-anchor', 'middle')
        .text('No repetitions of this technique this week');
      return;
    }
    // Every band from the nearest to the farthest, so a distance nobody trained at shows as a gap.
    const slots = bandSlots(zones);
    const x = scaleBand<string>()
      .domain(slots.map((z) => bandLabel(z, this.fmt())))
      .range([0, innerW])
      .padding(0.2);
    const y = scaleLinear().domain([0, 1]).range([innerH, 0]);
    g.append('g')
      .attr('class', 'll-chart__grid')
      .call(
        axisLeft(y)
          .ticks(4)
          .tickSize(-innerW)
          .tickFormat(() => ''),
      );
    g.append('g')
      .attr('class', 'll-chart__axis')
      .call(
        axisLeft(y)
          .ticks(4)
          .tickFormat((v) => this.fmt().percent(Number(v))),
      );
    const every = Math.max(1, Math.ceil(slots.length / Math.max(1, Math.floor(innerW / 56))));
    g.append('g')
      .attr('class', 'll-chart__axis')
      .attr('transform', `translate(0,${innerH})`)
      .call(axisBottom(x).tickValues(slots.map((z) => bandLabel(z, this.fmt())).filter((_, i) => i % every === 0)));
    const bars = g.selectAll('g.ll-zone').data(zones).join('g').attr('class', 'll-zone');
    bars
      .append('rect')
      .attr('class', 'll-zone__bar')
      .attr('x', (z) => x(bandLabel(z, this.fmt())) ?? 0)
      .attr('width', x.bandwidth())
      .attr('y', (z) => y(z.hitRate))
      .attr('height', (z) => innerH - y(z.hitRate))
      .append('title')
      .text((z) => `${bandLabel(z, this.fmt())}: ${this.fmt().percent(z.hitRate)} of ${z.reps} reps on target`);
    bars
      .append('text')
      .attr('class', 'll-chart__label ll-zone__reps')
      .attr('x', (z) => (x(bandLabel(z, this.fmt())) ?? 0) + x.bandwidth() / 2)
      .attr('y', (z) => y(z.hitRate) - 4)
      .attr('text-anchor', 'middle')
      .text((z) => (x.bandwidth() >= 22 ? `n ${z.reps}` : `${z.reps}`));
  }
}
