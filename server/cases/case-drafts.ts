// Saving a new load case: revision 1 of a new series, a draft by its author, with the columns the
// case list reads copied out of its results and its rationale rebuilt from its own record.
import { randomUUID } from 'node:crypto';
import { whyRecordOf, type CaseInputs } from '../../shared/api/case-content';
import { caseRationale } from '../../shared/physics/case-why';
import type { Db } from '../db/database';
import { loadCases, type LoadCaseRow, type MissionRow, type UserRow } from '../db/schema';

export type DraftValues = Pick<LoadCaseRow, 'name' | 'kind' | 'inputs' | 'results'>;

/** A case's inputs with the rationale built again from them and its results (physics/case-why.ts). */
export function withRationale(kind: LoadCaseRow['kind'], inputs: CaseInputs, results: LoadCaseRow['results']): CaseInputs {
  return { ...inputs, rationale: caseRationale(whyRecordOf(kind, inputs, results)) };
}

/** The columns copied out of a case's results, to be written with the results every time. */
export function resultSummary(results: LoadCaseRow['results']): Pick<LoadCaseRow, 'orbitAverageAbsorbedW' | 'betaDeg'> {
  return { orbitAverageAbsorbedW: results.total.orbitAverageAbsorbedW, betaDeg: results.betaDeg };
}

export function insertDraft(tx: Pick<Db, 'insert'>, mission: MissionRow, user: UserRow, values: DraftValues): LoadCaseRow {
  return tx
    .insert(loadCases)
    .values({ ...values, ...resultSummary(values.results), missionId: mission.id, workspaceId: mission.workspaceId, seriesId: randomUUID(), revision: 1, status: 'draft', authorId: user.id })
    .returning()
    .get();
}
