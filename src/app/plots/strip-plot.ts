// On/off strips over time, one row each (heaters, switched dissipation), drawn with the same x axis
// as TimeSeriesPlot so the two line up one above the other with a shared xDomain.
import { ChangeDetectionStrategy, Component, computed, input, model, type Signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { cssColor } from './plot-colors';
import { axisTitle, formatValue, formatX } from './plot-format';
import { CURSOR_HINT, PlotCursor } from './plot-cursor';
import { buildXScale, xDomainOf } from './plot-scales';
import type { PlotBand, PlotGutters, StripRow, XKind } from './plot-series';
import { observePlotWidth } from './plot-width';
import { PlotXAxis } from './plot-x-axis';
import { clipSegments, isOnAt, onFraction } from './strip-segments';

/** A row's on fraction as shown: the caller's figure when it gave one, else the drawn segments' share. */
const dutyOf = (r: StripRow, domain: readonly [number, number]): number => r.duty ?? onFraction(r.segments, domain);
import { bandStyle } from './time-series-layout';

const TICK_CHAR_PX = 6.5;
let nextStripId = 0;

@Component({
  selector: 'ecl-strip-plot',
  imports: [PlotXAxis, MatButton],
  templateUrl: './strip-plot.html',
  styleUrls: ['./plot-axis.css', './plot-table.css', './strip-plot.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StripPlot {
  readonly rows = input.required<readonly StripRow[]>();
  /** Names the plot for screen readers and the table caption, e.g. "Heater duty, cold case". */
  readonly title = input('');
  readonly xLabel = input('Time');
  readonly xUnit = input('');
  readonly xKind = input<XKind>('number');
  /** Set it to the TimeSeriesPlot's range above to line the two up; by default the segments' range. */
  readonly xDomain = input<readonly [number, number] | undefined>(undefined);
  readonly bands = input<readonly PlotBand[]>([]);
  /**
   * The zoomed x range (null: the whole range). Bind it two-way, `[(zoomed)]`, to one signal on
   * plots stacked with a shared xDomain so a zoom on one zooms them all.
   */
  readonly zoomed = model<readonly [number, number] | null>(null);
  readonly rowHeight = input(22);
  /** Minimum left and right margins in px: give a StripPlot and a TimeSeriesPlot the same (wider than either's
   * own labels need) to align their x axes. */
  readonly gutters = input<PlotGutters>({});

  private readonly width = observePlotWidth();
  protected readonly cursorHint = CURSOR_HINT;
  protected readonly clipId = `ecl-strip-clip-${nextStripId}`;
  protected readonly hintId = `ecl-strip-hint-${nextStripId++}`;

  protected readonly xTitle = computed(() => axisTitle(this.xLabel(), this.xKind() === 'date' ? 'UTC' : this.xUnit()));

  private readonly fullDomain = computed<readonly [number, number]>(() => {
    const fixed = this.xDomain();
    if (fixed) return fixed;
    const xs = this.rows().flatMap((r) => r.segments.flatMap((s) => [s.from, s.to]));
    return xDomainOf(xs.length > 0 ? xs : this.bands().flatMap((b) => [b.from, b.to]));
  });
  protected readonly pointer: PlotCursor = new PlotCursor({
    fullDomain: this.fullDomain,
    geometry: () => {
      const l = this.layout();
      return { x: l.x, left: l.margin.left, innerWidth: l.innerWidth };
    },
    // on and off periods have no samples: the cursor moves freely
    stops: () => null,
    sentence: (at) => {
      const readout = this.readout(at);
      return [readout.x, ...readout.states.map((s) => `${s.label} ${s.state}`)].join('; ');
    },
    xText: (at) => formatX(at, this.xKind(), this.xUnit()),
    zoom: this.zoomed,
  });
  private readonly domain: Signal<readonly [number, number]> = this.pointer.domain;

  protected readonly layout = computed(() => {
    const rows = this.rows();
    const rowHeight = Math.max(12, this.rowHeight());
    const longest = Math.max(4, ...rows.map((r) => r.label.length));
    const gutters = this.gutters();
    const margin = {
      top: 4,
      right: Math.max(56, gutters.right ?? 0),
      bottom: 42,
      left: Math.max(Math.ceil(12 + longest * TICK_CHAR_PX), gutters.left ?? 0),
    };
    const width = Math.max(margin.left + margin.right + 60, this.width());
    const innerWidth = width - margin.left - margin.right;
    const innerHeight = rows.length * rowHeight;
    const domain = this.domain();
    const x = buildXScale(this.xKind(), domain, innerWidth);
    const bands = this.bands().flatMap((b) => {
      const from = Math.max(Math.min(b.from, b.to), domain[0]);
      const to = Math.min(Math.max(b.from, b.to), domain[1]);
      return to > from ? [{ kind: b.kind, x: x.toPx(from), width: x.toPx(to) - x.toPx(from), ...bandStyle(b.kind) }] : [];
    });
    return {
      width,
      height: margin.top + innerHeight + margin.bottom,
      margin,
      innerWidth,
      innerHeight,
      x,
      xTicks: x.ticks(Math.max(2, Math.round(innerWidth / (this.xKind() === 'date' ? 110 : 80)))),
      bands,
      rows: rows.map((r, i) => {
        const on = clipSegments(r.segments, domain);
        return {
          label: r.label,
          y: i * rowHeight,
          height: rowHeight,
          fill: cssColor(r.colorVar ?? '--mat-sys-primary'),
          duty: `${formatValue(dutyOf(r, domain) * 100)} %`,
          segments: on.map((s) => ({ x: x.toPx(s.from), width: x.toPx(s.to) - x.toPx(s.from) })),
        };
      }),
    };
  });

  protected readonly summary = computed(() => {
    const domain = this.domain();
    const [kind, unit] = [this.xKind(), this.xUnit()];
    const head = `On and off against ${this.xTitle()} from ${formatX(domain[0], kind, unit)} to ${formatX(domain[1], kind, unit)}`;
    const parts = [this.title() ? `${this.title()}: ${head}` : head];
    for (const r of this.rows()) {
      const periods = clipSegments(r.segments, domain).length;
      parts.push(`${r.label} on ${formatValue(dutyOf(r, domain) * 100)} % of the time in ${periods} period${periods === 1 ? '' : 's'}`);
    }
    return parts.join('. ') + '.';
  });

  protected readonly cursor = computed(() => {
    const at = this.pointer.shownX();
    if (at === null) return null;
    const layout = this.layout();
    const px = layout.x.toPx(at);
    if (!(px >= 0 && px <= layout.innerWidth)) return null;
    const flip = px > layout.innerWidth / 2;
    return { px, left: layout.margin.left + px + (flip ? -12 : 12), flip, ...this.readout(at) };
  });

  protected readonly table = computed(() => {
    if (!this.pointer.showTable()) return null;
    const domain = this.domain();
    const [kind, unit] = [this.xKind(), this.xUnit()];
    return this.rows().map((r) => ({
      label: r.label,
      duty: formatValue(dutyOf(r, domain) * 100),
      periods: clipSegments(r.segments, domain)
        .map((s) => `${formatX(s.from, kind, unit)} – ${formatX(s.to, kind, unit)}`)
        .join('; '),
    }));
  });

  private readout(at: number): { x: string; states: { label: string; state: 'on' | 'off' }[] } {
    return {
      x: formatX(at, this.xKind(), this.xUnit()),
      states: this.rows().map((r) => ({ label: r.label, state: isOnAt(r.segments, at) ? 'on' : 'off' })),
    };
  }
}
