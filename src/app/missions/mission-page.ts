import { DecimalPipe, NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTab, MatTabContent, MatTabGroup } from '@angular/material/tabs';
import { Router, RouterLink } from '@angular/router';
import { BehaviorSubject, combineLatest, filter, switchMap } from 'rxjs';
import type { MissionDetail, Orbit } from '../../../shared/api/missions';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded, type Loaded } from '../api/loaded';
import { EnvironmentResults } from '../orbits/environment-results';
import { MissionSweep } from '../orbits/mission-sweep';
import { OrbitEditor } from '../orbits/orbit-editor';
import { ConfirmDialog } from '../shell/confirm-dialog';
import { roleMayOpen } from '../shell/navigation';
import { DesignCaution } from '../shell/design-caution';
import { RowActions } from '../shell/row-actions';
import { SurfacesPanel } from '../surfaces/surfaces-panel';
import { PhasesPanel } from '../phases/phases-panel';
import { CurrentWorkspace } from '../workspace/current-workspace';
import { MissionApi } from './mission-api';
import { MissionFormDialog } from './mission-form-dialog';
import { DurationPipe } from '../time/duration-pipe';
import { UtcTimePipe } from '../time/utc-time-pipe';

/** One mission: its facts, orbits, spacecraft surfaces, one orbit's environment and the sweep. */
@Component({
  selector: 'ecl-mission-page',
  imports: [
    RowActions,
    DurationPipe, UtcTimePipe,
    RouterLink, DecimalPipe, NgTemplateOutlet, MatButton, MatIcon, MatTabGroup, MatTab, MatTabContent, MatFormField, MatLabel, MatSelect, MatOption,
    OrbitEditor, SurfacesPanel, PhasesPanel, EnvironmentResults, MissionSweep, DesignCaution,
  ],
  templateUrl: './mission-page.html',
  styleUrl: './mission-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MissionPage {
  private readonly api = inject(MissionApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly workspace = inject(CurrentWorkspace);
  private readonly router = inject(Router);
  private readonly refresh = new BehaviorSubject<void>(undefined);

  /** From the route /w/:workspaceId/missions/:missionId. */
  readonly workspaceId = input.required<string>();
  readonly missionId = input.required<string>();

  protected readonly canEdit = computed(() => this.workspace.role() !== 'viewer' && this.workspace.role() !== null);
  /** Attitude modes and phases carry the thermal design: thermal engineers and owners change them (the server says so too). */
  protected readonly canEditPhases = computed(() => this.workspace.role() === 'thermal' || this.workspace.role() === 'owner');
  /** Deleting a whole mission is the owner's (the server says so too). */
  protected readonly canDelete = computed(() => this.workspace.role() === 'owner');
  /** Why the server kept the mission (it holds released cases), shown until the next try. */
  protected readonly deleteRefusal = signal<string | null>(null);
  protected readonly mayModelThermal = computed(() => {
    const role = this.workspace.role();
    return role !== null && roleMayOpen(role, 'thermal');
  });
  protected readonly detail = toSignal(
    combineLatest([toObservable(this.missionId), this.refresh]).pipe(switchMap(([id]) => this.api.mission(id).pipe(loaded()))),
  );
  // Kept through a reload, so saving an orbit does not blank the page and its plots for a moment.
  protected readonly mission = linkedSignal<Loaded<MissionDetail> | undefined, MissionDetail | null>({
    source: this.detail,
    computation: (state, previous) =>
      state?.status === 'ready' ? state.value : previous?.value?.id === this.missionId() ? previous.value : null,
  });
  protected readonly failure = computed(() => {
    const state = this.detail();
    return state?.status === 'failed' ? state.message : null;
  });
  private readonly bodies = toSignal(this.api.bodies$.pipe(loaded()));
  protected readonly body = computed(() => {
    const state = this.bodies();
    const mission = this.mission();
    return state?.status === 'ready' && mission ? (state.value.find((b) => b.id === mission.bodyId) ?? null) : null;
  });

  /** null: no editor open; 'new': adding; an orbit: editing it. */
  protected readonly editing = signal<Orbit | 'new' | null>(null);
  protected readonly editedOrbit = computed(() => {
    const e = this.editing();
    return e === 'new' ? null : e;
  });
  private readonly chosenOrbitId = signal<string | null>(null);
  /** The orbit the Environment and Sweep tabs show: the chosen one, else the first. */
  protected readonly orbit = computed<Orbit | null>(() => {
    const orbits = this.mission()?.orbits ?? [];
    return orbits.find((o) => o.id === this.chosenOrbitId()) ?? orbits[0] ?? null;
  });
  protected readonly selectedTab = signal(0);
  protected readonly orbitColumns = ['name', 'epoch', 'periapsis', 'apoapsis', 'inclination', 'period'];

  protected chooseOrbit(orbitId: string): void {
    this.chosenOrbitId.set(orbitId);
  }

  protected showResults(orbit: Orbit): void {
    this.chosenOrbitId.set(orbit.id);
    this.selectedTab.set(3);
  }

  protected editMission(): void {
    const mission = this.mission();
    if (!mission) return;
    MissionFormDialog.open(this.dialog, { workspaceId: this.workspaceId(), mission })
      .pipe(filter((saved) => saved !== undefined))
      .subscribe(() => this.refresh.next());
  }

  protected setArchived(archived: boolean): void {
    this.deleteRefusal.set(null);
    this.api.updateMission(this.missionId(), { archived }).subscribe({
      next: () => this.refresh.next(),
      error: (failure: unknown) => this.snackBar.open(apiErrorMessage(failure), 'Close'),
    });
  }

  protected deleteMission(mission: MissionDetail): void {
    this.deleteRefusal.set(null);
    ConfirmDialog.ask(this.dialog, {
      title: `Delete the mission ${mission.name}?`,
      message: 'Its orbits, surfaces, ephemerides, thermal models and unreleased load cases go with it. A mission with released load cases is kept; archive it instead.',
      confirmLabel: 'Delete',
    })
      .pipe(
        filter((yes) => yes),
        switchMap(() => this.api.deleteMission(mission.id)),
      )
      .subscribe({
        next: () => {
          this.snackBar.open(`${mission.name} deleted.`, undefined, { duration: 3000 });
          void this.router.navigate(['/w', this.workspaceId(), 'missions']);
        },
        error: (failure: unknown) => this.deleteRefusal.set(apiErrorMessage(failure)),
      });
  }

  protected orbitSaved(orbit: Orbit): void {
    this.editing.set(null);
    this.chosenOrbitId.set(orbit.id);
    this.snackBar.open(`Orbit ${orbit.name} saved.`, undefined, { duration: 3000 });
    this.refresh.next();
  }

  protected deleteOrbit(orbit: Orbit): void {
    ConfirmDialog.ask(this.dialog, {
      title: `Delete the orbit ${orbit.name}?`,
      message: 'Its environment results go with it. The mission and its surfaces stay.',
      confirmLabel: 'Delete',
    })
      .pipe(
        filter((yes) => yes),
        switchMap(() => this.api.deleteOrbit(this.missionId(), orbit.id)),
      )
      .subscribe({
        next: () => this.refresh.next(),
        error: (failure: unknown) => this.snackBar.open(apiErrorMessage(failure), 'Close'),
      });
  }

  protected reload(): void {
    this.refresh.next();
  }
}
