import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type {
  ThermalModelCreate, ThermalModelDetail, ThermalModelSizeRequest, ThermalModelSizeResponse, ThermalModelSummary, ThermalModelUpdate,
  ThermalRunResponse,
} from '../../../shared/api/thermal-models';
import { apiPath } from '../api/api-path';

/** The saved thermal model routes of shared/api/thermal-models.ts. */
@Injectable({ providedIn: 'root' })
export class ThermalModelApi {
  private readonly http = inject(HttpClient);

  list(missionId: string): Observable<ThermalModelSummary[]> {
    return this.http.get<{ items: ThermalModelSummary[] }>(apiPath('missions', missionId, 'thermal-models')).pipe(map((r) => r.items));
  }

  get(modelId: string): Observable<ThermalModelDetail> {
    return this.http.get<ThermalModelDetail>(apiPath('thermal-models', modelId));
  }

  create(missionId: string, body: ThermalModelCreate): Observable<ThermalModelDetail> {
    return this.http.post<ThermalModelDetail>(apiPath('missions', missionId, 'thermal-models'), body);
  }

  update(modelId: string, body: ThermalModelUpdate): Observable<ThermalModelDetail> {
    return this.http.patch<ThermalModelDetail>(apiPath('thermal-models', modelId), body);
  }

  remove(modelId: string): Observable<unknown> {
    return this.http.delete(apiPath('thermal-models', modelId));
  }

  /** `maxOrbits`: the orbits allowed for this run; a run that does not settle in them answers its last orbit. */
  run(modelId: string, caseId: string, maxOrbits?: number): Observable<ThermalRunResponse> {
    return this.http.post<ThermalRunResponse>(apiPath('thermal-models', modelId, 'run'), { caseId, ...(maxOrbits !== undefined ? { maxOrbits } : {}) });
  }

  lastRun(modelId: string, caseId: string): Observable<ThermalRunResponse> {
    return this.http.get<ThermalRunResponse>(apiPath('thermal-models', modelId, 'runs', caseId));
  }

  size(modelId: string, body: ThermalModelSizeRequest): Observable<ThermalModelSizeResponse> {
    return this.http.post<ThermalModelSizeResponse>(apiPath('thermal-models', modelId, 'size'), body);
  }
}
