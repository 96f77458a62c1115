import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { buildXScale, finiteExtent, nearestIndex, niceDomain, thinForDrawing, xDomainOf } from './plot-scales';
import type { PlotPoint } from './plot-series';

const pts = (xs: readonly number[], ys?: readonly number[]): PlotPoint[] => xs.map((x, i) => ({ x, y: ys ? ys[i] : x }));

describe('niceDomain', () => {
  it('covers negative and positive values and ends on tick steps', () => {
    const [lo, hi] = niceDomain([-12.3, 4, 48.2], 5);
    expect(lo).toBeLessThanOrEqual(-12.3);
    expect(hi).toBeGreaterThanOrEqual(48.2);
    expect(lo).toBe(-20);
    expect(hi).toBe(50);
  });

  it('opens a flat series around its value instead of a zero-height domain', () => {
    const [lo, hi] = niceDomain([1361, 1361, 1361]);
    expect(lo).toBeLessThan(1361);
    expect(hi).toBeGreaterThan(1361);
    expect(niceDomain([0, 0])).toEqual([-1, 1]);
    const [nlo, nhi] = niceDomain([-40, -40]);
    expect(nlo).toBeLessThan(-40);
    expect(nhi).toBeGreaterThan(-40);
  });

  it('skips gaps and gives [0, 1] when nothing is finite', () => {
    expect(niceDomain([NaN, 3, Infinity, 7])).toEqual(niceDomain([3, 7]));
    expect(niceDomain([])).toEqual([0, 1]);
    expect(niceDomain([NaN])).toEqual([0, 1]);
  });
});

describe('xDomainOf and finiteExtent', () => {
  it('keeps the data range exact and pads a single x', () => {
    expect(xDomainOf([0, 95.6])).toEqual([0, 95.6]);
    expect(xDomainOf([5])).toEqual([4, 6]);
    expect(finiteExtent([2, NaN, -3])).toEqual([-3, 2]);
  });
});

describe('buildXScale', () => {
  it('maps numbers and inverts them', () => {
    const x = buildXScale('number', [0, 100], 500);
    expect(x.toPx(25)).toBe(125);
    expect(x.fromPx(250)).toBe(50);
    const ticks = x.ticks(5);
    expect(ticks.map((t) => t.value)).toEqual([0, 20, 40, 60, 80, 100]);
    expect(ticks[1].px).toBe(100);
  });

  it('maps dates given as ms since epoch and labels their ticks', () => {
    const t0 = Date.UTC(2026, 2, 1);
    const t1 = Date.UTC(2026, 2, 11);
    const x = buildXScale('date', [t0, t1], 1000);
    expect(x.toPx(Date.UTC(2026, 2, 6))).toBe(500);
    expect(x.fromPx(100)).toBe(Date.UTC(2026, 2, 2));
    const ticks = x.ticks(5);
    expect(ticks.length).toBeGreaterThan(2);
    expect(ticks.every((t) => t.label.length > 0 && t.value >= t0 && t.value <= t1)).toBe(true);
  });
});

describe('nearestIndex', () => {
  it('finds the nearest sample, the lower one on a tie, and clamps outside', () => {
    const p = pts([0, 10, 20, 30]);
    expect(nearestIndex(p, 14)).toBe(1);
    expect(nearestIndex(p, 16)).toBe(2);
    expect(nearestIndex(p, 15)).toBe(1);
    expect(nearestIndex(p, -5)).toBe(0);
    expect(nearestIndex(p, 99)).toBe(3);
    expect(nearestIndex([], 3)).toBe(-1);
  });

  it('agrees with a linear scan on random sorted series (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: -1000, max: 1000 }), { minLength: 1, maxLength: 60 }),
        fc.integer({ min: -1200, max: 1200 }),
        (raw, x) => {
          const p = pts([...raw].sort((a, b) => a - b));
          let best = 0;
          for (let i = 1; i < p.length; i++) if (Math.abs(p[i].x - x) < Math.abs(p[best].x - x)) best = i;
          const found = nearestIndex(p, x);
          // Equal distances (or duplicate x) may pick another index at the same distance.
          expect(Math.abs(p[found].x - x)).toBe(Math.abs(p[best].x - x));
        },
      ),
    );
  });
});

describe('thinForDrawing', () => {
  const n = 100_000;
  const columns = 500;
  // A smooth orbit-like wave with one spike and one dip that a naive decimation would drop.
  const series: PlotPoint[] = Array.from({ length: n }, (_, i) => ({ x: i, y: Math.sin(i / 3000) * 100 }));
  series[53_217] = { x: 53_217, y: 5_000 };
  series[77_001] = { x: 77_001, y: -5_000 };

  const thin = thinForDrawing(series, columns);

  it('brings 100000 points down to about two a pixel column', () => {
    expect(thin.length).toBeLessThanOrEqual(2 * columns + 2);
    expect(thin.length).toBeGreaterThan(columns);
  });

  it('keeps the extremes, the ends and x order', () => {
    expect(thin).toContain(series[53_217]);
    expect(thin).toContain(series[77_001]);
    expect(thin[0]).toBe(series[0]);
    expect(thin[thin.length - 1]).toBe(series[n - 1]);
    for (let i = 1; i < thin.length; i++) expect(thin[i].x).toBeGreaterThan(thin[i - 1].x);
  });

  it("keeps each column's own minimum and maximum", () => {
    const perColumn = n / columns;
    for (const c of [0, 123, 266, 385, 499]) {
      const inColumn = series.slice(c * perColumn, (c + 1) * perColumn).map((p) => p.y);
      const kept = thin.filter((p) => p.x >= c * perColumn && p.x < (c + 1) * perColumn).map((p) => p.y);
      expect(Math.max(...kept)).toBe(Math.max(...inColumn));
      expect(Math.min(...kept)).toBe(Math.min(...inColumn));
    }
  });

  it('keeps a gap so the line still breaks there', () => {
    const gappy = series.map((p, i) => (i === 40_000 ? { x: p.x, y: NaN } : p));
    const thinned = thinForDrawing(gappy, columns);
    expect(thinned.some((p) => Number.isNaN(p.y) && p.x === 40_000)).toBe(true);
  });

  it('returns a short series unchanged', () => {
    const short = pts([0, 1, 2, 3, 4, 5]);
    expect(thinForDrawing(short, 500)).toBe(short);
  });
});
