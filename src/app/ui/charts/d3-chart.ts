import { Directive, ElementRef, afterRenderEffect, inject, viewChild } from '@angular/core';
import type { QuantityFormat } from '../../../../shared/quantity-format';
import { ClubFormat } from '../../core/club-format';
import { drawWidth, injectChartWidth } from './chart-width';

/**
 * The base of Loftline's d3 charts: the `#svg` element in the template, the host's measured width
 * (redrawn on resize) and the club's formatter. A chart only says how it draws: `draw` runs after
 * each render in which a signal it reads (its inputs, the width, the club's format) changed, so a
 * phone rotation, new data or a switch to yards all redraw it. Pair the drawing with a
 * `ChartTable` so every chart has its table alternative.
 */
@Directive()
export abstract class D3Chart {
  private readonly svgRef = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  private readonly width = injectChartWidth();
  /** The club's formatter: distances in its unit, numbers and dates in its locale. */
  protected readonly fmt = inject(ClubFormat).format;

  constructor() {
    afterRenderEffect(() => this.draw(this.svgRef().nativeElement, drawWidth(this.width()), this.fmt()));
  }

  /** Redraws the chart at `width` px. */
  protected abstract draw(element: SVGSVGElement, width: number, f: QuantityFormat): void;
}
