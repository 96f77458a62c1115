// The answer of POST /api/v1/environment/compute in the API's shape (API.md "Environment
// computation"): the physics of environment-columns.ts, its Float64Array columns turned into one
// object per sample and per surface, with the assumptions the answer carries.
// Leaves out: everything environment-columns.ts leaves out.
import { capAssumptions, type AlbedoModel, type IrModel } from './cap-loads';
import { surfaceTemperatureK, type SurfaceField } from './cap-radiance';
import type { Sampling } from './orbit-sampling';
import { computeEnvironmentColumns, type EnvironmentColumns, type EnvironmentRequest } from './environment-columns';
import type { SurfaceLoad } from './heat-loads';
import { profilePoints, surfaceLoads, type ProfilePoint } from './profile-loads';
import { degPerDay } from './kepler';

export { DEFAULT_STEPS, ECLIPSE_SCAN_STEPS, computeEnvironmentColumns, type EnvironmentColumns, type EnvironmentRequest } from './environment-columns';
export type { ProfilePoint } from './profile-loads';

export interface EnvironmentResult {
  bodyId: string;
  periodS: number;
  semiMajorAxisKm: number;
  eccentricity: number;
  periapsisAltitudeKm: number;
  apoapsisAltitudeKm: number;
  betaDeg: number;
  /** The beta the epoch implies, before any override; null without an epoch. */
  epochBetaDeg: number | null;
  /** The Sun's unit direction in the orbit's perifocal frame (x toward periapsis or, circular, the ascending node; z along the orbit normal). */
  sunDirection: { x: number; y: number; z: number };
  solarDistanceAu: number;
  solarFluxWm2: number;
  albedo: number;
  olrWm2: number;
  albedoModel: AlbedoModel;
  irModel: IrModel;
  /** Where the profile's samples fall: evenly in time (the default) or evenly in eccentric anomaly. */
  sampling: Sampling;
  /** The airless body's surface temperature field, null for a uniform OLR. */
  surfaceField: (SurfaceField & { subsolarK: number }) | null;
  /** Umbra plus half of penumbra, as a fraction of the period. */
  eclipseFraction: number;
  eclipseDurationS: number;
  umbraDurationS: number;
  penumbraDurationS: number;
  nodalRateDegPerDay: number;
  /** The planet a moon orbits, null for a planet. */
  parentBodyId: string | null;
  /** Time of this orbit in the planet's shadow (penumbra included), s: 0 for a planet or without an epoch. */
  parentShadowDurationS: number;
  /** Plain-words warnings: an orbit beyond the sphere of influence, across moons' orbits, inside a Roche limit. */
  warnings: string[];
  profile: (ProfilePoint & { parentSunlit?: number })[];
  /** Each profile sample's share of the period in seconds when sampled evenly in eccentric anomaly; null when evenly in time. */
  sampleWeightsS: number[] | null;
  orbitAverage: { surfaces: SurfaceLoad[] };
  peak: { surfaces: SurfaceLoad[] };
  assumptions: string[];
}

const ECLIPSE_ASSUMPTION = 'eclipseFraction counts umbra plus half of penumbra (conical shadow, Sun as a uniform disk, no atmosphere)';
const PARENT_SHADOW = "about a moon with an epoch, the planet's shadow is added (the moon placed by its published theory, the ephemeris Sun, the spacecraft at periapsis at the epoch); where both disks cover the Sun their covered shares add; albedo from the moon is not dimmed in the planet's shadow";
const SUN_FIXED = 'the Sun is held fixed over the orbit; tS counts from periapsis (from the ascending node for a circular orbit)';
const SAMPLING: Record<Sampling, string> = {
  time: 'profile samples evenly spaced in time; the peaks of an eccentric orbit are searched on a grid evenly spaced in eccentric anomaly, refined between the neighbours of each peak',
  'eccentric-anomaly': 'profile samples evenly spaced in eccentric anomaly (dense at periapsis); orbit averages weight each sample by its exact share of the period, (1 - e cos E) dE / n',
};
export const CAUTION = 'preliminary-design estimate from simplified models; verify with detailed analysis, a correlated model and thermal test';

/** The assumptions of an answer: the models it used, in words. */
export function environmentAssumptions(c: EnvironmentColumns): string[] {
  const used = [ECLIPSE_ASSUMPTION, ...(c.parentBodyId ? [PARENT_SHADOW] : []), ...capAssumptions(c.models, c.solarFluxWm2), ...c.pointing, SUN_FIXED, SAMPLING[c.sampling], CAUTION];
  return [...used, ...c.warnings.map((w) => `warning: ${w}`)];
}

/** Every field of the answer but the profile, in the answer's key order (environment-json.ts writes the same order). */
export function environmentHeader(c: EnvironmentColumns): Omit<EnvironmentResult, 'profile' | 'sampleWeightsS' | 'orbitAverage' | 'peak' | 'assumptions' | 'warnings'> {
  const { orbit, eclipse } = c;
  return {
    bodyId: c.bodyId,
    periodS: orbit.periodS,
    semiMajorAxisKm: orbit.semiMajorAxisKm,
    eccentricity: orbit.eccentricity,
    periapsisAltitudeKm: orbit.periapsisAltitudeKm,
    apoapsisAltitudeKm: orbit.apoapsisAltitudeKm,
    betaDeg: c.betaDeg,
    epochBetaDeg: c.epochBetaDeg,
    sunDirection: c.sunDirection,
    solarDistanceAu: c.solarDistanceAu,
    solarFluxWm2: c.solarFluxWm2,
    albedo: c.albedo,
    olrWm2: c.olrWm2,
    albedoModel: c.models.albedoModel,
    sampling: c.sampling,
    irModel: c.models.irModel,
    surfaceField: c.models.field ? { ...c.models.field, subsolarK: surfaceTemperatureK(c.models.field, c.solarFluxWm2, 1) } : null,
    eclipseFraction: eclipse.eclipseFraction,
    eclipseDurationS: eclipse.eclipseDurationS,
    umbraDurationS: eclipse.umbraS,
    penumbraDurationS: eclipse.penumbraS,
    nodalRateDegPerDay: degPerDay(orbit.nodalRateRadS),
    parentBodyId: c.parentBodyId,
    parentShadowDurationS: c.parentShadowS,
  };
}

/** The columns as the API's answer object. */
export function environmentResult(c: EnvironmentColumns): EnvironmentResult {
  const names = c.loads.names;
  return {
    ...environmentHeader(c),
    warnings: c.warnings,
    profile: withParentSunlit(profilePoints(c.loads, c.grid.tS, c.grid.trueAnomalyRad, c.shade.sunlit), c.parentSunlit),
    sampleWeightsS: c.weightS ? [...c.weightS] : null,
    orbitAverage: { surfaces: surfaceLoads(names, c.averages) },
    peak: { surfaces: surfaceLoads(names, c.loads.peaks) },
    assumptions: environmentAssumptions(c),
  };
}

/** About a moon, each point also says how much of the Sun its planet leaves (its `sunlit` already counts it). */
const withParentSunlit = (points: ProfilePoint[], parentSunlit: Float64Array | null): EnvironmentResult['profile'] =>
  parentSunlit ? points.map((p, k) => ({ ...p, parentSunlit: parentSunlit[k] })) : points;

/** Everything the compute route answers, from its request. Throws PhysicsError for the physically impossible. */
export function computeEnvironment(request: EnvironmentRequest): EnvironmentResult {
  return environmentResult(computeEnvironmentColumns(request));
}
