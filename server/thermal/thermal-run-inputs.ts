// A saved model against one load case becomes a POST /thermal/solve body: the case gives the period,
// the steps and, through the surfaces each node owns, the node's absorbed load over the orbit; the
// case's kind picks the node's hot or cold dissipation. Surfaces are the mission's by id, found in
// the case's snapshot by name (a case keeps the surfaces as they were when it was derived).
import type { ThermalSolveRequestInput } from '../../shared/api/thermal';
import type { SavedThermalNode, ThermalModelContent, ThermalRunNodeInput } from '../../shared/api/thermal-models';
import type { LoadCaseRow } from '../db/schema';
import { absorbedAtScale } from '../../shared/physics/thermal-distance-study';
import { round } from '../../shared/physics/rounding';
import { durationText } from '../../shared/physics/typed-units';
import { heatLoadFactor } from '../../shared/physics/design-environment';
import { unprocessable } from '../errors';

export interface RunInputs {
  request: ThermalSolveRequestInput;
  nodes: ThermalRunNodeInput[];
  assumptions: string[];
}


/** `values` (evenly spaced over one period) at `n` evenly spaced times, linear between samples, wrapping round the orbit. */
export function resamplePeriodic(values: readonly number[], n: number): number[] {
  if (values.length === n) return [...values];
  return Array.from({ length: n }, (_, k) => {
    const at = (k * values.length) / n;
    const i = Math.floor(at);
    const f = at - i;
    return (values[i % values.length] ?? 0) * (1 - f) + (values[(i + 1) % values.length] ?? 0) * f;
  });
}

/**
 * `values` at times `tS` (ascending, not evenly spaced: an eccentric orbit's case) as `n` values
 * evenly spaced over the period, each the mean of the piecewise-linear series over its step
 * (centred on the sample time, wrapping round the orbit): the periapsis pulse's energy lands in the
 * steps it falls in, so the orbit-average load is kept.
 */
export function resampleByTime(values: readonly number[], tS: readonly number[], periodS: number, n: number): number[] {
  const count = values.length;
  const t = [...tS, (tS[0] ?? 0) + periodS];
  const v = [...values, values[0] ?? 0];
  // cumulative integral at each sample (trapezoids)
  const cumulative = [0];
  for (let i = 1; i <= count; i++) cumulative.push(cumulative[i - 1]! + ((v[i]! + v[i - 1]!) / 2) * (t[i]! - t[i - 1]!));
  const total = cumulative[count]!;
  const integralTo = (time: number): number => {
    const turns = Math.floor((time - t[0]!) / periodS);
    const x = time - turns * periodS;
    let i = 0;
    while (i < count - 1 && t[i + 1]! <= x) i++;
    const dt = t[i + 1]! - t[i]!;
    const f = dt > 0 ? (x - t[i]!) / dt : 0;
    const at = v[i]! + (v[i + 1]! - v[i]!) * f;
    return turns * total + cumulative[i]! + ((v[i]! + at) / 2) * (x - t[i]!);
  };
  const step = periodS / n;
  return Array.from({ length: n }, (_, k) => (integralTo((k + 0.5) * step) - integralTo((k - 0.5) * step)) / step);
}

/**
 * A node's dissipation in a case: a survival case's least dissipation over the phases (0 W for a node
 * no phase names: heaters only); in a phase's case, the phase's value where it names the node; else
 * the model's own for the case's kind.
 */
function dissipationFor(node: SavedThermalNode, loadCase: LoadCaseRow): SavedThermalNode['dissipationW'] {
  const survival = loadCase.inputs.decision?.survival;
  if (survival) return survival.nodes.find((n) => n.node === node.name)?.dissipationW ?? 0;
  const phased = loadCase.inputs.phase?.dissipation.find((d) => d.node === node.name);
  if (phased) return phased.dissipationW;
  const kind = loadCase.kind;
  if (kind === 'hot' && node.hotDissipationW !== undefined) return node.hotDissipationW;
  if (kind === 'cold' && node.coldDissipationW !== undefined) return node.coldDissipationW;
  return node.dissipationW;
}

function describeDissipation(d: SavedThermalNode['dissipationW']): string {
  if (d === undefined) return 'none';
  if (typeof d === 'number') return `${d} W`;
  return `${d.onW} W for ${d.onS} s every ${d.periodS} s${d.offW ? `, ${d.offW} W otherwise` : ''}`;
}

function dissipationAssumptions(loadCase: LoadCaseRow): string[] {
  const phase = loadCase.inputs.phase;
  if (loadCase.inputs.decision?.survival) {
    return ['Survival: each node dissipates the least any mission phase gives it (0 W for a node no phase names); heaters as in the model.'];
  }
  if (phase) return [`Dissipation of phase "${phase.name}" (${phase.startDate} to ${phase.endDate}) for the nodes it names; other nodes take the model's own ${loadCase.kind} value.`];
  return [];
}

/**
 * The solve request of `model` on `loadCase`. `solarScale` multiplies the case's solar and albedo loads
 * (the distance study's Sun at another distance); planetary IR is kept as it is.
 */
export function runInputs(model: ThermalModelContent, surfaceNames: ReadonlyMap<string, string>, loadCase: LoadCaseRow, solarScale = 1): RunInputs {
  const results = loadCase.results;
  const steps = results.tS.length;
  const byName = new Map(results.surfaces.map((s) => [s.name, s]));
  const { heatLoadPercent, temperatureMarginC } = loadCase.inputs.margins;
  const direction = loadCase.inputs.conditions.marginDirection;
  // The case's stored series are without its heat-load margin; the design case is with it.
  const factor = heatLoadFactor(heatLoadPercent, direction);

  const nodeInputs: ThermalRunNodeInput[] = [];
  const nodes = model.nodes.map((node, i) => {
    const { surfaceIds, hotDissipationW: _hot, coldDissipationW: _cold, dissipationW: _base, ...rest } = node;
    const owned = surfaceIds.map((id, j) => {
      const name = surfaceNames.get(id);
      if (name === undefined) {
        throw unprocessable(`Node ${JSON.stringify(node.name)} owns surface ${JSON.stringify(id)}, which the mission no longer has; edit the model.`, [{ path: `model.nodes.${i}.surfaceIds.${j}`, message: 'no such surface in the mission' }]);
      }
      const found = byName.get(name);
      if (!found) {
        throw unprocessable(`The case "${loadCase.name}" has no surface named ${JSON.stringify(name)} (node ${JSON.stringify(node.name)}); derive the case again after adding the surface.`, [{ path: `model.nodes.${i}.surfaceIds.${j}`, message: `not in the case's snapshot: ${name}` }]);
      }
      return found;
    });
    const absorbed = new Array<number>(steps).fill(0);
    // an eccentric orbit's case is sampled unevenly in time (weightS): its loads are averaged into even steps
    const even = (series: number[]) => results.weightS ? resampleByTime(series, results.tS, results.periodS, steps) : resamplePeriodic(series, steps);
    for (const s of owned) even(solarScale === 1 ? s.series.absorbedW : absorbedAtScale(s.series, solarScale)).forEach((w, k) => (absorbed[k] = (absorbed[k] ?? 0) + w * factor));
    const areaM2 = owned.reduce((sum, s) => sum + s.areaM2, 0);
    // An explicit radiator replaces the surfaces' own; otherwise they radiate with their area-weighted emissivity.
    const explicit = node.radiatorAreaM2 !== undefined;
    const fromSurfaces = !explicit && areaM2 > 0;
    const surfaceEmissivity = fromSurfaces ? round(owned.reduce((sum, s) => sum + s.areaM2 * s.emissivity, 0) / areaM2, 6) : null;
    const radiator = fromSurfaces ? { radiatorAreaM2: round(areaM2, 6), emissivity: surfaceEmissivity ?? 0 } : {};
    const dissipationW = dissipationFor(node, loadCase);
    nodeInputs.push({
      name: node.name,
      surfaces: owned.map((s) => s.name),
      orbitAverageAbsorbedW: round(absorbed.reduce((a, b) => a + b, 0) / steps),
      peakAbsorbedW: round(Math.max(0, ...absorbed)),
      radiatorAreaM2: explicit ? (node.radiatorAreaM2 ?? 0) : round(areaM2, 6),
      emissivity: surfaceEmissivity ?? node.emissivity ?? null,
      dissipation: describeDissipation(dissipationW),
    });
    return {
      ...rest,
      ...radiator,
      ...(dissipationW !== undefined ? { dissipationW } : {}),
      ...(owned.length > 0 ? { absorbedW: absorbed.map((w) => round(w)) } : {}),
    };
  });

  const operatingK = model.margins.operatingK ?? temperatureMarginC;
  const request: ThermalSolveRequestInput = {
    periodS: results.periodS,
    steps,
    nodes,
    couplings: model.couplings,
    radiativeCouplings: model.radiativeCouplings,
    heaters: model.heaters,
    loops: model.loops,
    margins: { operatingK, ...(model.margins.survivalK !== undefined ? { survivalK: model.margins.survivalK } : {}) },
    ...(model.toleranceK !== undefined ? { toleranceK: model.toleranceK } : {}),
    ...(model.maxOrbits !== undefined ? { maxOrbits: model.maxOrbits } : {}),
    ...(model.substeps !== undefined ? { substeps: model.substeps } : {}),
  };
  const assumptions = [
    `Loads from case "${loadCase.name}" (${loadCase.kind}, revision ${loadCase.revision}, ${loadCase.status}): each node absorbs the sum of its surfaces' absorbed loads, ${steps} samples over ${durationText(results.periodS)}.`,
    ...(results.weightS
      ? ['The case is sampled densely at periapsis; its loads are averaged over each of the solver\'s even time steps, so the periapsis pass keeps its energy but is spread over the step it falls in.']
      : []),
    `The case's heat-load margin is applied: loads ${direction === 'increase' ? '+' : '-'}${heatLoadPercent} %.`,
    model.margins.operatingK !== undefined
      ? `Operating limits checked with the model's margin of ${operatingK} K.`
      : `Operating limits checked with the case's temperature margin of ${operatingK} K (the model sets none).`,
    'A node radiates to space through its surfaces (their area, their emissivity in the case) unless it names a radiator of its own.',
    ...dissipationAssumptions(loadCase),
  ];
  return { request, nodes: nodeInputs, assumptions };
}
