import { DOCUMENT, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatOption, MatSelect } from '@angular/material/select';
import { distinctUntilChanged, of, switchMap } from 'rxjs';
import type { BodySummaryResponse, EnvironmentResponse } from '../../../shared/api/environment';
import type { MissionDetail, Orbit } from '../../../shared/api/missions';
import { loaded } from '../api/loaded';
import { MissionApi, type PropertySet } from '../missions/mission-api';
import { buildResultCsv, downloadCsv } from '../plots/csv-download';
import { sharedZoom } from '../plots/plot-cursor';
import { TimeSeriesPlot } from '../plots/time-series-plot';
import { absorbedSeries, bodyName, eclipseBands, fluxSeries, profileCsvColumns } from './environment-plot-data';
import { DurationPipe } from '../time/duration-pipe';
import { SourceWordsPipe } from '../shell/source-words-pipe';
import { OrbitView } from './orbit-view';
import { nearestIndex } from '../plots/plot-scales';
import { describeNormal } from '../surfaces/surface-normals';
import { defaultFacesRequest, faceAverages } from './default-faces';
import { FigureTable, type FigureColumn, type FigureRow } from './figure-table';

/** The face plotted first: the Sun-pointing plate, the largest solar load. */
const DEFAULT_FACE_SHOWN = 6;

const FACE_COLUMNS: readonly FigureColumn[] = [
  { label: 'Solar', digits: '1.1-1' },
  { label: 'Albedo', digits: '1.1-1' },
  { label: 'Planetary IR', digits: '1.1-1' },
  { label: 'Total', digits: '1.1-1' },
];
const AVERAGE_COLUMNS: readonly FigureColumn[] = [
  { label: 'Solar (W/m²)', digits: '1.1-1' },
  { label: 'Albedo (W/m²)', digits: '1.1-1' },
  { label: 'Planetary IR (W/m²)', digits: '1.1-1' },
  { label: 'Absorbed, average (W)', digits: '1.2-2' },
  { label: 'Absorbed, peak (W)', digits: '1.2-2' },
];

/** One saved orbit's environment with the mission's surfaces: figures, plots around the orbit, averages. */
@Component({
  selector: 'ecl-environment-results',
  imports: [DurationPipe, SourceWordsPipe, DecimalPipe, MatButton, MatButtonToggleGroup, MatButtonToggle, MatFormField, MatLabel, MatSelect, MatOption, TimeSeriesPlot, OrbitView, FigureTable],
  templateUrl: './environment-results.html',
  styleUrls: ['./result-panel.css', './environment-results.css'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EnvironmentResults {
  private readonly api = inject(MissionApi);
  private readonly document = inject(DOCUMENT);

  readonly mission = input.required<MissionDetail>();
  readonly orbit = input.required<Orbit>();
  readonly body = input.required<BodySummaryResponse>();

  protected readonly properties = signal<PropertySet>('bol');
  protected readonly surfaceIndex = signal(0);
  /** The profile sample the orbit view's spacecraft stands at and the plots' cursor reads. */
  protected readonly sampleIndex = signal<number | null>(null);

  // Anything that changes the answer: the orbit, the surfaces (and their materials) and BOL/EOL.
  private readonly request = computed(() => ({
    missionId: this.mission().id,
    orbitId: this.orbit().id,
    properties: this.properties(),
    key: [this.orbit().updatedAt, ...this.mission().surfaces.map((s) => `${s.id}@${s.updatedAt}`)].join('|'),
  }));
  protected readonly result = toSignal(
    toObservable(this.request).pipe(
      distinctUntilChanged((a, b) => a.orbitId === b.orbitId && a.properties === b.properties && a.key === b.key && a.missionId === b.missionId),
      switchMap((r) => this.api.orbitEnvironment(r.missionId, r.orbitId, r.properties).pipe(loaded())),
    ),
  );
  protected readonly answer = computed<EnvironmentResponse | null>(() => {
    const state = this.result();
    return state?.status === 'ready' ? state.value : null;
  });
  protected readonly failure = computed(() => {
    const state = this.result();
    return state?.status === 'failed' ? state.message : null;
  });

  protected readonly surfaceNames = computed(() => this.answer()?.orbitAverage.surfaces.map((s) => s.name) ?? []);
  /** The flux and absorbed plots share the orbit's time axis: they zoom together. */
  protected readonly zoom = sharedZoom(this.answer);

  // Without surfaces: the incident fluxes on the six body-frame faces and a Sun-pointing plate,
  // asked once the saved orbit's answer says how it was sampled (default-faces.ts).
  private readonly facesRequest = computed(() => {
    const a = this.answer();
    return a && a.orbitAverage.surfaces.length === 0 ? defaultFacesRequest(this.mission(), this.orbit(), a.sampling) : null;
  });
  protected readonly faces = toSignal(
    toObservable(this.facesRequest).pipe(
      distinctUntilChanged((a, b) => JSON.stringify(a) === JSON.stringify(b)),
      switchMap((r) => (r ? this.api.compute(r).pipe(loaded()) : of(null))),
    ),
  );
  protected readonly facesAnswer = computed<EnvironmentResponse | null>(() => {
    const state = this.faces();
    return state?.status === 'ready' ? state.value : null;
  });
  protected readonly faceIndex = signal(DEFAULT_FACE_SHOWN);
  protected readonly faceNames = computed(() => this.facesAnswer()?.orbitAverage.surfaces.map((s) => s.name) ?? []);
  private readonly shownFace = computed(() => Math.min(this.faceIndex(), Math.max(0, this.faceNames().length - 1)));

  /** No surfaces: the flux plot shows the default faces instead. */
  protected readonly bare = computed(() => this.answer() !== null && this.surfaceNames().length === 0);
  protected readonly plotNames = computed(() => (this.bare() ? this.faceNames() : this.surfaceNames()));
  protected readonly plotIndex = computed(() => (this.bare() ? this.shownFace() : this.shownIndex()));
  protected readonly plotName = computed(() => this.plotNames().at(this.plotIndex()) ?? '');
  protected readonly flux = computed(() => {
    const a = this.bare() ? this.facesAnswer() : this.answer();
    return a && a.profile.length > 0 && this.plotNames().length > 0 ? fluxSeries(a.profile, this.plotIndex()) : [];
  });
  protected readonly faceColumns = FACE_COLUMNS;
  protected readonly faceTable = computed<FigureRow[]>(() => {
    const a = this.facesAnswer();
    return (a ? faceAverages(a) : []).map((r) => ({ name: r.name, values: [r.solarWm2, r.albedoWm2, r.irWm2, r.totalWm2] }));
  });
  private readonly shownIndex = computed(() => Math.min(this.surfaceIndex(), Math.max(0, this.surfaceNames().length - 1)));
  /** Each saved surface's pointing in words, by name. */
  private readonly pointingByName = computed(() => new Map(this.mission().surfaces.map((s) => [s.name, describeNormal(s.normal)])));
  private pointingOf(name: string): string {
    return this.pointingByName().get(name) ?? '';
  }
  protected readonly shownName = computed(() => this.surfaceNames()[this.shownIndex()] ?? '');
  protected readonly bands = computed(() => eclipseBands(this.answer()?.profile ?? [], this.answer()?.parentBodyId ?? null));
  protected readonly parentName = computed(() => bodyName(this.answer()?.parentBodyId ?? ''));
  protected readonly absorbed = computed(() => {
    const a = this.answer();
    return a && a.profile.length > 0 && this.surfaceNames().length > 0 ? absorbedSeries(a.profile, this.shownIndex()) : [];
  });
  protected readonly averageColumns = AVERAGE_COLUMNS;
  /** Per surface, under its name how it is pointed. */
  protected readonly averageTable = computed<FigureRow[]>(() => {
    const a = this.answer();
    if (!a) return [];
    return a.orbitAverage.surfaces.map((avg, i) => ({
      name: avg.name,
      note: this.pointingOf(avg.name),
      values: [avg.solarWm2, avg.albedoWm2, avg.irWm2, avg.absorbedW, a.peak.surfaces[i]?.absorbedW ?? NaN],
    }));
  });

  protected readonly fileStem = computed(() => `${this.mission().name}-${this.orbit().name}-${this.properties()}`.replace(/[^A-Za-z0-9._-]+/g, '-'));

  /** The plots' cursor follows the orbit view's scrubber (minutes from periapsis, the plots' x), once it has been moved. */
  protected readonly cursorMinutes = computed(() => {
    const i = this.sampleIndex();
    const p = i === null ? undefined : this.answer()?.profile[i];
    return p ? p.tS / 60 : null;
  });

  /** The orbit view follows a plot's cursor; when the cursor is hidden the spacecraft stays put. */
  protected followPlot(minutes: number | null): void {
    const profile = this.answer()?.profile;
    if (minutes === null || !profile) return;
    const i = nearestIndex(profile.map((p) => ({ x: p.tS / 60, y: 0 })), minutes);
    if (i >= 0) this.sampleIndex.set(i);
  }

  protected choosePlotted(index: number): void {
    (this.bare() ? this.faceIndex : this.surfaceIndex).set(index);
  }

  protected setProperties(value: PropertySet): void {
    this.properties.set(value);
  }

  protected downloadProfile(): void {
    const a = this.answer();
    if (!a) return;
    downloadCsv(`${this.fileStem()}-profile.csv`, buildResultCsv(profileCsvColumns(a.profile, a.sampleWeightsS)), this.document);
  }
}
