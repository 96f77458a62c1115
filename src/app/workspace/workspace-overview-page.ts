import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { EMPTY, switchMap } from 'rxjs';
import type { WorkspaceOverview } from '../../../shared/api/cases';
import { loaded, type Loaded } from '../api/loaded';
import { CaseApi } from '../cases/case-api';
import { CaseKindLabel } from '../cases/case-kind-label';
import { CaseStatusChip } from '../cases/case-status-chip';
import { UtcTimePipe } from '../time/utc-time-pipe';
import { AuthSession } from '../auth/auth-session';
import { navEntriesFor } from '../shell/navigation';
import { CurrentWorkspace } from './current-workspace';
import { ROLE_ABILITIES, ROLE_ORDER } from './role-abilities';
import { RoleLabelPipe } from './role-label-pipe';

/**
 * The workspace's front page: what needs you (cases waiting for your review, your drafts returned
 * with a comment, what changed in the cases you follow, released cases whose inputs changed), then
 * who you are here and what your role lets you do.
 */
@Component({
  selector: 'ecl-workspace-overview-page',
  imports: [RouterLink, NgTemplateOutlet, CaseStatusChip, CaseKindLabel, UtcTimePipe, RoleLabelPipe],
  template: `
    <ng-template #caseLine let-c>
      <a [routerLink]="['/w', c.workspaceId, 'cases', c.id]" data-testid="overview-case">{{ c.name }}</a>
      <span class="ecl-muted"> · revision {{ c.revision }} · {{ c.missionName }} · </span>
      <ecl-case-kind [kind]="c.kind" />
      <ecl-case-status [status]="c.status" />
    </ng-template>
    @if (workspace.membership(); as m) {
      <section class="ecl-page">
        <h1 data-testid="overview-title">{{ m.workspaceName }}</h1>
        <p>
          You are signed in as <strong>{{ session.user()?.name }}</strong> with the role
          <strong data-testid="overview-role">{{ m.role | roleLabel }}</strong>@if (abilities()?.who; as who) { ({{ who }})}.
        </p>
        <h2>What needs you</h2>
        @switch (overview().status) {
          @case ('loading') {
            <p class="ecl-muted">Looking for what needs you…</p>
          }
          @case ('failed') {
            <p role="alert">{{ failure() }}</p>
          }
          @case ('ready') {
            @if (needs(); as n) {
              <div class="needs">
                <section aria-labelledby="needs-review" data-testid="overview-review">
                  <h3 id="needs-review">Waiting for your review ({{ n.waitingForReview.length }})</h3>
                  @for (c of n.waitingForReview; track c.id) {
                    <p class="line">
                      <ng-container *ngTemplateOutlet="caseLine; context: { $implicit: c }" />
                      <span class="ecl-muted"> by {{ c.author?.name ?? 'a former member' }}</span>
                    </p>
                  } @empty {
                    <p class="ecl-muted">No case is waiting for your review.</p>
                  }
                </section>
                <section aria-labelledby="needs-returned" data-testid="overview-returned">
                  <h3 id="needs-returned">Returned to you ({{ n.returnedToMe.length }})</h3>
                  @for (r of n.returnedToMe; track r.case.id) {
                    <div class="line">
                      <ng-container *ngTemplateOutlet="caseLine; context: { $implicit: r.case }" />
                      <blockquote>
                        “{{ r.comment.text }}”
                        <span class="ecl-muted">— {{ r.comment.author?.name ?? 'a former member' }}, {{ r.comment.createdAt | utc }}</span>
                      </blockquote>
                    </div>
                  } @empty {
                    <p class="ecl-muted">None of your drafts was returned.</p>
                  }
                </section>
                <section aria-labelledby="needs-followed" data-testid="overview-followed">
                  <h3 id="needs-followed">Cases you follow ({{ n.followed.length }})</h3>
                  @for (c of n.followed; track c.id) {
                    <p class="line">
                      <ng-container *ngTemplateOutlet="caseLine; context: { $implicit: c }" />
                      <span class="ecl-muted">
                        @if (c.releasedAt) {
                          released {{ c.releasedAt | utc }}
                        } @else {
                          changed {{ c.updatedAt | utc }}
                        }
                      </span>
                    </p>
                  } @empty {
                    <p class="ecl-muted">You follow no case. Follow one from its page to see its releases and revisions here.</p>
                  }
                </section>
                <section aria-labelledby="needs-stale" data-testid="overview-stale">
                  <h3 id="needs-stale">Released, mission inputs changed since ({{ n.stale.length }})</h3>
                  @for (c of n.stale; track c.id) {
                    <p class="line">
                      <ng-container *ngTemplateOutlet="caseLine; context: { $implicit: c }" />
                      <span class="ecl-muted changed" data-testid="overview-stale-change">
                        {{ c.inputChanges[0] }}@if (c.inputChanges.length > 1) { (and {{ c.inputChanges.length - 1 }} more)}
                      </span>
                    </p>
                  } @empty {
                    <p class="ecl-muted">Every released case is current with its mission.</p>
                  }
                </section>
              </div>
            }
          }
        }
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
                <th scope="col">May</th>
              </tr>
            </thead>
            <tbody>
              @for (role of roleOrder; track role) {
                <tr [class.mine]="role === m.role">
                  <th scope="row">
                    {{ role | roleLabel }}@if (role === m.role) { <span class="ecl-muted"> (you)</span> }
                    @if (abilitiesOf[role].who; as who) { <span class="who ecl-muted">{{ who }}</span> }
                  </th>
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
    .needs {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(min(320px, 100%), 1fr));
      gap: 8px 32px;
    }
    .needs h3 {
      font: var(--mat-sys-title-small);
      margin: 12px 0 4px;
    }
    .line {
      margin: 4px 0 8px;
      overflow-wrap: anywhere;
    }
    .line ecl-case-status {
      margin-left: 6px;
    }
    .line .changed {
      display: block;
      font: var(--mat-sys-body-small);
    }
    blockquote {
      margin: 4px 0 0 16px;
      font: var(--mat-sys-body-medium);
    }
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
    .roles .who {
      display: block;
      font: var(--mat-sys-body-small);
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
  private readonly api = inject(CaseApi);
  protected readonly roleOrder = ROLE_ORDER;
  protected readonly overview = toSignal(
    toObservable(this.workspace.id).pipe(switchMap((id) => (id ? this.api.overview(id).pipe(loaded()) : EMPTY))),
    { initialValue: { status: 'loading' } as Loaded<WorkspaceOverview> },
  );
  protected readonly needs = computed(() => {
    const o = this.overview();
    return o.status === 'ready' ? o.value : null;
  });
  protected readonly failure = computed(() => {
    const o = this.overview();
    return o.status === 'failed' ? o.message : '';
  });
  protected readonly abilitiesOf = ROLE_ABILITIES;
  protected readonly abilities = computed(() => {
    const role = this.workspace.role();
    return role ? ROLE_ABILITIES[role] : null;
  });
  protected readonly entries = computed(() =>
    navEntriesFor(this.workspace.membership(), this.session.user()?.isAdmin ?? false).filter((e) => e.id !== 'overview'),
  );
}
