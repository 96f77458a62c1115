import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { CustomBodyInput, CustomBodyResponse } from '../../../shared/api/custom-bodies';
import type { EnvironmentTablePut, EnvironmentTableResponse } from '../../../shared/api/environment-table';
import type { AuditEvent, Invitation, InvitationCreate, Member, Role } from '../../../shared/api/workspaces';
import { apiPath } from '../api/api-path';

export interface AuditFilter {
  readonly action?: string;
  readonly actor?: string;
  /** ISO 8601 with offset, as the server's auditQuery expects. */
  readonly since?: string;
  readonly until?: string;
  readonly limit: number;
  readonly offset: number;
}

/** The workspace routes of shared/api/workspaces.ts (members, invitations, audit log) and its environment table. */
@Injectable({ providedIn: 'root' })
export class WorkspaceApi {
  private readonly http = inject(HttpClient);

  members(workspaceId: string): Observable<{ items: Member[] }> {
    return this.http.get<{ items: Member[] }>(apiPath('workspaces', workspaceId, 'members'));
  }

  changeRole(workspaceId: string, userId: string, role: Role): Observable<Member> {
    return this.http.patch<Member>(apiPath('workspaces', workspaceId, 'members', userId), { role });
  }

  removeMember(workspaceId: string, userId: string): Observable<unknown> {
    return this.http.delete(apiPath('workspaces', workspaceId, 'members', userId));
  }

  invitations(workspaceId: string): Observable<{ items: Invitation[] }> {
    return this.http.get<{ items: Invitation[] }>(apiPath('workspaces', workspaceId, 'invitations'));
  }

  invite(workspaceId: string, invitation: InvitationCreate): Observable<Invitation> {
    return this.http.post<Invitation>(apiPath('workspaces', workspaceId, 'invitations'), invitation);
  }

  revokeInvitation(workspaceId: string, invitationId: string): Observable<unknown> {
    return this.http.delete(apiPath('workspaces', workspaceId, 'invitations', invitationId));
  }

  environmentTable(workspaceId: string): Observable<EnvironmentTableResponse> {
    return this.http.get<EnvironmentTableResponse>(apiPath('workspaces', workspaceId, 'environment-table'));
  }

  saveEnvironmentTable(workspaceId: string, table: EnvironmentTablePut): Observable<EnvironmentTableResponse> {
    return this.http.put<EnvironmentTableResponse>(apiPath('workspaces', workspaceId, 'environment-table'), table);
  }

  customBodies(workspaceId: string): Observable<{ items: CustomBodyResponse[] }> {
    return this.http.get<{ items: CustomBodyResponse[] }>(apiPath('workspaces', workspaceId, 'bodies'));
  }

  createCustomBody(workspaceId: string, body: CustomBodyInput): Observable<CustomBodyResponse> {
    return this.http.post<CustomBodyResponse>(apiPath('workspaces', workspaceId, 'bodies'), body);
  }

  updateCustomBody(workspaceId: string, bodyId: string, body: CustomBodyInput): Observable<CustomBodyResponse> {
    return this.http.put<CustomBodyResponse>(apiPath('workspaces', workspaceId, 'bodies', bodyId), body);
  }

  deleteCustomBody(workspaceId: string, bodyId: string): Observable<unknown> {
    return this.http.delete(apiPath('workspaces', workspaceId, 'bodies', bodyId));
  }

  audit(workspaceId: string, query: AuditFilter): Observable<{ items: AuditEvent[]; total: number }> {
    let params = new HttpParams().set('limit', query.limit).set('offset', query.offset);
    for (const key of ['action', 'actor', 'since', 'until'] as const) {
      const value = query[key];
      if (value) params = params.set(key, value);
    }
    return this.http.get<{ items: AuditEvent[]; total: number }>(apiPath('workspaces', workspaceId, 'audit'), { params });
  }
}
