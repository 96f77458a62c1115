// Reading and removing stored ephemerides, and who may: members of the mission's workspace read;
// analysts, thermal engineers and owners upload and delete; another workspace's mission is 404.
import { and, asc, desc, eq } from 'drizzle-orm';
import type { EphemerisPointsPage, EphemerisSummary } from '../../shared/api/ephemerides';
import type { Role } from '../../shared/api/workspaces';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import { memberRole, roleRefused } from '../auth/middleware';
import { ephemerides, missions, type EphemerisRow, type MissionRow } from '../db/schema';
import { notFound } from '../errors';
import { epochText } from './epoch-text';

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

interface PointRecord {
  seq: number;
  t_ms: number;
  x_km: number;
  y_km: number;
  z_km: number;
  vx_km_s: number | null;
  vy_km_s: number | null;
  vz_km_s: number | null;
}

export function pointsPage(ctx: AppContext, row: EphemerisRow, offset: number, limit: number): EphemerisPointsPage {
  const records = ctx.sqlite
    .prepare('SELECT seq, t_ms, x_km, y_km, z_km, vx_km_s, vy_km_s, vz_km_s FROM ephemeris_points WHERE ephemeris_id = ? AND seq >= ? ORDER BY seq LIMIT ?')
    .all(row.id, offset, limit) as PointRecord[];
  return {
    items: records.map((p) => ({
      seq: p.seq, epoch: epochText(p.t_ms), xKm: p.x_km, yKm: p.y_km, zKm: p.z_km, vxKmS: p.vx_km_s, vyKmS: p.vy_km_s, vzKmS: p.vz_km_s,
    })),
    offset,
    limit,
    total: row.rows,
  };
}

/** Removes the ephemeris and (by the cascade) its points, with the audit event, in one transaction. */
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
