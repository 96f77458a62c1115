// A user-defined load case: the mission's orbit on a fixed date (with the beta, Sun distance,
// albedo and OLR the user gives, else the date's), a property set and an attitude, saved as a draft.
import type { CaseCreateParsed } from '../../shared/api/cases';
import type { CaseInputs, StoredConditions } from '../../shared/api/case-content';
import { getBody } from '../../shared/physics/bodies';
import { attitudeText, caseAssumptions, pairWords } from '../../shared/physics/case-words';
import { ECCENTRIC_SAMPLING_FROM, evaluateCase } from '../../shared/physics/design-cases';
import { resolveMargins } from '../../shared/physics/design-environment';
import { raanOnDateRad, scanMission } from '../../shared/physics/design-scan';
import { defineOrbit } from '../../shared/physics/orbit-definition';
import { DEG } from '../../shared/physics/vector3';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import type { LoadCaseRow, MissionRow, UserRow } from '../db/schema';
import { unprocessable } from '../errors';
import { insertDraft, withRationale } from './case-drafts';
import { orbitElements, orbitInputs, snapshotOf } from './case-snapshot';

/** Saves a user-defined case: a fixed date (and beta, if given), property set and attitude. */
export function createCustomCase(ctx: AppContext, user: UserRow, mission: MissionRow, input: CaseCreateParsed): LoadCaseRow {
  const { orbit, surfaces: list } = snapshotOf(ctx.db, mission, input.orbitId, input.steps);
  const unknown = Object.keys(input.normals ?? {}).filter((n) => !list.some((s) => s.name === n));
  if (unknown.length > 0) {
    throw unprocessable(`The mission has no surface named ${unknown.map((n) => JSON.stringify(n)).join(', ')}.`, unknown.map((n) => ({ path: `normals.${n}`, message: 'no such surface' })));
  }
  const pointed = list.map((s) => ({ ...s, normal: input.normals?.[s.name] ?? s.normal }));
  const body = getBody(mission.bodyId);
  const elements = orbitElements(orbit);
  const defined = defineOrbit(elements, body);
  const day = scanMission(body, defined, new Date(orbit.epoch), input.date, input.date)[0]!;
  const margins = resolveMargins(input.margins);
  const conditions: StoredConditions = {
    bodyId: mission.bodyId, orbit: elements, orbitEpoch: orbit.epoch, date: input.date,
    betaDeg: input.betaDeg ?? day.betaDeg, solarDistanceAu: input.solarDistanceAu ?? day.solarDistanceAu,
    albedo: input.albedo ?? body.albedo.nominal, olrWm2: input.olrWm2 ?? body.olrWm2.nominal,
    properties: input.properties, marginDirection: input.marginDirection, steps: input.steps, surfaces: pointed,
    // an airless body's IR comes from its surface temperature field unless the user gave an OLR
    ...(body.airless && input.olrWm2 === undefined
      ? { surfaceField: { emissivity: body.airless.emissivity.nominal, nightFloorK: body.airless.nightFloorK.nominal } }
      : {}),
    ...(elements.eccentricity >= ECCENTRIC_SAMPLING_FROM ? { sampling: 'eccentric-anomaly' as const } : {}),
  };
  const pairText = pairWords(body, orbit.inclinationDeg, conditions.albedo, conditions.olrWm2, input.albedo !== undefined || input.olrWm2 !== undefined);
  const given = (v: unknown, what: string, fallback: string) => (v === undefined ? fallback : `${what} given by the user`);
  const facts = [
    `custom case on ${input.date}: ${given(input.betaDeg, `beta ${conditions.betaDeg.toFixed(1)} deg`, `beta ${conditions.betaDeg.toFixed(1)} deg from the date (node drifted under J2 to ${(raanOnDateRad(defined, new Date(orbit.epoch), new Date(`${input.date}T12:00:00Z`)) / DEG).toFixed(1)} deg)`)}`,
    `Sun distance ${conditions.solarDistanceAu.toFixed(4)} AU, ${given(input.solarDistanceAu, 'distance', 'from the date (VSOP87)')}`,
    pairText.rationale,
    `${input.properties.toUpperCase()} optical properties`,
  ];
  const inputs: CaseInputs = {
    ...orbitInputs(mission, orbit),
    attitude: input.attitude ?? attitudeText(pointed),
    conditions,
    environmentSource: pairText.source,
    provisional: body.provisional,
    margins,
    facts,
    rationale: [],
    surfaceDrivers: [],
    scan: null,
    assumptions: caseAssumptions(conditions),
  };
  const results = evaluateCase(conditions, margins);
  return ctx.db.transaction((tx) => {
    const row = insertDraft(tx, mission, user, { name: input.name, kind: 'custom', inputs: withRationale('custom', inputs, results), results });
    recordAudit(tx, {
      workspaceId: mission.workspaceId, actorUserId: user.id, action: 'case.created', targetType: 'load_case', targetId: row.id,
      summary: `Created custom case "${row.name}" (revision 1, draft) for mission "${mission.name}".`,
    });
    return row;
  });
}
