import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { apiErrorMessage } from '../api/api-error-message';
import { apiPath } from '../api/api-path';

@Component({
  selector: 'ecl-password-reset-request-page',
  imports: [ReactiveFormsModule, RouterLink, MatFormField, MatLabel, MatError, MatInput, MatButton],
  template: `
    <main class="auth-page">
      <section class="auth-card" aria-labelledby="reset-title">
        <p class="brand">Eclipta</p>
        <h1 id="reset-title">Reset your password</h1>
        @if (sent()) {
          <p role="status" data-testid="reset-sent">If an account exists for that address, we have sent a link.</p>
        } @else {
          <form class="ecl-form" [formGroup]="form" (ngSubmit)="requestLink()" novalidate>
            <mat-form-field appearance="outline">
              <mat-label>E-mail address</mat-label>
              <input matInput type="email" formControlName="email" autocomplete="email" data-testid="reset-email" />
              @if (form.controls.email.invalid) {
                <mat-error>Enter the e-mail address you sign in with.</mat-error>
              }
            </mat-form-field>
            @if (failure(); as message) {
              <p class="ecl-error" role="alert">{{ message }}</p>
            }
            <button mat-flat-button type="submit" [disabled]="busy()">Send a reset link</button>
          </form>
        }
        <p class="aside"><a routerLink="/sign-in">Back to sign in</a></p>
      </section>
    </main>
  `,
  styleUrl: './auth-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PasswordResetRequestPage {
  private readonly http = inject(HttpClient);
  protected readonly form = inject(NonNullableFormBuilder).group({ email: ['', [Validators.required, Validators.email]] });
  protected readonly sent = signal(false);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected requestLink(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.http.post(apiPath('auth', 'password-reset'), this.form.getRawValue()).subscribe({
      next: () => this.sent.set(true),
      error: (failure: unknown) => {
        this.failure.set(apiErrorMessage(failure));
        this.busy.set(false);
      },
    });
  }
}
