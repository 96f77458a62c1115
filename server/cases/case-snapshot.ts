// What a load case keeps of its mission, read from the database: the orbit, the surfaces with their
// materials, the mission and its body. A case is computed from this snapshot alone, so it does not
// move when the mission changes later (case-currency.ts tells when it would).
import { and, eq, sql } from 'drizzle-orm';
import type { CaseInputs, StoredConditions } from '../../shared/api/case-content';
import { surfaceNormal } from '../../shared/api/missions';
import { getBody, solarDistanceRangeAu } from '../../shared/physics/bodies';
import type { CaseSurface } from '../../shared/physics/design-cases';
import type { DbOrTx } from '../db/database';
import { preparedPer } from '../db/prepared';
import { materials, orbits, surfaces, type MissionRow, type OrbitRow } from '../db/schema';
import { notFound, unprocessable } from '../errors';
import { limitWork, MAX_CASE_SAMPLES } from '../work-limit';

export interface MissionSnapshot {
  orbit: OrbitRow;
  surfaces: CaseSurface[];
}

/** A case's series hold steps × surfaces samples of each quantity: within what a load case may hold, or 413. */
export function limitCaseWork(steps: number, surfaceCount: number): void {
  limitWork([{ name: 'steps', count: steps }, { name: 'surfaces', count: surfaceCount }], 'steps', 'use fewer steps', MAX_CASE_SAMPLES);
}

/** The orbit and the surfaces a case is computed from, once steps × surfaces is within the limit. */
export function snapshotOf(db: DbOrTx, mission: MissionRow, orbitId: string, steps: number): MissionSnapshot {
  const orbit = db.select().from(orbits).where(and(eq(orbits.id, orbitId), eq(orbits.missionId, mission.id))).get();
  if (!orbit) throw notFound(`The mission "${mission.name}" has no orbit with id ${JSON.stringify(orbitId.slice(0, 80))}.`);
  const list = surfaceSnapshot(db, mission);
  limitCaseWork(steps, list.length);
  return { orbit, surfaces: list };
}

const surfacesWithMaterials = preparedPer((db: DbOrTx) =>
  db
    .select({ surface: surfaces, material: materials })
    .from(surfaces)
    .innerJoin(materials, eq(materials.id, surfaces.materialId))
    .where(eq(surfaces.missionId, sql.placeholder('missionId')))
    .orderBy(surfaces.createdAt, surfaces.name)
    .prepare(),
);

/** The mission's surfaces with their materials, as a case keeps them; 422 when there are none. */
export function surfaceSnapshot(db: DbOrTx, mission: MissionRow): CaseSurface[] {
  const rows = surfacesWithMaterials(db).all({ missionId: mission.id });
  if (rows.length === 0) {
    throw unprocessable(`The mission "${mission.name}" has no spacecraft surfaces yet; add them before deriving load cases.`, [
      { path: 'missionId', message: 'no surfaces' },
    ]);
  }
  return rows.map(({ surface, material }) => ({
    name: surface.name,
    // Stored as JSON text; checked against the contract's normals on the way out.
    normal: surfaceNormal.parse(surface.normal),
    areaM2: surface.areaM2,
    material: {
      name: material.name,
      absorptivityBol: material.absorptivityBol,
      emissivityBol: material.emissivityBol,
      absorptivityEol: material.absorptivityEol,
      emissivityEol: material.emissivityEol,
      source: material.source,
    },
  }));
}

/** The mission and its body as a case records them. */
export function missionInputs(mission: MissionRow): Pick<CaseInputs, 'mission' | 'body'> {
  const body = getBody(mission.bodyId);
  return {
    mission: { id: mission.id, name: mission.name, startDate: mission.startDate, endDate: mission.endDate, crewed: mission.crewed },
    body: {
      id: body.id, name: body.name, gmKm3S2: body.gmKm3S2, radiusKm: body.radiusKm, j2: body.j2,
      solarDistanceAu: solarDistanceRangeAu(body), albedo: { ...body.albedo }, olrWm2: { ...body.olrWm2 },
      provisional: body.provisional, sources: { ...body.sources },
    },
  };
}

/** The mission, its body and the stored orbit as a case records them. */
export function orbitInputs(mission: MissionRow, orbit: OrbitRow): Pick<CaseInputs, 'mission' | 'body' | 'orbit'> {
  return {
    ...missionInputs(mission),
    orbit: {
      id: orbit.id, name: orbit.name, epoch: orbit.epoch, periapsisAltitudeKm: orbit.periapsisAltitudeKm,
      apoapsisAltitudeKm: orbit.apoapsisAltitudeKm, semiMajorAxisKm: orbit.semiMajorAxisKm, eccentricity: orbit.eccentricity,
      periodS: orbit.periodS, inclinationDeg: orbit.inclinationDeg, raanDeg: orbit.raanDeg, argPeriapsisDeg: orbit.argPeriapsisDeg,
    },
  };
}

/** The stored orbit's elements, as a case's conditions hold them. */
export const orbitElements = (orbit: OrbitRow): StoredConditions['orbit'] => ({
  semiMajorAxisKm: orbit.semiMajorAxisKm, eccentricity: orbit.eccentricity, inclinationDeg: orbit.inclinationDeg, raanDeg: orbit.raanDeg, argPeriapsisDeg: orbit.argPeriapsisDeg,
});
