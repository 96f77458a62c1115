// The day-by-day scan of a mission's date range a design case is chosen from: the beta angle with
// the node drifting under J2 and the Sun moving, and the body's distance from the Sun.
// Leaves out: drag and every perturbation but J2's secular node drift (see beta-angle.ts).
// Sources: Gilmore Vol. I ch. 2 (beta angle); Vallado ch. 9 (J2 nodal regression); VSOP87 (sun.ts).
import type { AnyBodyId, Body } from './bodies';
import { missionDays, type MissionDays } from './mission-days';
import type { Orbit } from './orbit-definition';
import { PhysicsError } from './physics-error';
import { DEG, wrapDeg } from './vector3';
import { DAY_MS } from './constants';

export interface ScanDay {
  /** YYYY-MM-DD; the sample is taken at 12:00 UTC. */
  date: string;
  betaDeg: number;
  raanDeg: number;
  solarDistanceAu: number;
  /** About a moon: the longest shadow its planet takes part in that day (mission-days.ts), or null. */
  parentShadow: { durationS: number; startMs: number; castBy: AnyBodyId[]; parentS: number; parentMiddleMs: number } | null;
}

// Beyond about ten years of daily samples the scan steps more coarsely; beta moves slowly enough.
const MAX_SAMPLES = 3700;

const noon = (date: string): Date => new Date(`${date}T12:00:00Z`);

function checkDate(date: string, path: string): Date {
  const d = noon(date);
  if (!/^\d{4}-\d{2}-\d{2}$/.test(date) || !Number.isFinite(d.getTime())) {
    throw new PhysicsError('invalid_quantity', `${path} must be a date like 2028-03-20, got "${date}"`, [{ path, message: `not a date: "${date}"` }]);
  }
  return d;
}

export { raanOnDateRad } from './mission-days';


/** One sample a day (coarser for very long missions) from startDate to endDate inclusive. */
export function scanMission(body: Body, orbit: Orbit, orbitEpoch: Date, startDate: string, endDate: string): ScanDay[] {
  const start = checkDate(startDate, 'startDate');
  const end = checkDate(endDate, 'endDate');
  if (end < start) {
    throw new PhysicsError('invalid_quantity', `the mission ends (${endDate}) before it starts (${startDate})`, [
      { path: 'endDate', message: 'before the start date' },
    ]);
  }
  const days = Math.round((end.getTime() - start.getTime()) / DAY_MS);
  const stepDays = Math.max(1, Math.ceil((days + 1) / MAX_SAMPLES));
  const out: ScanDay[] = [];
  const scan = missionDays(body, orbit, orbitEpoch.getTime(), start.getTime(), end.getTime());
  for (let k = 0; k <= days; k += stepDays) out.push(sample(scan, start.getTime() + k * DAY_MS, stepDays));
  // The last day always counts: a perihelion or a beta peak may sit on it.
  if (days % stepDays !== 0) out.push(sample(scan, end.getTime(), 1));
  return out;
}

function sample(scan: MissionDays, ms: number, stepDays: number): ScanDay {
  const day = scan.at(ms);
  const halfWindowMs = (stepDays * DAY_MS) / 2;
  let parentShadow: ScanDay['parentShadow'] = null;
  for (const span of scan.parentSpans(ms - halfWindowMs, ms + halfWindowMs)) {
    if (!parentShadow || span.durationS > parentShadow.durationS) parentShadow = {
      durationS: span.durationS, startMs: span.startMs, castBy: span.castBy, parentS: span.parentS, parentMiddleMs: span.parentMiddleMs,
    };
  }
  return {
    date: new Date(ms).toISOString().slice(0, 10),
    betaDeg: day.betaDeg,
    raanDeg: wrapDeg(day.raanRad / DEG),
    solarDistanceAu: day.solarDistanceAu,
    parentShadow,
  };
}

/**
 * The days worth evaluating in full: one per band of signed beta (so every beta the mission sees
 * is represented, both signs), plus the days of the largest and smallest |beta|.
 */
export function candidateDays(scan: readonly ScanDay[], maxCandidates = 90): ScanDay[] {
  if (scan.length === 0) return [];
  const betas = scan.map((d) => d.betaDeg);
  const lo = Math.min(...betas);
  const hi = Math.max(...betas);
  const width = Math.max(1, (hi - lo) / maxCandidates);
  const byBand = new Map<number, ScanDay>();
  for (const day of scan) {
    const band = Math.floor((day.betaDeg - lo) / width);
    if (!byBand.has(band)) byBand.set(band, day);
  }
  const extremes = [maxBy(scan, (d) => Math.abs(d.betaDeg)), maxBy(scan, (d) => -Math.abs(d.betaDeg))];
  const chosen = new Map<string, ScanDay>();
  for (const day of [...extremes, ...byBand.values()]) chosen.set(day.date, day);
  return [...chosen.values()];
}

/** The element with the largest key (the first one on a tie). */
export function maxBy<T>(items: readonly T[], key: (item: T) => number): T {
  const first = items[0];
  if (first === undefined) throw new RangeError('maxBy of an empty list');
  let best: T = first;
  let bestKey = key(first);
  for (const item of items) {
    const k = key(item);
    if (k > bestKey) {
      best = item;
      bestKey = k;
    }
  }
  return best;
}
