import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { catchError, combineLatest, forkJoin, of, switchMap } from 'rxjs';
import type { CaseResultsContent } from '../../../shared/api/case-content';
import type { CaseComparison } from '../../../shared/api/cases';
import { loaded } from '../api/loaded';
import { DifferenceBarPlot, type DifferenceRow, type DifferenceSeries } from '../plots/difference-bar-plot';
import { DesignCaution } from '../shell/design-caution';
import { CaseApi } from './case-api';
import { formatDifference, formatInputValue, formatQuantity, inputDifference, type Compared, type DifferenceText, derivedPath, labelOfPath } from './case-differences';
import { CaseKindLabel } from './case-kind-label';
import { CaseStatusChip } from './case-status-chip';
import { UtcTimePipe } from '../time/utc-time-pipe';

interface Row {
  readonly label: string;
  readonly a: string;
  readonly b: string;
  readonly difference: DifferenceText | null;
  readonly changed: boolean;
  /** Numbers line up on the right; text (sources, names) wraps on the left. */
  readonly numeric: boolean;
}

const QUANTITIES = [
  ['solarW', 'Solar absorbed, orbit average'],
  ['albedoW', 'Albedo absorbed, orbit average'],
  ['irW', 'IR absorbed, orbit average'],
  ['absorbedW', 'Absorbed, orbit average'],
  ['peakAbsorbedW', 'Absorbed, peak'],
] as const;

function loadRow(label: string, compared: Compared | null): Row {
  if (compared === null) return { label, a: '—', b: '—', difference: null, changed: true, numeric: true };
  const difference = formatDifference(compared, 'W');
  return { label, a: formatQuantity(compared.a, 'W'), b: formatQuantity(compared.b, 'W'), difference, changed: difference.changed, numeric: true };
}

/** Rows of the comparison: the inputs that differ and those that do not, then each surface's loads (a surface in one case only has no numbers). */
/**
 * The comparison answer has no margins in its loads, so a margin-only revision would look the same;
 * the two cases' own results supply the orbit averages with margin.
 */
export interface MarginedResults {
  readonly a: CaseResultsContent;
  readonly b: CaseResultsContent;
}

const diff = (a: number | undefined, b: number | undefined): Compared | null =>
  a === undefined || b === undefined ? null : { a, b, difference: b - a };

export function comparisonRows(c: CaseComparison, margined: MarginedResults | null = null): { changedInputs: Row[]; sameInputs: Row[]; surfaces: { name: string; rows: Row[] }[]; totals: Row[] } {
  const inputs = c.inputs.filter((i) => !derivedPath(i.path)).map((i): Row => {
    const difference = inputDifference(i.path, i.a, i.b);
    const numeric = typeof i.a === 'number' || typeof i.b === 'number';
    return { label: labelOfPath(i.path), a: formatInputValue(i.path, i.a), b: formatInputValue(i.path, i.b), difference, changed: i.changed, numeric };
  });
  const withMargin = (name: string): Row[] => {
    if (margined === null) return [];
    const of = (r: CaseResultsContent) => r.surfaces.find((x) => x.name === name)?.orbitAverage.absorbedWithMarginW;
    return [loadRow('Absorbed with margin, orbit average', diff(of(margined.a), of(margined.b)))];
  };
  const surfaces = c.surfaces.map((s) => ({
    name: s.name,
    rows: [...QUANTITIES.map(([key, label]) => loadRow(label, s[key])), ...withMargin(s.name)],
  }));
  const totals = [loadRow('Spacecraft, orbit-average absorbed', c.total.orbitAverageAbsorbedW)];
  if (margined !== null) {
    totals.push(loadRow('Spacecraft, orbit-average absorbed with margin', diff(margined.a.total.orbitAverageWithMarginW, margined.b.total.orbitAverageWithMarginW)));
  }
  return {
    changedInputs: inputs.filter((i) => i.changed),
    sameInputs: inputs.filter((i) => !i.changed),
    surfaces,
    totals,
  };
}

const LOAD_DIFFERENCE_SERIES: readonly DifferenceSeries[] = [
  { name: 'Absorbed, orbit average', color: '--ecl-absorbed' },
  { name: 'Absorbed, peak', color: '--ecl-accent' },
];

/** Per surface, the orbit-average and peak absorbed load differences (B − A, new − old); null for a surface in one case only. */
export function loadDifferenceRows(c: CaseComparison): DifferenceRow[] {
  return c.surfaces.map((s) => ({ label: s.name, values: [s.absorbedW?.difference ?? null, s.peakAbsorbedW?.difference ?? null] }));
}

/** Two cases side by side: inputs and per-surface orbit averages, B minus A, in the unit and in percent of A. */
@Component({
  selector: 'ecl-case-comparison-page',
  imports: [UtcTimePipe, NgTemplateOutlet, RouterLink, MatIcon, DesignCaution, CaseKindLabel, CaseStatusChip, DifferenceBarPlot],
  templateUrl: './case-comparison-page.html',
  styleUrl: './case-comparison-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseComparisonPage {
  readonly workspaceId = input.required<string>();
  readonly caseId = input.required<string>();
  readonly otherId = input.required<string>();

  private readonly api = inject(CaseApi);
  protected readonly state = toSignal(
    combineLatest([toObservable(this.caseId), toObservable(this.otherId)]).pipe(switchMap(([a, b]) => this.api.compare(a, b).pipe(loaded()))),
    { initialValue: { status: 'loading' as const } },
  );
  // The comparison answer carries summaries only: the details give the margins and whether the vehicle is crewed.
  private readonly details = toSignal(
    combineLatest([toObservable(this.caseId), toObservable(this.otherId)]).pipe(
      switchMap(([a, b]) => forkJoin([this.api.get(a), this.api.get(b)]).pipe(catchError(() => of(null)))),
    ),
    { initialValue: null },
  );
  protected readonly crewed = computed(() => this.details()?.[0].inputs.mission.crewed ?? false);
  /** The template context is untyped; the rows handed to it are always Row[]. */
  protected asRows(rows: unknown): readonly Row[] {
    return Array.isArray(rows) ? (rows as Row[]) : [];
  }

  protected readonly loadSeries = LOAD_DIFFERENCE_SERIES;
  protected readonly loadDifferences = computed(() => {
    const s = this.state();
    return s.status === 'ready' ? loadDifferenceRows(s.value) : [];
  });

  protected readonly rows = computed(() => {
    const s = this.state();
    const d = this.details();
    if (s.status !== 'ready') return null;
    // The answer puts the older case at A whatever the address's order; the details follow it.
    const byId = (id: string) => d?.find((x) => x.id === id)?.results;
    const a = byId(s.value.a.id);
    const b = byId(s.value.b.id);
    return comparisonRows(s.value, a && b ? { a, b } : null);
  });
}
