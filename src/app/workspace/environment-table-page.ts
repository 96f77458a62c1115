import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormArray, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { switchMap } from 'rxjs';
import type { EnvironmentTableResponse } from '../../../shared/api/environment-table';
import { bodyIds, getBody, type BodyId } from '../../../shared/physics/bodies';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { AuthSession } from '../auth/auth-session';
import { DesignCaution } from '../shell/design-caution';
import { WorkspaceApi } from './workspace-api';

type TableRow = EnvironmentTableResponse['rows'][number];

/**
 * The workspace's own paired hot/cold albedo and OLR by inclination band and averaging time, each
 * with its source; derived cases use the matching row instead of the built-in provisional pairs.
 * Every member reads it; owners and thermal engineers edit it.
 */
@Component({
  selector: 'ecl-environment-table-page',
  imports: [ReactiveFormsModule, DesignCaution, MatFormField, MatLabel, MatInput, MatSelect, MatOption, MatButton, MatIconButton, MatIcon],
  templateUrl: './environment-table-page.html',
  styleUrl: './environment-table-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EnvironmentTablePage {
  private readonly api = inject(WorkspaceApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(AuthSession);
  private readonly fb = inject(NonNullableFormBuilder);

  /** From the route /w/:workspaceId/environment. */
  readonly workspaceId = input.required<string>();

  protected readonly numberFields = [
    { control: 'inclinationMinDeg', label: 'Inclination from (°)', step: 1 },
    { control: 'inclinationMaxDeg', label: 'to (°)', step: 1 },
    { control: 'averagingTimeS', label: 'Averaging time (s)', step: 1 },
    { control: 'hotAlbedo', label: 'Hot albedo', step: 0.01 },
    { control: 'hotOlrWm2', label: 'Hot OLR (W/m²)', step: 1 },
    { control: 'coldAlbedo', label: 'Cold albedo', step: 0.01 },
    { control: 'coldOlrWm2', label: 'Cold OLR (W/m²)', step: 1 },
  ] as const;
  protected readonly bodies = bodyIds.map((id) => ({ id, name: getBody(id).name }));
  protected readonly canEdit = computed(() => {
    const role = this.session.workspaces().find((w) => w.workspaceId === this.workspaceId())?.role;
    return role === 'owner' || role === 'thermal';
  });
  protected readonly table = toSignal(toObservable(this.workspaceId).pipe(switchMap((id) => this.api.environmentTable(id).pipe(loaded()))));
  protected readonly rows = new FormArray<ReturnType<EnvironmentTablePage['rowGroup']>>([]);
  /** The form element's group, so submitting it stays in the page. */
  protected readonly form = new FormGroup({ rows: this.rows });
  /** Bumped whenever rows are added or removed: the form array itself is not a signal (zoneless, OnPush). */
  private readonly version = signal(0);
  protected readonly controls = computed(() => {
    this.version();
    return [...this.rows.controls];
  });
  protected readonly failure = signal<string | null>(null);
  protected readonly busy = signal(false);

  constructor() {
    effect(() => {
      const state = this.table();
      if (state?.status !== 'ready') return;
      this.rows.clear();
      for (const row of state.value.rows) this.rows.push(this.rowGroup(row));
      if (!this.canEdit()) this.rows.disable();
      this.version.update((v) => v + 1);
    });
  }

  private rowGroup(row?: TableRow) {
    const number = (value: number | null, min: number, max: number) => this.fb.control<number | null>(value, [Validators.required, Validators.min(min), Validators.max(max)]);
    return this.fb.group({
      bodyId: this.fb.control<BodyId>(row?.bodyId ?? 'earth'),
      inclinationMinDeg: number(row?.inclinationMinDeg ?? 0, 0, 180),
      inclinationMaxDeg: number(row?.inclinationMaxDeg ?? 30, 0, 180),
      averagingTimeS: number(row?.averagingTimeS ?? 896, 0.001, 1e7),
      hotAlbedo: number(row?.hot.albedo ?? null, 0, 1),
      hotOlrWm2: number(row?.hot.olrWm2 ?? null, 0, 20000),
      coldAlbedo: number(row?.cold.albedo ?? null, 0, 1),
      coldOlrWm2: number(row?.cold.olrWm2 ?? null, 0, 20000),
      source: this.fb.control(row?.source ?? '', [Validators.required, Validators.maxLength(300)]),
    });
  }

  protected add(): void {
    this.rows.push(this.rowGroup());
    this.version.update((v) => v + 1);
  }

  protected remove(index: number): void {
    this.rows.removeAt(index);
    this.version.update((v) => v + 1);
  }

  protected save(): void {
    if (this.rows.invalid) {
      this.rows.markAllAsTouched();
      this.failure.set('Every row needs its band, averaging time, both pairs and a source.');
      return;
    }
    const rows = this.rows.getRawValue().map((r) => ({
      bodyId: r.bodyId, inclinationMinDeg: r.inclinationMinDeg ?? 0, inclinationMaxDeg: r.inclinationMaxDeg ?? 0, averagingTimeS: r.averagingTimeS ?? 0,
      hot: { albedo: r.hotAlbedo ?? 0, olrWm2: r.hotOlrWm2 ?? 0 }, cold: { albedo: r.coldAlbedo ?? 0, olrWm2: r.coldOlrWm2 ?? 0 }, source: r.source.trim(),
    }));
    this.busy.set(true);
    this.failure.set(null);
    this.api.saveEnvironmentTable(this.workspaceId(), { rows }).subscribe({
      next: (saved) => {
        this.busy.set(false);
        this.snackBar.open(`Environment table saved: ${saved.rows.length} row(s).`, undefined, { duration: 3000 });
      },
      error: (failure: unknown) => {
        this.busy.set(false);
        this.failure.set(apiErrorMessage(failure));
      },
    });
  }
}
