import { HttpClient, HttpEventType, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { CaseDetail } from '../../../shared/api/cases';
import type {
  EphemerisCaseCreate,
  EphemerisSummary,
  TrajectoryEnvironmentRequest,
  TrajectoryEnvironmentResponse,
} from '../../../shared/api/ephemerides';
import { apiPath } from '../api/api-path';

/** Where an upload is: bytes going up, the server reading and checking them, or the answer. */
export type UploadProgress =
  | { readonly stage: 'sending'; readonly loaded: number; readonly total: number | null }
  | { readonly stage: 'processing' }
  | { readonly stage: 'done'; readonly summary: EphemerisSummary };

export interface UploadForm {
  file: File;
  frame: string;
  name: string;
  /** ISO 8601 UTC; the origin of a CSV's t column. */
  epoch: string;
}

/** Maps HttpClient's upload events to the three stages the upload zone shows. */
export function uploadProgress(event: HttpEvent<EphemerisSummary>): UploadProgress | null {
  switch (event.type) {
    case HttpEventType.Sent:
      return { stage: 'sending', loaded: 0, total: null };
    case HttpEventType.UploadProgress: {
      const total = event.total ?? null;
      // Once every byte is sent the server parses and checks the file; that part has no percentage.
      return total !== null && event.loaded >= total ? { stage: 'processing' } : { stage: 'sending', loaded: event.loaded, total };
    }
    case HttpEventType.Response:
      return event.body ? { stage: 'done', summary: event.body } : null;
    default:
      return null;
  }
}

/** The ephemeris routes of shared/api/ephemerides.ts. */
@Injectable({ providedIn: 'root' })
export class EphemerisApi {
  private readonly http = inject(HttpClient);

  list(missionId: string): Observable<EphemerisSummary[]> {
    return this.http.get<{ items: EphemerisSummary[] }>(apiPath('missions', missionId, 'ephemerides')).pipe(map((r) => r.items));
  }

  upload(missionId: string, form: UploadForm): Observable<UploadProgress> {
    const body = new FormData();
    if (form.frame) body.append('frame', form.frame);
    if (form.name.trim()) body.append('name', form.name.trim());
    if (form.epoch.trim()) body.append('epoch', form.epoch.trim());
    // The file last: the server has the fields in hand by the time the bytes arrive.
    body.append('file', form.file, form.file.name);
    return this.http
      .post<EphemerisSummary>(apiPath('missions', missionId, 'ephemerides'), body, { reportProgress: true, observe: 'events' })
      .pipe(
        map(uploadProgress),
        map((p) => p ?? { stage: 'processing' as const }),
      );
  }

  remove(missionId: string, ephemerisId: string): Observable<void> {
    return this.http.delete<void>(apiPath('missions', missionId, 'ephemerides', ephemerisId));
  }

  /** A load case (custom, draft) from a window of the ephemeris. */
  createCase(missionId: string, ephemerisId: string, request: EphemerisCaseCreate): Observable<CaseDetail> {
    return this.http.post<CaseDetail>(apiPath('missions', missionId, 'ephemerides', ephemerisId, 'cases'), request);
  }

  environment(missionId: string, ephemerisId: string, request: TrajectoryEnvironmentRequest): Observable<TrajectoryEnvironmentResponse> {
    return this.http.post<TrajectoryEnvironmentResponse>(apiPath('missions', missionId, 'ephemerides', ephemerisId, 'environment'), request);
  }
}
