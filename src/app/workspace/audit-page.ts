import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatPaginator, PageEvent } from '@angular/material/paginator';
import { MatTableModule } from '@angular/material/table';
import { combineLatest, switchMap } from 'rxjs';
import { loaded } from '../api/loaded';
import { type AuditFilter, WorkspaceApi } from './workspace-api';
import { UtcTimePipe } from '../time/utc-time-pipe';

/** A calendar day typed in the filter, as the instant it starts (since) or ends (until) in UTC. */
function dayBound(day: string, end: boolean): string | undefined {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(day)) return undefined;
  return end ? `${day}T23:59:59.999Z` : `${day}T00:00:00.000Z`;
}

/** Who changed and released what in the workspace (owners only). */
@Component({
  selector: 'ecl-audit-page',
  imports: [ReactiveFormsModule, UtcTimePipe, MatTableModule, MatPaginator, MatFormField, MatLabel, MatHint, MatInput, MatButton],
  templateUrl: './audit-page.html',
  styleUrl: './audit-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditPage {
  private readonly api = inject(WorkspaceApi);

  /** From the route /w/:workspaceId/audit. */
  readonly workspaceId = input.required<string>();

  protected readonly columns = ['at', 'actor', 'action', 'target', 'summary'];
  protected readonly pageSizes = [25, 50, 100];
  protected readonly filterForm = inject(NonNullableFormBuilder).group({ action: '', actor: '', since: '', until: '' });
  protected readonly query = signal<AuditFilter>({ limit: 25, offset: 0 });

  protected readonly events = toSignal(
    combineLatest([toObservable(this.workspaceId), toObservable(this.query)]).pipe(
      switchMap(([id, query]) => this.api.audit(id, query).pipe(loaded())),
    ),
  );

  protected applyFilters(): void {
    const { action, actor, since, until } = this.filterForm.getRawValue();
    this.query.set({
      action: actionCode(action) || undefined,
      actor: actor.trim() || undefined,
      since: dayBound(since, false),
      until: dayBound(until, true),
      limit: this.query().limit,
      offset: 0,
    });
  }

  /** An action as the log names it ("thermal_model.created"), in words ("thermal model: created"). */
  protected readonly actionWords = actionWords;

  protected clearFilters(): void {
    this.filterForm.reset();
    this.query.set({ limit: this.query().limit, offset: 0 });
  }

  protected turnPage(page: PageEvent): void {
    this.query.update((q) => ({ ...q, limit: page.pageSize, offset: page.pageIndex * page.pageSize }));
  }
}

/** An audit action in words: "thermal_model.created" -> "thermal model: created". */
export const actionWords = (code: string): string => code.replace('.', ': ').replaceAll('_', ' ');

/** What the filter field holds back into the log's action: words as the table shows them, or the code itself. */
export const actionCode = (text: string): string => text.trim().toLowerCase().replace(/\s*:\s*/, '.').replace(/\s+/g, '_');
