import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormArray, FormControl, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialog, MatDialogActions, MatDialogContent, MatDialogRef, MatDialogTitle } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import type { Observable } from 'rxjs';
import type { Surface, SurfaceNormal } from '../../../shared/api/missions';
import type { AttitudeMode } from '../../../shared/api/phases';
import { apiErrorMessage } from '../api/api-error-message';
import { dialogSubmit, placedBeside } from '../shell/dialog-submit';
import { describeNormal, NAMED_NORMALS, NORMAL_LABELS } from '../surfaces/surface-normals';
import { PhaseApi } from './phase-api';

export interface ModeDialogData {
  readonly missionId: string;
  readonly mode: AttitudeMode | null;
  readonly surfaces: readonly Surface[];
}

/** '' keeps the surface's own facing; 'kept' a pointing set otherwise (a vector), kept as it is. */
type Choice = string;

/** Adds or edits an attitude mode: where each surface points in it, and whether it yaw-steers. */
@Component({
  selector: 'ecl-mode-dialog',
  imports: [ReactiveFormsModule, MatButton, MatCheckbox, MatDialogTitle, MatDialogContent, MatDialogActions, MatFormField, MatLabel, MatInput, MatError, MatHint, MatSelect, MatOption],
  template: `
    <h2 mat-dialog-title>{{ data.mode ? 'Edit the attitude mode' : 'New attitude mode' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <mat-form-field appearance="outline">
          <mat-label>Mode name</mat-label>
          <input matInput formControlName="name" data-testid="mode-name" cdkFocusInitial />
          <mat-error>{{ problem() ?? 'Give the mode a name, e.g. nadir imaging.' }}</mat-error>
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Description</mat-label>
          <textarea matInput formControlName="description" rows="2" data-testid="mode-description"></textarea>
          <mat-hint>Optional; when the spacecraft flies it.</mat-hint>
        </mat-form-field>
        <mat-checkbox formControlName="yawSteering" data-testid="mode-yaw">Yaw steering (turn about nadir to keep the Sun off one side)</mat-checkbox>
        <h3>Pointing in this mode</h3>
        @for (s of data.surfaces; track s.id; let i = $index) {
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>{{ s.name }}</mat-label>
            <mat-select [formControl]="choices[i]!" [attr.data-testid]="'mode-pointing-' + i">
              <mat-option value="">As defined ({{ describe(s.normal) }})</mat-option>
              @if (kept.has(s.id)) {
                <mat-option value="kept">As set before ({{ describe(kept.get(s.id)!) }})</mat-option>
              }
              @for (n of normals; track n) {
                <mat-option [value]="n">{{ labels[n] }}</mat-option>
              }
            </mat-select>
          </mat-form-field>
        }
        @if (submit.failure(); as message) {
          <p class="ecl-error" role="alert" data-testid="mode-form-error">{{ message }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" (click)="dialogRef.close()">Cancel</button>
        <button mat-flat-button type="submit" [disabled]="submit.busy()" data-testid="mode-save">{{ data.mode ? 'Save' : 'Add mode' }}</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .fields { display: flex; flex-direction: column; gap: 8px; min-width: min(480px, 80vw); }
    h3 { font: var(--mat-sys-title-small); margin: 8px 0 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModeDialog {
  private readonly api = inject(PhaseApi);
  protected readonly data = inject<ModeDialogData>(MAT_DIALOG_DATA);
  protected readonly dialogRef = inject<MatDialogRef<ModeDialog, AttitudeMode>>(MatDialogRef);
  protected readonly normals = NAMED_NORMALS;
  protected readonly labels = NORMAL_LABELS;
  protected readonly problem = signal<string | null>(null);

  private readonly pointed = new Map((this.data.mode?.pointing ?? []).map((p) => [p.surfaceId, p.normal as SurfaceNormal]));
  /** Pointings the picker has no name for (a vector, or another form given through the API): offered as they are. */
  protected readonly kept = new Map([...this.pointed].filter(([, n]) => typeof n !== 'string'));
  protected readonly choices = this.data.surfaces.map((s) => {
    const n = this.pointed.get(s.id);
    return new FormControl<Choice>(n === undefined ? '' : typeof n === 'string' ? n : 'kept', { nonNullable: true });
  });
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.data.mode?.name ?? '', Validators.required],
    description: this.data.mode?.description ?? '',
    yawSteering: this.data.mode?.yawSteering ?? false,
  });

  protected readonly submit = dialogSubmit<AttitudeMode>(new FormGroup({ mode: this.form, pointing: new FormArray(this.choices) }));

  protected describe(normal: SurfaceNormal): string {
    return describeNormal(normal);
  }

  static open(dialog: MatDialog, data: ModeDialogData): Observable<AttitudeMode | undefined> {
    return dialog.open<ModeDialog, ModeDialogData, AttitudeMode>(ModeDialog, { data, width: '560px', maxWidth: '95vw' }).afterClosed();
  }

  protected save(): void {
    this.problem.set(null);
    const v = this.form.getRawValue();
    const pointing = this.data.surfaces.flatMap((s, i) => {
      const choice = this.choices[i]!.value;
      if (choice === '') return [];
      const normal = choice === 'kept' ? this.kept.get(s.id) : (choice as SurfaceNormal);
      return normal === undefined ? [] : [{ surfaceId: s.id, normal }];
    });
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
