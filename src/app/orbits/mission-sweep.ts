import { DOCUMENT, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatProgressBar } from '@angular/material/progress-bar';
import { Subscription, bufferTime, filter } from 'rxjs';
import type { MissionDetail, Orbit, SweepDay, SweepLine } from '../../../shared/api/missions';
import { MissionApi, type PropertySet } from '../missions/mission-api';
import { buildResultCsv, downloadCsv } from '../plots/csv-download';
import type { PlotSeries } from '../plots/plot-series';
import { sharedZoom } from '../plots/plot-cursor';
import { TimeSeriesPlot } from '../plots/time-series-plot';
import { castByText, sweepCsvColumns, sweepExtremes, sweepPhaseRows, sweepSeries } from './sweep-plot-data';
import { streamSweep } from './sweep-stream';
import { describeNormal } from '../surfaces/surface-normals';

type SweepState = 'idle' | 'running' | 'done' | 'cancelled' | 'failed';

/** The orbit day by day over the mission: beta, eclipse and each surface's orbit-average absorbed heat. */
@Component({
  selector: 'ecl-mission-sweep',
  imports: [DecimalPipe, MatButton, MatButtonToggleGroup, MatButtonToggle, MatProgressBar, TimeSeriesPlot],
  templateUrl: './mission-sweep.html',
  styleUrls: ['./result-panel.css', './mission-sweep.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MissionSweep {
  private readonly api = inject(MissionApi);
  private readonly document = inject(DOCUMENT);

  readonly mission = input.required<MissionDetail>();
  /** Each surface's pointing in words, beside the plot of its loads. */
  protected readonly pointingWords = describeNormal;
  readonly orbit = input.required<Orbit>();

  protected readonly properties = signal<PropertySet>('bol');
  protected readonly state = signal<SweepState>('idle');
  protected readonly failure = signal<string | null>(null);
  protected readonly totalDays = signal(0);
  protected readonly days = signal<readonly SweepDay[]>([]);
  /** The models the sweep used, in words, from the stream's first line. */
  protected readonly assumptions = signal<readonly string[]>([]);
  /** The mission's phases with their attitude modes, from the stream's first line. */
  private readonly phases = signal<readonly { name: string; startDate: string; endDate: string; modeName: string }[]>([]);
  protected readonly phaseRows = computed(() => sweepPhaseRows(this.phases(), this.days()));
  private running: Subscription | null = null;
  private readonly orbitId = computed(() => this.orbit().id);

  protected readonly percent = computed(() => (this.totalDays() > 0 ? (100 * this.days().length) / this.totalDays() : 0));
  protected readonly series = computed(() => sweepSeries(this.days()));
  protected readonly absorbed = computed<readonly PlotSeries[]>(() => this.series().absorbed);
  /** The beta, eclipse and absorbed plots share the mission's dates: they zoom together, afresh with each sweep. */
  protected readonly zoom = sharedZoom(() => this.days()[0]?.date ?? null);
  /** Each quantity's lowest and highest day of those swept. */
  protected readonly extremes = computed(() => sweepExtremes(this.days()));
  /** About a moon: the day whose longest shadow (its planet's included) is the longest of those shown. */
  protected readonly longestShadow = computed<SweepDay | null>(() => {
    const withParent = this.days().filter((d) => d.longestShadowStart !== null);
    return withParent.length === 0 ? null : withParent.reduce((a, b) => (b.longestShadowS > a.longestShadowS ? b : a));
  });
  protected readonly castBy = castByText;
  protected readonly range = computed(() => {
    const d = this.days();
    return d.length === 0 ? null : { from: d[0].date, to: d[d.length - 1].date };
  });

  constructor() {
    inject(DestroyRef).onDestroy(() => this.running?.unsubscribe());
    // Another orbit: the days shown would belong to the old one. (A reload of the same orbit keeps them.)
    effect(() => {
      this.orbitId();
      untracked(() => {
        this.cancel('idle');
        this.days.set([]);
        this.state.set('idle');
      });
    });
  }

  protected run(): void {
    this.cancel('idle');
    this.days.set([]);
    this.assumptions.set([]);
    this.phases.set([]);
    this.totalDays.set(0);
    this.failure.set(null);
    this.state.set('running');
    const url = this.api.sweepUrl(this.mission().id, this.orbit().id, this.properties());
    this.running = streamSweep(url)
      .pipe(
        // One screen update per ~150 ms rather than per day: the plots redraw from the whole list.
        bufferTime(150),
        filter((lines) => lines.length > 0),
      )
      .subscribe({
        next: (lines) => this.take(lines),
        error: (failure: unknown) => {
          this.running = null;
          this.state.set('failed');
          this.failure.set(failure instanceof Error ? failure.message : String(failure));
        },
        complete: () => {
          this.running = null;
          if (this.state() === 'running') this.state.set('done');
        },
      });
  }

  private take(lines: readonly SweepLine[]): void {
    const fresh: SweepDay[] = [];
    for (const line of lines) {
      if (line.type === 'start') {
        this.totalDays.set(line.days);
        this.assumptions.set(line.assumptions ?? []);
        this.phases.set(line.phases ?? []);
      }
      else if (line.type === 'day') fresh.push(line);
      else if (line.type === 'end') this.state.set('done');
    }
    if (fresh.length > 0) this.days.update((d) => [...d, ...fresh]);
  }

  /** Stops the stream (the request is aborted, so the server stops as well). */
  protected cancel(next: SweepState = 'cancelled'): void {
    if (this.running) {
      this.running.unsubscribe();
      this.running = null;
      this.state.set(next);
    }
  }

  protected downloadSweep(): void {
    const name = `${this.mission().name}-${this.orbit().name}-sweep-${this.properties()}`.replace(/[^A-Za-z0-9._-]+/g, '-');
    downloadCsv(`${name}.csv`, buildResultCsv(sweepCsvColumns(this.days())), this.document);
  }
}
