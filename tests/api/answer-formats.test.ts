// The answer forms of API.md "Answer formats": the default JSON unchanged (byte for byte where it is
// written without building the per-step objects), ?layout=columns holding the same numbers in one
// array per quantity and surface, an Apache Arrow IPC stream (read back with apache-arrow, the
// reader pandas and polars share) with the same numbers and the scalar results in the schema's
// metadata, and every answer compressed (br or gzip) when the request accepts it. The checks are
// equalities between forms of one answer (common practice, no source): the physics is checked elsewhere.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { brotliDecompressSync, constants, gunzipSync } from 'node:zlib';
import { tableFromIPC, type Table } from 'apache-arrow';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { asEnvironmentRequest, environmentRequest } from '../../shared/api/environment';
import { computeEnvironment, computeEnvironmentColumns } from '../../shared/physics/environment';
import { environmentJson } from '../../server/http/environment-json';
import { createTestMission, fixturesDir } from './ephemeris-test-mission';
import { kestrelOne, missionIdOf, orbitIdOf } from './mission-fixtures';
import { createTestApp, type TestApp } from './test-app';

const ARROW = 'application/vnd.apache.arrow.stream';

let t: TestApp;
let analyst: request.Agent;
let thermal: request.Agent;
let server: http.Server;
let base: string;
let cookie: string;

beforeAll(async () => {
  t = await createTestApp();
  analyst = await t.signIn('analyst@kestrel.test');
  thermal = await t.signIn('thermal@kestrel.test');
  server = t.app.listen(0);
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const signIn = await fetch(`${base}/api/v1/auth/sign-in`, {
    method: 'POST', headers: { 'content-type': 'application/json', origin: base }, body: JSON.stringify({ email: 'analyst@kestrel.test', password: 'eclipta-demo' }),
  });
  cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
});
afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  await t.close();
});

// Unicode and punctuation in names on purpose: the hand-written JSON must escape them as JSON.stringify does.
const orbitRequest = {
  bodyId: 'earth',
  orbit: { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 560, inclinationDeg: 97.6, raanDeg: 30 },
  epoch: '2027-03-20T12:00:00Z',
  steps: 240,
  surfaces: [
    { name: 'nadir panel', normal: 'nadir', areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 },
    { name: 'Sonnensegel "süd" ☀', normal: 'sun', areaM2: 1.2, absorptivity: 0.9, emissivity: 0.8 },
    { name: 'tilted\\panel', normal: { x: 0.6, y: 0, z: 0.8 }, areaM2: 0.3, absorptivity: 0.4, emissivity: 0.7 },
  ],
};

interface Raw {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: Buffer;
}

/** A request over a real socket, the body as it came (nothing decompressed on the way). */
function raw(method: 'GET' | 'POST', url: string, headers: Record<string, string>, body?: unknown): Promise<Raw> {
  return new Promise((resolve, reject) => {
    const req = http.request(`${base}${url}`, { method, headers: { cookie, origin: base, ...(body ? { 'content-type': 'application/json' } : {}), ...headers } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    });
    req.on('error', reject);
    req.end(body === undefined ? undefined : JSON.stringify(body));
  });
}

const decoded = (r: Raw): Buffer =>
  r.headers['content-encoding'] === 'br' ? brotliDecompressSync(r.body) : r.headers['content-encoding'] === 'gzip' ? gunzipSync(r.body) : r.body;

const arrowOf = (r: Raw): Table => {
  expect(r.headers['content-type']).toBe(ARROW);
  return tableFromIPC(decoded(r));
};

const numbers = (table: Table, name: string): number[] => {
  const column = table.getChild(name);
  if (!column) throw new Error(`no column ${name} in ${table.schema.fields.map((f) => f.name).join(', ')}`);
  return Array.from(column.toArray() as Float64Array);
};

interface Load { name: string; solarWm2: number; albedoWm2: number; irWm2: number; absorbedW: number }
interface Point { tS: number; trueAnomalyDeg: number; sunlit: number; surfaces: Load[] }
const quantities = ['solarWm2', 'albedoWm2', 'irWm2', 'absorbedW'] as const;

describe('POST /environment/compute in its three forms', () => {
  it('writes the default JSON byte for byte as JSON.stringify of the answer object, names escaped alike', async () => {
    const parsed = asEnvironmentRequest(environmentRequest.parse(orbitRequest));
    expect(environmentJson(computeEnvironmentColumns(parsed)).equals(Buffer.from(JSON.stringify(computeEnvironment(parsed))))).toBe(true);
    const res = await raw('POST', '/api/v1/environment/compute', { 'accept-encoding': 'identity' }, orbitRequest);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    expect(res.body.toString('utf8')).toBe(JSON.stringify(computeEnvironment(parsed)));
  });

  it('answers ?layout=columns with the default answer\'s numbers, one array per quantity and surface', async () => {
    const rows = (await analyst.post('/api/v1/environment/compute').send(orbitRequest).expect(200)).body as Record<string, unknown> & { profile: Point[] };
    const columns = (await analyst.post('/api/v1/environment/compute?layout=columns').send(orbitRequest).expect(200)).body as Record<string, unknown> & {
      profile: { tS: number[]; trueAnomalyDeg: number[]; sunlit: number[]; surfaces: (Record<(typeof quantities)[number], number[]> & { name: string })[] };
    };
    const { profile: rowProfile, ...rowRest } = rows;
    const { profile, ...columnRest } = columns;
    expect(columnRest).toEqual(rowRest);
    expect(profile.tS).toEqual(rowProfile.map((p) => p.tS));
    expect(profile.trueAnomalyDeg).toEqual(rowProfile.map((p) => p.trueAnomalyDeg));
    expect(profile.sunlit).toEqual(rowProfile.map((p) => p.sunlit));
    expect(profile.surfaces.map((s) => s.name)).toEqual(orbitRequest.surfaces.map((s) => s.name));
    profile.surfaces.forEach((surface, j) => {
      for (const q of quantities) expect(surface[q]).toEqual(rowProfile.map((p) => p.surfaces[j][q]));
    });
  });

  it('answers Accept: application/vnd.apache.arrow.stream with the same numbers, the scalars as schema metadata', async () => {
    const json = JSON.parse(decoded(await raw('POST', '/api/v1/environment/compute', { 'accept-encoding': 'br' }, orbitRequest)).toString('utf8')) as Record<string, unknown> & { profile: Point[]; periodS: number; eclipseFraction: number };
    const table = arrowOf(await raw('POST', '/api/v1/environment/compute', { accept: ARROW, 'accept-encoding': 'br' }, orbitRequest));
    expect(table.numRows).toBe(240);
    expect(numbers(table, 'tS')).toEqual(json.profile.map((p) => p.tS));
    expect(numbers(table, 'sunlit')).toEqual(json.profile.map((p) => p.sunlit));
    orbitRequest.surfaces.forEach((s, j) => {
      for (const q of quantities) expect(numbers(table, `${s.name}.${q}`)).toEqual(json.profile.map((p) => p.surfaces[j][q]));
    });
    const meta = table.schema.metadata;
    expect(Number(meta.get('periodS'))).toBe(json.periodS);
    expect(Number(meta.get('eclipseFraction'))).toBe(json.eclipseFraction);
    expect(meta.get('bodyId')).toBe('earth');
    expect(JSON.parse(meta.get('sunDirection') ?? 'null')).toEqual(json['sunDirection']);
    expect(JSON.parse(meta.get('orbitAverage') ?? 'null')).toEqual(json['orbitAverage']);
    expect(JSON.parse(meta.get('assumptions') ?? '[]')).toEqual(json['assumptions']);
  });

  it('refuses a layout it does not know with a 400 naming the field', async () => {
    const res = await analyst.post('/api/v1/environment/compute?layout=rows').send(orbitRequest).expect(400);
    expect(JSON.stringify(res.body.error)).toMatch(/layout/);
  });
});

describe('compression', () => {
  it('sends br or gzip as the request accepts, with Vary, decompressing to the plain answer in a fraction of its size', async () => {
    const plain = await raw('POST', '/api/v1/environment/compute', { 'accept-encoding': 'identity' }, orbitRequest);
    expect(plain.headers['content-encoding']).toBeUndefined();
    for (const [accept, encoding] of [['br, gzip', 'br'], ['gzip', 'gzip'], ['gzip;q=1, br;q=0.5', 'gzip']] as const) {
      const packed = await raw('POST', '/api/v1/environment/compute', { 'accept-encoding': accept }, orbitRequest);
      expect(packed.headers['content-encoding']).toBe(encoding);
      expect(String(packed.headers['vary'])).toMatch(/Accept-Encoding/i);
      expect(decoded(packed).equals(plain.body)).toBe(true);
      // Under a third for this small answer (240 steps x 3 surfaces, about a quarter at the fastest
      // settings); bench/wire.bench.ts shows the full orbit's bytes against the fifth of issue 16.
      expect(packed.body.length).toBeLessThan(plain.body.length / 3);
    }
  });

  it('compresses the columnar and Arrow answers and a full-size compute answer written in pieces to the very bytes sent uncompressed', async () => {
    const big = { ...orbitRequest, steps: 3600 };
    for (const [url, headers, body] of [
      ['/api/v1/environment/compute', {}, big],
      ['/api/v1/environment/compute?layout=columns', {}, orbitRequest],
      ['/api/v1/environment/compute', { accept: ARROW }, big],
    ] as const) {
      const plain = await raw('POST', url, { ...headers, 'accept-encoding': 'identity' }, body);
      expect(plain.headers['content-encoding']).toBeUndefined();
      for (const encoding of ['br', 'gzip']) {
        const packed = await raw('POST', url, { ...headers, 'accept-encoding': encoding }, body);
        expect(packed.headers['content-encoding'], url).toBe(encoding);
        expect(decoded(packed).equals(plain.body), `${url} ${encoding}`).toBe(true);
        expect(packed.body.length).toBeLessThan(plain.body.length);
      }
    }
    const parsed = asEnvironmentRequest(environmentRequest.parse(big));
    const json = await raw('POST', '/api/v1/environment/compute', { 'accept-encoding': 'br' }, big);
    expect(decoded(json).toString('utf8')).toBe(JSON.stringify(computeEnvironment(parsed)));
    const table = arrowOf(await raw('POST', '/api/v1/environment/compute', { accept: ARROW, 'accept-encoding': 'gzip' }, big));
    const profile = (JSON.parse(decoded(json).toString('utf8')) as { profile: Point[] }).profile;
    expect(numbers(table, `${big.surfaces[1].name}.absorbedW`)).toEqual(profile.map((p) => p.surfaces[1].absorbedW));
  });

  it('compresses a streamed NDJSON sweep chunk by chunk: what has arrived decompresses to whole lines before the end', async () => {
    const missionId = missionIdOf(t, kestrelOne);
    const orbitId = orbitIdOf(t, missionId, 'Operational SSO 540 km');
    const url = `/api/v1/missions/${missionId}/orbits/${orbitId}/sweep?from=2027-03-01&to=2027-12-31`;
    const plain = (await raw('GET', url, { 'accept-encoding': 'identity' })).body.toString('utf8');
    const seen: string[] = [];
    const whole = await new Promise<Buffer>((resolve, reject) => {
      http.get(`${base}${url}`, { headers: { cookie, 'accept-encoding': 'gzip' } }, (res) => {
        expect(res.headers['content-encoding']).toBe('gzip');
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => {
          chunks.push(c);
          seen.push(gunzipSync(Buffer.concat(chunks), { finishFlush: constants.Z_SYNC_FLUSH }).toString('utf8'));
        });
        res.on('end', () => resolve(Buffer.concat(chunks)));
        res.on('error', reject);
      }).on('error', reject);
    });
    expect(gunzipSync(whole).toString('utf8')).toBe(plain);
    // Flushed after the start line and after each chunk of days: before the last bytes, what has come
    // decompresses to whole lines (a compressor left to fill its buffer would cut a line).
    const early = seen.slice(0, -1).filter((text) => text.length > 0);
    expect(early.length).toBeGreaterThan(0);
    expect(early[0].split('\n')[0]).toBe(plain.split('\n')[0]);
    expect(early.some((text) => text.endsWith('\n') && text.split('\n').length > 2)).toBe(true);
  });
});

describe('the other per-step answers', () => {
  it('answers the mission sweep in columns and as Arrow with the NDJSON stream\'s days', async () => {
    const missionId = missionIdOf(t, kestrelOne);
    const orbitId = orbitIdOf(t, missionId, 'Operational SSO 540 km');
    const url = `/api/v1/missions/${missionId}/orbits/${orbitId}/sweep?from=2027-03-01&to=2027-06-30&stepDays=7`;
    const lines = (await raw('GET', url, { 'accept-encoding': 'identity' })).body.toString('utf8').trim().split('\n').map((l) => JSON.parse(l) as Record<string, unknown>);
    const days = lines.filter((l) => l['type'] === 'day') as unknown as { date: string; betaDeg: number; surfaces: { surfaceId: string; name: string; absorbedW: number }[] }[];
    const columns = (await analyst.get(`${url}&layout=columns`).expect(200)).body as { days: number; series: { date: string[]; betaDeg: number[]; surfaces: { surfaceId: string; name: string; absorbedW: number[] }[] } };
    expect(columns.days).toBe(days.length);
    expect(columns.series.date).toEqual(days.map((d) => d.date));
    expect(columns.series.betaDeg).toEqual(days.map((d) => d.betaDeg));
    columns.series.surfaces.forEach((s, j) => {
      expect(s.surfaceId).toBe(days[0].surfaces[j].surfaceId);
      expect(s.absorbedW).toEqual(days.map((d) => d.surfaces[j].absorbedW));
    });
    const table = arrowOf(await raw('GET', url, { accept: ARROW }));
    expect(Array.from(table.getChild('date')?.toArray() as string[])).toEqual(days.map((d) => d.date));
    expect(numbers(table, 'betaDeg')).toEqual(days.map((d) => d.betaDeg));
    const first = days[0].surfaces[0];
    expect(numbers(table, `${first.name}.absorbedW`)).toEqual(days.map((d) => d.surfaces[0].absorbedW));
    expect(table.schema.metadata.get('from')).toBe('2027-03-01');
  });

  it('answers a case export and a thermal run as Arrow with the JSON answer\'s numbers', async () => {
    const missionId = missionIdOf(t, kestrelOne);
    const cases = (await thermal.get(`/api/v1/cases?missionId=${missionId}&status=released`).expect(200)).body.items as { id: string; kind: string }[];
    const hot = cases.find((c) => c.kind === 'hot')!.id;
    const exported = JSON.parse((await analyst.get(`/api/v1/cases/${hot}/export`).expect(200)).text) as { caution: string; checksum: string; results: { tS: number[]; surfaces: { name: string; series: { absorbedW: number[] } }[] } };
    const sameInColumns = JSON.parse((await analyst.get(`/api/v1/cases/${hot}/export?layout=columns`).expect(200)).text) as typeof exported & { exportedAt: string };
    expect({ ...sameInColumns, exportedAt: null }).toEqual({ ...exported, exportedAt: null });
    const caseTable = arrowOf(await raw('GET', `/api/v1/cases/${hot}/export`, { accept: ARROW }));
    expect(numbers(caseTable, 'tS')).toEqual(exported.results.tS);
    const surface = exported.results.surfaces[0];
    expect(numbers(caseTable, `${surface.name}.absorbedW`)).toEqual(surface.series.absorbedW);
    expect(caseTable.schema.metadata.get('caution')).toBe(exported.caution);
    expect(caseTable.schema.metadata.get('checksum')).toBe(exported.checksum);

    const models = (await thermal.get(`/api/v1/missions/${missionId}/thermal-models`).expect(200)).body.items as { id: string }[];
    const run = (await thermal.post(`/api/v1/thermal-models/${models[0].id}/run`).send({ caseId: hot }).expect(200)).body as { result: { tS: number[]; nodes: { name: string; temperaturesC: number[]; maxC: number }[] } };
    const runTable = arrowOf(await raw('GET', `/api/v1/thermal-models/${models[0].id}/runs/${hot}`, { accept: ARROW, cookie: await cookieOf('thermal@kestrel.test') }));
    expect(numbers(runTable, 'tS')).toEqual(run.result.tS);
    for (const node of run.result.nodes) expect(numbers(runTable, `${node.name}.temperaturesC`)).toEqual(node.temperaturesC);
    const left = JSON.parse(runTable.schema.metadata.get('result') ?? '{}') as { nodes: { name: string; maxC: number }[] };
    expect(left.nodes.map((n) => n.maxC)).toEqual(run.result.nodes.map((n) => n.maxC));
  });

  it('answers the environment along an ephemeris in columns and as Arrow with the JSON answer\'s numbers', async () => {
    const missionId = createTestMission(t);
    const upload = await analyst.post(`/api/v1/missions/${missionId}/ephemerides`).field('frame', 'EME2000').attach('file', path.join(fixturesDir, 'leo-circular.csv')).expect(201);
    const url = `/api/v1/missions/${missionId}/ephemerides/${upload.body.id as string}/environment`;
    const json = (await analyst.post(url).send({}).expect(200)).body as { rows: number; points: { epoch: string; altitudeKm: number; surfaces: Load[] }[] };
    const columns = (await analyst.post(`${url}?layout=columns`).send({}).expect(200)).body as { rows: number; points: { epoch: string[]; altitudeKm: number[]; surfaces: (Record<(typeof quantities)[number], number[]> & { name: string })[] } };
    expect(columns.rows).toBe(json.rows);
    expect(columns.points.epoch).toEqual(json.points.map((p) => p.epoch));
    expect(columns.points.altitudeKm).toEqual(json.points.map((p) => p.altitudeKm));
    for (const q of quantities) expect(columns.points.surfaces[1][q]).toEqual(json.points.map((p) => p.surfaces[1][q]));
    const table = arrowOf(await raw('POST', url, { accept: ARROW }, {}));
    expect(Array.from(table.getChild('epoch')?.toArray() as string[])).toEqual(json.points.map((p) => p.epoch));
    const name = json.points[0].surfaces[1].name;
    expect(numbers(table, `${name}.absorbedW`)).toEqual(json.points.map((p) => p.surfaces[1].absorbedW));
  });
});

describe('GET /api/v1/openapi.json', () => {
  it('documents the columnar layout and the Arrow stream on every per-step route', async () => {
    type Operation = { parameters?: { name: string; in: string }[]; responses: Record<string, { description: string; content?: Record<string, unknown> }> };
    const doc = (await analyst.get('/api/v1/openapi.json').expect(200)).body as { paths: Record<string, Record<string, Operation>> };
    const perStep: [string, string][] = [
      ['/api/v1/environment/compute', 'post'],
      ['/api/v1/missions/{id}/orbits/{orbitId}/sweep', 'get'],
      ['/api/v1/missions/{id}/ephemerides/{ephemerisId}/environment', 'post'],
      ['/api/v1/cases/{id}/export', 'get'],
      ['/api/v1/thermal-models/{id}/run', 'post'],
      ['/api/v1/thermal-models/{id}/runs/{caseId}', 'get'],
    ];
    for (const [route, method] of perStep) {
      const operation = doc.paths[route]?.[method];
      expect(operation, `${method} ${route}`).toBeDefined();
      expect(operation!.parameters?.some((p) => p.in === 'query' && p.name === 'layout'), route).toBe(true);
      expect(Object.keys(operation!.responses['200']!.content ?? {}), route).toContain(ARROW);
      expect(operation!.responses['200']!.description).toMatch(/layout=columns/);
    }
  });
});

async function cookieOf(email: string): Promise<string> {
  const res = await fetch(`${base}/api/v1/auth/sign-in`, {
    method: 'POST', headers: { 'content-type': 'application/json', origin: base }, body: JSON.stringify({ email, password: 'eclipta-demo' }),
  });
  return (res.headers.get('set-cookie') ?? '').split(';')[0];
}
