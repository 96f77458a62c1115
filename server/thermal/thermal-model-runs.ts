// Running a saved model against a load case (the periodic steady state, kept as the model's last
// run for that case) and sizing its radiator in the hot case and its heater in the cold case, with
// the stateless solver and sizing of shared/physics.
import { and, eq } from 'drizzle-orm';
import { asThermalSolveInput, thermalSolveRequest, type ThermalSolveRequestInput } from '../../shared/api/thermal';
import type { ThermalModelSizeResponse, ThermalRunResponse, thermalModelSizeRequest } from '../../shared/api/thermal-models';
import { ThermalConvergenceError, ThermalModelError } from '../../shared/physics/thermal-model';
import { controlRecoveries } from '../../shared/physics/thermal-loop-results';
import type { z } from 'zod';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { surfaces, thermalRuns, type LoadCaseRow, type MissionRow, type ThermalModelRow } from '../db/schema';
import { badRequest, notFound, parse } from '../errors';
import { caseOfMission, modelFor } from './thermal-model-access';
import { answerThermalAsync, boundedModel } from './thermal-failures';
import { thermalPool } from './thermal-pool';
import { runInputs } from './thermal-run-inputs';

type SizeRequest = z.output<typeof thermalModelSizeRequest>;

export const caseRef = (loadCase: LoadCaseRow) => ({ id: loadCase.id, name: loadCase.name, kind: loadCase.kind, status: loadCase.status, revision: loadCase.revision });

export function inputsFor(db: Db, row: ThermalModelRow, mission: MissionRow, loadCase: LoadCaseRow, extra: Partial<ThermalSolveRequestInput> = {}, solarScale = 1) {
  const names = new Map(db.select({ id: surfaces.id, name: surfaces.name }).from(surfaces).where(eq(surfaces.missionId, mission.id)).all().map((s) => [s.id, s.name]));
  const base = runInputs(row.model, names, loadCase, solarScale);
  const inputs = { ...base, request: { ...base.request, ...extra } };
  // The request is built from checked parts; parsing again fills the solver's defaults and keeps
  // the route honest should a case hold something the stateless route would refuse.
  return { ...inputs, parsed: boundedModel(asThermalSolveInput(parse(thermalSolveRequest, inputs.request))) };
}

export async function runModel(db: Db, userId: string, modelId: string, caseId: string, maxOrbits?: number, signal?: AbortSignal): Promise<ThermalRunResponse> {
  const { row, mission, role } = modelFor(db, userId, modelId, 'run');
  const loadCase = caseOfMission(db, mission, caseId, role, 'caseId');
  // A run that does not settle still answers: its last orbit, marked (result.converged false, result.unsettled).
  const { request, nodes, assumptions, parsed } = inputsFor(db, row, mission, loadCase, { whenUnsettled: 'last-orbit', ...(maxOrbits !== undefined ? { maxOrbits } : {}) });
  const result = await answerThermalAsync(thermalPool.run('solve', parsed, signal), 'impossible_model');
  const ranAt = new Date().toISOString();
  const answer: Omit<ThermalRunResponse, 'stale'> = {
    model: { id: row.id, name: row.name, updatedAt: row.updatedAt },
    case: { ...caseRef(loadCase), periodS: loadCase.results.periodS, steps: loadCase.results.tS.length, eclipseFraction: loadCase.results.eclipseFraction, sunlit: loadCase.results.sunlit },
    crewed: mission.crewed,
    ranAt,
    inputs: nodes,
    solveRequest: { ...request },
    result,
    recoveries: controlRecoveries(result, loadCase.results.sunlit, parsed.periodS),
    assumptions: [...assumptions, ...result.assumptions],
  };
  db.transaction((tx) => {
    tx.delete(thermalRuns).where(and(eq(thermalRuns.modelId, row.id), eq(thermalRuns.caseId, loadCase.id))).run();
    tx.insert(thermalRuns).values({ modelId: row.id, caseId: loadCase.id, pass: result.pass, modelUpdatedAt: row.updatedAt, result: answer, ranBy: userId, ranAt }).run();
    recordAudit(tx, {
      workspaceId: mission.workspaceId, actorUserId: userId, action: 'thermal_model.run', targetType: 'thermal_model', targetId: row.id,
      summary: `Ran thermal model "${row.name}" on case "${loadCase.name}" (${loadCase.kind}): ${result.converged ? (result.pass ? 'pass' : 'fail') : `not settled after ${result.orbits} orbits`}.`,
    });
  });
  return { ...answer, stale: false };
}

export function lastRun(db: Db, userId: string, modelId: string, caseId: string): ThermalRunResponse {
  const { row, mission, role } = modelFor(db, userId, modelId, 'read');
  const loadCase = caseOfMission(db, mission, caseId, role, 'caseId');
  const run = db.select().from(thermalRuns).where(and(eq(thermalRuns.modelId, row.id), eq(thermalRuns.caseId, loadCase.id))).get();
  if (!run) throw notFound(`Thermal model "${row.name}" has not been run on case "${loadCase.name}" yet.`, 'no_run');
  // Runs kept before unsettled runs were answered have no `unsettled`: they all settled.
  return { ...run.result, result: { ...run.result.result, unsettled: run.result.result.unsettled ?? null }, stale: run.modelUpdatedAt !== row.updatedAt };
}

/** The sizing's answer, or the sentence saying why this model cannot be sized so. */
async function attempt<T>(work: Promise<T>): Promise<{ sizing: T | null; refused: string | null }> {
  try {
    return { sizing: await work, refused: null };
  } catch (error) {
    if (error instanceof ThermalModelError || error instanceof ThermalConvergenceError) return { sizing: null, refused: error.message };
    throw error;
  }
}

export async function sizeModel(db: Db, userId: string, modelId: string, body: SizeRequest, signal?: AbortSignal): Promise<ThermalModelSizeResponse> {
  const { row, mission, role } = modelFor(db, userId, modelId, 'run');
  const hot = caseOfMission(db, mission, body.caseHotId, role, 'caseHotId');
  const cold = caseOfMission(db, mission, body.caseColdId, role, 'caseColdId');
  const heaterNode = body.heaterNode ?? body.node;
  for (const [field, name] of [['node', body.node], ['heaterNode', heaterNode]] as const) {
    if (!row.model.nodes.some((n) => n.name === name)) {
      const message = `no node is named ${JSON.stringify(name)} in model "${row.name}" (got ${JSON.stringify(name)})`;
      throw badRequest(`${field}: ${message}.`, [{ path: field, message }]);
    }
  }
  const hotInputs = inputsFor(db, row, mission, hot);
  const coldInputs = inputsFor(db, row, mission, cold);
  const hotMarginK = body.marginK ?? hotInputs.parsed.margins?.operatingK ?? 0;
  const coldMarginK = body.marginK ?? coldInputs.parsed.margins?.operatingK ?? 0;
  const maxDutyCycle = body.maxDutyCycle ?? row.model.maxDutyCycle;
  // Both in the pool at once (two workers when the pool has them).
  const [radiator, heater] = await Promise.all([
    attempt(thermalPool.run('radiator', { model: hotInputs.parsed, node: body.node, marginK: hotMarginK }, signal).then((r) => ({ kind: 'radiator' as const, ...r }))),
    attempt(thermalPool.run('heater', { model: coldInputs.parsed, node: heaterNode, marginK: coldMarginK, maxDutyCycle }, signal).then((h) => ({ kind: 'heater' as const, ...h }))),
  ]);
  return {
    radiator: { case: caseRef(hot), ...radiator },
    heater: { case: caseRef(cold), ...heater },
    margins: { hotK: hotMarginK, coldK: coldMarginK },
    maxDutyCycle,
  };
}
