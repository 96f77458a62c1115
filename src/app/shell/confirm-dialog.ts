import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle } from '@angular/material/dialog';
import { Observable, map } from 'rxjs';

export interface ConfirmQuestion {
  readonly title: string;
  readonly message: string;
  /** The verb on the button, e.g. "Revoke"; says what will happen. */
  readonly confirmLabel: string;
}

/** A yes/no question before something that cannot be undone. */
@Component({
  selector: 'ecl-confirm-dialog',
  imports: [MatButton, MatDialogTitle, MatDialogContent, MatDialogActions, MatDialogClose],
  template: `
    <h2 mat-dialog-title>{{ question.title }}</h2>
    <mat-dialog-content>{{ question.message }}</mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button [mat-dialog-close]="false">Cancel</button>
      <button mat-flat-button [mat-dialog-close]="true" data-testid="confirm">{{ question.confirmLabel }}</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConfirmDialog {
  protected readonly question = inject<ConfirmQuestion>(MAT_DIALOG_DATA);

  /** Opens the dialog; emits true only when the user confirmed. */
  static ask(dialog: MatDialog, question: ConfirmQuestion): Observable<boolean> {
    return dialog
      .open<ConfirmDialog, ConfirmQuestion, boolean>(ConfirmDialog, { data: question, width: '420px' })
      .afterClosed()
      .pipe(map((answer) => answer === true));
  }
}
