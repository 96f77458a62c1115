import { TestBed } from '@angular/core/testing';
import { beforeEach, describe, expect, it } from 'vitest';
import { DifferenceBarPlot } from './difference-bar-plot';

async function render(rows: { label: string; values: (number | null)[] }[]): Promise<HTMLElement> {
  const fixture = TestBed.createComponent(DifferenceBarPlot);
  fixture.componentRef.setInput('series', [{ name: 'Orbit average', color: '--ecl-absorbed' }, { name: 'Peak', color: '--ecl-accent' }]);
  fixture.componentRef.setInput('rows', rows);
  fixture.componentRef.setInput('unit', 'W');
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

describe('DifferenceBarPlot', () => {
  beforeEach(() => TestBed.configureTestingModule({ imports: [DifferenceBarPlot] }));

  it('draws a fall left of zero and a rise right of it, lengths in proportion (common practice, no source)', async () => {
    const el = await render([{ label: 'Radiator', values: [-10, 20] }]);
    const zero = Number(el.querySelector('line.zero')?.getAttribute('x1'));
    const [fall, rise] = Array.from(el.querySelectorAll('rect')).map((r) => ({ x: Number(r.getAttribute('x')), w: Number(r.getAttribute('width')) }));
    expect(fall!.x + fall!.w).toBeCloseTo(zero, 6);
    expect(rise!.x).toBeCloseTo(zero, 6);
    expect(rise!.w / fall!.w).toBeCloseTo(2, 6);
  });

  it('hides the drawing from screen readers and gives them a table with signed values in the unit, a missing value in words', async () => {
    const el = await render([{ label: 'Radiator', values: [-3.4, 12] }, { label: 'Antenna', values: [null, null] }]);
    expect(el.querySelector('svg')?.getAttribute('aria-hidden')).toBe('true');
    expect(Array.from(el.querySelectorAll('thead th')).map((th) => th.textContent?.trim())).toEqual(['Surface', 'Orbit average (W)', 'Peak (W)']);
    const cells = Array.from(el.querySelectorAll('tbody tr')).map((tr) => Array.from(tr.children).map((c) => c.textContent?.trim()));
    expect(cells).toEqual([['Radiator', '−3.4', '+12'], ['Antenna', 'only in one case', 'only in one case']]);
    expect(el.querySelectorAll('rect')).toHaveLength(2);
  });

  it('says "no difference" instead of drawing an empty axis when every difference is 0 (common practice, no source)', async () => {
    const el = await render([{ label: 'Radiator', values: [0, 0] }, { label: 'Antenna', values: [null, 0] }]);
    expect(el.querySelector('svg')).toBeNull();
    expect(el.querySelector('[data-testid="no-difference"]')?.textContent).toMatch(/No difference/);
    // the table still reads each value
    expect(el.querySelectorAll('tbody tr')).toHaveLength(2);
    const changed = await render([{ label: 'Radiator', values: [0, 0.5] }]);
    expect(changed.querySelector('[data-testid="no-difference"]')).toBeNull();
    expect(changed.querySelector('svg')).not.toBeNull();
  });
});
