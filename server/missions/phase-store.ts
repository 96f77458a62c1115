// A mission's attitude modes and phases (shared/api/phases.ts): every member reads, thermal
// engineers and owners change them (an analyst is refused with 403), each change with its audit
// event in the same transaction. A mode points the mission's surfaces by id; a phase flies a mode of
// the same mission, lies within the mission's dates, and phases do not overlap (each day of the
// mission is in one phase at most, so the sweep and the cases know which attitude and dissipation hold).
import { and, asc, eq, ne, sql } from 'drizzle-orm';
import type { z } from 'zod';
import type { AttitudeMode, MissionPhase, attitudeModeCreate, attitudeModeUpdate, phaseCreate, phaseUpdate } from '../../shared/api/phases';
import type { Role } from '../../shared/api/workspaces';
import { roleRefused } from '../auth/middleware';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { attitudeModes, missionPhases, surfaces, type AttitudeModeRow, type MissionPhaseRow, type MissionRow } from '../db/schema';
import { badRequest, conflict, notFound } from '../errors';
import { missionFor, type DbLike, type Tx } from './mission-access';

type ModeCreate = z.output<typeof attitudeModeCreate>;
type ModeUpdate = z.output<typeof attitudeModeUpdate>;
type PhaseCreate = z.output<typeof phaseCreate>;
type PhaseUpdate = z.output<typeof phaseUpdate>;

/** Who changes modes and phases: they carry the thermal design's attitudes and dissipation. */
export const phaseEditors: readonly Role[] = ['owner', 'thermal'];

const shown = (value: string) => JSON.stringify(value.slice(0, 80));
const refuse = (path: string, message: string) => badRequest(`${path}: ${message}.`, [{ path, message }]);

/** The mission for a change of its modes or phases: 404 for a non-member, 403 for a role other than thermal or owner. */
function missionToEdit(tx: DbLike, userId: string, missionId: string): MissionRow {
  const { mission, role } = missionFor(tx, userId, missionId, 'read');
  if (!phaseEditors.includes(role)) throw roleRefused(role, phaseEditors);
  return mission;
}

const surfaceNames = (db: DbLike, missionId: string): Map<string, string> =>
  new Map(db.select({ id: surfaces.id, name: surfaces.name }).from(surfaces).where(eq(surfaces.missionId, missionId)).all().map((s) => [s.id, s.name]));

export function toMode(row: AttitudeModeRow, names: ReadonlyMap<string, string>): AttitudeMode {
  return {
    id: row.id, missionId: row.missionId, name: row.name, description: row.description, yawSteering: row.yawSteering,
    pointing: row.pointing.flatMap((p) => {
      const surfaceName = names.get(p.surfaceId);
      return surfaceName === undefined ? [] : [{ ...p, surfaceName }];
    }),
    createdAt: row.createdAt, updatedAt: row.updatedAt,
  };
}

export function toPhase(row: MissionPhaseRow, modeName: string): MissionPhase {
  return {
    id: row.id, missionId: row.missionId, name: row.name, description: row.description, startDate: row.startDate, endDate: row.endDate,
    modeId: row.modeId, modeName, dissipation: row.dissipation, createdAt: row.createdAt, updatedAt: row.updatedAt,
  };
}

export const modeRowsOf = (db: Pick<Db, 'select'>, missionId: string): AttitudeModeRow[] =>
  db.select().from(attitudeModes).where(eq(attitudeModes.missionId, missionId)).orderBy(asc(attitudeModes.createdAt), sql`"attitude_modes".rowid`).all();

export const phaseRowsOf = (db: Pick<Db, 'select'>, missionId: string): MissionPhaseRow[] =>
  db.select().from(missionPhases).where(eq(missionPhases.missionId, missionId)).orderBy(asc(missionPhases.startDate), asc(missionPhases.name)).all();

export function listModes(db: Db, userId: string, missionId: string): AttitudeMode[] {
  const { mission } = missionFor(db, userId, missionId, 'read');
  const names = surfaceNames(db, mission.id);
  return modeRowsOf(db, mission.id).map((row) => toMode(row, names));
}

export function listPhases(db: Db, userId: string, missionId: string): MissionPhase[] {
  const { mission } = missionFor(db, userId, missionId, 'read');
  const modes = new Map(modeRowsOf(db, mission.id).map((m) => [m.id, m.name]));
  return phaseRowsOf(db, mission.id).map((row) => toPhase(row, modes.get(row.modeId) ?? ''));
}

function modeOf(db: DbLike, missionId: string, modeId: string, path = 'modeId'): AttitudeModeRow {
  const row = db.select().from(attitudeModes).where(and(eq(attitudeModes.id, modeId), eq(attitudeModes.missionId, missionId))).get();
  if (!row) {
    if (path === ':modeId') throw notFound(`No attitude mode with id ${shown(modeId)} in this mission.`);
    throw refuse(path, `no attitude mode ${shown(modeId)} in this mission`);
  }
  return row;
}

function phaseOf(db: DbLike, missionId: string, phaseId: string): MissionPhaseRow {
  const row = db.select().from(missionPhases).where(and(eq(missionPhases.id, phaseId), eq(missionPhases.missionId, missionId))).get();
  if (!row) throw notFound(`No phase with id ${shown(phaseId)} in this mission.`);
  return row;
}

function checkPointing(tx: Tx, missionId: string, pointing: ModeCreate['pointing']): void {
  const names = surfaceNames(tx, missionId);
  pointing.forEach((p, i) => {
    if (!names.has(p.surfaceId)) throw refuse(`pointing.${i}.surfaceId`, `no surface ${shown(p.surfaceId)} in this mission`);
  });
}

function uniqueModeName(tx: Tx, missionId: string, name: string, exceptId?: string): void {
  const clash = tx.select({ id: attitudeModes.id }).from(attitudeModes)
    .where(and(eq(attitudeModes.missionId, missionId), eq(attitudeModes.name, name), exceptId ? ne(attitudeModes.id, exceptId) : undefined)).get();
  if (clash) throw conflict(`The mission already has an attitude mode named ${shown(name)}; mode names are unique in a mission.`, 'duplicate_name');
}

function uniquePhaseName(tx: Tx, missionId: string, name: string, exceptId?: string): void {
  const clash = tx.select({ id: missionPhases.id }).from(missionPhases)
    .where(and(eq(missionPhases.missionId, missionId), eq(missionPhases.name, name), exceptId ? ne(missionPhases.id, exceptId) : undefined)).get();
  if (clash) throw conflict(`The mission already has a phase named ${shown(name)}; phase names are unique in a mission.`, 'duplicate_name');
}

/** Each day in one phase at most: 400 naming the date that falls in another phase (or the range that takes one in). */
function noOverlap(tx: Tx, missionId: string, startDate: string, endDate: string, exceptId?: string): void {
  const other = phaseRowsOf(tx, missionId).find((p) => p.id !== exceptId && p.startDate <= endDate && startDate <= p.endDate);
  if (!other) return;
  const theirs = `phase ${shown(other.name)} (${other.startDate} to ${other.endDate}); phases do not overlap`;
  if (other.startDate <= startDate) throw refuse('startDate', `${startDate} falls in ${theirs}`);
  if (endDate <= other.endDate) throw refuse('endDate', `${endDate} falls in ${theirs}`);
  throw refuse('endDate', `${startDate} to ${endDate} takes in ${theirs}`);
}

/** A phase lies within its mission's dates: 400 naming the date outside them. */
function withinMission(mission: MissionRow, startDate: string, endDate: string): void {
  if (startDate < mission.startDate) throw refuse('startDate', `${startDate} is before the mission starts (${mission.startDate})`);
  if (endDate > mission.endDate) throw refuse('endDate', `${endDate} is after the mission ends (${mission.endDate})`);
}

/**
 * New mission dates that would leave a phase outside them: 400 naming the mission's date and the phase
 * (the phases are moved first, so no phase is ever flown outside its mission).
 */
export function phasesStayWithin(tx: Tx, missionId: string, startDate: string, endDate: string): void {
  for (const p of phaseRowsOf(tx, missionId)) {
    const phase = `phase ${shown(p.name)} (${p.startDate} to ${p.endDate}); move or shorten the phase first`;
    if (p.startDate < startDate) throw refuse('startDate', `${startDate} is after the start of ${phase}`);
    if (p.endDate > endDate) throw refuse('endDate', `${endDate} is before the end of ${phase}`);
  }
}

const describeMode = (m: { name: string; yawSteering: boolean; pointing: unknown[] }) =>
  `"${m.name}"${m.yawSteering ? ', yaw steering' : ''}, ${m.pointing.length} surface${m.pointing.length === 1 ? '' : 's'} pointed`;

function audit(tx: Tx, userId: string, mission: MissionRow, action: string, targetType: string, targetId: string, summary: string): void {
  recordAudit(tx, { workspaceId: mission.workspaceId, actorUserId: userId, action, targetType, targetId, summary });
}

export function createMode(db: Db, userId: string, missionId: string, input: ModeCreate): AttitudeMode {
  return db.transaction((tx) => {
    const mission = missionToEdit(tx, userId, missionId);
    uniqueModeName(tx, mission.id, input.name);
    checkPointing(tx, mission.id, input.pointing);
    const row = tx.insert(attitudeModes).values({ missionId: mission.id, ...input }).returning().get();
    audit(tx, userId, mission, 'attitude_mode.created', 'attitude_mode', row.id, `Attitude mode ${describeMode(row)} added to mission "${mission.name}".`);
    return toMode(row, surfaceNames(tx, mission.id));
  });
}

export function updateMode(db: Db, userId: string, missionId: string, modeId: string, input: ModeUpdate): AttitudeMode {
  return db.transaction((tx) => {
    const mission = missionToEdit(tx, userId, missionId);
    const mode = modeOf(tx, mission.id, modeId, ':modeId');
    if (input.name !== undefined && input.name !== mode.name) uniqueModeName(tx, mission.id, input.name, mode.id);
    if (input.pointing !== undefined) checkPointing(tx, mission.id, input.pointing);
    const next = {
      name: input.name ?? mode.name, description: input.description ?? mode.description,
      yawSteering: input.yawSteering ?? mode.yawSteering, pointing: input.pointing ?? mode.pointing,
    };
    if (JSON.stringify(next) === JSON.stringify({ name: mode.name, description: mode.description, yawSteering: mode.yawSteering, pointing: mode.pointing })) {
      return toMode(mode, surfaceNames(tx, mission.id));
    }
    const row = tx.update(attitudeModes).set({ ...next, updatedAt: new Date().toISOString() }).where(eq(attitudeModes.id, mode.id)).returning().get();
    audit(tx, userId, mission, 'attitude_mode.updated', 'attitude_mode', row.id, `Attitude mode "${mode.name}" of mission "${mission.name}" changed: now ${describeMode(row)}.`);
    return toMode(row, surfaceNames(tx, mission.id));
  });
}

export function deleteMode(db: Db, userId: string, missionId: string, modeId: string): void {
  db.transaction((tx) => {
    const mission = missionToEdit(tx, userId, missionId);
    const mode = modeOf(tx, mission.id, modeId, ':modeId');
    const flying = phaseRowsOf(tx, mission.id).filter((p) => p.modeId === mode.id);
    if (flying.length > 0) {
      throw conflict(`Attitude mode "${mode.name}" is flown in ${flying.map((p) => `phase "${p.name}"`).join(', ')}; give ${flying.length === 1 ? 'that phase' : 'those phases'} another mode first.`, 'mode_in_use');
    }
    tx.delete(attitudeModes).where(eq(attitudeModes.id, mode.id)).run();
    audit(tx, userId, mission, 'attitude_mode.deleted', 'attitude_mode', mode.id, `Attitude mode "${mode.name}" removed from mission "${mission.name}".`);
  });
}

const describePhase = (p: { name: string; startDate: string; endDate: string; dissipation: unknown[] }, modeName: string) =>
  `"${p.name}" ${p.startDate} to ${p.endDate} in mode "${modeName}", dissipation for ${p.dissipation.length} node${p.dissipation.length === 1 ? '' : 's'}`;

export function createPhase(db: Db, userId: string, missionId: string, input: PhaseCreate): MissionPhase {
  return db.transaction((tx) => {
    const mission = missionToEdit(tx, userId, missionId);
    const mode = modeOf(tx, mission.id, input.modeId);
    uniquePhaseName(tx, mission.id, input.name);
    withinMission(mission, input.startDate, input.endDate);
    noOverlap(tx, mission.id, input.startDate, input.endDate);
    const row = tx.insert(missionPhases).values({ missionId: mission.id, ...input }).returning().get();
    audit(tx, userId, mission, 'phase.created', 'mission_phase', row.id, `Phase ${describePhase(row, mode.name)} added to mission "${mission.name}".`);
    return toPhase(row, mode.name);
  });
}

export function updatePhase(db: Db, userId: string, missionId: string, phaseId: string, input: PhaseUpdate): MissionPhase {
  return db.transaction((tx) => {
    const mission = missionToEdit(tx, userId, missionId);
    const phase = phaseOf(tx, mission.id, phaseId);
    const next = {
      name: input.name ?? phase.name, description: input.description ?? phase.description,
      startDate: input.startDate ?? phase.startDate, endDate: input.endDate ?? phase.endDate,
      modeId: input.modeId ?? phase.modeId, dissipation: input.dissipation ?? phase.dissipation,
    };
    if (next.startDate > next.endDate) throw refuse('endDate', `${next.endDate} is before the phase's start ${next.startDate}`);
    const mode = modeOf(tx, mission.id, next.modeId);
    if (next.name !== phase.name) uniquePhaseName(tx, mission.id, next.name, phase.id);
    // a phase kept from before the mission's dates were checked may still be renamed as it is
    if (input.startDate !== undefined || input.endDate !== undefined) withinMission(mission, next.startDate, next.endDate);
    noOverlap(tx, mission.id, next.startDate, next.endDate, phase.id);
    const row = tx.update(missionPhases).set({ ...next, updatedAt: new Date().toISOString() }).where(eq(missionPhases.id, phase.id)).returning().get();
    audit(tx, userId, mission, 'phase.updated', 'mission_phase', row.id, `Phase "${phase.name}" of mission "${mission.name}" changed: now ${describePhase(row, mode.name)}.`);
    return toPhase(row, mode.name);
  });
}

export function deletePhase(db: Db, userId: string, missionId: string, phaseId: string): void {
  db.transaction((tx) => {
    const mission = missionToEdit(tx, userId, missionId);
    const phase = phaseOf(tx, mission.id, phaseId);
    tx.delete(missionPhases).where(eq(missionPhases.id, phase.id)).run();
    audit(tx, userId, mission, 'phase.deleted', 'mission_phase', phase.id, `Phase "${phase.name}" removed from mission "${mission.name}".`);
  });
}
