// A load case along a trajectory (an uploaded ephemeris) rather than a Keplerian orbit: its results
// from the loads at every row of a window (trajectory-environment.ts), the margin columns for other
// margins, and the osculating orbit the case records. Rounded as design-cases.ts rounds stored results.
// Leaves out: what trajectory-environment.ts leaves out. Sources: the load definitions of API.md;
// the heat-load margin per MIL-STD-1540 (design-environment.ts); Kepler's third law (kepler.ts).
import type { Body } from './bodies';
import { capAssumptions } from './cap-loads';
import type { CaseResults, CaseSurface, CaseSurfaceResult, LoadSummary } from './design-cases';
import { heatLoadFactor, opticalProperties, type MarginDirection, type Margins, type PropertySet } from './design-environment';
import type { SurfaceLoad } from './heat-loads';
import { periodS } from './kepler';
import { round } from './rounding';
import type { StateElements } from './state-elements';
import type { TrajectoryEnvironment } from './trajectory-environment';

/** The case's assumptions, with the albedo and IR models the window was computed with (cap-loads.ts says them). */
export const trajectoryCaseAssumptions = (env: TrajectoryEnvironment): string[] => [
  'loads at every row of the ephemeris inside the window: the Sun from each row\'s epoch (VSOP87, interpolated between hourly evaluations), conical shadow of the central body, no atmosphere',
  ...capAssumptions(env.models, env.meanSolarFluxWm2),
  'surfaces are flat plates fixed in the local orbital frame from r and v (x ram, y orbit normal, z zenith) or pointed at the Sun; no shadowing between them',
  '"orbit average" values are time-weighted (trapezoidal) over the whole window, every row; peaks over every row; the stored series keeps `steps` rows evenly spaced in time (the first row at or after each step), whatever the file\'s own spacing',
  'tS counts from the first row of the window and periodS is the window\'s length: a thermal model run on this case repeats the window as if it were periodic',
  'eclipseFraction counts umbra plus half of penumbra over the window',
];

/** Eclipse time of a window, s: umbra plus half of penumbra, as the Keplerian cases count it. */
export const trajectoryEclipseS = (env: Pick<TrajectoryEnvironment, 'umbraS' | 'penumbraS'>): number => env.umbraS + env.penumbraS / 2;

/**
 * A case's results from the loads along a window: `env` computed for `surfaces` with the optical
 * properties of `properties`; `startMs` is the window's first row (tS counts from it).
 */
export function trajectoryCaseResults(
  env: TrajectoryEnvironment, surfaces: readonly CaseSurface[], properties: PropertySet, margins: Margins, direction: MarginDirection, startMs: number,
): CaseResults {
  const factor = heatLoadFactor(margins.heatLoadPercent, direction);
  const results = surfaces.map((s, i): CaseSurfaceResult => {
    const { absorptivity, emissivity } = opticalProperties(s.material, properties);
    const watts = (load: Pick<SurfaceLoad, 'solarWm2' | 'albedoWm2' | 'irWm2' | 'absorbedW'>): LoadSummary => ({
      solarWm2: round(load.solarWm2), albedoWm2: round(load.albedoWm2), irWm2: round(load.irWm2),
      solarW: round(s.areaM2 * absorptivity * load.solarWm2), albedoW: round(s.areaM2 * absorptivity * load.albedoWm2), irW: round(s.areaM2 * emissivity * load.irWm2),
      absorbedW: round(load.absorbedW),
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
  const totalAverage = results.reduce((sum, s) => sum + s.orbitAverage.absorbedW, 0);
  const eclipseS = trajectoryEclipseS(env);
  return {
    periodS: round(env.spanS, 3),
    betaDeg: round(env.meanBetaDeg, 4),
    solarFluxWm2: round(env.meanSolarFluxWm2, 3),
    eclipseFraction: round(eclipseS / env.spanS, 5),
    eclipseDurationS: round(eclipseS, 1),
    umbraDurationS: round(env.umbraS, 1),
    penumbraDurationS: round(env.penumbraS, 1),
    tS: env.points.map((p) => round((p.tMs - startMs) / 1000, 3)),
    sunlit: env.points.map((p) => round(p.sunlit, 5)),
    // about a moon, the planet's shadow where it falls on the window (as a derived case keeps it)
    ...(env.points.some((p) => (p.parentSunlit ?? 1) < 1) ? { parentSunlit: env.points.map((p) => round(p.parentSunlit ?? 1, 5)) } : {}),
    surfaces: results,
    total: { orbitAverageAbsorbedW: round(totalAverage), orbitAverageWithMarginW: round(totalAverage * factor), peakAbsorbedW: round(env.peakTotalAbsorbedW) },
  };
}

interface MarginColumns {
  surfaces: { orbitAverage: { absorbedW: number; absorbedWithMarginW: number } }[];
  total: { orbitAverageAbsorbedW: number; orbitAverageWithMarginW: number };
}

/** The margin columns of stored results for other margins (the loads themselves do not change). */
export function withMargins<R extends MarginColumns>(results: R, margins: Pick<Margins, 'heatLoadPercent'>, direction: MarginDirection): R {
  const factor = heatLoadFactor(margins.heatLoadPercent, direction);
  return {
    ...results,
    surfaces: results.surfaces.map((s) => ({ ...s, orbitAverage: { ...s.orbitAverage, absorbedWithMarginW: round(s.orbitAverage.absorbedW * factor) } })),
    total: { ...results.total, orbitAverageWithMarginW: round(results.total.orbitAverageAbsorbedW * factor) },
  };
}

/** The orbit a case records for osculating elements: apsides above the body's surface, the period by Kepler's third law. */
export function osculatingOrbit(el: StateElements, body: Pick<Body, 'radiusKm' | 'gmKm3S2'>) {
  return {
    periapsisAltitudeKm: el.semiMajorAxisKm * (1 - el.eccentricity) - body.radiusKm,
    apoapsisAltitudeKm: el.semiMajorAxisKm * (1 + el.eccentricity) - body.radiusKm,
    semiMajorAxisKm: el.semiMajorAxisKm,
    eccentricity: el.eccentricity,
    periodS: periodS(el.semiMajorAxisKm, body.gmKm3S2),
    inclinationDeg: el.inclinationDeg,
    raanDeg: el.raanDeg,
    argPeriapsisDeg: el.argPeriapsisDeg,
  };
}
