import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { beforeEach, describe, expect, it } from 'vitest';
import type { StripRow } from './plot-series';
import { StripPlot } from './strip-plot';
import { TimeSeriesPlot } from './time-series-plot';

const heaters: StripRow[] = [
  { label: 'Battery heater', segments: [{ from: 0, to: 10 }, { from: 50, to: 75 }] },
  { label: 'Propellant line heater', segments: [{ from: 20, to: 30 }], colorVar: '--ecl-cold' },
];

async function render(inputs: Record<string, unknown>): Promise<{ fixture: ComponentFixture<StripPlot>; el: HTMLElement }> {
  const fixture = TestBed.createComponent(StripPlot);
  for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
  await fixture.whenStable();
  return { fixture, el: fixture.nativeElement as HTMLElement };
}

const innerWidth = (el: HTMLElement): number => Number(el.querySelector('clipPath rect')?.getAttribute('width'));

async function press(fixture: ComponentFixture<StripPlot>, key: string): Promise<void> {
  const svg = (fixture.nativeElement as HTMLElement).querySelector('svg') as SVGSVGElement;
  svg.dispatchEvent(new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true }));
  await fixture.whenStable();
}

describe('StripPlot', () => {
  beforeEach(() => TestBed.configureTestingModule({ imports: [StripPlot] }));

  it('draws each on period at its x in the row colour, with the duty cycle beside the row', async () => {
    const { el } = await render({ rows: heaters, xDomain: [0, 100], xUnit: 'min' });
    const w = innerWidth(el);
    const rows = Array.from(el.querySelectorAll('.ecl-strip-row'));
    expect(rows).toHaveLength(2);
    const first = Array.from(rows[0].querySelectorAll('rect.ecl-strip-on'));
    expect(first.map((r) => Number(r.getAttribute('x')) / w)).toEqual([0, 0.5].map((f) => expect.closeTo(f, 3)));
    expect(first.map((r) => Number(r.getAttribute('width')) / w)).toEqual([0.1, 0.25].map((f) => expect.closeTo(f, 3)));
    expect((rows[1].querySelector('rect.ecl-strip-on') as SVGRectElement).style.fill).toContain('var(--ecl-cold');
    expect(rows[0].querySelector('.ecl-strip-duty')?.textContent?.trim()).toBe('35 %');
    expect(rows[1].querySelector('.ecl-strip-duty')?.textContent?.trim()).toBe('10 %');
    expect(rows[0].querySelector('.ecl-strip-label')?.textContent?.trim()).toBe('Battery heater');
  });

  it('shares the x axis style and title with the time-series plot', async () => {
    const { el } = await render({ rows: heaters, xDomain: [0, 100], xLabel: 'Time', xUnit: 'min' });
    expect(el.querySelector('g[eclPlotXAxis] .ecl-axis-title')?.textContent?.trim()).toBe('Time (min)');
    expect(Array.from(el.querySelectorAll('g[eclPlotXAxis] .ecl-axis-tick text')).map((t) => t.textContent?.trim())).toContain('40');
  });

  it('shades bands behind the strips', async () => {
    const { el } = await render({ rows: heaters, xDomain: [0, 100], bands: [{ from: 60, to: 95, label: 'Eclipse', kind: 'eclipse' }] });
    const band = el.querySelector('rect.ecl-strip-band') as SVGRectElement;
    expect(Number(band.getAttribute('x')) / innerWidth(el)).toBeCloseTo(0.6, 3);
    expect(band.style.fill).toContain('var(--ecl-eclipse-band');
    // Under the on periods, so a heater is never hidden by the shading.
    const on = el.querySelector('rect.ecl-strip-on') as Element;
    expect(band.compareDocumentPosition(on) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
  });

  it('lines up with a TimeSeriesPlot given the same gutters and x range', async () => {
    const shared = { xDomain: [0, 100], gutters: { left: 200, right: 60 }, bands: [{ from: 40, to: 70, label: 'Eclipse', kind: 'eclipse' }] };
    const { el: strip } = await render({ rows: heaters, ...shared });
    const series = TestBed.createComponent(TimeSeriesPlot);
    series.componentRef.setInput('series', [{ id: 't', label: 'Battery', unit: '°C', colorVar: '--ecl-hot', points: [{ x: 0, y: 5 }, { x: 100, y: 9 }] }]);
    for (const [name, value] of Object.entries(shared)) series.componentRef.setInput(name, value);
    await series.whenStable();
    const edges = (root: HTMLElement): number[] => {
      const left = Number(/translate\(([\d.]+),/.exec(root.querySelector('svg > g')?.getAttribute('transform') ?? '')?.[1]);
      const band = root.querySelector('rect[data-kind="eclipse"]') as Element;
      return [left + Number(band.getAttribute('x')), left + Number(band.getAttribute('x')) + Number(band.getAttribute('width'))];
    };
    const stripEdges = edges(strip);
    const seriesEdges = edges(series.nativeElement as HTMLElement);
    expect(stripEdges[0]).toBeCloseTo(seriesEdges[0], 6);
    expect(stripEdges[1]).toBeCloseTo(seriesEdges[1], 6);
  });

  it('reads which rows are on at the cursor, moved by the arrow keys', async () => {
    const { fixture, el } = await render({ rows: heaters, xDomain: [0, 100], xUnit: 'min' });
    await press(fixture, 'Home');
    const states = (): string[] =>
      Array.from(el.querySelectorAll('.ecl-strip-tooltip-row')).map((r) =>
        Array.from(r.querySelectorAll('span'))
          .map((c) => c.textContent?.trim())
          .join(' '),
      );
    expect(el.querySelector('.ecl-strip-tooltip-x')?.textContent?.trim()).toBe('0 min');
    expect(states()).toEqual(['Battery heater on', 'Propellant line heater off']);
    // 1 % steps: 25 presses reach 25 min.
    for (let i = 0; i < 25; i++) await press(fixture, 'ArrowRight');
    expect(el.querySelector('.ecl-strip-tooltip-x')?.textContent?.trim()).toBe('25 min');
    expect(states()).toEqual(['Battery heater off', 'Propellant line heater on']);
    expect(el.querySelector('[aria-live]')?.textContent).toContain('Propellant line heater on');
    await press(fixture, 'Escape');
    expect(el.querySelector('.ecl-strip-tooltip')).toBeNull();
  });

  it("shows the caller's duty figure when it gives one (a cycle longer than the drawn orbit), beside the row, in the summary and in the table", async () => {
    // Issue 14: the strip said 57.5 % (the drawn last orbit) where the heater table said 52.1 % (the 14-orbit cycle).
    const { fixture, el } = await render({ rows: [{ ...heaters[0], duty: 0.5214 }], xDomain: [0, 100], xUnit: 'min' });
    expect(el.querySelector('.ecl-strip-duty')?.textContent?.trim()).toBe('52.1 %');
    expect(el.querySelector('svg')?.getAttribute('aria-label')).toContain('Battery heater on 52.1 % of the time');
    (el.querySelector('.ecl-strip-table-toggle') as HTMLButtonElement).click();
    await fixture.whenStable();
    expect(el.querySelectorAll('tbody tr')[0].children[1]?.textContent?.trim()).toBe('52.1');
  });

  it('summarises duty cycles for screen readers and offers a table', async () => {
    const { fixture, el } = await render({ rows: heaters, xDomain: [0, 100], xUnit: 'min', title: 'Heaters, cold case' });
    const label = el.querySelector('svg')?.getAttribute('aria-label') ?? '';
    expect(label).toContain('Heaters, cold case');
    expect(label).toContain('Battery heater on 35 % of the time in 2 periods');
    (el.querySelector('.ecl-strip-table-toggle') as HTMLButtonElement).click();
    await fixture.whenStable();
    const cells = Array.from(el.querySelectorAll('tbody tr')[0].children).map((c) => c.textContent?.trim());
    expect(cells).toEqual(['Battery heater', '35', '0 min – 10 min; 50 min – 75 min']);
  });
});
