import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { RouterLink } from '@angular/router';
import { CurrentWorkspace } from '../workspace/current-workspace';
import { RoleLabelPipe } from '../workspace/role-label-pipe';

@Component({
  selector: 'ecl-not-allowed-page',
  imports: [RouterLink, RoleLabelPipe],
  template: `
    <section class="ecl-page" data-testid="not-allowed">
      <h1>Not allowed</h1>
      <p>
        Your role
        @if (workspace.membership(); as m) {
          in {{ m.workspaceName }} ({{ m.role | roleLabel }})
        }
        does not open this page. A workspace owner can change roles on the Members page.
      </p>
      <p><a routerLink="/">Back to the overview</a></p>
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotAllowedPage {
  protected readonly workspace = inject(CurrentWorkspace);
}
