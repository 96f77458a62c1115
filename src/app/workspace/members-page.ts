import { ChangeDetectionStrategy, Component, computed, inject, input, viewChild } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { BehaviorSubject, combineLatest, filter, switchMap } from 'rxjs';
import { roleLabels, roles, type Role } from '../../../shared/api/plain-lists';
import type { Invitation, Member } from '../../../shared/api/workspaces';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { AuthSession } from '../auth/auth-session';
import { ConfirmDialog } from '../shell/confirm-dialog';
import { pageSubmit } from '../shell/dialog-submit';
import { RowActions } from '../shell/row-actions';
import { RoleLabelPipe } from './role-label-pipe';
import { WorkspaceApi } from './workspace-api';
import { UtcTimePipe } from '../time/utc-time-pipe';

/** The owner's page for who is in the workspace, with which role, and who is invited. */
@Component({
  selector: 'ecl-members-page',
  imports: [
    RowActions,
    ReactiveFormsModule,
    UtcTimePipe,
    RoleLabelPipe,
    MatTableModule,
    MatFormField,
    MatLabel,
    MatError,
    MatInput,
    MatSelect,
    MatOption,
    MatButton,
  ],
  templateUrl: './members-page.html',
  styleUrl: './members-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MembersPage {
  private readonly api = inject(WorkspaceApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(AuthSession);
  private readonly refresh = new BehaviorSubject<void>(undefined);

  /** From the route /w/:workspaceId/members. */
  readonly workspaceId = input.required<string>();

  protected readonly roles = roles;
  protected readonly myUserId = computed(() => this.session.user()?.id ?? null);
  protected readonly memberColumns = ['name', 'email', 'role', 'joined', 'actions'];
  protected readonly invitationColumns = ['email', 'role', 'invitedBy', 'expires', 'actions'];

  private readonly context = combineLatest([toObservable(this.workspaceId), this.refresh]);
  protected readonly members = toSignal(this.context.pipe(switchMap(([id]) => this.api.members(id).pipe(loaded()))));
  protected readonly invitations = toSignal(
    this.context.pipe(switchMap(([id]) => this.api.invitations(id).pipe(loaded()))),
  );
  protected readonly pending = computed(() => {
    const state = this.invitations();
    return state?.status === 'ready' ? state.value.items.filter((i) => i.acceptedAt === null) : [];
  });

  protected readonly inviteForm = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    role: ['viewer' as Role, Validators.required],
  });

  protected changeRole(member: Member, role: Role): void {
    this.api.changeRole(this.workspaceId(), member.userId, role).subscribe({
      next: () => {
        this.snackBar.open(`${member.name}’s role is now ${roleLabels[role]}.`, undefined, { duration: 3000 });
        this.refresh.next();
      },
      // e.g. 409 when the last owner would be demoted; reload so the select shows the real role again.
      error: (failure: unknown) => {
        this.snackBar.open(apiErrorMessage(failure), 'Close');
        this.refresh.next();
      },
    });
  }

  protected remove(member: Member): void {
    ConfirmDialog.ask(this.dialog, {
      title: `Remove ${member.name}?`,
      message: `${member.email} loses access to this workspace at once. They can be invited again later.`,
      confirmLabel: 'Remove',
    })
      .pipe(
        filter((yes) => yes),
        switchMap(() => this.api.removeMember(this.workspaceId(), member.userId)),
      )
      .subscribe({
        next: () => this.refresh.next(),
        error: (failure: unknown) => this.snackBar.open(apiErrorMessage(failure), 'Close'),
      });
  }

  private readonly formDirective = viewChild(FormGroupDirective);
  /** Sends the invitation; the emptied form shows no errors afterwards (pageSubmit). */
  protected readonly inviteSubmit = pageSubmit<Invitation>(this.inviteForm, this.formDirective, (made) => {
    this.snackBar.open(`Invitation sent to ${made.email}.`, undefined, { duration: 3000 });
    this.refresh.next();
  });

  protected invite(): void {
    this.inviteSubmit.submit(() => {
      const { email, role } = this.inviteForm.getRawValue();
      return this.api.invite(this.workspaceId(), { email: email.trim().toLowerCase(), role });
    });
  }

  protected revokeInvitation(invitation: Invitation): void {
    ConfirmDialog.ask(this.dialog, {
      title: 'Revoke the invitation?',
      message: `The link sent to ${invitation.email} stops working.`,
      confirmLabel: 'Revoke',
    })
      .pipe(
        filter((yes) => yes),
        switchMap(() => this.api.revokeInvitation(this.workspaceId(), invitation.id)),
      )
      .subscribe({
        next: () => this.refresh.next(),
        error: (failure: unknown) => this.snackBar.open(apiErrorMessage(failure), 'Close'),
      });
  }
}
