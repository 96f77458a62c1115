// What signing every request costs: autocannon (100 connections) against Eclipta in its own process
// (seeded demo, fresh data dir, request log at info level) on an authenticated GET /api/v1/cases
// with a session cookie and with a personal API token, and GET /api/v1/auth/me, each beside its
// anchor measured in the same run: a bare Express app in a process of its own answering the very
// same JSON bytes the case list answered. The machine is shared and noisy, so the routes take turns
// in rounds (each round measures every route once) and each route's figure is its median over the
// rounds; the ratio is requests/s over the bare route's. Beside it, the CPU time the serving process
// used per answer (user + system, from /proc; steadier than requests/s when other work shares the
// cores). BENCH_AUTH_ROUNDS (default 3),
// BENCH_AUTH_DURATION_S (seconds per route and round, default 4) and BENCH_CONNECTIONS (default
// 100) change the run.
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { childSignIn, repoRoot, startChildServer } from '../tests/api/child-server';
import type { BenchRow } from './bench-table';

const connections = Number(process.env['BENCH_CONNECTIONS'] ?? 100);
const durationS = Number(process.env['BENCH_AUTH_DURATION_S'] ?? 4);
const rounds = Number(process.env['BENCH_AUTH_ROUNDS'] ?? 3);
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? NaN;

// The anchor: Express with nothing but one route sending a fixed JSON body, as res.json would.
const bareServer = `
const express = require('express');
const body = process.env.BARE_BODY;
const app = express();
app.get('/cases', (_req, res) => { res.type('application/json').send(body); });
const server = app.listen(0, () => console.log('listening ' + server.address().port));
`;

/** CPU time (user + system) a process has used, in ms; NaN where /proc is not there. */
function cpuMs(pid: number | undefined): number {
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]?.split(' ') ?? [];
    return (Number(fields[11]) + Number(fields[12])) * 10; // clock ticks of 10 ms
  } catch {
    return NaN;
  }
}

function startBare(body: string): Promise<{ url: string; pid: number | undefined; stop: () => Promise<void> }> {
  const child = spawn(process.execPath, ['-e', bareServer], { cwd: repoRoot, env: { ...process.env, BARE_BODY: body }, stdio: ['ignore', 'pipe', 'inherit'] });
  const exited = new Promise<void>((resolve) => child.on('exit', () => resolve()));
  const stop = async () => {
    child.kill('SIGTERM');
    await exited;
  };
  return new Promise((resolve, reject) => {
    child.stdout.on('data', (chunk: Buffer) => {
      const port = /listening (\d+)/.exec(chunk.toString('utf8'))?.[1];
      if (port) resolve({ url: `http://localhost:${port}`, pid: child.pid, stop });
    });
    void exited.then(() => reject(new Error('the bare Express server exited before listening')));
  });
}

async function rate(url: string, headers: Record<string, string>, pid: number | undefined): Promise<{ perS: number; p99: number; cpuUs: number }> {
  const cpuBefore = cpuMs(pid);
  const result = await autocannon({ url, connections, duration: durationS, headers, timeout: 30 });
  const cpuUs = ((cpuMs(pid) - cpuBefore) * 1000) / result.requests.total;
  const failures = result.errors + result.timeouts + result.non2xx;
  if (failures > 0 || result['2xx'] === 0) throw new Error(`${url}: ${failures} failed answers of ${result.requests.total}`);
  return { perS: result.requests.average, p99: result.latency.p99, cpuUs };
}

export interface AuthFigure {
  route: string;
  perS: number;
  p99: number;
  cpuUs: number;
}

/** Every route's median requests/s, p99 and server CPU per answer; the first is the bare Express anchor. */
export async function measureAuth(): Promise<AuthFigure[]> {
  const dir = mkdtempSync(path.join(tmpdir(), 'eclipta-auth-bench-'));
  const server = await startChildServer(dir);
  let bare: Awaited<ReturnType<typeof startBare>> | undefined;
  try {
    const cookie = await childSignIn(server.url, 'owner@kestrel.test');
    const made = await fetch(`${server.url}/api/v1/tokens`, {
      method: 'POST', headers: { cookie, 'content-type': 'application/json' }, body: JSON.stringify({ name: 'auth bench', readOnly: true }),
    });
    if (made.status !== 201) throw new Error(`creating an API token answered ${made.status}`);
    const { secret } = (await made.json()) as { secret: string };
    const listed = await fetch(`${server.url}/api/v1/cases`, { headers: { cookie } });
    const body = await listed.text();
    const cases = (JSON.parse(body) as { items: unknown[] }).items.length;
    bare = await startBare(body);

    const pid = server.child.pid;
    const runs: { route: string; url: string; headers: Record<string, string>; pid: number | undefined }[] = [
      { route: `bare Express, same JSON (${cases} cases, ${(body.length / 1024).toFixed(1)} kB)`, url: `${bare.url}/cases`, headers: {}, pid: bare.pid },
      { route: 'GET /api/v1/cases, session cookie', url: `${server.url}/api/v1/cases`, headers: { cookie }, pid },
      { route: 'GET /api/v1/cases, API token', url: `${server.url}/api/v1/cases`, headers: { authorization: `Bearer ${secret}` }, pid },
      { route: 'GET /api/v1/auth/me, session cookie', url: `${server.url}/api/v1/auth/me`, headers: { cookie }, pid },
      { route: 'GET /api/health (no authentication)', url: `${server.url}/api/health`, headers: {}, pid },
    ];
    // A short warm-up first so the JIT has seen every path before it is measured.
    for (const run of runs) await autocannon({ url: run.url, connections, duration: 1, headers: run.headers });
    const measured = runs.map(() => ({ perS: [] as number[], p99: [] as number[], cpuUs: [] as number[] }));
    for (let round = 0; round < rounds; round++) {
      for (const [i, run] of runs.entries()) {
        const { perS, p99, cpuUs } = await rate(run.url, run.headers, run.pid);
        measured[i]!.perS.push(perS);
        measured[i]!.p99.push(p99);
        measured[i]!.cpuUs.push(cpuUs);
      }
    }
    return runs.map((run, i) => ({
      route: run.route, perS: median(measured[i]!.perS), p99: median(measured[i]!.p99), cpuUs: median(measured[i]!.cpuUs),
    }));
  } finally {
    await bare?.stop();
    server.child.kill('SIGTERM');
    await server.exited;
    rmSync(dir, { recursive: true, force: true });
  }
}

export default async function authBench(): Promise<BenchRow[]> {
  const figures = await measureAuth();
  const anchor = figures[0]!.perS;
  const rows: BenchRow[] = figures.map((f) => ({
    route: f.route, 'req/s': Math.round(f.perS), 'p99 ms': f.p99, 'x bare Express': f.perS / anchor, 'server CPU us/answer': Math.round(f.cpuUs),
  }));
  rows.push({ route: `(${connections} connections, median of ${rounds} rounds of ${durationS} s; target: authenticated GET >= 0.5x bare Express)` });
  return rows;
}
