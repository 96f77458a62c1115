import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialog, MatDialogActions, MatDialogContent, MatDialogTitle } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { Observable } from 'rxjs';
import type { Material } from '../../../shared/api/missions';
import { MissionApi } from '../missions/mission-api';
import { DialogButtons } from '../shell/dialog-buttons';
import { dialogSubmit } from '../shell/dialog-submit';

const fraction = [Validators.required, Validators.min(0), Validators.max(1)];

/** A workspace's own surface finish, beside the built-in library. */
@Component({
  selector: 'ecl-material-dialog',
  imports: [ReactiveFormsModule, MatDialogTitle, MatDialogContent, MatDialogActions, DialogButtons, MatFormField, MatLabel, MatInput, MatError, MatHint],
  template: `
    <h2 mat-dialog-title>Add a material</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <mat-form-field appearance="outline">
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" data-testid="material-name" />
          <mat-error>Give the material a name.</mat-error>
        </mat-form-field>
        <div class="pairs">
          @for (f of optical; track f.key) {
            <mat-form-field appearance="outline">
              <mat-label>{{ f.label }}</mat-label>
              <input matInput type="number" step="0.01" min="0" max="1" [formControlName]="f.key" [attr.data-testid]="'material-' + f.key" />
              <mat-error>{{ f.symbol }} is a fraction from 0 to 1.</mat-error>
            </mat-form-field>
          }
        </div>
        <mat-form-field appearance="outline">
          <mat-label>Source of the values</mat-label>
          <input matInput formControlName="source" data-testid="material-source" />
          <mat-hint>A datasheet, a measurement report, a handbook table.</mat-hint>
        </mat-form-field>
        @if (submit.failure(); as message) {
          <p class="ecl-error" role="alert">{{ message }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end" eclDialogButtons [busy]="submit.busy()" label="Add material" testid="material-save" />
    </form>
  `,
  styles: `
    .fields { display: flex; flex-direction: column; gap: 4px; min-width: min(480px, 80vw); }
    .pairs { display: grid; grid-template-columns: 1fr 1fr; gap: 0 12px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialDialog {
  private readonly api = inject(MissionApi);
  private readonly workspaceId = inject<string>(MAT_DIALOG_DATA);
  protected readonly optical = [
    { key: 'absorptivityBol', label: 'Solar absorptivity α, BOL', symbol: 'α' },
    { key: 'emissivityBol', label: 'IR emissivity ε, BOL', symbol: 'ε' },
    { key: 'absorptivityEol', label: 'Solar absorptivity α, EOL', symbol: 'α' },
    { key: 'emissivityEol', label: 'IR emissivity ε, EOL', symbol: 'ε' },
  ] as const;

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', Validators.required],
    absorptivityBol: [0.5, fraction],
    emissivityBol: [0.5, fraction],
    absorptivityEol: [0.5, fraction],
    emissivityEol: [0.5, fraction],
    source: '',
  });
  protected readonly submit = dialogSubmit<Material>(this.form);

  static open(dialog: MatDialog, workspaceId: string): Observable<Material | undefined> {
    return dialog.open<MaterialDialog, string, Material>(MaterialDialog, { data: workspaceId, width: '560px' }).afterClosed();
  }

  protected save(): void {
    this.submit.submit(() => {
      const value = this.form.getRawValue();
      return this.api.createMaterial(this.workspaceId, { ...value, name: value.name.trim(), source: value.source.trim() || undefined });
    });
  }
}
