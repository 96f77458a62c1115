import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { map } from 'rxjs';
import { DesignCaution } from '../shell/design-caution';
import { loaded } from '../api/loaded';
import { apiPath } from '../api/api-path';

// The fields of GET /api/v1/cases fixed by API.md; the full case type comes with the case library.
interface CaseRow {
  readonly id: string;
  readonly missionId: string;
  readonly name: string;
  readonly kind: 'hot' | 'cold' | 'custom';
  readonly status: 'draft' | 'review' | 'released' | 'superseded';
  readonly revision: number;
}

/** A first list of load cases; the library (revisions, release, compare) arrives later. */
@Component({
  selector: 'ecl-load-cases-page',
  imports: [DesignCaution],
  template: `
    <section class="ecl-page">
      <h1>Load cases</h1>
      @if (cases(); as state) {
        @if (state.status === 'loading') {
          <p class="ecl-muted" role="status">Loading…</p>
        } @else if (state.status === 'failed') {
          <p class="ecl-muted">The case library is not available yet ({{ state.message }}).</p>
        } @else if (state.value.length === 0) {
          <p class="ecl-muted">No load cases yet.</p>
        } @else {
          <div class="ecl-table-wrap">
            <table class="cases">
              <thead>
                <tr><th scope="col">Name</th><th scope="col">Kind</th><th scope="col">Status</th><th scope="col">Revision</th></tr>
              </thead>
              <tbody>
                @for (c of state.value; track c.id) {
                  <tr>
                    <td>{{ c.name }}</td>
                    <td><span [class]="'kind-' + c.kind">{{ c.kind }}</span></td>
                    <td>{{ c.status }}</td>
                    <td class="num">{{ c.revision }}</td>
                  </tr>
                }
              </tbody>
            </table>
          </div>
        }
      }
      <ecl-design-caution />
    </section>
  `,
  styles: `
    .cases {
      width: 100%;
      border-collapse: collapse;
      margin-bottom: 16px;
    }
    .cases th,
    .cases td {
      text-align: left;
      padding: 6px 12px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .num {
      text-align: right;
    }
    /* Colour backs up the word, never replaces it. */
    .kind-hot {
      color: var(--ecl-hot);
      font-weight: 600;
    }
    .kind-cold {
      color: var(--ecl-cold);
      font-weight: 600;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadCasesPage {
  // API.md allows a bare array or {items}; accept both until the server settles on one.
  protected readonly cases = toSignal(
    inject(HttpClient)
      .get<CaseRow[] | { items: CaseRow[] }>(apiPath('cases'))
      .pipe(
        map((answer) => (Array.isArray(answer) ? answer : answer.items)),
        loaded(),
      ),
    { requireSync: true },
  );
}
