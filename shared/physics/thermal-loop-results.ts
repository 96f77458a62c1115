// What a run answers about each coolant loop (API.md "Coolant loops"): flow over the orbit, the
// coolant leaving each path element, the heat each element gives the coolant, how long the flow
// sits at a limit, and how well the controller holds its node (largest deviation from the set
// point, time outside the band, and, given the orbit's eclipse entries and exits, how long the node
// takes to come back within the band after each).
import { KELVIN_OFFSET, type ControlFigures, type LoopResult, type ThermalModelInput, type ThermalSolveResult } from './thermal-model';
import type { ThermalNetwork } from './thermal-network';
import type { PeriodicRun } from './thermal-periodic';
import { round } from './rounding';

/** Default control requirement when the loop states none, K (common practice, no source). */
export const DEFAULT_CONTROL_BAND_K = 0.5;

const series = (values: ArrayLike<number>, offset = 0, digits = 4) => Array.from(values, (v) => round(v - offset, digits));

/** Largest |T - set point| and time outside +/- band over one orbit of evenly spaced samples. */
export function controlFigures(node: string, temperaturesC: readonly number[], setPointC: number, bandK: number, periodS: number): ControlFigures {
  const dt = periodS / temperaturesC.length;
  let maxDeviationK = 0;
  let outside = 0;
  for (const t of temperaturesC) {
    const d = Math.abs(t - setPointC);
    if (d > maxDeviationK) maxDeviationK = d;
    if (d > bandK) outside++;
  }
  return { node, setPointC, bandK, maxDeviationK: round(maxDeviationK), outsideBandS: round(outside * dt, 1), pass: maxDeviationK <= bandK };
}

export interface Recovery {
  event: 'eclipse entry' | 'eclipse exit';
  atS: number;
  /** Time from the event until the node is back within the band for good (before the next event); 0 if it never left, null if it does not return. */
  returnS: number | null;
}

/**
 * After each change of `sunlit` (1 sun, 0 umbra; a crossing of 0.5): the time until the controlled
 * node is back within +/- band and stays there until the next event (the orbit wraps round).
 */
export function recoveries(temperaturesC: readonly number[], sunlit: readonly number[], setPointC: number, bandK: number, periodS: number): Recovery[] {
  const n = temperaturesC.length;
  if (!n || sunlit.length === 0) return [];
  const lit = (s: number) => sunlit[Math.floor((s * sunlit.length) / n) % sunlit.length] >= 0.5;
  const events: { s: number; event: Recovery['event'] }[] = [];
  for (let s = 0; s < n; s++) {
    const before = lit((s - 1 + n) % n);
    if (before !== lit(s)) events.push({ s, event: before ? 'eclipse entry' : 'eclipse exit' });
  }
  const dt = periodS / n;
  const outside = (s: number) => Math.abs(temperaturesC[s % n] - setPointC) > bandK;
  return events.map((e, k) => {
    const next = k + 1 < events.length ? events[k + 1].s : events[0].s + n;
    let last = -1;
    for (let s = e.s; s < next; s++) if (outside(s)) last = s;
    const returnS = last < 0 ? 0 : last + 1 >= next ? null : round((last + 1 - e.s) * dt, 1);
    return { event: e.event, atS: round(e.s * dt, 1), returnS };
  });
}

/** For every controlled loop of a run: the return within its band after each eclipse entry and exit. */
export function controlRecoveries(result: Pick<ThermalSolveResult, 'nodes' | 'loops'>, sunlit: readonly number[], periodS: number): ({ loop: string; node: string } & Recovery)[] {
  return result.loops.flatMap((loop) => {
    const control = loop.control;
    const node = control ? result.nodes.find((n) => n.name === control.node) : undefined;
    if (!control || !node) return [];
    return recoveries(node.temperaturesC, sunlit, control.setPointC, control.bandK, periodS).map((r) => ({ loop: loop.name, node: control.node, ...r }));
  });
}

export function loopResults(model: ThermalModelInput, net: ThermalNetwork, run: PeriodicRun): LoopResult[] {
  const closed = net.loops;
  const nodeSeriesC = (name: string) => {
    const i = model.nodes.findIndex((n) => n.name === name);
    const free = i < 0 ? -1 : net.freeOfNode[i];
    return free < 0 ? null : series(run.samplesK[free], KELVIN_OFFSET);
  };
  return (model.loops ?? []).map((loop, k): LoopResult => {
    const flow = run.loopSamplesKgS[k];
    const controlled = loop.minFlowKgS < loop.maxFlowKgS;
    const span = Math.max(loop.maxFlowKgS - loop.minFlowKgS, 1e-12);
    let saturated = 0;
    if (controlled) for (const f of flow) if (f <= loop.minFlowKgS + 1e-6 * span || f >= loop.maxFlowKgS - 1e-6 * span) saturated++;
    const c = closed ? closed.modelLoop.indexOf(k) : -1;
    const elements = c >= 0 && closed ? Array.from({ length: closed.count[c] }, (_, j) => closed.start[c] + j) : [];
    const path = loop.path ?? [];
    const controlSeries = controlled && loop.controlNode !== undefined ? nodeSeriesC(loop.controlNode) : null;
    return {
      name: loop.name,
      closed: c >= 0,
      flowKgS: series(flow, 0, 6),
      averageFlowKgS: round(run.loopAverageKgS[k], 6),
      nominalFlowKgS: loop.nominalFlowKgS,
      averageToNominal: round(run.loopAverageKgS[k] / loop.nominalFlowKgS),
      heatRemovedW: round(c >= 0 ? elements.reduce((a, e) => a + Math.max(run.elementHeatW[e], 0), 0) : run.loopHeatW[k]),
      coolantC: elements.map((e, j) => ({ node: path[j].node, temperaturesC: series(run.samplesK[closed!.lumpFree[e]], KELVIN_OFFSET) })),
      heatW: elements.map((e, j) => ({ node: path[j].node, averageW: round(run.elementHeatW[e]) })),
      saturatedFraction: round(saturated / flow.length),
      densityKgM3: loop.densityKgM3 ?? null,
      control: controlSeries && loop.setPointC !== undefined
        ? controlFigures(loop.controlNode!, controlSeries, loop.setPointC, loop.bandK ?? DEFAULT_CONTROL_BAND_K, model.periodS)
        : null,
    };
  });
}
