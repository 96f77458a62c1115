import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { BodySummaryResponse, EnvironmentRequestInput, EnvironmentResponse } from '../../../shared/api/environment';
import type {
  Material,
  MaterialCreate,
  Mission,
  MissionCreate,
  MissionDetail,
  MissionUpdate,
  Orbit,
  OrbitCreate,
  Surface,
  SurfaceCreate,
} from '../../../shared/api/missions';
import { apiPath } from '../api/api-path';

export type PropertySet = 'bol' | 'eol';

/** What GET /bodies/:id/sun-synchronous answers; read defensively, the route is another team's. */
export type SunSynchronousAnswer = { readonly inclinationDeg: number } | { readonly none: string };

function readSunSynchronous(body: unknown): SunSynchronousAnswer {
  if (typeof body === 'object' && body !== null && 'inclinationDeg' in body && typeof body.inclinationDeg === 'number') {
    return { inclinationDeg: body.inclinationDeg };
  }
  return { none: 'The server gave no inclination for this altitude.' };
}

/** The mission routes of shared/api/missions.ts plus the body catalogue they refer to. */
@Injectable({ providedIn: 'root' })
export class MissionApi {
  private readonly http = inject(HttpClient);

  /**
   * The catalogue and the caller's workspaces' own bodies, fetched by each page that asks (a body
   * the workspace added meanwhile is then in it; the list is a few kB).
   */
  get bodies$(): Observable<BodySummaryResponse[]> {
    return this.http.get<BodySummaryResponse[]>(apiPath('bodies'));
  }

  missions(includeArchived: boolean): Observable<Mission[]> {
    const params = includeArchived ? new HttpParams().set('includeArchived', 'true') : undefined;
    return this.http.get<{ items: Mission[] }>(apiPath('missions'), { params }).pipe(map((r) => r.items));
  }

  mission(missionId: string): Observable<MissionDetail> {
    return this.http.get<MissionDetail>(apiPath('missions', missionId));
  }

  createMission(body: MissionCreate): Observable<Mission> {
    return this.http.post<Mission>(apiPath('missions'), body);
  }

  updateMission(missionId: string, body: MissionUpdate): Observable<Mission> {
    return this.http.patch<Mission>(apiPath('missions', missionId), body);
  }

  /** Owners only; 409 when the mission holds released cases (the message names them). */
  deleteMission(missionId: string): Observable<unknown> {
    return this.http.delete(apiPath('missions', missionId));
  }

  createOrbit(missionId: string, body: OrbitCreate): Observable<Orbit> {
    return this.http.post<Orbit>(apiPath('missions', missionId, 'orbits'), body);
  }

  updateOrbit(missionId: string, orbitId: string, body: Partial<OrbitCreate>): Observable<Orbit> {
    return this.http.patch<Orbit>(apiPath('missions', missionId, 'orbits', orbitId), body);
  }

  deleteOrbit(missionId: string, orbitId: string): Observable<unknown> {
    return this.http.delete(apiPath('missions', missionId, 'orbits', orbitId));
  }

  orbitEnvironment(missionId: string, orbitId: string, properties: PropertySet, steps = 360): Observable<EnvironmentResponse> {
    return this.http.post<EnvironmentResponse>(apiPath('missions', missionId, 'orbits', orbitId, 'environment'), {
      properties,
      steps,
    });
  }

  /** The stateless compute route; the orbit editor previews derived figures with it. */
  compute(request: EnvironmentRequestInput): Observable<EnvironmentResponse> {
    return this.http.post<EnvironmentResponse>(apiPath('environment', 'compute'), request);
  }

  sunSynchronous(bodyId: string, altitudeKm: number): Observable<SunSynchronousAnswer> {
    const params = new HttpParams().set('altitudeKm', altitudeKm);
    return this.http.get<unknown>(apiPath('bodies', bodyId, 'sun-synchronous'), { params }).pipe(map(readSunSynchronous));
  }

  createSurface(missionId: string, body: SurfaceCreate): Observable<Surface> {
    return this.http.post<Surface>(apiPath('missions', missionId, 'surfaces'), body);
  }

  updateSurface(missionId: string, surfaceId: string, body: Partial<SurfaceCreate>): Observable<Surface> {
    return this.http.patch<Surface>(apiPath('missions', missionId, 'surfaces', surfaceId), body);
  }

  deleteSurface(missionId: string, surfaceId: string): Observable<unknown> {
    return this.http.delete(apiPath('missions', missionId, 'surfaces', surfaceId));
  }

  materials(workspaceId: string): Observable<Material[]> {
    const params = new HttpParams().set('workspaceId', workspaceId);
    return this.http.get<{ items: Material[] }>(apiPath('materials'), { params }).pipe(map((r) => r.items));
  }

  createMaterial(workspaceId: string, body: MaterialCreate): Observable<Material> {
    return this.http.post<Material>(apiPath('workspaces', workspaceId, 'materials'), body);
  }

  /** The sweep's URL for fetch() streaming and for the CSV link. */
  sweepUrl(missionId: string, orbitId: string, properties: PropertySet, format: 'ndjson' | 'csv' = 'ndjson'): string {
    const query = new URLSearchParams({ properties, ...(format === 'csv' ? { format } : {}) });
    return `${apiPath('missions', missionId, 'orbits', orbitId, 'sweep')}?${query.toString()}`;
  }
}
