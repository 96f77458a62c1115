// The submit of every form dialog: an invalid form shows its errors and sends nothing; a valid one
// is disabled while its request runs (so nothing can change under it), the dialog closes with the
// answer, and a refusal enables the form again with the server's message in the user's words.
// (enable() enables every control: a form that keeps some disabled on purpose would have to restore
// them in its refusal handler.) A form on a page (not in a dialog) takes the same path through
// pageSubmit: the answer readies the form for the next one instead of closing anything.
import { HttpErrorResponse } from '@angular/common/http';
import { inject, signal } from '@angular/core';
import type { AbstractControl, FormGroupDirective } from '@angular/forms';
import { MatDialogRef } from '@angular/material/dialog';
import type { Observable } from 'rxjs';
import { apiErrorMessage } from '../api/api-error-message';

/** The part of a MatDialogRef the submit needs. */
export interface ClosableDialog<R> {
  close(result?: R): void;
}

/** A refusal's per-field details (the API's error shape), so a dialog can put each under its field. */
export interface RefusalDetail {
  readonly path?: string;
  readonly message: string;
}

export function refusalDetails(failure: unknown): readonly RefusalDetail[] {
  if (!(failure instanceof HttpErrorResponse)) return [];
  return (failure.error as { error?: { details?: RefusalDetail[] } } | null)?.error?.details ?? [];
}

/**
 * Told of a refusal after the form is enabled again (so errors it sets on controls stay); answering
 * 'placed' says every part of it was put beside its field, and the general message is left out.
 */
export type RefusalHandler = (failure: unknown) => 'placed' | void;

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
   * disabled, so it reads the values as typed; it may answer null to send nothing).
   */
  submit(request: () => Observable<R> | null, refused?: RefusalHandler): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const answer = request();
    if (answer) this.send(answer, refused);
  }

  /** Sends without checking the form (e.g. reloading what the server holds), closing with the answer. */
  send(request: Observable<R>, refused?: RefusalHandler): void {
    this.busy.set(true);
    this.failure.set(null);
    this.form.disable();
    request.subscribe({
      next: (answer) => this.dialogRef.close(answer),
      error: (failure: unknown) => {
        this.busy.set(false);
        this.form.enable();
        if (refused?.(failure) !== 'placed') this.failure.set(apiErrorMessage(failure));
      },
    });
  }
}

/** A DialogSubmit for the dialog being constructed; call in its injection context. */
export function dialogSubmit<R>(form: AbstractControl): DialogSubmit<R> {
  return new DialogSubmit<R>(inject<MatDialogRef<unknown, R>>(MatDialogRef), form);
}

/**
 * A DialogSubmit for a form on a page: after an answer the form is enabled again and emptied through
 * its directive (which also forgets the submit, so the emptied fields show no errors), then `done`
 * gets the answer. `directive` is the page's viewChild(FormGroupDirective).
 */
export function pageSubmit<R>(
  form: AbstractControl,
  directive: () => FormGroupDirective | undefined,
  done: (answer: R) => void,
): DialogSubmit<R> {
  const submit: DialogSubmit<R> = new DialogSubmit<R>(
    {
      close: (answer) => {
        submit.busy.set(false);
        form.enable();
        directive()?.resetForm();
        done(answer as R);
      },
    },
    form,
  );
  return submit;
}

/**
 * A RefusalHandler that puts each detail whose path is one of `fields` beside its field (`show`);
 * the general message stays for a refusal without details or with one for no field of the form.
 */
export function placedBeside<F extends string>(fields: Readonly<Record<F, unknown>>, show: (field: F, message: string) => void): RefusalHandler {
  return (failure) => {
    const details = refusalDetails(failure);
    let unplaced = details.length === 0;
    for (const d of details) {
      if (d.path && d.path in fields) show(d.path as F, d.message);
      else unplaced = true;
    }
    return unplaced ? undefined : 'placed';
  };
}
