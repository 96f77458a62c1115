import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { apiErrorMessage } from '../api/api-error-message';
import { AuthSession } from './auth-session';
import { safeReturnUrl } from './signed-in-guard';

@Component({
  selector: 'ecl-sign-in-page',
  imports: [ReactiveFormsModule, RouterLink, MatFormField, MatLabel, MatError, MatInput, MatButton],
  templateUrl: './sign-in-page.html',
  styleUrl: './auth-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignInPage {
  private readonly session = inject(AuthSession);
  private readonly router = inject(Router);

  /** Where the user was going when sign-in was asked for (query parameter). */
  readonly returnUrl = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', Validators.required],
  });
  protected readonly failure = signal<string | null>(null);
  protected readonly busy = signal(false);

  protected signIn(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    this.session.signIn(this.form.getRawValue()).subscribe({
      next: () => void this.router.navigateByUrl(safeReturnUrl(this.returnUrl())),
      // 401 (wrong e-mail or password) and 429 (too many tries) carry the server's own sentence.
      error: (failure: unknown) => {
        this.failure.set(apiErrorMessage(failure));
        this.busy.set(false);
      },
    });
  }
}
