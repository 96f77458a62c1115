// A line plot of one or more series against time (or any x): heat loads around the orbit,
// temperatures, beta angle over the mission. Bands shade eclipses, limit lines mark hot and cold
// limits, the legend toggles series, and a cursor reads values by pointer or arrow keys; a drag or
// the + and − keys zoom the x range (plot-cursor.ts).
import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, model, output, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { buildResultCsv, downloadCsv } from './csv-download';
import { cssColor } from './plot-colors';
import { axisTitle } from './plot-format';
import { CURSOR_HINT, PlotCursor } from './plot-cursor';
import { nearestIndex } from './plot-scales';
import { physicalRange, type LimitLine, type PhysicalRange, type PlotBand, type PlotGutters, type PlotSeries, type XKind } from './plot-series';
import { observePlotWidth } from './plot-width';
import { PlotXAxis } from './plot-x-axis';
import { bandStyle, layoutTimeSeries, timeSeriesXDomain } from './time-series-layout';
import { formatX } from './plot-format';
import { dataTable, readoutAt, readoutSentence, seriesCsvColumns, summarize } from './time-series-text';

let nextPlotId = 0;

@Component({
  selector: 'ecl-time-series-plot',
  imports: [PlotXAxis, MatButton],
  templateUrl: './time-series-plot.html',
  styleUrls: ['./plot-axis.css', './plot-table.css', './time-series-plot.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TimeSeriesPlot {
  readonly series = input.required<readonly PlotSeries[]>();
  /** Names the plot for screen readers and the data table caption, e.g. "Heat loads around the orbit". */
  readonly title = input('');
  readonly xLabel = input('Time');
  readonly xUnit = input('');
  readonly yLabel = input('');
  readonly yUnit = input('');
  readonly xKind = input<XKind>('number');
  readonly bands = input<readonly PlotBand[]>([]);
  readonly limits = input<readonly LimitLine[]>([]);
  /** Fixes the x range, e.g. to line up with a StripPlot below; by default the data's range. */
  readonly xDomain = input<readonly [number, number] | undefined>(undefined);
  /** Where y can physically lie ('non-negative', 'fraction', 'beta' or [low, high]): the axis never runs past it. */
  readonly yRange = input<PhysicalRange | undefined>(undefined);
  readonly height = input(280);
  /** Minimum left and right margins in px: give a StripPlot below the same to align the x axes. */
  readonly gutters = input<PlotGutters>({});
  /** When set, a "Download CSV" button saves every sample under this file name. */
  readonly csvFileName = input('');
  /**
   * An x another view points at (e.g. the orbit view's scrubber): the cursor shows there while the
   * pointer is not over the plot. Null (the default) leaves the cursor to the pointer and keys alone.
   */
  readonly cursorAt = input<number | null>(null);
  /**
   * The zoomed x range (null: the whole range). Bind it two-way, `[(zoomed)]`, to one signal on
   * plots stacked with a shared xDomain so a zoom on one zooms them all.
   */
  readonly zoomed = model<readonly [number, number] | null>(null);
  /** The x the user put the cursor on by pointer or keys (a sample's x), null when they hid it. */
  readonly cursorChange = output<number | null>();

  private readonly document = inject(DOCUMENT);
  private readonly width = observePlotWidth();
  private readonly hidden = signal<ReadonlySet<string>>(new Set());
  protected readonly cursorHint = CURSOR_HINT;
  protected readonly clipId = `ecl-plot-clip-${nextPlotId}`;
  protected readonly hintId = `ecl-plot-hint-${nextPlotId++}`;

  private readonly fullXDomain = computed(() => timeSeriesXDomain(this.series(), this.bands(), this.xDomain()));
  protected readonly pointer: PlotCursor = new PlotCursor({
    fullDomain: this.fullXDomain,
    geometry: () => {
      const l = this.layout();
      return { x: l.x, left: l.margin.left, innerWidth: l.innerWidth };
    },
    // The cursor snaps to the samples of the first visible series.
    stops: () => this.visibleSeries().find((s) => s.points.length > 0)?.points ?? [],
    sentence: (x) => readoutSentence(readoutAt(this.visibleSeries(), x, this.xKind(), this.xUnit())),
    xText: (x) => formatX(x, this.xKind(), this.xUnit()),
    changed: (x) => this.cursorChange.emit(x),
    external: this.cursorAt,
    zoom: this.zoomed,
  });

  protected readonly xTitle = computed(() => axisTitle(this.xLabel(), this.xKind() === 'date' ? 'UTC' : this.xUnit()));
  protected readonly yTitle = computed(() => axisTitle(this.yLabel(), this.yUnit()));

  protected readonly visibleSeries = computed(() => this.series().filter((s) => !this.hidden().has(s.id)));

  protected readonly layout = computed(() =>
    layoutTimeSeries({
      series: this.series(),
      hidden: this.hidden(),
      bands: this.bands(),
      limits: this.limits(),
      xKind: this.xKind(),
      xDomain: this.pointer.domain(),
      yFromShownX: this.pointer.zoom() !== null,
      yRange: physicalRange(this.yRange()),
      width: this.width(),
      height: this.height(),
      gutters: this.gutters(),
    }),
  );

  protected readonly legend = computed(() =>
    this.series().map((s) => ({
      id: s.id,
      label: s.label,
      unit: s.unit,
      stroke: cssColor(s.colorVar),
      dash: s.dash ?? false,
      visible: !this.hidden().has(s.id),
    })),
  );

  /** One legend key per band label, so "Eclipse" is named once however many orbits are shown. */
  protected readonly bandLegend = computed(() => {
    const seen = new Map<string, { label: string; fill: string; opacity: number }>();
    for (const b of this.bands()) if (!seen.has(b.label)) seen.set(b.label, { label: b.label, ...bandStyle(b.kind) });
    return [...seen.values()];
  });

  protected readonly summary = computed(() =>
    summarize({
      title: this.title(),
      series: this.visibleSeries(),
      x: { label: this.xLabel(), unit: this.xUnit() },
      y: { label: this.yLabel(), unit: this.yUnit() },
      xKind: this.xKind(),
      xDomain: this.layout().x.domain,
      bands: this.bands(),
      limits: this.limits(),
    }),
  );

  protected readonly cursor = computed(() => {
    const x = this.pointer.shownX();
    if (x === null) return null;
    const layout = this.layout();
    const px = layout.x.toPx(x);
    if (!(px >= 0 && px <= layout.innerWidth)) return null;
    const visible = this.visibleSeries();
    const readout = readoutAt(visible, x, this.xKind(), this.xUnit());
    const markers = visible.flatMap((s) => {
      const i = nearestIndex(s.points, x);
      const y = i < 0 ? NaN : s.points[i].y;
      if (!Number.isFinite(y)) return [];
      return [{ id: s.id, cx: layout.x.toPx(s.points[i].x), cy: layout.yToPx(y), stroke: cssColor(s.colorVar) }];
    });
    const strokes = new Map(visible.map((s) => [s.id, cssColor(s.colorVar)]));
    const flip = px > layout.innerWidth / 2;
    return {
      px,
      markers,
      x: readout.x,
      rows: readout.rows.map((r) => ({ ...r, stroke: strokes.get(r.id) ?? 'currentColor' })),
      left: layout.margin.left + px + (flip ? -12 : 12),
      flip,
    };
  });

  protected readonly table = computed(() =>
    this.pointer.showTable() ? dataTable(this.series(), { label: this.xLabel(), unit: this.xUnit() }, this.xKind()) : null,
  );

  protected toggleSeries(id: string): void {
    this.hidden.update((hidden) => {
      const next = new Set(hidden);
      if (!next.delete(id)) next.add(id);
      return next;
    });
  }

  protected downloadData(): void {
    const columns = seriesCsvColumns(this.series(), { label: this.xLabel(), unit: this.xUnit() }, this.xKind());
    downloadCsv(this.csvFileName(), buildResultCsv(columns), this.document);
  }
}
