// Hot and cold design cases: from a mission's orbit, date range and surfaces, the combination of
// Sun distance, paired albedo/OLR, property set and beta that bounds the absorbed heat, for the
// spacecraft as a whole and for each surface, each choice with the words that say what drove it.
// Leaves out: dissipation and attitude modes (the thermal model's part), survival cases, and any
// coupling between parameters: the worst Sun distance and the worst beta are combined even when
// they fall on different days, the usual conservative practice (DOMAIN.md "Cases" [P, G]).
import { getBody, solarDistanceRangeAu, type AnyBodyId, type Body } from './bodies';
import { caseRationale, fixed, type CaseDecision } from './case-why';
import { designPairs, heatLoadFactor, opticalProperties, type CaseMaterial, type EnvironmentPair, type MarginDirection, type Margins, type PropertySet } from './design-environment';
import { candidateDays, maxBy, raanOnDateRad, scanMission, type ScanDay } from './design-scan';
import { computeEnvironment, type EnvironmentResult } from './environment';
import { capAssumptions, chooseCapModels } from './cap-loads';
import { surfaceTemperatureK } from './cap-radiance';
import type { Sampling } from './orbit-sampling';
import type { SurfaceNormal } from './heat-loads';
import { defineOrbit, type OrbitInput } from './orbit-definition';
import { solarFluxWm2 } from './sun';
import { DEG, wrapDeg } from './vector3';
import { DAY_MS } from './constants';
import { round } from './rounding';

export interface CaseSurface {
  name: string;
  normal: SurfaceNormal;
  areaM2: number;
  material: CaseMaterial;
}

/** Everything one case is computed from; a case's results follow from these alone. */
export interface CaseConditions {
  bodyId: AnyBodyId;
  orbit: OrbitInput;
  orbitEpoch: string;
  /** YYYY-MM-DD: sets the node (J2 drift) and the Sun's azimuth; beta and distance are given below. */
  date: string;
  /** ISO 8601 UTC: where the orbit starts when not at 12:00 UTC of date (an orbit in the planet's shadow). */
  orbitStart?: string;
  betaDeg: number;
  solarDistanceAu: number;
  albedo: number;
  olrWm2: number;
  properties: PropertySet;
  /** Hot cases add the heat-load margin, cold cases take it off. */
  marginDirection: MarginDirection;
  steps: number;
  surfaces: CaseSurface[];
  /** An airless body's surface temperature field (its Bond albedo is `albedo`); absent: the uniform `olrWm2`. */
  surfaceField?: { emissivity: number; nightFloorK: number } | undefined;
  /** Where the series' samples fall; absent: evenly in time. */
  sampling?: Sampling | undefined;
}

/** From this eccentricity on, a derived case's series are sampled evenly in eccentric anomaly. */
export const ECCENTRIC_SAMPLING_FROM = 0.1;

export interface LoadSummary {
  solarWm2: number;
  albedoWm2: number;
  irWm2: number;
  solarW: number;
  albedoW: number;
  irW: number;
  absorbedW: number;
}

export interface CaseSurfaceResult {
  name: string;
  areaM2: number;
  absorptivity: number;
  emissivity: number;
  series: { solarWm2: number[]; albedoWm2: number[]; irWm2: number[]; solarW: number[]; albedoW: number[]; irW: number[]; absorbedW: number[] };
  orbitAverage: LoadSummary & { absorbedWithMarginW: number };
  peak: LoadSummary;
}

export interface CaseResults {
  periodS: number;
  betaDeg: number;
  solarFluxWm2: number;
  eclipseFraction: number;
  eclipseDurationS: number;
  umbraDurationS: number;
  penumbraDurationS: number;
  tS: number[];
  /** Each sample's share of the period, s, when the series are not evenly spaced in time. */
  weightS?: number[];
  sunlit: number[];
  /** About a moon, the sunlit share past its planet alone, when the planet's shadow falls on the orbit (`sunlit` is the combined one). */
  parentSunlit?: number[];
  surfaces: CaseSurfaceResult[];
  total: { orbitAverageAbsorbedW: number; orbitAverageWithMarginW: number; peakAbsorbedW: number };
}


const noonOf = (date: string): Date => new Date(`${date}T12:00:00Z`);

function environmentFor(conditions: CaseConditions, steps: number): EnvironmentResult {
  const body = getBody(conditions.bodyId);
  const orbit = defineOrbit(conditions.orbit, body);
  const at = conditions.orbitStart === undefined ? noonOf(conditions.date) : new Date(conditions.orbitStart);
  const raanDeg = raanOnDateRad(orbit, new Date(conditions.orbitEpoch), at) / DEG;
  return computeEnvironment({
    bodyId: conditions.bodyId,
    orbit: { ...conditions.orbit, raanDeg: wrapDeg(raanDeg) },
    epoch: at.toISOString(),
    betaDeg: conditions.betaDeg,
    solarDistanceAu: conditions.solarDistanceAu,
    albedo: conditions.albedo,
    ...(conditions.surfaceField
      ? { irModel: 'surface-temperature' as const, surfaceEmissivity: conditions.surfaceField.emissivity, nightFloorK: conditions.surfaceField.nightFloorK }
      : { irModel: 'uniform' as const, olrWm2: conditions.olrWm2 }),
    sampling: conditions.sampling ?? 'time',
    steps,
    surfaces: conditions.surfaces.map((s) => ({ name: s.name, normal: s.normal, areaM2: s.areaM2, ...opticalProperties(s.material, conditions.properties) })),
  });
}

/** A case's results: per-surface time series of incident (W/m^2) and absorbed (W) loads, orbit averages and peaks. */
export function evaluateCase(conditions: CaseConditions, margins: Margins): CaseResults {
  const env = environmentFor(conditions, conditions.steps);
  const factor = heatLoadFactor(margins.heatLoadPercent, conditions.marginDirection);
  // time weights per sample (equal when evenly spaced in time): averages stay time averages
  const weights = env.sampleWeightsS ?? env.profile.map(() => env.periodS / env.profile.length);
  const surfaces = conditions.surfaces.map((s, i): CaseSurfaceResult => {
    const { absorptivity, emissivity } = opticalProperties(s.material, conditions.properties);
    const loads = env.profile.map((p) => p.surfaces[i]!);
    const watts = (w: { solarWm2: number; albedoWm2: number; irWm2: number }) => ({
      solarW: s.areaM2 * absorptivity * w.solarWm2,
      albedoW: s.areaM2 * absorptivity * w.albedoWm2,
      irW: s.areaM2 * emissivity * w.irWm2,
    });
    const perStep = loads.map((l) => ({ ...l, ...watts(l) }));
    const mean = (pick: (x: (typeof perStep)[number]) => number) => perStep.reduce((sum, x, k) => sum + pick(x) * weights[k]!, 0) / env.periodS;
    const summary = (reduce: (pick: (x: (typeof perStep)[number]) => number) => number): LoadSummary => ({
      solarWm2: round(reduce((x) => x.solarWm2)), albedoWm2: round(reduce((x) => x.albedoWm2)), irWm2: round(reduce((x) => x.irWm2)),
      solarW: round(reduce((x) => x.solarW)), albedoW: round(reduce((x) => x.albedoW)), irW: round(reduce((x) => x.irW)),
      absorbedW: round(reduce((x) => x.absorbedW)),
    });
    const orbitAverage = summary(mean);
    // the peaks the environment searched for between samples too (orbit-sampling.ts)
    const peakLoad = env.peak.surfaces[i]!;
    const peak = summary((pick) => pick({ ...peakLoad, ...watts(peakLoad) }));
    return {
      name: s.name, areaM2: s.areaM2, absorptivity, emissivity,
      series: {
        solarWm2: perStep.map((x) => round(x.solarWm2)), albedoWm2: perStep.map((x) => round(x.albedoWm2)), irWm2: perStep.map((x) => round(x.irWm2)),
        solarW: perStep.map((x) => round(x.solarW)), albedoW: perStep.map((x) => round(x.albedoW)), irW: perStep.map((x) => round(x.irW)),
        absorbedW: perStep.map((x) => round(x.absorbedW)),
      },
      orbitAverage: { ...orbitAverage, absorbedWithMarginW: round(orbitAverage.absorbedW * factor) },
      peak,
    };
  });
  const totalSeries = env.profile.map((p) => p.surfaces.reduce((sum, l) => sum + l.absorbedW, 0));
  const totalAverage = surfaces.reduce((sum, s) => sum + s.orbitAverage.absorbedW, 0);
  return {
    periodS: round(env.periodS, 3),
    betaDeg: round(env.betaDeg, 4),
    solarFluxWm2: round(env.solarFluxWm2, 3),
    eclipseFraction: round(env.eclipseFraction, 5),
    eclipseDurationS: round(env.eclipseDurationS, 1),
    umbraDurationS: round(env.umbraDurationS, 1),
    penumbraDurationS: round(env.penumbraDurationS, 1),
    tS: env.profile.map((p) => round(p.tS, 3)),
    ...(env.sampleWeightsS ? { weightS: env.sampleWeightsS.map((w) => round(w, 3)) } : {}),
    sunlit: env.profile.map((p) => round(p.sunlit, 5)),
    ...(env.profile.some((p) => (p.parentSunlit ?? 1) < 1) ? { parentSunlit: env.profile.map((p) => round(p.parentSunlit ?? 1, 5)) } : {}),
    surfaces,
    total: { orbitAverageAbsorbedW: round(totalAverage), orbitAverageWithMarginW: round(totalAverage * factor), peakAbsorbedW: round(Math.max(...totalSeries)) },
  };
}

export interface DerivationInput {
  bodyId: AnyBodyId;
  orbit: OrbitInput;
  orbitEpoch: string;
  startDate: string;
  endDate: string;
  surfaces: CaseSurface[];
  margins: Margins;
  properties?: { hot?: PropertySet | undefined; cold?: PropertySet | undefined } | undefined;
  /** The user's own pairs (e.g. transcribed from NASA/TM-2001-211221) over the catalogue's. */
  environment?: { hot?: EnvironmentPair | undefined; cold?: EnvironmentPair | undefined } | undefined;
  steps?: number | undefined;
}

/** What made one surface hottest (or coldest), when that differs from the spacecraft's case. */
export interface SurfaceDriver {
  surface: string;
  date: string;
  betaDeg: number;
  orbitAverageAbsorbedW: number;
  sameAsCase: boolean;
  text: string;
}

export interface DerivedCase {
  kind: 'hot' | 'cold';
  conditions: CaseConditions;
  environmentSource: string;
  provisional: boolean;
  /** What the derivation decided; the rationale is built from it and the results (case-why.ts). */
  decision: CaseDecision;
  rationale: string[];
  surfaceDrivers: SurfaceDriver[];
  results: CaseResults;
}

export interface ScanSummary {
  startDate: string;
  endDate: string;
  days: number;
  candidates: number;
  betaMinDeg: number;
  betaMaxDeg: number;
  solarDistanceMinAu: number;
  solarDistanceMaxAu: number;
  spansFullYear: boolean;
}

export interface Derivation {
  hot: DerivedCase;
  cold: DerivedCase;
  scan: ScanSummary;
}

const SCAN_STEPS = 72;
/** Days of the scan evaluated again with the case's steps before one is chosen. */
const FINALISTS = 5;

interface Evaluated {
  day: ScanDay;
  env: EnvironmentResult;
  total: number;
  /** Set when the orbit is not the one from 12:00 UTC (the cold case in the planet's shadow). */
  orbitStart?: string;
}

interface DarkestDay {
  day: ScanDay;
  durationS: number;
  castBy: string[];
  startMs: number;
  /** The orbit centred on the shadow's middle, ISO 8601 UTC. */
  orbitStart: string;
}

/** The scan day with the longest shadow the planet takes part in, and the orbit centred on it; null for a planet's orbiter or none. */
function longestParentShadow(scan: readonly ScanDay[], input: DerivationInput): DarkestDay | null {
  const days = scan.filter((d) => d.parentShadow !== null);
  if (days.length === 0) return null;
  const day = maxBy(days, (d) => d.parentShadow!.durationS);
  const shadow = day.parentShadow!;
  const periodS = defineOrbit(input.orbit, getBody(input.bodyId)).periodS;
  // The orbit is centred on the planet's part of the shadow when that outlasts an orbit (dark
  // wherever the spacecraft is on it), else on the whole shadow.
  const middleMs = shadow.parentS >= periodS ? shadow.parentMiddleMs : shadow.startMs + (shadow.durationS * 1000) / 2;
  const startMs = middleMs - periodS * 500;
  return { day, durationS: shadow.durationS, castBy: shadow.castBy, startMs: shadow.startMs, orbitStart: new Date(Math.round(startMs)).toISOString() };
}

/** The hot and the cold case of a mission (DOMAIN.md "Cases"). */
export function deriveDesignCases(input: DerivationInput): Derivation {
  const body = getBody(input.bodyId);
  const orbit = defineOrbit(input.orbit, body);
  const scan = scanMission(body, orbit, new Date(input.orbitEpoch), input.startDate, input.endDate);
  const candidates = candidateDays(scan);
  const spanDays = Math.round((noonOf(input.endDate).getTime() - noonOf(input.startDate).getTime()) / DAY_MS) + 1;
  const spansFullYear = spanDays >= body.solarYearDays;
  const pairs = designPairs(body, orbit.inclinationRad / DEG);
  const summary: ScanSummary = {
    startDate: input.startDate, endDate: input.endDate, days: scan.length, candidates: candidates.length,
    betaMinDeg: round(Math.min(...scan.map((d) => d.betaDeg)), 3), betaMaxDeg: round(Math.max(...scan.map((d) => d.betaDeg)), 3),
    solarDistanceMinAu: round(Math.min(...scan.map((d) => d.solarDistanceAu)), 6),
    solarDistanceMaxAu: round(Math.max(...scan.map((d) => d.solarDistanceAu)), 6),
    spansFullYear,
  };
  const derive = (kind: 'hot' | 'cold'): DerivedCase =>
    deriveOne(kind, input, body, scan, candidates, spansFullYear, input.environment?.[kind] ?? pairs[kind]);
  return { hot: derive('hot'), cold: derive('cold'), scan: summary };
}

function deriveOne(
  kind: 'hot' | 'cold', input: DerivationInput, body: Body, scan: ScanDay[], candidates: ScanDay[], spansFullYear: boolean, pair: EnvironmentPair,
): DerivedCase {
  const hot = kind === 'hot';
  const sign = hot ? 1 : -1;
  const properties = input.properties?.[kind] ?? (hot ? 'eol' : 'bol');
  // Sun distance: the closest (hot) or farthest (cold) day of the mission, or the body's
  // perihelion/aphelion when the mission spans a whole orbit of the body about the Sun.
  const sunDay = maxBy(scan, (d) => -sign * d.solarDistanceAu);
  const range = solarDistanceRangeAu(body);
  const distanceAu = spansFullYear ? (hot ? range.min : range.max) : sunDay.solarDistanceAu;

  const sampling = orbitSampling(input.orbit);
  const base = (day: ScanDay, steps: number, albedo = pair.albedo): CaseConditions => ({
    bodyId: input.bodyId, orbit: input.orbit, orbitEpoch: input.orbitEpoch, date: day.date, betaDeg: day.betaDeg,
    solarDistanceAu: distanceAu, albedo, olrWm2: pair.olrWm2, properties,
    marginDirection: hot ? 'increase' : 'decrease', steps, surfaces: input.surfaces,
    ...(pair.surfaceField ? { surfaceField: pair.surfaceField } : {}),
    ...(sampling ? { sampling } : {}),
  });
  const evaluated: Evaluated[] = candidates.map((day) => {
    const env = environmentFor(base(day, SCAN_STEPS), SCAN_STEPS);
    return { day, env, total: totalOf(env) };
  });
  // About a moon, the cold case is the orbit amid the mission's longest shadow its planet takes part in.
  const darkest = hot ? null : longestParentShadow(scan, input);
  if (darkest) {
    const conditions = { ...base(darkest.day, SCAN_STEPS), orbitStart: darkest.orbitStart };
    const env = environmentFor(conditions, SCAN_STEPS);
    evaluated.push({ day: darkest.day, env, total: totalOf(env), orbitStart: darkest.orbitStart });
  }
  // Hot: the least eclipse (ties to the largest |beta|); cold: the longest eclipse (smallest |beta|).
  const eclipseExtreme = maxBy(evaluated, (e) => -sign * e.env.eclipseDurationS * 1e3 + sign * Math.abs(e.day.betaDeg) * 1e-3);
  // The scan's coarse orbit ranks the days; the best few and the eclipse extreme are evaluated as the
  // case is (its steps), and the case is the best of those, so its words never call a day the
  // largest (smallest) while quoting another that beats it. About a moon, the longest shadow decides.
  const steps = input.steps ?? 120;
  // About a moon the case's orbit starts amid the planet's shadow (conditions.orbitStart).
  const startingAt = (e: Evaluated, given: CaseConditions): CaseConditions => (e.orbitStart === undefined ? given : { ...given, orbitStart: e.orbitStart });
  const finalists = darkest ? [evaluated[evaluated.length - 1]!] : [...evaluated].sort((a, b) => sign * (b.total - a.total)).slice(0, FINALISTS);
  if (!finalists.includes(eclipseExtreme)) finalists.push(eclipseExtreme);
  const scored = finalists.map((e) => ({ e, results: evaluateCase(startingAt(e, base(e.day, steps)), input.margins) }));
  const best = darkest ? scored[0]! : maxBy(scored, (x) => sign * x.results.total.orbitAverageAbsorbedW);
  const chosen = best.e;
  // An airless body: the end of the albedo range that makes the chosen day hotter (or colder).
  const albedo = pair.albedoChoices
    ? maxBy(pair.albedoChoices, (a) => sign * totalOf(environmentFor(startingAt(chosen, base(chosen.day, SCAN_STEPS, a)), SCAN_STEPS)))
    : pair.albedo;
  const conditions = startingAt(chosen, base(chosen.day, steps, albedo));
  const results = albedo === pair.albedo ? best.results : evaluateCase(conditions, input.margins);
  const extremeScored = scored.find((x) => x.e === eclipseExtreme)!;
  const extremeResults = darkest !== null || chosen === eclipseExtreme || Math.abs(results.eclipseDurationS - extremeScored.results.eclipseDurationS) < 1 ? null : extremeScored.results;
  const field = pair.surfaceField;
  const decision: CaseDecision = {
    sun: { basis: spansFullYear ? (hot ? 'perihelion' : 'aphelion') : 'mission', date: sunDay.date, distanceAu: distanceAu },
    day: { date: chosen.day.date, betaDeg: round(chosen.day.betaDeg, 4) },
    eclipseExtreme: extremeResults
      ? { date: eclipseExtreme.day.date, betaDeg: extremeResults.betaDeg, eclipseDurationS: extremeResults.eclipseDurationS, orbitAverageAbsorbedW: extremeResults.total.orbitAverageAbsorbedW }
      : null,
    pair: {
      albedo, olrWm2: pair.olrWm2, source: pair.source,
      ...(field ? { surfaceField: { emissivity: field.emissivity, nightFloorK: field.nightFloorK, subsolarK: round(surfaceTemperatureK({ bondAlbedo: albedo, ...field }, solarFluxWm2(distanceAu), 1), 1), albedoRange: pair.albedoChoices !== undefined } } : {}),
    },
    ...(darkest ? { shadow: { durationS: round(darkest.durationS, 1), date: darkest.day.date, start: new Date(darkest.startMs).toISOString(), castBy: darkest.castBy.map((id) => getBody(id).name) } } : {}),
    properties,
  };
  const rationale = caseRationale({ kind, bodyName: body.name, conditions, results, margins: input.margins, decision });
  const surfaceDrivers = input.surfaces.map((s, i): SurfaceDriver => {
    const best = maxBy(evaluated, (e) => sign * e.env.orbitAverage.surfaces[i]!.absorbedW);
    const sameAsCase = best.day.date === chosen.day.date;
    // The case's own figures come from its results (the record), the other day's from the scan.
    const caseW = results.surfaces[i]!.orbitAverage.absorbedW;
    const w = sameAsCase ? caseW : best.env.orbitAverage.surfaces[i]!.absorbedW;
    const text = sameAsCase
      ? `${s.name}: ${hot ? 'hottest' : 'coldest'} in the spacecraft's case (beta ${fixed(best.day.betaDeg)} deg, ${fixed(w)} W orbit-average absorbed)`
      : `${s.name}: ${hot ? 'hottest' : 'coldest'} at beta ${fixed(best.day.betaDeg)} deg on ${best.day.date} (${fixed(w)} W orbit-average absorbed; the spacecraft's case gives it ${fixed(caseW)} W)`;
    return { surface: s.name, date: best.day.date, betaDeg: round(best.day.betaDeg, 3), orbitAverageAbsorbedW: round(w), sameAsCase, text };
  });
  return { kind, conditions, environmentSource: pair.source, provisional: pair.provisional, decision, rationale, surfaceDrivers, results };
}

/** The albedo, IR and sampling models a case's loads use, in words (cap-loads.ts chooses them as for the compute route). */
export function caseModelAssumptions(conditions: CaseConditions): string[] {
  const body = getBody(conditions.bodyId);
  const orbit = defineOrbit(conditions.orbit, body);
  const request = conditions.surfaceField
    ? { irModel: 'surface-temperature' as const, surfaceEmissivity: conditions.surfaceField.emissivity, nightFloorK: conditions.surfaceField.nightFloorK }
    : { irModel: 'uniform' as const, olrWm2: conditions.olrWm2 };
  const models = chooseCapModels(body, request, conditions.albedo, orbit.apoapsisAltitudeKm);
  const sampling = conditions.sampling === 'eccentric-anomaly'
    ? ['series sampled evenly in eccentric anomaly (dense at periapsis); averages weight each sample by its share of the period (weightS)']
    : ['series sampled evenly in time; the peaks of an eccentric orbit are searched between samples too'];
  return [...capAssumptions(models, solarFluxWm2(conditions.solarDistanceAu)), ...sampling];
}

const totalOf = (env: EnvironmentResult): number => env.orbitAverage.surfaces.reduce((s, l) => s + l.absorbedW, 0);

/** Eccentric orbits' series are sampled evenly in eccentric anomaly so the periapsis pass is in them. */
const orbitSampling = (orbit: OrbitInput): Sampling | undefined =>
  orbit.eccentricity !== undefined && orbit.eccentricity >= ECCENTRIC_SAMPLING_FROM ? 'eccentric-anomaly' : undefined;
