import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { switchMap } from 'rxjs';
import type { Mission } from '../../../shared/api/missions';
import { apiPath } from '../api/api-path';
import { loaded } from '../api/loaded';
import { CurrentWorkspace } from '../workspace/current-workspace';
import { MissionEphemerides } from './mission-ephemerides';

/** The route /w/:workspaceId/missions/:missionId/ephemerides: a mission's trajectories on a page of their own. */
@Component({
  selector: 'ecl-mission-ephemerides-page',
  imports: [RouterLink, MissionEphemerides],
  template: `
    <section class="ecl-page">
      <p class="crumbs">
        <a [routerLink]="['/w', workspaceId(), 'missions']">Missions</a> ›
        <a [routerLink]="['/w', workspaceId(), 'missions', missionId()]">{{ missionName() }}</a>
      </p>
      <h1>Ephemerides</h1>
      @if (failure(); as message) {
        <p class="ecl-error" role="alert">{{ message }}</p>
      } @else {
        <ecl-mission-ephemerides [missionId]="missionId()" [workspaceId]="workspaceId()" [canEdit]="canEdit()" [canMakeCases]="canMakeCases()" [crewed]="crewed()" />
      }
    </section>
  `,
  styles: `
    .crumbs { margin: 0 0 8px; }
    h1 { margin: 0 0 8px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MissionEphemeridesPage {
  private readonly http = inject(HttpClient);
  private readonly workspace = inject(CurrentWorkspace);

  readonly workspaceId = input.required<string>();
  readonly missionId = input.required<string>();

  private readonly mission = toSignal(
    toObservable(this.missionId).pipe(switchMap((id) => this.http.get<Mission>(apiPath('missions', id)).pipe(loaded()))),
  );
  protected readonly missionName = computed(() => {
    const state = this.mission();
    return state?.status === 'ready' ? state.value.name : 'Mission';
  });
  protected readonly crewed = computed(() => {
    const state = this.mission();
    return state?.status === 'ready' ? state.value.crewed : false;
  });
  protected readonly failure = computed(() => {
    const state = this.mission();
    return state?.status === 'failed' ? state.message : null;
  });
  protected readonly canMakeCases = computed(() => {
    const role = this.workspace.role();
    return role === 'owner' || role === 'thermal';
  });
  protected readonly canEdit = computed(() => {
    const role = this.workspace.role();
    return role === 'owner' || role === 'analyst' || role === 'thermal';
  });
}
