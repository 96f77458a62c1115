// The shared cursor and zoom of the plots: the pure steps, then the zoom as a user meets it on a
// time-series plot (drag, keys, reset) and on a strip plot. Common practice, no source.
import { signal, type Type } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { beforeEach, describe, expect, it } from 'vitest';
import { clampDomain } from './plot-scales';
import { cursorKeyTarget, MIN_ZOOM_FRACTION, panToShow, sharedZoom, zoomAbout, zoomBetween } from './plot-cursor';
import type { PlotSeries } from './plot-series';
import { StripPlot } from './strip-plot';
import { TimeSeriesPlot } from './time-series-plot';

const stops = Array.from({ length: 11 }, (_, i) => ({ x: i * 10 })); // 0..100
const full = [0, 100] as const;

describe('cursorKeyTarget', () => {
  it('steps sample by sample, starts at an end, stops at the last sample and hides on Escape', () => {
    const view = { shown: full, full, columns: 600 };
    expect(cursorKeyTarget('ArrowRight', false, null, view, stops)).toBe(0);
    expect(cursorKeyTarget('ArrowLeft', false, null, view, stops)).toBe(100);
    expect(cursorKeyTarget('ArrowRight', false, 30, view, stops)).toBe(40);
    expect(cursorKeyTarget('ArrowRight', true, 30, view, stops)).toBe(100);
    expect(cursorKeyTarget('End', false, 30, view, stops)).toBe(100);
    expect(cursorKeyTarget('ArrowRight', false, 100, view, stops)).toBe(100);
    expect(cursorKeyTarget('Escape', false, 30, view, stops)).toBe('hide');
    expect(cursorKeyTarget('a', false, 30, view, stops)).toBeNull();
  });

  it('moves about a pixel column of samples when there are more samples than columns', () => {
    const dense = Array.from({ length: 1001 }, (_, i) => ({ x: i }));
    expect(cursorKeyTarget('ArrowRight', false, 0, { shown: [0, 1000], full: [0, 1000], columns: 100 }, dense)).toBe(10);
    // zoomed to a tenth, the same key moves a tenth as far
    expect(cursorKeyTarget('ArrowRight', false, 0, { shown: [0, 100], full: [0, 1000], columns: 100 }, dense)).toBe(1);
  });

  it('moves freely in 1 % steps of the range shown when there are no samples (a strip plot)', () => {
    expect(cursorKeyTarget('ArrowRight', false, 20, { shown: full, full, columns: 600 }, null)).toBe(21);
    expect(cursorKeyTarget('ArrowRight', true, 20, { shown: full, full, columns: 600 }, null)).toBe(30);
    expect(cursorKeyTarget('ArrowRight', false, 20, { shown: [20, 30], full, columns: 600 }, null)).toBeCloseTo(20.1, 9);
    expect(cursorKeyTarget('Home', false, 50, { shown: [20, 30], full, columns: 600 }, null)).toBe(0);
  });
});

describe('zoom ranges', () => {
  it('zooms between two x in either order, inside the whole range, and a range covering it all is no zoom', () => {
    expect(zoomBetween(full, 60, 20)).toEqual([20, 60]);
    expect(zoomBetween(full, -50, 40)).toEqual([0, 40]);
    expect(zoomBetween(full, -1, 101)).toBeNull();
  });

  it('never zooms narrower than the least share of the range', () => {
    const z = zoomBetween(full, 50, 50) ?? [0, 0];
    expect(z[1] - z[0]).toBeCloseTo(100 * MIN_ZOOM_FRACTION, 12);
    expect((z[0] + z[1]) / 2).toBeCloseTo(50, 12);
    const atEdge = zoomBetween(full, 100, 100) ?? [0, 0];
    expect(atEdge[1]).toBe(100);
  });

  it('zooms in and out about a centre that keeps its place, sliding inward at an edge', () => {
    expect(zoomAbout(full, full, 40, 2)).toEqual([20, 70]);
    expect(zoomAbout(full, [20, 70], 40, 0.5)).toBeNull();
    expect(zoomAbout(full, [0, 20], 0, 0.5)).toEqual([0, 40]);
    expect(zoomAbout(full, [80, 100], 100, 0.5)).toEqual([60, 100]);
  });

  it('slides a zoomed range to show the cursor, keeping its width', () => {
    expect(panToShow(full, [20, 40], 30)).toEqual([20, 40]);
    expect(panToShow(full, [20, 40], 50)).toEqual([30, 50]);
    expect(panToShow(full, [20, 40], 5)).toEqual([5, 25]);
    expect(panToShow(full, [20, 40], 100)).toEqual([80, 100]);
  });
});

describe('clampDomain', () => {
  it('keeps a nice axis inside the physical range (beta ±90°, sunlit 0..1, flow ≥ 0)', () => {
    expect(clampDomain([-100, 100], [-90, 90])).toEqual([-90, 90]);
    expect(clampDomain([0.9, 1.1], [0, 1])).toEqual([0.9, 1]);
    expect(clampDomain([-1, 1], [0, Infinity])).toEqual([0, 1]);
    expect(clampDomain([-20, 40], undefined)).toEqual([-20, 40]);
    // data wholly outside the range (bad data) stays visible
    expect(clampDomain([-5, -1], [0, Infinity])).toEqual([-5, -1]);
  });
});

const series: PlotSeries[] = [
  { id: 'a', label: 'Absorbed', unit: 'W', colorVar: '--ecl-absorbed', points: stops.map(({ x }) => ({ x, y: x < 50 ? x : 100 - x })) },
];

async function render<T>(type: Type<T>, inputs: Record<string, unknown>): Promise<{ fixture: ComponentFixture<T>; el: HTMLElement }> {
  const fixture = TestBed.createComponent(type);
  for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
  await fixture.whenStable();
  return { fixture, el: fixture.nativeElement as HTMLElement };
}

async function press(fixture: ComponentFixture<unknown>, key: string): Promise<void> {
  const svg = (fixture.nativeElement as HTMLElement).querySelector('svg[role="img"]') as SVGSVGElement;
  svg.dispatchEvent(new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true }));
  await fixture.whenStable();
}

function area(el: HTMLElement): { left: number; width: number } {
  const transform = el.querySelector('svg[role="img"] > g')?.getAttribute('transform') ?? '';
  return { left: Number(/translate\(([-\d.]+),/.exec(transform)?.[1]), width: Number(el.querySelector('clipPath rect')?.getAttribute('width')) };
}

const ticks = (el: HTMLElement): number[] =>
  Array.from(el.querySelectorAll('g[eclPlotXAxis] .ecl-axis-tick text')).map((t) => Number(t.textContent?.replace(/,/g, '')));

describe('zoom on a plot', () => {
  beforeEach(() => TestBed.configureTestingModule({ imports: [TimeSeriesPlot, StripPlot] }));

  it('zooms to the range dragged across the plot, scales y to it, and the reset button shows it all again', async () => {
    const { fixture, el } = await render(TimeSeriesPlot, { series, xUnit: 'min' });
    const svg = el.querySelector('svg.ecl-plot-svg') as SVGSVGElement;
    const { left, width } = area(el);
    const at = (f: number) => svg.getBoundingClientRect().left + left + width * f;
    svg.dispatchEvent(new MouseEvent('pointerdown', { clientX: at(0.1), button: 0, bubbles: true }));
    svg.dispatchEvent(new MouseEvent('pointermove', { clientX: at(0.3), bubbles: true }));
    await fixture.whenStable();
    expect(el.querySelector('.ecl-plot-zoom-box')).not.toBeNull();
    svg.dispatchEvent(new MouseEvent('pointerup', { clientX: at(0.3), bubbles: true }));
    await fixture.whenStable();
    expect(el.querySelector('.ecl-plot-zoom-box')).toBeNull();
    const shown = ticks(el);
    expect(Math.min(...shown)).toBeGreaterThanOrEqual(10);
    expect(Math.max(...shown)).toBeLessThanOrEqual(30);
    expect(el.querySelector('[aria-live]')?.textContent).toContain('Zoomed to 10 min – 30 min');
    // y follows the samples shown (10..30), not the whole series' 0..50
    const yTicks = Array.from(el.querySelectorAll('.ecl-axis-y .ecl-axis-tick text')).map((t) => Number(t.textContent));
    expect(Math.max(...yTicks)).toBeLessThanOrEqual(30);
    const reset = el.querySelector('.ecl-plot-zoom-reset') as HTMLButtonElement;
    reset.click();
    await fixture.whenStable();
    expect(Math.max(...ticks(el))).toBe(100);
    expect(el.querySelector('.ecl-plot-zoom-reset')).toBeNull();
  });

  it('a click without a drag does not zoom', async () => {
    const { fixture, el } = await render(TimeSeriesPlot, { series, xUnit: 'min' });
    const svg = el.querySelector('svg.ecl-plot-svg') as SVGSVGElement;
    const { left, width } = area(el);
    const x = svg.getBoundingClientRect().left + left + width * 0.5;
    svg.dispatchEvent(new MouseEvent('pointerdown', { clientX: x, button: 0, bubbles: true }));
    svg.dispatchEvent(new MouseEvent('pointerup', { clientX: x + 2, bubbles: true }));
    await fixture.whenStable();
    expect(el.querySelector('.ecl-plot-zoom-reset')).toBeNull();
  });

  it('zooms by keyboard about the cursor, follows the cursor past the edge, and 0 shows the whole range', async () => {
    const { fixture, el } = await render(TimeSeriesPlot, { series, xUnit: 'min' });
    await press(fixture, 'ArrowRight'); // cursor at 0
    for (let i = 0; i < 4; i++) await press(fixture, 'ArrowRight'); // 40
    await press(fixture, '+');
    expect(Math.min(...ticks(el))).toBeGreaterThanOrEqual(20);
    expect(Math.max(...ticks(el))).toBeLessThanOrEqual(70);
    await press(fixture, 'End');
    expect(el.querySelector('.ecl-plot-tooltip-x')?.textContent?.trim()).toBe('100 min');
    expect(Math.max(...ticks(el))).toBe(100);
    await press(fixture, '-');
    expect(el.querySelector('.ecl-plot-zoom-reset')).toBeNull();
    await press(fixture, '+');
    expect(el.querySelector('.ecl-plot-zoom-reset')).not.toBeNull();
    await press(fixture, '0');
    expect(el.querySelector('.ecl-plot-zoom-reset')).toBeNull();
    expect(el.querySelector('[aria-live]')?.textContent).toContain('Showing the whole range');
  });

  it('takes its zoom from the two-way zoomed binding and reports its own, so stacked plots zoom together', async () => {
    const { fixture, el } = await render(TimeSeriesPlot, { series, xUnit: 'min', zoomed: [20, 40] });
    expect(Math.min(...ticks(el))).toBeGreaterThanOrEqual(20);
    expect(Math.max(...ticks(el))).toBeLessThanOrEqual(40);
    const told: unknown[] = [];
    fixture.componentInstance.zoomed.subscribe((z) => told.push(z));
    await press(fixture, '0');
    expect(told).toEqual([null]);
    expect(Math.max(...ticks(el))).toBe(100);
  });

  it('zooms a strip plot by keyboard too', async () => {
    const rows = [{ label: 'Heater', segments: [{ from: 0, to: 10 }, { from: 50, to: 75 }] }];
    const { fixture, el } = await render(StripPlot, { rows, xDomain: [0, 100], xUnit: 'min' });
    await press(fixture, 'Home');
    await press(fixture, '+');
    expect(Math.max(...ticks(el))).toBeLessThanOrEqual(50);
    expect(el.querySelector('.ecl-plot-zoom-reset')).not.toBeNull();
    await press(fixture, '0');
    expect(Math.max(...ticks(el))).toBe(100);
  });
});

describe('sharedZoom', () => {
  it('keeps one zoom for the plots bound to it, and shows the whole range again when their data changes', () => {
    const run = signal({ id: 1 });
    const zoom = sharedZoom(run);
    expect(zoom()).toBeNull();
    zoom.set([20, 40]); // a drag on one plot, told through its [(zoomed)] binding
    expect(zoom()).toEqual([20, 40]);
    run.set({ id: 2 }); // a new run: the old zoom may lie outside its range
    expect(zoom()).toBeNull();
  });
});
