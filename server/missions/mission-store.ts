// Missions: listing across the caller's workspaces, creating, changing (archiving too) and deleting,
// each change with its audit event in the same transaction.
import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { MissionDetail, Mission, missionCreate, missionUpdate } from '../../shared/api/missions';
import type { Role } from '../../shared/api/workspaces';
import type { z } from 'zod';
import { getBody } from '../../shared/physics/bodies';
import { useCustomBodyIn } from '../bodies/custom-body-store';
import { recordAudit } from '../audit/audit-log';
import { noWorkspace, roleRefused } from '../auth/middleware';
import type { Db } from '../db/database';
import {
  caseSubscriptions, ephemerides, loadCases, memberships, missions, orbits, surfaces, thermalModels, thermalRuns, workspaces,
  type LoadCaseRow, type MissionRow,
} from '../db/schema';
import { ApiError, badRequest } from '../errors';
import { memberRole } from '../auth/middleware';
import { editorRoles, missionFor, type Tx } from './mission-access';
import { toMission, toOrbit, toSurface } from './mission-responses';
import { canonicalOrbit } from './orbit-values';
import { phasesStayWithin } from './phase-store';
import { withQuantityReader, type ReadQuantity } from './quantity-reader';

type MissionCreate = z.output<typeof missionCreate>;
type MissionUpdate = z.output<typeof missionUpdate>;

export function listMissions(db: Db, userId: string, includeArchived: boolean): Mission[] {
  const mine = db.select({ id: memberships.workspaceId }).from(memberships).where(eq(memberships.userId, userId));
  const rows = db
    .select()
    .from(missions)
    .where(and(inArray(missions.workspaceId, mine), includeArchived ? undefined : isNull(missions.archivedAt)))
    .orderBy(asc(missions.name), asc(missions.id))
    .all();
  return rows.map(toMission);
}

export function missionDetail(db: Db, mission: MissionRow): MissionDetail {
  const orbitRows = db.select().from(orbits).where(eq(orbits.missionId, mission.id)).orderBy(asc(orbits.createdAt), sql`"orbits".rowid`).all();
  const surfaceRows = db.select().from(surfaces).where(eq(surfaces.missionId, mission.id)).orderBy(asc(surfaces.createdAt), sql`"surfaces".rowid`).all();
  return { ...toMission(mission), orbits: orbitRows.map(toOrbit), surfaces: surfaceRows.map(toSurface) };
}

/** The workspace a new mission goes to: the one named, or the caller's only one. */
function targetWorkspace(db: Db, userId: string, workspaceId: string | undefined): string {
  if (workspaceId !== undefined) return workspaceId;
  const mine = db
    .select({ id: workspaces.id, name: workspaces.name })
    .from(memberships)
    .innerJoin(workspaces, eq(workspaces.id, memberships.workspaceId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(workspaces.name))
    .all();
  const [only] = mine;
  if (mine.length === 1 && only) return only.id;
  const message =
    mine.length === 0
      ? 'You belong to no workspace, so there is nowhere to create the mission.'
      : `workspaceId: you belong to ${mine.length} workspaces, so say which one: ${mine.map((w) => `${w.name} (${w.id})`).join(', ')}.`;
  throw badRequest(message, [{ path: 'workspaceId', message }]);
}

export function createMission(db: Db, userId: string, input: MissionCreate): Mission {
  const workspaceId = targetWorkspace(db, userId, input.workspaceId);
  return db.transaction((tx) => {
    const role = memberRole(tx, userId, workspaceId);
    if (!role) throw noWorkspace(workspaceId);
    if (!editorRoles.includes(role)) throw roleRefused(role, editorRoles);
    // a workspace's own body only in its own missions
    useCustomBodyIn(tx, [workspaceId], input.bodyId);
    const { workspaceId: _named, ...fields } = input;
    const row = tx.insert(missions).values({ ...fields, workspaceId, createdBy: userId }).returning().get();
    recordAudit(tx, {
      workspaceId,
      actorUserId: userId,
      action: 'mission.created',
      targetType: 'mission',
      targetId: row.id,
      summary: `Mission "${row.name}" created (${getBody(row.bodyId).name}, ${row.startDate} to ${row.endDate}).`,
    });
    return toMission(row);
  });
}

const describeChange = (name: string, before: unknown, after: unknown): string =>
  `${name} ${JSON.stringify(before)} -> ${JSON.stringify(after)}`;

/** A change of body moves every orbit's canonical values (altitudes are above the new body). */
function recomputeOrbits(tx: Tx, missionId: string, bodyId: string, read: ReadQuantity): void {
  const body = getBody(bodyId);
  for (const orbit of tx.select().from(orbits).where(eq(orbits.missionId, missionId)).all()) {
    let values;
    try {
      values = canonicalOrbit(orbit.input, body, read);
    } catch (error) {
      if (error instanceof ApiError) {
        const message = `bodyId: orbit "${orbit.name}" does not fit around ${body.name}: ${error.message}`;
        throw new ApiError(422, error.code, message, [{ path: 'bodyId', message }]);
      }
      throw error;
    }
    tx.update(orbits).set({ ...values, updatedAt: new Date().toISOString() }).where(eq(orbits.id, orbit.id)).run();
  }
}

export function updateMission(db: Db, userId: string, missionId: string, input: MissionUpdate): Promise<Mission> {
  // A new body recomputes every stored orbit from its typed fields.
  return withQuantityReader((read) => db.transaction((tx) => {
    const { mission } = missionFor(tx, userId, missionId, 'edit');
    const startDate = input.startDate ?? mission.startDate;
    const endDate = input.endDate ?? mission.endDate;
    if (endDate < startDate) {
      const path = input.endDate !== undefined ? 'endDate' : 'startDate';
      const message = `${path}: the mission would end (${endDate}) before it starts (${startDate})`;
      throw badRequest(`${message}.`, [{ path, message }]);
    }
    if (startDate !== mission.startDate || endDate !== mission.endDate) phasesStayWithin(tx, mission.id, startDate, endDate);
    const { archived, ...fields } = input;
    const changes: string[] = [];
    for (const [name, value] of Object.entries(fields)) {
      const before: unknown = mission[name as keyof typeof fields];
      if (value !== undefined && value !== before) changes.push(name === 'description' ? 'description' : describeChange(name, before, value));
    }
    let archivedAt = mission.archivedAt;
    if (archived === true && archivedAt === null) {
      archivedAt = new Date().toISOString();
      changes.push('archived');
    } else if (archived === false && archivedAt !== null) {
      archivedAt = null;
      changes.push('un-archived');
    }
    if (changes.length === 0) return toMission(mission);
    if (fields.bodyId !== undefined && fields.bodyId !== mission.bodyId) {
      useCustomBodyIn(tx, [mission.workspaceId], fields.bodyId);
      recomputeOrbits(tx, mission.id, fields.bodyId, read);
    }
    const row = tx
      .update(missions)
      .set({ ...fields, archivedAt, updatedAt: new Date().toISOString() })
      .where(eq(missions.id, mission.id))
      .returning()
      .get();
    const action = archived === true && changes.length === 1 ? 'mission.archived' : archived === false && changes.length === 1 ? 'mission.unarchived' : 'mission.updated';
    recordAudit(tx, {
      workspaceId: mission.workspaceId,
      actorUserId: userId,
      action,
      targetType: 'mission',
      targetId: mission.id,
      summary: `Mission "${row.name}": ${changes.join('; ')}.`,
    });
    return toMission(row);
  }));
}

/** Roles that may delete a whole mission (with everything in it that is not released). */
export const missionDeleteRoles: readonly Role[] = ['owner'];

const counted = (n: number, singular: string, plural = `${singular}s`): string => `${n} ${n === 1 ? singular : plural}`;

/**
 * Deletes a mission: only an owner may, and never one that holds released or superseded load
 * cases (409 naming them; archive it instead), because other teams import those. Everything else
 * goes with it, listed in the audit event: orbits, surfaces, ephemerides, thermal models and their
 * runs, draft and in-review cases and the subscriptions to their series.
 */
export function deleteMission(db: Db, userId: string, missionId: string): void {
  db.transaction((tx) => {
    const { mission, role } = missionFor(tx, userId, missionId, 'read');
    if (!missionDeleteRoles.includes(role)) throw roleRefused(role, missionDeleteRoles);
    const cases = tx
      .select({ id: loadCases.id, seriesId: loadCases.seriesId, name: loadCases.name, revision: loadCases.revision, status: loadCases.status })
      .from(loadCases)
      .where(eq(loadCases.missionId, mission.id))
      .orderBy(asc(loadCases.name), asc(loadCases.revision))
      .all();
    const kept = cases.filter((c) => keptStatuses.includes(c.status));
    if (kept.length > 0) throw releasedCasesKept(mission, kept);

    const ids = (rows: { id: string }[]) => rows.map((r) => r.id);
    const orbitCount = tx.select({ id: orbits.id }).from(orbits).where(eq(orbits.missionId, mission.id)).all().length;
    const surfaceCount = tx.select({ id: surfaces.id }).from(surfaces).where(eq(surfaces.missionId, mission.id)).all().length;
    const ephemerisRows = tx.select({ rows: ephemerides.rows }).from(ephemerides).where(eq(ephemerides.missionId, mission.id)).all();
    const modelIds = ids(tx.select({ id: thermalModels.id }).from(thermalModels).where(eq(thermalModels.missionId, mission.id)).all());
    const runCount = modelIds.length === 0 ? 0 : tx.select({ id: thermalRuns.id }).from(thermalRuns).where(inArray(thermalRuns.modelId, modelIds)).all().length;
    // Subscriptions follow a series, not a row, so no foreign key removes them: a series that had
    // no release lives only in this mission and goes with it.
    const series = [...new Set(cases.map((c) => c.seriesId))];
    const subscriptionCount = series.length === 0 ? 0 : tx.delete(caseSubscriptions).where(inArray(caseSubscriptions.caseSeriesId, series)).run().changes;
    // The rest goes with it by ON DELETE CASCADE (a database trigger refuses any released case).
    tx.delete(missions).where(eq(missions.id, mission.id)).run();
    const removed = [
      counted(orbitCount, 'orbit'),
      counted(surfaceCount, 'surface'),
      `${counted(ephemerisRows.length, 'ephemeris', 'ephemerides')} (${ephemerisRows.reduce((n, e) => n + e.rows, 0)} rows)`,
      `${counted(modelIds.length, 'thermal model')} with ${counted(runCount, 'stored run')}`,
      `${counted(cases.length, 'unreleased load case')}${cases.length > 0 ? ` (${cases.map((c) => `"${c.name}" revision ${c.revision}, ${c.status}`).join('; ')})` : ''}`,
      counted(subscriptionCount, 'subscription'),
    ];
    recordAudit(tx, {
      workspaceId: mission.workspaceId,
      actorUserId: userId,
      action: 'mission.deleted',
      targetType: 'mission',
      targetId: mission.id,
      summary: `Mission "${mission.name}" deleted with ${removed.join(', ')}.`,
    });
  });
}

/** Statuses whose cases other teams may have imported: they are never deleted. */
const keptStatuses: readonly LoadCaseRow['status'][] = ['released', 'superseded'];

function releasedCasesKept(mission: MissionRow, kept: Pick<LoadCaseRow, 'name' | 'revision' | 'status'>[]): ApiError {
  const listed = kept.map((c) => `"${c.name}" revision ${c.revision} (${c.status})`);
  const message =
    `The mission "${mission.name}" holds ${counted(kept.length, 'load case')} that ${kept.length === 1 ? 'was' : 'were'} released: ${listed.join(', ')}. ` +
    'Released cases stay for the teams that import them, so the mission cannot be deleted; archive it instead.';
  return new ApiError(409, 'mission_has_released_cases', message, listed.map((text) => ({ message: text })));
}
