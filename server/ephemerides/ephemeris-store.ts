// Reading and removing stored ephemerides, and who may: members of the mission's workspace read;
// analysts, thermal engineers and owners upload and delete; another workspace's mission is 404.
import { and, asc, desc, eq, gt, sql } from 'drizzle-orm';
import type { EphemerisPointsPage, EphemerisSummary } from '../../shared/api/ephemerides';
import type { Role } from '../../shared/api/workspaces';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import { memberRole, roleRefused } from '../auth/middleware';
import type { Db } from '../db/database';
import { preparedPer } from '../db/prepared';
import { ephemerides, ephemerisPointBlocks, missions, type EphemerisRow, type MissionRow } from '../db/schema';
import { notFound } from '../errors';
import { epochText } from './epoch-text';
import { POINT_FIELDS, unpackBlock } from './point-blocks';

const editors: readonly Role[] = ['owner', 'analyst', 'thermal'];
const shown = (id: string): string => JSON.stringify(id.slice(0, 80));

/** The mission when the user may read it (or edit it): 404 hides other workspaces' missions. */
export function ephemerisMission(ctx: AppContext, userId: string, missionId: string, access: 'read' | 'edit'): MissionRow {
  const mission = ctx.db.select().from(missions).where(eq(missions.id, missionId)).get();
  const role = mission ? memberRole(ctx.db, userId, mission.workspaceId) : null;
  if (!mission || !role) throw notFound(`No mission with id ${shown(missionId)}.`);
  if (access === 'edit' && !editors.includes(role)) throw roleRefused(role, editors);
  return mission;
}

export function ephemerisOf(ctx: AppContext, missionId: string, ephemerisId: string): EphemerisRow {
  const row = ctx.db
    .select()
    .from(ephemerides)
    .where(and(eq(ephemerides.id, ephemerisId), eq(ephemerides.missionId, missionId)))
    .get();
  if (!row) throw notFound(`No ephemeris with id ${shown(ephemerisId)} in this mission.`);
  return row;
}

export const toEphemerisSummary = (row: EphemerisRow): EphemerisSummary => ({
  id: row.id,
  missionId: row.missionId,
  name: row.name,
  frame: row.frame,
  format: row.format,
  rows: row.rows,
  startEpoch: row.startEpoch,
  endEpoch: row.endEpoch,
  stepS: row.stepS,
  minAltitudeKm: row.minAltitudeKm,
  maxAltitudeKm: row.maxAltitudeKm,
  hasVelocity: row.hasVelocity,
  sha256: row.sha256,
  fileName: row.fileName,
  createdAt: row.createdAt,
});

export function listEphemerides(ctx: AppContext, missionId: string): EphemerisSummary[] {
  return ctx.db
    .select()
    .from(ephemerides)
    .where(eq(ephemerides.missionId, missionId))
    .orderBy(desc(ephemerides.createdAt), asc(ephemerides.name))
    .all()
    .map(toEphemerisSummary);
}

export interface StoredBlock {
  /** 0-based order in the file of the block's first point. */
  firstSeq: number;
  points: number;
  /** POINT_FIELDS values a point: t_ms, x, y, z, vx, vy, vz (NaN when there are no velocities). */
  values: Float64Array;
}

/** Blocks read per statement: about 0.9 MB, so a long trajectory is never held in memory whole. */
const BLOCKS_PER_READ = 4;

const blocksAfter = preparedPer((db: Db) =>
  db
    .select({ block: ephemerisPointBlocks.block, firstSeq: ephemerisPointBlocks.firstSeq, points: ephemerisPointBlocks.points, data: ephemerisPointBlocks.data })
    .from(ephemerisPointBlocks)
    .where(
      and(
        eq(ephemerisPointBlocks.ephemerisId, sql.placeholder('ephemerisId')),
        gt(ephemerisPointBlocks.block, sql.placeholder('after')),
        gt(sql`${ephemerisPointBlocks.firstSeq} + ${ephemerisPointBlocks.points}`, sql.placeholder('fromSeq')),
      ),
    )
    .orderBy(asc(ephemerisPointBlocks.block))
    .limit(BLOCKS_PER_READ)
    .prepare(),
);

/** The ephemeris' point blocks in file order, from the one holding point `fromSeq` on, a few blocks a read. */
export function* storedBlocks(ctx: AppContext, ephemerisId: string, fromSeq = 0): Generator<StoredBlock> {
  let after = -1;
  for (;;) {
    const rows = blocksAfter(ctx.db).all({ ephemerisId, after, fromSeq });
    for (const r of rows) yield { firstSeq: r.firstSeq, points: r.points, values: unpackBlock(r.data) };
    const last = rows.at(-1);
    if (!last || rows.length < BLOCKS_PER_READ) return;
    after = last.block;
  }
}

const orNull = (x: number): number | null => (Number.isNaN(x) ? null : x);

export function pointsPage(ctx: AppContext, row: EphemerisRow, offset: number, limit: number): EphemerisPointsPage {
  const items: EphemerisPointsPage['items'] = [];
  for (const block of storedBlocks(ctx, row.id, offset)) {
    const v = block.values;
    for (let k = Math.max(0, offset - block.firstSeq); k < block.points && items.length < limit; k++) {
      const i = k * POINT_FIELDS;
      items.push({
        seq: block.firstSeq + k, epoch: epochText(v[i]), xKm: v[i + 1], yKm: v[i + 2], zKm: v[i + 3],
        vxKmS: orNull(v[i + 4]), vyKmS: orNull(v[i + 5]), vzKmS: orNull(v[i + 6]),
      });
    }
    if (items.length >= limit) break;
  }
  return { items, offset, limit, total: row.rows };
}

/** Removes the ephemeris and (by the cascade) its point blocks, with the audit event, in one transaction. */
export function deleteEphemeris(ctx: AppContext, mission: MissionRow, row: EphemerisRow, userId: string): void {
  ctx.db.transaction((tx) => {
    tx.delete(ephemerides).where(eq(ephemerides.id, row.id)).run();
    recordAudit(tx, {
      workspaceId: mission.workspaceId,
      actorUserId: userId,
      action: 'ephemeris.deleted',
      targetType: 'ephemeris',
      targetId: row.id,
      summary: `Ephemeris "${row.name}" (${row.rows} rows) deleted from mission "${mission.name}".`,
    });
  });
}
