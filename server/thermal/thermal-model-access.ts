// Who may do what with a saved thermal model: every member of the mission's workspace reads;
// thermal engineers and owners edit (PRODUCT.md "Users and roles"); analysts may also run and size,
// which computes with the model but changes nothing of it. Another workspace's model is 404.
import { and, eq } from 'drizzle-orm';
import type { Role } from '../../shared/api/workspaces';
import { roleRefused } from '../auth/middleware';
import { visibleToViewer } from '../cases/case-access';
import { loadCases, missions, thermalModels, type LoadCaseRow, type MissionRow, type ThermalModelRow } from '../db/schema';
import { notFound } from '../errors';
import { memberRole } from '../auth/middleware';
import type { DbLike } from '../missions/mission-access';

export type ModelAccess = 'read' | 'run' | 'edit';

const allowedRoles: Record<ModelAccess, readonly Role[]> = {
  read: ['owner', 'thermal', 'analyst', 'viewer'],
  run: ['owner', 'thermal', 'analyst'],
  edit: ['owner', 'thermal'],
};

const shown = (id: string) => JSON.stringify(id.slice(0, 80));

export interface ModelWithAccess {
  row: ThermalModelRow;
  mission: MissionRow;
  role: Role;
}

function check(role: Role | null, access: ModelAccess, missing: () => Error): Role {
  if (!role) throw missing();
  if (!allowedRoles[access].includes(role)) throw roleRefused(role, allowedRoles[access]);
  return role;
}

/** The mission for a model list or a new model; 404 for a non-member, 403 for a role that may not. */
export function missionForModels(db: DbLike, userId: string, missionId: string, access: ModelAccess): { mission: MissionRow; role: Role } {
  const mission = db.select().from(missions).where(eq(missions.id, missionId)).get();
  const missing = () => notFound(`No mission with id ${shown(missionId)}.`);
  if (!mission) throw missing();
  return { mission, role: check(memberRole(db, userId, mission.workspaceId), access, missing) };
}

export function modelFor(db: DbLike, userId: string, modelId: string, access: ModelAccess): ModelWithAccess {
  const row = db.select().from(thermalModels).where(eq(thermalModels.id, modelId)).get();
  const missing = () => notFound(`No thermal model with id ${shown(modelId)}.`);
  const mission = row ? db.select().from(missions).where(eq(missions.id, row.missionId)).get() : undefined;
  if (!row || !mission) throw missing();
  return { row, mission, role: check(memberRole(db, userId, mission.workspaceId), access, missing) };
}

/** A load case of the model's own mission that the caller may see (viewers: released revisions only). */
export function caseOfMission(db: DbLike, mission: MissionRow, caseId: string, role: Role, field: string): LoadCaseRow {
  const row = db.select().from(loadCases).where(and(eq(loadCases.id, caseId), eq(loadCases.missionId, mission.id))).get();
  if (!row || (role === 'viewer' && !visibleToViewer(row.status))) {
    throw notFound(`${field}: no load case with id ${shown(caseId)} in the mission "${mission.name}".`);
  }
  return row;
}
