// Crash safety: the server process is killed (SIGKILL, no chance to clean up) in the middle of a
// large ephemeris import, once while it parses and checks the rows and once while it writes them in
// its transaction, and started again on the same data dir. The database passes
// PRAGMA integrity_check, no part of the ephemeris remains (no row, no point, no upload file), and
// the server answers.
import Database from 'better-sqlite3';
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { childSignIn, startChildServer, type ChildServer } from './child-server';

const rows = 200_000;
let dir: string;
let bigCsv: Buffer;

beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'eclipta-crash-'));
  // A 550 km circular orbit sampled every second (two-body, invented): valid in every row.
  const rKm = 6378.137 + 550;
  const periodS = 2 * Math.PI * Math.sqrt(rKm ** 3 / 398600.4418);
  const lines = ['epoch,x,y,z'];
  const t0 = Date.parse('2027-03-20T12:00:00Z');
  for (let i = 0; i < rows; i++) {
    const u = (2 * Math.PI * i) / periodS;
    lines.push(`${new Date(t0 + i * 1000).toISOString()},${(rKm * Math.cos(u)).toFixed(3)},${(rKm * Math.sin(u) * 0.2).toFixed(3)},${(rKm * Math.sin(u) * 0.98).toFixed(3)}`);
  }
  bigCsv = Buffer.from(lines.join('\n') + '\n');
  writeFileSync(path.join(dir, 'big.csv'), bigCsv);
});
afterAll(() => {
  rmSync(dir, { recursive: true, force: true });
});

const dataDir = () => path.join(dir, 'data');
const uploads = () => path.join(dataDir(), 'uploads');
const walSize = () => (existsSync(path.join(dataDir(), 'eclipta.db-wal')) ? statSync(path.join(dataDir(), 'eclipta.db-wal')).size : 0);
const spoolSize = () => (existsSync(uploads()) ? readdirSync(uploads()).filter((n) => n.endsWith('.points')).map((n) => statSync(path.join(uploads(), n)).size).reduce((a, b) => a + b, 0) : 0);

async function missionOf(server: ChildServer, cookie: string): Promise<string> {
  const res = await fetch(`${server.url}/api/v1/missions`, { headers: { cookie } });
  const body = (await res.json()) as { items: { id: string; bodyId: string }[] } | { id: string; bodyId: string }[];
  const items = Array.isArray(body) ? body : body.items;
  const earth = items.find((m) => m.bodyId === 'earth');
  if (!earth) throw new Error('no Earth mission in the demo seed');
  return earth.id;
}

/** Starts the big upload and SIGKILLs the server once `when` says so; answers what it saw then. */
async function killDuring(when: 'checking' | 'writing'): Promise<{ spool: number; wal: number }> {
  const server = await startChildServer(dataDir());
  const cookie = await childSignIn(server.url, 'analyst@kestrel.test');
  const missionId = await missionOf(server, cookie);
  const walBefore = walSize();
  const form = new FormData();
  form.append('frame', 'EME2000');
  form.append('name', `killed while ${when}`);
  form.append('file', new Blob([bigCsv]), 'big.csv');
  const answer = fetch(`${server.url}/api/v1/missions/${missionId}/ephemerides`, { method: 'POST', headers: { cookie }, body: form }).catch(() => null);
  let seen = { spool: 0, wal: 0 };
  for (let i = 0; i < 6000; i++) {
    seen = { spool: spoolSize(), wal: walSize() - walBefore };
    // checking: the point spool is being written; writing: the transaction is growing the WAL
    if (when === 'checking' ? seen.spool > 1_000_000 : seen.wal > 2_000_000) break;
    await new Promise((resolve) => setTimeout(resolve, 5));
  }
  server.child.kill('SIGKILL');
  await server.exited;
  const res = await answer;
  // the client never heard a success
  expect(res === null || res.status !== 201).toBe(true);
  return seen;
}

async function checkRecovered(): Promise<void> {
  const server = await startChildServer(dataDir());
  try {
    const health = await fetch(`${server.url}/api/health`);
    expect(await health.json()).toEqual({ status: 'ok' });
    const db = new Database(path.join(dataDir(), 'eclipta.db'), { readonly: true });
    try {
      expect(db.pragma('integrity_check', { simple: true })).toBe('ok');
      expect(db.pragma('foreign_key_check')).toEqual([]);
      expect((db.prepare('SELECT count(*) AS n FROM ephemerides').get() as { n: number }).n).toBe(0);
      expect((db.prepare('SELECT count(*) AS n FROM ephemeris_point_blocks').get() as { n: number }).n).toBe(0);
    } finally {
      db.close();
    }
    // what the killed request had written to uploads/ was removed at start-up
    expect(readdirSync(uploads())).toEqual([]);
    // and the server still takes an upload and answers it in full
    const cookie = await childSignIn(server.url, 'analyst@kestrel.test');
    const form = new FormData();
    form.append('frame', 'EME2000');
    form.append('file', new Blob([bigCsv.subarray(0, bigCsv.indexOf('\n', 5000) + 1)]), 'small.csv');
    const ok = await fetch(`${server.url}/api/v1/missions/${await missionOf(server, cookie)}/ephemerides`, { method: 'POST', headers: { cookie }, body: form });
    expect(ok.status).toBe(201);
    await fetch(`${server.url}/api/v1/missions/${await missionOf(server, cookie)}/ephemerides/${((await ok.json()) as { id: string }).id}`, { method: 'DELETE', headers: { cookie } });
  } finally {
    server.child.kill('SIGTERM');
    await server.exited;
  }
}

describe('a server killed during a large import', () => {
  it('keeps nothing of an import killed while its rows are checked', async () => {
    const seen = await killDuring('checking');
    expect(seen.spool).toBeGreaterThan(1_000_000);
    await checkRecovered();
  }, 240_000);

  it('keeps nothing of an import killed inside its write transaction', async () => {
    const seen = await killDuring('writing');
    expect(seen.wal).toBeGreaterThan(2_000_000);
    await checkRecovered();
  }, 240_000);
});
