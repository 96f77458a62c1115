// A user-defined load case: the mission's orbit on a fixed date (with the beta, Sun distance,
// albedo and OLR the user gives, else the date's), a property set and an attitude, saved as a draft.
import type { CaseCreateParsed } from '../../shared/api/cases';
import type { CaseInputs, StoredConditions } from '../../shared/api/case-content';
import { getBody } from '../../shared/physics/bodies';
import { attitudeText, caseAssumptions, pairWords, USER_GIVEN_SOURCE } from '../../shared/physics/case-words';
import { ECCENTRIC_SAMPLING_FROM, evaluateCase } from '../../shared/physics/design-cases';
import { resolveMargins } from '../../shared/physics/design-environment';
import { raanOnDateRad, scanMission } from '../../shared/physics/design-scan';
import { defineOrbit } from '../../shared/physics/orbit-definition';
import { DEG } from '../../shared/physics/vector3';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import type { LoadCaseRow, MissionRow, UserRow } from '../db/schema';
import { unprocessable } from '../errors';
import { insertDraft, withRationale, type DraftValues } from './case-drafts';
import type { DbOrTx } from '../db/database';
import { orbitElements, orbitInputs, snapshotOf } from './case-snapshot';

/** A user-defined case computed with the mission's orbit, surfaces and materials as they are now. */
export function customCaseValues(db: DbOrTx, mission: MissionRow, input: CaseCreateParsed): DraftValues {
  const { orbit, surfaces: list } = snapshotOf(db, mission, input.orbitId, input.steps);
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
  const userValues = { betaDeg: input.betaDeg, solarDistanceAu: input.solarDistanceAu, albedo: input.albedo, olrWm2: input.olrWm2, normals: input.normals };
  const fixed: NonNullable<CaseInputs['fixed']> = Object.fromEntries(Object.entries(userValues).filter(([, v]) => v !== undefined));
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
    ...(Object.keys(fixed).length > 0 ? { fixed } : {}),
  };
  const results = evaluateCase(conditions, margins);
  return { name: input.name, kind: 'custom', inputs: withRationale('custom', inputs, results), results };
}

/**
 * The request that computes a stored custom case again from the mission's current orbit, surfaces
 * and materials: its date, property set, margins and steps, the values its author fixed (beta, Sun
 * distance, albedo, OLR, normals, attitude in words) and the conditions edited by hand since.
 */
export function customRequestOf(row: Pick<LoadCaseRow, 'name' | 'inputs'>, surfaceNames: string[]): CaseCreateParsed {
  const i = row.inputs;
  const c = i.conditions;
  const fixed = i.fixed ?? legacyFixed(i);
  const kept = <K extends 'betaDeg' | 'solarDistanceAu' | 'albedo' | 'olrWm2'>(k: K) => (i.handEdited?.includes(k) ? c[k] : fixed[k]);
  const normals = Object.entries(fixed.normals ?? {}).filter(([name]) => surfaceNames.includes(name));
  const typedAttitude = i.attitude !== attitudeText(c.surfaces) ? i.attitude : undefined;
  const optional = { betaDeg: kept('betaDeg'), solarDistanceAu: kept('solarDistanceAu'), albedo: kept('albedo'), olrWm2: kept('olrWm2'), attitude: typedAttitude };
  return {
    orbitId: i.orbit.id ?? '', name: row.name, date: c.date, properties: c.properties, marginDirection: c.marginDirection, steps: c.steps,
    margins: { heatLoadPercent: i.margins.heatLoadPercent, temperatureMarginC: i.margins.temperatureMarginC },
    ...Object.fromEntries(Object.entries(optional).filter(([, v]) => v !== undefined)),
    ...(normals.length > 0 ? { normals: Object.fromEntries(normals) } : {}),
  };
}

/** What a custom case made before `fixed` was kept says of itself: its setup lines and environment source. */
function legacyFixed(i: CaseInputs): NonNullable<CaseInputs['fixed']> {
  const c = i.conditions;
  const said = (pattern: RegExp) => (i.facts ?? []).some((line) => pattern.test(line));
  const pairGiven = i.environmentSource === USER_GIVEN_SOURCE;
  return {
    ...(said(/^custom case on .*: beta \S+ deg given by the user/) ? { betaDeg: c.betaDeg } : {}),
    ...(said(/^Sun distance .*, distance given by the user/) ? { solarDistanceAu: c.solarDistanceAu } : {}),
    ...(pairGiven ? { albedo: c.albedo, olrWm2: c.olrWm2 } : {}),
  };
}

/** Saves a user-defined case: a fixed date (and beta, if given), property set and attitude. */
export function createCustomCase(ctx: AppContext, user: UserRow, mission: MissionRow, input: CaseCreateParsed): LoadCaseRow {
  const values = customCaseValues(ctx.db, mission, input);
  return ctx.db.transaction((tx) => {
    const row = insertDraft(tx, mission, user, values);
    recordAudit(tx, {
      workspaceId: mission.workspaceId, actorUserId: user.id, action: 'case.created', targetType: 'load_case', targetId: row.id,
      summary: `Created custom case "${row.name}" (revision 1, draft) for mission "${mission.name}".`,
    });
    return row;
  });
}
