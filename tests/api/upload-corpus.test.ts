// The upload corpus: malformed ephemeris files (the committed fixtures/ephemerides/bad/ and more made
// here, among them a line of many megabytes that is not committed) are each refused with a 4xx in
// API.md's shape that says what is wrong, and leave the database and the data dir as they were.
// Files that are valid despite their looks (byte-order mark, CRLF, mixed line ends) are accepted, and
// a path in the client's file name never decides where anything is written.
import { createHash } from 'node:crypto';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { createTestApp, type TestApp } from './test-app';
import { createTestMission, fixturesDir } from './ephemeris-test-mission';

let t: TestApp;
let analyst: request.Agent;
let missionId: string;
let scratch: string;

beforeAll(async () => {
  t = await createTestApp();
  analyst = await t.signIn('analyst@kestrel.test');
  missionId = createTestMission(t);
  scratch = mkdtempSync(path.join(tmpdir(), 'eclipta-corpus-'));
});
afterAll(async () => {
  await t.close();
  rmSync(scratch, { recursive: true, force: true });
});

/** Row counts of every table and every file of the data dir but the database's own. */
function snapshot(app: TestApp): string {
  const tables = app.ctx.sqlite.prepare("SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name").all() as { name: string }[];
  const counts = tables.map(({ name }) => `${name}=${(app.ctx.sqlite.prepare(`SELECT count(*) AS n FROM "${name}"`).get() as { n: number }).n}`);
  const files: string[] = [];
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (!/eclipta\.db(-wal|-shm)?$/.test(entry.name)) files.push(`${path.relative(app.ctx.config.dataDir, full)}:${statSync(full).size}`);
    }
  };
  walk(app.ctx.config.dataDir);
  return [...counts, ...files.sort()].join('\n');
}

const good = readFileSync(path.join(fixturesDir, 'leo-crlf.csv'), 'utf8').replace(/\r\n/g, '\n');
const goodLines = good.trim().split('\n');
const header = goodLines[0] ?? '';

function made(name: string, content: string | Buffer): string {
  const file = path.join(scratch, name);
  writeFileSync(file, content);
  return file;
}

// Files made here, each with what the refusal must say.
const madeRefusals: [name: string, content: () => string | Buffer, reason: RegExp][] = [
  ['blank-lines.csv', () => '\n\n   \n\r\n', /empty/],
  ['tabs.csv', () => good.replace(/,/g, '\t'), /separated by tabs/],
  ['utf16.csv', () => Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(good, 'utf16le')]), /not a text file|UTF-8/],
  ['latin1.csv', () => Buffer.concat([Buffer.from(header + '\n'), Buffer.from('2027-03-20T12:00:00Z,caf\xe9,1,1,1,1,1\n', 'latin1')]), /UTF-8/],
  ['zipped.csv', () => Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(64, 1)]), /compressed file \(zip\)/],
  ['gzipped-here.csv', () => gzipSync(good), /compressed file \(gzip\)/],
  ['page.html', () => '<!doctype html><html><body><script>alert(1)</script></body></html>\n', /unknown column/],
  ['nul-inside.csv', () => good.slice(0, 200) + '\u0000' + good.slice(200), /not a text file/],
  ['oem-header-only.oem', () => 'CCSDS_OEM_VERS = 2.0\nCREATION_DATE = 2027-03-20T00:00:00\nORIGINATOR = KESTREL\n', /no META_START/],
  ['huge-line.csv', () => header + '\n' + '2027-03-20T12:00:00.000Z,' + '1'.repeat(12 * 1024 * 1024) + ',0,0,0,0,0\n', /row 1, x: too large/],
  ['huge-text-line.csv', () => header + '\n' + 'k'.repeat(16 * 1024 * 1024) + '\n', /row 1/],
];

const committed = readdirSync(path.join(fixturesDir, 'bad')).sort();

async function upload(agent: request.Agent, file: string, filename?: string) {
  return agent
    .post(`/api/v1/missions/${missionId}/ephemerides`)
    .field('frame', 'EME2000')
    .attach('file', file, filename ? { filename } : undefined);
}

describe('the upload corpus', () => {
  it('holds at least 20 malformed files', () => {
    expect(committed.length + madeRefusals.length).toBeGreaterThanOrEqual(20);
  });

  it.each(committed)('refuses fixtures/ephemerides/bad/%s clearly and keeps nothing', async (name) => {
    const before = snapshot(t);
    // OEM files carry their frame; the CSV ones are declared EME2000.
    const res = await upload(analyst, path.join(fixturesDir, 'bad', name));
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(400);
    expect(res.body.error.code).toMatch(/^invalid_/);
    expect(res.body.error.message.length).toBeGreaterThan(20);
    expect(snapshot(t)).toBe(before);
  });

  it.each(madeRefusals)('refuses %s with a reason and keeps nothing', async (name, content, reason) => {
    const file = made(name, content());
    const before = snapshot(t);
    const res = await upload(analyst, file);
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(400);
    expect(res.body.error.code).toMatch(/^invalid_/);
    expect(res.body.error.message).toMatch(reason);
    expect(res.body.error.message.length).toBeLessThan(2000);
    expect(snapshot(t)).toBe(before);
  }, 60_000);

  it.each([
    ['with a byte-order mark', () => '\uFEFF' + good],
    ['with CRLF line ends', () => good.replace(/\n/g, '\r\n')],
    ['with mixed LF and CRLF line ends', () => goodLines.map((l, i) => l + (i % 2 ? '\r\n' : '\n')).join('')],
  ])('accepts a valid file %s', async (_what, content) => {
    const res = await upload(analyst, made('valid.csv', content()));
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(201);
    expect(res.body.rows).toBe(goodLines.length - 1);
    expect(readdirSync(path.join(t.ctx.config.dataDir, 'uploads'))).toEqual([]);
  });

  it('stores a file named ../../etc/passwd under a generated name and writes nothing outside the data dir', async () => {
    const outside = path.dirname(t.ctx.config.dataDir);
    const listOutside = () => readdirSync(outside).filter((n) => n === 'etc' || n === 'passwd');
    expect(listOutside()).toEqual([]);
    const res = await upload(analyst, made('plain.csv', good), '../../etc/passwd');
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(201);
    // shown as its base name only; the bytes went through uploads/<uuid>.upload and are gone
    expect(res.body.fileName).toBe('passwd');
    expect(res.body.sha256).toBe(createHash('sha256').update(good).digest('hex'));
    expect(listOutside()).toEqual([]);
    expect(existsSync(path.join(t.ctx.config.dataDir, 'etc'))).toBe(false);
    expect(readdirSync(path.join(t.ctx.config.dataDir, 'uploads'))).toEqual([]);
  });

  it('answers 413 for a file over ECLIPTA_UPLOAD_LIMIT_MB and keeps nothing', async () => {
    const small = await createTestApp({ ECLIPTA_UPLOAD_LIMIT_MB: '1' });
    try {
      const agent = await small.signIn('analyst@kestrel.test');
      const mission = createTestMission(small);
      const big = made('over-limit.csv', header + '\n' + goodLines.slice(1).join('\n').repeat(1).padEnd(1.5 * 1024 * 1024, '\n'));
      const before = snapshot(small);
      const res = await agent.post(`/api/v1/missions/${mission}/ephemerides`).field('frame', 'EME2000').attach('file', big);
      expect(res.status).toBe(413);
      expect(res.body.error).toMatchObject({ code: 'too_large' });
      expect(res.body.error.message).toMatch(/1 MB/);
      expect(snapshot(small)).toBe(before);
    } finally {
      await small.close();
    }
  });
});
