// A mission's environment date by date: for each date the beta angle, the Sun's distance and flux,
// the eclipse (conical shadow) and the orbit-average loads on each surface, with the node and the
// periapsis drifting under J2 and the Sun moving along the body's orbit. One orbit is computed per
// date with the Sun held fixed over it, as POST /environment/compute does. Albedo and planetary IR
// take the compute route's models (cap-loads.ts chooseCapModels: an airless body's surface
// temperature field and the Lambertian albedo integral by default); where they need the cap
// quadrature, a plate fixed in the local frame on a circular orbit takes the exact time average over
// the orbit node by node (cap-radiance.ts plateOrbitMeanFluxes); other plates and eccentric orbits
// are sampled on a coarser grid than the compute route's (SWEEP_CAP_STEPS samples evenly in eccentric
// anomaly with their exact time weights); both on SWEEP_CAP_RADIAL x SWEEP_CAP_AZIMUTH nodes, so ten
// years stay quick; mission-sweep.spec.ts holds the orbit averages to the compute route's. Surfaces
// take every pointing of pointing.ts: a plate that moves in the local frame gets its Sun cosine and
// view factor at every sample, the view factor read from a table by tilt for a circular orbit's one
// radius (viewFactorTable), and inertial directions turned toward each day's drifted orbit.
// Leaves out: everything computeEnvironment leaves out; drag and other perturbations that change
// the orbit's size or inclination; the Sun's motion within one orbit. Sources: Vallado ch. 9 (J2
// secular rates); the models of environment.ts; the Sun from VSOP87 through sun-track.ts.
import { getBody, type AnyBodyId } from './bodies';
import { capAssumptions, capColumns, capExitances, capGridNodes, COARSE_CAP_NODES, chooseCapModels, needsCap, type CapModelChoice, type CapModelRequest } from './cap-loads';
import type { EclipseSummary } from './eclipse';
import type { Surface, SurfaceLoad } from './heat-loads';
import { defineOrbit, type Orbit, type OrbitInput } from './orbit-definition';
import { plateOrbitMeanFluxes, type PlateNodes } from './cap-radiance';
import {
  eclipseFromShade, eclipseOnGrid, gridShade, orbitGrid, orbitGridAt, shadeGrid, type GridShade, type OrbitGrid, type PerifocalSun,
} from './orbit-grid';
import { eccentricAnomalyTimes } from './orbit-sampling';
import { longestShadow, missionDays } from './mission-days';
import { PhysicsError } from './physics-error';
import { solarFluxWm2 } from './sun';
import { orientSurfaces, prepareSurfaces, type PreparedSurface } from './surface-grid';
import { pointingAssumptions } from './pointing-words';
import { isInertial, j2000ToPerifocal, pointingColumns, pointingColumnsFor, viewFactorTables, type PointingColumns, type PointingPlan, type ViewFactorTable } from './pointing';
import { DEG, wrapDeg, type Vector3 } from './vector3';
import { degPerDay } from './kepler';
import { DAY_MS } from './constants';

export interface MissionSweepRequest extends CapModelRequest {
  bodyId: AnyBodyId | string;
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
  /** Override the body's nominal albedo and OLR (an OLR given for an airless body asks for the uniform model, as in the compute route). */
  albedo?: number | undefined;
  olrWm2?: number | undefined;
  /**
   * Other pointings of the same surfaces (same names, same order) over parts of the sweep: a
   * mission's phases, each with its attitude mode. A row whose instant is in [fromMs, toMs) of a
   * span takes that span's surfaces (the first span that holds it); a row in none the request's.
   * The per-day geometry (Sun, node, shadow) is computed once per row whatever the span; spans that
   * share one surfaces list (phases in one mode) share its preparation.
   */
  attitudeSpans?: readonly AttitudeSpan[] | undefined;
  /**
   * The moving plates' view-factor tables (pointing.ts viewFactorTables), kept by the caller across
   * calls that sweep one orbit a chunk of days at a time, so each is made once; made afresh without it.
   */
  viewFactorTables?: Map<string, ViewFactorTable> | undefined;
}

export interface AttitudeSpan {
  fromMs: number;
  toMs: number;
  surfaces: readonly Surface[];
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
  longestShadowCastBy: AnyBodyId[];
  /** When it starts (ISO 8601 UTC) for a shadow the planet takes part in; null for the body's own. */
  longestShadowStart: string | null;
  /** The index of the attitude span the row's loads were computed in, null for the request's own surfaces. */
  spanIndex: number | null;
}

export interface MissionSweepResult {
  bodyId: AnyBodyId;
  periodS: number;
  nodalRateDegPerDay: number;
  apsidalRateDegPerDay: number;
  rows: MissionSweepRow[];
  minBetaDeg: number;
  maxBetaDeg: number;
  /** The albedo and IR models used (the compute route's choice for the same orbit). */
  models: CapModelChoice;
  /** The models in words, as the compute route says them, with the sweep's own quadrature grid. */
  assumptions: string[];
}

/** The most rows one sweep may produce (the routes answer 400 beyond it). */
export const MAX_SWEEP_ROWS = 20000;
export const DEFAULT_SWEEP_STEPS = 360;
/** The shadow scan grid of a sweep: finer load grids are used as they are. */
const SWEEP_SCAN_STEPS = 360;
/** The cap quadrature of a sweep: samples per orbit (evenly in eccentric anomaly) and nodes over the disk. */
export const SWEEP_CAP_STEPS = 48;
const { radial: SWEEP_CAP_RADIAL, azimuth: SWEEP_CAP_AZIMUTH } = COARSE_CAP_NODES;

function toMs(value: string | Date, path: string): number {
  const ms = (value instanceof Date ? value : new Date(value)).getTime();
  if (!Number.isFinite(ms)) throw new PhysicsError('missing_sun_geometry', `${path} is not a date: ${String(value)}`, [{ path, message: 'not a date' }]);
  return ms;
}

/** Number of rows for a span and step, without building them. */
export const sweepRowCount = (days: number, stepDays: number): number => Math.floor(days / stepDays + 1e-9) + 1;


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
  const models = chooseCapModels(body, request, albedo, orbit.apoapsisAltitudeKm);

  const grid = orbitGrid(orbit, body.radiusKm, steps);
  const scanGrid = steps >= SWEEP_SCAN_STEPS ? grid : orbitGrid(orbit, body.radiusKm, SWEEP_SCAN_STEPS);
  const shade = gridShade(steps);
  // What each pointing needs for every date, made once per list of surfaces the rows meet (spans
  // that share one list, e.g. two phases in one attitude mode, share it too).
  const pointings = new Map<readonly Surface[], Pointing>();
  // a circular orbit's one radius: moving plates read their view factor from tables shared across the lists
  const r0 = grid.radiusKm[0];
  const tables = grid.radiusKm.every((r) => r === r0) ? viewFactorTables(r0, body.radiusKm, request.viewFactorTables) : null;
  const spans = request.attitudeSpans ?? [];
  const pointingAt = (ms: number): { index: number; set: Pointing } => {
    const index = spans.findIndex((span) => ms >= span.fromMs && ms < span.toMs);
    const list = index < 0 ? surfaces : spans[index]!.surfaces;
    let set = pointings.get(list);
    if (set === undefined) {
      set = pointing(list, grid, orbit, body.radiusKm, needsCap(models), rowCount, tables);
      pointings.set(list, set);
    }
    return { index, set };
  };
  const rows: MissionSweepRow[] = new Array(rowCount);
  let minBeta = Infinity;
  let maxBeta = -Infinity;

  for (let row = 0; row < rowCount; row++) {
    const ms = startMs + row * stepDays * DAY_MS;
    const { sun, basis, betaDeg, raanRad: raan, solarDistanceAu: distanceAu } = days.at(ms);
    const flux = solarFluxWm2(distanceAu);
    const { index: spanIndex, set } = pointingAt(ms);
    const { prepared, irSums, constantViewFactor, moving, solarSums, albedoSums, sunIrSums, cap } = set;
    // inertial pointings turned toward the day's orbit (its node and periapsis drift)
    const toOrbit = set.inertial ? j2000ToPerifocal(body, basis, new Date(ms)) : null;
    if (toOrbit) orientSurfaces(prepared, toOrbit);
    shadeGrid(grid, sun, shade);
    accumulate(prepared, moving, grid, shade, sun.sw, body.radiusKm, constantViewFactor, solarSums, albedoSums, sunIrSums);
    const eclipse: EclipseSummary = scanGrid === grid
      ? eclipseFromShade(orbit, grid, shade, sun, body.radiusKm)
      : eclipseOnGrid(orbit, scanGrid, sun, body.radiusKm);
    const halfWindowMs = (stepDays * DAY_MS) / 2;
    const longest = longestShadow(body, eclipse.umbraS + eclipse.penumbraS, days.parentSpans(ms - halfWindowMs, ms + halfWindowMs));
    minBeta = Math.min(minBeta, betaDeg);
    maxBeta = Math.max(maxBeta, betaDeg);
    const capAverages = cap ? cap.averages(models, sun, flux, albedo, toOrbit) : null;
    const loads: SurfaceLoad[] = new Array(prepared.length);
    for (let j = 0; j < prepared.length; j++) {
      const s = prepared[j].surface;
      const solarWm2 = (flux * solarSums[j]) / steps;
      const albedoWm2 = capAverages?.albedoWm2?.[j] ?? (flux * albedo * albedoSums[j]) / steps;
      const irWm2 = capAverages?.irWm2?.[j] ?? (olrWm2 * (prepared[j].normal === null ? sunIrSums[j] : irSums[j])) / steps;
      loads[j] = { name: s.name, solarWm2, albedoWm2, irWm2, absorbedW: s.areaM2 * (s.absorptivity * (solarWm2 + albedoWm2) + s.emissivity * irWm2) };
    }
    rows[row] = {
      date: new Date(ms).toISOString(), betaDeg, raanDeg: wrapDeg(raan / DEG), solarDistanceAu: distanceAu, solarFluxWm2: flux,
      eclipseFraction: eclipse.eclipseFraction, eclipseDurationS: eclipse.eclipseDurationS,
      umbraDurationS: eclipse.umbraS, penumbraDurationS: eclipse.penumbraS, surfaces: loads,
      longestShadowS: longest.durationS, longestShadowCastBy: longest.castBy,
      longestShadowStart: longest.startMs === null ? null : new Date(longest.startMs).toISOString(),
      spanIndex: spanIndex < 0 ? null : spanIndex,
    };
  }
  return {
    bodyId: body.id,
    periodS: orbit.periodS,
    nodalRateDegPerDay: degPerDay(orbit.nodalRateRadS),
    apsidalRateDegPerDay: degPerDay(apsidalRate),
    rows,
    minBetaDeg: rowCount > 0 ? minBeta : Number.NaN,
    maxBetaDeg: rowCount > 0 ? maxBeta : Number.NaN,
    models,
    assumptions: [...sweepAssumptions(models, rows[0].solarFluxWm2), ...pointingAssumptions([...surfaces, ...spans.flatMap((span) => span.surfaces)].map((s) => s.normal))],
  };
}

interface Pointing {
  prepared: PreparedSurface[];
  irSums: number[];
  constantViewFactor: Float64Array;
  moving: (MovingSurface | null)[];
  /** Some surface is fixed in inertial space: turned toward each day's orbit. */
  inertial: boolean;
  solarSums: Float64Array;
  albedoSums: Float64Array;
  sunIrSums: Float64Array;
  cap: ReturnType<typeof sweepCap> | null;
}

/**
 * One pointing of the surfaces made ready for every date of the sweep. `rowCount`: the sweep's rows,
 * which sweepCap takes to decide on its tables; `tables`: the view-factor tables of a circular orbit.
 */
function pointing(
  surfaces: readonly Surface[], grid: OrbitGrid, orbit: Orbit, bodyRadiusKm: number, withCap: boolean, rowCount: number,
  tables: ((plan: PointingPlan) => ViewFactorTable) | null,
): Pointing {
  const prepared = prepareSurfaces(surfaces, grid, bodyRadiusKm);
  return {
    prepared,
    // IR depends only on the view factor, the same on every date: its orbit sum is computed once.
    irSums: prepared.map((p) => (p.normal === null ? Number.NaN : p.viewFactor.reduce((s, f) => s + f, 0))),
    constantViewFactor: constantViewFactors(prepared),
    moving: movingSurfaces(prepared, grid.steps, tables),
    inertial: prepared.some((p) => p.plan !== null && isInertial(p.source)),
    solarSums: new Float64Array(prepared.length),
    albedoSums: new Float64Array(prepared.length),
    sunIrSums: new Float64Array(prepared.length),
    cap: withCap ? sweepCap(orbit, bodyRadiusKm, surfaces, rowCount) : null,
  };
}

/** The sweep's albedo and IR models in words: the compute route's lines, and the sweep's quadrature grid. */
function sweepAssumptions(models: CapModelChoice, firstFluxWm2: number): string[] {
  const lines = capAssumptions(models, firstFluxWm2);
  if (models.field) lines[1] = `${lines[1]} (subsolar temperature at the first date's solar flux)`;
  if (needsCap(models)) {
    lines.push(
      `the sweep's cap integrals use ${SWEEP_CAP_RADIAL} x ${SWEEP_CAP_AZIMUTH} nodes over the disk (the compute route: 20 x 48): on a circular orbit a plate fixed to the spacecraft takes the exact time average over the orbit, ` +
      `plates that move in the local frame (Sun-pointed, inertial, tracking, spinning, yaw-steered) and eccentric orbits ${SWEEP_CAP_STEPS} samples evenly in eccentric anomaly with their exact time weights; orbit averages agree with the compute route's to about 1 %`,
    );
  }
  return lines;
}

/**
 * The cap quadrature of a sweep, its nodes built once for every day: per day, the orbit-average albedo
 * and IR of each surface (null for a component a closed form gives). On a circular orbit a plate fixed
 * in the local frame takes the exact time average over the orbit (plateOrbitMeanFluxes); moving
 * plates (pointing.ts) and eccentric orbits are sampled on a small grid evenly in eccentric anomaly with exact time weights.
 */
function sweepCap(orbit: Orbit, bodyRadiusKm: number, surfaces: readonly Surface[], rowCount: number) {
  const { times, weightS } = eccentricAnomalyTimes(orbit, SWEEP_CAP_STEPS);
  const grid = orbitGridAt(orbit, bodyRadiusKm, times);
  const prepared = prepareSurfaces(surfaces, grid, bodyRadiusKm);
  const nodesAt = capGridNodes(prepared, grid, bodyRadiusKm, { keepAll: true, ...COARSE_CAP_NODES });
  const circular = orbit.eccentricity === 0;
  const fixed = circular ? nodesAt(0).plates : prepared.map(() => null);
  // the sampled grid only for the plates the exact mean does not serve
  const sampled = prepared.filter((_, j) => fixed[j] === null);
  const sampledNodesAt = capGridNodes(sampled, grid, bodyRadiusKm, { keepAll: true, ...COARSE_CAP_NODES });
  const shade = gridShade(grid.steps);
  const out = new Float64Array(2);
  const litTables: ((sy: number) => number)[] = [];
  const average = (column: Float64Array): number => {
    let sum = 0;
    for (let k = 0; k < column.length; k++) sum += column[k] * weightS[k];
    return sum / orbit.periodS;
  };
  return {
    averages(models: CapModelChoice, sun: PerifocalSun, fluxWm2: number, albedo: number, toOrbit: ((v: Vector3) => Vector3) | null): { albedoWm2: number[] | null; irWm2: number[] | null } {
      const { reflected, day, floor } = capExitances(models, fluxWm2, albedo);
      if (toOrbit) orientSurfaces(sampled, toOrbit);
      const albedoWm2 = new Array<number>(prepared.length);
      const irWm2 = new Array<number>(prepared.length);
      const columns = sampled.length > 0
        ? (shadeGrid(grid, sun, shade), capColumns(models, sampled, grid, shade, sun.sw, bodyRadiusKm, fluxWm2, albedo, sampledNodesAt))
        : null;
      let i = 0;
      for (let j = 0; j < prepared.length; j++) {
        const plate = fixed[j];
        if (plate && !models.field && rowCount >= ALBEDO_TABLE_FROM_ROWS) {
          // the albedo alone: its orbit mean per unit reflected exitance, tabulated by beta
          albedoWm2[j] = reflected * (litTables[j] ??= litByBeta(plate))(sun.sw);
          irWm2[j] = Number.NaN;
        } else if (plate) {
          plateOrbitMeanFluxes(plate, sun.sw, reflected, day, floor, out);
          albedoWm2[j] = out[0];
          irWm2[j] = out[1];
        } else {
          albedoWm2[j] = columns?.albedoWm2 ? average(columns.albedoWm2[i]) : Number.NaN;
          irWm2[j] = columns?.irWm2 ? average(columns.irWm2[i]) : Number.NaN;
          i++;
        }
      }
      return { albedoWm2: models.albedoModel === 'lambertian' ? albedoWm2 : null, irWm2: models.field ? irWm2 : null };
    },
  };
}

/** A moving surface's reusable columns and its view factor by tilt (tabulated once for a circular orbit's one radius). */
interface MovingSurface {
  columns: PointingColumns;
  table: ViewFactorTable | null;
}

function movingSurfaces(prepared: readonly PreparedSurface[], steps: number, tables: ((plan: PointingPlan) => ViewFactorTable) | null): (MovingSurface | null)[] {
  return prepared.map((p) => (p.plan ? { columns: pointingColumnsFor(steps), table: tables ? tables(p.source) : null } : null));
}

/**
 * From this many rows a sweep without a surface temperature field tabulates each fixed plate's orbit
 * mean albedo (per unit reflected exitance) by beta once, instead of integrating the cap every day:
 * the table costs ALBEDO_TABLE_STEPS + 4 days' work. The mean is a smooth function of beta (the
 * Sun turns about the orbit normal; plateOrbitMeanFluxes), read by four-point Lagrange interpolation
 * (Abramowitz & Stegun 25.2.13) within a few 1e-6 of the day-by-day value
 * (mission-sweep.spec.ts holds it to the day-by-day integral).
 */
const ALBEDO_TABLE_FROM_ROWS = 1000;
const ALBEDO_TABLE_STEPS = 720;

/** A fixed plate's orbit-mean lit cap, sum of w max(mu, 0), as a function of sin(beta), from a table evenly in beta. */
function litByBeta(plate: PlateNodes): (sy: number) => number {
  const h = Math.PI / ALBEDO_TABLE_STEPS;
  const out = new Float64Array(2);
  // nodes from -90 deg - h to 90 deg + 2h: beyond +-90 deg sin(beta) folds back, so the table is whole there too
  const table = Float64Array.from({ length: ALBEDO_TABLE_STEPS + 4 }, (_, n) => {
    plateOrbitMeanFluxes(plate, Math.sin(-Math.PI / 2 + (n - 1) * h), 1, 0, 0, out);
    return out[0];
  });
  return (sy) => {
    const s = (Math.asin(Math.max(-1, Math.min(1, sy))) + Math.PI / 2) / h + 1;
    const j = Math.min(ALBEDO_TABLE_STEPS + 1, Math.max(1, Math.floor(s)));
    const u = s - j;
    return ((-u * (u - 1) * (u - 2)) / 6) * table[j - 1] + (((u + 1) * (u - 1) * (u - 2)) / 2) * table[j]
      + ((-(u + 1) * u * (u - 2)) / 2) * table[j + 1] + (((u + 1) * u * (u - 1)) / 6) * table[j + 2];
  };
}

/**
 * Orbit sums, per surface, of sunlit x max(0, cos incidence) and of F x max(0, cos subsolar); for
 * moving surfaces (pointing.ts) also of their moving view factor. Flux, albedo and OLR multiply them after.
 */
function accumulate(
  prepared: readonly PreparedSurface[], moving: readonly (MovingSurface | null)[], grid: OrbitGrid, shade: GridShade, sunW: number, bodyRadiusKm: number,
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
    const m = moving[j];
    let solar = 0;
    let albedo = 0;
    let ir = 0;
    if (p.plan && m) {
      const { sums } = pointingColumns(p.plan, grid, shade, sunW, bodyRadiusKm, m.columns, m.table, sunlit);
      [solar, albedo, ir] = [sums[0], sums[1], sums[2]];
    } else if (p.normal) {
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
