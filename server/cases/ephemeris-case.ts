// A load case computed along a window of an uploaded ephemeris instead of a Keplerian orbit: the
// loads at every row of the window (the averages and peaks count each one; the stored series keeps
// `steps` of them, evenly spaced in time, as the thermal model takes a case's series), with the
// osculating orbit at the first row recorded as the case's orbit. Its results come from the
// trajectory, so its inputs cannot be edited by hand: a different window or property set is a new
// case from the ephemeris page.
import type { EphemerisCaseCreateParsed } from '../../shared/api/ephemerides';
import type { CaseInputs, CaseResultsContent, StoredConditions } from '../../shared/api/case-content';
import { getBody } from '../../shared/physics/bodies';
import { round, type CaseSurfaceResult, type LoadSummary } from '../../shared/physics/design-cases';
import { opticalProperties, resolveMargins, type Margins } from '../../shared/physics/design-environment';
import type { SurfaceLoad } from '../../shared/physics/heat-loads';
import { elementsFromState } from '../../shared/physics/state-elements';
import { sunFromBody } from '../../shared/physics/sun';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import type { EphemerisRow, LoadCaseRow, MissionRow, UserRow } from '../db/schema';
import { unprocessable } from '../errors';
import { capAssumptions } from '../../shared/physics/cap-loads';
import type { TrajectoryEnvironment } from '../../shared/physics/trajectory-environment';
import { ephemerisWindow, firstStates, windowEnvironment } from '../ephemerides/ephemeris-environment';
import { attitudeText, insertDraft, withRationale, limitCaseWork, missionInputs, pairWords, surfaceSnapshot, USER_GIVEN_SOURCE, type DraftValues } from './case-derivation';

/** The case's assumptions, with the albedo and IR models the window was computed with (cap-loads.ts says them). */
export const ephemerisCaseAssumptions = (env: TrajectoryEnvironment): string[] => [
  'loads at every row of the ephemeris inside the window: the Sun from each row\'s epoch (VSOP87, interpolated between hourly evaluations), conical shadow of the central body, no atmosphere',
  ...capAssumptions(env.models, env.meanSolarFluxWm2),
  'surfaces are flat plates fixed in the local orbital frame from r and v (x ram, y orbit normal, z zenith) or pointed at the Sun; no shadowing between them',
  '"orbit average" values are time-weighted (trapezoidal) over the whole window, every row; peaks over every row; the stored series keeps `steps` rows evenly spaced in time (the first row at or after each step), whatever the file\'s own spacing',
  'tS counts from the first row of the window and periodS is the window\'s length: a thermal model run on this case repeats the window as if it were periodic',
  'eclipseFraction counts umbra plus half of penumbra over the window',
];

const f1 = (x: number) => x.toFixed(1);

/** The margin columns of stored results for other margins (the loads themselves do not change). */
export function withMargins(results: CaseResultsContent, margins: Margins, direction: 'increase' | 'decrease'): CaseResultsContent {
  const factor = direction === 'increase' ? 1 + margins.heatLoadPercent / 100 : 1 - margins.heatLoadPercent / 100;
  return {
    ...results,
    surfaces: results.surfaces.map((s) => ({ ...s, orbitAverage: { ...s.orbitAverage, absorbedWithMarginW: round(s.orbitAverage.absorbedW * factor) } })),
    total: { ...results.total, orbitAverageWithMarginW: round(results.total.orbitAverageAbsorbedW * factor) },
  };
}

/** Computes the case along the window with the mission's surfaces and materials as they are now (kind custom). */
export function ephemerisCaseValues(
  ctx: AppContext, mission: MissionRow, ephemeris: EphemerisRow, input: EphemerisCaseCreateParsed,
): DraftValues {
  const body = getBody(mission.bodyId);
  const snapshot = surfaceSnapshot(ctx.db, mission);
  limitCaseWork(input.steps, snapshot.length);
  const window = ephemerisWindow(ctx, ephemeris, input);
  const optics = snapshot.map((s) => opticalProperties(s.material, input.properties));
  const env = windowEnvironment(
    ctx, mission, ephemeris, window,
    snapshot.map((s, i) => ({ name: s.name, normal: s.normal, areaM2: s.areaM2, ...optics[i]! })),
    { albedo: input.albedo, olrWm2: input.olrWm2, maxPoints: input.steps, sampling: 'time' },
  );

  // The osculating orbit at the first row (velocity by a forward difference when the file has none).
  const [first, second] = firstStates(ctx, ephemeris, window);
  const velocity = first.velocityKmS ?? first.positionKm.map((x, k) => (second.positionKm[k]! - x) / ((second.tMs - first.tMs) / 1000));
  const el = elementsFromState(first.positionKm, [velocity[0]!, velocity[1]!, velocity[2]!], body.gmKm3S2);
  if (!(el.eccentricity < 1)) {
    throw unprocessable(`At ${window.from} the trajectory is not a closed orbit about ${body.name} (eccentricity ${el.eccentricity.toFixed(3)}): a load case needs an orbit to record; choose a window where it is bound.`, [
      { path: 'from', message: `eccentricity ${el.eccentricity.toFixed(3)} at the first row` },
    ]);
  }
  const { from, to } = window;
  const spanS = env.spanS;
  const margins = resolveMargins(input.margins);
  const factor = input.marginDirection === 'increase' ? 1 + margins.heatLoadPercent / 100 : 1 - margins.heatLoadPercent / 100;

  const surfaces = snapshot.map((s, i): CaseSurfaceResult => {
    const { absorptivity, emissivity } = optics[i]!;
    const watts = (l: Pick<SurfaceLoad, 'solarWm2' | 'albedoWm2' | 'irWm2' | 'absorbedW'>): LoadSummary => ({
      solarWm2: round(l.solarWm2), albedoWm2: round(l.albedoWm2), irWm2: round(l.irWm2),
      solarW: round(s.areaM2 * absorptivity * l.solarWm2), albedoW: round(s.areaM2 * absorptivity * l.albedoWm2), irW: round(s.areaM2 * emissivity * l.irWm2),
      absorbedW: round(l.absorbedW),
    });
    const perStep = env.points.map((p) => watts(p.surfaces[i]!));
    const average = watts(env.averages.surfaces[i]!);
    return {
      name: s.name, areaM2: s.areaM2, absorptivity, emissivity,
      series: {
        solarWm2: perStep.map((x) => x.solarWm2), albedoWm2: perStep.map((x) => x.albedoWm2), irWm2: perStep.map((x) => x.irWm2),
        solarW: perStep.map((x) => x.solarW), albedoW: perStep.map((x) => x.albedoW), irW: perStep.map((x) => x.irW),
        absorbedW: perStep.map((x) => x.absorbedW),
      },
      orbitAverage: { ...average, absorbedWithMarginW: round(average.absorbedW * factor) },
      peak: watts(env.peaks.surfaces[i]!),
    };
  });
  const totalAverage = surfaces.reduce((sum, s) => sum + s.orbitAverage.absorbedW, 0);
  const eclipseS = env.umbraS + env.penumbraS / 2;
  const results: CaseResultsContent = {
    periodS: round(spanS, 3),
    betaDeg: round(env.meanBetaDeg, 4),
    solarFluxWm2: round(env.meanSolarFluxWm2, 3),
    eclipseFraction: round(eclipseS / env.spanS, 5),
    eclipseDurationS: round(eclipseS, 1),
    umbraDurationS: round(env.umbraS, 1),
    penumbraDurationS: round(env.penumbraS, 1),
    tS: env.points.map((p) => round((p.tMs - first.tMs) / 1000, 3)),
    sunlit: env.points.map((p) => round(p.sunlit, 5)),
    // about a moon, the planet's shadow where it falls on the window (as a derived case keeps it)
    ...(env.points.some((p) => (p.parentSunlit ?? 1) < 1) ? { parentSunlit: env.points.map((p) => round(p.parentSunlit ?? 1, 5)) } : {}),
    surfaces,
    total: { orbitAverageAbsorbedW: round(totalAverage), orbitAverageWithMarginW: round(totalAverage * factor), peakAbsorbedW: round(env.peakTotalAbsorbedW) },
  };

  const middle = new Date(first.tMs + (spanS * 1000) / 2);
  const solarDistanceAu = sunFromBody(body, middle).distanceAu;
  const elements: StoredConditions['orbit'] = {
    semiMajorAxisKm: el.semiMajorAxisKm, eccentricity: el.eccentricity, inclinationDeg: el.inclinationDeg, raanDeg: el.raanDeg, argPeriapsisDeg: el.argPeriapsisDeg,
  };
  const pair = pairWords(body, el.inclinationDeg, env.albedo, env.olrWm2, input.albedo !== undefined || input.olrWm2 !== undefined);
  const conditions: StoredConditions = {
    bodyId: mission.bodyId, orbit: elements, orbitEpoch: from, date: from.slice(0, 10),
    betaDeg: results.betaDeg, solarDistanceAu: round(solarDistanceAu, 6), albedo: env.albedo, olrWm2: env.olrWm2,
    properties: input.properties, marginDirection: input.marginDirection, steps: env.points.length, surfaces: snapshot,
  };
  const inputs: CaseInputs = {
    ...missionInputs(mission),
    orbit: {
      id: null,
      name: `osculating at ${from} (ephemeris "${ephemeris.name}")`,
      epoch: from,
      periapsisAltitudeKm: el.semiMajorAxisKm * (1 - el.eccentricity) - body.radiusKm,
      apoapsisAltitudeKm: el.semiMajorAxisKm * (1 + el.eccentricity) - body.radiusKm,
      semiMajorAxisKm: el.semiMajorAxisKm,
      eccentricity: el.eccentricity,
      periodS: 2 * Math.PI * Math.sqrt(el.semiMajorAxisKm ** 3 / body.gmKm3S2),
      inclinationDeg: el.inclinationDeg,
      raanDeg: el.raanDeg,
      argPeriapsisDeg: el.argPeriapsisDeg,
    },
    attitude: attitudeText(snapshot),
    conditions,
    environmentSource: pair.source,
    provisional: body.provisional,
    margins,
    facts: [
      `loads along the ephemeris "${ephemeris.name}" (${ephemeris.fileName}, SHA-256 ${ephemeris.sha256.slice(0, 12)}…) from ${from} to ${to}: ${window.rows} rows, every one counted in the averages and peaks; the series keeps ${env.points.length} of them`,
      `beta ${f1(results.betaDeg)} deg: the time-weighted mean over the window of the Sun's angle above the orbit plane (r x v at each row)`,
      `Sun distance ${solarDistanceAu.toFixed(4)} AU at the middle of the window (VSOP87); mean solar flux ${f1(results.solarFluxWm2)} W/m^2`,
      pair.rationale,
      `eclipse ${f1(eclipseS / 60)} min of the window's ${f1(spanS / 60)} min (umbra ${f1(env.umbraS / 60)} min, penumbra ${f1(env.penumbraS / 60)} min)`,
      `${input.properties.toUpperCase()} optical properties`,
    ],
    rationale: [],
    surfaceDrivers: [],
    scan: null,
    assumptions: ephemerisCaseAssumptions(env),
    ephemeris: { id: ephemeris.id, name: ephemeris.name, fileName: ephemeris.fileName, sha256: ephemeris.sha256, from, to, rows: window.rows },
  };
  return { name: input.name, kind: 'custom', inputs: withRationale('custom', inputs, results), results };
}

/**
 * The request that computes a stored case again along the same ephemeris and window: its steps,
 * property set, margins and direction, and its albedo and OLR only where the user gave them.
 */
export function ephemerisRequestOf(row: Pick<LoadCaseRow, 'name' | 'inputs'>, ephemeris: EphemerisRow): EphemerisCaseCreateParsed {
  const i = row.inputs;
  const c = i.conditions;
  const trajectory = i.ephemeris!;
  // the whole file was asked for: no bounds, so an OEM's sub-millisecond first and last epochs stay in
  const wholeFile = trajectory.from === ephemeris.startEpoch && trajectory.to === ephemeris.endEpoch;
  const givenPair = i.environmentSource === USER_GIVEN_SOURCE;
  return {
    name: row.name, properties: c.properties, marginDirection: c.marginDirection, steps: c.steps,
    margins: { heatLoadPercent: i.margins.heatLoadPercent, temperatureMarginC: i.margins.temperatureMarginC },
    ...(wholeFile ? {} : { from: trajectory.from, to: trajectory.to }),
    ...(givenPair ? { albedo: c.albedo, olrWm2: c.olrWm2 } : {}),
  };
}

/** Computes and saves the case as a draft (kind custom). */
export function createEphemerisCase(
  ctx: AppContext, user: UserRow, mission: MissionRow, ephemeris: EphemerisRow, input: EphemerisCaseCreateParsed,
): LoadCaseRow {
  const values = ephemerisCaseValues(ctx, mission, ephemeris, input);
  const { from, to } = values.inputs.ephemeris!;
  return ctx.db.transaction((tx) => {
    const row = insertDraft(tx, mission, user, values);
    recordAudit(tx, {
      workspaceId: mission.workspaceId, actorUserId: user.id, action: 'case.created', targetType: 'load_case', targetId: row.id,
      summary: `Created custom case "${row.name}" (revision 1, draft) from ephemeris "${ephemeris.name}" (${from} – ${to}) for mission "${mission.name}".`,
    });
    return row;
  });
}
