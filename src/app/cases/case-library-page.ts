import { ChangeDetectionStrategy, Component, computed, effect, inject, input, linkedSignal, signal, viewChild } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatPaginator } from '@angular/material/paginator';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortHeader } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { RouterLink, Router } from '@angular/router';
import { combineLatest, filter, switchMap, tap } from 'rxjs';
import type { CaseStatus } from '../../../shared/api/case-content';
import type { CaseDetail, CaseSummary } from '../../../shared/api/cases';
import { loaded } from '../api/loaded';
import { DesignCaution } from '../shell/design-caution';
import { CurrentWorkspace } from '../workspace/current-workspace';
import { mayChangeCases } from './case-actions';
import { CaseApi } from './case-api';
import { CaseDeriveDialog, type CaseDeriveData } from './case-derive-dialog';
import { CaseKindLabel } from './case-kind-label';
import { CASE_STATUSES, STATUS_LABELS, shortChecksum } from './case-labels';
import { CaseStatusChip } from './case-status-chip';
import { CustomCaseDialog } from './custom-case-dialog';
import { UtcTimePipe } from '../time/utc-time-pipe';

/** Sort keys for the columns whose cell is not a plain field of the row. */
function sortValue(row: CaseSummary, column: string): string | number {
  switch (column) {
    case 'mission':
      return row.missionName.toLowerCase();
    case 'released':
      return row.releasedAt ?? '';
    case 'checksum':
      return row.checksum ?? '';
    case 'revision':
      return row.revision;
    case 'kind':
      return row.kind;
    case 'status':
      return CASE_STATUSES.indexOf(row.status);
    default:
      return row.name.toLowerCase();
  }
}

/** The case library: every case the user may see, filtered by mission and status. */
@Component({
  selector: 'ecl-case-library-page',
  imports: [
    UtcTimePipe, RouterLink, MatTableModule, MatSort, MatSortHeader, MatPaginator, MatFormField, MatLabel, MatSelect, MatOption,
    MatButton, MatIcon, DesignCaution, CaseKindLabel, CaseStatusChip,
  ],
  templateUrl: './case-library-page.html',
  styleUrl: './case-library-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseLibraryPage {
  readonly workspaceId = input.required<string>();
  /** ?missionId= opens the library filtered to one mission (a mission page links here that way). */
  readonly missionId = input<string | undefined>(undefined);

  private readonly api = inject(CaseApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);
  private readonly role = inject(CurrentWorkspace).role;

  protected readonly statuses = CASE_STATUSES;
  protected readonly statusLabels = STATUS_LABELS;
  protected readonly short = shortChecksum;
  protected readonly columns = ['name', 'mission', 'kind', 'status', 'revision', 'released', 'checksum'];
  protected readonly mayChange = computed(() => mayChangeCases(this.role()));

  protected readonly missionFilter = linkedSignal(() => this.missionId() ?? '');
  protected readonly statusFilter = signal<CaseStatus | ''>('');
  private readonly reload = signal(0);

  protected readonly missions = toSignal(toObservable(this.workspaceId).pipe(switchMap((id) => this.api.missions(id).pipe(loaded()))), {
    initialValue: { status: 'loading' as const },
  });

  protected readonly dataSource = new MatTableDataSource<CaseSummary>([]);
  protected readonly cases = toSignal(
    combineLatest([toObservable(this.missionFilter), toObservable(this.statusFilter), toObservable(this.reload)]).pipe(
      switchMap(([missionId, status]) =>
        this.api.list({ missionId: missionId || null, status: status || null }).pipe(
          // Another workspace's cases are not ours to list, whatever the server sends for the user.
          tap((items) => (this.dataSource.data = items.filter((c) => c.workspaceId === this.workspaceId()))),
          loaded(),
        ),
      ),
    ),
    { initialValue: { status: 'loading' as const } },
  );

  private readonly sort = viewChild(MatSort);
  private readonly paginator = viewChild(MatPaginator);

  constructor() {
    this.dataSource.sortingDataAccessor = sortValue;
    effect(() => {
      this.dataSource.sort = this.sort() ?? null;
      this.dataSource.paginator = this.paginator() ?? null;
    });
  }

  protected deriveCases(): void {
    const data: CaseDeriveData = { workspaceId: this.workspaceId(), missionId: this.missionFilter() || null };
    this.dialog
      .open<CaseDeriveDialog, CaseDeriveData, CaseDetail[]>(CaseDeriveDialog, { data, width: '640px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((made): made is CaseDetail[] => made !== undefined))
      .subscribe((made) => {
        this.reload.update((n) => n + 1);
        this.snackBar.open(`Derived ${made.map((c) => c.name).join(' and ')} as drafts.`, 'OK', { duration: 6000 });
      });
  }

  protected newCustomCase(): void {
    const data: CaseDeriveData = { workspaceId: this.workspaceId(), missionId: this.missionFilter() || null };
    this.dialog
      .open<CustomCaseDialog, CaseDeriveData, CaseDetail>(CustomCaseDialog, { data, width: '640px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((made): made is CaseDetail => made !== undefined))
      .subscribe((made) => void this.router.navigate(['/w', this.workspaceId(), 'cases', made.id]));
  }
}
