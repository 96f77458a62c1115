import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { Router } from '@angular/router';
import type { InvitationAccept, InvitationPreview, MeResponse } from '../../../shared/api/auth';
import { apiErrorMessage } from '../api/api-error-message';
import { apiPath } from '../api/api-path';
import { type Loaded, loaded } from '../api/loaded';
import { RoleLabelPipe } from '../workspace/role-label-pipe';
import { AuthSession } from './auth-session';
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from './matching-passwords';

@Component({
  selector: 'ecl-invitation-page',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatHint, MatError, MatInput, MatButton, RoleLabelPipe],
  templateUrl: './invitation-page.html',
  styleUrl: './auth-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InvitationPage implements OnInit {
  private readonly http = inject(HttpClient);
  private readonly session = inject(AuthSession);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);

  /** The invitation's secret from the e-mailed link (route parameter). */
  readonly token = input.required<string>();

  protected readonly minLength = PASSWORD_MIN_LENGTH;
  private readonly previewState = signal<Loaded<InvitationPreview>>({ status: 'loading' });
  protected readonly preview = this.previewState.asReadonly();
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.maxLength(120)]],
    password: ['', [Validators.required, Validators.minLength(PASSWORD_MIN_LENGTH), Validators.maxLength(PASSWORD_MAX_LENGTH)]],
  });
  protected readonly failure = signal<string | null>(null);
  protected readonly busy = signal(false);

  ngOnInit(): void {
    // The token input is bound only now; the preview is fetched once per visit.
    this.http
      .get<InvitationPreview>(apiPath('invitations', this.token()))
      .pipe(loaded(), takeUntilDestroyed(this.destroyRef))
      .subscribe((next) => {
        this.previewState.set(next);
        // A new account needs a name; an existing one signs in with its own password.
        if (next.status === 'ready' && !next.value.existingUser) {
          this.form.controls.name.addValidators(Validators.required);
          this.form.controls.name.updateValueAndValidity();
        }
      });
  }

  protected accept(invitation: InvitationPreview): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, password } = this.form.getRawValue();
    const body: InvitationAccept = invitation.existingUser ? { password } : { name: name.trim(), password };
    this.busy.set(true);
    this.failure.set(null);
    this.http.post<MeResponse>(apiPath('invitations', this.token(), 'accept'), body).subscribe({
      next: (me) => {
        this.session.adopt(me);
        void this.router.navigateByUrl('/');
      },
      error: (failure: unknown) => {
        this.failure.set(apiErrorMessage(failure));
        this.busy.set(false);
      },
    });
  }
}
