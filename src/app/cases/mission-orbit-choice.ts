import { Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import type { FormControl } from '@angular/forms';
import { map, of, startWith, switchMap, tap } from 'rxjs';
import type { Mission, MissionDetail } from '../../../shared/api/missions';
import { loaded, type Loaded } from '../api/loaded';
import type { CaseApi } from './case-api';

export interface MissionOrbitChoice {
  readonly missions: Signal<Loaded<Mission[]>>;
  /** The chosen mission with its orbits; null before one is chosen. */
  readonly mission: Signal<Loaded<MissionDetail | null>>;
}

/**
 * The mission and orbit pickers of the case dialogs: the workspace's missions, and the orbits of
 * the chosen one (the first orbit is chosen for the user when none is). Call in an injection context.
 */
export function missionOrbitChoice(
  api: CaseApi,
  workspaceId: string,
  missionControl: FormControl<string>,
  orbitControl: FormControl<string>,
): MissionOrbitChoice {
  const missions = toSignal(api.missions(workspaceId).pipe(loaded()), { requireSync: true });
  const mission = toSignal(
    missionControl.valueChanges.pipe(
      startWith(missionControl.value),
      switchMap((id) =>
        id === ''
          ? of<Loaded<MissionDetail | null>>({ status: 'ready', value: null })
          : api.mission(id).pipe(
              tap((detail) => {
                if (!detail.orbits.some((o) => o.id === orbitControl.value)) orbitControl.setValue(detail.orbits[0]?.id ?? '');
              }),
              map((detail): MissionDetail | null => detail),
              loaded(),
            ),
      ),
    ),
    { requireSync: true },
  );
  return { missions, mission };
}
