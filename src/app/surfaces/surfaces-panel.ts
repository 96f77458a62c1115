import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { BehaviorSubject, combineLatest, filter, switchMap } from 'rxjs';
import type { Material, Surface } from '../../../shared/api/missions';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { MissionApi } from '../missions/mission-api';
import { ConfirmDialog } from '../shell/confirm-dialog';
import { MaterialDialog } from './material-dialog';
import { SurfaceDialog } from './surface-dialog';
import { describeNormal } from './surface-normals';
import { SourceWordsPipe } from '../shell/source-words-pipe';
import { RowActions } from '../shell/row-actions';

/** The spacecraft's surfaces of one mission, with their materials' optical properties. */
@Component({
  selector: 'ecl-surfaces-panel',
  imports: [RowActions, SourceWordsPipe, DecimalPipe, MatButton, MatIcon],
  templateUrl: './surfaces-panel.html',
  styleUrl: './surfaces-panel.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SurfacesPanel {
  private readonly api = inject(MissionApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly refreshMaterials = new BehaviorSubject<void>(undefined);

  readonly missionId = input.required<string>();
  readonly workspaceId = input.required<string>();
  readonly surfaces = input.required<readonly Surface[]>();
  readonly canEdit = input(false);
  /** A surface was added, changed or removed: the mission should be fetched again. */
  readonly changed = output<void>();

  protected readonly describeNormal = describeNormal;
  protected readonly materials = toSignal(
    combineLatest([toObservable(this.workspaceId), this.refreshMaterials]).pipe(switchMap(([id]) => this.api.materials(id).pipe(loaded()))),
  );
  private readonly materialList = computed<readonly Material[]>(() => {
    const state = this.materials();
    return state?.status === 'ready' ? state.value : [];
  });
  protected readonly rows = computed(() =>
    this.surfaces().map((surface) => ({ surface, material: this.materialList().find((m) => m.id === surface.materialId) ?? null })),
  );
  protected readonly totalAreaM2 = computed(() => this.surfaces().reduce((sum, s) => sum + s.areaM2, 0));

  protected addSurface(): void {
    this.openSurface(null);
  }

  protected editSurface(surface: Surface): void {
    this.openSurface(surface);
  }

  private openSurface(surface: Surface | null): void {
    SurfaceDialog.open(this.dialog, { missionId: this.missionId(), surface, materials: this.materialList() })
      .pipe(filter((saved) => saved !== undefined))
      .subscribe(() => this.changed.emit());
  }

  protected deleteSurface(surface: Surface): void {
    ConfirmDialog.ask(this.dialog, {
      title: `Delete the surface ${surface.name}?`,
      message: 'Environment results and the sweep no longer include it.',
      confirmLabel: 'Delete',
    })
      .pipe(
        filter((yes) => yes),
        switchMap(() => this.api.deleteSurface(this.missionId(), surface.id)),
      )
      .subscribe({
        next: () => this.changed.emit(),
        error: (failure: unknown) => this.snackBar.open(apiErrorMessage(failure), 'Close'),
      });
  }

  protected addMaterial(): void {
    MaterialDialog.open(this.dialog, this.workspaceId())
      .pipe(filter((made) => made !== undefined))
      .subscribe((made) => {
        this.snackBar.open(`${made.name} added to this workspace's materials.`, undefined, { duration: 3000 });
        this.refreshMaterials.next();
      });
  }
}
