// Plot and file inputs from a run's answer: a node's temperature over the orbit with its limits,
// the heaters' on/off strips, and the CSV of every node's temperature (the loops' are in
// thermal-loop-plots.ts). Minutes.
import type { ThermalRunResponse } from '../../../shared/api/thermal-models';
import type { CsvColumn } from '../plots/csv-download';
import { formatWithUnit } from '../plots/plot-format';
import type { LimitLine, PlotBand, PlotSeries, StripRow } from '../plots/plot-series';

type Run = ThermalRunResponse;

const minutes = (run: Run) => run.result.tS.map((t) => t / 60);

/** Eclipse (sunlit 0) and penumbra bands from the case's sunlit fraction. */
export function shadowBands(run: Run): PlotBand[] {
  const x = minutes(run);
  const sunlit = run.case.sunlit;
  const bands: PlotBand[] = [];
  const kindAt = (i: number): PlotBand['kind'] | null => ((sunlit[i] ?? 1) <= 0 ? 'eclipse' : (sunlit[i] ?? 1) < 1 ? 'penumbra' : null);
  let start = 0;
  let kind: PlotBand['kind'] | null = null;
  for (let i = 0; i <= x.length; i++) {
    const here = i < x.length ? kindAt(i) : null;
    if (here === kind) continue;
    if (kind !== null) bands.push({ from: x[start] ?? 0, to: x[Math.min(i, x.length - 1)] ?? 0, kind, label: kind === 'eclipse' ? 'Eclipse (umbra)' : 'Penumbra' });
    start = i;
    kind = here;
  }
  return bands;
}

export function temperatureSeries(run: Run, node: string): PlotSeries[] {
  const n = run.result.nodes.find((x) => x.name === node);
  if (!n) return [];
  const x = minutes(run);
  return [{ id: `t-${n.name}`, label: n.name, unit: '°C', colorVar: '--ecl-absorbed', points: n.temperaturesC.map((y, i) => ({ x: x[i] ?? 0, y })) }];
}

/** The node's operating limits, and the limits less the margin the run checked against. */
export function limitLines(run: Run, node: string): LimitLine[] {
  const n = run.result.nodes.find((x) => x.name === node);
  const op = n?.limits.find((l) => l.kind === 'operating');
  if (!op) return [];
  const lines: LimitLine[] = [];
  if (op.minC !== null) {
    lines.push({ y: op.minC, label: `Min operating ${op.minC} °C`, kind: 'cold' });
    if (op.marginK > 0) lines.push({ y: op.minC + op.marginK, label: `Min + ${op.marginK} K margin`, kind: 'cold' });
  }
  if (op.maxC !== null) {
    lines.push({ y: op.maxC, label: `Max operating ${op.maxC} °C`, kind: 'hot' });
    if (op.marginK > 0) lines.push({ y: op.maxC - op.marginK, label: `Max − ${op.marginK} K margin`, kind: 'hot' });
  }
  return lines;
}

/** On wherever the heater's mean power over a sample is above zero. */
export function heaterRows(run: Run): StripRow[] {
  const x = minutes(run);
  const dt = x.length > 1 ? (x[1] ?? 0) - (x[0] ?? 0) : 0;
  return run.result.heaters.map((h) => {
    const segments: { from: number; to: number }[] = [];
    h.powerW.forEach((w, i) => {
      if (w <= 0) return;
      const from = x[i] ?? 0;
      const last = segments[segments.length - 1];
      // A sample partly on counts in proportion, so the strip's on fraction matches the duty cycle.
      const to = from + (dt * Math.min(1, w / Math.max(h.peakW, 1e-12)));
      if (last && Math.abs(last.to - from) < 1e-9) last.to = to;
      else segments.push({ from, to });
    });
    // The figure beside the strip is the table's: over the whole cycle, which may span several orbits.
    return { label: h.name, segments, colorVar: '--ecl-hot', duty: h.dutyCycle };
  });
}

/** A duty cycle as the strip and the table both show it, e.g. "52.1 %". */
export function dutyPercent(fraction: number): string {
  return formatWithUnit(fraction * 100, '%');
}

/** What the strip draws against what its duty figures cover, when the two differ; null when they do not. */
export function heaterCycleNote(run: Run): string | null {
  const r = run.result;
  if (!r.converged) return 'The strip draws the last orbit of a run that did not settle; the duty cycles are that orbit\'s.';
  if (r.periodOrbits > 1) {
    return `The strip draws the last orbit; the thermostats' cycle repeats every ${r.periodOrbits} orbits, so the duty cycles beside it and in the table are over those ${r.periodOrbits} orbits.`;
  }
  if (r.periodOrbits === 0 && r.averagedOrbits > 1) {
    return `The strip draws the last orbit; the thermostats' cycle never locks to the orbit, so the duty cycles beside it and in the table are averages over the last ${r.averagedOrbits} orbits.`;
  }
  return null;
}

export function temperatureColumns(run: Run): CsvColumn[] {
  return [
    { header: 'Time', unit: 's', values: run.result.tS },
    ...run.result.nodes.map((n): CsvColumn => ({ header: n.name, unit: '°C', values: n.temperaturesC })),
    ...run.result.heaters.map((h): CsvColumn => ({ header: h.name, unit: 'W', values: h.powerW })),
  ];
}

/** The tightest operating margin of a node, K (negative: the limit is broken). */
export function worstMarginK(run: Run, node: string): number | null {
  const op = run.result.nodes.find((x) => x.name === node)?.limits.find((l) => l.kind === 'operating');
  if (!op) return null;
  const margins = [op.coldMarginK, op.hotMarginK].filter((m): m is number => m !== null);
  return margins.length > 0 ? Math.min(...margins) : null;
}
