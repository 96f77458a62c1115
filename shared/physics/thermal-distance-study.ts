// The distance study (issue 14 item 3): one saved model on one load case, with the Sun at other
// distances. The case's solar and albedo loads scale with the solar flux, inverse square
// (sun.ts solarFluxWm2); planetary IR stays (the planet's own emission). At each distance the
// model is solved (its loops' PI controllers set the pump flow) and the radiator is sized to hold
// its set point (thermal-sizing.ts radiatorAreaFor).
import { isCustomBodyId } from './custom-bodies';
import { getBody, isBodyId, solarDistanceRangeAu } from './bodies';
import { ThermalConvergenceError, ThermalModelError, type ThermalSolveInput, type ThermalSolveResult } from './thermal-model';
import { radiatorAreaFor, type RadiatorSizing } from './thermal-sizing';
import { solveThermal } from './thermal-solver';
import { solarFluxWm2 } from './sun';

/** A place the study puts the Sun: a name for the reader and the distance. */
export interface StudyDistance {
  label: string;
  distanceAu: number;
}

export interface LoopFlowFigures {
  name: string;
  averageKgS: number;
  peakKgS: number;
  /** Volume flow, when the loop's coolant density is known; null otherwise. */
  averageLMin: number | null;
  peakLMin: number | null;
}

export interface DistancePointResult {
  /** Settled into its periodic state; otherwise the flows are the last orbit's. */
  settled: boolean;
  loops: LoopFlowFigures[];
  radiator: RadiatorSizing | null;
  /** Why no radiator area holds the set point at this distance. */
  radiatorRefused: string | null;
  /** Why the model could not be solved at this distance (then loops is empty). */
  solveRefused: string | null;
}

/** The factor on the case's solar and albedo loads with the Sun at `distanceAu` instead of at the case's flux. */
export const solarScaleAt = (distanceAu: number, caseSolarFluxWm2: number): number => solarFluxWm2(distanceAu) / caseSolarFluxWm2;

/** One surface's absorbed load per sample with solar and albedo scaled, planetary IR as it was. */
export function absorbedAtScale(series: { solarW: readonly number[]; albedoW: readonly number[]; irW: readonly number[] }, scale: number): number[] {
  return series.solarW.map((s, k) => (s + (series.albedoW[k] ?? 0)) * scale + (series.irW[k] ?? 0));
}

/** Where the Sun is at a body's mean distance, or a mission body's perihelion and aphelion. */
export function bodyDistances(bodyId: string): StudyDistance[] {
  if (!isBodyId(bodyId)) return [];
  const body = getBody(bodyId);
  return [{ label: body.name, distanceAu: solarDistanceRangeAu(body).mean }];
}

export function perihelionAphelion(bodyId: string): StudyDistance[] {
  // a mission's body may be the workspace's own (custom-bodies.ts), found by getBody on the server
  if (!isBodyId(bodyId) && !isCustomBodyId(bodyId)) return [];
  const body = getBody(bodyId);
  const { min, max } = solarDistanceRangeAu(body);
  return [{ label: `${body.name} perihelion`, distanceAu: min }, { label: `${body.name} aphelion`, distanceAu: max }];
}

const M3_TO_L = 1000;

export function loopFlows(result: ThermalSolveResult): LoopFlowFigures[] {
  return result.loops.map((loop) => {
    const peakKgS = Math.max(0, ...loop.flowKgS);
    const perMin = (kgS: number) => (loop.densityKgM3 ? (kgS / loop.densityKgM3) * M3_TO_L * 60 : null);
    return { name: loop.name, averageKgS: loop.averageFlowKgS, peakKgS, averageLMin: perMin(loop.averageFlowKgS), peakLMin: perMin(peakKgS) };
  });
}

const refusal = (error: unknown): string | null =>
  error instanceof ThermalModelError || error instanceof ThermalConvergenceError ? error.message : null;

/** The model (its loads already at the distance) solved, its loops' flows, and the radiator of `node` sized with `marginK`. */
export function distancePoint(model: ThermalSolveInput, node: string, marginK: number): DistancePointResult {
  let result: ThermalSolveResult;
  try {
    result = solveThermal({ ...model, whenUnsettled: 'last-orbit' });
  } catch (error) {
    const why = refusal(error);
    if (why === null) throw error;
    return { settled: false, loops: [], radiator: null, radiatorRefused: null, solveRefused: why };
  }
  let radiator: RadiatorSizing | null = null;
  let radiatorRefused: string | null = null;
  try {
    radiator = radiatorAreaFor(model, node, marginK);
  } catch (error) {
    radiatorRefused = refusal(error);
    if (radiatorRefused === null) throw error;
  }
  return { settled: result.converged, loops: loopFlows(result), radiator, radiatorRefused, solveRefused: null };
}
