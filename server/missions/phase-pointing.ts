// The mission's phases made ready for computing: each phase with its attitude mode, and the normal
// every surface computes with in that mode (shared/physics/attitude-modes.ts), checked against the
// shared schema of a normal -- the one the compute route takes -- so a pointing the physics cannot
// compute is refused with a 422 naming the mode and its field, never computed half.
import { surfaceNormal, type SurfaceNormal } from '../../shared/api/missions';
import type { CasePhase } from '../../shared/api/phases';
import { pointedNormals } from '../../shared/physics/attitude-modes';
import type { AttitudeModeRow, MissionPhaseRow, MissionRow } from '../db/schema';
import { unprocessable } from '../errors';
import type { Db } from '../db/database';
import { modeRowsOf, phaseRowsOf } from './phase-store';

export interface FlownPhase {
  phase: MissionPhaseRow;
  mode: AttitudeModeRow;
}

const DAY_MS = 86_400_000;

/** The mission's phases by start date, each with its mode. */
export function flownPhases(db: Pick<Db, 'select'>, mission: MissionRow): FlownPhase[] {
  const modes = new Map(modeRowsOf(db, mission.id).map((m) => [m.id, m]));
  return phaseRowsOf(db, mission.id).flatMap((phase) => {
    const mode = modes.get(phase.modeId);
    return mode ? [{ phase, mode }] : [];
  });
}

/** The instants a phase covers: from 00:00 UTC of its first day to 24:00 UTC of its last. */
export const phaseSpanMs = (p: MissionPhaseRow): { fromMs: number; toMs: number } => ({
  fromMs: Date.parse(`${p.startDate}T00:00:00Z`),
  toMs: Date.parse(`${p.endDate}T00:00:00Z`) + DAY_MS,
});

/**
 * The normals of `surfaces` (the mission's, by id) in `mode`, each one the compute route accepts;
 * 422 naming the mode's field when one is not (yaw steering before the server computes it).
 */
export function normalsInMode(surfaces: readonly { id: string; name: string; normal: unknown }[], mode: AttitudeModeRow): SurfaceNormal[] {
  const wanted = pointedNormals(surfaces, mode);
  return wanted.map((normal, i) => {
    const parsed = surfaceNormal.safeParse(normal);
    if (parsed.success) return parsed.data;
    const surface = surfaces[i]!;
    const listed = mode.pointing.findIndex((p) => p.surfaceId === surface.id);
    const path = mode.yawSteering ? 'yawSteering' : `pointing.${listed}.normal`;
    const why = mode.yawSteering ? 'this server does not compute yaw-steered normals yet; turn yaw steering off for this mode' : 'the pointing is not one the environment computation takes';
    throw unprocessable(
      `Attitude mode "${mode.name}": surface "${surface.name}" pointed ${JSON.stringify(normal)} cannot be computed: ${why}.`,
      [{ path, message: `surface "${surface.name}": ${why}` }],
    );
  });
}

/** A phase as a case keeps it. */
export const casePhaseOf = ({ phase, mode }: FlownPhase): CasePhase => ({
  id: phase.id, name: phase.name, startDate: phase.startDate, endDate: phase.endDate,
  mode: { id: mode.id, name: mode.name, yawSteering: mode.yawSteering },
  dissipation: phase.dissipation,
});
