// One saved thermal model: its tables (editable by thermal engineers and owners, read-only for the
// rest), a run on a load case of its mission, the results and the sizing. The caution carries the
// crewed-vehicle sentence always here, as issue 7 asks of the thermal results.
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { combineLatest, map, of, switchMap } from 'rxjs';
import type { CaseSummary } from '../../../shared/api/cases';
import type { MissionDetail } from '../../../shared/api/missions';
import type { ThermalModelDetail } from '../../../shared/api/thermal-models';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { CaseApi } from '../cases/case-api';
import { ConfirmDialog } from '../shell/confirm-dialog';
import { DesignCaution } from '../shell/design-caution';
import { CurrentWorkspace } from '../workspace/current-workspace';
import { ThermalModelApi } from './thermal-api';
import { ThermalModelEditor } from './thermal-model-editor';
import { contentOf, modelForm, type ModelForm } from './thermal-model-form';
import { ThermalRunPanel } from './thermal-run-panel';
import { ThermalDistancePanel } from './thermal-distance-panel';
import { ThermalSizingPanel } from './thermal-sizing-panel';

interface Loaded3 {
  model: ThermalModelDetail;
  mission: MissionDetail;
  cases: CaseSummary[];
}

@Component({
  selector: 'ecl-thermal-model-page',
  imports: [
    ReactiveFormsModule, RouterLink, MatButton, MatIcon, MatFormField, MatLabel, MatInput, DesignCaution, ThermalModelEditor, ThermalRunPanel,
    ThermalSizingPanel, ThermalDistancePanel,
  ],
  templateUrl: './thermal-model-page.html',
  styleUrl: './thermal-model-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ThermalModelPage {
  readonly workspaceId = input.required<string>();
  readonly modelId = input.required<string>();

  private readonly api = inject(ThermalModelApi);
  private readonly cases = inject(CaseApi);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly role = inject(CurrentWorkspace).role;

  protected readonly canEdit = computed(() => this.role() === 'thermal' || this.role() === 'owner');
  protected readonly canRun = computed(() => this.canEdit() || this.role() === 'analyst');

  private readonly reload = signal(0);
  protected readonly data = toSignal(
    combineLatest([toObservable(this.modelId), toObservable(this.reload)]).pipe(
      switchMap(([id]) =>
        this.api.get(id).pipe(
          switchMap((model) => combineLatest([of(model), this.cases.mission(model.missionId), this.cases.list({ missionId: model.missionId })])),
          map(([model, mission, cases]): Loaded3 => ({ model, mission, cases })),
          loaded(),
        ),
      ),
    ),
    { initialValue: { status: 'loading' as const } },
  );

  protected readonly ready = computed(() => {
    const d = this.data();
    return d.status === 'ready' ? d.value : null;
  });
  protected readonly failed = computed(() => {
    const d = this.data();
    return d.status === 'failed' ? d.message : null;
  });

  protected readonly form = signal<ModelForm | null>(null);
  protected readonly name = new FormControl('', { nonNullable: true });
  protected readonly saving = signal(false);
  protected readonly saveError = signal<string | null>(null);
  /** Bumped on form changes so the "unsaved" hint follows the form. */
  private readonly edits = signal(0);
  protected readonly dirty = computed(() => {
    this.edits();
    return (this.form()?.dirty ?? false) || this.name.dirty;
  });
  protected readonly nodeNames = computed(() => {
    const d = this.data();
    return d.status === 'ready' ? d.value.model.model.nodes.map((n) => n.name) : [];
  });
  protected readonly heaterNodes = computed(() => {
    const d = this.data();
    return d.status === 'ready' ? [...new Set(d.value.model.model.heaters.map((h) => h.node))] : [];
  });

  constructor() {
    effect(() => {
      const d = this.data();
      if (d.status !== 'ready') return;
      const form = modelForm(d.value.model.model);
      if (!this.canEdit()) form.disable({ emitEvent: false });
      form.events.subscribe(() => this.edits.update((v) => v + 1));
      this.name.setValue(d.value.model.name);
      this.name.markAsPristine();
      if (!this.canEdit()) this.name.disable();
      this.form.set(form);
    });
  }

  protected save(): void {
    const form = this.form();
    if (!form) return;
    form.markAllAsTouched();
    this.edits.update((v) => v + 1);
    if (form.invalid || this.name.value.trim() === '') {
      this.saveError.set('Some cells are not valid; each says why under it.');
      return;
    }
    this.saving.set(true);
    this.saveError.set(null);
    this.api.update(this.modelId(), { name: this.name.value.trim(), model: contentOf(form) }).subscribe({
      next: () => {
        this.saving.set(false);
        this.snackBar.open('Model saved.', undefined, { duration: 2500 });
        this.reload.update((v) => v + 1);
      },
      error: (e: unknown) => {
        this.saving.set(false);
        this.saveError.set(apiErrorMessage(e));
      },
    });
  }

  protected discard(): void {
    this.reload.update((v) => v + 1);
  }

  protected deleteModel(name: string, missionId: string): void {
    ConfirmDialog.ask(this.dialog, { title: 'Delete thermal model', message: `Delete "${name}" and its kept runs? This cannot be undone.`, confirmLabel: 'Delete' }).subscribe((yes) => {
      if (!yes) return;
      this.api.remove(this.modelId()).subscribe({
        next: () => void this.router.navigate(['/w', this.workspaceId(), 'thermal'], { queryParams: { mission: missionId } }),
        error: (e: unknown) => this.saveError.set(apiErrorMessage(e)),
      });
    });
  }
}
