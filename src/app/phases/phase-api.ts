import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { AttitudeMode, AttitudeModeCreate, MissionPhase, PhaseCreate } from '../../../shared/api/phases';
import { apiPath } from '../api/api-path';

/** The attitude mode and phase routes of shared/api/phases.ts. */
@Injectable({ providedIn: 'root' })
export class PhaseApi {
  private readonly http = inject(HttpClient);

  modes(missionId: string): Observable<AttitudeMode[]> {
    return this.http.get<{ items: AttitudeMode[] }>(apiPath('missions', missionId, 'attitude-modes')).pipe(map((r) => r.items));
  }

  saveMode(missionId: string, modeId: string | null, body: AttitudeModeCreate): Observable<AttitudeMode> {
    return modeId === null
      ? this.http.post<AttitudeMode>(apiPath('missions', missionId, 'attitude-modes'), body)
      : this.http.patch<AttitudeMode>(apiPath('missions', missionId, 'attitude-modes', modeId), body);
  }

  deleteMode(missionId: string, modeId: string): Observable<void> {
    return this.http.delete<void>(apiPath('missions', missionId, 'attitude-modes', modeId));
  }

  phases(missionId: string): Observable<MissionPhase[]> {
    return this.http.get<{ items: MissionPhase[] }>(apiPath('missions', missionId, 'phases')).pipe(map((r) => r.items));
  }

  savePhase(missionId: string, phaseId: string | null, body: PhaseCreate): Observable<MissionPhase> {
    return phaseId === null
      ? this.http.post<MissionPhase>(apiPath('missions', missionId, 'phases'), body)
      : this.http.patch<MissionPhase>(apiPath('missions', missionId, 'phases', phaseId), body);
  }

  deletePhase(missionId: string, phaseId: string): Observable<void> {
    return this.http.delete<void>(apiPath('missions', missionId, 'phases', phaseId));
  }
}
