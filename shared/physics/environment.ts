// The answer of POST /api/v1/environment/compute in the API's shape (API.md "Environment
// computation"): the physics of environment-columns.ts, its Float64Array columns turned into one
// object per sample and per surface, with the assumptions the answer carries.
// Leaves out: everything environment-columns.ts leaves out.
import { computeEnvironmentColumns, type EnvironmentColumns, type EnvironmentRequest } from './environment-columns';
import type { SurfaceLoad } from './heat-loads';
import { profilePoints, surfaceLoads, type ProfilePoint } from './profile-loads';
import { DEG } from './vector3';

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
  solarDistanceAu: number;
  solarFluxWm2: number;
  albedo: number;
  olrWm2: number;
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
  orbitAverage: { surfaces: SurfaceLoad[] };
  peak: { surfaces: SurfaceLoad[] };
  assumptions: string[];
}

export const ASSUMPTIONS = [
  'eclipseFraction counts umbra plus half of penumbra (conical shadow, Sun as a uniform disk, no atmosphere)',
  "about a moon with an epoch, the planet's shadow is added (the moon placed by its published theory, the ephemeris Sun, the spacecraft at periapsis at the epoch); where both disks cover the Sun their covered shares add; albedo from the moon is not dimmed in the planet's shadow",
  'albedo load = S * albedo * F * cos(solar zenith at the sub-spacecraft point) on the sunlit side: a common engineering approximation',
  'planetary IR = OLR * F, with F the plate-to-sphere view factor (Howell catalogue)',
  'the Sun is held fixed over the orbit; tS counts from periapsis (from the ascending node for a circular orbit)',
  'preliminary-design estimate from simplified models; verify with detailed analysis, a correlated model and thermal test',
];

/** Every field of the answer but the profile, in the answer's key order (environment-json.ts writes the same order). */
export function environmentHeader(c: EnvironmentColumns): Omit<EnvironmentResult, 'profile' | 'orbitAverage' | 'peak' | 'assumptions' | 'warnings'> {
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
    solarDistanceAu: c.solarDistanceAu,
    solarFluxWm2: c.solarFluxWm2,
    albedo: c.albedo,
    olrWm2: c.olrWm2,
    eclipseFraction: eclipse.eclipseFraction,
    eclipseDurationS: eclipse.eclipseDurationS,
    umbraDurationS: eclipse.umbraS,
    penumbraDurationS: eclipse.penumbraS,
    nodalRateDegPerDay: (orbit.nodalRateRadS / DEG) * 86400,
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
    orbitAverage: { surfaces: surfaceLoads(names, c.averages) },
    peak: { surfaces: surfaceLoads(names, c.loads.peaks) },
    assumptions: environmentAssumptions(c),
  };
}

/** The answer's assumptions: the fixed list, then the orbit's warnings. */
export function environmentAssumptions(c: EnvironmentColumns): string[] {
  return c.warnings.length > 0 ? [...ASSUMPTIONS, ...c.warnings.map((w) => `warning: ${w}`)] : ASSUMPTIONS;
}

/** About a moon, each point also says how much of the Sun its planet leaves (its `sunlit` already counts it). */
const withParentSunlit = (points: ProfilePoint[], parentSunlit: Float64Array | null): EnvironmentResult['profile'] =>
  parentSunlit ? points.map((p, k) => ({ ...p, parentSunlit: parentSunlit[k] })) : points;

/** Everything the compute route answers, from its request. Throws PhysicsError for the physically impossible. */
export function computeEnvironment(request: EnvironmentRequest): EnvironmentResult {
  return environmentResult(computeEnvironmentColumns(request));
}
