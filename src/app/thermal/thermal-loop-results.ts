// A run's coolant loops (issue 14): per loop the control verdict against the engineer's requirement
// (largest deviation, time outside the band, return after each eclipse entry and exit, share of the
// orbit the flow sits at a limit), the controlled node against its band, the coolant along the
// path, the heat each element gives the coolant, and the flow in kg/s and L/min.
import { DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, model } from '@angular/core';
import type { ThermalRunResponse } from '../../../shared/api/thermal-models';
import type { PlotBand, PlotGutters } from '../plots/plot-series';
import { TimeSeriesPlot } from '../plots/time-series-plot';
import { controlLines, controlRows, controlSeries, coolantSeries, flowSeries, recoveryBands } from './thermal-loop-plots';

@Component({
  selector: 'ecl-thermal-loop-results',
  imports: [DecimalPipe, PercentPipe, TimeSeriesPlot],
  template: `
    <h3>Coolant loops</h3>
    <ecl-time-series-plot [series]="flows()" [bands]="bands()" [xDomain]="xDomain()" [(zoomed)]="zoomed" [gutters]="gutters()" title="Pump flow" xLabel="Time in orbit" xUnit="min" yLabel="Flow" yUnit="kg/s" yRange="non-negative" [height]="200" data-testid="plot-loops" />
    @for (row of rows(); track row.loop.name) {
      @let l = row.loop;
      <section class="loop" [attr.aria-label]="l.name" data-testid="loop-results">
        <h4>
          {{ l.name }} <span class="ecl-muted small">{{ l.closed ? 'closed loop, coolant computed' : 'open loop, fixed inlet' }}</span>
          @if (l.control; as c) {
            <span class="verdict" [class.pass]="c.pass" [class.fail]="!c.pass" data-testid="control-verdict">{{ c.pass ? 'PASS' : 'FAIL' }} ± {{ c.bandK }} K</span>
          }
        </h4>
        <p class="small">
          Flow {{ l.averageFlowKgS | number: '1.4-5' }} kg/s on average@if (row.averageLMin !== null) { ({{ row.averageLMin | number: '1.2-3' }} L/min)},
          {{ l.averageToNominal | percent: '1.0-0' }} of the nominal; at its minimum or maximum {{ l.saturatedFraction | percent: '1.0-1' }} of the orbit;
          {{ l.heatRemovedW | number: '1.1-1' }} W moved.
        </p>
        @if (l.control; as c) {
          <div class="ecl-table-wrap">
            <table class="figures" data-testid="control-figures">
              <thead>
                <tr><th scope="col">Controls</th><th scope="col" class="num">Set point (°C)</th><th scope="col" class="num">Requirement (± K)</th><th scope="col" class="num">Largest deviation (K)</th><th scope="col" class="num">Outside the band (min per orbit)</th></tr>
              </thead>
              <tbody>
                <tr><th scope="row">{{ c.node }}</th><td class="num">{{ c.setPointC }}</td><td class="num">{{ c.bandK }}</td><td class="num" data-testid="control-deviation">{{ c.maxDeviationK | number: '1.3-3' }}</td><td class="num">{{ c.outsideBandS / 60 | number: '1.1-1' }}</td></tr>
              </tbody>
            </table>
          </div>
          @if (row.recoveries.length > 0) {
            <ul class="small" data-testid="control-recoveries">
              @for (e of row.recoveries; track $index) {
                <li>After {{ e.event }} at {{ e.atS / 60 | number: '1.1-1' }} min:
                  @if (e.returnS === null) { not back within the band before the next event }
                  @else if (e.returnS === 0) { stays within the band }
                  @else { back within the band after {{ e.returnS / 60 | number: '1.1-1' }} min }
                </li>
              }
            </ul>
          }
          <ecl-time-series-plot [series]="controlled(l)" [limits]="lines(l)" [bands]="withRecoveries(l)" [xDomain]="xDomain()" [(zoomed)]="zoomed" [gutters]="gutters()" [title]="c.node + ' against its set point'" xLabel="Time in orbit" xUnit="min" yLabel="Temperature" yUnit="°C" [height]="220" />
        }
        @if (l.coolantC.length > 0) {
          <ecl-time-series-plot [series]="coolant(l)" [bands]="bands()" [xDomain]="xDomain()" [(zoomed)]="zoomed" [gutters]="gutters()" [title]="'Coolant along the path of ' + l.name" xLabel="Time in orbit" xUnit="min" yLabel="Coolant" yUnit="°C" [height]="220" />
          <div class="ecl-table-wrap">
            <table class="figures" data-testid="loop-heat">
              <thead><tr><th scope="col">Path element</th><th scope="col" class="num">Heat to the coolant, orbit average (W)</th></tr></thead>
              <tbody>
                @for (h of l.heatW; track h.node) {
                  <tr><th scope="row">{{ h.node }}</th><td class="num" [class.cold]="h.averageW < 0">{{ h.averageW | number: '1.2-2' }}</td></tr>
                }
              </tbody>
            </table>
          </div>
        }
      </section>
    }
    @if (olderRun()) {
      <p class="ecl-muted small">Run again to see the return to the band after eclipse entry and exit.</p>
    }
  `,
  styleUrl: './thermal-run-panel.css',
  styles: `
    .loop { margin-top: 16px; }
    .loop h4 { display: flex; gap: 8px; align-items: center; flex-wrap: wrap; margin: 8px 0 4px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ThermalLoopResults {
  readonly run = input.required<ThermalRunResponse>();
  readonly bands = input<readonly PlotBand[]>([]);
  readonly xDomain = input<[number, number] | undefined>(undefined);
  readonly gutters = input<PlotGutters>({});
  /** The run's shared zoom (thermal-run-panel): the loops' plots zoom with the temperature plot above them. */
  readonly zoomed = model<readonly [number, number] | null>(null);

  protected readonly rows = computed(() => controlRows(this.run()));
  /** A run kept from before loops were judged: no recoveries. */
  protected readonly olderRun = computed(() => this.run().recoveries === undefined && this.run().result.loops.some((l) => l.control));
  protected readonly flows = computed(() => flowSeries(this.run()));
  protected controlled(l: ThermalRunResponse['result']['loops'][number]) {
    return controlSeries(this.run(), l);
  }
  protected lines(l: ThermalRunResponse['result']['loops'][number]) {
    return controlLines(l);
  }
  protected coolant(l: ThermalRunResponse['result']['loops'][number]) {
    return coolantSeries(this.run(), l);
  }
  protected withRecoveries(l: ThermalRunResponse['result']['loops'][number]): PlotBand[] {
    return [...this.bands(), ...recoveryBands(this.run(), l)];
  }
}
