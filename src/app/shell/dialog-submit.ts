// The submit of every form dialog: an invalid form shows its errors and sends nothing; a valid one
// is disabled while its request runs (so nothing can change under it), the dialog closes with the
// answer, and a refusal enables the form again with the server's message in the user's words.
import { inject, signal } from '@angular/core';
import type { AbstractControl } from '@angular/forms';
import { MatDialogRef } from '@angular/material/dialog';
import type { Observable } from 'rxjs';
import { apiErrorMessage } from '../api/api-error-message';

/** The part of a MatDialogRef the submit needs. */
export interface ClosableDialog<R> {
  close(result?: R): void;
}

export class DialogSubmit<R> {
  /** A request is running: the template shows progress and disables the buttons. */
  readonly busy = signal(false);
  /** The last refusal in the user's words; null while none. */
  readonly failure = signal<string | null>(null);

  constructor(
    private readonly dialogRef: ClosableDialog<R>,
    private readonly form: AbstractControl,
  ) {}

  /**
   * Checks the form, then sends what `request` builds from it (called before the form is
   * disabled, so it reads the values as typed). `refused` hears the failure after the message is set.
   */
  submit(request: () => Observable<R>, refused?: (failure: unknown) => void): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.send(request(), refused);
  }

  /** Sends without checking the form (e.g. reloading what the server holds), closing with the answer. */
  send(request: Observable<R>, refused?: (failure: unknown) => void): void {
    this.busy.set(true);
    this.failure.set(null);
    this.form.disable();
    request.subscribe({
      next: (answer) => this.dialogRef.close(answer),
      error: (failure: unknown) => {
        this.busy.set(false);
        this.form.enable();
        this.failure.set(apiErrorMessage(failure));
        refused?.(failure);
      },
    });
  }
}

/** A DialogSubmit for the dialog being constructed; call in its injection context. */
export function dialogSubmit<R>(form: AbstractControl): DialogSubmit<R> {
  return new DialogSubmit<R>(inject<MatDialogRef<unknown, R>>(MatDialogRef), form);
}
