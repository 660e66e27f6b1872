/*
 * The pieces every d3 chart in Loftline draws the same way: the sized frame with its inner plot
 * area, the "nothing to draw" note, grid lines and axes. A chart describes only its own marks.
 */
import { select, type Axis, type AxisDomain, type Selection } from 'd3';

/** Space around a chart's plot area, px. */
export interface ChartMargin {
  readonly top: number;
  readonly right: number;
  readonly bottom: number;
  readonly left: number;
}

/** A cleared, sized drawing with its plot area (`plot`, translated by the margin) and the plot's size. */
export interface ChartFrame {
  readonly svg: Selection<SVGSVGElement, unknown, null, undefined>;
  readonly plot: Selection<SVGGElement, unknown, null, undefined>;
  readonly innerW: number;
  readonly innerH: number;
}

/** Clears the drawing, sizes it to `width` × `height` and opens the plot area inside `margin`. */
export function chartFrame(element: SVGSVGElement, width: number, height: number, margin: ChartMargin): ChartFrame {
  const svg = select(element);
  svg.selectAll('*').remove();
  svg.attr('viewBox', `0 0 ${width} ${height}`).attr('width', width).attr('height', height);
  return {
    svg,
    plot: svg.append('g').attr('transform', `translate(${margin.left},${margin.top})`),
    innerW: Math.max(10, width - margin.left - margin.right),
    innerH: Math.max(10, height - margin.top - margin.bottom),
  };
}

/** The sentence a chart shows in the middle of its plot area when there is nothing to draw. */
export function drawEmptyNote(frame: ChartFrame, text: string, offsetYPx = 0): void {
  frame.plot
    .append('text')
    .attr('class', 'll-chart__empty')
    .attr('x', frame.innerW / 2)
    .attr('y', frame.innerH / 2 + offsetYPx)
    .attr('text-anchor', 'middle')
    .text(text);
}

/** Horizontal grid lines across the plot at the ticks of a left axis (its labels hidden). */
export function drawGrid<D extends AxisDomain>(frame: ChartFrame, axis: Axis<D>): void {
  frame.plot
    .append('g')
    .attr('class', 'll-chart__grid')
    .call(axis.tickSize(-frame.innerW).tickFormat(() => ''));
}

/** An axis in the chart's style, at the plot's left edge, or moved by `translate` (e.g. to the bottom). */
export function drawAxis<D extends AxisDomain>(frame: ChartFrame, axis: Axis<D>, translate?: { x?: number; y?: number }): void {
  const g = frame.plot.append('g').attr('class', 'll-chart__axis');
  if (translate) g.attr('transform', `translate(${translate.x ?? 0},${translate.y ?? 0})`);
  g.call(axis);
}

/** An axis along the bottom of the plot. */
export function drawBottomAxis<D extends AxisDomain>(frame: ChartFrame, axis: Axis<D>): void {
  drawAxis(frame, axis, { y: frame.innerH });
}
