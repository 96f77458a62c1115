// The environment along a stored ephemeris: its points streamed from SQLite a block at a time
// (never all loaded at once), the mission's surfaces with their materials' BOL or EOL properties, and
// shared/physics/trajectory-environment.ts. Exported for load cases that take an ephemeris as
// their source.
import { eq } from 'drizzle-orm';
import type { TrajectoryEnvironmentResponse } from '../../shared/api/ephemerides';
import { getBody } from '../../shared/physics/bodies';
import { capAssumptions, COARSE_CAP_NODES, needsCap } from '../../shared/physics/cap-loads';
import { CAUTION } from '../../shared/physics/environment';
import { surfaceNormal } from '../../shared/api/pointing';
import type { Surface, SurfaceNormal } from '../../shared/physics/heat-loads';
import { trajectoryEnvironment, type TrajectoryEnvironment, type TrajectorySample } from '../../shared/physics/trajectory-environment';
import type { AppContext } from '../app-context';
import { materials, surfaces, type EphemerisRow, type MissionRow } from '../db/schema';
import { unprocessable } from '../errors';
import { limitWork } from '../work-limit';
import { storedBlocks } from './ephemeris-store';
import { epochText } from './epoch-text';
import { POINT_FIELDS } from './point-blocks';

export interface EphemerisEnvironmentOptions {
  properties: 'bol' | 'eol';
  maxPoints: number;
  albedo?: number | undefined;
  olrWm2?: number | undefined;
  from?: string | undefined;
  to?: string | undefined;
}

/** The answer's assumptions: the albedo and IR models it used (cap-loads.ts says them) among the fixed ones. */
const assumptions = (result: TrajectoryEnvironment): string[] => [
  'the Sun from each row\'s epoch (VSOP87, interpolated between hourly evaluations); conical shadow of the central body, no atmosphere',
  ...capAssumptions(result.models, result.meanSolarFluxWm2),
  ...(needsCap(result.models) ? [`the cap integrals at each row use ${COARSE_CAP_NODES.radial} x ${COARSE_CAP_NODES.azimuth} nodes over the disk (the compute route: 20 x 48), within about 1 % of it`] : []),
  'local orbital frame from r and v (v by finite differences when the file has no velocities); surfaces fixed in it or pointed in it at each row (inertial directions in the body\'s equatorial frame of J2000)',
  'averages are time-weighted (trapezoidal) over the window (the whole ephemeris unless a window is given), not per orbit',
  CAUTION,
];

// Stored as written by the surfaces route (validated there); a form outside the contract is a bug, not input.
const storedNormal = (normal: unknown): SurfaceNormal => surfaceNormal.parse(normal);

/** The mission's surfaces as the physics takes them, with the chosen property set. */
export function missionSurfaces(ctx: AppContext, missionId: string, properties: 'bol' | 'eol'): Surface[] {
  return ctx.db
    .select({ surface: surfaces, material: materials })
    .from(surfaces)
    .innerJoin(materials, eq(materials.id, surfaces.materialId))
    .where(eq(surfaces.missionId, missionId))
    .all()
    .map(({ surface, material }) => ({
      name: surface.name,
      normal: storedNormal(surface.normal),
      areaM2: surface.areaM2,
      absorptivity: properties === 'eol' ? material.absorptivityEol : material.absorptivityBol,
      emissivity: properties === 'eol' ? material.emissivityEol : material.emissivityBol,
    }));
}

/** The stored points with epochs in [fromMs, toMs], in order. */
function* samples(ctx: AppContext, ephemerisId: string, fromMs: number, toMs: number): Generator<TrajectorySample> {
  for (const block of storedBlocks(ctx, ephemerisId)) {
    const v = block.values;
    const n = block.points * POINT_FIELDS;
    // whole blocks before the window are passed over; the first one after it ends the walk
    if (v[n - POINT_FIELDS] < fromMs) continue;
    if (v[0] > toMs) return;
    for (let i = 0; i < n; i += POINT_FIELDS) {
      const tMs = v[i];
      if (tMs < fromMs) continue;
      if (tMs > toMs) return;
      const velocity = Number.isNaN(v[i + 4]) || Number.isNaN(v[i + 5]) || Number.isNaN(v[i + 6]) ? null : ([v[i + 4], v[i + 5], v[i + 6]] as const);
      yield { tMs, positionKm: [v[i + 1], v[i + 2], v[i + 3]], velocityKmS: velocity };
    }
  }
}

export interface WindowRequest {
  from?: string | undefined;
  to?: string | undefined;
}

export interface EphemerisWindow {
  /** Epochs kept: fromMs <= t <= toMs (unbounded for the whole ephemeris). */
  fromMs: number;
  toMs: number;
  /** Rows with epochs in the window. */
  rows: number;
  /** The epochs of the first and last of those rows, as stored summaries write them. */
  from: string;
  to: string;
}

/**
 * The rows of the ephemeris inside the asked window (either end defaults to the ephemeris' own),
 * with the epochs of the first and last of them; 422 when the window holds fewer than two rows.
 */
export function ephemerisWindow(ctx: AppContext, row: EphemerisRow, window: WindowRequest): EphemerisWindow {
  const startMs = Date.parse(row.startEpoch);
  const endMs = Date.parse(row.endEpoch);
  const fromMs = window.from ? Date.parse(window.from) : startMs;
  const toMs = window.to ? Date.parse(window.to) : endMs;
  if (fromMs > endMs || toMs < startMs) {
    const field = fromMs > endMs ? 'from' : 'to';
    throw unprocessable(`The window ${epochText(fromMs)} – ${epochText(toMs)} lies outside the ephemeris, which runs ${row.startEpoch} – ${row.endEpoch}.`, [
      { path: field, message: `${field} ${epochText(field === 'from' ? fromMs : toMs)} is outside ${row.startEpoch} – ${row.endEpoch}` },
    ]);
  }
  // The whole file: no bounds at all, so a sub-millisecond OEM epoch at either end stays in.
  if (!window.from && !window.to) return { fromMs: -Infinity, toMs: Infinity, rows: row.rows, from: row.startEpoch, to: row.endEpoch };
  let rows = 0;
  let first = NaN;
  let last = NaN;
  for (const sample of samples(ctx, row.id, fromMs, toMs)) {
    if (rows === 0) first = sample.tMs;
    last = sample.tMs;
    rows++;
  }
  if (rows < 2) {
    throw unprocessable(`The window ${epochText(fromMs)} – ${epochText(toMs)} holds ${rows} row${rows === 1 ? '' : 's'} of the ephemeris; a window needs at least two (its rows are ${row.stepS} s apart).`, [
      { path: 'to', message: `the window holds ${rows} row${rows === 1 ? '' : 's'}` },
    ]);
  }
  return { fromMs: first, toMs: last, rows, from: epochText(first), to: epochText(last) };
}

/** The window's first two rows (it holds at least two). */
export function firstStates(ctx: AppContext, row: EphemerisRow, window: EphemerisWindow): [TrajectorySample, TrajectorySample] {
  const found: TrajectorySample[] = [];
  for (const sample of samples(ctx, row.id, window.fromMs, window.toMs)) {
    found.push(sample);
    if (found.length === 2) return [found[0]!, found[1]!];
  }
  throw new Error(`the window of ephemeris ${row.id} holds fewer than two rows`);
}

export interface WindowEnvironmentOptions {
  albedo?: number | undefined;
  olrWm2?: number | undefined;
  /** Rows to keep as points (the averages and peaks use every row). */
  maxPoints: number;
  /**
   * rows: every n-th row and the last, for plots; time: the first row at or after each of maxPoints
   * evenly spaced times from the first row (the last row's time excluded), so the points are evenly
   * spaced in time however unevenly the file is, as a load case's series must be.
   */
  sampling?: 'rows' | 'time';
}

/** Keeps the first row at or after each of `count` times evenly spaced over [firstMs, lastMs). */
export function evenInTime(firstMs: number, lastMs: number, count: number): (index: number, tMs: number) => boolean {
  const stepMs = (lastMs - firstMs) / count;
  let k = 0;
  return (_index, tMs) => {
    if (k >= count || tMs < firstMs + k * stepMs) return false;
    // one row stands for every grid time it reaches (a gap in the file longer than the grid step)
    while (k < count && tMs >= firstMs + k * stepMs) k++;
    return true;
  };
}

/** The environment at every row of the window, for the given surfaces. */
export function windowEnvironment(
  ctx: AppContext, mission: MissionRow, row: EphemerisRow, window: EphemerisWindow, surfaceList: Surface[], options: WindowEnvironmentOptions,
): TrajectoryEnvironment {
  limitWork([{ name: 'rows of the window', count: window.rows }, { name: 'surfaces', count: surfaceList.length }], 'to', 'choose a shorter window (from, to)');
  const stride = Math.max(1, Math.ceil(window.rows / options.maxPoints));
  const keep = options.sampling === 'time'
    ? evenInTime(Number.isFinite(window.fromMs) ? window.fromMs : Date.parse(window.from), Date.parse(window.to), options.maxPoints)
    : (i: number) => i % stride === 0 || i === window.rows - 1;
  return trajectoryEnvironment(samples(ctx, row.id, window.fromMs, window.toMs), {
    body: getBody(mission.bodyId),
    surfaces: surfaceList,
    albedo: options.albedo,
    olrWm2: options.olrWm2,
    maxAltitudeKm: row.maxAltitudeKm,
    keep,
  });
}

export function ephemerisEnvironment(ctx: AppContext, mission: MissionRow, row: EphemerisRow, options: EphemerisEnvironmentOptions): TrajectoryEnvironmentResponse {
  const body = getBody(mission.bodyId);
  const surfaceList = missionSurfaces(ctx, mission.id, options.properties);
  if (surfaceList.length === 0) {
    throw unprocessable('The mission has no surfaces yet: add at least one (with a material) to compute loads along the ephemeris.', [
      { path: 'surfaces', message: 'no surfaces in this mission' },
    ]);
  }
  const window = ephemerisWindow(ctx, row, options);
  const result = windowEnvironment(ctx, mission, row, window, surfaceList, options);
  return {
    ephemerisId: row.id,
    bodyId: body.id,
    properties: options.properties,
    albedo: result.albedo,
    olrWm2: result.olrWm2,
    rows: result.rows,
    window: { from: window.from, to: window.to },
    points: result.points.map((p) => ({ epoch: epochText(p.tMs), altitudeKm: p.altitudeKm, sunlit: p.sunlit, surfaces: p.surfaces })),
    averages: result.averages,
    peaks: result.peaks,
    assumptions: assumptions(result),
  };
}
