// The mission sweep: one orbit's environment on every day (or every stepDays) of a date range, with
// the node (and periapsis) drifting under J2 from the orbit's epoch and the Sun moving along the
// body's orbit; each day is sampled at 12:00 UTC. The physics is shared/physics/mission-sweep.ts;
// this file plans the range and computes it a chunk of days at a time, so the stream can yield.
// Sources: Vallado ch. 9 (J2 secular rates); Gilmore Vol. I ch. 2 (beta angle), via shared/physics.
import type { z } from 'zod';
import type { SweepDay, sweepQuery } from '../../shared/api/missions';
import { CAUTION } from '../../shared/physics/environment';
import { DAY_MS } from '../../shared/physics/constants';
import { DEFAULT_SWEEP_STEPS, sweepMission } from '../../shared/physics/mission-sweep';
import type { ViewFactorTable } from '../../shared/physics/pointing';
import type { MissionRow, OrbitRow } from '../db/schema';
import { badRequest } from '../errors';
import { limitWork } from '../work-limit';
import { savedOrbitInput, type MissionSurface } from './saved-environment';
import { normalsInMode, phaseSpanMs, type FlownPhase } from './phase-pointing';

type SweepQuery = z.output<typeof sweepQuery>;

/** The longest range a sweep covers: 40 years of days. */
export const MAX_SWEEP_DAYS = Math.floor(40 * 365.25);
// The compute route's default: the shared sweep is fast enough (well under 1 ms a day) to afford it.
export const SWEEP_STEPS = DEFAULT_SWEEP_STEPS;

export interface SweepPlan {
  from: string;
  to: string;
  stepDays: number;
  /** How many day lines the sweep writes. */
  days: number;
}

const dayMs = (date: string): number => Date.parse(`${date}T00:00:00Z`);
const isoDay = (ms: number): string => new Date(ms).toISOString().slice(0, 10);

/** The range to sweep: the query's dates or the mission's; 400 when reversed or longer than 40 years. */
export function planSweep(mission: MissionRow, query: SweepQuery): SweepPlan {
  const from = query.from ?? mission.startDate;
  const to = query.to ?? mission.endDate;
  if (!Number.isFinite(dayMs(from)) || !Number.isFinite(dayMs(to))) {
    const path = Number.isFinite(dayMs(from)) ? 'to' : 'from';
    const message = `${JSON.stringify(path === 'from' ? from : to)} is not a calendar date`;
    throw badRequest(`${path}: ${message}.`, [{ path, message }]);
  }
  if (to < from) {
    const message = `the sweep would end (${to}) before it starts (${from})`;
    throw badRequest(`to: ${message}.`, [{ path: 'to', message }]);
  }
  const spanDays = Math.round((dayMs(to) - dayMs(from)) / DAY_MS);
  if (spanDays > MAX_SWEEP_DAYS) {
    const message = `${from} to ${to} is ${spanDays} days; a sweep covers at most 40 years (${MAX_SWEEP_DAYS} days)`;
    throw badRequest(`to: ${message}.`, [{ path: 'to', message }]);
  }
  return { from, to, stepDays: query.stepDays, days: Math.floor(spanDays / query.stepDays) + 1 };
}

/** The albedo and IR models of the sweep in words (one day computed to learn them) and the caution. */
export function sweepAssumptions(mission: MissionRow, orbit: OrbitRow, plan: SweepPlan): string[] {
  const { assumptions } = sweepMission({
    bodyId: mission.bodyId, orbit: savedOrbitInput(orbit), orbitEpoch: orbit.epoch, epochStart: `${plan.from}T12:00:00Z`, days: 0, steps: SWEEP_STEPS,
  });
  return [...assumptions, CAUTION];
}

/**
 * Computes days [first, first + count) of the plan; the caller decides how many to do between yields.
 * A day within a phase takes the surfaces as the phase's attitude mode points them (its row names
 * the phase); a day in no phase the surfaces' own normals.
 */
export function sweepChunkComputer(
  mission: MissionRow, orbit: OrbitRow, plan: SweepPlan, surfaces: readonly MissionSurface[], phases: readonly FlownPhase[] = [],
): (first: number, count: number) => SweepDay[] {
  limitWork([{ name: 'days', count: plan.days }, { name: 'surfaces of the mission', count: surfaces.length }], 'stepDays', 'use a larger stepDays or a shorter range (from, to)');
  const physicsSurfaces = surfaces.map((s) => s.physics);
  const labelled = surfaces.map((s) => ({ id: s.label.id, name: s.label.name, normal: s.physics.normal }));
  // Each mode's pointing is checked and made once, one list per mode (phases in one mode share it), so
  // the physics prepares each mode once per chunk that meets it.
  const byMode = new Map<string, typeof physicsSurfaces>();
  const attitudeSpans = phases.map((f) => {
    let list = byMode.get(f.mode.id);
    if (list === undefined) {
      const normals = normalsInMode(labelled, f.mode);
      list = physicsSurfaces.map((s, i) => ({ ...s, normal: normals[i]! }));
      byMode.set(f.mode.id, list);
    }
    return { ...phaseSpanMs(f.phase), surfaces: list };
  });
  // the moving plates' view-factor tables, made in the first chunk that needs them and kept for the rest
  const viewFactorTables = new Map<string, ViewFactorTable>();
  return (first, count) => {
    const startDate = isoDay(dayMs(plan.from) + first * plan.stepDays * DAY_MS);
    const result = sweepMission({
      bodyId: mission.bodyId,
      orbit: savedOrbitInput(orbit),
      orbitEpoch: orbit.epoch,
      epochStart: `${startDate}T12:00:00Z`,
      days: (count - 1) * plan.stepDays,
      stepDays: plan.stepDays,
      steps: SWEEP_STEPS,
      surfaces: physicsSurfaces,
      attitudeSpans,
      viewFactorTables,
    });
    return result.rows.map((row, i) => ({
      type: 'day',
      index: first + i,
      date: row.date.slice(0, 10),
      betaDeg: row.betaDeg,
      eclipseFraction: row.eclipseFraction,
      eclipseDurationS: row.eclipseDurationS,
      solarDistanceAu: row.solarDistanceAu,
      solarFluxWm2: row.solarFluxWm2,
      surfaces: row.surfaces.map((load, j) => ({ surfaceId: surfaces[j]?.label.id ?? '', name: load.name, absorbedW: load.absorbedW })),
      longestShadowS: row.longestShadowS,
      longestShadowCastBy: row.longestShadowCastBy,
      longestShadowStart: row.longestShadowStart,
      phase: row.spanIndex === null ? null : (phases[row.spanIndex]?.phase.name ?? null),
    }));
  };
}
