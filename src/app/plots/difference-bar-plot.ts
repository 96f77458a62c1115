// Signed differences as horizontal bars, one group per row (e.g. a surface) and one bar per series,
// left of zero for a decrease and right for an increase; the x axis is the plots' shared one. The
// SVG is hidden from screen readers, which read the table beneath it instead.
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { cssColor } from './plot-colors';
import { axisTitle, formatWithUnit } from './plot-format';
import { buildXScale, niceDomain } from './plot-scales';
import { observePlotWidth } from './plot-width';
import { PlotXAxis } from './plot-x-axis';

export interface DifferenceSeries {
  readonly name: string;
  /** A theme custom property, e.g. '--ecl-absorbed'. */
  readonly color: string;
}

export interface DifferenceRow {
  readonly label: string;
  /** One value per series; null where the row has no value in one of the cases. */
  readonly values: readonly (number | null)[];
}

const LABEL_PX = 180;
const BAR_PX = 12;
const GAP_PX = 10;
const AXIS_PX = 42;

@Component({
  selector: 'ecl-difference-bar-plot',
  imports: [PlotXAxis],
  changeDetection: ChangeDetectionStrategy.OnPush,
  styleUrls: ['./plot-axis.css', './plot-table.css'],
  template: `
    @if (noDifference()) {
      <p class="no-difference ecl-muted" data-testid="no-difference">No difference: every value is the same in both cases.</p>
    } @else {
    <div class="legend" aria-hidden="true">
      @for (s of series(); track s.name) {
        <span><i [style.background]="color(s.color)"></i>{{ s.name }}</span>
      }
    </div>
    <svg [attr.width]="width()" [attr.height]="layout().height" aria-hidden="true" focusable="false">
      <g [attr.transform]="'translate(' + labelPx() + ',0)'">
        @for (row of layout().rows; track row.label) {
          <text class="row-label" x="-8" [attr.y]="row.y + row.h / 2" text-anchor="end" dominant-baseline="middle">{{ row.shortLabel }}</text>
          @for (bar of row.bars; track $index) {
            <rect [attr.x]="bar.x" [attr.y]="bar.y" [attr.width]="bar.w" [attr.height]="barPx" [style.fill]="bar.fill" />
          }
        }
        <line class="zero" [attr.x1]="layout().zero" [attr.x2]="layout().zero" y1="0" [attr.y2]="layout().plotHeight" />
        <g eclPlotXAxis [attr.transform]="'translate(0,' + layout().plotHeight + ')'" [ticks]="layout().ticks" [width]="layout().plotWidth" [title]="axisLabel()" />
      </g>
    </svg>
    }
    <table class="ecl-plot-table ecl-visually-hidden">
      <caption>{{ caption() }}</caption>
      <thead>
        <tr>
          <th scope="col">{{ rowHeading() }}</th>
          @for (s of series(); track s.name) {
            <th scope="col">{{ s.name }} ({{ unit() }})</th>
          }
        </tr>
      </thead>
      <tbody>
        @for (row of rows(); track row.label) {
          <tr>
            <th scope="row">{{ row.label }}</th>
            @for (v of row.values; track $index) {
              <td>{{ v === null ? 'only in one case' : signed(v) }}</td>
            }
          </tr>
        }
      </tbody>
    </table>
  `,
  styles: `
    :host {
      display: block;
    }
    svg {
      display: block;
      overflow: visible;
    }
    .legend {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 16px;
      font: var(--mat-sys-label-medium);
      margin-bottom: 4px;
    }
    .legend i {
      display: inline-block;
      width: 12px;
      height: 12px;
      margin-right: 6px;
      vertical-align: -1px;
    }
    .no-difference {
      margin: 4px 0;
      font: var(--mat-sys-body-medium);
    }
    .row-label {
      fill: var(--mat-sys-on-surface, #1a1b21);
      font-size: 12px;
    }
    .zero {
      stroke: var(--mat-sys-on-surface-variant, #44464f);
      stroke-width: 1;
      shape-rendering: crispEdges;
    }
  `,
})
export class DifferenceBarPlot {
  readonly series = input.required<readonly DifferenceSeries[]>();
  readonly rows = input.required<readonly DifferenceRow[]>();
  readonly unit = input.required<string>();
  readonly axisName = input('Difference, new − old');
  readonly caption = input('Differences, new − old');
  readonly rowHeading = input('Surface');

  protected readonly width = observePlotWidth();
  protected readonly barPx = BAR_PX;
  protected readonly color = cssColor;
  /** Narrow screens give the labels less room. */
  protected readonly labelPx = computed(() => Math.min(LABEL_PX, Math.round(this.width() * 0.3)));
  protected readonly axisLabel = computed(() => axisTitle(this.axisName(), this.unit()));

  /** Every value present is 0: an axis around nothing says less than the words. */
  protected readonly noDifference = computed(() => {
    const values = this.rows().flatMap((r) => r.values.filter((v): v is number => v !== null));
    return values.length > 0 && values.every((v) => v === 0);
  });

  protected readonly layout = computed(() => {
    const series = this.series();
    const plotWidth = Math.max(80, this.width() - this.labelPx() - 12);
    const values = this.rows().flatMap((r) => r.values.filter((v): v is number => v !== null));
    const scale = buildXScale('number', niceDomain([0, ...values]), plotWidth);
    const zero = scale.toPx(0);
    const groupPx = series.length * BAR_PX + GAP_PX;
    const maxChars = Math.max(4, Math.floor(this.labelPx() / 7));
    const rows = this.rows().map((row, i) => {
      const y = i * groupPx + GAP_PX / 2;
      const bars = row.values.flatMap((v, k) => {
        if (v === null) return [];
        const end = scale.toPx(v);
        return [{ x: Math.min(zero, end), y: y + k * BAR_PX, w: Math.max(1, Math.abs(end - zero)), fill: cssColor(series[k]?.color ?? '--mat-sys-primary') }];
      });
      const shortLabel = row.label.length > maxChars ? `${row.label.slice(0, maxChars - 1)}…` : row.label;
      return { label: row.label, shortLabel, y, h: series.length * BAR_PX, bars };
    });
    const plotHeight = Math.max(groupPx, rows.length * groupPx);
    return { rows, zero, plotWidth, plotHeight, height: plotHeight + AXIS_PX, ticks: scale.ticks(Math.max(2, Math.floor(plotWidth / 90))) };
  });

  protected signed(v: number): string {
    return v > 0 ? `+${formatWithUnit(v, '')}` : formatWithUnit(v, '').replace('-', '−');
  }
}
