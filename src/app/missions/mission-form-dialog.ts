import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialog, MatDialogActions, MatDialogContent, MatDialogRef, MatDialogTitle } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { map, Observable } from 'rxjs';
import type { BodySummaryResponse } from '../../../shared/api/environment';
import type { Mission } from '../../../shared/api/missions';
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
  imports: [ReactiveFormsModule, MatButton, MatCheckbox, MatDialogTitle, MatDialogContent, MatDialogActions, MatFormField, MatLabel, MatInput, MatError, MatHint, MatSelect, MatOption],
  template: `
    <h2 mat-dialog-title>{{ data.mission ? 'Edit the mission' : 'New mission' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <mat-form-field appearance="outline">
          <mat-label>Mission name</mat-label>
          <input matInput formControlName="name" data-testid="mission-name" cdkFocusInitial />
          <mat-error>{{ problems()['name'] ?? 'Give the mission a name.' }}</mat-error>
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Central body</mat-label>
          <mat-select formControlName="bodyId" data-testid="mission-body">
            @for (b of bodies() ?? []; track b.id) {
              <mat-option [value]="b.id">{{ b.name }} ({{ b.workspaceId ? 'the workspace’s own body' : b.kind }})</mat-option>
            }
          </mat-select>
          <mat-error>{{ problems()['bodyId'] ?? 'Choose the body the spacecraft orbits.' }}</mat-error>
        </mat-form-field>
        <div class="dates">
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>Start (UTC date)</mat-label>
            <input matInput type="text" inputmode="numeric" autocomplete="off" placeholder="YYYY-MM-DD" formControlName="startDate" data-testid="mission-start" />
            <mat-error>{{ problems()['startDate'] ?? 'Give the start date as YYYY-MM-DD, e.g. 2027-06-01.' }}</mat-error>
          </mat-form-field>
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>End (UTC date)</mat-label>
            <input matInput type="text" inputmode="numeric" autocomplete="off" placeholder="YYYY-MM-DD" formControlName="endDate" data-testid="mission-end" />
            <mat-error data-testid="mission-end-error">{{ problems()['endDate'] ?? 'Give the end date as YYYY-MM-DD, e.g. 2028-06-01.' }}</mat-error>
          </mat-form-field>
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
      <mat-dialog-actions align="end">
        <button mat-button type="button" (click)="dialogRef.close()">Cancel</button>
        <button mat-flat-button type="submit" [disabled]="submit.busy()" data-testid="mission-save">
          {{ data.mission ? 'Save' : 'Create mission' }}
        </button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .fields {
      display: flex;
      flex-direction: column;
      gap: 4px;
      min-width: min(480px, 80vw);
    }
    .dates {
      display: flex;
      flex-wrap: wrap;
      gap: 0 12px;
    }
    .dates mat-form-field {
      flex: 1 1 180px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MissionFormDialog {
  private readonly api = inject(MissionApi);
  protected readonly data = inject<MissionFormData>(MAT_DIALOG_DATA);
  protected readonly dialogRef = inject<MatDialogRef<MissionFormDialog, Mission>>(MatDialogRef);
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
