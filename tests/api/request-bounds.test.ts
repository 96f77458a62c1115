// One request cannot take the server down (issue 12, item 7), on a real server process
// (tests/api/child-server.ts): the largest environment one request may ask for is answered while
// /api/health keeps answering and the process stays well under 600 MB; one sample over it is
// refused before any work; and an upload that stalls half way is dropped after the idle timeout.
// The limits are this project's own choices (server/work-limit.ts, README "Configuration"); no source.
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { request as httpRequest } from 'node:http';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import express from 'express';
import request from 'supertest';
import { sendJson } from '../../server/json-stream';
import { MAX_SAMPLES } from '../../server/work-limit';
import { childSignIn, startChildServer, type ChildServer } from './child-server';

let dir: string;
let server: ChildServer;
let viewer: string;
beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), 'eclipta-bounds-'));
  server = await startChildServer(path.join(dir, 'data'));
  viewer = await childSignIn(server.url, 'viewer@kestrel.test');
}, 90_000);
afterAll(async () => {
  server.child.kill('SIGTERM');
  await server.exited;
  rmSync(dir, { recursive: true, force: true });
});

const surfaceNames = ['nadir', 'zenith', 'ram', 'wake', 'orbit-normal', 'anti-orbit-normal', 'sun'] as const;
const computeBody = (steps: number, surfaceCount: number) => JSON.stringify({
  bodyId: 'earth',
  orbit: { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6 },
  betaDeg: 20,
  steps,
  surfaces: Array.from({ length: surfaceCount }, (_, i) => ({ name: `panel ${i + 1}`, normal: surfaceNames[i % surfaceNames.length], areaM2: 0.5, absorptivity: 0.3, emissivity: 0.8 })),
});

/** The process's peak resident memory so far (Linux /proc), MB. */
function peakRssMb(pid: number): number {
  const match = /VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
  if (!match?.[1]) throw new Error('no VmHWM in /proc');
  return Number(match[1]) / 1024;
}

describe('the work one request may ask for', () => {
  it(`over ${MAX_SAMPLES} samples (the attack's 100,000 steps × 50 surfaces) is refused with 413 naming steps × surfaces and the limit`, async () => {
    const res = await fetch(`${server.url}/api/v1/environment/compute`, { method: 'POST', headers: { cookie: viewer, 'content-type': 'application/json' }, body: computeBody(100_000, 50) });
    expect(res.status).toBe(413);
    const body = (await res.json()) as { error: { code: string; message: string; details: { path: string }[] } };
    expect(body.error.code).toBe('too_much_work');
    expect(body.error.message).toContain('Steps × surfaces = 100,000 × 50 = 5,000,000 samples');
    expect(body.error.message).toContain('500,000');
    expect(body.error.details[0]?.path).toBe('steps');
  });

  it('at the limit (100,000 steps × 5 surfaces) is answered whole, /api/health answers meanwhile, and the process stays under 600 MB', async () => {
    const steps = 100_000;
    const surfaces = MAX_SAMPLES / steps;
    // The big answer is read as bytes (parsed only at the end), so its last byte is seen when it
    // arrives; each health answer notes when its status came back. Order only, no timing limit.
    // The big answer is read slowly: once its first bytes arrive the reading pauses, so the
    // server is still writing it (it waits for the socket to drain) while /api/health is asked.
    // Order only, no timing limit, so a busy machine cannot make it fail.
    let bigEnded = false;
    let resumeBig: () => void = () => undefined;
    let resumeReading: () => void = () => undefined;
    const firstBytes = new Promise<void>((seen) => {
      resumeBig = seen;
    });
    const big = new Promise<{ status: number; bytes: Buffer }>((resolve, reject) => {
      const payload = computeBody(steps, surfaces);
      const req = httpRequest(`${server.url}/api/v1/environment/compute`, { method: 'POST', headers: { cookie: viewer, 'content-type': 'application/json', 'content-length': Buffer.byteLength(payload) } }, (res) => {
        const chunks: Buffer[] = [];
        res.once('data', (chunk: Buffer) => {
          chunks.push(chunk);
          res.pause();
          resumeBig();
          res.on('data', (more: Buffer) => chunks.push(more));
        });
        res.on('end', () => {
          bigEnded = true;
          resolve({ status: res.statusCode ?? 0, bytes: Buffer.concat(chunks) });
        });
        res.on('error', reject);
        resumeReading = () => res.resume();
      });
      req.on('error', reject);
      req.end(payload);
    });
    await firstBytes;
    const healthBeforeBigEnded: number[] = [];
    for (let i = 0; i < 3; i++) {
      const health = await fetch(`${server.url}/api/health`);
      await health.arrayBuffer();
      if (!bigEnded) healthBeforeBigEnded.push(health.status);
    }
    resumeReading();
    const answer = await big;
    expect(answer.status).toBe(200);
    const body = JSON.parse(answer.bytes.toString('utf8')) as { profile: { surfaces: unknown[] }[] };
    expect(body.profile).toHaveLength(steps);
    expect(body.profile[steps - 1]?.surfaces).toHaveLength(surfaces);
    expect(healthBeforeBigEnded.length).toBeGreaterThan(0);
    expect(healthBeforeBigEnded.every((s) => s === 200)).toBe(true);
    if (process.env['ECLIPTA_BOUNDS_LOG']) console.log(`peak RSS ${peakRssMb(server.child.pid ?? 0).toFixed(0)} MB, ${healthBeforeBigEnded.length} health answers before the big one ended`);
    expect(peakRssMb(server.child.pid ?? 0)).toBeLessThan(600);
  }, 120_000);
});

describe('a large answer written a piece at a time', () => {
  it('is the same text as JSON.stringify of it (key order, undefined members, nested long arrays, toJSON)', async () => {
    const value = {
      name: 'profile',
      skipped: undefined,
      when: new Date('2027-03-20T12:00:00Z'),
      profile: Array.from({ length: 1234 }, (_, i) => ({ tS: i * 0.5, gone: undefined, surfaces: [{ name: `s${i % 3}`, absorbedW: i / 7 }] })),
      nested: { series: Array.from({ length: 777 }, (_, i) => (i % 5 === 0 ? null : i)), holes: [undefined, 1] },
      tail: [1, 2, 3],
    };
    const app = express();
    app.get('/big', async (_req, res) => sendJson(res, value));
    const res = await request(app).get('/big').buffer(true).parse((r, done) => {
      let text = '';
      r.on('data', (c: Buffer) => (text += c.toString('utf8')));
      r.on('end', () => done(null, text));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(res.body).toBe(JSON.stringify(value));
  });
});

// A raw socket, so the body can stop half way with the connection left open.
function stalledUpload(url: string, cookie: string, missionId: string): Promise<{ closedAfterMs: number; answer: string }> {
  const { hostname, port } = new URL(url);
  return new Promise((resolve, reject) => {
    const boundary = 'eclipta-stall';
    const head = `--${boundary}\r\nContent-Disposition: form-data; name="frame"\r\n\r\nEME2000\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="half.csv"\r\nContent-Type: text/csv\r\n\r\nepoch,x,y,z\n2027-03-20T12:00:00Z,6928,0,0\n`;
    const req = httpRequest({
      host: hostname, port: Number(port), method: 'POST', path: `/api/v1/missions/${missionId}/ephemerides`,
      headers: { cookie, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': String(head.length * 10) },
    });
    const started = Date.now();
    let answer = '';
    req.on('response', (res) => {
      res.on('data', (c: Buffer) => (answer += c.toString('utf8')));
      res.on('error', () => undefined);
    });
    req.on('error', () => resolve({ closedAfterMs: Date.now() - started, answer }));
    req.on('close', () => resolve({ closedAfterMs: Date.now() - started, answer }));
    req.write(head, (err) => (err ? reject(err) : undefined));
    // …and nothing more: the rest of the announced length never comes.
  });
}

describe('a stalled upload', () => {
  let stalling: ChildServer;
  beforeAll(async () => {
    stalling = await startChildServer(path.join(dir, 'stall-data'), { ECLIPTA_IDLE_TIMEOUT_S: '1' });
  }, 90_000);
  afterAll(async () => {
    stalling.child.kill('SIGTERM');
    await stalling.exited;
  });

  it('(half a body, then silence) is dropped after ECLIPTA_IDLE_TIMEOUT_S, keeps nothing, and the server answers on', async () => {
    const cookie = await childSignIn(stalling.url, 'analyst@kestrel.test');
    const missions = (await (await fetch(`${stalling.url}/api/v1/missions`, { headers: { cookie } })).json()) as { items: { id: string; bodyId: string }[] };
    const missionId = missions.items.find((m) => m.bodyId === 'earth')?.id ?? '';
    const stalled = await stalledUpload(stalling.url, cookie, missionId);
    // Dropped by the 1 s idle timeout, not by Node's defaults (5 minutes for the whole request).
    expect(stalled.closedAfterMs).toBeGreaterThanOrEqual(900);
    expect(stalled.closedAfterMs).toBeLessThan(30_000);
    if (stalled.answer !== '') expect(JSON.parse(stalled.answer)).toEqual({ error: expect.objectContaining({ code: 'request_timeout' }) });
    const listed = (await (await fetch(`${stalling.url}/api/v1/missions/${missionId}/ephemerides`, { headers: { cookie } })).json()) as { items: unknown[] };
    expect(listed.items.some((e) => JSON.stringify(e).includes('half'))).toBe(false);
    expect((await fetch(`${stalling.url}/api/health`)).status).toBe(200);
    // The upload's files are removed once its request ends.
    const uploads = path.join(dir, 'stall-data', 'uploads');
    const leftovers = () => (existsSync(uploads) ? readdirSync(uploads).filter((n) => /\.(upload|points)$/.test(n)) : []);
    await vi.waitFor(() => expect(leftovers()).toEqual([]), { timeout: 15_000, interval: 100 });
    expect(stalling.output.filter((line) => line.includes('"status":5') || line.includes('unhandled error'))).toEqual([]);
    if (process.env['ECLIPTA_BOUNDS_LOG']) console.log(stalled, stalling.output.filter((l) => l.includes('ephemerides')));
  }, 60_000);
});
