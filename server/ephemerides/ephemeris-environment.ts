// The environment along a stored ephemeris: its points streamed from SQLite a block at a time
// (never all loaded at once), the mission's surfaces with their materials' BOL or EOL properties, and
// shared/physics/trajectory-environment.ts. Exported for load cases that take an ephemeris as
// their source.
import { eq } from 'drizzle-orm';
import type { TrajectoryEnvironmentResponse } from '../../shared/api/ephemerides';
import { getBody } from '../../shared/physics/bodies';
import { namedNormals, type Surface, type SurfaceNormal } from '../../shared/physics/heat-loads';
import { trajectoryEnvironment, type TrajectorySample } from '../../shared/physics/trajectory-environment';
import type { AppContext } from '../app-context';
import { materials, surfaces, type EphemerisRow, type MissionRow } from '../db/schema';
import { unprocessable } from '../errors';
import { storedBlocks } from './ephemeris-store';
import { epochText } from './epoch-text';
import { POINT_FIELDS } from './point-blocks';

export interface EphemerisEnvironmentOptions {
  properties: 'bol' | 'eol';
  maxPoints: number;
  albedo?: number | undefined;
  olrWm2?: number | undefined;
}

const assumptions = [
  'the Sun from each row\'s epoch (VSOP87, interpolated between hourly evaluations); conical shadow of the central body, no atmosphere',
  'albedo load = S * albedo * F * cos(solar zenith at the sub-spacecraft point): a common engineering approximation; planetary IR = OLR * F (Howell catalogue)',
  'local orbital frame from r and v (v by finite differences when the file has no velocities); surfaces fixed in it',
  'averages are time-weighted (trapezoidal) over the whole span of the ephemeris, not per orbit',
  'preliminary-design estimate from simplified models; verify with detailed analysis, a correlated model and thermal test',
];

// Stored as written by the surfaces route (validated there); a name outside the list is a bug, not input.
function storedNormal(normal: string | { x: number; y: number; z: number }, surface: string): SurfaceNormal {
  if (typeof normal !== 'string') return normal;
  const named = namedNormals.find((n) => n === normal);
  if (!named) throw new Error(`surface ${surface} has an unknown stored normal ${JSON.stringify(normal)}`);
  return named;
}

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
      normal: storedNormal(surface.normal, surface.name),
      areaM2: surface.areaM2,
      absorptivity: properties === 'eol' ? material.absorptivityEol : material.absorptivityBol,
      emissivity: properties === 'eol' ? material.emissivityEol : material.emissivityBol,
    }));
}

function* samples(ctx: AppContext, ephemerisId: string): Generator<TrajectorySample> {
  for (const block of storedBlocks(ctx, ephemerisId)) {
    const v = block.values;
    for (let i = 0; i < block.points * POINT_FIELDS; i += POINT_FIELDS) {
      const velocity = Number.isNaN(v[i + 4]) || Number.isNaN(v[i + 5]) || Number.isNaN(v[i + 6]) ? null : ([v[i + 4], v[i + 5], v[i + 6]] as const);
      yield { tMs: v[i], positionKm: [v[i + 1], v[i + 2], v[i + 3]], velocityKmS: velocity };
    }
  }
}

export function ephemerisEnvironment(ctx: AppContext, mission: MissionRow, row: EphemerisRow, options: EphemerisEnvironmentOptions): TrajectoryEnvironmentResponse {
  const body = getBody(mission.bodyId);
  const surfaceList = missionSurfaces(ctx, mission.id, options.properties);
  if (surfaceList.length === 0) {
    throw unprocessable('The mission has no surfaces yet: add at least one (with a material) to compute loads along the ephemeris.', [
      { path: 'surfaces', message: 'no surfaces in this mission' },
    ]);
  }
  const stride = Math.max(1, Math.ceil(row.rows / options.maxPoints));
  const result = trajectoryEnvironment(samples(ctx, row.id), {
    body,
    surfaces: surfaceList,
    albedo: options.albedo,
    olrWm2: options.olrWm2,
    keep: (i) => i % stride === 0 || i === row.rows - 1,
  });
  return {
    ephemerisId: row.id,
    bodyId: body.id,
    properties: options.properties,
    albedo: result.albedo,
    olrWm2: result.olrWm2,
    rows: result.rows,
    points: result.points.map((p) => ({ epoch: epochText(p.tMs), altitudeKm: p.altitudeKm, sunlit: p.sunlit, surfaces: p.surfaces })),
    averages: result.averages,
    peaks: result.peaks,
    assumptions,
  };
}
