// The environment core against a plain numpy implementation of the same math
// (bench/reference/environment.py): (a) one orbit of 3600 steps and 20 surfaces through
// computeEnvironmentColumns - incident solar, albedo, IR and absorbed per surface per step in arrays,
// their averages and peaks, the eclipse: what the numpy side computes - and (a') the same orbit
// through computeEnvironment, the API's answer, which adds building 72,000 per-step objects that the
// numpy side does not do; (b) a ten-year mission, one orbit a day (3653 orbits x 360 steps x 6
// surfaces) with beta, eclipse and orbit-average loads through sweepMission; (c), (d) the same about
// Europa and the Moon with the planet's shadow, timed beside (b) and beside (b)'s figure before the
// planet's shadow was added (no numpy side for those); (f) the compute route's largest orbit,
// (a)'s orbit with one panel at 100,000 steps, against the 1 s the task asks of it; (g)-(j) the ten
// years of (b) with the surfaces pointed by attitude modes (yaw-steered, inertial, a Sun-pointing
// spinner, a mix) and (k) in five phases of two attitude modes, each timed in CPU time beside (b) (issue 19 asks for within 1.5x). Each side is timed
// inside its own process (median of several runs after warm-up); the answers are compared so the
// two cannot drift.
import { spawnSync } from 'node:child_process';
import { cpus, loadavg } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import earthData from 'astronomia/data/vsop87Bearth';
import { getBody } from '../shared/physics/bodies';
import { AU_KM, OBLIQUITY_J2000_DEG, SOLAR_CONSTANT_WM2, SUN_RADIUS_KM, TT_MINUS_UTC_S } from '../shared/physics/constants';
import { computeEnvironment, computeEnvironmentColumns, type EnvironmentRequest } from '../shared/physics/environment';
import { localNormal, type LocalVector, type NamedNormal, type Surface } from '../shared/physics/heat-loads';
import { apsidalRateRadS } from '../shared/physics/kepler';
import { sweepMission, type MissionSweepRequest } from '../shared/physics/mission-sweep';
import { defineOrbit, type OrbitInput } from '../shared/physics/orbit-definition';
import { sunTrackNodeDays } from '../shared/physics/sun-track';
import { unwrapVsopModule } from '../shared/physics/vsop87';
import type { BenchRow } from './bench-table';

const earth = getBody('earth');
const named = ['nadir', 'zenith', 'ram', 'wake', 'orbit-normal', 'anti-orbit-normal'] as const;
const panel = (name: string, normal: Surface['normal'], i: number): Surface => ({
  name, normal, areaM2: 0.1 + 0.02 * i, absorptivity: 0.2 + 0.03 * i, emissivity: 0.9 - 0.02 * i,
});
// 20 surfaces: the six faces and 14 tilted panels all round the local frame
const twenty: Surface[] = [
  ...named.map((n, i) => panel(n, n, i)),
  ...Array.from({ length: 14 }, (_, k) => {
    const [polar, azimuth] = [((k + 0.5) / 14) * Math.PI, k * 2.4];
    return panel(`tilted ${k + 1}`, { x: Math.sin(polar) * Math.cos(azimuth), y: Math.sin(polar) * Math.sin(azimuth), z: Math.cos(polar) }, k + 6);
  }),
];
const six = named.map((n, i) => panel(n, n, i));

export const caseA: EnvironmentRequest = {
  bodyId: 'earth', orbit: { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6, raanDeg: 30 },
  epoch: '2027-03-20T12:00:00Z', albedo: 0.3, olrWm2: 237, steps: 3600, surfaces: twenty,
};
const missionOrbit: OrbitInput = { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 51.6, raanDeg: 40 };
export const caseB: MissionSweepRequest = {
  bodyId: 'earth', orbit: missionOrbit, epochStart: '2027-01-01T12:00:00Z', days: 3652, stepDays: 1, steps: 360,
  surfaces: six, albedo: 0.3, olrWm2: 237,
};
// (c) and (d): the same ten years about a moon, with the planet's shadow (parent-shadow.ts) searched every day.
export const caseC: MissionSweepRequest = {
  ...caseB, bodyId: 'europa', orbit: { periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 85, raanDeg: 40 }, albedo: 0.68, olrWm2: 7,
};
export const caseD: MissionSweepRequest = {
  ...caseB, bodyId: 'moon', orbit: { periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 90, raanDeg: 40 }, albedo: 0.11, olrWm2: 300,
};
// (e): (d) with the Moon's own models (no OLR given): its surface temperature field and the Lambertian
// albedo by cap quadrature each day (mission-sweep.ts), as the compute route chooses.
const caseE: MissionSweepRequest = { ...caseD, olrWm2: undefined };
/** The orbit of (a) with one panel (API.md's example surface) at the compute route's most steps. */
const caseF: EnvironmentRequest = { ...caseA, steps: 100_000, surfaces: [{ name: 'nadir panel', normal: 'nadir', areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 }] };
// (g)-(j): (b) with its six surfaces pointed by attitude modes (pointing.ts) instead of fixed in the
// local frame: every face yaw-steered; every face fixed in inertial space (an inertial science mode);
// six plates on a spinner about the Sun (a Sun-pointing safe mode); and a mix of every moving form.
const pointedSix = (normalOf: (n: (typeof named)[number], i: number) => Surface['normal']): Surface[] => named.map((n, i) => panel(n, normalOf(n, i), i));
export const pointedCases: [string, MissionSweepRequest][] = [
  ['(g) as (b), every face yaw-steered', { ...caseB, surfaces: pointedSix((n) => ({ yawSteered: { normal: n } })) }],
  ['(h) as (b), every face fixed in inertial space', { ...caseB, surfaces: pointedSix((_, i) => ({ inertial: { raDeg: 60 * i, decDeg: -75 + 30 * i } })) }],
  ['(i) as (b), six plates on a spinner about the Sun', { ...caseB, surfaces: pointedSix((_, i) => ({ spin: { axis: 'sun', angleDeg: 30 * i } })) }],
  ['(j) as (b), a mix: two yaw-steered faces, an inertial face, a one-axis array, a spinner plate, a fixed face', {
    ...caseB,
    surfaces: pointedSix((n, i) => [{ yawSteered: { normal: 'nadir' } }, { yawSteered: { normal: 'anti-orbit-normal' } }, { inertial: { raDeg: 10, decDeg: 20 } },
      { trackSun: { axis: 'orbit-normal' } }, { spin: { axis: 'sun', angleDeg: 90 } }, 'zenith'][i] as Surface['normal']),
  }],
  // (k): a mission in phases (issue 19 item 3): five phases in two attitude modes (mission-sweep.ts
  // attitudeSpans), the six plates spinning about the Sun in a Sun-safe mode for the first two weeks and
  // a month in 2031, in the local frame as (b) otherwise; the phases in one mode share one surface list.
  ['(k) as (b) in five phases and two modes: a spinning Sun-safe mode 45 days, the local frame otherwise', {
    ...caseB,
    attitudeSpans: ((safe: Surface[]) => {
      const at = (date: string) => Date.parse(`${date}T00:00:00Z`);
      const span = (from: string, to: string, surfaces: Surface[]) => ({ fromMs: at(from), toMs: at(to), surfaces });
      return [
        span('2027-01-01', '2027-01-15', safe), span('2027-01-15', '2027-04-01', six), span('2027-04-01', '2031-06-01', six),
        span('2031-06-01', '2031-07-01', safe), span('2031-07-01', '2037-01-02', six),
      ];
    })(pointedSix((_, i) => ({ spin: { axis: 'sun', angleDeg: i === 1 ? 0 : i === 0 ? 180 : 90 } }))),
  }],
];
/**
 * (b) before the planet's shadow and the moon's own position were added (commit dd2c64e), measured
 * 2026-12-04 on the shared 2-core development machine, load average 4.1: the reference the moon
 * sweeps (c), (d) must stay under twice of (issue 13).
 */
const SWEEP_BEFORE_MS = 109.2;

/**
 * Median and best wall-clock time of `repeats` runs after `warmUp` runs, and the median and best of
 * the process's CPU time (user + system, ms) per run: on the shared development machine (load
 * averages of 10 to 20 on 2 cores) a ratio of wall-clock times swings by 3x between neighbouring
 * runs, the CPU time far less.
 */
export function timeRuns(run: () => unknown, warmUp: number, repeats: number): { median: number; best: number; cpuMedian: number; cpuBest: number } {
  for (let i = 0; i < warmUp; i++) run();
  const times: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const started = performance.now();
    const cpuStarted = process.cpuUsage();
    run();
    const used = process.cpuUsage(cpuStarted);
    times.push(performance.now() - started);
    cpu.push((used.user + used.system) / 1000);
  }
  const median = (values: number[]) => [...values].sort((x, y) => x - y)[Math.floor(values.length / 2)];
  return { median: median(times), best: Math.min(...times), cpuMedian: median(cpu), cpuBest: Math.min(...cpu) };
}

function orbitJob(input: OrbitInput) {
  const o = defineOrbit(input, earth);
  return {
    a: o.semiMajorAxisKm, e: o.eccentricity, i: o.inclinationRad, raan: o.raanRad, argp: o.argPeriapsisRad,
    n: o.meanMotionRadS, T: o.periodS, nodalRate: o.nodalRateRadS,
    apsidalRate: o.circular ? 0 : apsidalRateRadS(earth, o.semiMajorAxisKm, o.eccentricity, o.inclinationRad),
  };
}

const surfaceJob = (surfaces: Surface[]) => ({
  normals: surfaces.map((s) => localNormal(s.normal as NamedNormal | LocalVector, [0, 0, 1])),
  areaM2: surfaces.map((s) => s.areaM2), absorptivity: surfaces.map((s) => s.absorptivity), emissivity: surfaces.map((s) => s.emissivity),
});

export function findNumpy(): string | null {
  for (const python of ['python3', '/usr/bin/python3']) {
    const probe = spawnSync(python, ['-c', 'import numpy'], { encoding: 'utf8' });
    if (probe.status === 0) return python;
  }
  return null;
}

export interface NumpyCase {
  name: string;
  medianMs: number;
  bestMs: number;
  result: Record<string, number[] | number[][]>;
}

/** Case (a) as a job for the numpy reference, run `repeats` times there. */
export const orbitCaseJob = (repeats: number) => ({
  name: 'a', kind: 'orbit', repeats, orbit: orbitJob(caseA.orbit), epochMs: Date.parse(caseA.epoch ?? ''), steps: caseA.steps,
  albedo: 0.3, olrWm2: 237, ...surfaceJob(twenty),
});

/** Runs bench/reference/environment.py on the given cases; its medians, bests and results. */
export function runNumpy(python: string, repeats: number, cases: object[]): { numpy: string; cases: NumpyCase[] } {
  const job = {
    repeats,
    vsop: unwrapVsopModule(earthData),
    obliquityDeg: OBLIQUITY_J2000_DEG, ttMinusUtcS: TT_MINUS_UTC_S, solarConstantWm2: SOLAR_CONSTANT_WM2, auKm: AU_KM, sunRadiusKm: SUN_RADIUS_KM,
    body: { radiusKm: earth.radiusKm },
    cases,
  };
  const script = path.join(path.dirname(fileURLToPath(import.meta.url)), 'reference', 'environment.py');
  const run = spawnSync(python, [script], { input: JSON.stringify(job), encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
  if (run.status !== 0) throw new Error(`the numpy reference failed: ${run.stderr}`);
  return JSON.parse(run.stdout) as { numpy: string; cases: NumpyCase[] };
}

const maxRelative = (ours: number[], theirs: number[]): number =>
  Math.max(...ours.map((v, i) => Math.abs(v - theirs[i]) / Math.max(1e-9, Math.abs(theirs[i]))));
const maxAbsolute = (ours: number[], theirs: number[]): number => Math.max(...ours.map((v, i) => Math.abs(v - theirs[i])));

export default async function environmentBench(): Promise<BenchRow[]> {
  const repeats = Number(process.env['ECLIPTA_BENCH_REPEATS'] ?? 7);
  // (a) takes a few milliseconds, so it gets more runs than (b) on both sides to steady the median.
  const repeatsA = repeats * 6;
  let columnsA = computeEnvironmentColumns(caseA);
  const timeA = timeRuns(() => (columnsA = computeEnvironmentColumns(caseA)), 10, repeatsA);
  let resultA = computeEnvironment(caseA);
  const timeAnswer = timeRuns(() => (resultA = computeEnvironment(caseA)), 5, repeatsA);
  let resultB = sweepMission(caseB);
  const timeB = timeRuns(() => (resultB = sweepMission(caseB)), 2, repeats);

  const timeC = timeRuns(() => sweepMission(caseC), 1, repeats);
  const timeD = timeRuns(() => sweepMission(caseD), 1, repeats);
  const timeE = timeRuns(() => sweepMission(caseE), 1, repeats);
  const timeF = timeRuns(() => computeEnvironment(caseF), 1, repeats);
  const row = (name: string, time: { median: number; best: number }): BenchRow => ({ case: name, 'eclipta ms': time.median, 'eclipta best ms': time.best });
  const moonRow = (name: string, time: { median: number; best: number; cpuMedian: number }): BenchRow => ({
    ...row(name, time),
    'CPU ms': time.cpuMedian,
    'CPU ratio to (b)': `${(time.cpuMedian / timeB.cpuMedian).toFixed(2)}x`,
    'largest difference': `${(time.median / timeB.median).toFixed(2)}x (b) of this run; ${(time.median / SWEEP_BEFORE_MS).toFixed(2)}x (b) before the planet's shadow (${SWEEP_BEFORE_MS} ms)`,
    'under 2x (b)': time.median < 2 * timeB.median ? 'yes' : 'NO',
  });
  // (b) again right beside each pointed sweep, so both see the same machine load
  const pointedRows = pointedCases.map(([name, request]): BenchRow => {
    const fixed = timeRuns(() => sweepMission(caseB), 1, repeats);
    const pointed = timeRuns(() => sweepMission(request), 1, repeats);
    return {
      case: `${name} (CPU ms)`, 'eclipta ms': pointed.cpuMedian, 'eclipta best ms': pointed.cpuBest,
      'largest difference': `${(pointed.cpuMedian / fixed.cpuMedian).toFixed(2)}x the CPU time of (b) with fixed normals timed beside it (${fixed.cpuMedian.toFixed(1)} ms)`,
      'within 1.5x (b)': pointed.cpuMedian <= 1.5 * fixed.cpuMedian ? 'yes' : 'NO',
    };
  });
  const rowC = moonRow('(c) 10 years about Europa, as (b), with Jupiter\'s shadow', timeC);
  const rowD = moonRow('(d) 10 years about the Moon, as (b), with Earth\'s shadow (lunar eclipses)', timeD);
  const rowE = moonRow('(e) as (d) with the Moon\'s surface temperature field for IR (cap quadrature each day)', timeE);
  const rowA = row('(a) one orbit, 3600 steps x 20 surfaces: loads in arrays, averages, peaks, eclipse', timeA);
  const rowAnswer = row("(a') the same, as the API answer: (a) plus building 72,000 per-step objects (numpy builds none)", timeAnswer);
  const rowB: BenchRow = { ...row('(b) 10 years, 3653 orbits x 360 steps x 6 surfaces', timeB), 'CPU ms': timeB.cpuMedian };
  const rowF = { ...row('(f) one orbit, 100,000 steps x 1 surface, as the API answer', timeF), 'under 1 s': timeF.median < 1000 ? 'yes' : 'NO' };
  const python = findNumpy();
  if (!python) {
    rowA['numpy ms'] = rowAnswer['numpy ms'] = rowB['numpy ms'] = 'skipped: no python3 with numpy on PATH or at /usr/bin/python3';
    return [rowA, rowAnswer, rowB, rowC, rowD, rowE, rowF, ...pointedRows];
  }
  const answer = runNumpy(python, repeats, [
    orbitCaseJob(repeatsA),
    {
      name: 'b', kind: 'sweep', orbit: orbitJob(missionOrbit), startMs: Date.parse(String(caseB.epochStart)), orbitEpochMs: Date.parse(String(caseB.epochStart)),
      rows: resultB.rows.length, stepDays: 1, nodeDays: sunTrackNodeDays(earth), steps: 360, albedo: 0.3, olrWm2: 237, ...surfaceJob(six),
    },
  ]);
  const [a, b] = answer.cases;

  // Every average and peak of every surface, and the eclipse, against numpy's.
  const components = [['solarWm2', 'solar'], ['albedoWm2', 'albedo'], ['irWm2', 'ir'], ['absorbedW', 'absorbed']] as const;
  const loadsA = Math.max(...components.flatMap(([ours, theirs]) => [
    maxRelative([...columnsA.averages[ours]], a.result[`${theirs}Average`] as number[]),
    maxRelative([...columnsA.loads.peaks[ours]], a.result[`${theirs}Peak`] as number[]),
  ]));
  const agreeA = `loads avg+peak ${loadsA.toExponential(1)} rel, eclipse ${Math.abs(columnsA.eclipse.eclipseFraction - (a.result['eclipseFraction'] as number[])[0]).toExponential(1)}`;
  const answerLoads = Math.max(...components.flatMap(([ours, theirs]) => [
    maxRelative(resultA.orbitAverage.surfaces.map((s) => s[ours]), a.result[`${theirs}Average`] as number[]),
    maxRelative(resultA.peak.surfaces.map((s) => s[ours]), a.result[`${theirs}Peak`] as number[]),
  ]));
  const agreeAnswer = `loads avg+peak ${answerLoads.toExponential(1)} rel, eclipse ${Math.abs(resultA.eclipseFraction - (a.result['eclipseFraction'] as number[])[0]).toExponential(1)}`;
  const betaB = maxAbsolute(resultB.rows.map((r) => r.betaDeg), b.result['betaDeg'] as number[]);
  const eclipseB = maxAbsolute(resultB.rows.map((r) => r.eclipseFraction), b.result['eclipseFraction'] as number[]);
  const absorbedB = maxRelative(resultB.rows.flatMap((r) => r.surfaces.map((s) => s.absorbedW)), (b.result['absorbedAverage'] as number[][]).flat());
  const agreeB = `beta ${betaB.toExponential(1)} deg, eclipse ${eclipseB.toExponential(1)}, absorbed ${absorbedB.toExponential(1)} rel`;

  for (const [target, numpy, agree] of [[rowA, a, agreeA], [rowAnswer, a, agreeAnswer], [rowB, b, agreeB]] as const) {
    target['numpy ms'] = numpy.medianMs;
    target['numpy best ms'] = numpy.bestMs;
    target['ratio (numpy / eclipta)'] = `${(numpy.medianMs / (target['eclipta ms'] as number)).toFixed(2)}x`;
    target['best ratio'] = `${(numpy.bestMs / (target['eclipta best ms'] as number)).toFixed(2)}x`;
    target['largest difference'] = agree;
  }
  rowB['under 1 s'] = timeB.median < 1000 ? 'yes' : 'NO';
  const note = `numpy ${answer.numpy} (${python}), node ${process.version}, median and best of ${repeats} runs (a and a': ${repeatsA} on each side), ` +
    `ms of wall clock, load average ${loadavg()[0].toFixed(1)} on ${cpus().length} cores`;
  return [rowA, rowAnswer, rowB, rowC, rowD, rowE, rowF, ...pointedRows, { case: note }];
}
