// A run of the saved model on one of the mission's load cases: choose the case (hot and cold named
// in words and tone), run with a progress bar, then the per-node table with PASS/FAIL and margin,
// the temperature plot with its limits, the heaters' strips and table, the loops' flows and CSV.
import { DOCUMENT, DecimalPipe } from '@angular/common';
import { SourceWordsPipe } from '../shell/source-words-pipe';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatHint } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect, MatSelectTrigger } from '@angular/material/select';
import type { CaseSummary } from '../../../shared/api/cases';
import type { ThermalRunResponse } from '../../../shared/api/thermal-models';
import { apiErrorMessage } from '../api/api-error-message';
import { CaseKindLabel } from '../cases/case-kind-label';
import { buildResultCsv, downloadCsv } from '../plots/csv-download';
import { sharedZoom } from '../plots/plot-cursor';
import { StripPlot } from '../plots/strip-plot';
import { TimeSeriesPlot } from '../plots/time-series-plot';
import { ThermalModelApi } from './thermal-api';
import { loopColumns, loopSummaryColumns } from './thermal-loop-plots';
import { ThermalLoopResults } from './thermal-loop-results';
import { dutyPercent, heaterCycleNote, heaterRows, limitLines, shadowBands, temperatureColumns, temperatureSeries, worstMarginK } from './thermal-run-plots';

/** The solver's default when neither the run nor the model sets the orbits (shared/physics/thermal-model.ts). */
const DEFAULT_MAX_ORBITS = 200;
const MAX_ORBITS = 2000;

const GUTTERS = { left: 150, right: 56 } as const;

@Component({
  selector: 'ecl-thermal-run-panel',
  imports: [DecimalPipe, MatButton, MatFormField, MatLabel, MatHint, MatInput, MatIcon, MatProgressBar, MatSelect, MatSelectTrigger, MatOption, CaseKindLabel, TimeSeriesPlot, StripPlot, ThermalLoopResults, SourceWordsPipe],
  templateUrl: './thermal-run-panel.html',
  styleUrl: './thermal-run-panel.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ThermalRunPanel {
  readonly modelId = input.required<string>();
  readonly cases = input.required<readonly CaseSummary[]>();
  readonly canRun = input(false);
  /** True when the form has changes not saved: the run uses the saved model. */
  readonly unsaved = input(false);
  /** The model's own orbit allowance, if it sets one. */
  readonly modelMaxOrbits = input<number | undefined>(undefined);

  private readonly api = inject(ThermalModelApi);
  private readonly document = inject(DOCUMENT);

  protected readonly caseId = signal<string | null>(null);
  protected readonly running = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly run = signal<ThermalRunResponse | null>(null);
  protected readonly node = signal<string | null>(null);
  protected readonly gutters = GUTTERS;
  /** The temperature plot, the heater strips and the loops' plots beneath it zoom together. */
  protected readonly zoom = sharedZoom(this.run);
  protected readonly maxOrbitsLimit = MAX_ORBITS;
  /** Orbits allowed for the next run; null: the model's setting, else the solver's default. */
  protected readonly orbits = signal<number | null>(null);
  protected readonly defaultOrbits = computed(() => this.modelMaxOrbits() ?? DEFAULT_MAX_ORBITS);
  protected readonly orbitsValid = computed(() => {
    const n = this.orbits();
    return n === null || (Number.isInteger(n) && n >= 1 && n <= MAX_ORBITS);
  });
  protected readonly dutyPercent = dutyPercent;
  protected readonly cycleNote = computed(() => {
    const r = this.run();
    return r ? heaterCycleNote(r) : null;
  });
  /** What "run again" offers after a run that did not settle: four times its orbits, within the limit. */
  protected readonly moreOrbits = computed(() => {
    const r = this.run();
    return r && !r.result.converged && r.result.orbits < MAX_ORBITS ? Math.min(MAX_ORBITS, r.result.orbits * 4) : null;
  });
  protected readonly selectedCase = computed(() => this.cases().find((c) => c.id === this.caseId()) ?? null);

  protected readonly bands = computed(() => {
    const r = this.run();
    return r ? shadowBands(r) : [];
  });
  protected readonly xDomain = computed((): [number, number] | undefined => {
    const r = this.run();
    return r ? [0, r.case.periodS / 60] : undefined;
  });
  protected readonly shownNode = computed(() => this.node() ?? this.run()?.result.nodes[0]?.name ?? null);
  protected readonly temperatures = computed(() => {
    const r = this.run();
    const n = this.shownNode();
    return r && n ? temperatureSeries(r, n) : [];
  });
  protected readonly limits = computed(() => {
    const r = this.run();
    const n = this.shownNode();
    return r && n ? limitLines(r, n) : [];
  });
  protected readonly strips = computed(() => {
    const r = this.run();
    return r ? heaterRows(r) : [];
  });
  protected readonly nodeRows = computed(() => {
    const r = this.run();
    if (!r) return [];
    return r.result.nodes.map((n) => {
      const op = n.limits.find((l) => l.kind === 'operating');
      const survival = n.limits.find((l) => l.kind === 'survival');
      return {
        ...n, op, survival, coldMarginK: op?.coldMarginK ?? null, hotMarginK: op?.hotMarginK ?? null,
        pass: n.limits.every((l) => l.pass), marginK: worstMarginK(r, n.name),
      };
    });
  });

  constructor() {
    // Default to the first case and show its kept run, if any.
    effect(() => {
      const list = this.cases();
      if (untracked(this.caseId) === null && list.length > 0) this.chooseCase(list[0]!.id);
    });
  }

  protected chooseCase(caseId: string): void {
    this.caseId.set(caseId);
    this.failure.set(null);
    this.run.set(null);
    this.api.lastRun(this.modelId(), caseId).subscribe({
      next: (r) => {
        if (this.caseId() === caseId && !this.running()) this.run.set(r);
      },
      error: () => undefined, // not run on this case yet: nothing to show
    });
  }

  protected setOrbits(event: Event): void {
    const value = (event.target as HTMLInputElement).value.trim();
    this.orbits.set(value === '' ? null : Number(value));
  }

  protected runAgainWith(orbits: number): void {
    this.orbits.set(orbits);
    this.runCase();
  }

  protected runCase(): void {
    const caseId = this.caseId();
    if (!caseId || !this.orbitsValid()) return;
    this.running.set(true);
    this.failure.set(null);
    this.api.run(this.modelId(), caseId, this.orbits() ?? undefined).subscribe({
      next: (r) => {
        this.running.set(false);
        this.run.set(r);
        if (this.node() !== null && !r.result.nodes.some((n) => n.name === this.node())) this.node.set(null);
      },
      error: (e: unknown) => {
        this.running.set(false);
        this.failure.set(apiErrorMessage(e));
      },
    });
  }

  protected downloadTemperatures(): void {
    const r = this.run();
    if (!r) return;
    const stem = `${r.model.name}-${r.case.name}`.replace(/[^A-Za-z0-9._-]+/g, '-').toLowerCase();
    downloadCsv(`${stem}-temperatures.csv`, buildResultCsv([...temperatureColumns(r), ...loopColumns(r), ...loopSummaryColumns(r)]), this.document);
  }
}
