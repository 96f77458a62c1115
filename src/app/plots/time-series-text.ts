// A time-series plot in words and numbers: the aria summary, the cursor read-out, the data table
// that stands in for the picture, and the CSV behind the download button.
import type { CsvColumn } from './csv-download';
import { axisTitle, formatValue, formatWithUnit, formatX } from './plot-format';
import { finiteExtent, nearestIndex } from './plot-scales';
import type { LimitLine, PlotBand, PlotSeries, XKind } from './plot-series';

export interface AxisText {
  readonly label: string;
  readonly unit: string;
}

export interface ReadoutRow {
  readonly id: string;
  readonly label: string;
  readonly value: string;
}

export interface Readout {
  readonly x: string;
  readonly rows: readonly ReadoutRow[];
}

/** Every listed series' value at the sample nearest to `x`. */
export function readoutAt(series: readonly PlotSeries[], x: number, xKind: XKind, xUnit: string): Readout {
  const rows: ReadoutRow[] = [];
  for (const s of series) {
    const i = nearestIndex(s.points, x);
    if (i < 0) continue;
    rows.push({ id: s.id, label: s.label, value: formatWithUnit(s.points[i].y, s.unit) });
  }
  return { x: formatX(x, xKind, xUnit), rows };
}

export function readoutSentence(readout: Readout): string {
  return [readout.x, ...readout.rows.map((r) => `${r.label} ${r.value}`)].join('; ');
}

export interface SummaryInput {
  readonly title: string;
  readonly series: readonly PlotSeries[];
  readonly x: AxisText;
  readonly y: AxisText;
  readonly xKind: XKind;
  readonly xDomain: readonly [number, number];
  readonly bands: readonly PlotBand[];
  readonly limits: readonly LimitLine[];
}

/** The plot's aria-label: what is plotted against what, each series' range, bands and limits. */
export function summarize(input: SummaryInput): string {
  const { x, xKind } = input;
  const parts: string[] = [];
  const head = `${axisTitle(input.y.label, input.y.unit)} against ${axisTitle(x.label, x.unit)}`;
  parts.push(input.title ? `${input.title}: ${head}` : head);
  parts.push(`from ${formatX(input.xDomain[0], xKind, x.unit)} to ${formatX(input.xDomain[1], xKind, x.unit)}`);
  for (const s of input.series) {
    const [lo, hi] = finiteExtent(s.points.map((p) => p.y));
    parts.push(
      lo > hi ? `${s.label}: no data` : `${s.label} ${formatValue(lo)} to ${formatWithUnit(hi, s.unit)}`,
    );
  }
  for (const b of input.bands) {
    parts.push(`${b.label} from ${formatX(b.from, xKind, x.unit)} to ${formatX(b.to, xKind, x.unit)}`);
  }
  for (const l of input.limits) parts.push(`${l.label} at ${formatWithUnit(l.y, input.y.unit)}`);
  return parts.join('. ') + '.';
}

/** True when every series is sampled at the same x values, so one x column serves them all. */
export function sharesX(series: readonly PlotSeries[]): boolean {
  if (series.length < 2) return true;
  const first = series[0].points;
  return series.every((s) => s.points.length === first.length && s.points.every((p, i) => p.x === first[i].x));
}

export interface DataTable {
  readonly headers: readonly string[];
  readonly rows: readonly (readonly string[])[];
  /** 1 when every sample is shown; otherwise every n-th sample of the first series. */
  readonly every: number;
  readonly exact: boolean;
}

/** At most `maxRows` rows at the first series' x; other series at their nearest sample. */
export function dataTable(series: readonly PlotSeries[], x: AxisText, xKind: XKind, maxRows = 200): DataTable {
  const headers = [axisTitle(x.label, xKind === 'date' ? 'UTC' : x.unit), ...series.map((s) => axisTitle(s.label, s.unit))];
  const base = series.find((s) => s.points.length > 0)?.points ?? [];
  const every = Math.max(1, Math.ceil(base.length / maxRows));
  const rows: string[][] = [];
  for (let i = 0; i < base.length; i += every) {
    const at = base[i].x;
    rows.push([
      formatX(at, xKind, ''),
      ...series.map((s) => {
        const j = nearestIndex(s.points, at);
        return j < 0 ? '–' : formatValue(s.points[j].y);
      }),
    ]);
  }
  return { headers, rows, every, exact: sharesX(series) };
}

/** CSV columns with every sample: one x column when the series share x, else an x column each. */
export function seriesCsvColumns(series: readonly PlotSeries[], x: AxisText, xKind: XKind): CsvColumn[] {
  const xValues = (s: PlotSeries): (string | number)[] =>
    s.points.map((p) => (xKind === 'date' ? new Date(p.x).toISOString() : p.x));
  const xUnit = xKind === 'date' ? 'UTC' : x.unit;
  if (sharesX(series) && series.length > 0) {
    return [
      { header: x.label, unit: xUnit, values: xValues(series[0]) },
      ...series.map((s) => ({ header: s.label, unit: s.unit, values: s.points.map((p) => p.y) })),
    ];
  }
  return series.flatMap((s) => [
    { header: `${s.label} ${x.label.toLowerCase()}`, unit: xUnit, values: xValues(s) },
    { header: s.label, unit: s.unit, values: s.points.map((p) => p.y) },
  ]);
}
