import { Clipboard } from '@angular/cdk/clipboard';
import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { MatTooltip } from '@angular/material/tooltip';
import { BehaviorSubject, filter, switchMap } from 'rxjs';
import type { ApiToken, TokenCreate, TokenCreated } from '../../../shared/api/auth';
import { apiErrorMessage } from '../api/api-error-message';
import { apiPath } from '../api/api-path';
import { loaded } from '../api/loaded';
import { ConfirmDialog } from '../shell/confirm-dialog';
import { pageSubmit } from '../shell/dialog-submit';
import { RowActions } from '../shell/row-actions';
import { UtcTimePipe } from '../time/utc-time-pipe';

/** Personal API tokens: other teams' scripts import released cases with them. */
@Component({
  selector: 'ecl-api-tokens-page',
  imports: [
    RowActions,
    ReactiveFormsModule,
    UtcTimePipe,
    MatTableModule,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatInput,
    MatCheckbox,
    MatButton,
    MatIconButton,
    MatIcon,
    MatTooltip,
  ],
  templateUrl: './api-tokens-page.html',
  styleUrl: './api-tokens-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApiTokensPage {
  private readonly http = inject(HttpClient);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly clipboard = inject(Clipboard);
  private readonly refresh = new BehaviorSubject<void>(undefined);

  protected readonly columns = ['name', 'prefix', 'access', 'created', 'lastUsed', 'expires', 'actions'];
  protected readonly tokens = toSignal(
    this.refresh.pipe(switchMap(() => this.http.get<{ items: ApiToken[] }>(apiPath('tokens')).pipe(loaded()))),
    { requireSync: true },
  );

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(80)]],
    readOnly: [true],
    expiresInDays: [null as number | null, [Validators.min(1), Validators.max(3650)]],
  });
  /** The secret of the token just made; the server shows it this once. */
  protected readonly created = signal<TokenCreated | null>(null);
  private readonly formDirective = viewChild(FormGroupDirective);
  /** Makes the token; the emptied form shows no errors afterwards (pageSubmit). */
  protected readonly submit = pageSubmit<TokenCreated>(this.form, this.formDirective, (made) => {
    this.created.set(made);
    this.refresh.next();
  });

  protected createToken(): void {
    this.submit.submit(() => {
      const { name, readOnly, expiresInDays } = this.form.getRawValue();
      const body: TokenCreate = { name: name.trim(), readOnly, ...(expiresInDays ? { expiresInDays } : {}) };
      return this.http.post<TokenCreated>(apiPath('tokens'), body);
    });
  }

  protected copySecret(secret: string): void {
    const copied = this.clipboard.copy(secret);
    this.snackBar.open(copied ? 'Token copied.' : 'Copying failed; select the text and copy it.', undefined, { duration: 3000 });
  }

  protected revoke(token: ApiToken): void {
    ConfirmDialog.ask(this.dialog, {
      title: 'Revoke this token?',
      message: `Scripts using "${token.name}" (${token.prefix}…) stop working at once. This cannot be undone.`,
      confirmLabel: 'Revoke',
    })
      .pipe(
        filter((yes) => yes),
        switchMap(() => this.http.delete(apiPath('tokens', token.id))),
      )
      .subscribe({
        next: () => {
          if (this.created()?.token.id === token.id) this.created.set(null);
          this.refresh.next();
        },
        error: (failure: unknown) => this.snackBar.open(apiErrorMessage(failure), 'Close'),
      });
  }
}
