import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogActions, MatDialogContent, MatDialogTitle } from '@angular/material/dialog';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import type { CaseDetail, CaseUpdate } from '../../../shared/api/cases';
import { DialogButtons } from '../shell/dialog-buttons';
import { dialogSubmit } from '../shell/dialog-submit';
import { CaseApi } from './case-api';
import { MarginFields, marginGroup } from './margin-fields';

/**
 * Renames a draft or changes its margins; the server recomputes. A released case answers 409, shown
 * here, and so does a draft someone else changed since it was opened (the edit names its version).
 */
@Component({
  selector: 'ecl-case-edit-dialog',
  imports: [
    ReactiveFormsModule, MatButton, MatDialogTitle, MatDialogContent, MatDialogActions, DialogButtons,
    MatFormField, MatLabel, MatError, MatInput, MatProgressBar, MarginFields,
  ],
  template: `
    <h2 mat-dialog-title>Edit {{ c.name }}</h2>
    <mat-dialog-content>
      <form class="ecl-form" [formGroup]="form" (ngSubmit)="saveCase()" id="edit-form" novalidate>
        <mat-form-field appearance="outline">
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" data-testid="edit-name" />
          <mat-error>Give the case a name (at most 120 characters).</mat-error>
        </mat-form-field>
        <ecl-margin-fields [group]="form.controls.margins" testIdPrefix="edit" />
      </form>
      @if (submit.busy()) {
        <mat-progress-bar mode="indeterminate" aria-label="Saving and recomputing" />
      }
      @if (submit.failure(); as message) {
        <p class="ecl-error refusal" role="alert" data-testid="edit-error">{{ message }}</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end" eclDialogButtons [busy]="submit.busy()" [cancelLocked]="true" formId="edit-form" label="Save" testid="edit-save">
      @if (stale()) {
        <button mat-stroked-button type="button" (click)="loadLatest()" [disabled]="submit.busy()" data-testid="edit-reload">Load the latest</button>
      }
    </mat-dialog-actions>
  `,
  styleUrl: './case-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseEditDialog {
  private readonly api = inject(CaseApi);
  protected readonly c = inject<CaseDetail>(MAT_DIALOG_DATA);

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.c.name, [Validators.required, Validators.maxLength(120)]],
    margins: marginGroup(inject(NonNullableFormBuilder), this.c.inputs.margins),
  });
  protected readonly submit = dialogSubmit<CaseDetail>(this.form);
  /** Someone changed the draft since this dialog opened: the server kept their change (409). */
  protected readonly stale = signal(false);

  protected saveCase(): void {
    this.submit.submit(
      () => {
        const v = this.form.getRawValue();
        const body: CaseUpdate = {
          // The version this edit was made on: if the draft changed meanwhile the server answers 409.
          version: this.c.version,
          ...(v.name.trim() !== this.c.name ? { name: v.name.trim() } : {}),
          margins: v.margins,
        };
        return this.api.update(this.c.id, body);
      },
      (failure) => this.stale.set(failure instanceof HttpErrorResponse && failure.status === 409 && this.c.status === 'draft'),
    );
  }

  /** Closes with the stored draft, so the page shows the other change; the user edits again from there. */
  protected loadLatest(): void {
    this.submit.send(this.api.get(this.c.id));
  }
}
