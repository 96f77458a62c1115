import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { CaseStatus } from '../../../shared/api/case-content';
import type { CaseComment, CaseComparison, CaseCreate, CaseDerive, CaseDetail, CaseSummary, CaseUpdate, WorkspaceOverview } from '../../../shared/api/cases';
import type { Mission, MissionDetail } from '../../../shared/api/missions';
import { apiPath } from '../api/api-path';

export interface CaseFilter {
  readonly missionId?: string | null;
  readonly status?: CaseStatus | null;
}

/** The load-case routes of shared/api/cases.ts, plus the mission reads the case screens need. */
@Injectable({ providedIn: 'root' })
export class CaseApi {
  private readonly http = inject(HttpClient);

  list(filter: CaseFilter = {}): Observable<CaseSummary[]> {
    let params = new HttpParams();
    if (filter.missionId) params = params.set('missionId', filter.missionId);
    if (filter.status) params = params.set('status', filter.status);
    return this.http.get<{ items: CaseSummary[] }>(apiPath('cases'), { params }).pipe(map((r) => r.items));
  }

  /** What needs the caller in a workspace: reviews, returned drafts, followed cases, stale releases. */
  overview(workspaceId: string): Observable<WorkspaceOverview> {
    return this.http.get<WorkspaceOverview>(apiPath('workspaces', workspaceId, 'overview'));
  }

  get(caseId: string): Observable<CaseDetail> {
    return this.http.get<CaseDetail>(apiPath('cases', caseId));
  }

  /** Both cases come back as drafts: [hot, cold]. */
  derive(missionId: string, body: CaseDerive): Observable<CaseDetail[]> {
    return this.http.post<{ items: CaseDetail[] }>(apiPath('missions', missionId, 'cases', 'derive'), body).pipe(map((r) => r.items));
  }

  create(missionId: string, body: CaseCreate): Observable<CaseDetail> {
    return this.http.post<CaseDetail>(apiPath('missions', missionId, 'cases'), body);
  }

  update(caseId: string, body: CaseUpdate): Observable<CaseDetail> {
    return this.http.patch<CaseDetail>(apiPath('cases', caseId), body);
  }

  submit(caseId: string): Observable<CaseDetail> {
    return this.http.post<CaseDetail>(apiPath('cases', caseId, 'submit'), {});
  }

  /** Returns a case in review to its author with the comment (review -> draft). */
  returnToAuthor(caseId: string, text: string): Observable<CaseDetail> {
    return this.http.post<CaseDetail>(apiPath('cases', caseId, 'return'), { text });
  }

  comment(caseId: string, text: string): Observable<CaseComment> {
    return this.http.post<CaseComment>(apiPath('cases', caseId, 'comments'), { text });
  }

  release(caseId: string): Observable<CaseDetail> {
    return this.http.post<CaseDetail>(apiPath('cases', caseId, 'release'), {});
  }

  /** A new draft revision with its reason; `fromCurrentInputs` derives it again from the mission as it is now. */
  newRevision(caseId: string, reason: string, fromCurrentInputs = false): Observable<CaseDetail> {
    return this.http.post<CaseDetail>(apiPath('cases', caseId, 'revisions'), { reason, fromCurrentInputs });
  }

  compare(caseId: string, otherId: string): Observable<CaseComparison> {
    return this.http.get<CaseComparison>(apiPath('cases', caseId, 'compare'), { params: new HttpParams().set('with', otherId) });
  }

  setSubscribed(caseId: string, subscribed: boolean): Observable<boolean> {
    const url = apiPath('cases', caseId, 'subscription');
    const call = subscribed ? this.http.post<{ subscribed: boolean }>(url, {}) : this.http.delete<{ subscribed: boolean }>(url);
    return call.pipe(map((r) => r.subscribed));
  }

  /** A plain link: the browser downloads the file with the session cookie, no script in between. */
  exportUrl(caseId: string, format: 'json' | 'csv'): string {
    return `${apiPath('cases', caseId, 'export')}?format=${format}`;
  }

  /** The workspace's missions that are still active (GET missions answers every workspace of the user). */
  missions(workspaceId: string): Observable<Mission[]> {
    return this.http
      .get<{ items: Mission[] }>(apiPath('missions'))
      .pipe(map((r) => r.items.filter((m) => m.workspaceId === workspaceId && !m.archived)));
  }

  mission(missionId: string): Observable<MissionDetail> {
    return this.http.get<MissionDetail>(apiPath('missions', missionId));
  }
}
