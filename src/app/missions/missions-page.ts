import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, viewChild } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator } from '@angular/material/paginator';
import { MatSlideToggle } from '@angular/material/slide-toggle';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortHeader } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { BehaviorSubject, combineLatest, switchMap } from 'rxjs';
import type { Mission } from '../../../shared/api/missions';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { CurrentWorkspace } from '../workspace/current-workspace';
import { MissionApi } from './mission-api';
import { MissionFormDialog } from './mission-form-dialog';

/** The workspace's missions: find one, open it, start a new one, archive old ones. */
@Component({
  selector: 'ecl-missions-page',
  imports: [RouterLink, MatTableModule, MatSort, MatSortHeader, MatPaginator, MatFormField, MatLabel, MatSuffix, MatInput, MatButton, MatIcon, MatSlideToggle],
  templateUrl: './missions-page.html',
  styleUrl: './missions-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MissionsPage {
  private readonly api = inject(MissionApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);
  private readonly workspace = inject(CurrentWorkspace);
  private readonly refresh = new BehaviorSubject<void>(undefined);

  /** From the route /w/:workspaceId/missions. */
  readonly workspaceId = input.required<string>();

  protected readonly canEdit = computed(() => this.workspace.role() !== 'viewer' && this.workspace.role() !== null);
  protected readonly showArchived = signal(false);
  protected readonly columns = computed(() => ['name', 'body', 'startDate', 'endDate', 'archived', ...(this.canEdit() ? ['actions'] : [])]);

  private readonly bodyNames = toSignal(this.api.bodies$.pipe(loaded()));
  protected readonly bodyName = (id: string): string => {
    const state = this.bodyNames();
    return state?.status === 'ready' ? (state.value.find((b) => b.id === id)?.name ?? id) : id;
  };

  protected readonly missions = toSignal(
    combineLatest([toObservable(this.showArchived), this.refresh]).pipe(switchMap(([archived]) => this.api.missions(archived).pipe(loaded()))),
  );
  /** GET /missions answers every workspace of the caller; this page lists the one in the URL. */
  protected readonly rows = computed(() => {
    const state = this.missions();
    return state?.status === 'ready' ? state.value.filter((m) => m.workspaceId === this.workspaceId()) : [];
  });
  protected readonly dataSource = new MatTableDataSource<Mission>([]);
  private readonly sort = viewChild.required(MatSort);
  private readonly paginator = viewChild.required(MatPaginator);

  constructor() {
    this.dataSource.filterPredicate = (m, filter) =>
      [m.name, this.bodyName(m.bodyId), m.bodyId, m.description, m.startDate, m.endDate].join(' ').toLowerCase().includes(filter);
    this.dataSource.sortingDataAccessor = (m, column) => (column === 'body' ? this.bodyName(m.bodyId) : String(m[column as keyof Mission]));
    effect(() => {
      this.dataSource.data = this.rows();
    });
    effect(() => {
      this.dataSource.sort = this.sort();
      this.dataSource.paginator = this.paginator();
    });
  }

  protected applyFilter(text: string): void {
    this.dataSource.filter = text.trim().toLowerCase();
    this.dataSource.paginator?.firstPage();
  }

  protected newMission(): void {
    MissionFormDialog.open(this.dialog, { workspaceId: this.workspaceId(), mission: null }).subscribe((made) => {
      if (made) void this.router.navigate(['/w', this.workspaceId(), 'missions', made.id]);
    });
  }

  protected setArchived(mission: Mission, archived: boolean): void {
    this.api.updateMission(mission.id, { archived }).subscribe({
      next: () => {
        this.snackBar.open(`${mission.name} ${archived ? 'archived' : 'restored'}.`, undefined, { duration: 3000 });
        this.refresh.next();
      },
      error: (failure: unknown) => this.snackBar.open(apiErrorMessage(failure), 'Close'),
    });
  }
}
