// Where an orbit is sampled, so the periapsis pass of an eccentric orbit is resolved: samples evenly
// spaced in eccentric anomaly E carry exact time weights dt = (1 - e cos E) dE / n (Kepler's
// equation differentiated), whose sum is the period to rounding, so orbit averages stay time
// averages; and peaks refined on such a grid and then on a fine grid between the neighbours of
// each peak sample, whatever grid the profile itself is on. Evenly in time (API.md) stays the
// default profile; evenly in E is asked for with `sampling`.
// Leaves out: refinement at shadow edges (the eclipse has its own root-finding scan, orbit-grid.ts).
// Sources: Vallado ch. 2 (Kepler's equation M = E - e sin E); trapezoid rule on a periodic
// integrand (spectrally accurate, Trefethen & Weideman 2014, SIAM Review 56, from memory).
import type { Orbit } from './orbit-definition';
import type { LoadTotals, ProfileColumns } from './profile-loads';

export const samplings = ['time', 'eccentric-anomaly'] as const;
export type Sampling = (typeof samplings)[number];

/** Sub-samples put between the neighbours of each peak sample. */
const ZOOM_POINTS = 24;

const TWO_PI = 2 * Math.PI;

/** Time after periapsis (s) at eccentric anomaly E (rad): Kepler's equation. */
const timeAtE = (orbit: Orbit, eRad: number): number => (eRad - orbit.eccentricity * Math.sin(eRad)) / orbit.meanMotionRadS;

/** `steps` times evenly spaced in eccentric anomaly, and each one's share of the period in seconds. */
export function eccentricAnomalyTimes(orbit: Orbit, steps: number): { times: Float64Array; weightS: Float64Array } {
  const times = new Float64Array(steps);
  const weightS = new Float64Array(steps);
  const dE = TWO_PI / steps;
  for (let k = 0; k < steps; k++) {
    const eRad = k * dE;
    times[k] = timeAtE(orbit, eRad);
    weightS[k] = ((1 - orbit.eccentricity * Math.cos(eRad)) * dE) / orbit.meanMotionRadS;
  }
  return { times, weightS };
}

/** Time averages of every column with per-sample time weights (sum = the period). */
export function weightedAverages(loads: ProfileColumns, weightS: Float64Array, periodS: number): LoadTotals {
  const average = (columns: Float64Array[]) => Float64Array.from(columns, (column) => {
    let sum = 0;
    for (let k = 0; k < column.length; k++) sum += column[k] * weightS[k];
    return sum / periodS;
  });
  return { solarWm2: average(loads.solarWm2), albedoWm2: average(loads.albedoWm2), irWm2: average(loads.irWm2), absorbedW: average(loads.absorbedW) };
}

const components = ['solarWm2', 'albedoWm2', 'irWm2', 'absorbedW'] as const;

const maxOf = (column: Float64Array): { value: number; index: number } => {
  let index = 0;
  for (let k = 1; k < column.length; k++) if (column[k] > column[index]) index = k;
  return { value: column[index] ?? 0, index };
};

/**
 * Peaks of an eccentric orbit: the larger of `peaks` (the profile's own), those on a grid of
 * `steps` samples evenly in E, and those on a fine grid in E between the neighbours of each
 * component's peak sample. `evaluate` computes the loads at given times. A circular orbit's peaks
 * are returned as they are.
 */
export function refinedPeaks(orbit: Orbit, steps: number, peaks: LoadTotals, evaluate: (times: Float64Array) => ProfileColumns, onE: ProfileColumns | null): LoadTotals {
  if (orbit.eccentricity === 0) return peaks;
  const coarse = onE ?? evaluate(eccentricAnomalyTimes(orbit, steps).times);
  const dE = TWO_PI / steps;
  const windows = new Set<number>();
  for (const c of components) for (const column of coarse[c]) windows.add(maxOf(column).index);
  const fine: number[] = [];
  for (const index of windows) {
    for (let i = 1; i < 2 * ZOOM_POINTS; i++) fine.push(timeAtE(orbit, (index - 1 + i / ZOOM_POINTS) * dE));
  }
  const zoom = evaluate(Float64Array.from(fine, (t) => ((t % orbit.periodS) + orbit.periodS) % orbit.periodS));
  const out: LoadTotals = {
    solarWm2: Float64Array.from(peaks.solarWm2), albedoWm2: Float64Array.from(peaks.albedoWm2),
    irWm2: Float64Array.from(peaks.irWm2), absorbedW: Float64Array.from(peaks.absorbedW),
  };
  for (const c of components) {
    for (let j = 0; j < out[c].length; j++) out[c][j] = Math.max(out[c][j], coarse.peaks[c][j], zoom.peaks[c][j]);
  }
  return out;
}
