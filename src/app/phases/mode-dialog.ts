import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormArray, FormControl, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatCheckbox } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialog, MatDialogActions, MatDialogContent, MatDialogTitle } from '@angular/material/dialog';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { map, merge, type Observable } from 'rxjs';
import type { Surface, SurfaceNormal } from '../../../shared/api/missions';
import type { AttitudeMode } from '../../../shared/api/phases';
import { apiErrorMessage } from '../api/api-error-message';
import { DialogButtons } from '../shell/dialog-buttons';
import { LabelledField } from '../shell/labelled-field';
import { dialogSubmit, placedBeside } from '../shell/dialog-submit';
import { PointingEditor, pointingForm, readPointingForm } from '../surfaces/pointing-editor';
import { describeNormal } from '../surfaces/surface-normals';
import { PhaseApi } from './phase-api';

export interface ModeDialogData {
  readonly missionId: string;
  readonly mode: AttitudeMode | null;
  readonly surfaces: readonly Surface[];
}

/** '' keeps the surface's own facing; 'set' points it in this mode with the pointing editor. */
type Choice = '' | 'set';

/** Adds or edits an attitude mode: where each surface points in it, and whether it yaw-steers. */
@Component({
  selector: 'ecl-mode-dialog',
  imports: [ReactiveFormsModule, MatCheckbox, MatDialogTitle, MatDialogContent, MatDialogActions, DialogButtons, LabelledField, MatFormField, MatLabel, MatInput, MatHint, MatSelect, MatOption, PointingEditor],
  template: `
    <h2 mat-dialog-title>{{ data.mode ? 'Edit the attitude mode' : 'New attitude mode' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <ecl-field [control]="form.controls.name" label="Mode name" testid="mode-name" initialFocus [error]="problem() ?? 'Give the mode a name, e.g. nadir imaging.'" />
        <mat-form-field appearance="outline">
          <mat-label>Description</mat-label>
          <textarea matInput formControlName="description" rows="2" data-testid="mode-description"></textarea>
          <mat-hint>Optional; when the spacecraft flies it.</mat-hint>
        </mat-form-field>
        <mat-checkbox formControlName="yawSteering" data-testid="mode-yaw">Yaw steering (turn about nadir to keep the Sun off one side)</mat-checkbox>
        <h3>Pointing in this mode</h3>
        <p class="ecl-muted hint">A surface left "as defined" faces as on the Surfaces tab.</p>
        @for (s of data.surfaces; track s.id; let i = $index) {
          <div class="surface" [class.pointed]="chosen()[i] === 'set'" role="group" [attr.aria-label]="'Pointing of ' + s.name + ' in this mode'">
            <mat-form-field appearance="outline" subscriptSizing="dynamic">
              <mat-label>{{ s.name }}</mat-label>
              <mat-select [formControl]="choices[i]!" [attr.data-testid]="'mode-pointing-' + i">
                <mat-option value="">As defined ({{ describe(s.normal) }})</mat-option>
                <mat-option value="set">Pointed in this mode</mat-option>
              </mat-select>
            </mat-form-field>
            @if (chosen()[i] === 'set') {
              <ecl-pointing-editor [form]="pointings[i]!" [testid]="'mode-' + i" [label]="'How ' + s.name + ' points'" />
            }
          </div>
        }
        @if (submit.failure(); as message) {
          <p class="ecl-error" role="alert" data-testid="mode-form-error">{{ message }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end" eclDialogButtons [busy]="submit.busy()" [label]="data.mode ? 'Save' : 'Add mode'" testid="mode-save" />
    </form>
  `,
  styles: `
    .fields { display: flex; flex-direction: column; gap: 8px; min-width: min(480px, 80vw); }
    h3 { font: var(--mat-sys-title-small); margin: 8px 0 0; }
    .hint { margin: 0; font: var(--mat-sys-body-small); }
    .surface { display: flex; flex-direction: column; gap: 8px; }
    .surface.pointed { padding: 4px 0 0 12px; border-left: 2px solid var(--mat-sys-outline-variant); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModeDialog {
  private readonly api = inject(PhaseApi);
  protected readonly data = inject<ModeDialogData>(MAT_DIALOG_DATA);
  protected readonly problem = signal<string | null>(null);

  private readonly pointed = new Map((this.data.mode?.pointing ?? []).map((p) => [p.surfaceId, p.normal as SurfaceNormal]));
  /** Per surface: whether the mode points it, and its pointing (the mode's, else the surface's own to start from). */
  protected readonly choices = this.data.surfaces.map((s) => new FormControl<Choice>(this.pointed.has(s.id) ? 'set' : '', { nonNullable: true }));
  protected readonly pointings = this.data.surfaces.map((s) => pointingForm(this.pointed.get(s.id) ?? s.normal));
  private readonly choiceValues = () => this.choices.map((c) => c.value);
  protected readonly chosen = toSignal(merge(...this.choices.map((c) => c.valueChanges)).pipe(map(this.choiceValues)), { initialValue: this.choiceValues() });
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.data.mode?.name ?? '', Validators.required],
    description: this.data.mode?.description ?? '',
    yawSteering: this.data.mode?.yawSteering ?? false,
  });

  protected readonly submit = dialogSubmit<AttitudeMode>(new FormGroup({ mode: this.form, choices: new FormArray(this.choices), pointing: new FormArray(this.pointings) }));

  protected describe(normal: SurfaceNormal): string {
    return describeNormal(normal);
  }

  static open(dialog: MatDialog, data: ModeDialogData): Observable<AttitudeMode | undefined> {
    return dialog.open<ModeDialog, ModeDialogData, AttitudeMode>(ModeDialog, { data, width: '560px', maxWidth: '95vw' }).afterClosed();
  }

  protected save(): void {
    this.problem.set(null);
    const v = this.form.getRawValue();
    const readings = this.data.surfaces.flatMap((s, i) => (this.choices[i]!.value === 'set' ? [{ surfaceId: s.id, reading: readPointingForm(this.pointings[i]!) }] : []));
    const pointing = readings.flatMap(({ surfaceId, reading }) => (reading.ok ? [{ surfaceId, normal: reading.normal }] : []));
    // A pointing not yet complete is said under its editor; nothing is sent until each is.
    if (pointing.length < readings.length) return;
    this.submit.submit(
      () => this.api.saveMode(this.data.missionId, this.data.mode?.id ?? null, { name: v.name.trim(), description: v.description, yawSteering: v.yawSteering, pointing }),
      (failure) => {
        // A name refused (a mode of that name already) is said under the name; the rest above the buttons.
        if (!(failure instanceof HttpErrorResponse && failure.status === 409)) return placedBeside({ name: true }, (_field, message) => this.nameProblem(message))(failure);
        this.nameProblem(apiErrorMessage(failure));
        return 'placed';
      },
    );
  }

  private nameProblem(message: string): void {
    this.problem.set(message);
    this.form.controls.name.setErrors({ problem: true });
    this.form.controls.name.markAsTouched();
  }
}
