// Ephemeris upload (issue 6): 100,000 and 1,000,000 rows of CSV through POST /missions/:id/ephemerides
// of a real server process, against csv-parse alone reading the same file (target: at least half its
// throughput), with the server's peak resident memory (target: under 300 MB, no larger for the
// bigger file). Each size gets a fresh server (node --import tsx server/main.ts, temp data dir), so
// its peak is its own. Uploads and csv-parse-alone runs alternate, RUNS of each, and the medians
// are compared (this machine's speed drifts between runs; a single pair can mislead either way).
// Memory is from /proc (Linux): the server's resident size when idle before the first upload, and
// its peak (VmHWM, reset through clear_refs just before the uploads) while they run.
import { spawn, type ChildProcess } from 'node:child_process';
import { createReadStream, mkdtempSync, openAsBlob, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';
import { parse } from 'csv-parse';
import { csvParseOptions } from '../server/ephemerides/csv-ephemeris';
import type { BenchRow } from './bench-table';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const sizes = [100_000, 1_000_000];
const RUNS = Number(process.env['BENCH_RUNS'] ?? 3);
const median = (xs: number[]): number => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** A 550 km circular equatorial orbit every 10 s, positions and velocities (about 100 bytes a row). */
function writeCsv(file: string, rows: number): void {
  const r = 6928.137;
  const w = Math.sqrt(398600.4418 / r ** 3);
  const t0 = Date.parse('2027-03-20T12:00:00Z');
  const lines = ['epoch,x,y,z,vx,vy,vz'];
  for (let i = 0; i < rows; i++) {
    const a = w * i * 10;
    lines.push([
      new Date(t0 + i * 10_000).toISOString(), (r * Math.cos(a)).toFixed(6), (r * Math.sin(a)).toFixed(6), '0.000000',
      (-r * w * Math.sin(a)).toFixed(9), (r * w * Math.cos(a)).toFixed(9), '0.000000000',
    ].join(','));
  }
  writeFileSync(file, lines.join('\n') + '\n');
}

/** csv-parse with the server's own options and read size, counting records in 'data' callbacks as the server does. */
async function csvParseAlone(file: string): Promise<number> {
  const started = performance.now();
  let rows = 0;
  const parser = createReadStream(file, { highWaterMark: 256 * 1024 }).pipe(parse(csvParseOptions));
  await new Promise<void>((resolve, reject) => {
    parser.on('data', (record: unknown) => {
      if (Array.isArray(record)) rows++;
    });
    parser.on('end', resolve);
    parser.on('error', reject);
  });
  return (rows - 1) / ((performance.now() - started) / 1000);
}

interface Server {
  child: ChildProcess;
  url: string;
}

function startServer(dataDir: string): Promise<Server> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: root,
    env: { ...process.env, PORT: '0', ECLIPTA_DATA_DIR: dataDir, ECLIPTA_DB_PATH: path.join(dataDir, 'eclipta.db'), ECLIPTA_UPLOAD_LIMIT_MB: '1000', ECLIPTA_LOG_LEVEL: 'info', ECLIPTA_CLIENT_DIR: path.join(dataDir, 'no-client') },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  return new Promise((resolve, reject) => {
    child.on('exit', (code) => reject(new Error(`the server exited with ${code}`)));
    const lines = createInterface({ input: child.stdout! });
    lines.on('line', (line) => {
      const match = /"url":"(http:\/\/localhost:\d+)"/.exec(line);
      if (match) resolve({ child, url: match[1] });
    });
  });
}

const statusMb = (pid: number, field: 'VmHWM' | 'VmRSS'): number => {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = Number(new RegExp(`${field}:\\s+(\\d+)`).exec(status)?.[1] ?? NaN);
  return kb / 1024;
};

/** Resets the peak to the current size (Linux clear_refs 5); false where that is not allowed. */
function resetPeak(pid: number): boolean {
  try {
    writeFileSync(`/proc/${pid}/clear_refs`, '5');
    return true;
  } catch {
    return false;
  }
}

interface Session {
  server: Server;
  cookie: string;
  missionId: string;
}

async function openSession(server: Server): Promise<Session> {
  const json = (body: unknown) => ({ method: 'POST', headers: { 'content-type': 'application/json', origin: server.url }, body: JSON.stringify(body) });
  const signIn = await fetch(`${server.url}/api/v1/auth/sign-in`, json({ email: 'analyst@kestrel.test', password: process.env['ECLIPTA_DEMO_PASSWORD'] ?? 'eclipta-demo' }));
  const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
  const created = await fetch(`${server.url}/api/v1/missions`, { ...json({ name: 'Bench mission', bodyId: 'earth', startDate: '2027-03-01', endDate: '2027-12-31' }), headers: { ...json({}).headers, cookie } });
  const mission = (await created.json()) as { id: string };
  return { server, cookie, missionId: mission.id };
}

/** One upload as Eclipta's own screen sends it (the frame first, then the file); seconds to the answer. */
async function ingest(session: Session, file: string): Promise<number> {
  const { server, cookie, missionId } = session;
  const form = new FormData();
  form.append('frame', 'EME2000');
  form.append('file', await openAsBlob(file), path.basename(file));
  const started = performance.now();
  const res = await fetch(`${server.url}/api/v1/missions/${missionId}/ephemerides`, { method: 'POST', headers: { cookie, origin: server.url }, body: form });
  await res.arrayBuffer();
  if (res.status !== 201) throw new Error(`the upload of ${path.basename(file)} answered ${res.status}`);
  return (performance.now() - started) / 1000;
}

export default async function ephemerisIngestBench(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  for (const size of sizes) {
    const dir = mkdtempSync(path.join(tmpdir(), 'eclipta-bench-ephemeris-'));
    const file = path.join(dir, `orbit-${size}.csv`);
    try {
      writeCsv(file, size);
      const server = await startServer(path.join(dir, 'data'));
      try {
        const session = await openSession(server);
        const pid = server.child.pid!;
        const idleMb = statusMb(pid, 'VmRSS');
        const peakReset = resetPeak(pid);
        const alone: number[] = [];
        const seconds: number[] = [];
        for (let run = 0; run < RUNS; run++) {
          alone.push(await csvParseAlone(file));
          seconds.push(await ingest(session, file));
        }
        const shares = seconds.map((s, i) => (100 * size) / s / alone[i]);
        const throughput = size / median(seconds);
        const peakMb = statusMb(pid, 'VmHWM');
        rows.push({
          rows: size,
          'file MB': readFileSync(file).length / 1e6,
          'upload+ingest s': median(seconds),
          'ingest rows/s': Math.round(throughput),
          'csv-parse alone rows/s': Math.round(median(alone)),
          'share of csv-parse': `${Math.round((100 * throughput) / median(alone))} % (runs ${Math.round(Math.min(...shares))}-${Math.round(Math.max(...shares))} %; target >= 50 %)`,
          'server idle RSS MB': Math.round(idleMb),
          [peakReset ? 'peak RSS while ingesting MB' : 'peak RSS since start MB']: Math.round(peakMb),
          'rise MB': Math.round(peakMb - idleMb),
        });
      } finally {
        server.child.removeAllListeners('exit');
        server.child.kill('SIGTERM');
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }
  return rows;
}
