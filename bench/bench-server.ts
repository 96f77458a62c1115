// What the benches that talk to a real server share: a server process of its own (node --import tsx
// server/main.ts on a free port, its own data directory), a signed-in demo session with a mission,
// its memory from /proc, and the ephemeris CSV the ingest benches upload.
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { openAsBlob, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';
import { meanMotionRadS } from '../shared/physics/kepler';

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
export const median = (xs: number[]): number => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** A 550 km circular equatorial orbit every 10 s, positions and velocities (about 100 bytes a row). */
export function writeCsv(file: string, rows: number): void {
  const r = 6928.137;
  const w = meanMotionRadS(r, 398600.4418);
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

export interface Server {
  child: ChildProcess;
  url: string;
}

/**
 * The bench-only route that answers the compute request the way the route did before issue 16
 * (bench/issue16-anchor-route.ts), on a server started with `anchorRoute`.
 */
export const ISSUE16_ANCHOR_PATH = '/api/v1/bench/environment/compute-as-before';

/** A server of its own; `anchorRoute` adds the bench-only route above (never part of the product). */
export function startServer(dataDir: string, clientDir = path.join(dataDir, 'no-client'), options: { anchorRoute?: boolean } = {}): Promise<Server> {
  const preload = options.anchorRoute ? ['--import', './bench/issue16-anchor-route.ts'] : [];
  const child = spawn(process.execPath, ['--import', 'tsx', ...preload, 'server/main.ts'], {
    cwd: root,
    env: { ...process.env, PORT: '0', ECLIPTA_DATA_DIR: dataDir, ECLIPTA_DB_PATH: path.join(dataDir, 'eclipta.db'), ECLIPTA_UPLOAD_LIMIT_MB: '1000', ECLIPTA_LOG_LEVEL: 'info', ECLIPTA_CLIENT_DIR: clientDir },
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

export const statusMb = (pid: number, field: 'VmHWM' | 'VmRSS'): number => {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = Number(new RegExp(`${field}:\\s+(\\d+)`).exec(status)?.[1] ?? NaN);
  return kb / 1024;
};

let ticksPerSecond = 0;

/** CPU time (user + system, every thread) a process has used, in ms, from /proc (clock ticks, 10 ms on Linux). */
export function processCpuMs(pid: number): number {
  ticksPerSecond ||= Number(execFileSync('getconf', ['CLK_TCK'], { encoding: 'utf8' }).trim()) || 100;
  // The fields after the command's closing parenthesis: utime and stime are the 12th and 13th.
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / ticksPerSecond;
}

/** Resets the peak to the current size (Linux clear_refs 5); false where that is not allowed. */
export function resetPeak(pid: number): boolean {
  try {
    writeFileSync(`/proc/${pid}/clear_refs`, '5');
    return true;
  } catch {
    return false;
  }
}

export interface Session {
  server: Server;
  cookie: string;
  missionId: string;
}

export async function openSession(server: Server): Promise<Session> {
  const json = (body: unknown) => ({ method: 'POST', headers: { 'content-type': 'application/json', origin: server.url }, body: JSON.stringify(body) });
  const signIn = await fetch(`${server.url}/api/v1/auth/sign-in`, json({ email: 'analyst@kestrel.test', password: process.env['ECLIPTA_DEMO_PASSWORD'] ?? 'eclipta-demo' }));
  const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
  const created = await fetch(`${server.url}/api/v1/missions`, { ...json({ name: 'Bench mission', bodyId: 'earth', startDate: '2027-03-01', endDate: '2027-12-31' }), headers: { ...json({}).headers, cookie } });
  const mission = (await created.json()) as { id: string };
  return { server, cookie, missionId: mission.id };
}

/** One upload as Eclipta's own screen sends it (the frame first, then the file); seconds to the answer. */
export async function ingest(session: Session, file: string): Promise<number> {
  const { server, cookie, missionId } = session;
  const form = new FormData();
  form.append('frame', 'EME2000');
  form.append('file', await openAsBlob(file), path.basename(file));
  const started = performance.now();
  const res = await fetch(`${server.url}/api/v1/missions/${missionId}/ephemerides`, { method: 'POST', headers: { cookie, origin: server.url }, body: form }).catch((error: unknown) => {
    throw new Error(`the upload of ${path.basename(file)} failed: ${String((error as { cause?: unknown }).cause ?? error)}`);
  });
  await res.arrayBuffer();
  if (res.status !== 201) throw new Error(`the upload of ${path.basename(file)} answered ${res.status}`);
  return (performance.now() - started) / 1000;
}

