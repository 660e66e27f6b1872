import { DestroyRef, ElementRef, Signal, afterNextRender, inject, signal } from '@angular/core';

/** Width a chart draws at before its box has been measured (a phone's content width). */
export const FALLBACK_CHART_WIDTH_PX = 328;

/**
 * The host element's content width as a signal, kept current by a ResizeObserver, so a d3 chart
 * redraws to fit when the phone rotates or the side nav opens. Must be called in an injection
 * context (a component's field initialiser or constructor).
 */
export function injectChartWidth(): Signal<number> {
  const host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;
  const width = signal(0);
  const measure = (value: number): void => {
    const rounded = Math.floor(value);
    if (rounded > 0 && rounded !== width()) {
      width.set(rounded);
    }
  };
  let observer: ResizeObserver | null = null;
  afterNextRender(() => {
    measure(host.getBoundingClientRect().width);
    if (typeof ResizeObserver !== 'undefined') {
      observer = new ResizeObserver((entries) => {
        const entry = entries[entries.length - 1];
        if (entry) {
          measure(entry.contentRect.width);
        }
      });
      observer.observe(host);
    }
  });
  inject(DestroyRef).onDestroy(() => observer?.disconnect());
  return width;
}

/** The width to draw at: the measured one, or the fallback before the first measurement. */
export function drawWidth(measured: number): number {
  return measured > 0 ? measured : FALLBACK_CHART_WIDTH_PX;
}
