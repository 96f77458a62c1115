import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialog, MatDialogActions, MatDialogContent, MatDialogTitle } from '@angular/material/dialog';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import type { Observable } from 'rxjs';
import type { CaseDetail } from '../../../shared/api/cases';
import type { EphemerisSummary } from '../../../shared/api/ephemerides';
import { CaseTreatmentToggles } from '../cases/case-treatment-toggles';
import { MarginFields, marginGroup } from '../cases/margin-fields';
import { DialogButtons } from '../shell/dialog-buttons';
import { dialogSubmit } from '../shell/dialog-submit';
import { EphemerisApi } from './ephemeris-api';
import { windowText } from './ephemeris-window';

export interface EphemerisCaseData {
  missionId: string;
  ephemeris: EphemerisSummary;
  /** The window shown on the page (ISO 8601 UTC), which the case takes. */
  from: string;
  to: string;
  properties: 'bol' | 'eol';
}

/** Saves the loads along the shown window of an ephemeris as a draft load case. */
@Component({
  selector: 'ecl-ephemeris-case-dialog',
  imports: [
    ReactiveFormsModule, CaseTreatmentToggles, MatDialogTitle, MatDialogContent, MatDialogActions, DialogButtons,
    MatFormField, MatLabel, MatError, MatInput, MatProgressBar, MarginFields,
  ],
  template: `
    <h2 mat-dialog-title>Load case from this window</h2>
    <mat-dialog-content>
      <p class="ecl-muted intro">
        The loads at every row of “{{ data.ephemeris.name }}” from {{ window }}, saved as a draft custom case for review.
        Its orbit is recorded as the osculating one at the first row.
      </p>
      <form class="ecl-form" [formGroup]="form" (ngSubmit)="createCase()" id="ephemeris-case-form" novalidate>
        <mat-form-field appearance="outline">
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" data-testid="ephemeris-case-name" />
          <mat-error>Give the case a name (at most 120 characters).</mat-error>
        </mat-form-field>
        <ecl-case-treatment-toggles [properties]="form.controls.properties" [marginDirection]="form.controls.marginDirection" />
        <ecl-margin-fields [group]="form.controls.margins" testIdPrefix="ephemeris-case" />
      </form>
      @if (submit.busy()) {
        <mat-progress-bar mode="indeterminate" aria-label="Computing the case along the ephemeris" />
        <p class="ecl-muted" role="status">Computing the loads at {{ data.ephemeris.rows > 100000 ? 'up to ' : '' }}every row of the window…</p>
      }
      @if (submit.failure(); as message) {
        <p class="ecl-error" role="alert" data-testid="ephemeris-case-error">{{ message }}</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end" eclDialogButtons [busy]="submit.busy()" [cancelLocked]="true" formId="ephemeris-case-form" label="Create case" testid="ephemeris-case-submit" />
  `,
  styleUrl: '../cases/case-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EphemerisCaseDialog {
  private readonly api = inject(EphemerisApi);
  protected readonly data = inject<EphemerisCaseData>(MAT_DIALOG_DATA);
  protected readonly window = windowText(this.data.from, this.data.to);

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [`${this.data.ephemeris.name}, ${this.window}`.slice(0, 120), [Validators.required, Validators.maxLength(120)]],
    properties: [this.data.properties],
    marginDirection: ['increase' as 'increase' | 'decrease'],
    margins: marginGroup(inject(NonNullableFormBuilder)),
  });
  protected readonly submit = dialogSubmit<CaseDetail>(this.form);

  static open(dialog: MatDialog, data: EphemerisCaseData): Observable<CaseDetail | undefined> {
    return dialog.open<EphemerisCaseDialog, EphemerisCaseData, CaseDetail>(EphemerisCaseDialog, { data, width: '640px' }).afterClosed();
  }

  protected createCase(): void {
    this.submit.submit(() => {
      const v = this.form.getRawValue();
      return this.api.createCase(this.data.missionId, this.data.ephemeris.id, {
        name: v.name.trim(), from: this.data.from, to: this.data.to, properties: v.properties, marginDirection: v.marginDirection, margins: v.margins,
      });
    });
  }
}
