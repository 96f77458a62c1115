// A workspace's own central bodies (shared/api/custom-bodies.ts): read by every member, written by
// owners, thermal engineers and analysts, each change with its audit event in one transaction. The
// physics finds them through getBody (shared/physics/bodies.ts setCustomBodyLookup, set in app.ts),
// so a mission, a compute request, the sweep and the case derivation take a custom body like one of
// the catalogue's; a body can only be used where its workspace is: useCustomBodyIn checks that.
import { and, asc, eq, inArray } from 'drizzle-orm';
import type { CustomBodyInput, CustomBodyResponse } from '../../shared/api/custom-bodies';
import { type Body } from '../../shared/physics/bodies';
import { customBody, isCustomBodyId, CUSTOM_BODY_PREFIX, type CustomBodyDefinition } from '../../shared/physics/custom-bodies';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { customBodies, missions, type CustomBodyRow } from '../db/schema';
import { badRequest, conflict, notFound } from '../errors';
import type { DbLike } from '../missions/mission-access';
import { withQuantityReader, type ReadQuantity } from '../missions/quantity-reader';

const apiId = (rowId: string) => `${CUSTOM_BODY_PREFIX}${rowId}` as const;
const rowIdOf = (bodyId: string): string => bodyId.slice(CUSTOM_BODY_PREFIX.length);
const shown = (id: string): string => JSON.stringify(id.slice(0, 80));

export const noCustomBody = (id: string) => notFound(`No body with id ${shown(id)} in this workspace.`);

const definitionOf = (row: CustomBodyRow): CustomBodyDefinition => ({ ...row.definition, id: apiId(row.id), name: row.name });

const toResponse = (row: CustomBodyRow): CustomBodyResponse => {
  const d = row.definition;
  return {
    id: apiId(row.id), workspaceId: row.workspaceId, name: row.name, gmKm3S2: d.gmKm3S2, radiusKm: d.radiusKm, j2: d.j2,
    place: d.place, albedo: d.albedo, olrWm2: d.olrWm2, airless: d.airless, sources: d.sources,
    createdAt: row.createdAt, updatedAt: row.updatedAt,
  };
};

/** The stored definition from a request: typed quantities read in km and days. */
function definitionFrom(input: CustomBodyInput, readQuantityIn: ReadQuantity): Omit<CustomBodyDefinition, 'id' | 'name'> {
  const positive = (value: number, path: string, words: string): number => {
    if (!(value > 0)) throw badRequest(`${path}: ${words} must be above 0 (got ${value}).`, [{ path, message: `${words} must be above 0 (got ${value})` }]);
    return value;
  };
  const radiusKm = positive(readQuantityIn(input.radiusKm, 'km', 'radiusKm'), 'radiusKm', 'the radius');
  const place: CustomBodyDefinition['place'] = input.place.kind === 'sun'
    ? input.place
    : {
      kind: 'planet', parentId: input.place.parentId,
      orbitRadiusKm: positive(readQuantityIn(input.place.orbitRadiusKm, 'km', 'place.orbitRadiusKm'), 'place.orbitRadiusKm', 'the orbit radius'),
      periodDays: positive(readQuantityIn(input.place.periodDays, 'd', 'place.periodDays'), 'place.periodDays', 'the orbit period'),
    };
  const sources = Object.fromEntries(Object.entries(input.sources).filter(([, text]) => typeof text === 'string' && text !== '')) as Record<string, string>;
  return { gmKm3S2: input.gmKm3S2, radiusKm, j2: input.j2, place, albedo: input.albedo, olrWm2: input.olrWm2, airless: input.airless, sources };
}

export function listCustomBodies(db: DbLike, workspaceIds: readonly string[]): CustomBodyResponse[] {
  if (workspaceIds.length === 0) return [];
  return db.select().from(customBodies).where(inArray(customBodies.workspaceId, [...workspaceIds])).orderBy(asc(customBodies.name)).all().map(toResponse);
}

function rowIn(db: DbLike, workspaceId: string, bodyId: string): CustomBodyRow {
  const row = isCustomBodyId(bodyId)
    ? db.select().from(customBodies).where(and(eq(customBodies.id, rowIdOf(bodyId)), eq(customBodies.workspaceId, workspaceId))).get()
    : undefined;
  if (!row) throw noCustomBody(bodyId);
  return row;
}

export const customBodyIn = (db: DbLike, workspaceId: string, bodyId: string): CustomBodyResponse => toResponse(rowIn(db, workspaceId, bodyId));

export function createCustomBody(db: Db, userId: string, workspaceId: string, input: CustomBodyInput): Promise<CustomBodyResponse> {
  return withQuantityReader((read) => db.transaction((tx) => {
    const definition = definitionFrom(input, read);
    const row = tx.insert(customBodies).values({ workspaceId, name: input.name, definition, createdBy: userId }).returning().get();
    recordAudit(tx, {
      workspaceId, actorUserId: userId, action: 'body.created', targetType: 'body', targetId: apiId(row.id),
      summary: `Body "${row.name}" added (${definition.airless ? 'airless' : 'with an atmosphere'}).`,
    });
    return toResponse(row);
  }));
}

export function updateCustomBody(db: Db, userId: string, workspaceId: string, bodyId: string, input: CustomBodyInput): Promise<CustomBodyResponse> {
  return withQuantityReader((read) => db.transaction((tx) => {
    const definition = definitionFrom(input, read);
    const before = rowIn(tx, workspaceId, bodyId);
    const row = tx.update(customBodies).set({ name: input.name, definition, updatedAt: new Date().toISOString() })
      .where(eq(customBodies.id, before.id)).returning().get();
    recordAudit(tx, {
      workspaceId, actorUserId: userId, action: 'body.updated', targetType: 'body', targetId: bodyId,
      summary: `Body "${before.name}" changed${before.name === row.name ? '' : ` (now "${row.name}")`}.`,
    });
    return toResponse(row);
  }));
}

export function deleteCustomBody(db: Db, userId: string, workspaceId: string, bodyId: string): void {
  db.transaction((tx) => {
    const row = rowIn(tx, workspaceId, bodyId);
    const users = tx.select({ name: missions.name }).from(missions).where(eq(missions.bodyId, apiId(row.id))).all();
    if (users.length > 0) {
      throw conflict(`Body "${row.name}" is the body of ${users.length} mission(s) (${users.slice(0, 3).map((m) => `"${m.name}"`).join(', ')}); change their body first.`, 'body_in_use');
    }
    tx.delete(customBodies).where(eq(customBodies.id, row.id)).run();
    recordAudit(tx, { workspaceId, actorUserId: userId, action: 'body.deleted', targetType: 'body', targetId: bodyId, summary: `Body "${row.name}" deleted.` });
  });
}

/** The physics' Body for a custom id, whatever its workspace (getBody's lookup; the routes check the workspace first). */
export function lookupCustomBody(db: DbLike, bodyId: string): Body | undefined {
  if (!isCustomBodyId(bodyId)) return undefined;
  const row = db.select().from(customBodies).where(eq(customBodies.id, rowIdOf(bodyId))).get();
  return row ? customBody(definitionOf(row)) : undefined;
}

/**
 * Refuses (400 naming `path`) a custom body that is not one of the given workspaces' own; a
 * catalogue body passes. The same words whether the body exists elsewhere or not at all.
 */
export function useCustomBodyIn(db: DbLike, workspaceIds: readonly string[], bodyId: string, path = 'bodyId'): void {
  if (!isCustomBodyId(bodyId)) return;
  const row = workspaceIds.length === 0
    ? undefined
    : db.select({ id: customBodies.id }).from(customBodies)
      .where(and(eq(customBodies.id, rowIdOf(bodyId)), inArray(customBodies.workspaceId, [...workspaceIds]))).get();
  if (!row) {
    const message = `${workspaceIds.length === 1 ? 'this workspace has' : 'your workspaces have'} no body ${shown(bodyId)}`;
    throw badRequest(`${path}: ${message}.`, [{ path, message }], 'unknown_body');
  }
}
