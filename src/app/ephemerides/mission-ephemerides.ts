import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';
import { BehaviorSubject, combineLatest, filter, of, switchMap } from 'rxjs';
import type { EphemerisSummary } from '../../../shared/api/ephemerides';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { sharedZoom } from '../plots/plot-cursor';
import { TimeSeriesPlot } from '../plots/time-series-plot';
import { ConfirmDialog } from '../shell/confirm-dialog';
import { DesignCaution } from '../shell/design-caution';
import { RowActions } from '../shell/row-actions';
import { EphemerisApi } from './ephemeris-api';
import { EphemerisCaseDialog } from './ephemeris-case-dialog';
import { isoFromUtcField, utcFieldValue, windowText } from './ephemeris-window';
import { absorbedSeries, altitudeSeries, eclipseBands, fluxSeries, spanText, sunlitSeries } from './ephemeris-series';
import { EphemerisUpload } from './ephemeris-upload';
import { UtcTimePipe } from '../time/utc-time-pipe';

/** A mission's ephemerides: upload, the list, and for the chosen one its summary and the environment along it. */
@Component({
  selector: 'ecl-mission-ephemerides',
  imports: [
    RowActions,
    UtcTimePipe, DecimalPipe, MatButton, MatButtonToggleGroup, MatButtonToggle, MatFormField, MatLabel, MatInput, MatSelect, MatOption,
    TimeSeriesPlot, DesignCaution, EphemerisUpload,
  ],
  templateUrl: './mission-ephemerides.html',
  styleUrl: './mission-ephemerides.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MissionEphemerides {
  private readonly api = inject(EphemerisApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);
  private readonly refresh = new BehaviorSubject<void>(undefined);

  readonly missionId = input.required<string>();
  readonly workspaceId = input.required<string>();
  readonly canEdit = input(false);
  readonly crewed = input(false);
  /** Thermal engineers and owners make load cases from a window. */
  readonly canMakeCases = input(false);

  protected readonly spanText = spanText;
  protected readonly list = toSignal(
    combineLatest([toObservable(this.missionId), this.refresh]).pipe(switchMap(([id]) => this.api.list(id).pipe(loaded()))),
  );
  protected readonly items = computed(() => {
    const state = this.list();
    return state?.status === 'ready' ? state.value : [];
  });
  private readonly chosenId = signal<string | null>(null);
  /** The chosen ephemeris, or the newest when none is chosen (or the chosen one was deleted). */
  protected readonly selected = computed<EphemerisSummary | null>(() => {
    const items = this.items();
    return items.find((e) => e.id === this.chosenId()) ?? items[0] ?? null;
  });
  protected readonly properties = signal<'bol' | 'eol'>('bol');
  protected readonly surfaceIndex = signal(0);
  /** The window asked for (ISO epochs; empty ends: the ephemeris' own); back to the whole span for another ephemeris. */
  protected readonly window = linkedSignal<EphemerisSummary | null, { from?: string; to?: string }>({ source: this.selected, computation: () => ({}) });

  protected readonly environment = toSignal(
    combineLatest([toObservable(this.selected), toObservable(this.properties), toObservable(this.window)]).pipe(
      filter(([selected]) => selected !== undefined),
      switchMap(([selected, properties, window]) =>
        selected ? this.api.environment(this.missionId(), selected.id, { properties, maxPoints: 2000, ...window }).pipe(loaded()) : of(null),
      ),
    ),
  );
  protected readonly env = computed(() => {
    const state = this.environment();
    return state?.status === 'ready' ? state.value : null;
  });
  /** The window fields show the rows in use until the user types other epochs. */
  protected readonly fromText = linkedSignal(() => utcFieldValue(this.env()?.window.from ?? ''));
  protected readonly toText = linkedSignal(() => utcFieldValue(this.env()?.window.to ?? ''));
  protected readonly windowProblem = signal<string | null>(null);
  protected readonly windowed = computed(() => this.window().from !== undefined || this.window().to !== undefined);
  protected readonly shownWindow = computed(() => {
    const w = this.env()?.window;
    return w ? windowText(w.from, w.to) : '';
  });
  protected readonly bands = computed(() => eclipseBands(this.env()?.points ?? []));
  protected readonly altitude = computed(() => altitudeSeries(this.env()?.points ?? []));
  protected readonly sunlit = computed(() => sunlitSeries(this.env()?.points ?? []));
  protected readonly absorbed = computed(() => absorbedSeries(this.env()?.points ?? []));
  protected readonly fluxes = computed(() => fluxSeries(this.env()?.points ?? [], this.surfaceIndex()));
  protected readonly surfaceNames = computed(() => this.env()?.averages.surfaces.map((s) => s.name) ?? []);
  protected readonly surfaceName = computed(() => this.surfaceNames().at(this.surfaceIndex()) ?? '');
  protected readonly gutters = { left: 64, right: 16 };
  /** The altitude, sunlit, absorbed and flux plots share the window's dates: they zoom together. */
  protected readonly zoom = sharedZoom(this.env);

  protected showWindow(): void {
    const [from, to] = [isoFromUtcField(this.fromText()), isoFromUtcField(this.toText())];
    if (!from || !to) {
      this.windowProblem.set(`Give both ends as a UTC date and time, e.g. 2027-03-20 12:00:00${!from ? ` (From: "${this.fromText()}")` : ` (To: "${this.toText()}")`}.`);
      return;
    }
    if (Date.parse(from) >= Date.parse(to)) {
      this.windowProblem.set('From must be before To.');
      return;
    }
    this.windowProblem.set(null);
    this.window.set({ from, to });
  }

  protected wholeSpan(): void {
    this.windowProblem.set(null);
    this.window.set({});
  }

  protected makeCase(e: EphemerisSummary): void {
    const shown = this.env();
    if (!shown) return;
    EphemerisCaseDialog.open(this.dialog, { missionId: this.missionId(), ephemeris: e, from: shown.window.from, to: shown.window.to, properties: this.properties() })
      .pipe(filter((made) => made !== undefined))
      .subscribe((made) => {
        this.snackBar.open(`Saved the draft case “${made.name}”.`, undefined, { duration: 3000 });
        void this.router.navigate(['/w', this.workspaceId(), 'cases', made.id]);
      });
  }

  protected showEphemeris(e: EphemerisSummary): void {
    this.chosenId.set(e.id);
  }

  protected stored(summary: EphemerisSummary): void {
    this.chosenId.set(summary.id);
    this.refresh.next();
  }

  protected deleteEphemeris(e: EphemerisSummary): void {
    ConfirmDialog.ask(this.dialog, {
      title: `Delete “${e.name}”?`,
      message: `Its ${e.rows} rows are removed from the mission. This cannot be undone.`,
      confirmLabel: 'Delete',
    })
      .pipe(filter((yes) => yes), switchMap(() => this.api.remove(this.missionId(), e.id)))
      .subscribe({
        next: () => {
          this.snackBar.open(`Deleted “${e.name}”.`, undefined, { duration: 3000 });
          this.refresh.next();
        },
        error: (failure: unknown) => this.snackBar.open(apiErrorMessage(failure), 'Close'),
      });
  }
}
