// A load case computed along a window of an uploaded ephemeris instead of a Keplerian orbit: the
// loads at every row of the window (the averages and peaks count each one; the stored series keeps
// `steps` of them, evenly spaced in time, as the thermal model takes a case's series), with the
// osculating orbit at the first row recorded as the case's orbit. Its results come from the
// trajectory, so its inputs cannot be edited by hand: a different window or property set is a new
// case from the ephemeris page.
import type { EphemerisCaseCreateParsed } from '../../shared/api/ephemerides';
import type { CaseInputs, StoredConditions } from '../../shared/api/case-content';
import { getBody } from '../../shared/physics/bodies';
import { attitudeText, pairWords, USER_GIVEN_SOURCE } from '../../shared/physics/case-words';
import { opticalProperties, resolveMargins } from '../../shared/physics/design-environment';
import { round } from '../../shared/physics/rounding';
import { elementsFromState } from '../../shared/physics/state-elements';
import { sunFromBody } from '../../shared/physics/sun';
import { osculatingOrbit, trajectoryCaseAssumptions, trajectoryCaseResults, trajectoryEclipseS } from '../../shared/physics/trajectory-case';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import type { EphemerisRow, LoadCaseRow, MissionRow, UserRow } from '../db/schema';
import { unprocessable } from '../errors';
import { ephemerisWindow, firstStates, windowEnvironment } from '../ephemerides/ephemeris-environment';
import { insertDraft, withRationale, type DraftValues } from './case-drafts';
import { limitCaseWork, missionInputs, surfaceSnapshot } from './case-snapshot';

const oneDecimal = (x: number) => x.toFixed(1);

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
  const results = trajectoryCaseResults(env, snapshot, input.properties, margins, input.marginDirection, first.tMs);
  const eclipseS = trajectoryEclipseS(env);

  const middle = new Date(first.tMs + (spanS * 1000) / 2);
  const solarDistanceAu = sunFromBody(body, middle).distanceAu;
  const elements: StoredConditions['orbit'] = {
    semiMajorAxisKm: el.semiMajorAxisKm, eccentricity: el.eccentricity, inclinationDeg: el.inclinationDeg, raanDeg: el.raanDeg, argPeriapsisDeg: el.argPeriapsisDeg,
  };
  const pairText = pairWords(body, el.inclinationDeg, env.albedo, env.olrWm2, input.albedo !== undefined || input.olrWm2 !== undefined);
  const conditions: StoredConditions = {
    bodyId: mission.bodyId, orbit: elements, orbitEpoch: from, date: from.slice(0, 10),
    betaDeg: results.betaDeg, solarDistanceAu: round(solarDistanceAu, 6), albedo: env.albedo, olrWm2: env.olrWm2,
    properties: input.properties, marginDirection: input.marginDirection, steps: env.points.length, surfaces: snapshot,
  };
  const inputs: CaseInputs = {
    ...missionInputs(mission),
    orbit: { id: null, name: `osculating at ${from} (ephemeris "${ephemeris.name}")`, epoch: from, ...osculatingOrbit(el, body) },
    attitude: attitudeText(snapshot),
    conditions,
    environmentSource: pairText.source,
    provisional: body.provisional,
    margins,
    facts: [
      `loads along the ephemeris "${ephemeris.name}" (${ephemeris.fileName}, SHA-256 ${ephemeris.sha256.slice(0, 12)}…) from ${from} to ${to}: ${window.rows} rows, every one counted in the averages and peaks; the series keeps ${env.points.length} of them`,
      `beta ${oneDecimal(results.betaDeg)} deg: the time-weighted mean over the window of the Sun's angle above the orbit plane (r x v at each row)`,
      `Sun distance ${solarDistanceAu.toFixed(4)} AU at the middle of the window (VSOP87); mean solar flux ${oneDecimal(results.solarFluxWm2)} W/m²`,
      pairText.rationale,
      `eclipse ${oneDecimal(eclipseS / 60)} min of the window's ${oneDecimal(spanS / 60)} min (umbra ${oneDecimal(env.umbraS / 60)} min, penumbra ${oneDecimal(env.penumbraS / 60)} min)`,
      `${input.properties.toUpperCase()} optical properties`,
    ],
    rationale: [],
    surfaceDrivers: [],
    scan: null,
    assumptions: trajectoryCaseAssumptions(env),
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
