// Who may see and change which case. Members read their workspace's cases, viewers only released
// and superseded revisions (a draft is not theirs to see: 404, as for a non-member); thermal
// engineers and owners change them (PRODUCT.md "Users and roles").
import { eq } from 'drizzle-orm';
import type { Role } from '../../shared/api/workspaces';
import type { AppContext } from '../app-context';
import { memberRole, roleRefused } from '../auth/middleware';
import { loadCases, missions, type LoadCaseRow, type MissionRow } from '../db/schema';
import { badRequest, notFound } from '../errors';

export const caseEditors: readonly Role[] = ['thermal', 'owner'];

const quoted = (id: string) => JSON.stringify(id.slice(0, 80));

export const visibleToViewer = (status: LoadCaseRow['status']): boolean => status === 'released' || status === 'superseded';

export interface CaseAccess {
  row: LoadCaseRow;
  role: Role;
}

/** The case and the caller's role; 404 when the caller may not see it, 403 when `editing` and the role may not. */
export function caseFor(ctx: AppContext, userId: string, caseId: string, editing = false): CaseAccess {
  const row = ctx.db.select().from(loadCases).where(eq(loadCases.id, caseId)).get();
  const role = row ? memberRole(ctx.db, userId, row.workspaceId) : null;
  if (!row || !role || (role === 'viewer' && !visibleToViewer(row.status))) throw notFound(`No load case with id ${quoted(caseId)}.`);
  if (editing && !caseEditors.includes(role)) throw roleRefused(role, caseEditors);
  return { row, role };
}

/** The mission and the caller's role; 404 for a non-member, 403 for a role that may not make cases. */
export function missionForCases(ctx: AppContext, userId: string, missionId: string): { mission: MissionRow; role: Role } {
  const mission = ctx.db.select().from(missions).where(eq(missions.id, missionId)).get();
  const role = mission ? memberRole(ctx.db, userId, mission.workspaceId) : null;
  if (!mission || !role) throw notFound(`No mission with id ${quoted(missionId)}.`);
  if (!caseEditors.includes(role)) throw roleRefused(role, caseEditors);
  return { mission, role };
}

/** The case to compare `row` with: one the caller may see, of the same mission (400 otherwise). */
export function caseToCompareWith(ctx: AppContext, userId: string, row: LoadCaseRow, otherId: string): LoadCaseRow {
  const other = caseFor(ctx, userId, otherId).row;
  if (other.missionId !== row.missionId) {
    throw badRequest('Compare revisions of cases of the same mission.', [{ path: 'with', message: `case ${otherId} belongs to another mission` }]);
  }
  return other;
}
