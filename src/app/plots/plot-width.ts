// The width a plot should draw at: its host's, followed with a ResizeObserver. jsdom and some
// embedded browsers have no ResizeObserver or report 0 px; then the plot keeps a sensible default.
import { afterNextRender, DestroyRef, ElementRef, inject, signal, type Signal } from '@angular/core';

export const DEFAULT_PLOT_WIDTH_PX = 640;

/** Call in a component's injection context; the signal follows the host element's content width. */
export function observePlotWidth(): Signal<number> {
  const host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;
  const destroyRef = inject(DestroyRef);
  const width = signal(DEFAULT_PLOT_WIDTH_PX);
  const accept = (px: number): void => {
    // Rounded so sub-pixel layout jitter does not redraw every path.
    if (px > 0) width.set(Math.round(px));
  };
  afterNextRender(() => {
    accept(host.clientWidth);
    if (typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver((entries) => {
      for (const entry of entries) accept(entry.contentRect.width);
    });
    observer.observe(host);
    destroyRef.onDestroy(() => observer.disconnect());
  });
  return width.asReadonly();
}
