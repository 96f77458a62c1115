import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatCheckbox } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialog, MatDialogActions, MatDialogContent, MatDialogTitle } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { map, Observable } from 'rxjs';
import type { BodySummaryResponse } from '../../../shared/api/environment';
import type { Mission } from '../../../shared/api/missions';
import { DialogButtons } from '../shell/dialog-buttons';
import { LabelledField } from '../shell/labelled-field';
import { dialogSubmit, refusalDetails } from '../shell/dialog-submit';
import { MissionApi } from './mission-api';
import { isoDateValidator } from '../time/iso-date-validator';

export interface MissionFormData {
  readonly workspaceId: string;
  /** The mission to edit; null creates one. */
  readonly mission: Mission | null;
}

type MissionFieldName = 'name' | 'bodyId' | 'description' | 'startDate' | 'endDate';

/** Creates or edits a mission's facts: name, central body, dates, crewed. */
@Component({
  selector: 'ecl-mission-form-dialog',
  imports: [ReactiveFormsModule, MatCheckbox, MatDialogTitle, MatDialogContent, MatDialogActions, DialogButtons, LabelledField, MatFormField, MatLabel, MatInput, MatError, MatHint, MatSelect, MatOption],
  template: `
    <h2 mat-dialog-title>{{ data.mission ? 'Edit the mission' : 'New mission' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <ecl-field [control]="form.controls.name" label="Mission name" testid="mission-name" initialFocus [error]="problems()['name'] ?? 'Give the mission a name.'" />
        <mat-form-field appearance="outline">
          <mat-label>Central body</mat-label>
          <mat-select formControlName="bodyId" data-testid="mission-body">
            @for (b of bodies() ?? []; track b.id) {
              <mat-option [value]="b.id">{{ b.name }} ({{ b.workspaceId ? 'the workspace’s own body' : b.kind }})</mat-option>
            }
          </mat-select>
          <mat-error>{{ problems()['bodyId'] ?? 'Choose the body the spacecraft orbits.' }}</mat-error>
        </mat-form-field>
        <div class="ecl-pair">
          <ecl-field [control]="form.controls.startDate" kind="date" label="Start (UTC date)" testid="mission-start" [error]="problems()['startDate'] ?? 'Give the start date as YYYY-MM-DD, e.g. 2027-06-01.'" />
          <ecl-field [control]="form.controls.endDate" kind="date" label="End (UTC date)" testid="mission-end" errorTestid="mission-end-error" [error]="problems()['endDate'] ?? 'Give the end date as YYYY-MM-DD, e.g. 2028-06-01.'" />
        </div>
        <mat-form-field appearance="outline">
          <mat-label>Description</mat-label>
          <textarea matInput formControlName="description" rows="3" data-testid="mission-description"></textarea>
          <mat-hint>Optional; what the mission is for.</mat-hint>
        </mat-form-field>
        <mat-checkbox formControlName="crewed" data-testid="mission-crewed">Crewed vehicle</mat-checkbox>
        @if (submit.failure(); as message) {
          <p class="ecl-error" role="alert" data-testid="mission-form-error">{{ message }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end" eclDialogButtons [busy]="submit.busy()" [label]="data.mission ? 'Save' : 'Create mission'" testid="mission-save" />
    </form>
  `,
  styles: `
    .fields {
      display: flex;
      flex-direction: column;
      gap: 4px;
      min-width: min(480px, 80vw);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MissionFormDialog {
  private readonly api = inject(MissionApi);
  protected readonly data = inject<MissionFormData>(MAT_DIALOG_DATA);
  // the catalogue and this workspace's own bodies (another workspace's could not be its body)
  protected readonly bodies = toSignal<BodySummaryResponse[]>(
    this.api.bodies$.pipe(map((all) => all.filter((b) => b.workspaceId === undefined || b.workspaceId === this.data.workspaceId))),
  );
  protected readonly problems = signal<Partial<Record<MissionFieldName, string>>>({});

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.data.mission?.name ?? '', Validators.required],
    bodyId: [this.data.mission?.bodyId ?? 'earth', Validators.required],
    description: this.data.mission?.description ?? '',
    startDate: [this.data.mission?.startDate ?? '', [Validators.required, isoDateValidator]],
    endDate: [this.data.mission?.endDate ?? '', [Validators.required, isoDateValidator]],
    crewed: this.data.mission?.crewed ?? false,
  });
  protected readonly submit = dialogSubmit<Mission>(this.form);

  static open(dialog: MatDialog, data: MissionFormData): Observable<Mission | undefined> {
    return dialog.open<MissionFormDialog, MissionFormData, Mission>(MissionFormDialog, { data, width: '560px' }).afterClosed();
  }

  protected save(): void {
    this.problems.set({});
    const value = this.form.getRawValue();
    if (value.startDate && value.endDate && value.endDate < value.startDate) {
      this.showProblem('endDate', 'the mission ends before it starts');
    }
    this.submit.submit(
      () => {
        const body = { ...value, name: value.name.trim(), bodyId: value.bodyId as Mission['bodyId'] };
        const mission = this.data.mission;
        return mission ? this.api.updateMission(mission.id, body) : this.api.createMission({ workspaceId: this.data.workspaceId, ...body });
      },
      (failure) => {
        // Each detail under its field; the message above the buttons only for what no field shows.
        const details = refusalDetails(failure);
        let unplaced = details.length === 0;
        for (const d of details) {
          if (d.path && d.path in this.form.controls) this.showProblem(d.path as MissionFieldName, d.message);
          else unplaced = true;
        }
        return unplaced ? undefined : 'placed';
      },
    );
  }

  private showProblem(field: MissionFieldName, message: string): void {
    this.problems.update((p) => ({ ...p, [field]: message }));
    const control = this.form.controls[field];
    control.setErrors({ problem: message });
    control.markAsTouched();
  }
}
