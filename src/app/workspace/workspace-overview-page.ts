import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { RouterLink } from '@angular/router';
import { AuthSession } from '../auth/auth-session';
import { navEntriesFor } from '../shell/navigation';
import { CurrentWorkspace } from './current-workspace';
import { ROLE_ABILITIES, ROLE_ORDER } from './role-abilities';

/** The workspace's front page: who you are here and what your role lets you do. */
@Component({
  selector: 'ecl-workspace-overview-page',
  imports: [RouterLink],
  template: `
    @if (workspace.membership(); as m) {
      <section class="ecl-page">
        <h1 data-testid="overview-title">{{ m.workspaceName }}</h1>
        <p>
          You are signed in as <strong>{{ session.user()?.name }}</strong> with the role
          <strong data-testid="overview-role">{{ m.role }}</strong> ({{ abilities()?.who }}).
        </p>
        <h2>Your role may</h2>
        <ul>
          @for (line of abilities()?.may; track line) {
            <li>{{ line }}</li>
          }
        </ul>
        <h2>Open</h2>
        <ul class="links">
          @for (entry of entries(); track entry.id) {
            <li><a [routerLink]="entry.link">{{ entry.label }}</a></li>
          }
        </ul>
        <h2>Roles in a workspace</h2>
        <div class="ecl-table-wrap">
          <table class="roles">
            <thead>
              <tr>
                <th scope="col">Role</th>
                <th scope="col">Who</th>
                <th scope="col">May</th>
              </tr>
            </thead>
            <tbody>
              @for (role of roleOrder; track role) {
                <tr [class.mine]="role === m.role">
                  <th scope="row">{{ role }}@if (role === m.role) { <span class="ecl-muted"> (you)</span> }</th>
                  <td>{{ abilitiesOf[role].who }}</td>
                  <td>{{ abilitiesOf[role].may.join('; ') }}</td>
                </tr>
              }
            </tbody>
          </table>
        </div>
      </section>
    }
  `,
  styles: `
    .roles {
      width: 100%;
      border-collapse: collapse;
      font: var(--mat-sys-body-medium);
    }
    .roles th,
    .roles td {
      text-align: left;
      padding: 6px 12px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      vertical-align: top;
    }
    .roles tr.mine {
      background: var(--mat-sys-secondary-container);
    }
    .links {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 24px;
      padding: 0;
      list-style: none;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkspaceOverviewPage {
  protected readonly session = inject(AuthSession);
  protected readonly workspace = inject(CurrentWorkspace);
  protected readonly roleOrder = ROLE_ORDER;
  protected readonly abilitiesOf = ROLE_ABILITIES;
  protected readonly abilities = computed(() => {
    const role = this.workspace.role();
    return role ? ROLE_ABILITIES[role] : null;
  });
  protected readonly entries = computed(() =>
    navEntriesFor(this.workspace.membership(), this.session.user()?.isAdmin ?? false).filter((e) => e.id !== 'overview'),
  );
}
