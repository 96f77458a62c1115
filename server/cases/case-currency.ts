// Is a case still current with its mission? The inputs a case was made from (its snapshot of the
// surfaces with their materials, the orbit, the body's constants and the mission's dates) against
// the mission as it is now, as a list of changes in words. A case from an ephemeris compares its
// surfaces and body only (its orbit is the trajectory's), and whether its ephemeris is still there.
import { and, eq } from 'drizzle-orm';
import type { CaseInputs } from '../../shared/api/case-content';
import type { Db } from '../db/database';
import { ephemerides, missions, orbits, type LoadCaseRow } from '../db/schema';
import { canonicalJson } from './canonical-json';
import { missionInputs, surfaceSnapshot } from './case-derivation';

const same = (a: unknown, b: unknown) => canonicalJson(a) === canonicalJson(b);

function changed(label: string, was: unknown, now: unknown, unit = ''): string | null {
  if (same(was, now)) return null;
  const show = (v: unknown) => (typeof v === 'number' || typeof v === 'string' ? `${v}${unit}` : 'the values given');
  return `${label}: ${show(was)} -> ${show(now)}`;
}

/** What changed in the mission since the case was made; empty when it is current (or the mission is gone). */
export function inputChanges(db: Db, row: Pick<LoadCaseRow, 'missionId' | 'inputs'>): string[] {
  const mission = db.select().from(missions).where(eq(missions.id, row.missionId)).get();
  if (!mission) return [];
  const i: CaseInputs = row.inputs;
  const out: (string | null)[] = [];
  const now = missionInputs(mission);
  out.push(changed('mission start', i.mission.startDate, now.mission.startDate), changed('mission end', i.mission.endDate, now.mission.endDate));
  for (const k of ['gmKm3S2', 'radiusKm', 'j2'] as const) out.push(changed(`${i.body.name} ${k === 'gmKm3S2' ? 'GM' : k === 'radiusKm' ? 'radius' : 'J2'}`, i.body[k], now.body[k]));
  out.push(changed(`${i.body.name} albedo range`, i.body.albedo, now.body.albedo), changed(`${i.body.name} OLR range`, i.body.olrWm2, now.body.olrWm2));
  if (!i.ephemeris && i.orbit.id) {
    const orbit = db.select().from(orbits).where(and(eq(orbits.id, i.orbit.id), eq(orbits.missionId, mission.id))).get();
    if (!orbit) out.push(`orbit "${i.orbit.name}" was deleted`);
    else {
      const fields = [['semiMajorAxisKm', 'semi-major axis', ' km'], ['eccentricity', 'eccentricity', ''], ['inclinationDeg', 'inclination', ' deg'], ['raanDeg', 'RAAN', ' deg'], ['argPeriapsisDeg', 'argument of periapsis', ' deg'], ['epoch', 'epoch', '']] as const;
      for (const [key, label, unit] of fields) out.push(changed(`orbit "${i.orbit.name}" ${label}`, i.orbit[key], orbit[key], unit));
    }
  }
  if (i.ephemeris && !ephemerisKept(db, row.missionId, i.ephemeris.id)) out.push(`ephemeris "${i.ephemeris.name}" was deleted`);
  let current: ReturnType<typeof surfaceSnapshot>;
  try {
    current = surfaceSnapshot(db, mission);
  } catch {
    // The mission has no surfaces left (422 when deriving); every surface of the case was removed.
    current = [];
  }
  const was = i.conditions.surfaces;
  for (const s of was) {
    const c = current.find((x) => x.name === s.name);
    if (!c) {
      out.push(`surface "${s.name}" was removed`);
      continue;
    }
    out.push(changed(`surface "${s.name}" area`, s.areaM2, c.areaM2, ' m^2'));
    if (!same(s.normal, c.normal) && !i.handEdited?.includes('surfaces') && !i.fixed?.normals?.[s.name]) out.push(`surface "${s.name}" pointing changed`);
    if (s.material.name !== c.material.name) out.push(`surface "${s.name}" material: ${s.material.name} -> ${c.material.name}`);
    else {
      for (const k of ['absorptivityBol', 'emissivityBol', 'absorptivityEol', 'emissivityEol'] as const) {
        out.push(changed(`${s.material.name} ${k.replace(/(Bol|Eol)$/, (m) => ` ${m.toUpperCase()}`)}`, s.material[k], c.material[k]));
      }
    }
  }
  for (const c of current) if (!was.some((s) => s.name === c.name)) out.push(`surface "${c.name}" was added`);
  return [...new Set(out.filter((x): x is string => x !== null))];
}

const ephemerisKept = (db: Db, missionId: string, id: string): boolean =>
  !!db.select({ id: ephemerides.id }).from(ephemerides).where(and(eq(ephemerides.id, id), eq(ephemerides.missionId, missionId))).get();

/**
 * Why a new revision cannot be computed again from the mission's current inputs: the ephemeris or
 * the orbit it was computed on was deleted (the route's 409 and the case page say it); null when it can.
 */
export function rederivationBlocked(db: Db, row: Pick<LoadCaseRow, 'missionId' | 'inputs'>): string | null {
  const i = row.inputs;
  const keep = 'a new revision can keep its stored inputs and loads only';
  if (i.ephemeris) {
    if (ephemerisKept(db, row.missionId, i.ephemeris.id)) return null;
    return `The ephemeris "${i.ephemeris.name}" this case was computed along was deleted from the mission: ${keep}, or upload the file again and make a new case from it.`;
  }
  const orbit = i.orbit.id ? db.select({ id: orbits.id }).from(orbits).where(and(eq(orbits.id, i.orbit.id), eq(orbits.missionId, row.missionId))).get() : undefined;
  if (orbit) return null;
  return `The orbit "${i.orbit.name}" this case was computed on was deleted from the mission: ${keep}, or add the orbit again and make a new case on it.`;
}
