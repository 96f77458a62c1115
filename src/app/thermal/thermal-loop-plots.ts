// Plot, table and file inputs for a run's coolant loops (issue 14): each controlled node against its
// set point and requirement band, with the return to the band after each eclipse entry and exit
// shaded; the coolant leaving each path element; the flow in kg/s and L/min. Minutes on the x axis.
import type { ThermalRunResponse } from '../../../shared/api/thermal-models';
import type { CsvColumn } from '../plots/csv-download';
import { seriesLook } from '../plots/plot-colors';
import type { LimitLine, PlotBand, PlotSeries } from '../plots/plot-series';

type Run = ThermalRunResponse;
type Loop = Run['result']['loops'][number];

const minutes = (run: Run) => run.result.tS.map((t) => t / 60);

/** kg/s to L/min with the coolant's density (kg/m^3): 1 m^3 = 1000 L, 60 s a minute. */
export const litresPerMinute = (kgS: number, densityKgM3: number) => (kgS / densityKgM3) * 1000 * 60;

export function controlSeries(run: Run, loop: Loop): PlotSeries[] {
  const node = loop.control ? run.result.nodes.find((n) => n.name === loop.control!.node) : undefined;
  if (!node) return [];
  const x = minutes(run);
  return [{ id: `ctl-${loop.name}`, label: node.name, unit: '°C', colorVar: '--ecl-absorbed', points: node.temperaturesC.map((y, i) => ({ x: x[i] ?? 0, y })) }];
}

/** The requirement band round the set point. */
export function controlLines(loop: Loop): LimitLine[] {
  const c = loop.control;
  if (!c) return [];
  return [
    { y: c.setPointC + c.bandK, label: `Set point + ${c.bandK} K`, kind: 'hot' },
    { y: c.setPointC - c.bandK, label: `Set point − ${c.bandK} K`, kind: 'cold' },
  ];
}

/** From each eclipse entry and exit until the node is back within its band, shaded (the plot's markers). */
export function recoveryBands(run: Run, loop: Loop): PlotBand[] {
  return (run.recoveries ?? [])
    .filter((r) => r.loop === loop.name && r.returnS !== 0)
    .map((r) => ({
      from: r.atS / 60,
      to: (r.atS + (r.returnS ?? run.case.periodS - r.atS)) / 60,
      kind: 'limit' as const,
      label: r.returnS === null ? 'Outside the band until the next event' : 'Back within the band',
    }));
}

export function coolantSeries(run: Run, loop: Loop): PlotSeries[] {
  const x = minutes(run);
  return loop.coolantC.map((c, j) => ({
    id: `coolant-${loop.name}-${j}`, label: `leaving ${c.node}`, unit: '°C', colorVar: seriesLook(j).colorVar, points: c.temperaturesC.map((y, i) => ({ x: x[i] ?? 0, y })),
  }));
}

export function flowSeries(run: Run): PlotSeries[] {
  const x = minutes(run);
  return run.result.loops.map((l, k) => ({
    id: `flow-${k}`, label: l.name, unit: 'kg/s', colorVar: seriesLook(k).colorVar, points: l.flowKgS.map((y, i) => ({ x: x[i] ?? 0, y })),
  }));
}

/** Flow (kg/s and, with a density, L/min) and the coolant leaving each element, per loop. */
export function loopColumns(run: Run): CsvColumn[] {
  return run.result.loops.flatMap((l): CsvColumn[] => [
    { header: `${l.name} flow`, unit: 'kg/s', values: l.flowKgS },
    ...(l.densityKgM3 ? [{ header: `${l.name} flow`, unit: 'L/min', values: l.flowKgS.map((f) => Math.round(litresPerMinute(f, l.densityKgM3!) * 1e4) / 1e4) }] : []),
    ...l.coolantC.map((c): CsvColumn => ({ header: `${l.name} coolant leaving ${c.node}`, unit: '°C', values: c.temperaturesC })),
  ]);
}

/** The loops' figures as rows (one per loop): what the control summary table and the CSV's tail show. */
export function controlRows(run: Run) {
  return run.result.loops.map((l) => ({
    loop: l,
    averageLMin: l.densityKgM3 ? litresPerMinute(l.averageFlowKgS, l.densityKgM3) : null,
    recoveries: (run.recoveries ?? []).filter((r) => r.loop === l.name),
  }));
}

/** The summary lines the CSV ends with: per loop its control figures and per element its heat. */
export function loopSummaryColumns(run: Run): CsvColumn[] {
  const lines: string[] = [];
  for (const { loop: l, recoveries } of controlRows(run)) {
    const c = l.control;
    lines.push(`${l.name}: ${l.closed ? 'closed' : 'open'} loop; average flow ${l.averageFlowKgS} kg/s; flow at a limit ${Math.round(l.saturatedFraction * 1000) / 10} % of the orbit`);
    if (c) lines.push(`${l.name}: holds ${c.node} at ${c.setPointC} °C ± ${c.bandK} K: largest deviation ${c.maxDeviationK} K, ${c.outsideBandS} s per orbit outside the band: ${c.pass ? 'PASS' : 'FAIL'}`);
    for (const r of recoveries) lines.push(`${l.name}: after ${r.event} at ${r.atS} s: ${r.returnS === null ? 'not back within the band before the next event' : `back within the band after ${r.returnS} s`}`);
    for (const h of l.heatW) lines.push(`${l.name}: heat taken from ${h.node}: ${h.averageW} W (orbit average)`);
  }
  return lines.length ? [{ header: 'Loops', values: lines }] : [];
}
