// Demo load cases: Kestrel-1's hot and cold cases on its operational orbit, derived by the thermal
// engineer and released by the owner (four eyes), the hot one in a second released revision with a
// larger heat-load margin, so the library shows a superseded revision, a comparison and a subscriber.
// Runs after the missions seed and finds the mission and orbit by their demo names.
import { and, eq } from 'drizzle-orm';
import { resolveMargins } from '../../shared/physics/design-environment';
import { evaluateCase } from '../../shared/physics/design-cases';
import { recordAudit } from '../audit/audit-log';
import { derivedCaseValues } from '../cases/case-derivation';
import { resultSummary, withRationale } from '../cases/case-drafts';
import { caseChecksum } from '../cases/case-export';
import { caseSubscriptions, loadCases, missions, orbits, type LoadCaseRow } from '../db/schema';
import type { FeatureSeed } from './seed';

const missionName = 'Kestrel-1 imaging smallsat';
const orbitName = 'Operational SSO 540 km';

export const seedDemoCases: FeatureSeed = (tx, team) => {
  const thermal = team.users['thermal@kestrel.test'];
  const owner = team.users['owner@kestrel.test'];
  const viewer = team.users['viewer@kestrel.test'];
  const mission = tx.select().from(missions).where(and(eq(missions.workspaceId, team.kestrel.id), eq(missions.name, missionName))).get();
  const orbit = mission ? tx.select().from(orbits).where(and(eq(orbits.missionId, mission.id), eq(orbits.name, orbitName))).get() : undefined;
  if (!thermal || !owner || !viewer || !mission || !orbit) throw new Error(`the case seed needs the demo team and the mission "${missionName}" with orbit "${orbitName}"`);

  const release = (values: Pick<LoadCaseRow, 'name' | 'kind' | 'inputs' | 'results'>, seriesId: string, revision: number, at: string): LoadCaseRow => {
    const draft = tx
      .insert(loadCases)
      .values({
        ...values, ...resultSummary(values.results), missionId: mission.id, workspaceId: mission.workspaceId, seriesId, revision, status: 'released', authorId: thermal.id,
        submittedBy: thermal.id, submittedAt: at, releasedBy: owner.id, releasedAt: at, createdAt: at, updatedAt: at,
      })
      .returning()
      .get();
    const checksum = caseChecksum(draft);
    tx.update(loadCases).set({ checksum }).where(eq(loadCases.id, draft.id)).run();
    recordAudit(tx, {
      workspaceId: mission.workspaceId, actorUserId: owner.id, action: 'case.released', targetType: 'load_case', targetId: draft.id,
      summary: `Released "${draft.name}" revision ${revision} (sha256 ${checksum.slice(0, 12)}…).`,
    });
    return { ...draft, checksum };
  };

  const [hot, cold] = derivedCaseValues(tx, mission, { orbitId: orbit.id, name: 'Kestrel-1 SSO 540', steps: 120 });
  if (!hot || !cold) throw new Error('the derivation gave no hot and cold case');
  const hotSeries = crypto.randomUUID();
  const hot1 = release(hot, hotSeries, 1, '2026-05-12T09:00:00.000Z');
  release(cold, crypto.randomUUID(), 1, '2026-05-12T09:05:00.000Z');

  // Revision 2 of the hot case: the project raised the heat-load margin to 30 %.
  const margins = resolveMargins({ heatLoadPercent: 30, temperatureMarginC: hot.inputs.margins.temperatureMarginC });
  const results = evaluateCase(hot.inputs.conditions, margins);
  const inputs = withRationale('hot', { ...hot.inputs, margins }, results);
  release({ ...hot, inputs, results }, hotSeries, 2, '2026-06-03T14:00:00.000Z');
  tx.update(loadCases).set({ status: 'superseded' }).where(eq(loadCases.id, hot1.id)).run();

  tx.insert(caseSubscriptions).values({ caseSeriesId: hotSeries, userId: viewer.id }).run();
};
