// Who may see and change a mission: members of its workspace read, analysts, thermal engineers and
// owners edit. A mission of a workspace the caller is not in answers 404, exactly as a missing one.
import { and, eq } from 'drizzle-orm';
import type { Role } from '../../shared/api/workspaces';
import { memberRole, roleRefused } from '../auth/middleware';
import type { DbOrTx } from '../db/database';
import { missions, orbits, surfaces, type MissionRow, type OrbitRow, type SurfaceRow } from '../db/schema';
import { notFound } from '../errors';

export type { Tx } from '../db/database';
export type DbLike = DbOrTx;

export const editorRoles: readonly Role[] = ['owner', 'analyst', 'thermal'];
export const readerRoles: readonly Role[] = ['owner', 'analyst', 'thermal', 'viewer'];

export type Access = 'read' | 'edit';

const shown = (id: string): string => JSON.stringify(id.slice(0, 80));

export const noMission = (id: string) => notFound(`No mission with id ${shown(id)}.`);
export const noOrbit = (id: string) => notFound(`No orbit with id ${shown(id)} in this mission.`);
export const noSurface = (id: string) => notFound(`No surface with id ${shown(id)} in this mission.`);

export interface MissionAccess {
  mission: MissionRow;
  role: Role;
}

/** The mission if the user may `access` it: 404 when it is missing or not theirs, 403 for a viewer's write. */
export function missionFor(db: DbLike, userId: string, missionId: string, access: Access): MissionAccess {
  const mission = db.select().from(missions).where(eq(missions.id, missionId)).get();
  if (!mission) throw noMission(missionId);
  const role = memberRole(db, userId, mission.workspaceId);
  if (!role) throw noMission(missionId);
  const allowed = access === 'edit' ? editorRoles : readerRoles;
  if (!allowed.includes(role)) throw roleRefused(role, allowed);
  return { mission, role };
}

export function orbitOf(db: DbLike, missionId: string, orbitId: string): OrbitRow {
  const row = db
    .select()
    .from(orbits)
    .where(and(eq(orbits.id, orbitId), eq(orbits.missionId, missionId)))
    .get();
  if (!row) throw noOrbit(orbitId);
  return row;
}

export function surfaceOf(db: DbLike, missionId: string, surfaceId: string): SurfaceRow {
  const row = db
    .select()
    .from(surfaces)
    .where(and(eq(surfaces.id, surfaceId), eq(surfaces.missionId, missionId)))
    .get();
  if (!row) throw noSurface(surfaceId);
  return row;
}
