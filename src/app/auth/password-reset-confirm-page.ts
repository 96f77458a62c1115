import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { apiErrorMessage } from '../api/api-error-message';
import { apiPath } from '../api/api-path';
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH, matchingPasswords } from './matching-passwords';

@Component({
  selector: 'ecl-password-reset-confirm-page',
  imports: [ReactiveFormsModule, RouterLink, MatFormField, MatLabel, MatHint, MatError, MatInput, MatButton],
  template: `
    <main class="auth-page">
      <section class="auth-card" aria-labelledby="new-password-title">
        <p class="brand">Eclipta</p>
        <h1 id="new-password-title">Choose a new password</h1>
        @if (done()) {
          <p role="status">{{ done() }}</p>
          <p><a routerLink="/sign-in" data-testid="reset-done-sign-in">Sign in with the new password</a></p>
        } @else {
          <form class="ecl-form" [formGroup]="form" (ngSubmit)="setPassword()" novalidate>
            <mat-form-field appearance="outline">
              <mat-label>New password</mat-label>
              <input matInput type="password" formControlName="password" autocomplete="new-password" />
              <mat-hint>At least {{ minLength }} characters</mat-hint>
              @if (form.controls.password.invalid) {
                <mat-error>A password needs {{ minLength }} to {{ maxLength }} characters.</mat-error>
              }
            </mat-form-field>
            <mat-form-field appearance="outline">
              <mat-label>New password again</mat-label>
              <input matInput type="password" formControlName="repeat" autocomplete="new-password" />
            </mat-form-field>
            @if (form.hasError('mismatch') && form.controls.repeat.touched) {
              <p class="ecl-error" role="alert">The two passwords differ.</p>
            }
            @if (failure(); as message) {
              <p class="ecl-error" role="alert">{{ message }}</p>
            }
            <button mat-flat-button type="submit" [disabled]="busy()">Set the password</button>
          </form>
        }
      </section>
    </main>
  `,
  styleUrl: './auth-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PasswordResetConfirmPage {
  private readonly http = inject(HttpClient);

  /** The one-time token from the e-mailed link (route parameter). */
  readonly token = input.required<string>();

  protected readonly minLength = PASSWORD_MIN_LENGTH;
  protected readonly maxLength = PASSWORD_MAX_LENGTH;
  protected readonly form = inject(NonNullableFormBuilder).group(
    {
      password: ['', [Validators.required, Validators.minLength(PASSWORD_MIN_LENGTH), Validators.maxLength(PASSWORD_MAX_LENGTH)]],
      repeat: ['', Validators.required],
    },
    { validators: matchingPasswords },
  );
  /** The server's confirmation (which sessions ended, which API tokens were revoked), once done. */
  protected readonly done = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected setPassword(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    const body = { token: this.token(), password: this.form.controls.password.value };
    this.http.post<{ message: string }>(apiPath('auth', 'password-reset', 'confirm'), body).subscribe({
      next: (answer) => this.done.set(answer.message),
      error: (failure: unknown) => {
        this.failure.set(apiErrorMessage(failure));
        this.busy.set(false);
      },
    });
  }
}
