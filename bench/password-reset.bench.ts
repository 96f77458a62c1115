// Does a password reset request tell, by its time, whether the address has an account? Times the
// answer for a demo user's address and for an unknown one, interleaved, against a server in its own
// process (as an attacker sees it, and as the server's request log has it), and gives their ratios:
// about 1 when the request path is the same. Requests are 150 ms apart so the background work of
// one (look-up, reset row, mail) is done before the next; the rate limits' counts are cleared in
// the bench server's own database before each request, so every answer is a 202.
import Database from 'better-sqlite3';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { startChildServer } from '../tests/api/child-server';
import type { BenchRow } from './bench-table';

const rounds = 120;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? NaN;
const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

export default async function passwordResetBench(): Promise<BenchRow[]> {
  const dir = mkdtempSync(path.join(tmpdir(), 'eclipta-reset-bench-'));
  const server = await startChildServer(dir);
  const db = new Database(path.join(dir, 'eclipta.db'));
  db.pragma('busy_timeout = 5000');
  const times: Record<'known' | 'unknown', number[]> = { known: [], unknown: [] };
  try {
    for (let i = 0; i < rounds; i++) {
      for (const kind of i % 2 === 0 ? (['known', 'unknown'] as const) : (['unknown', 'known'] as const)) {
        db.prepare('DELETE FROM rate_limit_hits').run();
        await pause(150);
        const email = kind === 'known' ? 'owner@kestrel.test' : 'nobody-here@kestrel.test';
        const started = performance.now();
        const res = await fetch(`${server.url}/api/v1/auth/password-reset`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email }) });
        await res.arrayBuffer();
        const ms = performance.now() - started;
        if (res.status !== 202) throw new Error(`reset request answered ${res.status}`);
        if (i >= 10) times[kind].push(ms); // the first rounds warm up
      }
    }
  } finally {
    db.close();
    server.child.kill('SIGTERM');
    await server.exited;
    rmSync(dir, { recursive: true, force: true });
  }
  const known = median(times.known);
  const unknown = median(times.unknown);
  // The server's own time for each answer, from its request log (in the order sent: two a round,
  // the known address first in even rounds).
  const serverMs = server.output
    .filter((l) => l.includes('"path":"/api/v1/auth/password-reset"'))
    .map((l) => Number(/"ms":([\d.]+)/.exec(l)?.[1]));
  const serverTimes: Record<'known' | 'unknown', number[]> = { known: [], unknown: [] };
  serverMs.forEach((ms, n) => {
    const round = Math.floor(n / 2);
    const knownFirst = round % 2 === 0;
    if (round >= 10) serverTimes[(n % 2 === 0) === knownFirst ? 'known' : 'unknown'].push(ms);
  });
  const serverKnown = median(serverTimes.known);
  const serverUnknown = median(serverTimes.unknown);
  return [
    { name: `client: address with an account (median of ${times.known.length})`, value: known, unit: 'ms' },
    { name: `client: address without one (median of ${times.unknown.length})`, value: unknown, unit: 'ms' },
    { name: 'client: ratio known / unknown', value: known / unknown, unit: '' },
    { name: 'server log: address with an account (median)', value: serverKnown, unit: 'ms' },
    { name: 'server log: address without one (median)', value: serverUnknown, unit: 'ms' },
    { name: 'server log: ratio known / unknown', value: serverKnown / serverUnknown, unit: '' },
  ];
}
