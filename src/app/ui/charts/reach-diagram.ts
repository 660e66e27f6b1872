import { ChangeDetectionStrategy, Component, ViewEncapsulation, computed, input } from '@angular/core';
import { range, select } from 'd3';
import type { DistributionSummary, LandingEllipse } from '../../../../shared/flight';
import type { QuantityFormat } from '../../../../shared/quantity-format';
import { formatValue } from './chart-format';
import { ChartTable } from './chart-table';
import { D3Chart } from './d3-chart';

/** A target drawn on the diagram: a drill target the player has trained at, or the suggested next one. */
export interface ReachTarget {
  readonly distanceM: number;
  readonly radiusM: number;
  readonly kind: 'drill' | 'next';
  /** Predicted hit probability of this target under the envelope (0..1), when known. */
  readonly probability: number | null;
  /** How many logged repetitions aimed at it (drill targets). */
  readonly reps: number | null;
}

/** What the diagram draws: the envelope's landing cloud, its ellipse and percentiles. */
export interface ReachPicture {
  readonly cloud: { readonly xM: readonly number[]; readonly yM: readonly number[] };
  readonly ellipse: LandingEllipse;
  readonly carryM: DistributionSummary;
  readonly lateralM: DistributionSummary;
}

const MAX_DRAW_WIDTH_PX = 560;
/** Numbers each diagram's clip path so two diagrams on a page never share an id. */
let clipCounter = 0;
const MARGIN = { top: 16, right: 8, bottom: 28, left: 8 };
/** The tallest the drawing gets relative to its width, so a long, narrow envelope still fits a phone screen. */
const MAX_ASPECT = 1.2;

/** A distance-ring spacing that gives four to eight rings. */
function ringStep(forwardM: number): number {
  if (forwardM <= 20) return 2;
  if (forwardM <= 40) return 5;
  return 10;
}

/** The |value| below which 98 % of values lie (a few wild kicks should not shrink the picture). */
function absQuantile98(values: readonly number[]): number {
  if (values.length === 0) return 0;
  const sorted = values.map(Math.abs).sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor(0.98 * sorted.length))] ?? 0;
}

/**
 * A player's reach envelope seen from above, drawn to scale from the kick spot: distance rings,
 * the aim line, every sampled landing, the 90 % landing ellipse, the drill targets the player has
 * trained at, the suggested next target and the reliable-reach ring. Forward is up the screen and
 * the kicker's left is on the left, as a coach standing behind the ball sees it. The table below
 * gives the same numbers in words.
 */
@Component({
  selector: 'll-reach-diagram',
  imports: [ChartTable],
  template: `
    <svg #svg role="img" [attr.aria-label]="summary()"></svg>
    <ul class="ll-chart__legend" aria-hidden="true">
      <li><span class="ll-chart__swatch ll-reach__swatch--landing"></span>Predicted landings</li>
      <li><span class="ll-chart__swatch ll-reach__swatch--ellipse"></span>90 % of landings</li>
      @if (hasDrill()) {
        <li><span class="ll-chart__swatch ll-reach__swatch--drill"></span>Drill targets</li>
      }
      @if (hasNext()) {
        <li><span class="ll-chart__swatch ll-reach__swatch--next"></span>Next target</li>
      }
      @if (reliableReachM() !== null) {
        <li><span class="ll-chart__swatch ll-reach__swatch--reliable"></span>Reliable reach</li>
      }
    </ul>
    <ll-chart-table [rows]="rows()" [rowHeaders]="true" />
  `,
  styleUrl: './reach-diagram.scss',
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReachDiagram extends D3Chart {
  /** The envelope to draw. */
  readonly picture = input.required<ReachPicture>();
  /** Targets to draw on the aim line. */
  readonly targets = input<readonly ReachTarget[]>([]);
  /** Reliable reach, metres, for the ring; null when no distance reaches the threshold. */
  readonly reliableReachM = input<number | null>(null);
  /** One sentence read by screen readers in place of the drawing. */
  readonly summary = input.required<string>();

  protected readonly hasDrill = computed(() => this.targets().some((t) => t.kind === 'drill'));
  protected readonly hasNext = computed(() => this.targets().some((t) => t.kind === 'next'));

  protected readonly rows = computed(() => {
    const p = this.picture();
    const f = this.fmt();
    const lateral = (v: number): string =>
      Math.abs(v) < 0.05 ? 'on the aim line' : `${f.distance(Math.abs(v))} ${v > 0 ? 'left' : 'right'}`;
    const rows = [
      { label: 'Carry, 10th percentile', value: formatValue(p.carryM.p10, 'metres', this.fmt()) },
      { label: 'Carry, median', value: formatValue(p.carryM.p50, 'metres', this.fmt()) },
      { label: 'Carry, 90th percentile', value: formatValue(p.carryM.p90, 'metres', this.fmt()) },
      { label: 'Lateral, median', value: lateral(p.lateralM.p50) },
      { label: 'Lateral, 10th–90th percentile', value: `${lateral(p.lateralM.p10)} to ${lateral(p.lateralM.p90)}` },
      {
        label: '90 % ellipse',
        value: `${f.distance(2 * p.ellipse.semiMajorM)} × ${f.distance(2 * p.ellipse.semiMinorM)}`,
      },
      {
        label: 'Reliable reach',
        value: this.reliableReachM() === null ? 'none' : formatValue(this.reliableReachM(), 'metres', this.fmt()),
      },
    ];
    for (const t of this.targets()) {
      const what = t.kind === 'next' ? 'Next target' : `Drill target${t.reps === null ? '' : ` (${t.reps} reps)`}`;
      rows.push({
        label: `${what} ${f.round(t.distanceM)}, radius ${f.round(t.radiusM)}`,
        value: t.probability === null ? '–' : `${f.percent(t.probability)} predicted hits`,
      });
    }
    return rows.map((row) => ({ key: row.label, cells: [row.label, row.value] }));
  });

  /** Draws to scale in metres; labels are in the club's unit. */
  protected override draw(element: SVGSVGElement, available: number, f: QuantityFormat): void {
    const picture = this.picture();
    const targets = this.targets();
    const reliableReachM = this.reliableReachM();
    const width = Math.min(available, MAX_DRAW_WIDTH_PX);
    const { xM, yM } = picture.cloud;
    const farthest = Math.max(
      picture.carryM.p90,
      ...targets.map((t) => t.distanceM + t.radiusM),
      reliableReachM ?? 0,
      absQuantile98(xM),
      5,
    );
    // Rings fall on round distances in the club's unit (5 m or 5 yd apart); the drawing stays to scale.
    const unitsPerM = f.toUnit(1);
    const step = ringStep(farthest * unitsPerM);
    const forwardM = (Math.ceil((farthest * unitsPerM * 1.08) / step) * step) / unitsPerM;
    const innerW = Math.max(10, width - MARGIN.left - MARGIN.right);
    const lateralHalfM = Math.max(forwardM / (2 * MAX_ASPECT), absQuantile98(yM) * 1.15, ...targets.map((t) => t.radiusM * 1.5));
    const scale = innerW / (2 * lateralHalfM);
    const innerH = forwardM * scale;
    const height = innerH + MARGIN.top + MARGIN.bottom;
    const cx = MARGIN.left + innerW / 2;
    const baseY = MARGIN.top + innerH;
    const sx = (lateral: number): number => cx - lateral * scale;
    const sy = (forward: number): number => baseY - forward * scale;

    const svg = select(element);
    svg.selectAll('*').remove();
    svg.attr('viewBox', `0 0 ${width} ${height}`).attr('width', width).attr('height', height);
    const clipId = `ll-reach-clip-${++clipCounter}`;
    svg
      .append('clipPath')
      .attr('id', clipId)
      .append('rect')
      .attr('x', MARGIN.left)
      .attr('y', MARGIN.top)
      .attr('width', innerW)
      .attr('height', innerH);
    svg
      .append('rect')
      .attr('class', 'll-reach__ground')
      .attr('x', MARGIN.left)
      .attr('y', MARGIN.top)
      .attr('width', innerW)
      .attr('height', innerH);
    const plot = svg.append('g').attr('clip-path', `url(#${clipId})`);

    const rings = range(step, forwardM * unitsPerM + step / 2, step);
    plot
      .selectAll('circle.ll-reach__ring')
      .data(rings)
      .join('circle')
      .attr('class', 'll-reach__ring')
      .attr('cx', cx)
      .attr('cy', baseY)
      .attr('r', (d) => (d / unitsPerM) * scale);
    plot.append('line').attr('class', 'll-reach__aim').attr('x1', cx).attr('y1', baseY).attr('x2', cx).attr('y2', MARGIN.top);

    plot
      .selectAll('circle.ll-reach__landing')
      .data(xM.map((x, i) => [x, yM[i] ?? 0] as const))
      .join('circle')
      .attr('class', 'll-reach__landing')
      .attr('cx', (d) => sx(d[1]))
      .attr('cy', (d) => sy(d[0]))
      .attr('r', 1.6);

    const e = picture.ellipse;
    const a = (e.angleDeg * Math.PI) / 180;
    const outline = range(0, 73).map((i) => {
      const t = (i / 72) * 2 * Math.PI;
      const fx = e.centerXM + e.semiMajorM * Math.cos(t) * Math.cos(a) - e.semiMinorM * Math.sin(t) * Math.sin(a);
      const fy = e.centerYM + e.semiMajorM * Math.cos(t) * Math.sin(a) + e.semiMinorM * Math.sin(t) * Math.cos(a);
      return `${sx(fy).toFixed(1)},${sy(fx).toFixed(1)}`;
    });
    plot
      .append('path')
      .attr('class', 'll-reach__ellipse')
      .attr('d', `M${outline.join('L')}Z`);

    if (reliableReachM !== null) {
      plot
        .append('circle')
        .attr('class', 'll-reach__reliable')
        .attr('cx', cx)
        .attr('cy', baseY)
        .attr('r', reliableReachM * scale);
    }
    plot
      .selectAll('circle.ll-reach__target')
      .data(targets)
      .join('circle')
      .attr('class', (t) => `ll-reach__target ll-reach__target--${t.kind}`)
      .attr('cx', cx)
      .attr('cy', (t) => sy(t.distanceM))
      .attr('r', (t) => Math.max(2, t.radiusM * scale))
      .append('title')
      .text((t) => `${t.kind === 'next' ? 'Next target' : 'Drill target'} ${f.round(t.distanceM)}, radius ${f.round(t.radiusM)}`);

    // Ring labels sit on each ring a little right of the aim line, where targets never are, and
    // only where they fall inside the drawing.
    const labelAngle = (28 * Math.PI) / 180;
    svg
      .selectAll('text.ll-reach__ring-label')
      .data(
        rings.filter(
          (d) =>
            cx + (d / unitsPerM) * scale * Math.sin(labelAngle) < MARGIN.left + innerW - 24 &&
            baseY - (d / unitsPerM) * scale * Math.cos(labelAngle) > MARGIN.top + 8,
        ),
      )
      .join('text')
      .attr('class', 'll-chart__label ll-reach__ring-label')
      .attr('x', (d) => cx + (d / unitsPerM) * scale * Math.sin(labelAngle))
      .attr('y', (d) => baseY - (d / unitsPerM) * scale * Math.cos(labelAngle) + 4)
      .attr('text-anchor', 'middle')
      .text((d) => `${f.number(d)} ${f.unit}`);
    if (reliableReachM !== null) {
      svg
        .append('text')
        .attr('class', 'll-reach__reliable-label')
        .attr('x', MARGIN.left + 4)
        .attr('y', Math.max(MARGIN.top + 12, sy(reliableReachM) - 4))
        .text(`reliable ${f.distance(reliableReachM)}`);
    }
    svg.append('circle').attr('class', 'll-reach__spot').attr('cx', cx).attr('cy', baseY).attr('r', 4);
    svg
      .append('text')
      .attr('class', 'll-chart__label')
      .attr('x', MARGIN.left)
      .attr('y', height - 8)
      .text('← left');
    svg
      .append('text')
      .attr('class', 'll-chart__label')
      .attr('x', MARGIN.left + innerW)
      .attr('y', height - 8)
      .attr('text-anchor', 'end')
      .text('right →');
    svg
      .append('text')
      .attr('class', 'll-chart__label')
      .attr('x', cx)
      .attr('y', height - 8)
      .attr('text-anchor', 'middle')
      .text('kick spot');
  }
}
