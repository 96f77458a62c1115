import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogRef, MatDialogTitle } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import type { CaseDetail, CaseUpdate } from '../../../shared/api/cases';
import { apiErrorMessage } from '../api/api-error-message';
import { CaseApi } from './case-api';
import { heatLoadMarginHint, temperatureMarginHint } from './case-margins';

/** Renames a draft or changes its margins; the server recomputes. A released case answers 409, shown here. */
@Component({
  selector: 'ecl-case-edit-dialog',
  imports: [
    ReactiveFormsModule, MatButton, MatDialogTitle, MatDialogContent, MatDialogActions, MatDialogClose,
    MatFormField, MatLabel, MatHint, MatError, MatSuffix, MatInput, MatProgressBar,
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
        <div class="row">
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>Heat-load margin</mat-label>
            <input matInput type="number" min="0" max="200" formControlName="heatLoadPercent" data-testid="edit-heat-margin" />
            <span matTextSuffix>%</span>
            <mat-hint>{{ heatHint() }}</mat-hint>
            <mat-error>0 to 200 %.</mat-error>
          </mat-form-field>
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>Temperature margin</mat-label>
            <input matInput type="number" min="0" max="100" formControlName="temperatureMarginC" data-testid="edit-temperature-margin" />
            <span matTextSuffix>°C</span>
            <mat-hint>{{ temperatureHint() }}</mat-hint>
            <mat-error>0 to 100 °C.</mat-error>
          </mat-form-field>
        </div>
      </form>
      @if (busy()) {
        <mat-progress-bar mode="indeterminate" aria-label="Saving and recomputing" />
      }
      @if (failure(); as message) {
        <p class="ecl-error refusal" role="alert" data-testid="edit-error">{{ message }}</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close [disabled]="busy()">Cancel</button>
      <button mat-flat-button type="submit" form="edit-form" [disabled]="busy()" data-testid="edit-save">Save</button>
    </mat-dialog-actions>
  `,
  styleUrl: './case-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseEditDialog {
  private readonly api = inject(CaseApi);
  private readonly dialogRef = inject<MatDialogRef<CaseEditDialog, CaseDetail>>(MatDialogRef);
  protected readonly c = inject<CaseDetail>(MAT_DIALOG_DATA);

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.c.name, [Validators.required, Validators.maxLength(120)]],
    heatLoadPercent: [this.c.inputs.margins.heatLoadPercent, [Validators.required, Validators.min(0), Validators.max(200)]],
    temperatureMarginC: [this.c.inputs.margins.temperatureMarginC, [Validators.required, Validators.min(0), Validators.max(100)]],
  });
  private readonly values = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly heatHint = computed(() => heatLoadMarginHint(this.values().heatLoadPercent ?? null));
  protected readonly temperatureHint = computed(() => temperatureMarginHint(this.values().temperatureMarginC ?? null));
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected saveCase(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const body: CaseUpdate = {
      ...(v.name.trim() !== this.c.name ? { name: v.name.trim() } : {}),
      margins: { heatLoadPercent: v.heatLoadPercent, temperatureMarginC: v.temperatureMarginC },
    };
    this.busy.set(true);
    this.failure.set(null);
    this.api.update(this.c.id, body).subscribe({
      next: (saved) => this.dialogRef.close(saved),
      error: (failure: unknown) => {
        this.busy.set(false);
        this.failure.set(apiErrorMessage(failure));
      },
    });
  }
}
