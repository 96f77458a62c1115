// The environment of a saved orbit with the mission's surfaces: the compute route's physics, fed
// from the database, with the surfaces' BOL or EOL optical properties.
import { asc, eq, sql } from 'drizzle-orm';
import type { z } from 'zod';
import type { EnvironmentResponse } from '../../shared/api/environment';
import type { savedEnvironmentRequest } from '../../shared/api/missions';
import { ECCENTRIC_SAMPLING_FROM } from '../../shared/physics/design-cases';
import { computeEnvironment, type EnvironmentRequest } from '../../shared/physics/environment';
import type { OrbitInput } from '../../shared/physics/orbit-definition';
import type { Db } from '../db/database';
import { materials, surfaces, type MissionRow, type OrbitRow } from '../db/schema';
import { toSurface } from './mission-responses';
import { limitWork } from '../work-limit';

export type PropertySet = 'bol' | 'eol';
type SavedEnvironmentRequest = z.output<typeof savedEnvironmentRequest>;

export interface LabelledSurface {
  id: string;
  name: string;
  materialName: string;
  absorptivity: number;
  emissivity: number;
}

export interface MissionSurface {
  label: LabelledSurface;
  /** The surface as the physics takes it. */
  physics: EnvironmentRequest['surfaces'][number];
}

export type SavedEnvironmentResponse = EnvironmentResponse & { properties: PropertySet; surfaces: LabelledSurface[] };

/** The mission's surfaces with the chosen property set, in the order the client lists them. */
export function missionSurfaces(db: Db, missionId: string, properties: PropertySet): MissionSurface[] {
  return db
    .select({ surface: surfaces, material: materials })
    .from(surfaces)
    .innerJoin(materials, eq(materials.id, surfaces.materialId))
    .where(eq(surfaces.missionId, missionId))
    // Creation order; rowid breaks ties between rows of the same millisecond (the demo seed).
    .orderBy(asc(surfaces.createdAt), sql`"surfaces".rowid`)
    .all()
    .map(({ surface, material }) => {
      const absorptivity = properties === 'eol' ? material.absorptivityEol : material.absorptivityBol;
      const emissivity = properties === 'eol' ? material.emissivityEol : material.emissivityBol;
      const { normal } = toSurface(surface);
      return {
        label: { id: surface.id, name: surface.name, materialName: material.name, absorptivity, emissivity },
        physics: { name: surface.name, normal, areaM2: surface.areaM2, absorptivity, emissivity },
      };
    });
}

/** The saved orbit's canonical shape and angles: what the physics is given, whatever was typed. */
export function savedOrbitInput(orbit: OrbitRow, raanDeg = orbit.raanDeg): OrbitInput {
  return {
    semiMajorAxisKm: orbit.semiMajorAxisKm,
    eccentricity: orbit.eccentricity,
    inclinationDeg: orbit.inclinationDeg,
    raanDeg,
    argPeriapsisDeg: orbit.argPeriapsisDeg,
  };
}

export function savedEnvironment(db: Db, mission: MissionRow, orbit: OrbitRow, request: SavedEnvironmentRequest): SavedEnvironmentResponse {
  const list = missionSurfaces(db, mission.id, request.properties);
  limitWork([{ name: 'steps', count: request.steps }, { name: 'surfaces of the mission', count: list.length }], 'steps', 'use fewer steps');
  const result = computeEnvironment({
    bodyId: mission.bodyId,
    orbit: savedOrbitInput(orbit),
    epoch: orbit.epoch,
    steps: request.steps,
    // a saved eccentric orbit is plotted with its periapsis pass resolved
    sampling: request.sampling ?? (orbit.eccentricity >= ECCENTRIC_SAMPLING_FROM ? 'eccentric-anomaly' : 'time'),
    surfaces: list.map((s) => s.physics),
    ...(request.betaDeg !== undefined ? { betaDeg: request.betaDeg } : {}),
    ...(request.albedo !== undefined ? { albedo: request.albedo } : {}),
    ...(request.olrWm2 !== undefined ? { olrWm2: request.olrWm2 } : {}),
    ...(request.solarDistanceAu !== undefined ? { solarDistanceAu: request.solarDistanceAu } : {}),
  });
  const note = `optical properties: ${request.properties === 'eol' ? 'end of life (EOL)' : 'beginning of life (BOL)'} values of each surface's material`;
  return { ...result, assumptions: [...result.assumptions, note], properties: request.properties, surfaces: list.map((s) => s.label) };
}
