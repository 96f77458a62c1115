// Turns a mission's stored orbit, surfaces and materials into the snapshot a case keeps, derives
// the hot and cold cases (physics/design-cases.ts) or computes a custom one, and saves them as drafts.
import { randomUUID } from 'node:crypto';
import { and, eq, sql } from 'drizzle-orm';
import type { CaseCreateParsed, CaseDeriveParsed } from '../../shared/api/cases';
import { whyRecordOf, type CaseInputs, type StoredConditions } from '../../shared/api/case-content';
import { caseRationale } from '../../shared/physics/case-why';
import { surfaceNormal } from '../../shared/api/missions';
import { getBody, solarDistanceRangeAu, type Body } from '../../shared/physics/bodies';
import { ECCENTRIC_SAMPLING_FROM, caseModelAssumptions, deriveDesignCases, evaluateCase, type CaseConditions, type CaseSurface } from '../../shared/physics/design-cases';
import { designPairs, resolveMargins, type Margins } from '../../shared/physics/design-environment';
import { raanOnDateRad, scanMission } from '../../shared/physics/design-scan';
import { defineOrbit } from '../../shared/physics/orbit-definition';
import { pairsFromTable } from '../../shared/physics/environment-table';
import { DEG } from '../../shared/physics/vector3';
import type { AppContext } from '../app-context';
import type { Db, DbOrTx } from '../db/database';
import { preparedPer } from '../db/prepared';
import { recordAudit } from '../audit/audit-log';
import { environmentTableRowsOf } from '../environment/environment-table-store';
import { loadCases, materials, orbits, surfaces, type LoadCaseRow, type MissionRow, type OrbitRow, type UserRow } from '../db/schema';
import { notFound, unprocessable } from '../errors';
import { limitWork, MAX_CASE_SAMPLES } from '../work-limit';

/** A case's assumptions: the fixed ones and the albedo, IR and sampling models its conditions use. */
export const caseAssumptions = (conditions: CaseConditions): string[] => [
  'eclipseFraction counts umbra plus half of penumbra (conical shadow, Sun as a uniform disk, no atmosphere)',
  ...caseModelAssumptions(conditions),
  'surfaces are flat plates fixed in the local orbital frame (x ram, y orbit normal, z zenith) or pointed at the Sun; no shadowing between them',
  'the worst Sun distance and the worst beta are combined even when they fall on different days (conservative)',
  'the Sun is held fixed over the orbit; tS counts from periapsis (from the ascending node for a circular orbit)',
];

const describeNormal = (n: CaseSurface['normal']): string => (typeof n === 'string' ? n : `{x: ${n.x}, y: ${n.y}, z: ${n.z}}`);
export const attitudeText = (list: CaseSurface[]): string =>
  `surface normals in the local orbital frame: ${list.map((s) => `${s.name} ${describeNormal(s.normal)}`).join('; ')}`;

interface MissionSnapshot {
  orbit: OrbitRow;
  surfaces: CaseSurface[];
}

/** A case's series hold steps × surfaces samples of each quantity: within what a load case may hold, or 413. */
export function limitCaseWork(steps: number, surfaceCount: number): void {
  limitWork([{ name: 'steps', count: steps }, { name: 'surfaces', count: surfaceCount }], 'steps', 'use fewer steps', MAX_CASE_SAMPLES);
}

/** The orbit and the surfaces a case is computed from, once steps × surfaces is within the limit. */
function snapshotOf(db: DbOrTx, mission: MissionRow, orbitId: string, steps: number): MissionSnapshot {
  const orbit = db.select().from(orbits).where(and(eq(orbits.id, orbitId), eq(orbits.missionId, mission.id))).get();
  if (!orbit) throw notFound(`The mission "${mission.name}" has no orbit with id ${JSON.stringify(orbitId.slice(0, 80))}.`);
  const surfaces = surfaceSnapshot(db, mission);
  limitCaseWork(steps, surfaces.length);
  return { orbit, surfaces };
}

/** The mission's surfaces with their materials, as a case keeps them; 422 when there are none. */
const surfacesWithMaterials = preparedPer((db: DbOrTx) =>
  db
    .select({ surface: surfaces, material: materials })
    .from(surfaces)
    .innerJoin(materials, eq(materials.id, surfaces.materialId))
    .where(eq(surfaces.missionId, sql.placeholder('missionId')))
    .orderBy(surfaces.createdAt, surfaces.name)
    .prepare(),
);

export function surfaceSnapshot(db: DbOrTx, mission: MissionRow): CaseSurface[] {
  const rows = surfacesWithMaterials(db).all({ missionId: mission.id });
  if (rows.length === 0) {
    throw unprocessable(`The mission "${mission.name}" has no spacecraft surfaces yet; add them before deriving load cases.`, [
      { path: 'missionId', message: 'no surfaces' },
    ]);
  }
  return rows.map(({ surface, material }) => ({
    name: surface.name,
    // Stored as JSON text; checked against the contract's normals on the way out.
    normal: surfaceNormal.parse(surface.normal),
    areaM2: surface.areaM2,
    material: {
      name: material.name,
      absorptivityBol: material.absorptivityBol,
      emissivityBol: material.emissivityBol,
      absorptivityEol: material.absorptivityEol,
      emissivityEol: material.emissivityEol,
      source: material.source,
    },
  }));
}

/** A case's inputs with the rationale built again from them and its results (physics/case-why.ts). */
export function withRationale(kind: LoadCaseRow['kind'], inputs: CaseInputs, results: LoadCaseRow['results']): CaseInputs {
  return { ...inputs, rationale: caseRationale(whyRecordOf(kind, inputs, results)) };
}

/** The mission and its body as a case records them. */
export function missionInputs(mission: MissionRow): Pick<CaseInputs, 'mission' | 'body'> {
  const body = getBody(mission.bodyId);
  return {
    mission: { id: mission.id, name: mission.name, startDate: mission.startDate, endDate: mission.endDate, crewed: mission.crewed },
    body: {
      id: body.id, name: body.name, gmKm3S2: body.gmKm3S2, radiusKm: body.radiusKm, j2: body.j2,
      solarDistanceAu: solarDistanceRangeAu(body), albedo: { ...body.albedo }, olrWm2: { ...body.olrWm2 },
      provisional: body.provisional, sources: { ...body.sources },
    },
  };
}

function baseInputs(mission: MissionRow, orbit: OrbitRow): Pick<CaseInputs, 'mission' | 'body' | 'orbit'> {
  return {
    ...missionInputs(mission),
    orbit: {
      id: orbit.id, name: orbit.name, epoch: orbit.epoch, periapsisAltitudeKm: orbit.periapsisAltitudeKm,
      apoapsisAltitudeKm: orbit.apoapsisAltitudeKm, semiMajorAxisKm: orbit.semiMajorAxisKm, eccentricity: orbit.eccentricity,
      periodS: orbit.periodS, inclinationDeg: orbit.inclinationDeg, raanDeg: orbit.raanDeg, argPeriapsisDeg: orbit.argPeriapsisDeg,
    },
  };
}

const canonicalOrbit = (o: OrbitRow): StoredConditions['orbit'] => ({
  semiMajorAxisKm: o.semiMajorAxisKm, eccentricity: o.eccentricity, inclinationDeg: o.inclinationDeg, raanDeg: o.raanDeg, argPeriapsisDeg: o.argPeriapsisDeg,
});

/** A case's `environmentSource` when the user gave its albedo or OLR (a new revision keeps them). */
export const USER_GIVEN_SOURCE = 'entered by the user';

/**
 * A single case's albedo and OLR in words: where they come from (the body's nominal values unless
 * the user gave either) and the rationale line, which names the body's design pairs beside them.
 */
export function pairWords(body: Body, inclinationDeg: number, albedo: number, olrWm2: number, userGiven: boolean): { source: string; rationale: string } {
  const pairs = designPairs(body, inclinationDeg);
  return {
    source: userGiven ? USER_GIVEN_SOURCE : `${body.name} nominal: ${body.sources['albedo'] ?? ''}`,
    rationale: `albedo ${albedo.toFixed(2)} with OLR ${olrWm2.toFixed(0)} W/m^2, ${userGiven ? 'given by the user' : `${body.name}'s nominal values; design pairs: hot ${pairs.hot.albedo}/${pairs.hot.olrWm2.toFixed(0)}, cold ${pairs.cold.albedo}/${pairs.cold.olrWm2.toFixed(0)}`}`,
  };
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

export type DraftValues = Pick<LoadCaseRow, 'name' | 'kind' | 'inputs' | 'results'>;

/** The hot and cold cases of a mission's orbit, ready to be saved (the seed saves them too). */
export function derivedCaseValues(db: DbOrTx, mission: MissionRow, input: CaseDeriveParsed): DraftValues[] {
  const { orbit, surfaces: list } = snapshotOf(db, mission, input.orbitId, input.steps);
  const margins: Margins = resolveMargins(input.margins);
  const pair = (p: { albedo: number; olrWm2: number; source: string } | undefined) => (p ? { ...p, provisional: false } : undefined);
  // the workspace's own table, where a row holds for the body and the orbit's inclination, over the built-in pairs
  const table = pairsFromTable(environmentTableRowsOf(db, mission.workspaceId), getBody(mission.bodyId), orbit.inclinationDeg, input.averagingTimeS);
  const derivation = deriveDesignCases({
    bodyId: mission.bodyId,
    orbit: canonicalOrbit(orbit),
    orbitEpoch: orbit.epoch,
    startDate: mission.startDate,
    endDate: mission.endDate,
    surfaces: list,
    margins,
    properties: input.properties,
    environment: { hot: pair(input.environment?.hot) ?? table?.hot, cold: pair(input.environment?.cold) ?? table?.cold },
    steps: input.steps,
  });
  const prefix = input.name ?? `${mission.name} ${orbit.name}`;
  return [derivation.hot, derivation.cold].map((c) => ({
    name: `${prefix} ${c.kind}`,
    kind: c.kind,
    inputs: {
      ...baseInputs(mission, orbit),
      attitude: attitudeText(list),
      conditions: { ...c.conditions, orbit: canonicalOrbit(orbit) },
      environmentSource: c.environmentSource,
      provisional: c.provisional,
      margins,
      decision: c.decision,
      rationale: c.rationale,
      surfaceDrivers: c.surfaceDrivers,
      scan: derivation.scan,
      assumptions: caseAssumptions(c.conditions),
    },
    results: c.results,
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

/** A user-defined case computed with the mission's orbit, surfaces and materials as they are now. */
export function customCaseValues(db: DbOrTx, mission: MissionRow, input: CaseCreateParsed): DraftValues {
  const { orbit, surfaces: list } = snapshotOf(db, mission, input.orbitId, input.steps);
  const unknown = Object.keys(input.normals ?? {}).filter((n) => !list.some((s) => s.name === n));
  if (unknown.length > 0) {
    throw unprocessable(`The mission has no surface named ${unknown.map((n) => JSON.stringify(n)).join(', ')}.`, unknown.map((n) => ({ path: `normals.${n}`, message: 'no such surface' })));
  }
  const pointed = list.map((s) => ({ ...s, normal: input.normals?.[s.name] ?? s.normal }));
  const body = getBody(mission.bodyId);
  const elements = canonicalOrbit(orbit);
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
  const pair = pairWords(body, orbit.inclinationDeg, conditions.albedo, conditions.olrWm2, input.albedo !== undefined || input.olrWm2 !== undefined);
  const given = (v: unknown, what: string, fallback: string) => (v === undefined ? fallback : `${what} given by the user`);
  const facts = [
    `custom case on ${input.date}: ${given(input.betaDeg, `beta ${conditions.betaDeg.toFixed(1)} deg`, `beta ${conditions.betaDeg.toFixed(1)} deg from the date (node drifted under J2 to ${(raanOnDateRad(defined, new Date(orbit.epoch), new Date(`${input.date}T12:00:00Z`)) / DEG).toFixed(1)} deg)`)}`,
    `Sun distance ${conditions.solarDistanceAu.toFixed(4)} AU, ${given(input.solarDistanceAu, 'distance', 'from the date (VSOP87)')}`,
    pair.rationale,
    `${input.properties.toUpperCase()} optical properties`,
  ];
  const userValues = { betaDeg: input.betaDeg, solarDistanceAu: input.solarDistanceAu, albedo: input.albedo, olrWm2: input.olrWm2, normals: input.normals };
  const fixed: NonNullable<CaseInputs['fixed']> = Object.fromEntries(Object.entries(userValues).filter(([, v]) => v !== undefined));
  const inputs: CaseInputs = {
    ...baseInputs(mission, orbit),
    attitude: input.attitude ?? attitudeText(pointed),
    conditions,
    environmentSource: pair.source,
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
