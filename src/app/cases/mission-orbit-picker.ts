// The mission and orbit pickers of the case dialogs: the workspace's missions, the orbits of the
// chosen one, and in the fields' hints what the user needs to know (no missions loaded, no orbit
// yet, the mission's dates).
import { ChangeDetectionStrategy, Component, computed, input, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule, type FormControl } from '@angular/forms';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatOption, MatSelect } from '@angular/material/select';
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
 * The missions and the chosen mission with its orbits, for MissionOrbitPicker and the dialog around
 * it (the first orbit is chosen for the user when none is). Call in an injection context.
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

/** The orbit field's hint: the mission's dates, or that it has no orbit; empty before a mission is loaded. */
export function orbitHint(mission: Loaded<MissionDetail | null>): string {
  if (mission.status === 'failed') return "The mission's orbits could not be loaded.";
  if (mission.status !== 'ready' || mission.value === null) return '';
  return mission.value.orbits.length === 0 ? 'This mission has no orbit yet.' : `Mission ${mission.value.startDate} to ${mission.value.endDate}`;
}

/** The two pickers side by side; the controls belong to the dialog's form (test ids `<prefix>-mission`, `<prefix>-orbit`). */
@Component({
  selector: 'ecl-mission-orbit-picker',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatHint, MatError, MatSelect, MatOption],
  template: `
    <mat-form-field appearance="outline">
      <mat-label>Mission</mat-label>
      <mat-select [formControl]="missionControl()" [attr.data-testid]="testIdPrefix() + '-mission'">
        @if (choice().missions(); as missions) {
          @if (missions.status === 'ready') {
            @for (m of missions.value; track m.id) {
              <mat-option [value]="m.id">{{ m.name }}</mat-option>
            }
          }
        }
      </mat-select>
      @if (choice().missions().status === 'failed') {
        <mat-hint>The missions could not be loaded.</mat-hint>
      }
      <mat-error>Choose a mission.</mat-error>
    </mat-form-field>
    <mat-form-field appearance="outline">
      <mat-label>Orbit</mat-label>
      <mat-select [formControl]="orbitControl()" [attr.data-testid]="testIdPrefix() + '-orbit'">
        @if (choice().mission(); as m) {
          @if (m.status === 'ready' && m.value) {
            @for (o of m.value.orbits; track o.id) {
              <mat-option [value]="o.id">{{ o.name }}</mat-option>
            }
          }
        }
      </mat-select>
      <mat-hint>{{ hint() }}</mat-hint>
      <mat-error>Choose an orbit.</mat-error>
    </mat-form-field>
  `,
  styles: `
    :host {
      align-items: flex-start;
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
    }
    mat-form-field {
      flex: 1 1 220px;
    }
    mat-hint {
      white-space: normal;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MissionOrbitPicker {
  readonly missionControl = input.required<FormControl<string>>();
  readonly orbitControl = input.required<FormControl<string>>();
  readonly choice = input.required<MissionOrbitChoice>();
  readonly testIdPrefix = input.required<string>();
  protected readonly hint = computed(() => orbitHint(this.choice().mission()));
}
