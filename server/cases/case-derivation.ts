// Derives the hot and cold cases of a mission's orbit (physics/design-cases.ts) from its snapshot
// and the workspace's environment table, and saves them as drafts. A mission flown in phases is
// derived phase by phase (physics/phase-cases.ts), each case naming the phase that drove it (the most
// or least heat into the spacecraft: absorbed load plus the phase's dissipation); the survival cold
// case takes the loads of the phase of least absorbed load with each node's least dissipation over
// the phases (the same in every phase).
import type { CaseDeriveParsed } from '../../shared/api/cases';
import type { SurfaceNormal } from '../../shared/api/missions';
import type { CasePhaseCompared } from '../../shared/api/phases';
import { caseRationale } from '../../shared/physics/case-why';
import { derivePhasedCases, phaseDissipationW, survivalDissipation } from '../../shared/physics/phase-cases';
import { round } from '../../shared/physics/rounding';
import { getBody } from '../../shared/physics/bodies';
import { attitudeText, caseAssumptions } from '../../shared/physics/case-words';
import { deriveDesignCases, type DerivedCase, type ScanSummary } from '../../shared/physics/design-cases';
import { resolveMargins, type EnvironmentPair } from '../../shared/physics/design-environment';
import { pairsFromTable } from '../../shared/physics/environment-table';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import type { DbOrTx } from '../db/database';
import type { LoadCaseRow, MissionRow, UserRow } from '../db/schema';
import { environmentTableRowsOf } from '../environment/environment-table-store';
import { badRequest } from '../errors';
import { casePhaseOf, flownPhases, normalsInMode, type FlownPhase } from '../missions/phase-pointing';
import { insertDraft, type DraftValues } from './case-drafts';
import { orbitElements, orbitInputs, snapshotOf } from './case-snapshot';

/** A pair the user gave: never provisional. */
const userPair = (given: { albedo: number; olrWm2: number; source: string } | undefined): EnvironmentPair | undefined =>
  given ? { ...given, provisional: false } : undefined;

/**
 * The hot and cold cases of a mission's orbit, ready to be saved (the seed saves them too). A mission
 * with phases is derived per phase (or in the one phase asked for) and each case names the phase
 * that drove it; `survival` adds the survival cold case (minimum dissipation; with phases, the loads of the
 * phase of least absorbed load).
 */
export function derivedCaseValues(db: DbOrTx, mission: MissionRow, input: CaseDeriveParsed): DraftValues[] {
  const { orbit, surfaces: list, ids } = snapshotOf(db, mission, input.orbitId, input.steps);
  const margins = resolveMargins(input.margins);
  // the workspace's own table, where a row holds for the body and the orbit's inclination, over the built-in pairs
  const table = pairsFromTable(environmentTableRowsOf(db, mission.workspaceId), getBody(mission.bodyId), orbit.inclinationDeg, input.averagingTimeS);
  const common = {
    bodyId: mission.bodyId,
    orbit: orbitElements(orbit),
    orbitEpoch: orbit.epoch,
    margins,
    properties: input.properties,
    environment: { hot: userPair(input.environment?.hot) ?? table?.hot, cold: userPair(input.environment?.cold) ?? table?.cold },
    steps: input.steps,
  };
  const flown = flownPhases(db, mission);
  const phases = input.phaseId === undefined ? flown : flown.filter((f) => f.phase.id === input.phaseId);
  if (input.phaseId !== undefined && phases.length === 0) {
    const message = `no phase ${JSON.stringify(input.phaseId.slice(0, 80))} in this mission`;
    throw badRequest(`phaseId: ${message} ("${mission.name}").`, [{ path: 'phaseId', message }]);
  }
  let derived: { c: DerivedCase; scan: ScanSummary; phase?: FlownPhase }[];
  // a case chosen among all the phases keeps what the choice depended on (case-currency.ts compares it)
  let compared: CasePhaseCompared[] | undefined;
  if (phases.length === 0) {
    const derivation = deriveDesignCases({ ...common, startDate: mission.startDate, endDate: mission.endDate, surfaces: list });
    derived = [derivation.hot, derivation.cold].map((c) => ({ c, scan: derivation.scan }));
  } else {
    const pointed = phases.map((f) => ({
      id: f.phase.id, name: f.phase.name, startDate: f.phase.startDate, endDate: f.phase.endDate, modeName: f.mode.name,
      surfaces: normalsInMode(list.map((s, i) => ({ id: ids[i]!, name: s.name, normal: s.normal })), f.mode).map((normal, i) => ({ ...list[i]!, normal })),
      dissipation: f.phase.dissipation,
    }));
    const { hot, cold, survival } = derivePhasedCases(common, pointed);
    if (input.phaseId === undefined) compared = pointed.map((p, k) => comparedPhase(phases[k]!, p.surfaces, orbit.periodS));
    derived = [hot, cold, survival].map((c) => ({ c, scan: c.scan, phase: phases[c.phaseIndex]! }));
  }
  // without phases the survival case takes the cold case's loads; with phases, the phase of least absorbed load
  const survivalLoads = derived[2] ?? derived[1]!;
  derived = derived.slice(0, 2);
  if (input.survival) {
    const decision = { ...survivalLoads.c.decision, survival: survivalDissipation(flown.map((f) => f.phase)) };
    const rationale = caseRationale({ kind: 'cold', bodyName: getBody(mission.bodyId).name, conditions: survivalLoads.c.conditions, results: survivalLoads.c.results, margins, decision });
    derived.push({ ...survivalLoads, c: { ...survivalLoads.c, decision, rationale } });
  }
  const prefix = input.name ?? `${mission.name} ${orbit.name}`;
  return derived.map(({ c, scan, phase }) => ({
    name: `${prefix} ${c.decision.survival ? 'survival cold' : c.kind}`,
    kind: c.kind,
    inputs: {
      ...orbitInputs(mission, orbit),
      attitude: phase ? `phase "${phase.phase.name}", attitude mode "${phase.mode.name}"${phase.mode.yawSteering ? ' with yaw steering' : ''}: ${attitudeText(c.conditions.surfaces)}` : attitudeText(list),
      conditions: { ...c.conditions, orbit: orbitElements(orbit) },
      environmentSource: c.environmentSource,
      provisional: c.provisional,
      margins,
      decision: c.decision,
      rationale: c.rationale,
      surfaceDrivers: c.surfaceDrivers,
      scan,
      assumptions: caseAssumptions(c.conditions),
      ...(phase ? { phase: casePhaseOf(phase) } : {}),
      ...(compared ? { phases: compared } : {}),
    },
    results: c.results,
  }));
}

/** A phase as a case chosen among the phases keeps it: its dates, mode, each surface's normal in it, its dissipation. */
export const comparedPhase = ({ phase, mode }: FlownPhase, surfaces: readonly { name: string; normal: SurfaceNormal }[], periodS: number): CasePhaseCompared => ({
  id: phase.id, name: phase.name, startDate: phase.startDate, endDate: phase.endDate, mode: { id: mode.id, name: mode.name },
  normals: Object.fromEntries(surfaces.map((s) => [s.name, s.normal])),
  dissipationW: round(phaseDissipationW(phase.dissipation, periodS), 3),
});

/** Derives and saves the hot and cold drafts of a mission's orbit. */
export function deriveCases(ctx: AppContext, user: UserRow, mission: MissionRow, input: CaseDeriveParsed): LoadCaseRow[] {
  const values = derivedCaseValues(ctx.db, mission, input);
  return ctx.db.transaction((tx) => {
    const rows = values.map((v) => insertDraft(tx, mission, user, v));
    for (const row of rows) {
      recordAudit(tx, {
        workspaceId: mission.workspaceId, actorUserId: user.id, action: 'case.derived', targetType: 'load_case', targetId: row.id,
        summary: `Derived ${row.kind} case "${row.name}" (revision 1, draft) for mission "${mission.name}".`,
      });
    }
    return rows;
  });
}
