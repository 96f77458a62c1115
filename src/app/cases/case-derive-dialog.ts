import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatCheckbox } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogActions, MatDialogContent, MatDialogTitle } from '@angular/material/dialog';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import type { CaseDerive, CaseDetail } from '../../../shared/api/cases';
import { DialogButtons } from '../shell/dialog-buttons';
import { dialogSubmit } from '../shell/dialog-submit';
import { CaseApi } from './case-api';
import { MarginFields, marginGroup } from './margin-fields';
import { MissionOrbitPicker, missionOrbitChoice } from './mission-orbit-picker';

export interface CaseDeriveData {
  readonly workspaceId: string;
  readonly missionId: string | null;
}

/** Derives a mission's hot and cold cases from one orbit over its date range; both become drafts. */
@Component({
  selector: 'ecl-case-derive-dialog',
  imports: [
    ReactiveFormsModule, MatButtonToggleGroup, MatButtonToggle, MatDialogTitle, MatDialogContent, MatDialogActions, DialogButtons,
    MatFormField, MatLabel, MatHint, MatInput, MatProgressBar, MarginFields, MissionOrbitPicker, MatCheckbox,
  ],
  templateUrl: './case-derive-dialog.html',
  styleUrl: './case-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseDeriveDialog {
  private readonly api = inject(CaseApi);
  private readonly data = inject<CaseDeriveData>(MAT_DIALOG_DATA);

  /** The property set of each case derived, with why its default is what it is. */
  protected readonly propertyRows = [
    { control: 'hot', label: 'Hot case', note: 'default EOL: absorptivity is highest at end of life' },
    { control: 'cold', label: 'Cold case', note: 'default BOL' },
  ] as const;

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
  protected readonly submit = dialogSubmit<CaseDetail[]>(this.form);

  protected deriveCases(): void {
    this.submit.submit(() => {
      const v = this.form.getRawValue();
      const body: CaseDerive = {
        orbitId: v.orbitId,
        ...(v.name.trim() ? { name: v.name.trim() } : {}),
        properties: { hot: v.hot, cold: v.cold },
        margins: v.margins,
        ...(v.survival ? { survival: true } : {}),
      };
      return this.api.derive(v.missionId, body);
    });
  }
}
