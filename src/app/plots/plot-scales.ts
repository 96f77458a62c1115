// Pure helpers behind the plots: axis domains, the x scale (numbers or UTC dates), nearest-sample
// lookup and thinning long series for drawing. No DOM and no Angular, so they run inside computed().
import { nice, scaleLinear, scaleUtc } from 'd3';
import { utcTickLabel } from '../time/utc-time';
import type { PlotPoint, XKind } from './plot-series';

export interface AxisTick {
  readonly value: number;
  /** Position along the axis in px. */
  readonly px: number;
  readonly label: string;
}

/** An x scale that hides whether x is a number or a date (ms since epoch). */
export interface XScale {
  readonly domain: readonly [number, number];
  toPx(x: number): number;
  fromPx(px: number): number;
  ticks(count: number): AxisTick[];
}

/**
 * A domain containing every finite value, rounded outward to nice tick steps. A flat series gets
 * room around its value so its line does not lie on the frame; no finite value gives [0, 1].
 */
export function niceDomain(values: Iterable<number>, tickCount = 5): [number, number] {
  let [lo, hi] = finiteExtent(values);
  if (lo > hi) return [0, 1];
  if (lo === hi) {
    const pad = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    lo -= pad;
    hi += pad;
  }
  return nice(lo, hi, tickCount);
}

/**
 * A nice domain kept inside a physical range (a beta angle within ±90°, a sunlit fraction within
 * 0..1, a flow at or above 0): nice rounding and the room around a flat line never carry an axis past
 * what the quantity can be. A domain wholly outside the range (bad data) is left as it is, so the
 * data stays visible.
 */
export function clampDomain(domain: readonly [number, number], range: readonly [number, number] | undefined): [number, number] {
  if (!range) return [domain[0], domain[1]];
  const lo = Math.max(domain[0], range[0]);
  const hi = Math.min(domain[1], range[1]);
  return hi > lo ? [lo, hi] : [domain[0], domain[1]];
}

/** [min, max] of the finite values; [Infinity, -Infinity] when there are none. */
export function finiteExtent(values: Iterable<number>): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return [lo, hi];
}

/** The data x range: exact (an orbit from 0 to 95.6 min should not be stretched to 100), padded when flat. */
export function xDomainOf(xs: Iterable<number>): [number, number] {
  const [lo, hi] = finiteExtent(xs);
  if (lo > hi) return [0, 1];
  if (lo === hi) return [lo - 1, hi + 1];
  return [lo, hi];
}

export function buildXScale(kind: XKind, domain: readonly [number, number], widthPx: number): XScale {
  if (kind === 'date') {
    const scale = scaleUtc().domain([new Date(domain[0]), new Date(domain[1])]).range([0, widthPx]);
    return {
      domain,
      toPx: (x) => scale(x),
      fromPx: (px) => scale.invert(px).getTime(),
      ticks: (count) => {
        return scale.ticks(count).map((d) => ({ value: d.getTime(), px: scale(d), label: utcTickLabel(d) }));
      },
    };
  }
  const scale = scaleLinear().domain(domain).range([0, widthPx]);
  return {
    domain,
    toPx: (x) => scale(x),
    fromPx: (px) => scale.invert(px),
    ticks: (count) => {
      const label = scale.tickFormat(count);
      return scale.ticks(count).map((v) => ({ value: v, px: scale(v), label: label(v) }));
    },
  };
}

/** Index of the point whose x is nearest to `x` (the lower one on a tie); -1 for no points. */
export function nearestIndex(points: readonly { readonly x: number }[], x: number): number {
  const n = points.length;
  if (n === 0 || Number.isNaN(x)) return -1;
  // Binary search for the first point with x >= target.
  let lo = 0;
  let hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (points[mid].x < x) lo = mid + 1;
    else hi = mid;
  }
  if (lo === 0) return 0;
  if (lo === n) return n - 1;
  return x - points[lo - 1].x <= points[lo].x - x ? lo - 1 : lo;
}

/**
 * Thins a sorted series for drawing `columns` pixel columns wide: per column it keeps the lowest and
 * the highest point (in x order), so spikes and dips survive, plus the first and last point and
 * the first gap (non-finite y) so line breaks survive. Short series come back unchanged.
 */
export function thinForDrawing(
  points: readonly PlotPoint[],
  columns: number,
  domain?: readonly [number, number],
): readonly PlotPoint[] {
  const cols = Math.max(1, Math.floor(columns));
  const n = points.length;
  // Below ~4 points a column the SVG path is already cheap; thinning would only cost fidelity.
  if (n <= cols * 4) return points;
  const x0 = domain ? domain[0] : points[0].x;
  const x1 = domain ? domain[1] : points[n - 1].x;
  const span = x1 - x0 || 1;
  const keep: number[] = [0];
  let bucket = -1;
  let minI = -1;
  let maxI = -1;
  let gapI = -1;
  const flush = (): void => {
    const picked = [minI, maxI, gapI].filter((i) => i >= 0).sort((a, b) => a - b);
    for (const i of picked) if (i !== keep[keep.length - 1]) keep.push(i);
  };
  for (let i = 0; i < n; i++) {
    const b = Math.min(cols - 1, Math.max(0, Math.floor(((points[i].x - x0) / span) * cols)));
    if (b !== bucket) {
      flush();
      bucket = b;
      minI = maxI = gapI = -1;
    }
    const y = points[i].y;
    if (!Number.isFinite(y)) {
      if (gapI < 0) gapI = i;
      continue;
    }
    if (minI < 0 || y < points[minI].y) minI = i;
    if (maxI < 0 || y > points[maxI].y) maxI = i;
  }
  flush();
  if (keep[keep.length - 1] !== n - 1) keep.push(n - 1);
  return keep.map((i) => points[i]);
}
