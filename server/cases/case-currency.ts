// Is a case still current with its mission? The inputs a case was made from (its snapshot of the
// surfaces with their materials, the orbit, the body's constants and the mission's dates) against
// the mission as it is now, as a list of changes in words. A case from an ephemeris compares its
// surfaces and body only (its orbit is the trajectory's), and whether its ephemeris is still there.
// A case chosen among a mission's phases also compares every phase the choice weighed (dates, mode,
// the normals the mode gives, dissipation; a phase added or deleted): a change to another phase can
// change which phase drives it. A phase's name does not enter the choice, so renaming is no change.
import { and, eq, sql } from 'drizzle-orm';
import type { CaseInputs } from '../../shared/api/case-content';
import type { Db } from '../db/database';
import { preparedPer } from '../db/prepared';
import { ephemerides, loadCases, missions, orbits, type MissionRow, type OrbitRow } from '../db/schema';
import { canonicalJson } from './canonical-json';
import { missionInputs, surfaceSnapshotWithIds } from './case-snapshot';
import { flownPhases, normalsInMode, type FlownPhase } from '../missions/phase-pointing';
import type { SurfaceNormal } from '../../shared/api/missions';
import { phaseDissipationW, survivalDissipation } from '../../shared/physics/phase-cases';
import { round } from '../../shared/physics/rounding';

const isObject = (v: unknown): v is object => v !== null && typeof v === 'object';
/** Equal as stored: numbers and texts directly, ranges and vectors by their canonical JSON. */
const same = (a: unknown, b: unknown) => a === b || (isObject(a) && isObject(b) && canonicalJson(a) === canonicalJson(b));

function changed(label: string, was: unknown, now: unknown, unit = ''): string | null {
  if (same(was, now)) return null;
  const show = (v: unknown) => (typeof v === 'number' || typeof v === 'string' ? `${v}${unit}` : 'the values given');
  return `${label}: ${show(was)} -> ${show(now)}`;
}

/** A mission as it is now: what a case's inputs are compared with. */
interface MissionNow {
  mission: MissionRow;
  inputs: ReturnType<typeof missionInputs>;
  orbits: Map<string, OrbitRow>;
  /** The mission's surfaces with their ids, as a case keeps them. */
  surfaces: ReturnType<typeof surfaceSnapshotWithIds>;
  ephemerisIds: Set<string>;
  phases: FlownPhase[];
  /** Phase id -> the surfaces' normals in its mode now (null: cannot be computed); filled as asked. */
  pointed: Map<string, SurfaceNormal[] | null>;
}

const missionById = preparedPer((db: Db) => db.select().from(missions).where(eq(missions.id, sql.placeholder('id'))).prepare());
const orbitsOfMission = preparedPer((db: Db) => db.select().from(orbits).where(eq(orbits.missionId, sql.placeholder('missionId'))).prepare());
const ephemerisIdsOfMission = preparedPer((db: Db) => db.select({ id: ephemerides.id }).from(ephemerides).where(eq(ephemerides.missionId, sql.placeholder('missionId'))).prepare());

/**
 * Reads each mission once however many of its cases are compared (a case list compares every case
 * it lists); make one per request, so every request sees the database as it is.
 */
export function missionsNow(db: Db): (missionId: string) => MissionNow | null {
  const read = new Map<string, MissionNow | null>();
  return (missionId) => {
    let found = read.get(missionId);
    if (found === undefined) {
      const mission = missionById(db).get({ id: missionId });
      found = mission
        ? {
            mission, inputs: missionInputs(mission), orbits: new Map(orbitsOfMission(db).all({ missionId }).map((o) => [o.id, o])), surfaces: currentSurfaces(db, mission),
            ephemerisIds: new Set(ephemerisIdsOfMission(db).all({ missionId }).map((e) => e.id)),
            phases: flownPhases(db, mission), pointed: new Map(),
          }
        : null;
      read.set(missionId, found);
    }
    return found;
  };
}

function currentSurfaces(db: Db, mission: MissionRow): ReturnType<typeof surfaceSnapshotWithIds> {
  try {
    return surfaceSnapshotWithIds(db, mission);
  } catch {
    // The mission has no surfaces left (422 when deriving); every surface of the case was removed.
    return [];
  }
}

/** The parts of a case's inputs the comparison reads (the case list reads only these). */
export type CurrencyInputs = Pick<CaseInputs, 'mission' | 'body' | 'orbit'> & {
  conditions: Pick<CaseInputs['conditions'], 'surfaces'>;
  /** null when cut out of a case that has none */
  ephemeris?: CaseInputs['ephemeris'] | null;
  handEdited?: CaseInputs['handEdited'] | null;
  fixed?: CaseInputs['fixed'] | null;
  /** A phase's case: the phase as it was. */
  phase?: CaseInputs['phase'] | null;
  /** A case chosen among the phases: every phase as it was when chosen. */
  phases?: CaseInputs['phases'] | null;
  decision?: CaseInputs['decision'] | null;
};

const inputsOfCase = preparedPer((db: Db) => db.select({ inputs: loadCases.inputs, version: loadCases.version }).from(loadCases).where(eq(loadCases.id, sql.placeholder('id'))).prepare());
const keptInputs = preparedPer((_db: Db) => new Map<string, { version: number; inputs: CaseInputs }>());
const MAX_KEPT_INPUTS = 10_000;

/**
 * A case's inputs, read and parsed once per case and version (about 12 kB of JSON a case, which
 * parsing on every case list cost more than the rest of the request). Every write to a case adds one
 * to its version, in this process or another, so a kept copy is never used for a changed case.
 */
export function caseInputsOf(db: Db, caseId: string, version: number): CaseInputs {
  const kept = keptInputs(db);
  const found = kept.get(caseId);
  if (found && found.version === version) return found.inputs;
  const row = inputsOfCase(db).get({ id: caseId });
  if (!row) throw new Error(`case ${caseId} vanished while it was listed`);
  if (kept.size >= MAX_KEPT_INPUTS) kept.clear();
  // Kept under the version read with them (a write may have come between the list and this read).
  kept.set(caseId, { version: row.version, inputs: row.inputs });
  return row.inputs;
}

/** What changed in the mission since the case was made; empty when it is current (or the mission is gone). */
export function inputChanges(db: Db, row: { missionId: string; inputs: CurrencyInputs }, missionNow = missionsNow(db)): string[] {
  const found = missionNow(row.missionId);
  if (!found) return [];
  const { inputs: now, surfaces: listed } = found;
  const i = row.inputs;
  const out: (string | null)[] = [];
  out.push(changed('mission start', i.mission.startDate, now.mission.startDate), changed('mission end', i.mission.endDate, now.mission.endDate));
  for (const k of ['gmKm3S2', 'radiusKm', 'j2'] as const) out.push(changed(`${i.body.name} ${k === 'gmKm3S2' ? 'GM' : k === 'radiusKm' ? 'radius' : 'J2'}`, i.body[k], now.body[k]));
  out.push(changed(`${i.body.name} albedo range`, i.body.albedo, now.body.albedo), changed(`${i.body.name} OLR range`, i.body.olrWm2, now.body.olrWm2));
  if (!i.ephemeris && i.orbit.id) {
    const orbit = found.orbits.get(i.orbit.id);
    if (!orbit) out.push(`orbit "${i.orbit.name}" was deleted`);
    else {
      const fields = [['semiMajorAxisKm', 'semi-major axis', ' km'], ['eccentricity', 'eccentricity', ''], ['inclinationDeg', 'inclination', ' deg'], ['raanDeg', 'RAAN', ' deg'], ['argPeriapsisDeg', 'argument of periapsis', ' deg'], ['epoch', 'epoch', '']] as const;
      for (const [key, label, unit] of fields) out.push(changed(`orbit "${i.orbit.name}" ${label}`, i.orbit[key], orbit[key], unit));
    }
  }
  if (i.ephemeris && !found.ephemerisIds.has(i.ephemeris.id)) out.push(`ephemeris "${i.ephemeris.name}" was deleted`);
  const current = i.phase ? phaseChanges(i.phase, i.orbit.periodS, found, out) : listed.map((x) => x.surface);
  if (i.phases) comparedPhaseChanges(i.phases, i, found, out);
  if (i.phase && i.decision?.survival) survivalChanges(i.decision.survival.nodes, found, out);
  const was = i.conditions.surfaces;
  for (const s of was) {
    const c = current.find((x) => x.name === s.name);
    if (!c) {
      out.push(`surface "${s.name}" was removed`);
      continue;
    }
    out.push(changed(`surface "${s.name}" area`, s.areaM2, c.areaM2, ' m²'));
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

/**
 * Why a new revision cannot be computed again from the mission's current inputs: the ephemeris or
 * the orbit it was computed on was deleted (the route's 409 and the case page say it); null when it can.
 */
export function rederivationBlocked(db: Db, row: { missionId: string; inputs: CurrencyInputs }): string | null {
  const i = row.inputs;
  const keep = 'a new revision can keep its stored inputs and loads only';
  if (i.ephemeris) {
    const kept = db.select({ id: ephemerides.id }).from(ephemerides).where(and(eq(ephemerides.id, i.ephemeris.id), eq(ephemerides.missionId, row.missionId))).get();
    if (kept) return null;
    return `The ephemeris "${i.ephemeris.name}" this case was computed along was deleted from the mission: ${keep}, or upload the file again and make a new case from it.`;
  }
  const orbit = i.orbit.id ? db.select({ id: orbits.id }).from(orbits).where(and(eq(orbits.id, i.orbit.id), eq(orbits.missionId, row.missionId))).get() : undefined;
  if (orbit) return null;
  return `The orbit "${i.orbit.name}" this case was computed on was deleted from the mission: ${keep}, or add the orbit again and make a new case on it.`;
}

/** A phase named as the case knew it, with its name now when renamed since (a name alone is no change). */
const phaseLabel = (was: { name: string }, now: FlownPhase) =>
  now.phase.name === was.name ? `phase "${was.name}"` : `phase "${was.name}" (now "${now.phase.name}")`;

/** A phase's dates and attitude mode against what the case knew of them. */
function datesAndMode(label: string, was: { startDate: string; endDate: string; mode: { id: string; name: string } }, now: FlownPhase, out: (string | null)[]): void {
  out.push(changed(`${label} start`, was.startDate, now.phase.startDate), changed(`${label} end`, was.endDate, now.phase.endDate));
  if (now.mode.id !== was.mode.id) out.push(`${label} attitude mode: ${was.mode.name} -> ${now.mode.name}`);
}

/** The orbit-average dissipation of a phase's nodes, W, as a case keeps it (over the case's orbit). */
const dissipationTotalW = (dissipation: FlownPhase['phase']['dissipation'], periodS: number) => round(phaseDissipationW(dissipation, periodS), 3);

/** A phase's dissipation total changed, to 0.1 W as "why this case" shows it (to 0.001 W when that hides the change). */
function dissipationChanged(label: string, was: number, now: number): string | null {
  if (was === now) return null;
  const digits = round(was, 1) === round(now, 1) ? 3 : 1;
  return changed(`${label} dissipation`, round(was, digits), round(now, digits), ' W');
}

/** The mission's surfaces' normals in a phase's mode now, computed once per request; null when the mode cannot be computed. */
function pointedNow(found: MissionNow, flown: FlownPhase): SurfaceNormal[] | null {
  let normals = found.pointed.get(flown.phase.id);
  if (normals === undefined) {
    try {
      normals = normalsInMode(found.surfaces.map((x) => ({ id: x.id, name: x.surface.name, normal: x.surface.normal })), flown.mode);
    } catch {
      normals = null;
    }
    found.pointed.set(flown.phase.id, normals);
  }
  return normals;
}

/**
 * A phase's case: what changed in its phase (dates, mode, dissipation), written to `out`; answers the
 * mission's surfaces as the phase's mode points them now (their own normals when it cannot be computed).
 */
function phaseChanges(was: NonNullable<CaseInputs['phase']>, periodS: number, found: MissionNow, out: (string | null)[]): ReturnType<typeof surfaceSnapshotWithIds>[number]['surface'][] {
  const own = found.surfaces.map((x) => x.surface);
  const now = found.phases.find((f) => f.phase.id === was.id);
  if (!now) {
    out.push(`phase "${was.name}" was deleted`);
    return own;
  }
  const label = phaseLabel(was, now);
  datesAndMode(label, was, now, out);
  if (!same(was.dissipation, now.phase.dissipation)) {
    // the total when it changed; a node's share moved with the same total, in words
    out.push(dissipationChanged(label, dissipationTotalW(was.dissipation, periodS), dissipationTotalW(now.phase.dissipation, periodS)) ?? `${label} dissipation of its nodes changed (same total)`);
  }
  const normals = pointedNow(found, now);
  if (!normals) {
    out.push(`attitude mode "${now.mode.name}" can no longer be computed`);
    return own;
  }
  return own.map((c, k) => ({ ...c, normal: normals[k]! }));
}

/**
 * A case chosen among the phases: what changed in the other phases since (their dates, modes, the
 * normals their modes give, their dissipation; a phase added or deleted), any of which can change
 * which phase drives the case. Its own phase is phaseChanges'.
 */
function comparedPhaseChanges(was: NonNullable<CaseInputs['phases']>, i: CurrencyInputs, found: MissionNow, out: (string | null)[]): void {
  for (const w of was) {
    if (w.id === i.phase?.id) continue;
    const now = found.phases.find((f) => f.phase.id === w.id);
    if (!now) {
      out.push(`phase "${w.name}" was deleted`);
      continue;
    }
    const label = phaseLabel(w, now);
    datesAndMode(label, w, now, out);
    // the survival case's phase is chosen by the absorbed load alone; its dissipation is survivalChanges'
    if (i.decision?.phase?.by !== 'environment') out.push(dissipationChanged(label, w.dissipationW, dissipationTotalW(now.phase.dissipation, i.orbit.periodS)));
    const normals = pointedNow(found, now);
    if (!normals) out.push(`attitude mode "${now.mode.name}" can no longer be computed`);
    else found.surfaces.forEach((x, k) => {
      const before = w.normals[x.surface.name];
      if (before !== undefined && !same(before, normals[k])) out.push(`${label}: surface "${x.surface.name}" pointing changed`);
    });
  }
  for (const f of found.phases) if (!was.some((w) => w.id === f.phase.id)) out.push(`phase "${f.phase.name}" was added`);
}

/** A survival cold case: each node's least dissipation over the phases, as the phases give it now. */
function survivalChanges(was: { node: string; dissipationW: number }[], found: MissionNow, out: (string | null)[]): void {
  const now = survivalDissipation(found.phases.map((f) => f.phase)).nodes;
  for (const w of was) {
    const n = now.find((x) => x.node === w.node);
    out.push(n ? changed(`survival dissipation of node "${w.node}"`, w.dissipationW, n.dissipationW, ' W') : `survival dissipation: no phase names node "${w.node}" any more`);
  }
  for (const n of now) if (!was.some((w) => w.node === n.node)) out.push(`survival dissipation: node "${n.node}" was added (${n.dissipationW} W)`);
}
