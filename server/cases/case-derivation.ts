// Derives the hot and cold cases of a mission's orbit (physics/design-cases.ts) from its snapshot
// and the workspace's environment table, and saves them as drafts.
import type { CaseDeriveParsed } from '../../shared/api/cases';
import { getBody } from '../../shared/physics/bodies';
import { attitudeText, caseAssumptions } from '../../shared/physics/case-words';
import { deriveDesignCases } from '../../shared/physics/design-cases';
import { resolveMargins, type EnvironmentPair } from '../../shared/physics/design-environment';
import { pairsFromTable } from '../../shared/physics/environment-table';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import type { DbOrTx } from '../db/database';
import type { LoadCaseRow, MissionRow, UserRow } from '../db/schema';
import { environmentTableRowsOf } from '../environment/environment-table-store';
import { insertDraft, type DraftValues } from './case-drafts';
import { orbitElements, orbitInputs, snapshotOf } from './case-snapshot';

/** A pair the user gave: never provisional. */
const userPair = (given: { albedo: number; olrWm2: number; source: string } | undefined): EnvironmentPair | undefined =>
  given ? { ...given, provisional: false } : undefined;

/** The hot and cold cases of a mission's orbit, ready to be saved (the seed saves them too). */
export function derivedCaseValues(db: DbOrTx, mission: MissionRow, input: CaseDeriveParsed): DraftValues[] {
  const { orbit, surfaces: list } = snapshotOf(db, mission, input.orbitId, input.steps);
  const margins = resolveMargins(input.margins);
  // the workspace's own table, where a row holds for the body and the orbit's inclination, over the built-in pairs
  const table = pairsFromTable(environmentTableRowsOf(db, mission.workspaceId), getBody(mission.bodyId), orbit.inclinationDeg, input.averagingTimeS);
  const derivation = deriveDesignCases({
    bodyId: mission.bodyId,
    orbit: orbitElements(orbit),
    orbitEpoch: orbit.epoch,
    startDate: mission.startDate,
    endDate: mission.endDate,
    surfaces: list,
    margins,
    properties: input.properties,
    environment: { hot: userPair(input.environment?.hot) ?? table?.hot, cold: userPair(input.environment?.cold) ?? table?.cold },
    steps: input.steps,
  });
  const prefix = input.name ?? `${mission.name} ${orbit.name}`;
  return [derivation.hot, derivation.cold].map((derived) => ({
    name: `${prefix} ${derived.kind}`,
    kind: derived.kind,
    inputs: {
      ...orbitInputs(mission, orbit),
      attitude: attitudeText(list),
      conditions: { ...derived.conditions, orbit: orbitElements(orbit) },
      environmentSource: derived.environmentSource,
      provisional: derived.provisional,
      margins,
      decision: derived.decision,
      rationale: derived.rationale,
      surfaceDrivers: derived.surfaceDrivers,
      scan: derivation.scan,
      assumptions: caseAssumptions(derived.conditions),
    },
    results: derived.results,
  }));
}

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
