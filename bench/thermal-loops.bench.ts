// Loop benchmark (issue 14): the 100-node network of thermal-loops-bench-model.ts with two closed
// coolant loops under PI control, 720 samples per orbit taken in 3 implicit substeps each, solved to
// its periodic steady state; then the same equations with SciPy's solve_ivp (BDF) in
// bench/reference/thermal_loops.py, started from the same temperatures and stopped by the same
// periodic test (the change over an orbit and the estimated distance still to go), and the ratio of
// the two times and the largest difference of any node over the last orbit. Skipped with a message
// where python3 or scipy is missing.
// Runs under bench/run.ts (npm run bench -- thermal), or alone: npx tsx bench/thermal-loops.bench.ts
import { spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { orbitAverageStartC } from '../shared/physics/thermal-periodic';
import { solveThermal } from '../shared/physics/thermal-solver';
import type { ThermalSolveResult } from '../shared/physics/thermal-model';
import type { BenchRow } from './bench-table';
import { scipyAvailable } from './thermal.bench';
import { benchLoopModel } from './thermal-loops-bench-model';

const here = path.dirname(fileURLToPath(import.meta.url));
const TOLERANCE_K = 0.01;
// Both sides at an accuracy the 0.1 K comparison can judge. Measured against a fine answer (eclipta
// with 64 substeps to 0.001 K, which SciPy at rtol 1e-8, atol 1e-6 K, max step dt/2 matched within
// 0.002 K): eclipta with 1 substep was 0.108 K off (panel 10 as the sun returns: each step takes the
// load at its end), with 3 substeps 0.017 K (4: 0.010 K, at some 15% more time); SciPy at rtol 1e-5,
// atol 1e-3 K was 0.112 K off, at rtol 1e-6, atol 1e-4 K 0.038 K.
const SUBSTEPS = 3;
const FINE_SUBSTEPS = 16;
const RTOL = 1e-6;
const ATOL_K = 1e-4;

export default async function thermalLoopsBench(): Promise<BenchRow[]> {
  const model = benchLoopModel();
  const cpuRuns: number[] = [];
  const wallRuns: number[] = [];
  let result = solveThermal({ ...model, toleranceK: TOLERANCE_K, substeps: SUBSTEPS });
  for (let k = 0; k < 3; k++) {
    const t0 = performance.now();
    const c0 = process.cpuUsage();
    result = solveThermal({ ...model, toleranceK: TOLERANCE_K, substeps: SUBSTEPS });
    const used = process.cpuUsage(c0);
    wallRuns.push(performance.now() - t0);
    cpuRuns.push((used.user + used.system) / 1000);
  }
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
  const eclipsMs = median(wallRuns);
  const eclipsCpuMs = median(cpuRuns);
  const rows: BenchRow[] = [
    { name: 'thermal loops: nodes / couplings / closed loops (lumps) / samples x substeps', value: `${model.nodes.length} / ${(model.couplings?.length ?? 0) + (model.radiativeCouplings?.length ?? 0)} / ${model.loops?.length} (${model.loops?.reduce((a, l) => a + (l.path?.length ?? 0), 0)}) / ${model.steps} x ${SUBSTEPS}`, unit: '' },
    { name: 'thermal loops: eclipta to periodic state (median of 3), wall', value: Math.round(eclipsMs), unit: 'ms' },
    { name: 'thermal loops: eclipta, CPU', value: Math.round(eclipsCpuMs), unit: 'ms' },
    { name: 'thermal loops: eclipta orbits', value: result.orbits, unit: 'orbits' },
    { name: `thermal loops: eclipta's step error: largest difference from ${FINE_SUBSTEPS} substeps`, value: Math.round(largestDifference(result, solveThermal({ ...model, toleranceK: TOLERANCE_K, substeps: FINE_SUBSTEPS })) * 1000) / 1000, unit: 'K' },
  ];
  const missing = scipyAvailable();
  if (missing) {
    rows.push({ name: 'thermal loops: scipy reference', value: `skipped: ${missing}`, unit: '' });
    return rows;
  }
  const startC = orbitAverageStartC(model);
  const dir = path.join(here, '..', 'tmp', 'bench');
  mkdirSync(dir, { recursive: true });
  const file = path.join(dir, 'thermal-loops-model.json');
  writeFileSync(file, JSON.stringify({ ...model, initialK: startC.map((c) => c + 273.15), toleranceK: TOLERANCE_K, rtol: RTOL, atolK: ATOL_K }));
  const py = spawnSync('python3', [path.join(here, 'reference', 'thermal_loops.py'), file], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  if (py.status !== 0) {
    rows.push({ name: 'thermal loops: scipy reference', value: `failed: ${py.stderr.trim().split('\n').pop() ?? ''}`, unit: '' });
    return rows;
  }
  const reference = JSON.parse(py.stdout) as {
    ms: number; cpuMs: number; orbits: number; converged: boolean; temperaturesC: number[][];
    changeOnly: { orbits: number; ms: number; cpuMs: number } | null;
  };
  let maxDiff = 0;
  let loopDiff = 0;
  const onPaths = new Set((model.loops ?? []).flatMap((l) => (l.path ?? []).map((e) => e.node)));
  result.nodes.forEach((node, i) => node.temperaturesC.forEach((t, s) => {
    const d = Math.abs(t - reference.temperaturesC[i]![s]!);
    maxDiff = Math.max(maxDiff, d);
    if (onPaths.has(node.name)) loopDiff = Math.max(loopDiff, d);
  }));
  rows.push(
    { name: `thermal loops: scipy solve_ivp BDF (rtol ${RTOL}, atol ${ATOL_K} K), wall`, value: Math.round(reference.ms), unit: 'ms' },
    { name: 'thermal loops: scipy, CPU', value: Math.round(reference.cpuMs), unit: 'ms' },
    { name: 'thermal loops: scipy orbits (the same periodic test)', value: reference.converged ? reference.orbits : `${reference.orbits} (not converged)`, unit: 'orbits' },
    { name: 'thermal loops: scipy / eclipta, wall', value: Math.round((reference.ms / eclipsMs) * 10) / 10, unit: 'x' },
    { name: 'thermal loops: scipy / eclipta, CPU', value: Math.round((reference.cpuMs / eclipsCpuMs) * 10) / 10, unit: 'x' },
    // The looser test (a change below the tolerance alone): scipy stopped there, eclipta at its full test.
    ...(reference.changeOnly
      ? [
        { name: 'thermal loops: scipy to a change < tolerance alone, orbits / CPU', value: `${reference.changeOnly.orbits} / ${Math.round(reference.changeOnly.cpuMs)}`, unit: 'orbits / ms' },
        { name: 'thermal loops: scipy (change alone) / eclipta (full test), CPU', value: Math.round((reference.changeOnly.cpuMs / eclipsCpuMs) * 10) / 10, unit: 'x' },
      ]
      : []),
    { name: 'thermal loops: largest difference between the two, last orbit, any node', value: Math.round(maxDiff * 1000) / 1000, unit: 'K' },
    { name: 'thermal loops: largest difference on the loops\' path nodes', value: Math.round(loopDiff * 1000) / 1000, unit: 'K' },
  );
  return rows;
}

function largestDifference(a: ThermalSolveResult, b: ThermalSolveResult): number {
  let d = 0;
  a.nodes.forEach((node, i) => node.temperaturesC.forEach((t, s) => (d = Math.max(d, Math.abs(t - b.nodes[i]!.temperaturesC[s]!)))));
  return d;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  for (const row of await thermalLoopsBench()) console.log(`${row.name}: ${row.value} ${row.unit}`.trimEnd());
}
