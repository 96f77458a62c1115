// Rows as the API answers them (shared/api/missions.ts): archived as a boolean, JSON columns as values.
import type { Material, Mission, Orbit, Surface, SurfaceNormal } from '../../shared/api/missions';
import type { MaterialRow, MissionRow, OrbitRow, SurfaceRow } from '../db/schema';

export const toMission = (row: MissionRow): Mission => ({
  id: row.id,
  workspaceId: row.workspaceId,
  name: row.name,
  bodyId: row.bodyId,
  description: row.description,
  startDate: row.startDate,
  endDate: row.endDate,
  crewed: row.crewed,
  archived: row.archivedAt !== null,
  createdAt: row.createdAt,
  updatedAt: row.updatedAt,
});

export const toOrbit = (row: OrbitRow): Orbit => ({
  id: row.id,
  missionId: row.missionId,
  name: row.name,
  definition: row.definition,
  input: row.input,
  epoch: row.epoch,
  periapsisAltitudeKm: row.periapsisAltitudeKm,
  apoapsisAltitudeKm: row.apoapsisAltitudeKm,
  semiMajorAxisKm: row.semiMajorAxisKm,
  eccentricity: row.eccentricity,
  periodS: row.periodS,
  inclinationDeg: row.inclinationDeg,
  raanDeg: row.raanDeg,
  argPeriapsisDeg: row.argPeriapsisDeg,
  createdAt: row.createdAt,
  updatedAt: row.updatedAt,
});

export const toSurface = (row: SurfaceRow): Surface => ({
  id: row.id,
  missionId: row.missionId,
  name: row.name,
  areaM2: row.areaM2,
  // The column holds what surfaceNormal accepted: a named normal or a unit vector.
  normal: row.normal as SurfaceNormal,
  materialId: row.materialId,
  createdAt: row.createdAt,
  updatedAt: row.updatedAt,
});

export const toMaterial = (row: MaterialRow): Material => ({
  id: row.id,
  workspaceId: row.workspaceId,
  name: row.name,
  absorptivityBol: row.absorptivityBol,
  emissivityBol: row.emissivityBol,
  absorptivityEol: row.absorptivityEol,
  emissivityEol: row.emissivityEol,
  source: row.source,
});
