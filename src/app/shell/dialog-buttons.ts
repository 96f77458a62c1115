import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialogClose } from '@angular/material/dialog';

/**
 * A form dialog's Cancel and submit buttons, put on its actions row:
 * `<mat-dialog-actions align="end" eclDialogButtons [busy]="submit.busy()" label="Save" testid="mode-save" />`.
 * The submit is disabled while the request runs (`dialogSubmit`'s `busy`); buttons placed inside stand
 * between the two (e.g. "Load the latest").
 */
@Component({
  selector: '[eclDialogButtons]',
  imports: [MatButton, MatDialogClose],
  template: `
    <button mat-button type="button" mat-dialog-close [disabled]="cancelLocked() && busy()">Cancel</button>
    <ng-content />
    <button mat-flat-button type="submit" [attr.form]="formId()" [disabled]="busy()" [attr.data-testid]="testid()">{{ label() }}</button>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DialogButtons {
  /** The submit's words, e.g. "Save", "Add mode", "Derive". */
  readonly label = input.required<string>();
  readonly testid = input.required<string>();
  readonly busy = input(false);
  /** Cancel too is disabled while the request runs (a computation the dialog waits on to report it). */
  readonly cancelLocked = input(false);
  /** The id of the form submitted, when the buttons stand outside it. */
  readonly formId = input<string | null>(null);
}
