// Materials: the built-in library (read-only) plus each workspace's own, which its analysts,
// thermal engineers and owners add, change and delete. A material a surface uses stays.
import { and, asc, eq, inArray, isNull, ne, or, sql } from 'drizzle-orm';
import type { z } from 'zod';
import type { Material, materialCreate, materialUpdate } from '../../shared/api/missions';
import { recordAudit } from '../audit/audit-log';
import { memberRole, noWorkspace } from '../auth/middleware';
import type { Db } from '../db/database';
import { materials, memberships, missions, surfaces, type MaterialRow } from '../db/schema';
import { conflict, forbidden, notFound } from '../errors';
import type { Tx } from './mission-access';
import { toMaterial } from './mission-responses';

type MaterialCreate = z.output<typeof materialCreate>;
type MaterialUpdate = z.output<typeof materialUpdate>;

/** The library and the workspace's own (the caller is a member), or the library and all the caller's workspaces'. */
/** The library and the caller's workspaces' own materials (one workspace's when given: 404 for a non-member). */
export function listMaterials(db: Db, userId: string, workspaceId: string | undefined): Material[] {
  if (workspaceId !== undefined && !memberRole(db, userId, workspaceId)) throw noWorkspace(workspaceId);
  const own =
    workspaceId !== undefined
      ? eq(materials.workspaceId, workspaceId)
      : inArray(materials.workspaceId, db.select({ id: memberships.workspaceId }).from(memberships).where(eq(memberships.userId, userId)));
  return db
    .select()
    .from(materials)
    .where(or(isNull(materials.workspaceId), own))
    // The library first, in DOMAIN.md's order (rowid: insertion order); then the workspaces' own by name.
    .orderBy(sql`${materials.workspaceId} IS NOT NULL`, sql`CASE WHEN ${materials.workspaceId} IS NULL THEN rowid END`, asc(materials.name))
    .all()
    .map(toMaterial);
}

/** A workspace's own material; 403 for a library row (it is reference data), 404 for anything else. */
function ownMaterial(tx: Tx, workspaceId: string, materialId: string): MaterialRow {
  const row = tx.select().from(materials).where(eq(materials.id, materialId)).get();
  if (row && row.workspaceId === null) {
    throw forbidden(`"${row.name}" is a library material and cannot be changed or deleted; add a workspace material with your own values instead.`, 'library_material');
  }
  if (!row || row.workspaceId !== workspaceId) throw notFound(`No material with id ${JSON.stringify(materialId.slice(0, 80))} in this workspace.`);
  return row;
}

function requireUniqueName(tx: Tx, workspaceId: string, name: string, exceptId?: string): void {
  const clash = tx
    .select({ id: materials.id })
    .from(materials)
    .where(and(eq(materials.workspaceId, workspaceId), sql`lower(${materials.name}) = lower(${name})`, exceptId ? ne(materials.id, exceptId) : undefined))
    .get();
  if (clash) throw conflict(`The workspace already has a material named ${JSON.stringify(name)}.`, 'duplicate_name');
}

const optics = (m: Pick<MaterialRow, 'absorptivityBol' | 'emissivityBol' | 'absorptivityEol' | 'emissivityEol'>): string =>
  `alpha/epsilon BOL ${m.absorptivityBol}/${m.emissivityBol}, EOL ${m.absorptivityEol}/${m.emissivityEol}`;

export function createMaterial(db: Db, userId: string, workspaceId: string, input: MaterialCreate): Material {
  return db.transaction((tx) => {
    requireUniqueName(tx, workspaceId, input.name);
    const row = tx.insert(materials).values({ ...input, workspaceId }).returning().get();
    audit(tx, userId, workspaceId, 'material.created', row.id, `Material "${row.name}" added: ${optics(row)}.`);
    return toMaterial(row);
  });
}

/** Only the fields the request named: materialUpdate's schema fills in source's default otherwise. */
function sentOnly(value: MaterialUpdate, sent: ReadonlySet<string>): MaterialUpdate {
  const out: MaterialUpdate = {};
  for (const key of Object.keys(value) as (keyof MaterialUpdate)[]) {
    if (sent.has(key)) Object.assign(out, { [key]: value[key] });
  }
  return out;
}

export function updateMaterial(db: Db, userId: string, workspaceId: string, materialId: string, parsed: MaterialUpdate, sent: ReadonlySet<string>): Material {
  const input = sentOnly(parsed, sent);
  return db.transaction((tx) => {
    const material = ownMaterial(tx, workspaceId, materialId);
    if (input.name !== undefined) requireUniqueName(tx, workspaceId, input.name, material.id);
    const changes = Object.entries(input)
      .filter(([name, value]) => value !== undefined && value !== material[name as keyof MaterialUpdate])
      .map(([name, value]) => `${name} ${JSON.stringify(material[name as keyof MaterialUpdate])} -> ${JSON.stringify(value)}`);
    if (changes.length === 0) return toMaterial(material);
    const row = tx.update(materials).set(input).where(eq(materials.id, material.id)).returning().get();
    audit(tx, userId, workspaceId, 'material.updated', row.id, `Material "${material.name}": ${changes.join('; ')}.`);
    return toMaterial(row);
  });
}

export function deleteMaterial(db: Db, userId: string, workspaceId: string, materialId: string): void {
  db.transaction((tx) => {
    const material = ownMaterial(tx, workspaceId, materialId);
    const users = tx
      .select({ surface: surfaces.name, mission: missions.name })
      .from(surfaces)
      .innerJoin(missions, eq(missions.id, surfaces.missionId))
      .where(eq(surfaces.materialId, material.id))
      .orderBy(asc(missions.name), asc(surfaces.name))
      .all();
    if (users.length > 0) {
      const named = users.slice(0, 10).map((u) => `"${u.surface}" (${u.mission})`).join(', ');
      const more = users.length > 10 ? ` and ${users.length - 10} more` : '';
      throw conflict(`Material "${material.name}" is used by ${users.length} surface(s): ${named}${more}. Give them another material first.`, 'material_in_use');
    }
    tx.delete(materials).where(eq(materials.id, material.id)).run();
    audit(tx, userId, workspaceId, 'material.deleted', material.id, `Material "${material.name}" deleted.`);
  });
}

function audit(tx: Tx, userId: string, workspaceId: string, action: string, targetId: string, summary: string): void {
  recordAudit(tx, { workspaceId, actorUserId: userId, action, targetType: 'material', targetId, summary });
}
