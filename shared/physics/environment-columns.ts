// The physics of POST /api/v1/environment/compute in columns: orbit, Sun, beta, shadow, and the heat
// loads on each surface sampled evenly in time over one orbit, as Float64Arrays (profile-loads.ts),
// with the orbit averages, peaks and eclipse. environment.ts shapes this into the API's answer; the
// benchmark times this part against the numpy reference, which computes the same quantities.
// Leaves out: everything the modules it calls leave out; the Sun is held fixed for the one orbit
// computed. Surfaces take every pointing form of pointing.ts. About a moon with an epoch, the planet's shadow (parent-shadow.ts) darkens the samples
// it covers and the eclipse is counted from both bodies. Source: API.md "Environment computation".
import { getBody, type AnyBodyId } from './bodies';
import { betaFromVectorsRad } from './beta-angle';
import { capColumns, chooseCapModels, reportedOlrWm2, type AlbedoModel, type CapModelChoice, type IrModel } from './cap-loads';
import { AU_KM } from './constants';
import type { EclipseSummary } from './eclipse';
import type { Surface } from './heat-loads';
import { defineOrbit, type Orbit, type OrbitInput } from './orbit-definition';
import { eclipseFromShade, eclipseOnGrid, gridShade, orbitGrid, orbitGridAt, shadeGrid, type GridShade, type OrbitGrid, type PerifocalSun } from './orbit-grid';
import { eccentricAnomalyTimes, refinedPeaks, weightedAverages, type Sampling } from './orbit-sampling';
import { orbitBasis } from './orbit-position';
import { PhysicsError } from './physics-error';
import { profileColumns, type LoadTotals, type ProfileColumns } from './profile-loads';
import { solarFluxWm2, sunFromBody } from './sun';
import { orbitWarnings } from './orbit-warnings';
import { combinedSunlit, parentShadow, type ParentShadow } from './parent-shadow';
import { prepareSurfaces } from './surface-grid';
import { j2000ToPerifocal } from './pointing';
import { pointingAssumptions } from './pointing-words';
import { DEG, dot, norm, scale, subtract, type Vector3 } from './vector3';

export interface EnvironmentRequest {
  bodyId: AnyBodyId | string;
  orbit: OrbitInput;
  /** ISO 8601 UTC; sets the Sun's direction and distance. Optional when betaDeg is given. */
  epoch?: string;
  betaDeg?: number;
  solarDistanceAu?: number;
  albedo?: number;
  olrWm2?: number;
  steps?: number;
  surfaces: Surface[];
  /** Albedo as the Lambertian integral over the cap or the engineering S a F cos(theta); default in cap-loads.ts. */
  albedoModel?: AlbedoModel | undefined;
  /** An airless body's surface temperature field or a uniform OLR; default by body (cap-loads.ts). */
  irModel?: IrModel | undefined;
  /** The airless field's emissivity and night floor, over the body's nominal values. */
  surfaceEmissivity?: number | undefined;
  nightFloorK?: number | undefined;
  /** Profile samples evenly in time (the default, API.md) or evenly in eccentric anomaly with time weights. */
  sampling?: Sampling | undefined;
}

export interface EnvironmentColumns {
  bodyId: string;
  orbit: Orbit;
  betaDeg: number;
  /** The beta the epoch implies, before any override; null without an epoch. */
  epochBetaDeg: number | null;
  /** The Sun's unit direction in the orbit's perifocal frame: x toward periapsis (the ascending node for a circular orbit, as tS counts), z along the orbit normal. */
  sunDirection: { x: number; y: number; z: number };
  solarDistanceAu: number;
  solarFluxWm2: number;
  albedo: number;
  /** The uniform OLR, or the whole-body mean exitance of an airless body's field. */
  olrWm2: number;
  /** The albedo and IR models used. */
  models: CapModelChoice;
  eclipse: EclipseSummary;
  sampling: Sampling;
  /** tS, true anomaly and radius at each sample. */
  grid: OrbitGrid;
  /** Each sample's share of the period in seconds; null when evenly spaced in time. */
  weightS: Float64Array | null;
  /** The Sun's share (sunlit) and direction at each sample. */
  shade: GridShade;
  /** Incident fluxes and absorbed power per surface per sample, their orbit sums and peaks. */
  loads: ProfileColumns;
  /** Orbit averages per surface (the sums over the steps). */
  averages: LoadTotals;
  /** About a moon with an epoch: the share of the Sun seen past the planet at each sample (already in shade.sunlit), else null. */
  parentSunlit: Float64Array | null;
  /** The planet a moon orbits, null for a planet. */
  parentBodyId: string | null;
  /** Time of this orbit in the planet's shadow (penumbra included), s; 0 without an epoch or for a planet. */
  parentShadowS: number;
  /** Plain-words warnings about the orbit (orbit-warnings.ts). */
  warnings: string[];
  /** The assumptions of the pointing forms the surfaces use (pointing-words.ts). */
  pointing: string[];
}

export const DEFAULT_STEPS = 360;
/** Samples of the shadow scan over one orbit (each crossing is then refined by bisection). */
export const ECLIPSE_SCAN_STEPS = 2048;

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

const averaged = (sums: LoadTotals, steps: number): LoadTotals => ({
  solarWm2: sums.solarWm2.map((v) => v / steps), albedoWm2: sums.albedoWm2.map((v) => v / steps),
  irWm2: sums.irWm2.map((v) => v / steps), absorbedW: sums.absorbedW.map((v) => v / steps),
});

/** The compute route's physics, from its request. Throws PhysicsError for the physically impossible. */
export function computeEnvironmentColumns(request: EnvironmentRequest): EnvironmentColumns {
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
  const albedo = request.albedo ?? body.albedo.nominal;
  const olrWm2 = request.olrWm2 ?? body.olrWm2.nominal;
  const models = chooseCapModels(body, request, albedo, orbit.apoapsisAltitudeKm);

  const sampling = request.sampling ?? 'time';
  const onE = sampling === 'eccentric-anomaly' ? eccentricAnomalyTimes(orbit, steps) : null;
  const grid = onE ? orbitGridAt(orbit, body.radiusKm, onE.times) : orbitGrid(orbit, body.radiusKm, steps);
  const sun: PerifocalSun = {
    sp: dot(sunDirection, basis.p), sq: dot(sunDirection, basis.q), sw: dot(sunDirection, basis.w), distanceKm: solarDistanceAu * AU_KM,
  };
  // About a moon, the planet's shadow at the epoch's orbit (the ephemeris Sun, whatever beta is asked).
  const epochMs = request.epoch === undefined ? null : parseEpoch(request.epoch).getTime();
  const planetShadow = epochMs === null ? null : parentShadow(body, orbit, epochMs);
  const parentOn = (g: OrbitGrid): Float64Array | null => (planetShadow && epochMs !== null ? parentSunlitOnGrid(planetShadow, g, epochMs) : null);
  // An inertial pointing's direction, body equatorial J2000, in this orbit's perifocal frame (pointing.ts).
  const toOrbit = j2000ToPerifocal(body, basis, request.epoch === undefined ? null : parseEpoch(request.epoch));
  const loadsOn = (g: OrbitGrid, shade: GridShade, parent = parentOn(g)): ProfileColumns => {
    shadeGrid(g, sun, shade);
    if (parent) for (let k = 0; k < g.steps; k++) shade.sunlit[k] = combinedSunlit(shade.sunlit[k], parent[k]);
    const prepared = prepareSurfaces(request.surfaces, g, body.radiusKm, toOrbit);
    const cap = capColumns(models, prepared, g, shade, sun.sw, body.radiusKm, solarFlux, albedo);
    return profileColumns(prepared, g, shade, sun.sw, body.radiusKm, solarFlux, albedo, olrWm2, cap);
  };
  const shade = gridShade(steps);
  const parentSunlit = parentOn(grid);
  const loads = loadsOn(grid, shade, parentSunlit);
  // An eccentric orbit's peaks are searched where its periapsis pass is resolved (orbit-sampling.ts).
  loads.peaks = refinedPeaks(orbit, steps, loads.peaks, (times) => loadsOn(orbitGridAt(orbit, body.radiusKm, times), gridShade(times.length)), onE ? loads : null);
  // The shadow scan needs a fine grid, evenly in time, even when few load steps are asked for.
  const scanGrid = !onE && steps >= ECLIPSE_SCAN_STEPS ? grid : orbitGrid(orbit, body.radiusKm, ECLIPSE_SCAN_STEPS);
  let eclipse = scanGrid === grid ? eclipseFromShade(orbit, grid, shade, sun, body.radiusKm) : eclipseOnGrid(orbit, scanGrid, sun, body.radiusKm);
  let parentShadowS = 0;
  if (planetShadow && parentSunlit && epochMs !== null && parentSunlit.some((f) => f < 1)) {
    // The planet's shadow touches this orbit: the eclipse is counted on the scan grid from both bodies' shade.
    const both = combinedEclipseOnGrid(planetShadow, orbit, scanGrid, sun, body.radiusKm, epochMs);
    eclipse = both.eclipse;
    parentShadowS = both.parentShadowS;
  }
  return {
    bodyId: body.id, orbit,
    betaDeg: betaFromVectorsRad(basis.w, sunDirection) / DEG,
    epochBetaDeg: epochBetaRad === null ? null : epochBetaRad / DEG,
    sunDirection: { x: sun.sp, y: sun.sq, z: sun.sw },
    solarDistanceAu, solarFluxWm2: solarFlux, albedo, olrWm2: reportedOlrWm2(models, solarFlux, olrWm2), models, eclipse,
    sampling, grid, weightS: onE?.weightS ?? null, shade, loads,
    averages: onE ? weightedAverages(loads, onE.weightS, orbit.periodS) : averaged(loads.sums, steps),
    parentSunlit, parentBodyId: body.parentId, parentShadowS, warnings: orbitWarnings(body, orbit),
    pointing: pointingAssumptions(request.surfaces.map((s) => s.normal)),
  };
}

/** The planet's share of the Sun at each sample of the grid, the orbit starting at the epoch. */
function parentSunlitOnGrid(planetShadow: ParentShadow, grid: OrbitGrid, epochMs: number): Float64Array {
  const out = new Float64Array(grid.steps);
  for (let k = 0; k < grid.steps; k++) out[k] = planetShadow.at(epochMs + grid.tS[k] * 1000).parent;
  return out;
}

/** Umbra, penumbra and eclipse of one orbit in both bodies' shadows, counted on the grid's samples (each worth T / steps). */
function combinedEclipseOnGrid(
  planetShadow: ParentShadow, orbit: Orbit, grid: OrbitGrid, sun: PerifocalSun, bodyRadiusKm: number, epochMs: number,
): { eclipse: EclipseSummary; parentShadowS: number } {
  const shade: GridShade = gridShade(grid.steps);
  shadeGrid(grid, sun, shade);
  const dt = orbit.periodS / grid.steps;
  let [umbraS, penumbraS, parentShadowS] = [0, 0, 0];
  for (let k = 0; k < grid.steps; k++) {
    const parent = planetShadow.at(epochMs + grid.tS[k] * 1000).parent;
    const sunlit = combinedSunlit(shade.sunlit[k], parent);
    if (sunlit <= 0) umbraS += dt;
    else if (sunlit < 1) penumbraS += dt;
    if (parent < 1) parentShadowS += dt;
  }
  const eclipseDurationS = umbraS + penumbraS / 2;
  return { eclipse: { eclipseFraction: eclipseDurationS / orbit.periodS, eclipseDurationS, umbraS, penumbraS }, parentShadowS };
}
