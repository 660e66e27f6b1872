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
import { axisBottom, axisLeft, line, max, scaleLinear, select, type Selection } from 'd3';
import { GOAL_HEIGHT_M, GOAL_WIDTH_M } from '../../../../shared/flight';
import type { QuantityFormat } from '../../../../shared/quantity-format';
import { ClubFormat } from '../../core/club-format';
import { injectChartWidth } from './chart-width';

/** One trajectory: `x` along the aim, `y` height (side view) or lateral offset, + = left (top view). */
export interface TrajectoryTrace {
  readonly id: string;
  readonly label: string;
  readonly points: readonly { readonly x: number; readonly y: number }[];
  /** Which of the three line styles (colour and dash) to use: 0, 1 or 2. */
  readonly tone: number;
  /** Whether this is the trace being edited (drawn heavier). */
  readonly emphasised: boolean;
}

/** Reference marks drawn to the chart's scale. */
export interface TrajectoryLandmarks {
  /** Distance of the wall from the ball, m (IFAB Laws of the Game, Law 13: 9.15 m). */
  readonly wallAtM?: number;
  /** Height of the wall, m (side view). */
  readonly wallHeightM?: number;
  /** Distance of the goal line, m; the goal is drawn 7.32 × 2.44 m (IFAB Laws of the Game, Law 1). */
  readonly goalAtM?: number;
  /** Where the goal's centre is across the aim line, m, + = left (top view; default on the aim). */
  readonly goalCentreM?: number;
}

/** Which way a trajectory chart looks at the kick. */
export type TrajectoryView = 'side' | 'top';

const MARGIN = { top: 24, right: 14, bottom: 36, left: 44 };

/**
 * A kick's path (or several overlaid) from the side or from above, in d3 with axes in the club's unit, a wall and
 * the goal drawn to the same scale, and a landing mark per kick. Responsive: it redraws for its own
 * width, so it fits a 360 px phone and a desktop panel. Colours come from CSS custom properties with
 * `light-dark()`, and each kick also differs by dash pattern so the overlay reads without colour. The
 * `summary` is the chart's accessible name; screens pair it with a table of the same figures.
 */
@Component({
  selector: 'll-trajectory-chart',
  template: `
    <svg #svg class="ll-trajectory__svg" role="img" [attr.aria-label]="summary()" [attr.height]="height()"></svg>
    @if (traces().length > 1) {
      <ul class="ll-trajectory__legend" aria-hidden="true">
        @for (trace of traces(); track trace.id) {
          <li>
            <svg width="28" height="10" class="ll-trajectory__swatch">
              <line x1="1" y1="5" x2="27" y2="5" [attr.class]="'ll-trajectory__trace ll-trajectory__trace--tone-' + trace.tone" />
            </svg>
            {{ trace.label }}
          </li>
        }
      </ul>
    }
  `,
  styles: `
    ll-trajectory-chart {
      display: block;
      --ll-tone-0: light-dark(#1b2a41, #a9c7ff);
      --ll-tone-1: light-dark(#8a5700, #f0a202);
      --ll-tone-2: light-dark(#006a60, #5fd6c4);
      --ll-chart-ink: var(--mat-sys-on-surface-variant);
      --ll-chart-grid: color-mix(in srgb, var(--mat-sys-on-surface) 12%, transparent);
      color: var(--ll-chart-ink);
    }
    .ll-trajectory__svg {
      display: block;
      width: 100%;
      overflow: visible;
    }
    .ll-trajectory__svg text {
      font: var(--mat-sys-label-small);
      fill: var(--ll-chart-ink);
    }
    .ll-trajectory__grid line {
      stroke: var(--ll-chart-grid);
    }
    .ll-trajectory__ground {
      stroke: var(--ll-chart-ink);
      stroke-width: 1.5;
    }
    .ll-trajectory__trace {
      fill: none;
      stroke-width: 2.5;
      stroke-linecap: round;
      stroke-linejoin: round;
    }
    .ll-trajectory__trace--emphasised {
      stroke-width: 4;
    }
    .ll-trajectory__trace--tone-0 {
      stroke: var(--ll-tone-0);
    }
    .ll-trajectory__trace--tone-1 {
      stroke: var(--ll-tone-1);
      stroke-dasharray: 9 5;
    }
    .ll-trajectory__trace--tone-2 {
      stroke: var(--ll-tone-2);
      stroke-dasharray: 2 5;
    }
    .ll-trajectory__landing {
      stroke: var(--mat-sys-surface);
      stroke-width: 1.5;
    }
    .ll-trajectory__landing--tone-0 {
      fill: var(--ll-tone-0);
    }
    .ll-trajectory__landing--tone-1 {
      fill: var(--ll-tone-1);
    }
    .ll-trajectory__landing--tone-2 {
      fill: var(--ll-tone-2);
    }
    .ll-trajectory__wall {
      fill: color-mix(in srgb, var(--mat-sys-error) 35%, transparent);
      stroke: var(--mat-sys-error);
    }
    .ll-trajectory__goal {
      fill: none;
      stroke: var(--mat-sys-on-surface);
      stroke-width: 3;
    }
    .ll-trajectory__legend {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 16px;
      margin: 4px 0 0;
      padding: 0;
      list-style: none;
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface);
    }
    .ll-trajectory__legend li {
      display: inline-flex;
      align-items: center;
      gap: 6px;
    }
  `,
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TrajectoryChart {
  /** Side view (height over distance) or top view (lateral offset over distance). */
  readonly view = input.required<TrajectoryView>();
  /** The kicks to draw, in legend order. */
  readonly traces = input.required<readonly TrajectoryTrace[]>();
  /** Wall and goal, drawn to scale. */
  readonly landmarks = input<TrajectoryLandmarks>({});
  /** The chart's accessible name: what it shows, in words. */
  readonly summary = input.required<string>();

  private readonly svgRef = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly width = injectChartWidth();
  /** The club's formatter: numbers in its locale, ground distances in its unit (heights in metres, as labelled). */
  private readonly fmt = inject(ClubFormat).format;
  protected readonly height = computed(() => {
    const w = this.width() || 320;
    return this.view() === 'side' ? Math.round(Math.min(300, Math.max(170, w * 0.38))) : Math.round(Math.min(240, Math.max(140, w * 0.28)));
  });

  constructor() {
    afterRenderEffect(() => this.draw());
  }

  private draw(): void {
    const width = this.width() || this.svgRef().nativeElement.getBoundingClientRect().width || 320;
    const height = this.height();
    const side = this.view() === 'side';
    const f = this.fmt();
    const traces = this.traces();
    const marks = this.landmarks();
    const svg = select(this.svgRef().nativeElement);
    svg.attr('viewBox', `0 0 ${width} ${height}`);

    // Ground distances (along the aim, and across it in the top view) are drawn in the club's unit;
    // heights stay in metres like the Laws' 2.44 m bar and the wall. Axes scale in the unit shown, and
    // `x`/`y` below take metres, so the landmarks and paths need no conversion of their own.
    const u = (m: number): number => f.toUnit(m);
    const maxX = Math.max(10, max(traces, (t) => max(t.points, (p) => p.x)) ?? 0, (marks.goalAtM ?? 0) + 2);
    const xAxis = scaleLinear()
      .domain([0, u(maxX) * 1.04])
      .nice()
      .range([MARGIN.left, width - MARGIN.right]);
    const yAxis = scaleLinear().range([height - MARGIN.bottom, MARGIN.top]);
    if (side) {
      const top = Math.max(GOAL_HEIGHT_M, marks.wallHeightM ?? 0, max(traces, (t) => max(t.points, (p) => p.y)) ?? 0);
      yAxis.domain([0, top * 1.15]).nice();
    } else {
      const goalEdge = marks.goalAtM !== undefined ? Math.abs(marks.goalCentreM ?? 0) + GOAL_WIDTH_M / 2 + 0.5 : 0;
      const reach = Math.max(3, goalEdge, max(traces, (t) => max(t.points, (p) => Math.abs(p.y))) ?? 0);
      yAxis.domain([-u(reach) * 1.15, u(reach) * 1.15]).nice();
    }
    const x = (m: number): number => xAxis(u(m));
    const y = (m: number): number => yAxis(side ? m : u(m));

    const axes = svg.selectAll<SVGGElement, null>('g.ll-trajectory__axes').data([null]).join('g').attr('class', 'll-trajectory__axes');
    axes
      .selectAll<SVGGElement, null>('g.ll-trajectory__grid')
      .data([null])
      .join('g')
      .attr('class', 'll-trajectory__grid')
      .attr('transform', `translate(${MARGIN.left},0)`)
      .call(
        axisLeft(yAxis)
          .ticks(Math.max(3, Math.round(height / 50)))
          .tickSize(-(width - MARGIN.left - MARGIN.right))
          .tickFormat((v) => f.number(Number(v))),
      )
      .call((g) => g.select('.domain').remove());
    axes
      .selectAll<SVGGElement, null>('g.ll-trajectory__x')
      .data([null])
      .join('g')
      .attr('class', 'll-trajectory__x')
      .attr('transform', `translate(0,${height - MARGIN.bottom})`)
      .call(
        axisBottom(xAxis)
          .ticks(Math.max(3, Math.round(width / 80)))
          .tickFormat((v) => f.number(Number(v))),
      );
    axes
      .selectAll<SVGTextElement, string>('text.ll-trajectory__axis-label')
      .data([`Distance, ${f.unit}`, side ? 'Height, m' : `Left +, ${f.unit}`])
      .join('text')
      .attr('class', 'll-trajectory__axis-label')
      .attr('text-anchor', (_, i) => (i === 0 ? 'end' : 'start'))
      .attr('x', (_, i) => (i === 0 ? width - MARGIN.right : 2))
      .attr('y', (_, i) => (i === 0 ? height - 4 : 12))
      .text((d) => d);
    axes
      .selectAll<SVGLineElement, null>('line.ll-trajectory__ground')
      .data([null])
      .join('line')
      .attr('class', 'll-trajectory__ground')
      .attr('x1', MARGIN.left)
      .attr('x2', width - MARGIN.right)
      .attr('y1', y(0))
      .attr('y2', y(0));

    this.drawLandmarks(
      svg.selectAll<SVGGElement, null>('g.ll-trajectory__landmarks').data([null]).join('g').attr('class', 'll-trajectory__landmarks'),
      x,
      y,
      side,
      marks,
      f,
    );

    const path = line<{ x: number; y: number }>()
      .x((p) => x(p.x))
      .y((p) => y(p.y));
    const layer = svg.selectAll<SVGGElement, null>('g.ll-trajectory__kicks').data([null]).join('g').attr('class', 'll-trajectory__kicks');
    layer
      .selectAll<SVGPathElement, TrajectoryTrace>('path.ll-trajectory__trace')
      .data(traces, (t) => t.id)
      .join('path')
      .attr(
        'class',
        (t) => `ll-trajectory__trace ll-trajectory__trace--tone-${t.tone}${t.emphasised ? ' ll-trajectory__trace--emphasised' : ''}`,
      )
      .attr('d', (t) => path(t.points as { x: number; y: number }[]) ?? '');
    layer
      .selectAll<SVGCircleElement, TrajectoryTrace>('circle.ll-trajectory__landing')
      .data(
        traces.filter((t) => t.points.length > 0),
        (t) => t.id,
      )
      .join('circle')
      .attr('class', (t) => `ll-trajectory__landing ll-trajectory__landing--tone-${t.tone}`)
      .attr('r', (t) => (t.emphasised ? 6 : 4.5))
      .attr('cx', (t) => x(t.points[t.points.length - 1]!.x))
      .attr('cy', (t) => y(t.points[t.points.length - 1]!.y));
  }

  private drawLandmarks(
    g: Selection<SVGGElement, null, SVGSVGElement, unknown>,
    x: (v: number) => number,
    y: (v: number) => number,
    side: boolean,
    marks: TrajectoryLandmarks,
    f: QuantityFormat,
  ): void {
    const wall = marks.wallAtM === undefined ? [] : [marks.wallAtM];
    const wallH = side ? (marks.wallHeightM ?? 0) : 0;
    g.selectAll<SVGRectElement, number>('rect.ll-trajectory__wall')
      .data(wall)
      .join('rect')
      .attr('class', 'll-trajectory__wall')
      // A wall is about 0.3 m deep (common practice); drawn at least 4 px so it shows on a phone.
      .attr('x', (d) => x(d) - Math.max(2, (x(0.3) - x(0)) / 2))
      .attr('width', Math.max(4, x(0.3) - x(0)))
      .attr('y', side ? y(wallH) : y(2.5))
      .attr('height', side ? y(0) - y(wallH) : y(-2.5) - y(2.5));
    g.selectAll<SVGTextElement, number>('text.ll-trajectory__wall-label')
      .data(wall)
      .join('text')
      .attr('class', 'll-trajectory__wall-label')
      .attr('text-anchor', 'start')
      .attr('x', (d) => x(d) + Math.max(4, (x(0.3) - x(0)) / 2) + 3)
      .attr('y', side ? y(0) - 4 : y(-2.5) - 2)
      .text((d) => `wall ${f.round(d, 2)}`);
    const goal = marks.goalAtM === undefined ? [] : [marks.goalAtM];
    const c = marks.goalCentreM ?? 0;
    g.selectAll<SVGPathElement, number>('path.ll-trajectory__goal')
      .data(goal)
      .join('path')
      .attr('class', 'll-trajectory__goal')
      .attr('d', (d) =>
        side
          ? `M${x(d)},${y(0)}V${y(GOAL_HEIGHT_M)}h${Math.max(6, x(2) - x(0))}`
          : `M${x(d)},${y(c - GOAL_WIDTH_M / 2)}V${y(c + GOAL_WIDTH_M / 2)}`,
      );
  }
}
