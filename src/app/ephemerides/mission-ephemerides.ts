import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { BehaviorSubject, combineLatest, filter, of, switchMap } from 'rxjs';
import type { EphemerisSummary } from '../../../shared/api/ephemerides';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { TimeSeriesPlot } from '../plots/time-series-plot';
import { ConfirmDialog } from '../shell/confirm-dialog';
import { DesignCaution } from '../shell/design-caution';
import { EphemerisApi } from './ephemeris-api';
import { absorbedSeries, altitudeSeries, eclipseBands, fluxSeries, spanText, sunlitSeries } from './ephemeris-series';
import { EphemerisUpload } from './ephemeris-upload';

/** A mission's ephemerides: upload, the list, and for the chosen one its summary and the environment along it. */
@Component({
  selector: 'ecl-mission-ephemerides',
  imports: [
    DatePipe, DecimalPipe, MatButton, MatButtonToggleGroup, MatButtonToggle, MatFormField, MatLabel, MatSelect, MatOption,
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
  private readonly refresh = new BehaviorSubject<void>(undefined);

  readonly missionId = input.required<string>();
  readonly workspaceId = input.required<string>();
  readonly canEdit = input(false);
  readonly crewed = input(false);

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

  protected readonly environment = toSignal(
    combineLatest([toObservable(this.selected), toObservable(this.properties)]).pipe(
      filter(([selected]) => selected !== undefined),
      switchMap(([selected, properties]) =>
        selected ? this.api.environment(this.missionId(), selected.id, { properties, maxPoints: 2000 }).pipe(loaded()) : of(null),
      ),
    ),
  );
  protected readonly env = computed(() => {
    const state = this.environment();
    return state?.status === 'ready' ? state.value : null;
  });
  protected readonly bands = computed(() => eclipseBands(this.env()?.points ?? []));
  protected readonly altitude = computed(() => altitudeSeries(this.env()?.points ?? []));
  protected readonly sunlit = computed(() => sunlitSeries(this.env()?.points ?? []));
  protected readonly absorbed = computed(() => absorbedSeries(this.env()?.points ?? []));
  protected readonly fluxes = computed(() => fluxSeries(this.env()?.points ?? [], this.surfaceIndex()));
  protected readonly surfaceNames = computed(() => this.env()?.averages.surfaces.map((s) => s.name) ?? []);
  protected readonly surfaceName = computed(() => this.surfaceNames().at(this.surfaceIndex()) ?? '');
  protected readonly gutters = { left: 64, right: 16 };

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
