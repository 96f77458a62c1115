// Writes the example ephemerides of fixtures/ephemerides/ (an invented scenario: the "Kestrel-1"
// small satellite) by propagating Kepler orbits with shared/physics, and the malformed files of
// fixtures/ephemerides/bad/ that the upload tests expect to be refused.
// Run: npx tsx scripts/make-ephemeris-fixtures.ts   (deterministic: the same bytes every time)
//
// Elements are given in the body's IAU equatorial frame, the frame of POST /environment/compute,
// and rotated into ICRF axes (written as EME2000, which differs from ICRF by milliarcseconds), so
// the same orbit sent to the compute route and uploaded as an ephemeris describes one trajectory.
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { getBody, type Body } from '../shared/physics/bodies';
import { solveKepler, trueAnomalyFromEccentric } from '../shared/physics/kepler';
import { defineOrbit, type OrbitInput } from '../shared/physics/orbit-definition';
import { orbitBasis } from '../shared/physics/orbit-position';
import { bodyFrameAxes, julianDateTT } from '../shared/physics/sun';
import { fixtureEpoch, gtoOrbit, leoOrbit } from './ephemeris-fixture-orbits';
import type { Vector3 } from '../shared/physics/vector3';

const root = path.resolve(import.meta.dirname, '..', 'fixtures', 'ephemerides');
const bad = path.join(root, 'bad');


interface State {
  tMs: number;
  r: Vector3;
  v: Vector3;
}

/** Two-body states every stepS for durationS from periapsis (the ascending node when circular), ICRF axes. */
function propagate(body: Body, input: OrbitInput, epoch: string, stepS: number, durationS: number): State[] {
  const orbit = defineOrbit(input, body);
  const { p, q } = orbitBasis(orbit.inclinationRad, orbit.raanRad, orbit.argPeriapsisRad);
  const t0 = Date.parse(epoch);
  const axes = bodyFrameAxes(body, julianDateTT(new Date(t0)));
  const toIcrf = (b: Vector3): Vector3 => [
    axes.x[0] * b[0] + axes.y[0] * b[1] + axes.z[0] * b[2],
    axes.x[1] * b[0] + axes.y[1] * b[1] + axes.z[1] * b[2],
    axes.x[2] * b[0] + axes.y[2] * b[1] + axes.z[2] * b[2],
  ];
  const { semiMajorAxisKm: a, eccentricity: e, meanMotionRadS: n } = orbit;
  const semiLatus = a * (1 - e * e);
  const states: State[] = [];
  for (let t = 0; t <= durationS + 1e-9; t += stepS) {
    const nu = trueAnomalyFromEccentric(solveKepler(n * t, e), e);
    // conic equation; perifocal velocity sqrt(mu/p) (-sin nu, e + cos nu) (Vallado ch. 2)
    const r = semiLatus / (1 + e * Math.cos(nu));
    const k = Math.sqrt(body.gmKm3S2 / semiLatus);
    const [c, s] = [Math.cos(nu), Math.sin(nu)];
    const rB: Vector3 = [r * (c * p[0] + s * q[0]), r * (c * p[1] + s * q[1]), r * (c * p[2] + s * q[2])];
    const vB: Vector3 = [k * (-s * p[0] + (e + c) * q[0]), k * (-s * p[1] + (e + c) * q[1]), k * (-s * p[2] + (e + c) * q[2])];
    states.push({ tMs: t0 + t * 1000, r: toIcrf(rB), v: toIcrf(vB) });
  }
  return states;
}

const km = (x: number) => x.toFixed(6);
const kms = (x: number) => x.toFixed(9);
const iso = (tMs: number) => new Date(tMs).toISOString();

function csvLines(states: State[], scale = 1): string[] {
  return states.map((s) => [iso(s.tMs), ...s.r.map((x) => km(x * scale)), ...s.v.map((x) => kms(x * scale))].join(','));
}
const csvHeader = 'epoch,x,y,z,vx,vy,vz';

function oemText(states: State[], center: string, timeSystem: string): string {
  const epochOf = (tMs: number) => iso(tMs).replace('Z', '');
  const head = [
    'CCSDS_OEM_VERS = 2.0',
    'COMMENT Invented scenario for Eclipta: Kestrel-1 in a 550 km circular orbit (scripts/make-ephemeris-fixtures.ts)',
    'CREATION_DATE = 2026-01-05T09:00:00',
    'ORIGINATOR = ECLIPTA FIXTURES',
    '',
    'META_START',
    'OBJECT_NAME = KESTREL-1',
    'OBJECT_ID = KESTREL-1',
    `CENTER_NAME = ${center}`,
    'REF_FRAME = EME2000',
    `TIME_SYSTEM = ${timeSystem}`,
    `START_TIME = ${epochOf(states[0].tMs)}`,
    `STOP_TIME = ${epochOf(states[states.length - 1].tMs)}`,
    'META_STOP',
    '',
    'COMMENT Positions km, velocities km/s',
  ];
  const data = states.map((s) => [epochOf(s.tMs), ...s.r.map(km), ...s.v.map(kms)].join(' '));
  return [...head, ...data, ''].join('\n');
}

function write(dir: string, name: string, content: string | Buffer): void {
  writeFileSync(path.join(dir, name), content);
}

function main(): void {
  mkdirSync(bad, { recursive: true });
  const earth = getBody('earth');
  const leo = propagate(earth, leoOrbit, fixtureEpoch, 60, 4 * 3600);
  const gto = propagate(earth, gtoOrbit, fixtureEpoch, 60, 6 * 3600);

  const leoCsv = [csvHeader, ...csvLines(leo)];
  write(root, 'leo-circular.csv', leoCsv.join('\n') + '\n');
  write(root, 'leo-circular.oem', oemText(leo, 'EARTH', 'UTC'));
  // Seconds from an epoch given with the upload, positions only: velocities by finite differences.
  const t0 = gto[0].tMs;
  write(root, 'gto-transfer.csv', ['t,x,y,z', ...gto.map((s) => [((s.tMs - t0) / 1000).toFixed(3), ...s.r.map(km)].join(','))].join('\n') + '\n');
  // Accepted variants: a spreadsheet's UTF-8 byte-order mark, Windows line ends.
  const short = leoCsv.slice(0, 21);
  write(root, 'leo-bom.csv', '\uFEFF' + short.join('\n') + '\n');
  write(root, 'leo-crlf.csv', short.join('\r\n') + '\r\n');

  // Malformed files: each broken at a known row (row 1 is the first data row).
  const rows = csvLines(leo.slice(0, 12));
  const edit = (name: string, row: number, change: (cells: string[]) => string[]) => {
    const lines = rows.map((line, i) => (i + 1 === row ? change(line.split(',')).join(',') : line));
    write(bad, name, [csvHeader, ...lines].join('\n') + '\n');
  };
  edit('unparseable-line.csv', 3, (c) => [c[0], `${c[1].slice(0, 2)}"${c[1].slice(2)}`, ...c.slice(2)]);
  edit('missing-column.csv', 4, (c) => c.slice(0, 6));
  edit('extra-column.csv', 5, (c) => [...c, '0.0']);
  edit('non-numeric.csv', 2, (c) => [c[0], 'abc', ...c.slice(2)]);
  edit('nan-value.csv', 3, (c) => [c[0], c[1], 'NaN', ...c.slice(3)]);
  edit('infinity-value.csv', 4, (c) => [...c.slice(0, 3), 'Infinity', ...c.slice(4)]);
  edit('repeated-epoch.csv', 5, (c) => [rows[3].split(',')[0], ...c.slice(1)]);
  edit('decreasing-epoch.csv', 6, (c) => [iso(leo[2].tMs), ...c.slice(1)]);
  edit('below-surface.csv', 3, (c) => [c[0], ...c.slice(1, 4).map((x) => km(Number(x) * 0.9)), ...c.slice(4)]);
  write(bad, 'metres.csv', [csvHeader, ...csvLines(leo.slice(0, 12), 1000)].join('\n') + '\n');
  write(bad, 'wrong-center.oem', oemText(leo.slice(0, 12), 'MARS', 'UTC'));
  write(bad, 'non-utc.oem', oemText(leo.slice(0, 12), 'EARTH', 'TAI'));
  write(bad, 'empty.csv', '');
  write(bad, 'header-only.csv', csvHeader + '\n');
  write(bad, 'semicolons.csv', [csvHeader, ...rows].map((l) => l.replaceAll(',', ';')).join('\n') + '\n');
  write(bad, 'compressed.csv.gz', gzipSync(Buffer.from([csvHeader, ...rows].join('\n') + '\n'), { level: 9 }));
  // Deterministic noise (a linear congruential generator), NUL bytes included.
  const noise = Buffer.alloc(2048);
  let seed = 12345;
  for (let i = 0; i < noise.length; i++) {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    noise[i] = (seed >>> 16) & 0xff;
  }
  write(bad, 'binary-garbage.bin', noise);
  console.log(`wrote ${leo.length} LEO rows, ${gto.length} GTO rows and the malformed set to ${path.relative(process.cwd(), root)}`);
}

main();
