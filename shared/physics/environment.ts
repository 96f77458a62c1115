// The environment computation of POST /api/v1/environment/compute, end to end: orbit, Sun, beta,
// shadow, and the heat loads on each surface sampled evenly in time over one orbit.
// Leaves out: everything the modules it calls leave out; the Sun is held fixed for the one orbit
// computed. Source: API.md "Environment computation" for the contract.
import { getBody, type BodyId } from './bodies';
import { betaFromVectorsRad } from './beta-angle';
import type { Surface, SurfaceLoad } from './heat-loads';
import { defineOrbit, type OrbitInput } from './orbit-definition';
import { eclipseFromShade, eclipseOnGrid, gridShade, orbitGrid, shadeGrid, type PerifocalSun } from './orbit-grid';
import { orbitBasis } from './orbit-position';
import { profileLoads } from './profile-loads';
import { prepareSurfaces } from './surface-grid';
import { AU_KM } from './constants';
import { PhysicsError } from './physics-error';
import { solarFluxWm2, sunFromBody } from './sun';
import { DEG, dot, norm, scale, subtract, type Vector3 } from './vector3';

export interface EnvironmentRequest {
  bodyId: BodyId | string;
  orbit: OrbitInput;
  /** ISO 8601 UTC; sets the Sun's direction and distance. Optional when betaDeg is given. */
  epoch?: string;
  betaDeg?: number;
  solarDistanceAu?: number;
  albedo?: number;
  olrWm2?: number;
  steps?: number;
  surfaces: Surface[];
}

export interface ProfilePoint {
  tS: number;
  trueAnomalyDeg: number;
  sunlit: number;
  surfaces: SurfaceLoad[];
}

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
  profile: ProfilePoint[];
  orbitAverage: { surfaces: SurfaceLoad[] };
  peak: { surfaces: SurfaceLoad[] };
  assumptions: string[];
}

export const DEFAULT_STEPS = 360;
/** Samples of the shadow scan over one orbit (each crossing is then refined by bisection). */
export const ECLIPSE_SCAN_STEPS = 2048;

const ASSUMPTIONS = [
  'eclipseFraction counts umbra plus half of penumbra (conical shadow, Sun as a uniform disk, no atmosphere)',
  'albedo load = S * albedo * F * cos(solar zenith at the sub-spacecraft point) on the sunlit side: a common engineering approximation',
  'planetary IR = OLR * F, with F the plate-to-sphere view factor (Howell catalogue)',
  'the Sun is held fixed over the orbit; tS counts from periapsis (from the ascending node for a circular orbit)',
  'preliminary-design estimate from simplified models; verify with detailed analysis, a correlated model and thermal test',
];

/** Turn the Sun direction about the orbit so its elevation above the plane is betaRad, keeping its azimuth in the plane. */
function sunWithBeta(sun: Vector3 | null, orbitNormal: Vector3, nodeDirection: Vector3, betaRad: number): Vector3 {
  let inPlane = sun ? subtract(sun, scale(orbitNormal, dot(sun, orbitNormal))) : nodeDirection;
  // Without an epoch, or with the Sun on the orbit normal, the Sun's azimuth is put at the ascending node.
  if (norm(inPlane) < 1e-9) inPlane = nodeDirection;
  const u = scale(inPlane, 1 / norm(inPlane));
  return [
    u[0] * Math.cos(betaRad) + orbitNormal[0] * Math.sin(betaRad),
    u[1] * Math.cos(betaRad) + orbitNormal[1] * Math.sin(betaRad),
    u[2] * Math.cos(betaRad) + orbitNormal[2] * Math.sin(betaRad),
  ];
}

function parseEpoch(epoch: string): Date {
  const date = new Date(epoch);
  if (!Number.isFinite(date.getTime())) {
    throw new PhysicsError('missing_sun_geometry', `"${epoch}" is not an ISO 8601 date and time`, [{ path: 'epoch', message: `not a date: "${epoch}"` }]);
  }
  return date;
}

/** Everything the compute route answers, from its request. Throws PhysicsError for the physically impossible. */
export function computeEnvironment(request: EnvironmentRequest): EnvironmentResult {
  const body = getBody(request.bodyId);
  const orbit = defineOrbit(request.orbit, body);
  const steps = request.steps ?? DEFAULT_STEPS;
  if (!Number.isInteger(steps) || steps < 12 || steps > 100000) {
    throw new RangeError(`steps must be an integer from 12 to 100000, got ${steps}`);
  }
  const basis = orbitBasis(orbit.inclinationRad, orbit.raanRad, orbit.argPeriapsisRad);
  const node = orbitBasis(orbit.inclinationRad, orbit.raanRad, 0).p;

  if (request.epoch === undefined && request.betaDeg === undefined) {
    const message = 'give an epoch (it sets the Sun) or a betaDeg';
    throw new PhysicsError('missing_sun_geometry', message, [{ path: 'epoch', message }]);
  }
  const sunAtEpoch = request.epoch === undefined ? null : sunFromBody(body, parseEpoch(request.epoch));
  const epochBetaRad = sunAtEpoch ? betaFromVectorsRad(basis.w, sunAtEpoch.direction) : null;
  const sunDirection = request.betaDeg === undefined && sunAtEpoch
    ? sunAtEpoch.direction
    : sunWithBeta(sunAtEpoch?.direction ?? null, basis.w, node, (request.betaDeg ?? 0) * DEG);
  const solarDistanceAu = request.solarDistanceAu ?? sunAtEpoch?.distanceAu ?? body.semiMajorAxisAu;
  const solarFlux = solarFluxWm2(solarDistanceAu);
  const sunDistanceKm = solarDistanceAu * AU_KM;
  const albedo = request.albedo ?? body.albedo.nominal;
  const olrWm2 = request.olrWm2 ?? body.olrWm2.nominal;

  const grid = orbitGrid(orbit, body.radiusKm, steps);
  const sun: PerifocalSun = {
    sp: dot(sunDirection, basis.p), sq: dot(sunDirection, basis.q), sw: dot(sunDirection, basis.w), distanceKm: sunDistanceKm,
  };
  const prepared = prepareSurfaces(request.surfaces, grid, body.radiusKm);
  const shade = gridShade(steps);
  shadeGrid(grid, sun, shade);
  const profile = profileLoads(prepared, grid, shade, sun.sw, body.radiusKm, solarFlux, albedo, olrWm2);
  const { sums, peaks } = profile;
  // The shadow scan needs a fine grid even when few load steps are asked for.
  const eclipse = steps >= ECLIPSE_SCAN_STEPS
    ? eclipseFromShade(orbit, grid, shade, sun, body.radiusKm)
    : eclipseOnGrid(orbit, orbitGrid(orbit, body.radiusKm, ECLIPSE_SCAN_STEPS), sun, body.radiusKm);
  const average = (l: SurfaceLoad): SurfaceLoad => ({
    name: l.name, solarWm2: l.solarWm2 / steps, albedoWm2: l.albedoWm2 / steps, irWm2: l.irWm2 / steps, absorbedW: l.absorbedW / steps,
  });
  const points = profile.points;

  return {
    bodyId: body.id,
    periodS: orbit.periodS,
    semiMajorAxisKm: orbit.semiMajorAxisKm,
    eccentricity: orbit.eccentricity,
    periapsisAltitudeKm: orbit.periapsisAltitudeKm,
    apoapsisAltitudeKm: orbit.apoapsisAltitudeKm,
    betaDeg: betaFromVectorsRad(basis.w, sunDirection) / DEG,
    epochBetaDeg: epochBetaRad === null ? null : epochBetaRad / DEG,
    solarDistanceAu,
    solarFluxWm2: solarFlux,
    albedo,
    olrWm2,
    eclipseFraction: eclipse.eclipseFraction,
    eclipseDurationS: eclipse.eclipseDurationS,
    umbraDurationS: eclipse.umbraS,
    penumbraDurationS: eclipse.penumbraS,
    nodalRateDegPerDay: (orbit.nodalRateRadS / DEG) * 86400,
    profile: points,
    orbitAverage: { surfaces: sums.map(average) },
    peak: { surfaces: peaks },
    assumptions: ASSUMPTIONS,
  };
}
