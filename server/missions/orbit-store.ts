// Orbits of a mission: kept as typed (input) beside their canonical values, which are computed for
// the mission's body before anything is written, so a refused orbit leaves no row behind.
import { asc, eq, sql } from 'drizzle-orm';
import type { z } from 'zod';
import type { Orbit, orbitCreate, orbitUpdate } from '../../shared/api/missions';
import { getBody } from '../../shared/physics/bodies';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { orbits, type MissionRow } from '../db/schema';
import { missionFor, orbitOf } from './mission-access';
import { toOrbit } from './mission-responses';
import { withQuantityReader } from './quantity-reader';
import { canonicalOrbit, mergedFields, orbitFieldNames, type CanonicalOrbit, type OrbitFields } from './orbit-values';

type OrbitCreate = z.output<typeof orbitCreate>;
type OrbitUpdate = z.output<typeof orbitUpdate>;

/** The orbit fields of a request body, as typed (name and epoch left out). */
function typedFields(input: OrbitUpdate): OrbitFields {
  const fields: OrbitFields = {};
  for (const [name, value] of Object.entries(input)) {
    if (orbitFieldNames.includes(name) && (typeof value === 'number' || typeof value === 'string')) fields[name] = value;
  }
  return fields;
}

const summaryOf = (orbit: CanonicalOrbit): string =>
  `${orbit.periapsisAltitudeKm.toFixed(1)} x ${orbit.apoapsisAltitudeKm.toFixed(1)} km, i ${orbit.inclinationDeg.toFixed(2)} deg`;

export function listOrbits(db: Db, missionId: string): Orbit[] {
  return db.select().from(orbits).where(eq(orbits.missionId, missionId)).orderBy(asc(orbits.createdAt), sql`"orbits".rowid`).all().map(toOrbit);
}

export function createOrbit(db: Db, userId: string, missionId: string, input: OrbitCreate): Promise<Orbit> {
  return withQuantityReader((read) => db.transaction((tx) => {
    const { mission } = missionFor(tx, userId, missionId, 'edit');
    const fields = typedFields(input);
    const values = canonicalOrbit(fields, getBody(mission.bodyId), read);
    const row = tx
      .insert(orbits)
      .values({ missionId: mission.id, name: input.name, epoch: input.epoch, input: fields, ...values })
      .returning()
      .get();
    audit(tx, userId, mission, 'orbit.created', row.id, `Orbit "${row.name}" added to mission "${mission.name}": ${summaryOf(values)}.`);
    return toOrbit(row);
  }));
}

export function updateOrbit(db: Db, userId: string, missionId: string, orbitId: string, input: OrbitUpdate): Promise<Orbit> {
  return withQuantityReader((read) => db.transaction((tx) => {
    const { mission } = missionFor(tx, userId, missionId, 'edit');
    const orbit = orbitOf(tx, mission.id, orbitId);
    const change = typedFields(input);
    const fields = Object.keys(change).length > 0 ? mergedFields(orbit.input, change) : orbit.input;
    const values = canonicalOrbit(fields, getBody(mission.bodyId), read);
    const changed = [
      ...(input.name !== undefined && input.name !== orbit.name ? [`renamed "${orbit.name}" -> "${input.name}"`] : []),
      ...(input.epoch !== undefined && input.epoch !== orbit.epoch ? [`epoch ${orbit.epoch} -> ${input.epoch}`] : []),
      ...Object.entries(change).map(([name, value]) => `${name} ${JSON.stringify(orbit.input[name] ?? null)} -> ${JSON.stringify(value)}`),
    ];
    const row = tx
      .update(orbits)
      .set({ name: input.name ?? orbit.name, epoch: input.epoch ?? orbit.epoch, input: fields, ...values, updatedAt: new Date().toISOString() })
      .where(eq(orbits.id, orbit.id))
      .returning()
      .get();
    const what = changed.length > 0 ? changed.join('; ') : 'saved unchanged';
    audit(tx, userId, mission, 'orbit.updated', row.id, `Orbit "${row.name}" of mission "${mission.name}": ${what} (now ${summaryOf(values)}).`);
    return toOrbit(row);
  }));
}

export function deleteOrbit(db: Db, userId: string, missionId: string, orbitId: string): void {
  db.transaction((tx) => {
    const { mission } = missionFor(tx, userId, missionId, 'edit');
    const orbit = orbitOf(tx, mission.id, orbitId);
    tx.delete(orbits).where(eq(orbits.id, orbit.id)).run();
    audit(tx, userId, mission, 'orbit.deleted', orbit.id, `Orbit "${orbit.name}" removed from mission "${mission.name}".`);
  });
}

function audit(tx: Parameters<typeof recordAudit>[0], userId: string, mission: MissionRow, action: string, targetId: string, summary: string): void {
  recordAudit(tx, { workspaceId: mission.workspaceId, actorUserId: userId, action, targetType: 'orbit', targetId, summary });
}
