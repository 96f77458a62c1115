// A mission's environment date by date: for each date the beta angle, the Sun's distance and flux,
// the eclipse (conical shadow) and the orbit-average loads on each surface, with the node and the
// periapsis drifting under J2 and the Sun moving along the body's orbit. One orbit is computed per
// date with the Sun held fixed over it, as POST /environment/compute does.
// Leaves out: everything computeEnvironment leaves out; drag and other perturbations that change
// the orbit's size or inclination; the Sun's motion within one orbit. Sources: Vallado ch. 9 (J2
// secular rates); the models of environment.ts; the Sun from VSOP87 through sun-track.ts.
import { getBody, type BodyId } from './bodies';
import type { EclipseSummary } from './eclipse';
import type { Surface, SurfaceLoad } from './heat-loads';
import { defineOrbit, type OrbitInput } from './orbit-definition';
import {
  eclipseFromShade, eclipseOnGrid, gridShade, orbitGrid, shadeGrid, type GridShade, type OrbitGrid,
} from './orbit-grid';
import { longestShadow, missionDays } from './mission-days';
import { PhysicsError } from './physics-error';
import { solarFluxWm2 } from './sun';
import { prepareSurfaces, type PreparedSurface } from './surface-grid';
import { DEG } from './vector3';
import { plateToSphereViewFactor } from './view-factors';

export interface MissionSweepRequest {
  bodyId: BodyId | string;
  /** The compute route's orbit object; RAAN and argument of periapsis hold at orbitEpoch. */
  orbit: OrbitInput;
  /** The first date of the sweep (ISO 8601 UTC or a Date). */
  epochStart: string | Date;
  /** When the orbit's angles are given; the first date when left out. */
  orbitEpoch?: string | Date;
  /** Length of the sweep in days; rows at 0, stepDays, 2 stepDays, ... up to days. */
  days: number;
  /** Days between rows, default 1. */
  stepDays?: number;
  /** Samples over each orbit for the loads, default 360. */
  steps?: number;
  surfaces?: readonly Surface[];
  /** Override the body's nominal albedo and OLR. */
  albedo?: number;
  olrWm2?: number;
}

export interface MissionSweepRow {
  date: string;
  betaDeg: number;
  raanDeg: number;
  solarDistanceAu: number;
  solarFluxWm2: number;
  /** Umbra plus half of penumbra, as a fraction of the period. */
  eclipseFraction: number;
  eclipseDurationS: number;
  umbraDurationS: number;
  penumbraDurationS: number;
  /** Orbit-average incident fluxes and absorbed power per surface. */
  surfaces: SurfaceLoad[];
  /**
   * The longest continuous shadow of the row's day (the stepDays centred on the row), penumbra
   * included, s: the body's own over one orbit, or - about a moon - a passage through its planet's
   * shadow with the moon's own shadows that join on. 0 without shadow.
   */
  longestShadowS: number;
  /** Which bodies cast it ('europa', 'jupiter', or both); empty without shadow. */
  longestShadowCastBy: BodyId[];
  /** When it starts (ISO 8601 UTC) for a shadow the planet takes part in; null for the body's own. */
  longestShadowStart: string | null;
}

export interface MissionSweepResult {
  bodyId: BodyId;
  periodS: number;
  nodalRateDegPerDay: number;
  apsidalRateDegPerDay: number;
  rows: MissionSweepRow[];
  minBetaDeg: number;
  maxBetaDeg: number;
}

/** The most rows one sweep may produce (the routes answer 400 beyond it). */
export const MAX_SWEEP_ROWS = 20000;
export const DEFAULT_SWEEP_STEPS = 360;
/** The shadow scan grid of a sweep: finer load grids are used as they are. */
const SWEEP_SCAN_STEPS = 360;
const DAY_MS = 86400e3;

function toMs(value: string | Date, path: string): number {
  const ms = (value instanceof Date ? value : new Date(value)).getTime();
  if (!Number.isFinite(ms)) throw new PhysicsError('missing_sun_geometry', `${path} is not a date: ${String(value)}`, [{ path, message: 'not a date' }]);
  return ms;
}

/** Number of rows for a span and step, without building them. */
export const sweepRowCount = (days: number, stepDays: number): number => Math.floor(days / stepDays + 1e-9) + 1;

const wrapDeg = (rad: number): number => {
  const deg = (rad / DEG) % 360;
  return deg < 0 ? deg + 360 : deg;
};

/** The environment at each date of a mission, one orbit per row. Throws PhysicsError for the impossible. */
export function sweepMission(request: MissionSweepRequest): MissionSweepResult {
  const body = getBody(request.bodyId);
  const orbit = defineOrbit(request.orbit, body);
  const stepDays = request.stepDays ?? 1;
  const steps = request.steps ?? DEFAULT_SWEEP_STEPS;
  if (!(request.days >= 0) || !(stepDays > 0)) throw new RangeError(`a sweep needs days >= 0 and stepDays > 0, got ${request.days}, ${stepDays}`);
  if (!Number.isInteger(steps) || steps < 12 || steps > 100000) throw new RangeError(`steps must be an integer from 12 to 100000, got ${steps}`);
  const rowCount = sweepRowCount(request.days, stepDays);
  if (rowCount > MAX_SWEEP_ROWS) throw new RangeError(`a sweep of ${rowCount} rows is more than ${MAX_SWEEP_ROWS}; use a larger step`);

  const startMs = toMs(request.epochStart, 'epochStart');
  const orbitEpochMs = request.orbitEpoch === undefined ? startMs : toMs(request.orbitEpoch, 'orbitEpoch');
  const endMs = startMs + (rowCount - 1) * stepDays * DAY_MS;
  const days = missionDays(body, orbit, orbitEpochMs, startMs, endMs);
  const apsidalRate = days.apsidalRateRadS;
  const albedo = request.albedo ?? body.albedo.nominal;
  const olrWm2 = request.olrWm2 ?? body.olrWm2.nominal;
  const surfaces = request.surfaces ?? [];

  const grid = orbitGrid(orbit, body.radiusKm, steps);
  const scanGrid = steps >= SWEEP_SCAN_STEPS ? grid : orbitGrid(orbit, body.radiusKm, SWEEP_SCAN_STEPS);
  const prepared = prepareSurfaces(surfaces, grid, body.radiusKm);
  // IR depends only on the view factor, the same on every date: its orbit sum is computed once.
  const irSums = prepared.map((p) => (p.normal === null ? Number.NaN : p.viewFactor.reduce((s, f) => s + f, 0)));
  const constantViewFactor = constantViewFactors(prepared);
  const shade = gridShade(steps);
  const solarSums = new Float64Array(prepared.length);
  const albedoSums = new Float64Array(prepared.length);
  const sunIrSums = new Float64Array(prepared.length);
  const rows: MissionSweepRow[] = new Array(rowCount);
  let minBeta = Infinity;
  let maxBeta = -Infinity;

  for (let row = 0; row < rowCount; row++) {
    const ms = startMs + row * stepDays * DAY_MS;
    const { sun, betaDeg, raanRad: raan, solarDistanceAu: distanceAu } = days.at(ms);
    const flux = solarFluxWm2(distanceAu);
    shadeGrid(grid, sun, shade);
    accumulate(prepared, grid, shade, sun.sw, body.radiusKm, constantViewFactor, solarSums, albedoSums, sunIrSums);
    const eclipse: EclipseSummary = scanGrid === grid
      ? eclipseFromShade(orbit, grid, shade, sun, body.radiusKm)
      : eclipseOnGrid(orbit, scanGrid, sun, body.radiusKm);
    const halfWindowMs = (stepDays * DAY_MS) / 2;
    const longest = longestShadow(body, eclipse.umbraS + eclipse.penumbraS, days.parentSpans(ms - halfWindowMs, ms + halfWindowMs));
    minBeta = Math.min(minBeta, betaDeg);
    maxBeta = Math.max(maxBeta, betaDeg);
    const loads: SurfaceLoad[] = new Array(prepared.length);
    for (let j = 0; j < prepared.length; j++) {
      const s = prepared[j].surface;
      const solarWm2 = (flux * solarSums[j]) / steps;
      const albedoWm2 = (flux * albedo * albedoSums[j]) / steps;
      const irWm2 = (olrWm2 * (prepared[j].normal === null ? sunIrSums[j] : irSums[j])) / steps;
      loads[j] = { name: s.name, solarWm2, albedoWm2, irWm2, absorbedW: s.areaM2 * (s.absorptivity * (solarWm2 + albedoWm2) + s.emissivity * irWm2) };
    }
    rows[row] = {
      date: new Date(ms).toISOString(), betaDeg, raanDeg: wrapDeg(raan), solarDistanceAu: distanceAu, solarFluxWm2: flux,
      eclipseFraction: eclipse.eclipseFraction, eclipseDurationS: eclipse.eclipseDurationS,
      umbraDurationS: eclipse.umbraS, penumbraDurationS: eclipse.penumbraS, surfaces: loads,
      longestShadowS: longest.durationS, longestShadowCastBy: longest.castBy,
      longestShadowStart: longest.startMs === null ? null : new Date(longest.startMs).toISOString(),
    };
  }
  return {
    bodyId: body.id,
    periodS: orbit.periodS,
    nodalRateDegPerDay: (orbit.nodalRateRadS / DEG) * 86400,
    apsidalRateDegPerDay: (apsidalRate / DEG) * 86400,
    rows,
    minBetaDeg: rowCount > 0 ? minBeta : Number.NaN,
    maxBetaDeg: rowCount > 0 ? maxBeta : Number.NaN,
  };
}

/**
 * Orbit sums, per surface, of sunlit x max(0, cos incidence) and of F x max(0, cos subsolar); for
 * Sun-pointed surfaces also of their moving view factor. Flux, albedo and OLR multiply them after.
 */
function accumulate(
  prepared: readonly PreparedSurface[], grid: OrbitGrid, shade: GridShade, sunW: number, bodyRadiusKm: number,
  constantViewFactor: Float64Array, solarSums: Float64Array, albedoSums: Float64Array, sunIrSums: Float64Array,
): void {
  const { cx, cz, sunlit } = shade;
  const steps = grid.steps;
  // The sum of max(0, cos subsolar) serves every surface whose view factor is the same at every sample.
  let zenithSum = 0;
  for (let k = 0; k < steps; k++) {
    const z = cz[k];
    if (z > 0) zenithSum += z;
  }
  for (let j = 0; j < prepared.length; j++) {
    const p = prepared[j];
    let solar = 0;
    let albedo = 0;
    let ir = 0;
    if (p.normal === null) {
      for (let k = 0; k < steps; k++) {
        const z = cz[k];
        const viewFactor = sunPointedViewFactor(grid.radiusKm[k], bodyRadiusKm, z);
        solar += sunlit[k] * (cx[k] * cx[k] + sunW * sunW + z * z);
        if (z > 0) albedo += viewFactor * z;
        ir += viewFactor;
      }
    } else {
      const nx = p.normal[0];
      const nz = p.normal[2];
      const fromNormal = p.normal[1] * sunW;
      for (let k = 0; k < steps; k++) {
        const cosSun = nx * cx[k] + nz * cz[k] + fromNormal;
        if (cosSun > 0) solar += sunlit[k] * cosSun;
      }
      const f = constantViewFactor[j];
      if (Number.isNaN(f)) {
        const factors = p.viewFactor;
        for (let k = 0; k < steps; k++) {
          const z = cz[k];
          if (z > 0) albedo += factors[k] * z;
        }
      } else albedo = f * zenithSum;
    }
    solarSums[j] = solar;
    albedoSums[j] = albedo;
    sunIrSums[j] = ir;
  }
}

/** Per surface, its view factor where it is the same at every sample (a circular orbit), NaN otherwise. */
function constantViewFactors(prepared: readonly PreparedSurface[]): Float64Array {
  const out = new Float64Array(prepared.length).fill(Number.NaN);
  prepared.forEach((p, j) => {
    const f = p.viewFactor;
    if (p.normal === null || f.length === 0) return;
    let same = true;
    for (let k = 1; k < f.length && same; k++) same = f[k] === f[0];
    if (same) out[j] = f[0];
  });
  return out;
}

const sunPointedViewFactor = (radiusKm: number, bodyRadiusKm: number, cz: number): number =>
  plateToSphereViewFactor(radiusKm, bodyRadiusKm, Math.acos(Math.max(-1, Math.min(1, -cz))));
