// Geometry of a time-series plot as plain data: scales, ticks, line paths, bands and limit lines.
// The component binds this into its SVG template, so d3 does the arithmetic and Angular owns the
// DOM (no second renderer fighting change detection).
import { line, scaleLinear } from 'd3';
import { cssColor } from './plot-colors';
import { buildXScale, clampDomain, niceDomain, thinForDrawing, xDomainOf, type AxisTick, type XScale } from './plot-scales';
import type { BandKind, LimitLine, PlotBand, PlotGutters, PlotPoint, PlotSeries, XKind } from './plot-series';

export interface PlotMargin {
  readonly top: number;
  readonly right: number;
  readonly bottom: number;
  readonly left: number;
}

export interface TimeSeriesLayoutInput {
  readonly series: readonly PlotSeries[];
  readonly hidden: ReadonlySet<string>;
  readonly bands: readonly PlotBand[];
  readonly limits: readonly LimitLine[];
  readonly xKind: XKind;
  readonly xDomain: readonly [number, number] | undefined;
  /** y follows only the samples inside xDomain (a zoomed plot), not every sample. */
  readonly yFromShownX?: boolean;
  /** The physical range of y; the axis stays inside it (clampDomain). */
  readonly yRange?: readonly [number, number] | undefined;
  readonly width: number;
  readonly height: number;
  readonly gutters?: PlotGutters;
}

export interface LayoutLine {
  readonly id: string;
  readonly d: string;
  readonly stroke: string;
  readonly dash: boolean;
}

export interface LayoutBand {
  readonly kind: BandKind;
  readonly label: string;
  readonly x: number;
  readonly width: number;
  readonly fill: string;
  readonly opacity: number;
  /** Labels are drawn only where they fit; the legend names every band kind regardless. */
  readonly showLabel: boolean;
}

export interface LayoutLimit {
  readonly kind: 'hot' | 'cold';
  readonly label: string;
  readonly py: number;
  readonly stroke: string;
}

export interface TimeSeriesLayout {
  readonly width: number;
  readonly height: number;
  readonly margin: PlotMargin;
  readonly innerWidth: number;
  readonly innerHeight: number;
  readonly x: XScale;
  readonly yToPx: (y: number) => number;
  readonly xTicks: readonly AxisTick[];
  readonly yTicks: readonly AxisTick[];
  readonly lines: readonly LayoutLine[];
  readonly bands: readonly LayoutBand[];
  readonly limits: readonly LayoutLimit[];
}

/** Band fills: one look per kind on every page; penumbra is the eclipse colour at half strength. */
export function bandStyle(kind: BandKind): { fill: string; opacity: number } {
  switch (kind) {
    case 'eclipse':
      return { fill: cssColor('--ecl-eclipse-band'), opacity: 1 };
    case 'penumbra':
      return { fill: cssColor('--ecl-eclipse-band'), opacity: 0.5 };
    case 'parent-shadow':
      return { fill: cssColor('--ecl-parent-shadow-band'), opacity: 1 };
    case 'limit':
      return { fill: cssColor('--mat-sys-error'), opacity: 0.1 };
    case 'custom':
      return { fill: cssColor('--mat-sys-on-surface'), opacity: 0.06 };
  }
}

export function limitStroke(kind: 'hot' | 'cold'): string {
  return cssColor(kind === 'hot' ? '--ecl-hot' : '--ecl-cold');
}

const TICK_CHAR_PX = 6.5;
const MIN_LABEL_BAND_PX = 44;

export function timeSeriesXDomain(
  series: readonly PlotSeries[],
  bands: readonly PlotBand[],
  fixed: readonly [number, number] | undefined,
): [number, number] {
  if (fixed) return [fixed[0], fixed[1]];
  const xs: number[] = [];
  for (const s of series) {
    if (s.points.length === 0) continue;
    xs.push(s.points[0].x, s.points[s.points.length - 1].x);
  }
  if (xs.length === 0) for (const b of bands) xs.push(b.from, b.to);
  return xDomainOf(xs);
}

export function layoutTimeSeries(input: TimeSeriesLayoutInput): TimeSeriesLayout {
  const visible = input.series.filter((s) => !input.hidden.has(s.id));
  const height = Math.max(120, input.height);
  const top = 12;
  const bottom = 42;
  const innerHeight = height - top - bottom;

  // The y range follows the visible series, so hiding the large solar term lets the small IR term
  // fill the plot; limit lines always stay in view.
  // A zoomed plot scales y to the samples it shows.
  const shownX = input.yFromShownX && input.xDomain ? input.xDomain : null;
  const yValues = function* (): Generator<number> {
    for (const s of visible.length > 0 ? visible : input.series) {
      for (const p of s.points) if (!shownX || (p.x >= shownX[0] && p.x <= shownX[1])) yield p.y;
    }
    for (const l of input.limits) yield l.y;
  };
  const yTickCount = Math.max(2, Math.round(innerHeight / 40));
  const yDomain = clampDomain(niceDomain(yValues(), yTickCount), input.yRange);
  const y = scaleLinear().domain(yDomain).range([innerHeight, 0]);
  const yFormat = y.tickFormat(yTickCount);
  const yTickValues = y.ticks(yTickCount);
  const yLabels = yTickValues.map((v) => yFormat(v));

  const longestLabel = Math.max(1, ...yLabels.map((l) => l.length));
  const left = Math.max(Math.ceil(24 + 8 + longestLabel * TICK_CHAR_PX), input.gutters?.left ?? 0);
  // room for half the last x tick's label (a date such as 2027-09 at the right end)
  const right = Math.max(28, input.gutters?.right ?? 0);
  const width = Math.max(left + right + 60, input.width);
  const innerWidth = width - left - right;

  const x = buildXScale(input.xKind, timeSeriesXDomain(input.series, input.bands, input.xDomain), innerWidth);
  const xTicks = x.ticks(Math.max(2, Math.round(innerWidth / (input.xKind === 'date' ? 110 : 80))));
  const yTicks = yTickValues.map((v, i) => ({ value: v, px: y(v), label: yLabels[i] }));

  const path = line<PlotPoint>()
    .defined((p) => Number.isFinite(p.y))
    .x((p) => x.toPx(p.x))
    .y((p) => y(p.y))
    .digits(1);
  const lines = visible.map((s) => ({
    id: s.id,
    // About two points a pixel column is all the screen can show; the spikes are kept.
    d: path(thinForDrawing(s.points, innerWidth / 2, x.domain)) ?? '',
    stroke: cssColor(s.colorVar),
    dash: s.dash ?? false,
  }));

  const [d0, d1] = x.domain;
  const bands: LayoutBand[] = [];
  for (const b of input.bands) {
    const from = Math.max(Math.min(b.from, b.to), d0);
    const to = Math.min(Math.max(b.from, b.to), d1);
    if (!(to > from)) continue;
    const px0 = x.toPx(from);
    const px1 = x.toPx(to);
    bands.push({
      kind: b.kind,
      label: b.label,
      x: px0,
      width: px1 - px0,
      ...bandStyle(b.kind),
      showLabel: px1 - px0 >= Math.max(MIN_LABEL_BAND_PX, b.label.length * TICK_CHAR_PX + 6),
    });
  }

  const limits = input.limits.map((l) => ({ kind: l.kind, label: l.label, py: y(l.y), stroke: limitStroke(l.kind) }));

  return {
    width,
    height,
    margin: { top, right, bottom, left },
    innerWidth,
    innerHeight,
    x,
    yToPx: (v) => y(v),
    xTicks,
    yTicks,
    lines,
    bands,
    limits,
  };
}
