// Saved thermal models: checked on every write against the stateless solve schema (the same
// messages as POST /thermal/solve, naming the field and the value) and against the mission's
// surfaces; every change is audited in its own transaction, so nothing is ever half written.
import { asc, desc, eq } from 'drizzle-orm';
import type { z } from 'zod';
import { thermalSolveRequest } from '../../shared/api/thermal';
import type {
  ThermalModelContent, ThermalModelDetail, ThermalModelSummary, thermalModelCreate, thermalModelUpdate,
} from '../../shared/api/thermal-models';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { loadCases, surfaces, thermalModels, thermalRuns, users, type ThermalModelRow } from '../db/schema';
import { badRequest, zodDetails } from '../errors';
import type { ErrorDetail } from '../../shared/api/errors';
import type { DbLike } from '../missions/mission-access';
import { visibleToViewer } from '../cases/case-access';
import { missionForModels, modelFor } from './thermal-model-access';
import type { Role } from '../../shared/api/workspaces';

type ModelCreate = z.output<typeof thermalModelCreate>;
type ModelUpdate = z.output<typeof thermalModelUpdate>;

// Any period and step count do for checking a model's own fields; a case brings the real ones.
const PROBE_PERIOD_S = 5400;
const PROBE_STEPS = 12;

/** The model as POST /thermal/solve would take it, without a case: for the shared checks only. */
export function probeRequest(model: ThermalModelContent): Record<string, unknown> {
  const { maxDutyCycle: _limit, nodes, ...rest } = model;
  return {
    ...rest,
    periodS: PROBE_PERIOD_S,
    steps: PROBE_STEPS,
    nodes: nodes.map(({ surfaceIds: _s, hotDissipationW: _h, coldDissipationW: _c, ...node }) => node),
  };
}

/** 400 naming the field (under "model.", as the request body has it) and the value for anything the solver or the mission would refuse. */
export function checkModel(db: DbLike, missionId: string, model: ThermalModelContent): void {
  const issues: ErrorDetail[] = [];
  const own = new Set(db.select({ id: surfaces.id }).from(surfaces).where(eq(surfaces.missionId, missionId)).all().map((s) => s.id));
  const owner = new Map<string, string>();
  model.nodes.forEach((node, i) => {
    node.surfaceIds.forEach((surfaceId, j) => {
      const path = `model.nodes.${i}.surfaceIds.${j}`;
      if (!own.has(surfaceId)) issues.push({ path, message: `no surface with id ${JSON.stringify(surfaceId)} in this mission` });
      else if (owner.has(surfaceId)) {
        // Its load would be counted twice.
        issues.push({ path, message: `surface ${JSON.stringify(surfaceId)} already belongs to node ${JSON.stringify(owner.get(surfaceId))}` });
      } else owner.set(surfaceId, node.name);
    });
    if (node.fixedC !== undefined && node.surfaceIds.length > 0) {
      issues.push({ path: `model.nodes.${i}.surfaceIds`, message: `${JSON.stringify(node.name)} is a boundary at a fixed temperature; it cannot own surfaces` });
    }
  });
  const probe = probeRequest(model);
  const solvable = thermalSolveRequest.safeParse(probe, { reportInput: true });
  if (!solvable.success) {
    issues.push(...zodDetails(solvable.error, probe).map((d) => ({ ...d, path: d.path ? `model.${d.path}` : 'model' })));
  }
  const first = issues[0];
  if (first) throw badRequest(`${first.path}: ${first.message}${issues.length > 1 ? ` (and ${issues.length - 1} more)` : ''}.`, issues);
}

function person(db: DbLike, userId: string | null) {
  if (!userId) return null;
  return db.select({ id: users.id, name: users.name, email: users.email }).from(users).where(eq(users.id, userId)).get() ?? null;
}

function summaryOf(db: DbLike, row: ThermalModelRow): ThermalModelSummary {
  return {
    id: row.id, missionId: row.missionId, workspaceId: row.workspaceId, name: row.name, description: row.description,
    nodeCount: row.model.nodes.length, heaterCount: row.model.heaters.length,
    createdBy: person(db, row.createdBy), createdAt: row.createdAt, updatedAt: row.updatedAt,
  };
}

export function detailOf(db: DbLike, row: ThermalModelRow, crewed: boolean, role: Role): ThermalModelDetail {
  const runs = db
    .select({ run: thermalRuns, loadCase: loadCases })
    .from(thermalRuns)
    .innerJoin(loadCases, eq(loadCases.id, thermalRuns.caseId))
    .where(eq(thermalRuns.modelId, row.id))
    .orderBy(desc(thermalRuns.ranAt))
    .all()
    .filter(({ loadCase }) => role !== 'viewer' || visibleToViewer(loadCase.status))
    .map(({ run, loadCase }) => ({
      case: { id: loadCase.id, name: loadCase.name, kind: loadCase.kind, status: loadCase.status, revision: loadCase.revision },
      pass: run.pass, ranAt: run.ranAt, stale: run.modelUpdatedAt !== row.updatedAt,
    }));
  return { ...summaryOf(db, row), crewed, model: row.model, runs };
}

export function listModels(db: Db, userId: string, missionId: string): ThermalModelSummary[] {
  const { mission } = missionForModels(db, userId, missionId, 'read');
  return db.select().from(thermalModels).where(eq(thermalModels.missionId, mission.id)).orderBy(asc(thermalModels.name)).all().map((r) => summaryOf(db, r));
}

export function createModel(db: Db, userId: string, missionId: string, input: ModelCreate): ThermalModelDetail {
  return db.transaction((tx) => {
    const { mission, role } = missionForModels(tx, userId, missionId, 'edit');
    checkModel(tx, mission.id, input.model);
    const row = tx
      .insert(thermalModels)
      .values({ missionId: mission.id, workspaceId: mission.workspaceId, name: input.name, description: input.description, model: input.model, createdBy: userId })
      .returning()
      .get();
    recordAudit(tx, {
      workspaceId: mission.workspaceId, actorUserId: userId, action: 'thermal_model.created', targetType: 'thermal_model', targetId: row.id,
      summary: `Created thermal model "${row.name}" (${row.model.nodes.length} nodes) in "${mission.name}".`,
    });
    return detailOf(tx, row, mission.crewed, role);
  });
}

export function getModel(db: Db, userId: string, modelId: string): ThermalModelDetail {
  const { row, mission, role } = modelFor(db, userId, modelId, 'read');
  return detailOf(db, row, mission.crewed, role);
}

export function updateModel(db: Db, userId: string, modelId: string, input: ModelUpdate): ThermalModelDetail {
  return db.transaction((tx) => {
    const { row, mission, role } = modelFor(tx, userId, modelId, 'edit');
    if (input.model) checkModel(tx, mission.id, input.model);
    const changed = [input.name !== undefined && 'name', input.description !== undefined && 'description', input.model && 'model'].filter(Boolean);
    const updated = tx
      .update(thermalModels)
      .set({
        ...(input.name !== undefined ? { name: input.name } : {}),
        ...(input.description !== undefined ? { description: input.description } : {}),
        ...(input.model ? { model: input.model } : {}),
        updatedAt: new Date().toISOString(),
      })
      .where(eq(thermalModels.id, row.id))
      .returning()
      .get();
    recordAudit(tx, {
      workspaceId: mission.workspaceId, actorUserId: userId, action: 'thermal_model.updated', targetType: 'thermal_model', targetId: row.id,
      summary: `Changed ${changed.length > 0 ? changed.join(', ') : 'nothing'} of thermal model "${updated.name}".`,
    });
    return detailOf(tx, updated, mission.crewed, role);
  });
}

export function deleteModel(db: Db, userId: string, modelId: string): void {
  db.transaction((tx) => {
    const { row, mission } = modelFor(tx, userId, modelId, 'edit');
    tx.delete(thermalModels).where(eq(thermalModels.id, row.id)).run();
    recordAudit(tx, {
      workspaceId: mission.workspaceId, actorUserId: userId, action: 'thermal_model.deleted', targetType: 'thermal_model', targetId: row.id,
      summary: `Deleted thermal model "${row.name}" of "${mission.name}".`,
    });
  });
}
