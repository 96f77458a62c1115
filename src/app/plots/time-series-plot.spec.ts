import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { PlotSeries } from './plot-series';
import { TimeSeriesPlot } from './time-series-plot';

const xs = Array.from({ length: 11 }, (_, i) => i * 10); // 0..100 min
const threeSeries: PlotSeries[] = [
  { id: 'solar', label: 'Solar', unit: 'W/m²', colorVar: '--ecl-solar', points: xs.map((x) => ({ x, y: x < 50 ? 1361 : 0 })) },
  { id: 'albedo', label: 'Albedo', unit: 'W/m²', colorVar: '--ecl-albedo', points: xs.map((x) => ({ x, y: 300 - x })) },
  { id: 'ir', label: 'Planetary IR', unit: 'W/m²', colorVar: '--ecl-ir', points: xs.map((x) => ({ x, y: 230 + x / 10 })), dash: true },
];

async function render(inputs: Record<string, unknown>): Promise<{ fixture: ComponentFixture<TimeSeriesPlot>; el: HTMLElement }> {
  const fixture = TestBed.createComponent(TimeSeriesPlot);
  for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
  await fixture.whenStable();
  return { fixture, el: fixture.nativeElement as HTMLElement };
}

/** The plot area as drawn: its width from the clip rectangle, its left edge from the group's transform. */
function plotArea(el: HTMLElement): { left: number; width: number; height: number } {
  const clip = el.querySelector('clipPath rect') as SVGRectElement;
  const transform = el.querySelector('svg.ecl-plot-svg > g')?.getAttribute('transform') ?? '';
  const left = Number(/translate\(([-\d.]+),/.exec(transform)?.[1]);
  return { left, width: Number(clip.getAttribute('width')), height: Number(clip.getAttribute('height')) };
}

const lines = (el: HTMLElement): string[] =>
  Array.from(el.querySelectorAll('path.ecl-plot-line')).map((p) => p.getAttribute('data-series') ?? '');

async function press(fixture: ComponentFixture<TimeSeriesPlot>, key: string, shiftKey = false): Promise<KeyboardEvent> {
  const svg = (fixture.nativeElement as HTMLElement).querySelector('svg.ecl-plot-svg') as SVGSVGElement;
  const event = new KeyboardEvent('keydown', { key, shiftKey, bubbles: true, cancelable: true });
  svg.dispatchEvent(event);
  await fixture.whenStable();
  return event;
}

const tooltip = (el: HTMLElement): HTMLElement | null => el.querySelector('.ecl-plot-tooltip');

describe('TimeSeriesPlot', () => {
  beforeEach(() => TestBed.configureTestingModule({ imports: [TimeSeriesPlot] }));

  it('draws one path per series, in its colour variable with a fallback, dashed where asked', async () => {
    const { el } = await render({ series: threeSeries, xLabel: 'Time', xUnit: 'min', yLabel: 'Heat flux', yUnit: 'W/m²' });
    expect(lines(el)).toEqual(['solar', 'albedo', 'ir']);
    const solar = el.querySelector('path[data-series="solar"]') as SVGPathElement;
    expect(solar.getAttribute('d')).toMatch(/^M[\d.]+,[\d.]+L/);
    expect(solar.style.stroke).toContain('var(--ecl-solar');
    expect(solar.style.stroke).toContain('#c27c00');
    expect(el.querySelector('path[data-series="ir"]')?.getAttribute('stroke-dasharray')).toBeTruthy();
    expect(solar.getAttribute('stroke-dasharray')).toBeNull();
  });

  it('titles the axes with their units and labels the ticks', async () => {
    const { el } = await render({ series: threeSeries, xLabel: 'Time', xUnit: 'min', yLabel: 'Heat flux', yUnit: 'W/m²' });
    const titles = Array.from(el.querySelectorAll('.ecl-axis-title')).map((t) => t.textContent?.trim());
    expect(titles).toContain('Time (min)');
    expect(titles).toContain('Heat flux (W/m²)');
    const xTicks = Array.from(el.querySelectorAll('g[eclPlotXAxis] .ecl-axis-tick text')).map((t) => t.textContent?.trim());
    expect(xTicks).toContain('0');
    expect(xTicks).toContain('100');
    const yTicks = Array.from(el.querySelectorAll('.ecl-axis-y .ecl-axis-tick text')).map((t) => t.textContent?.trim());
    expect(yTicks.length).toBeGreaterThan(2);
  });

  it('places band rectangles at their x, clipped to the data range, eclipse in the shared band colour', async () => {
    const { el } = await render({
      series: threeSeries,
      bands: [
        { from: 25, to: 50, label: 'Umbra', kind: 'eclipse' },
        { from: 90, to: 130, label: 'Penumbra', kind: 'penumbra' },
      ],
    });
    const area = plotArea(el);
    const rects = Array.from(el.querySelectorAll('rect.ecl-plot-band')) as SVGRectElement[];
    expect(rects).toHaveLength(2);
    const attr = (r: Element, name: string): number => Number(r.getAttribute(name));
    expect(attr(rects[0], 'x')).toBeCloseTo(area.width * 0.25, 1);
    expect(attr(rects[0], 'width')).toBeCloseTo(area.width * 0.25, 1);
    expect(attr(rects[0], 'height')).toBe(area.height);
    expect(attr(rects[1], 'x')).toBeCloseTo(area.width * 0.9, 1);
    expect(attr(rects[1], 'width')).toBeCloseTo(area.width * 0.1, 1);
    expect(rects[0].style.fill).toContain('var(--ecl-eclipse-band');
    expect(rects[1].style.fill).toContain('var(--ecl-eclipse-band');
    // The bands sit behind the lines: earlier in document order.
    const firstLine = el.querySelector('path.ecl-plot-line') as Element;
    expect(rects[0].compareDocumentPosition(firstLine) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    const legendBands = Array.from(el.querySelectorAll('.ecl-plot-legend-band')).map((b) => b.textContent?.trim());
    expect(legendBands).toEqual(['Umbra', 'Penumbra']);
  });

  it('hides and shows a series from its legend button', async () => {
    const { fixture, el } = await render({ series: threeSeries });
    const button = el.querySelector('button[data-series="albedo"]') as HTMLButtonElement;
    // A native button: Enter and Space activate it with no key handling of ours.
    expect(button.tagName).toBe('BUTTON');
    expect(button.getAttribute('aria-pressed')).toBe('true');
    button.click();
    await fixture.whenStable();
    expect(lines(el)).toEqual(['solar', 'ir']);
    expect(button.getAttribute('aria-pressed')).toBe('false');
    expect(el.querySelector('svg.ecl-plot-svg')?.getAttribute('aria-label')).not.toContain('Albedo');
    button.click();
    await fixture.whenStable();
    expect(lines(el)).toEqual(['solar', 'albedo', 'ir']);
  });

  it('shows the cursor at an x set from outside and reports the x the user moves it to (linked views)', async () => {
    const { fixture, el } = await render({ series: threeSeries, xUnit: 'min', cursorAt: 30 });
    expect(tooltip(el)?.querySelector('.ecl-plot-tooltip-x')?.textContent?.trim()).toBe('30 min');
    const moved: (number | null)[] = [];
    fixture.componentInstance.cursorChange.subscribe((x) => moved.push(x));
    await press(fixture, 'ArrowRight');
    expect(moved).toEqual([40]);
    expect(tooltip(el)?.querySelector('.ecl-plot-tooltip-x')?.textContent?.trim()).toBe('40 min');
    await press(fixture, 'Escape');
    expect(moved).toEqual([40, null]);
    // with the user's own cursor hidden, the outside x shows again
    expect(tooltip(el)?.querySelector('.ecl-plot-tooltip-x')?.textContent?.trim()).toBe('30 min');
  });

  it('moves the read-out cursor with the arrow keys and lists every visible series with units', async () => {
    const { fixture, el } = await render({ series: threeSeries, xUnit: 'min' });
    expect(tooltip(el)).toBeNull();
    const first = await press(fixture, 'ArrowRight');
    expect(first.defaultPrevented).toBe(true);
    expect(tooltip(el)?.querySelector('.ecl-plot-tooltip-x')?.textContent?.trim()).toBe('0 min');
    await press(fixture, 'ArrowRight');
    await press(fixture, 'ArrowRight');
    const rows = Array.from(tooltip(el)?.querySelectorAll('.ecl-plot-tooltip-row') ?? []).map((r) =>
      Array.from(r.querySelectorAll('span'))
        .map((c) => c.textContent?.trim())
        .filter((t) => t)
        .join(' '),
    );
    expect(tooltip(el)?.querySelector('.ecl-plot-tooltip-x')?.textContent?.trim()).toBe('20 min');
    expect(rows).toEqual(['Solar 1,361 W/m²', 'Albedo 280 W/m²', 'Planetary IR 232 W/m²']);
    await press(fixture, 'ArrowLeft');
    expect(tooltip(el)?.querySelector('.ecl-plot-tooltip-x')?.textContent?.trim()).toBe('10 min');
    expect(el.querySelector('[aria-live]')?.textContent).toContain('10 min; Solar 1,361 W/m²');

    const area = plotArea(el);
    const cursorX = Number(el.querySelector('.ecl-plot-cursor line')?.getAttribute('x1'));
    expect(cursorX).toBeCloseTo(area.width * 0.1, 1);

    await press(fixture, 'End');
    expect(tooltip(el)?.querySelector('.ecl-plot-tooltip-x')?.textContent?.trim()).toBe('100 min');
    await press(fixture, 'ArrowRight');
    expect(tooltip(el)?.querySelector('.ecl-plot-tooltip-x')?.textContent?.trim()).toBe('100 min');
    await press(fixture, 'Escape');
    expect(tooltip(el)).toBeNull();
  });

  it('follows the pointer to the nearest sample and hides on leave', async () => {
    const { fixture, el } = await render({ series: threeSeries, xUnit: 'min' });
    const svg = el.querySelector('svg.ecl-plot-svg') as SVGSVGElement;
    const area = plotArea(el);
    const left = svg.getBoundingClientRect().left;
    svg.dispatchEvent(new MouseEvent('pointermove', { clientX: left + area.left + area.width * 0.43, bubbles: true }));
    await fixture.whenStable();
    expect(tooltip(el)?.querySelector('.ecl-plot-tooltip-x')?.textContent?.trim()).toBe('40 min');
    svg.dispatchEvent(new MouseEvent('pointerleave'));
    await fixture.whenStable();
    expect(tooltip(el)).toBeNull();
  });

  it('is focusable and summarises itself for screen readers', async () => {
    const { el } = await render({
      series: threeSeries,
      title: 'Heat loads around the orbit',
      xLabel: 'Time',
      xUnit: 'min',
      yLabel: 'Heat flux',
      yUnit: 'W/m²',
      bands: [{ from: 50, to: 85, label: 'Eclipse', kind: 'eclipse' }],
    });
    const svg = el.querySelector('svg.ecl-plot-svg') as SVGSVGElement;
    expect(svg.getAttribute('tabindex')).toBe('0');
    const label = svg.getAttribute('aria-label') ?? '';
    expect(label).toContain('Heat loads around the orbit: Heat flux (W/m²) against Time (min)');
    expect(label).toContain('Solar 0 to 1,361 W/m²');
    expect(label).toContain('Eclipse from 50 min to 85 min');
    expect(el.querySelector(`#${svg.getAttribute('aria-describedby')}`)?.textContent).toContain('Arrow keys move the read-out');
  });

  it('shows a data table with a column per series on request', async () => {
    const { fixture, el } = await render({ series: threeSeries, xLabel: 'Time', xUnit: 'min' });
    expect(el.querySelector('table')).toBeNull();
    (el.querySelector('.ecl-plot-table-toggle') as HTMLButtonElement).click();
    await fixture.whenStable();
    const headers = Array.from(el.querySelectorAll('th')).map((h) => h.textContent?.trim());
    expect(headers).toEqual(['Time (min)', 'Solar (W/m²)', 'Albedo (W/m²)', 'Planetary IR (W/m²)']);
    const rows = el.querySelectorAll('tbody tr');
    expect(rows).toHaveLength(11);
    expect(Array.from(rows[5].querySelectorAll('td')).map((c) => c.textContent?.trim())).toEqual(['50', '0', '250', '235']);
  });

  it('keeps limit lines in view and labels them', async () => {
    const { el } = await render({
      series: [threeSeries[2]],
      limits: [
        { y: 400, label: 'Max operating 400', kind: 'hot' },
        { y: 100, label: 'Min operating 100', kind: 'cold' },
      ],
    });
    const area = plotArea(el);
    const limitLines = Array.from(el.querySelectorAll('line.ecl-plot-limit'));
    expect(limitLines.map((l) => l.getAttribute('data-kind'))).toEqual(['hot', 'cold']);
    for (const l of limitLines) {
      const y = Number(l.getAttribute('y1'));
      expect(y).toBeGreaterThanOrEqual(0);
      expect(y).toBeLessThanOrEqual(area.height);
    }
    expect(Number(limitLines[0].getAttribute('y1'))).toBeLessThan(Number(limitLines[1].getAttribute('y1')));
    expect((limitLines[0] as SVGLineElement).style.stroke).toContain('var(--ecl-hot');
    expect(el.textContent).toContain('Min operating 100');
  });

  it('reads dates in UTC when x is a date', async () => {
    const t0 = Date.UTC(2026, 2, 1);
    const day = 86_400_000;
    const { fixture, el } = await render({
      series: [{ id: 'beta', label: 'Beta angle', unit: '°', colorVar: '--ecl-solar', points: [0, 1, 2, 3].map((d) => ({ x: t0 + d * day, y: 20 + d })) }],
      xKind: 'date',
      xLabel: 'Date',
    });
    expect(Array.from(el.querySelectorAll('.ecl-axis-title')).map((t) => t.textContent?.trim())).toContain('Date (UTC)');
    expect(el.querySelectorAll('g[eclPlotXAxis] .ecl-axis-tick').length).toBeGreaterThan(1);
    await press(fixture, 'ArrowRight');
    await press(fixture, 'ArrowRight');
    expect(tooltip(el)?.querySelector('.ecl-plot-tooltip-x')?.textContent?.trim()).toBe('2026-03-02 00:00 UTC');
    expect(tooltip(el)?.textContent).toContain('21 °');
  });

  it('thins a 100000-point series to a path of about two points a pixel column', async () => {
    const n = 100_000;
    const points = Array.from({ length: n }, (_, i) => ({ x: i, y: i === 61_000 ? 900 : Math.sin(i / 500) }));
    const { el } = await render({ series: [{ id: 'big', label: 'Node 3', unit: '°C', colorVar: '--ecl-hot', points }] });
    const area = plotArea(el);
    const d = el.querySelector('path.ecl-plot-line')?.getAttribute('d') ?? '';
    const vertices = (d.match(/[ML]/g) ?? []).length;
    expect(vertices).toBeLessThanOrEqual(area.width + 2);
    // The spike must survive: the highest vertex sits where the y axis puts 900.
    const ys = [...d.matchAll(/[ML][\d.-]+,([\d.-]+)/g)].map((m) => Number(m[1]));
    const ticks = Array.from(el.querySelectorAll('.ecl-axis-y .ecl-axis-tick')).map((t) => ({
      value: Number((t.textContent ?? '').trim().replace(/,/g, '').replace('\u2212', '-')),
      px: Number(/translate\(0,([-\d.]+)\)/.exec(t.getAttribute('transform') ?? '')?.[1]),
    }));
    const [a, b] = [ticks[0], ticks[ticks.length - 1]];
    const spikePx = a.px + ((900 - a.value) * (b.px - a.px)) / (b.value - a.value);
    expect(Math.min(...ys)).toBeCloseTo(spikePx, 0);
  });

  it('follows its host width through a ResizeObserver where there is one', async () => {
    let notify: ((width: number) => void) | undefined;
    class FakeResizeObserver {
      constructor(callback: (entries: { contentRect: { width: number } }[]) => void) {
        notify = (width) => callback([{ contentRect: { width } }]);
      }
      observe(): void {}
      disconnect(): void {}
    }
    vi.stubGlobal('ResizeObserver', FakeResizeObserver);
    const { fixture, el } = await render({ series: threeSeries });
    expect(notify).toBeDefined();
    notify?.(900);
    await fixture.whenStable();
    expect(el.querySelector('svg.ecl-plot-svg')?.getAttribute('width')).toBe('900');
    notify?.(420);
    await fixture.whenStable();
    expect(el.querySelector('svg.ecl-plot-svg')?.getAttribute('width')).toBe('420');
  });

  afterEach(() => vi.unstubAllGlobals());
});
