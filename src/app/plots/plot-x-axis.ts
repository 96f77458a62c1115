// The x axis every Eclipta plot draws, so time reads the same on the heat-load plot and the heater
// strips beneath it. Hosted on an SVG <g>, hence the svg: prefixes in its template.
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { AxisTick } from './plot-scales';

@Component({
  selector: 'g[eclPlotXAxis]',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg:line class="ecl-axis-domain" x1="0" [attr.x2]="width()" y1="0" y2="0" />
    @for (tick of ticks(); track tick.value) {
      <svg:g class="ecl-axis-tick" [attr.transform]="'translate(' + tick.px + ',0)'">
        <svg:line y1="0" y2="5" />
        <svg:text y="17" text-anchor="middle">{{ tick.label }}</svg:text>
      </svg:g>
    }
    <svg:text class="ecl-axis-title" [attr.x]="width() / 2" y="34" text-anchor="middle">{{ title() }}</svg:text>
  `,
  styleUrl: './plot-axis.css',
})
export class PlotXAxis {
  readonly ticks = input.required<readonly AxisTick[]>();
  /** The plot area's width in px. */
  readonly width = input.required<number>();
  readonly title = input('');
}
