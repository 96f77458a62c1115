// The distance study on the model page (issue 14 item 3): the model on one load case with the Sun
// at other distances (a list in AU and, optionally, the mission body's perihelion and aphelion).
// Each distance arrives as one NDJSON line (progress bar); Stop, or leaving the page, ends the
// request and the server stops. Pump flow per loop and radiator area are plotted against distance,
// tabled, and exported as CSV with the design caution.
import { DOCUMENT, DecimalPipe } from '@angular/common';
import { SourceWordsPipe } from '../shell/source-words-pipe';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, input, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect, MatSelectTrigger } from '@angular/material/select';
import type { Subscription } from 'rxjs';
import type { CaseSummary } from '../../../shared/api/cases';
import type { DistanceStudyLine } from '../../../shared/api/thermal-models';
import { apiPath } from '../api/api-path';
import { CaseKindLabel } from '../cases/case-kind-label';
import { streamNdjson } from '../orbits/sweep-stream';
import { buildCsv, downloadCsv } from '../plots/csv-download';
import { seriesLook } from '../plots/plot-colors';
import type { PlotSeries } from '../plots/plot-series';
import { sharedZoom } from '../plots/plot-cursor';
import { TimeSeriesPlot } from '../plots/time-series-plot';
import { DESIGN_CAUTION_TEXT } from '../shell/design-caution';

type StartLine = Extract<DistanceStudyLine, { type: 'start' }>;
type PointLine = Extract<DistanceStudyLine, { type: 'point' }>;

const LINE_TYPES = new Set(['start', 'point', 'end', 'error']);
function parseStudyLine(text: string): DistanceStudyLine {
  const value: unknown = JSON.parse(text);
  if (typeof value !== 'object' || value === null || !('type' in value) || typeof value.type !== 'string' || !LINE_TYPES.has(value.type)) {
    throw new Error('The study sent a line the page does not know.');
  }
  return value as DistanceStudyLine;
}

/** "0.72, 1, 1.52 AU" as numbers; null when a part is not a number. */
export function parseDistances(text: string): number[] | null {
  const parts = text.replace(/au/gi, '').split(/[\s,;]+/).filter((p) => p !== '');
  const values = parts.map(Number);
  return values.every((v) => Number.isFinite(v)) ? values : null;
}


@Component({
  selector: 'ecl-thermal-distance-panel',
  imports: [DecimalPipe, MatButton, MatCheckbox, MatFormField, MatHint, MatLabel, MatIcon, MatInput, MatProgressBar, MatSelect, MatSelectTrigger, MatOption, CaseKindLabel, TimeSeriesPlot, SourceWordsPipe],
  template: `
    <p class="ecl-muted">The same model with the Sun nearer or farther: the case's solar and albedo loads scale with the inverse square of the distance, planetary IR stays. At each distance: the pump flow the loops' controllers settle to, and the radiator area that holds the chosen node at its maximum less the margin.</p>
    <div class="pick-row">
      <mat-form-field appearance="outline">
        <mat-label>Load case</mat-label>
        <mat-select [value]="caseId()" (valueChange)="pickedCaseId.set($event)" data-testid="study-case">
          <mat-select-trigger>@if (caseOf(caseId()); as c) { <ecl-case-kind [kind]="c.kind" /> {{ c.name }} · rev {{ c.revision }} }</mat-select-trigger>
          @for (c of cases(); track c.id) { <mat-option [value]="c.id"><ecl-case-kind [kind]="c.kind" /> {{ c.name }} · rev {{ c.revision }}</mat-option> }
        </mat-select>
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>Radiator on node</mat-label>
        <mat-select [value]="radiatorNode()" (valueChange)="radiator.set($event)" data-testid="study-node">
          @for (n of nodes(); track n) { <mat-option [value]="n">{{ n }}</mat-option> }
        </mat-select>
      </mat-form-field>
      <mat-form-field appearance="outline" class="distances">
        <mat-label>Distances from the Sun (AU)</mat-label>
        <input matInput [value]="distancesText()" (input)="distancesText.set($any($event.target).value)" data-testid="study-distances" />
        <mat-hint>e.g. 0.72, 1, 1.52 (Venus, Earth, Mars)</mat-hint>
      </mat-form-field>
      <mat-checkbox [checked]="missionRange()" (change)="missionRange.set($event.checked)" data-testid="study-mission-range">the mission's perihelion and aphelion</mat-checkbox>
      @if (canRun()) {
        @if (running()) {
          <button mat-stroked-button type="button" (click)="stop()" data-testid="study-stop"><mat-icon>stop</mat-icon>Stop</button>
        } @else {
          <button mat-flat-button type="button" (click)="run()" [disabled]="!caseId() || !radiatorNode()" data-testid="study-run"><mat-icon>public</mat-icon>Run study</button>
        }
      }
    </div>
    @if (running()) {
      <mat-progress-bar mode="determinate" [value]="progress()" aria-label="Distance study progress" data-testid="study-progress" />
      <p class="ecl-muted small" aria-live="polite">{{ points().length }} of {{ start()?.distances?.length ?? '…' }} distances done</p>
    }
    @if (failure(); as f) {
      <p class="ecl-error" role="alert" data-testid="study-error">{{ f }}</p>
    }
    @if (points().length > 0) {
      <div class="plots" data-testid="study-results">
        <ecl-time-series-plot [series]="flowSeries()" title="Pump flow needed" xLabel="Distance from the Sun" xUnit="AU" yLabel="Flow" yUnit="L/min" yRange="non-negative" [height]="240" [gutters]="gutters" [(zoomed)]="zoom" />
        <ecl-time-series-plot [series]="areaSeries()" title="Radiator area needed" xLabel="Distance from the Sun" xUnit="AU" yLabel="Area" yUnit="m²" yRange="non-negative" [height]="240" [gutters]="gutters" [(zoomed)]="zoom" />
      </div>
      <div class="table-wrap">
        <table class="ecl-table" data-testid="study-table">
          <caption>Per distance: solar flux, pump flow per loop (average / peak), radiator area on {{ start()?.node }}</caption>
          <thead>
            <tr>
              <th scope="col">Sun at</th><th scope="col">Distance (AU)</th><th scope="col">Solar flux (W/m²)</th>
              @for (l of loopNames(); track l) { <th scope="col">{{ l }} flow, avg / peak (L/min)</th><th scope="col">{{ l }} flow, avg / peak (kg/s)</th> }
              <th scope="col">Radiator area (m²)</th>
            </tr>
          </thead>
          <tbody>
            @for (p of points(); track p.index) {
              <tr>
                <th scope="row">{{ p.label }}@if (!p.settled) { <span class="ecl-error"> (not settled)</span> }</th>
                <td>{{ p.distanceAu | number: '1.3-3' }}</td>
                <td>{{ p.solarFluxWm2 | number: '1.0-0' }}</td>
                @for (l of loopNames(); track l) {
                  @if (loopOf(p, l); as f) {
                    <td>{{ f.averageLMin === null ? '–' : (f.averageLMin | number: '1.2-2') }} / {{ f.peakLMin === null ? '–' : (f.peakLMin | number: '1.2-2') }}</td>
                    <td>{{ f.averageKgS | number: '1.4-4' }} / {{ f.peakKgS | number: '1.4-4' }}</td>
                  } @else { <td>–</td><td>–</td> }
                }
                <td>
                  @if (p.radiator; as r) { {{ r.areaM2 | number: '1.3-3' }}@if (r.note) { <span class="ecl-muted"> (none needed)</span> } }
                  @else { <span class="ecl-error">{{ p.radiatorRefused ?? p.solveRefused }}</span> }
                </td>
              </tr>
            }
          </tbody>
        </table>
      </div>
      <button mat-button type="button" (click)="downloadCsv()" data-testid="study-csv"><mat-icon>download</mat-icon>Download CSV</button>
      @if (start(); as s) {
        <details class="ecl-muted small"><summary>Assumptions</summary><ul>@for (a of s.assumptions; track $index) { <li>{{ a | sourceWords }}</li> }</ul></details>
      }
    }
  `,
  styles: `
    .pick-row { display: flex; flex-wrap: wrap; gap: 12px; align-items: center; }
    .distances { min-width: 260px; }
    .plots { display: grid; grid-template-columns: repeat(auto-fit, minmax(320px, 1fr)); gap: 16px; margin-top: 8px; }
    .table-wrap { overflow-x: auto; margin-top: 8px; }
    td, th { font-variant-numeric: tabular-nums; }
    .small { font-size: 0.85em; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ThermalDistancePanel {
  readonly modelId = input.required<string>();
  readonly modelName = input('');
  readonly cases = input.required<readonly CaseSummary[]>();
  readonly nodes = input.required<readonly string[]>();
  readonly canRun = input(false);

  private readonly document = inject(DOCUMENT);
  protected readonly pickedCaseId = signal<string | null>(null);
  protected readonly radiator = signal<string | null>(null);
  protected readonly distancesText = signal('0.72, 1, 1.52');
  protected readonly missionRange = signal(true);
  protected readonly running = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly start = signal<StartLine | null>(null);
  protected readonly points = signal<readonly PointLine[]>([]);
  /** The flow and area plots share the distance axis: they zoom together, afresh with each study. */
  protected readonly zoom = sharedZoom(this.start);
  protected readonly gutters = { left: 64 };
  private subscription: Subscription | null = null;

  protected readonly caseId = computed(() => this.pickedCaseId() ?? this.cases().find((c) => c.kind === 'hot')?.id ?? this.cases()[0]?.id ?? null);
  protected readonly radiatorNode = computed(() => this.radiator() ?? this.nodes().find((n) => /radiator/i.test(n)) ?? this.nodes()[0] ?? null);
  protected readonly progress = computed(() => {
    const total = this.start()?.distances.length ?? 0;
    return total > 0 ? (100 * this.points().length) / total : 0;
  });
  protected readonly loopNames = computed(() => [...new Set(this.points().flatMap((p) => p.loops.map((l) => l.name)))]);
  protected readonly flowSeries = computed<PlotSeries[]>(() =>
    this.loopNames().flatMap((name, i) => {
      const { colorVar } = seriesLook(i);
      const at = (pick: (f: PointLine['loops'][number]) => number | null) =>
        this.points().map((p) => ({ x: p.distanceAu, y: pick(p.loops.find((l) => l.name === name) ?? { name, averageKgS: NaN, peakKgS: NaN, averageLMin: null, peakLMin: null }) ?? NaN }));
      return [
        { id: `avg-${name}`, label: `${name}, average`, unit: 'L/min', colorVar, points: at((f) => f.averageLMin) },
        { id: `peak-${name}`, label: `${name}, peak`, unit: 'L/min', colorVar, dash: true, points: at((f) => f.peakLMin) },
      ];
    }),
  );
  protected readonly areaSeries = computed<PlotSeries[]>(() => [
    { id: 'area', label: `Radiator on ${this.start()?.node ?? ''}`, unit: 'm²', colorVar: '--ecl-absorbed', points: this.points().map((p) => ({ x: p.distanceAu, y: p.radiator?.areaM2 ?? NaN })) },
  ]);

  constructor() {
    inject(DestroyRef).onDestroy(() => this.stop());
  }

  protected caseOf(id: string | null) {
    return this.cases().find((c) => c.id === id) ?? null;
  }

  protected loopOf(p: PointLine, name: string) {
    return p.loops.find((l) => l.name === name) ?? null;
  }

  protected run(): void {
    const [caseId, node] = [this.caseId(), this.radiatorNode()];
    const distancesAu = parseDistances(this.distancesText());
    if (!caseId || !node) return;
    if (distancesAu === null) {
      this.failure.set('Write the distances as numbers in AU, separated by commas, e.g. 0.72, 1, 1.52.');
      return;
    }
    this.stop();
    this.failure.set(null);
    this.start.set(null);
    this.points.set([]);
    this.running.set(true);
    const body = { caseId, node, ...(distancesAu.length > 0 ? { distancesAu } : {}), ...(this.missionRange() ? { missionRange: true } : {}) };
    this.subscription = streamNdjson(apiPath('thermal-models', this.modelId(), 'distance-study'), { method: 'POST', body: JSON.stringify(body), headers: { 'Content-Type': 'application/json' } }, parseStudyLine).subscribe({
      next: (line) => {
        if (line.type === 'start') this.start.set(line);
        else if (line.type === 'point') this.points.update((ps) => [...ps, line]);
      },
      error: (e: unknown) => {
        this.failure.set(e instanceof Error ? e.message : 'The study stopped.');
        this.running.set(false);
      },
      complete: () => this.running.set(false),
    });
  }

  protected stop(): void {
    this.subscription?.unsubscribe();
    this.subscription = null;
    this.running.set(false);
  }

  protected downloadCsv(): void {
    const points = this.points();
    const loops = this.loopNames().flatMap((name) => {
      const of = (p: PointLine) => p.loops.find((l) => l.name === name);
      return [
        { header: `${name} flow, average`, unit: 'L/min', values: points.map((p) => of(p)?.averageLMin ?? '') },
        { header: `${name} flow, peak`, unit: 'L/min', values: points.map((p) => of(p)?.peakLMin ?? '') },
        { header: `${name} flow, average`, unit: 'kg/s', values: points.map((p) => of(p)?.averageKgS ?? '') },
        { header: `${name} flow, peak`, unit: 'kg/s', values: points.map((p) => of(p)?.peakKgS ?? '') },
      ];
    });
    const csv = buildCsv([
      { header: 'Sun at', values: points.map((p) => p.label) },
      { header: 'Distance', unit: 'AU', values: points.map((p) => p.distanceAu) },
      { header: 'Solar flux', unit: 'W/m²', values: points.map((p) => p.solarFluxWm2) },
      { header: 'Settled', values: points.map((p) => (p.settled ? 'yes' : 'no')) },
      ...loops,
      { header: `Radiator area on ${this.start()?.node ?? ''}`, unit: 'm²', values: points.map((p) => p.radiator?.areaM2 ?? '') },
      { header: 'Radiator note', values: points.map((p) => p.radiator?.note ?? p.radiatorRefused ?? p.solveRefused ?? '') },
      { header: 'Note', values: [DESIGN_CAUTION_TEXT] },
    ]);
    const stem = (this.modelName() || 'thermal-model').replace(/[^A-Za-z0-9]+/g, '-').replace(/^-|-$/g, '');
    downloadCsv(`${stem}-distance-study.csv`, csv, this.document);
  }
}
