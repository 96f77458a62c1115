// A line plot of one or more series against time (or any x): heat loads around the orbit,
// temperatures, beta angle over the mission. Bands shade eclipses, limit lines mark hot and cold
// limits, the legend toggles series, and a cursor reads values by pointer or arrow keys.
import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { buildResultCsv, downloadCsv } from './csv-download';
import { cssColor } from './plot-colors';
import { axisTitle } from './plot-format';
import { nearestIndex } from './plot-scales';
import type { LimitLine, PlotBand, PlotGutters, PlotSeries, XKind } from './plot-series';
import { observePlotWidth } from './plot-width';
import { PlotXAxis } from './plot-x-axis';
import { bandStyle, layoutTimeSeries } from './time-series-layout';
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
  /** The x the user put the cursor on by pointer or keys (a sample's x), null when they hid it. */
  readonly cursorChange = output<number | null>();

  private readonly document = inject(DOCUMENT);
  private readonly width = observePlotWidth();
  private readonly hidden = signal<ReadonlySet<string>>(new Set());
  private readonly ownCursorX = signal<number | null>(null);
  private readonly cursorX = computed(() => this.ownCursorX() ?? this.cursorAt());
  protected readonly showTable = signal(false);
  protected readonly announcement = signal('');
  protected readonly clipId = `ecl-plot-clip-${nextPlotId}`;
  protected readonly hintId = `ecl-plot-hint-${nextPlotId++}`;

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
      xDomain: this.xDomain(),
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
    const x = this.cursorX();
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
    this.showTable() ? dataTable(this.series(), { label: this.xLabel(), unit: this.xUnit() }, this.xKind()) : null,
  );

  protected toggleSeries(id: string): void {
    this.hidden.update((hidden) => {
      const next = new Set(hidden);
      if (!next.delete(id)) next.add(id);
      return next;
    });
  }

  protected toggleTable(): void {
    this.showTable.update((shown) => !shown);
  }

  protected downloadData(): void {
    const columns = seriesCsvColumns(this.series(), { label: this.xLabel(), unit: this.xUnit() }, this.xKind());
    downloadCsv(this.csvFileName(), buildResultCsv(columns), this.document);
  }

  protected trackPointer(event: MouseEvent): void {
    const target = event.currentTarget;
    if (!(target instanceof Element)) return;
    const layout = this.layout();
    const px = event.clientX - target.getBoundingClientRect().left - layout.margin.left;
    if (px < 0 || px > layout.innerWidth) {
      this.setCursor(null);
      return;
    }
    const x = layout.x.fromPx(px);
    const primary = this.primaryPoints();
    const i = nearestIndex(primary, x);
    this.setCursor(i < 0 ? x : primary[i].x);
  }

  protected hideCursor(): void {
    this.setCursor(null);
  }

  /** Arrows step about one pixel column (Shift: ten), Home/End jump to the ends, Escape hides. */
  protected moveCursor(event: KeyboardEvent): void {
    const points = this.primaryPoints();
    const n = points.length;
    if (n === 0) return;
    const base = Math.max(1, Math.floor(n / this.layout().innerWidth));
    const step = event.shiftKey ? base * 10 : base;
    const current = this.cursorX();
    const i = current === null ? -1 : nearestIndex(points, current);
    let next: number;
    switch (event.key) {
      case 'ArrowRight':
        next = i < 0 ? 0 : Math.min(n - 1, i + step);
        break;
      case 'ArrowLeft':
        next = i < 0 ? n - 1 : Math.max(0, i - step);
        break;
      case 'Home':
        next = 0;
        break;
      case 'End':
        next = n - 1;
        break;
      case 'Escape':
        this.setCursor(null);
        return;
      default:
        return;
    }
    event.preventDefault();
    this.setCursor(points[next].x);
    const x = points[next].x;
    this.announcement.set(readoutSentence(readoutAt(this.visibleSeries(), x, this.xKind(), this.xUnit())));
  }

  private setCursor(x: number | null): void {
    if (x === this.ownCursorX()) return;
    this.ownCursorX.set(x);
    this.cursorChange.emit(x);
  }

  /** The cursor snaps to the samples of the first visible series. */
  private primaryPoints(): PlotSeries['points'] {
    return this.visibleSeries().find((s) => s.points.length > 0)?.points ?? [];
  }
}
