import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogActions, MatDialogContent, MatDialogTitle } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import type { CaseCreate, CaseDetail } from '../../../shared/api/cases';
import { DialogButtons } from '../shell/dialog-buttons';
import { dialogSubmit } from '../shell/dialog-submit';
import { CaseApi } from './case-api';
import type { CaseDeriveData } from './case-derive-dialog';
import { CaseTreatmentToggles } from './case-treatment-toggles';
import { MarginFields, marginGroup } from './margin-fields';
import { MissionOrbitPicker, missionOrbitChoice } from './mission-orbit-picker';
import { isoDateValidator } from '../time/iso-date-validator';

/** A case the engineer defines: a date (and with it the Sun), or a fixed beta, an attitude, a property set. */
@Component({
  selector: 'ecl-custom-case-dialog',
  imports: [
    ReactiveFormsModule, CaseTreatmentToggles, MatDialogTitle, MatDialogContent, MatDialogActions, DialogButtons,
    MatFormField, MatLabel, MatHint, MatError, MatSuffix, MatInput, MatProgressBar, MarginFields, MissionOrbitPicker,
  ],
  templateUrl: './custom-case-dialog.html',
  styleUrl: './case-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CustomCaseDialog {
  private readonly api = inject(CaseApi);
  private readonly data = inject<CaseDeriveData>(MAT_DIALOG_DATA);

  protected readonly form = inject(NonNullableFormBuilder).group({
    missionId: [this.data.missionId ?? '', Validators.required],
    orbitId: ['', Validators.required],
    name: ['', [Validators.required, Validators.maxLength(120)]],
    date: ['', [Validators.required, isoDateValidator]],
    betaDeg: [null as number | null, [Validators.min(-90), Validators.max(90)]],
    properties: ['bol' as 'bol' | 'eol'],
    marginDirection: ['increase' as 'increase' | 'decrease'],
    attitude: ['', Validators.maxLength(300)],
    margins: marginGroup(inject(NonNullableFormBuilder)),
  });
  protected readonly choice = missionOrbitChoice(this.api, this.data.workspaceId, this.form.controls.missionId, this.form.controls.orbitId);
  protected readonly submit = dialogSubmit<CaseDetail>(this.form);

  protected missionStart(): string {
    const m = this.choice.mission();
    return m.status === 'ready' && m.value ? m.value.startDate : '';
  }

  protected createCase(): void {
    // An empty date means the mission's first day, as the hint says.
    if (this.form.controls.date.value === '' && this.missionStart() !== '') this.form.controls.date.setValue(this.missionStart());
    this.submit.submit(() => {
      const v = this.form.getRawValue();
      const body: CaseCreate = {
        orbitId: v.orbitId,
        name: v.name.trim(),
        date: v.date,
        ...(v.betaDeg !== null ? { betaDeg: v.betaDeg } : {}),
        properties: v.properties,
        marginDirection: v.marginDirection,
        ...(v.attitude.trim() ? { attitude: v.attitude.trim() } : {}),
        margins: v.margins,
      };
      return this.api.create(v.missionId, body);
    });
  }
}
