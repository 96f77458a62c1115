import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatCheckbox } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogRef, MatDialogTitle } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import type { CaseDerive, CaseDetail } from '../../../shared/api/cases';
import { apiErrorMessage } from '../api/api-error-message';
import { CaseApi } from './case-api';
import { MarginFields, marginGroup } from './margin-fields';
import { missionOrbitChoice } from './mission-orbit-choice';

export interface CaseDeriveData {
  readonly workspaceId: string;
  readonly missionId: string | null;
}

/** Derives a mission's hot and cold cases from one orbit over its date range; both become drafts. */
@Component({
  selector: 'ecl-case-derive-dialog',
  imports: [
    ReactiveFormsModule, MatButton, MatButtonToggleGroup, MatButtonToggle, MatDialogTitle, MatDialogContent, MatDialogActions,
    MatDialogClose, MatFormField, MatLabel, MatHint, MatError, MatInput, MatSelect, MatOption, MatProgressBar, MarginFields, MatCheckbox,
  ],
  templateUrl: './case-derive-dialog.html',
  styleUrl: './case-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseDeriveDialog {
  private readonly api = inject(CaseApi);
  private readonly dialogRef = inject<MatDialogRef<CaseDeriveDialog, CaseDetail[]>>(MatDialogRef);
  private readonly data = inject<CaseDeriveData>(MAT_DIALOG_DATA);

  protected readonly form = inject(NonNullableFormBuilder).group({
    missionId: [this.data.missionId ?? '', Validators.required],
    orbitId: ['', Validators.required],
    name: ['', Validators.maxLength(120)],
    hot: ['eol' as 'bol' | 'eol'],
    cold: ['bol' as 'bol' | 'eol'],
    margins: marginGroup(inject(NonNullableFormBuilder)),
    survival: false,
  });
  protected readonly choice = missionOrbitChoice(this.api, this.data.workspaceId, this.form.controls.missionId, this.form.controls.orbitId);
  protected readonly orbitHint = computed(() => {
    const m = this.choice.mission();
    if (m.status !== 'ready' || m.value === null) return '';
    return m.value.orbits.length === 0 ? 'This mission has no orbit yet.' : `Mission ${m.value.startDate} to ${m.value.endDate}`;
  });
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected deriveCases(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const body: CaseDerive = {
      orbitId: v.orbitId,
      ...(v.name.trim() ? { name: v.name.trim() } : {}),
      properties: { hot: v.hot, cold: v.cold },
      margins: v.margins,
      ...(v.survival ? { survival: true } : {}),
    };
    this.busy.set(true);
    this.failure.set(null);
    this.form.disable();
    this.api.derive(v.missionId, body).subscribe({
      next: (cases) => this.dialogRef.close(cases),
      error: (failure: unknown) => {
        this.busy.set(false);
        this.form.enable();
        this.failure.set(apiErrorMessage(failure));
      },
    });
  }
}
