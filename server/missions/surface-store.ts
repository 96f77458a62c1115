// Spacecraft surfaces of a mission: an area (typed with or without a unit), a normal in the local
// orbital frame and a material from the library or the mission's own workspace.
import { and, asc, eq, ne, sql } from 'drizzle-orm';
import type { z } from 'zod';
import type { Surface, surfaceCreate, surfaceUpdate } from '../../shared/api/missions';
import { PhysicsError } from '../../shared/physics/physics-error';
import { pointingWords } from '../../shared/physics/pointing-words';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { materials, surfaces, type MaterialRow, type MissionRow, type SurfaceRow } from '../db/schema';
import { badRequest, conflict } from '../errors';
import { missionFor, surfaceOf, type Tx } from './mission-access';
import { toSurface } from './mission-responses';
import { withQuantityReader, type ReadQuantity } from './quantity-reader';

type SurfaceCreate = z.output<typeof surfaceCreate>;
type SurfaceUpdate = z.output<typeof surfaceUpdate>;

// The compute route's own bound (shared/api/environment.ts surfaceInput).
const MAX_AREA_M2 = 10000;

const refuse = (path: string, message: string) => badRequest(`${path}: ${message}.`, [{ path, message }]);

function readAreaM2(read: ReadQuantity, value: number | string): number {
  let area: number;
  try {
    area = read(value, 'm^2', 'areaM2');
  } catch (error) {
    if (error instanceof PhysicsError) throw refuse('areaM2', error.message);
    throw error;
  }
  if (!(area > 0)) throw refuse('areaM2', `the area must be above 0 m² (got ${JSON.stringify(value)})`);
  if (area > MAX_AREA_M2) throw refuse('areaM2', `the area is at most ${MAX_AREA_M2} m² (got ${JSON.stringify(value)})`);
  return area;
}

/** The material if the mission may use it: the library's, or its own workspace's. */
function usableMaterial(tx: Tx, mission: MissionRow, materialId: string): MaterialRow {
  const row = tx.select().from(materials).where(eq(materials.id, materialId)).get();
  if (!row || (row.workspaceId !== null && row.workspaceId !== mission.workspaceId)) {
    throw refuse('materialId', `no material ${JSON.stringify(materialId.slice(0, 80))} in the library or this mission's workspace`);
  }
  return row;
}

function requireUniqueName(tx: Tx, missionId: string, name: string, exceptId?: string): void {
  const clash = tx
    .select({ id: surfaces.id })
    .from(surfaces)
    .where(and(eq(surfaces.missionId, missionId), eq(surfaces.name, name), exceptId ? ne(surfaces.id, exceptId) : undefined))
    .get();
  // Results label each surface by its name, so two of one name could not be told apart.
  if (clash) throw conflict(`The mission already has a surface named ${JSON.stringify(name)}; surface names are unique in a mission.`, 'duplicate_name');
}

export function listSurfaces(db: Db, missionId: string): Surface[] {
  return db.select().from(surfaces).where(eq(surfaces.missionId, missionId)).orderBy(asc(surfaces.createdAt), sql`"surfaces".rowid`).all().map(toSurface);
}

export function createSurface(db: Db, userId: string, missionId: string, input: SurfaceCreate): Promise<Surface> {
  return withQuantityReader((read) => db.transaction((tx) => {
    const { mission } = missionFor(tx, userId, missionId, 'edit');
    const areaM2 = readAreaM2(read, input.areaM2);
    const material = usableMaterial(tx, mission, input.materialId);
    requireUniqueName(tx, mission.id, input.name);
    const row = tx
      .insert(surfaces)
      .values({ missionId: mission.id, name: input.name, areaM2, normal: input.normal, materialId: material.id })
      .returning()
      .get();
    audit(tx, userId, mission, 'surface.created', row.id, `Surface "${row.name}" added to mission "${mission.name}": ${areaM2} m², ${describeNormal(row.normal)}, ${material.name}.`);
    return toSurface(row);
  }));
}

const describeNormal = (normal: SurfaceRow['normal']): string => pointingWords(normal);

export function updateSurface(db: Db, userId: string, missionId: string, surfaceId: string, input: SurfaceUpdate): Promise<Surface> {
  return withQuantityReader((read) => db.transaction((tx) => {
    const { mission } = missionFor(tx, userId, missionId, 'edit');
    const surface = surfaceOf(tx, mission.id, surfaceId);
    const changes: string[] = [];
    const next = { name: surface.name, areaM2: surface.areaM2, normal: surface.normal, materialId: surface.materialId };
    if (input.name !== undefined && input.name !== surface.name) {
      requireUniqueName(tx, mission.id, input.name, surface.id);
      changes.push(`renamed "${surface.name}" -> "${input.name}"`);
      next.name = input.name;
    }
    if (input.areaM2 !== undefined) {
      next.areaM2 = readAreaM2(read, input.areaM2);
      if (next.areaM2 !== surface.areaM2) changes.push(`area ${surface.areaM2} -> ${next.areaM2} m²`);
    }
    if (input.normal !== undefined && JSON.stringify(input.normal) !== JSON.stringify(surface.normal)) {
      changes.push(`${describeNormal(surface.normal)} -> ${describeNormal(input.normal)}`);
      next.normal = input.normal;
    }
    if (input.materialId !== undefined && input.materialId !== surface.materialId) {
      const material = usableMaterial(tx, mission, input.materialId);
      changes.push(`material -> ${material.name}`);
      next.materialId = material.id;
    }
    if (changes.length === 0) return toSurface(surface);
    const row = tx.update(surfaces).set({ ...next, updatedAt: new Date().toISOString() }).where(eq(surfaces.id, surface.id)).returning().get();
    audit(tx, userId, mission, 'surface.updated', row.id, `Surface "${row.name}" of mission "${mission.name}": ${changes.join('; ')}.`);
    return toSurface(row);
  }));
}

export function deleteSurface(db: Db, userId: string, missionId: string, surfaceId: string): void {
  db.transaction((tx) => {
    const { mission } = missionFor(tx, userId, missionId, 'edit');
    const surface = surfaceOf(tx, mission.id, surfaceId);
    tx.delete(surfaces).where(eq(surfaces.id, surface.id)).run();
    audit(tx, userId, mission, 'surface.deleted', surface.id, `Surface "${surface.name}" removed from mission "${mission.name}".`);
  });
}

function audit(tx: Tx, userId: string, mission: MissionRow, action: string, targetId: string, summary: string): void {
  recordAudit(tx, { workspaceId: mission.workspaceId, actorUserId: userId, action, targetType: 'surface', targetId, summary });
}
