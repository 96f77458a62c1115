// Uploading ephemerides: good files stored with their summary, every kind of bad file refused with
// the row and the reason and no trace left, the size limit, and who may upload.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { readFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type request from 'supertest';
import { createTestApp, type TestApp } from './test-app';
import { createTestMission, fixturesDir, trace } from './ephemeris-test-mission';

let t: TestApp;
let analyst: request.Agent;
let missionId: string;

beforeAll(async () => {
  t = await createTestApp();
  analyst = await t.signIn('analyst@kestrel.test');
  missionId = createTestMission(t);
});
afterAll(async () => {
  await t.close();
});

const fixture = (name: string) => path.join(fixturesDir, name);
const upload = (agent: request.Agent, file: string, fields: Record<string, string> = { frame: 'EME2000' }) => {
  let call = agent.post(`/api/v1/missions/${missionId}/ephemerides`);
  for (const [k, v] of Object.entries(fields)) call = call.field(k, v);
  return call.attach('file', file);
};

describe('accepted ephemerides', () => {
  it('stores a CSV with its summary, the SHA-256 of the bytes and every row, and leaves no file behind', async () => {
    const res = await upload(analyst, fixture('leo-circular.csv'), { frame: 'EME2000', name: 'Kestrel-1 nominal' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({
      name: 'Kestrel-1 nominal', frame: 'EME2000', format: 'csv', rows: 241, stepS: 60, hasVelocity: true,
      startEpoch: '2027-03-20T12:00:00.000Z', endEpoch: '2027-03-20T16:00:00.000Z', fileName: 'leo-circular.csv',
    });
    // a 550 km circular orbit: the altitude stays at 550 km (to the written precision)
    expect(res.body.minAltitudeKm).toBeCloseTo(550, 3);
    expect(res.body.maxAltitudeKm).toBeCloseTo(550, 3);
    expect(res.body.sha256).toBe(createHash('sha256').update(readFileSync(fixture('leo-circular.csv'))).digest('hex'));
    expect(trace(t).uploads).toEqual([]);

    const page = await analyst.get(`/api/v1/missions/${missionId}/ephemerides/${res.body.id}/points?offset=239&limit=5`);
    expect(page.status).toBe(200);
    expect(page.body.total).toBe(241);
    expect(page.body.items.map((p: { seq: number }) => p.seq)).toEqual([239, 240]);
    const last = readFileSync(fixture('leo-circular.csv'), 'utf8').trim().split('\n').at(-1)?.split(',') ?? [];
    expect(page.body.items[1].epoch).toBe(last[0]);
    expect(page.body.items[1].xKm).toBe(Number(last[1]));
    expect(page.body.items[1].vzKmS).toBe(Number(last[6]));
  });

  it('reads the OEM of the same trajectory, taking its name and frame from the metadata', async () => {
    const res = await upload(analyst, fixture('leo-circular.oem'), {});
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ name: 'KESTREL-1', frame: 'EME2000', format: 'oem', rows: 241, stepS: 60 });
  });

  it('takes t seconds from the epoch given with the upload, without velocities', async () => {
    const res = await upload(analyst, fixture('gto-transfer.csv'), { frame: 'ICRF', epoch: '2027-03-20T12:00:00Z' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ rows: 361, hasVelocity: false, startEpoch: '2027-03-20T12:00:00.000Z', endEpoch: '2027-03-20T18:00:00.000Z' });
    // 300 x 35786 km transfer, 6 h from periapsis: periapsis in the file, apoapsis (at ~5.3 h) too
    expect(res.body.minAltitudeKm).toBeCloseTo(300, 1);
    expect(res.body.maxAltitudeKm).toBeGreaterThan(35700);
  });

  it.each([['leo-bom.csv', 'a UTF-8 byte-order mark'], ['leo-crlf.csv', 'Windows line ends']])('accepts %s (%s)', async (name) => {
    const res = await upload(analyst, fixture(name));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.rows).toBe(20);
  });

  it('reads cells padded with spaces as the same values (csv-parse does not trim; the reader does)', async () => {
    const text = readFileSync(fixture('leo-circular.csv'), 'utf8').trim();
    const padded = text.split('\n').map((line) => line.split(',').map((cell) => ` ${cell}  `).join(',')).join('\n') + '\n';
    const res = await analyst.post(`/api/v1/missions/${missionId}/ephemerides`).field('frame', 'EME2000').attach('file', Buffer.from(padded), 'padded.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ rows: 241, stepS: 60, hasVelocity: true, startEpoch: '2027-03-20T12:00:00.000Z', endEpoch: '2027-03-20T16:00:00.000Z' });
    const page = await analyst.get(`/api/v1/missions/${missionId}/ephemerides/${res.body.id}/points?offset=240&limit=1`);
    const last = text.split('\n').at(-1)?.split(',') ?? [];
    expect(page.body.items[0]).toMatchObject({ epoch: last[0], xKm: Number(last[1]), vzKmS: Number(last[6]) });
  });

  // The file is read while it arrives when frame and epoch come before it in the form, else again
  // from disk once every field is in: both ways must give the same ephemeris.
  const summaryOf = (body: Record<string, unknown>) => {
    const { id: _id, createdAt: _createdAt, ...rest } = body;
    return rest;
  };
  const allPoints = async (id: string) => {
    const page = await analyst.get(`/api/v1/missions/${missionId}/ephemerides/${id}/points?offset=0&limit=10000`);
    return page.body.items.map((p: Record<string, unknown>) => ({ ...p, ephemerisId: undefined }));
  };

  it('gives the same ephemeris whether the fields come before the file (read as it arrives) or after it (read from disk)', async () => {
    // 20,000 rows (about 2 MB): many network chunks, so the reader holds the transfer back at times
    const rows = ['epoch,x,y,z,vx,vy,vz'];
    const r = 6928.137;
    const w = Math.sqrt(398600.4418 / r ** 3);
    for (let i = 0; i < 20_000; i++) {
      const a = w * i * 10;
      rows.push(`${new Date(Date.UTC(2027, 2, 20, 12) + i * 10_000).toISOString()},${(r * Math.cos(a)).toFixed(6)},${(r * Math.sin(a)).toFixed(6)},0,${(-r * w * Math.sin(a)).toFixed(9)},${(r * w * Math.cos(a)).toFixed(9)},0`);
    }
    const file = Buffer.from(rows.join('\n') + '\n');
    const url = `/api/v1/missions/${missionId}/ephemerides`;
    const before = await analyst.post(url).field('frame', 'EME2000').field('name', 'order test').attach('file', file, 'order.csv');
    const after = await analyst.post(url).attach('file', file, 'order.csv').field('frame', 'EME2000').field('name', 'order test');
    expect(before.status, JSON.stringify(before.body)).toBe(201);
    expect(after.status, JSON.stringify(after.body)).toBe(201);
    expect(before.body).toMatchObject({ rows: 20_000, stepS: 10, sha256: createHash('sha256').update(file).digest('hex') });
    expect(summaryOf(after.body)).toEqual(summaryOf(before.body));
    expect(await allPoints(after.body.id)).toEqual(await allPoints(before.body.id));
    // a page across the first block boundary (4,096 points a block) reads the file's rows in order
    const across = await analyst.get(`/api/v1/missions/${missionId}/ephemerides/${before.body.id}/points?offset=4090&limit=12`);
    expect(across.body.items.map((p: { seq: number }) => p.seq)).toEqual(Array.from({ length: 12 }, (_, k) => 4090 + k));
    expect(across.body.items.map((p: { epoch: string; xKm: number; vyKmS: number }) => [p.epoch, p.xKm, p.vyKmS])).toEqual(
      rows.slice(4091, 4103).map((line) => line.split(',')).map((c) => [c[0], Number(c[1]), Number(c[5])]),
    );
    expect(trace(t).uploads).toEqual([]);
  });

  it('reads the file again from disk when a field it depends on comes after it', async () => {
    // the t column needs the epoch: sent after the file, the early reading (without it) is set aside
    const url = `/api/v1/missions/${missionId}/ephemerides`;
    const late = await analyst.post(url).field('frame', 'ICRF').attach('file', fixture('gto-transfer.csv')).field('epoch', '2027-03-20T12:00:00Z');
    const early = await upload(analyst, fixture('gto-transfer.csv'), { frame: 'ICRF', epoch: '2027-03-20T12:00:00Z' });
    expect(late.status, JSON.stringify(late.body)).toBe(201);
    expect(early.status, JSON.stringify(early.body)).toBe(201);
    expect(summaryOf(late.body)).toEqual(summaryOf(early.body));
    expect(late.body).toMatchObject({ rows: 361, startEpoch: '2027-03-20T12:00:00.000Z' });
    // a frame after an OEM file must still agree with its REF_FRAME
    const clash = await analyst.post(url).attach('file', fixture('leo-circular.oem')).field('frame', 'ICRF');
    expect(clash.status).toBe(400);
    expect(clash.body.error.details[0]).toMatchObject({ row: 0, column: 'REF_FRAME', message: expect.stringMatching(/declared ICRF/) });
    expect(trace(t).uploads).toEqual([]);
  });

  it('lists, shows and deletes, taking the points with it', async () => {
    const created = await upload(analyst, fixture('leo-crlf.csv'), { frame: 'GCRF', name: 'to delete' });
    const before = trace(t);
    const list = await analyst.get(`/api/v1/missions/${missionId}/ephemerides`);
    expect(list.body.items.map((e: { name: string }) => e.name)).toContain('to delete');
    expect((await analyst.get(`/api/v1/missions/${missionId}/ephemerides/${created.body.id}`)).body.name).toBe('to delete');
    expect((await analyst.delete(`/api/v1/missions/${missionId}/ephemerides/${created.body.id}`)).status).toBe(204);
    expect(trace(t)).toEqual({ ...before, ephemerides: before.ephemerides - 1, points: before.points - 20, blocks: before.blocks - 1 });
    expect((await analyst.get(`/api/v1/missions/${missionId}/ephemerides/${created.body.id}`)).status).toBe(404);
  });
});

// Each malformed fixture (scripts/make-ephemeris-fixtures.ts) with the row, column and reason expected first.
const refused: [file: string, row: number, column: string | undefined, reason: RegExp, fields?: Record<string, string>][] = [
  // In words, not csv-parse's "Invalid Opening Quote: a quote is found on field 0 at line 3".
  ['unparseable-line.csv', 3, undefined, /this line cannot be read as CSV: a quote mark stands inside a value that did not start with one/],
  ['missing-column.csv', 4, 'vz', /missing column: vz/],
  ['extra-column.csv', 5, undefined, /extra column/],
  ['non-numeric.csv', 2, 'x', /not a number/],
  ['nan-value.csv', 3, 'y', /NaN is not a number/],
  ['infinity-value.csv', 4, 'z', /infinite/],
  ['repeated-epoch.csv', 5, 'epoch', /repeated epoch: row 4/],
  ['decreasing-epoch.csv', 6, 'epoch', /epochs must increase: this one is before row 5/],
  ['below-surface.csv', 3, 'x, y, z', /below the surface of Earth/],
  ['metres.csv', 1, 'x, y, z', /looks like metres; Eclipta expects km/],
  ['wrong-center.oem', 0, 'CENTER_NAME', /centred on MARS, but this mission is about Earth/, {}],
  ['non-utc.oem', 0, 'TIME_SYSTEM', /UTC epochs only; this file's are TAI/, {}],
  ['empty.csv', 0, undefined, /the file is empty/],
  ['header-only.csv', 0, undefined, /header but no data rows/],
  ['binary-garbage.bin', 0, undefined, /not a text file/],
  ['semicolons.csv', 0, undefined, /separated by ";"; Eclipta reads comma-separated/],
  ['compressed.csv.gz', 0, undefined, /looks like a compressed file \(gzip\)/],
];

describe('refused ephemerides leave no trace', () => {
  it.each(refused)('%s: row %i, %s', async (file, row, column, reason, fields) => {
    const before = trace(t);
    const res = await upload(analyst, fixture(path.join('bad', file)), fields);
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(res.body.error.code).toBe('invalid_ephemeris');
    const first = res.body.error.details[0];
    expect(first.row).toBe(row);
    expect(first.column).toBe(column);
    expect(first.message).toMatch(reason);
    expect(res.body.error.message).toMatch(reason);
    expect(trace(t)).toEqual(before);
  });

  it('lists every bad row up to 20: the metres file has one problem per position row', async () => {
    const res = await upload(analyst, fixture('bad/metres.csv'));
    expect(res.body.error.details.map((d: { row: number }) => d.row)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
  });

  it('refuses a CSV without a declared frame, and a frame that is not inertial, naming the field', async () => {
    const before = trace(t);
    const none = await upload(analyst, fixture('leo-crlf.csv'), {});
    expect(none.status).toBe(400);
    expect(none.body.error.details[0].path).toBe('frame');
    const rotating = await upload(analyst, fixture('leo-crlf.csv'), { frame: 'ITRF' });
    expect(rotating.status).toBe(400);
    expect(rotating.body.error.message).toMatch(/"ITRF" is not an inertial frame/);
    expect(trace(t)).toEqual(before);
  });

  it('refuses an OEM whose REF_FRAME contradicts the declared frame', async () => {
    const res = await upload(analyst, fixture('leo-circular.oem'), { frame: 'ICRF' });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0]).toMatchObject({ column: 'REF_FRAME', message: 'the file says EME2000 but the upload declared ICRF' });
  });

  it('refuses t seconds without the epoch they count from', async () => {
    const res = await upload(analyst, fixture('gto-transfer.csv'), { frame: 'ICRF' });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0]).toMatchObject({ row: 0, column: 't' });
  });

  it('refuses GCRF for a mission about Mars, and an OEM centred on the Earth', async () => {
    const marsMission = createTestMission(t, 'mars');
    const res = await analyst
      .post(`/api/v1/missions/${marsMission}/ephemerides`)
      .field('frame', 'GCRF')
      .attach('file', fixture('leo-crlf.csv'));
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/GCRF is centred on the Earth/);
    const oem = await analyst.post(`/api/v1/missions/${marsMission}/ephemerides`).attach('file', fixture('leo-circular.oem'));
    expect(oem.body.error.details[0].message).toMatch(/centred on EARTH, but this mission is about Mars/);
  });
});

describe('limits and access', () => {
  it('answers 413 beyond ECLIPTA_UPLOAD_LIMIT_MB and keeps nothing', async () => {
    const small = await createTestApp({ ECLIPTA_UPLOAD_LIMIT_MB: '0.01' });
    try {
      const agent = await small.signIn('analyst@kestrel.test');
      const mission = createTestMission(small);
      const before = trace(small);
      const res = await agent.post(`/api/v1/missions/${mission}/ephemerides`).field('frame', 'EME2000').attach('file', fixture('leo-circular.csv'));
      expect(res.status).toBe(413);
      expect(res.body.error).toMatchObject({ code: 'too_large' });
      expect(res.body.error.message).toMatch(/0\.01 MB/);
      expect(trace(small)).toEqual(before);
      // under the limit the same server accepts
      const ok = await agent.post(`/api/v1/missions/${mission}/ephemerides`).field('frame', 'EME2000').attach('file', fixture('leo-bom.csv'));
      expect(ok.status).toBe(201);
    } finally {
      await small.close();
    }
  });

  it('hides the mission from another workspace (404) and refuses a viewer (403) before storing anything', async () => {
    const stranger = await t.signIn('owner@plover.test');
    const viewer = await t.signIn('viewer@kestrel.test');
    const before = trace(t);
    expect((await upload(stranger, fixture('leo-bom.csv'))).status).toBe(404);
    expect((await stranger.get(`/api/v1/missions/${missionId}/ephemerides`)).status).toBe(404);
    const refusedViewer = await upload(viewer, fixture('leo-bom.csv'));
    expect(refusedViewer.status).toBe(403);
    expect(refusedViewer.body.error.message).toMatch(/Viewer/);
    expect(trace(t)).toEqual(before);
    // the viewer reads
    expect((await viewer.get(`/api/v1/missions/${missionId}/ephemerides`)).status).toBe(200);
  });

  it('keeps nothing when the client goes away in the middle of the upload', async () => {
    const token = await analyst.post('/api/v1/tokens').send({ name: 'abort test' });
    expect(token.status).toBe(201);
    const server = t.app.listen(0);
    try {
      const before = trace(t);
      const { port } = server.address() as AddressInfo;
      const boundary = 'eclipta-abort-test';
      const head = `--${boundary}\r\nContent-Disposition: form-data; name="frame"\r\n\r\nEME2000\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="half.csv"\r\nContent-Type: text/csv\r\n\r\n`;
      const content = readFileSync(fixture('leo-circular.csv'));
      const req = http.request({
        port, method: 'POST', path: `/api/v1/missions/${missionId}/ephemerides`,
        headers: { authorization: `Bearer ${token.body.secret}`, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': head.length + content.length * 2 },
      });
      const closed = new Promise<void>((resolve) => {
        req.on('error', () => resolve());
        req.on('close', () => resolve());
      });
      req.write(head);
      req.write(content.subarray(0, content.length / 2));
      // Half the file is on disk under a generated name, its rows read so far spooled beside it (the
      // frame came first, so reading began with the transfer). Waited for, not timed: a fixed 200 ms
      // was too short for a loaded machine.
      const during = await vi.waitFor(() => {
        const uploads = trace(t).uploads;
        if (!uploads.some((f) => f.endsWith('.upload')) || !uploads.some((f) => f.endsWith('.points'))) throw new Error(`only ${uploads.join(', ') || 'nothing'} in uploads/ yet`);
        return uploads;
      }, { timeout: 15_000, interval: 20 });
      req.destroy();
      await closed;
      expect(during).toHaveLength(2);
      expect(during.filter((f) => /^[0-9a-f-]{36}\.upload$/.test(f))).toHaveLength(1);
      expect(during.filter((f) => /^[0-9a-f-]{36}\.points$/.test(f))).toHaveLength(1);
      // both went with the request; the server notices the abort asynchronously
      await vi.waitFor(() => expect(trace(t)).toEqual(before), { timeout: 15_000, interval: 50 });
    } finally {
      server.close();
    }
  });
});
