// Exports of released cases as other teams import them: JSON valid against the served JSON Schema,
// CSV per RFC 4180 with units in the header, the same checksum in both (recomputed here from the
// JSON), an API-token import, and the OpenAPI document covering every route of the app.
import { createHash } from 'node:crypto';
import Ajv2020 from 'ajv/dist/2020';
import addFormats from 'ajv-formats';
import { parse as parseCsv } from 'csv-parse/sync';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listRoutes } from '../../server/route-list';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let viewer: request.Agent;
let released: { id: string; name: string; checksum: string; kind: string }[];

beforeAll(async () => {
  t = await createTestApp();
  viewer = await t.signIn('viewer@kestrel.test');
  released = (await viewer.get('/api/v1/cases?status=released').expect(200)).body.items;
});
afterAll(() => t.close());

// Written here again on purpose, from the rule the export states: keys sorted, no whitespace.
function canonical(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value);
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  const keys = Object.keys(value).sort();
  return `{${keys.map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`).join(',')}}`;
}
const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

describe('the demo seed', () => {
  it('holds a released hot and a released cold case of a Kestrel mission (API.md "Missions")', () => {
    expect(released.map((c) => c.kind).sort()).toEqual(['cold', 'hot']);
  });
});

describe('GET /api/v1/cases/:id/export?format=json', () => {
  it('validates against the JSON Schema served at /api/v1/schemas/load-case.json (ajv, draft 2020-12)', async () => {
    const schema = (await viewer.get('/api/v1/schemas/load-case.json').expect(200)).body;
    const ajv = new Ajv2020({ allErrors: true, strict: false });
    addFormats(ajv);
    const validate = ajv.compile(schema);
    for (const c of released) {
      const doc = JSON.parse((await viewer.get(`/api/v1/cases/${c.id}/export?format=json`).expect(200)).text);
      expect({ valid: validate(doc), errors: validate.errors ?? null }).toEqual({ valid: true, errors: null });
    }
    // and the validator does refuse a broken file
    const doc = JSON.parse((await viewer.get(`/api/v1/cases/${released[0]!.id}/export?format=json`)).text);
    delete doc.results.surfaces[0].orbitAverage;
    expect(validate(doc)).toBe(false);
  });

  it('carries the stored checksum, which the exported content reproduces, and the caution', async () => {
    const res = await viewer.get(`/api/v1/cases/${released[0]!.id}/export?format=json`).expect(200);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename=".+-rev\d+\.json"$/);
    const doc = JSON.parse(res.text);
    expect(doc.checksum).toBe(released[0]!.checksum);
    expect(sha256(canonical({ case: doc.case, inputs: doc.inputs, results: doc.results }))).toBe(doc.checksum);
    expect(doc.caution).toMatch(/Preliminary-design estimate from simplified models/);
    const again = JSON.parse((await viewer.get(`/api/v1/cases/${released[0]!.id}/export?format=json`)).text);
    expect(again.checksum).toBe(doc.checksum);
  });

  it('records who exported what (case.exported)', async () => {
    const rows = t.ctx.sqlite.prepare("SELECT summary FROM audit_events WHERE action = 'case.exported' AND target_id = ?").all(released[0]!.id) as { summary: string }[];
    expect(rows.length).toBeGreaterThanOrEqual(2);
    expect(rows[0]?.summary).toMatch(/as JSON/);
  });
});

/** Equal to within the rounding to `digits` decimals (half a unit of the last digit). */
const near = (value: unknown, expected: number, digits: number) => expect(Math.abs((value as number) - expected)).toBeLessThanOrEqual(0.5 * 10 ** -digits + 1e-9);

describe('GET /api/v1/cases/:id/export?format=csv', () => {
  it('is RFC 4180, one header row with units, one field count throughout, the caution and the checksum on every row', async () => {
    const c = released[0]!;
    const res = await viewer.get(`/api/v1/cases/${c.id}/export?format=csv`).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers['content-disposition']).toMatch(/\.csv"$/);
    expect(res.text.includes('\r\n')).toBe(true);
    // csv-parse refuses records of differing length unless told otherwise
    const rows = parseCsv(res.text, { columns: true }) as Record<string, string>[];
    expect(rows.length).toBeGreaterThan(0);
    for (const r of rows) {
      expect(r['checksum (sha256)']).toBe(c.checksum);
      expect(r['caution']).toMatch(/thermal test under the project's standards/);
      expect(r['status']).toBe('released');
    }
    const header = Object.keys(rows[0]!);
    // Every numeric column names its unit (RFC 4180 has no types; the unit travels in the header).
    for (const h of ['time from periapsis (s)', 'sunlit (0-1)', 'solar incident (W/m^2)', 'absorbed total (W)', 'beta (deg)']) expect(header).toContain(h);
  });

  it('reads back with csv-parse into the numbers of the JSON export, rounded to meaningful digits (W to 0.001, W/m^2 to 0.01)', async () => {
    const c = released[0]!;
    const csv = (await viewer.get(`/api/v1/cases/${c.id}/export?format=csv`).expect(200)).text;
    const json = JSON.parse((await viewer.get(`/api/v1/cases/${c.id}/export?format=json`)).text);
    const rows = parseCsv(csv, { columns: true, cast: (value, ctx) => (ctx.header || value === '' || Number.isNaN(Number(value)) ? value : Number(value)) }) as Record<string, string | number>[];
    const surfaces = json.results.surfaces as { name: string; series: Record<string, number[]>; orbitAverage: Record<string, number>; peak: Record<string, number> }[];
    const steps = rows.filter((r) => r['row'] === 'step');
    expect(steps.length).toBe(json.results.tS.length * surfaces.length);
    for (const r of steps) {
      const k = (r['step'] as number) - 1;
      const s = surfaces.find((x) => x.name === r['surface'])!;
      near(r['time from periapsis (s)'], json.results.tS[k], 1);
      near(r['sunlit (0-1)'], json.results.sunlit[k], 4);
      near(r['solar incident (W/m^2)'], s.series['solarWm2']![k]!, 2);
      near(r['IR absorbed (W)'], s.series['irW']![k]!, 3);
      near(r['absorbed total (W)'], s.series['absorbedW']![k]!, 3);
    }
    for (const s of surfaces) {
      const avg = rows.find((r) => r['row'] === 'orbit average' && r['surface'] === s.name)!;
      near(avg['absorbed total (W)'], s.orbitAverage['absorbedW']!, 3);
      near(avg['absorbed total with margin (W)'], s.orbitAverage['absorbedWithMarginW']!, 3);
      const peak = rows.find((r) => r['row'] === 'peak' && r['surface'] === s.name)!;
      near(peak['solar absorbed (W)'], s.peak['solarW']!, 3);
    }
    const total = rows.find((r) => r['row'] === 'orbit average' && r['surface'] === 'spacecraft total')!;
    near(total['absorbed total (W)'], json.results.total.orbitAverageAbsorbedW, 3);
    expect(total['heat-load margin (%)']).toBe(json.inputs.margins.heatLoadPercent);
    near(total['beta (deg)'], json.results.betaDeg, 3);
    // No floating-point noise: no number carries more than 6 decimals.
    expect(csv).not.toMatch(/\d\.\d{7,}/);
  });

  it("carries a moon orbiter's planet shadow per step (parentSunlit) as read back by csv-parse, and leaves the column empty about a planet", async () => {
    // The Europa demo orbit's cold case takes the orbit amid the mission's longest shadow of Jupiter (DEVELOPERS.md "Moons").
    const thermal = await t.signIn('thermal@kestrel.test');
    const mission = t.ctx.sqlite.prepare("SELECT m.id AS missionId, o.id AS orbitId FROM missions m JOIN orbits o ON o.mission_id = m.id WHERE m.body_id = 'europa'").get() as { missionId: string; orbitId: string };
    const derived = (await thermal.post(`/api/v1/missions/${mission.missionId}/cases/derive`).send({ orbitId: mission.orbitId, name: 'Europa export', steps: 60 }).expect(201)).body.items as { id: string; kind: string }[];
    const cold = derived.find((c) => c.kind === 'cold')!;
    const [hotJson, json] = await Promise.all(['hot', 'cold'].map(async (kind) => JSON.parse((await thermal.get(`/api/v1/cases/${derived.find((c) => c.kind === kind)!.id}/export?format=json`).expect(200)).text)));
    const parent = json.results.parentSunlit as number[];
    expect(parent).toHaveLength(json.results.tS.length);
    expect(Math.min(...parent)).toBeLessThan(1);
    const schema = (await viewer.get('/api/v1/schemas/load-case.json').expect(200)).body;
    const ajv = new Ajv2020({ allErrors: true, strict: false });
    addFormats(ajv);
    const validate = ajv.compile(schema);
    // both follow the schema, with what a moon's derivation decides (the planet's shadow, the surface field)
    for (const doc of [hotJson, json]) expect({ valid: validate(doc), errors: validate.errors ?? null }).toEqual({ valid: true, errors: null });
    const csv = (await thermal.get(`/api/v1/cases/${cold.id}/export?format=csv`).expect(200)).text;
    const rows = parseCsv(csv, { columns: true, cast: (value, ctx) => (ctx.header || value === '' || Number.isNaN(Number(value)) ? value : Number(value)) }) as Record<string, string | number>[];
    const steps = rows.filter((r) => r['row'] === 'step');
    expect(steps.length).toBe(json.results.tS.length * json.results.surfaces.length);
    for (const r of steps) near(r['sunlit past the parent planet (0-1)'], parent[(r['step'] as number) - 1]!, 4);
    // about the Earth there is no parent planet: the column is there, empty
    const earth = parseCsv((await viewer.get(`/api/v1/cases/${released[0]!.id}/export?format=csv`).expect(200)).text, { columns: true }) as Record<string, string>[];
    expect(earth.every((r) => r['sunlit past the parent planet (0-1)'] === '')).toBe(true);
  });

  it('refuses an unknown format with 400 naming it', async () => {
    const res = await viewer.get(`/api/v1/cases/${released[0]!.id}/export?format=xlsx`).expect(400);
    expect(res.body.error.details[0].path).toBe('format');
    expect(res.body.error.details[0].message).toMatch(/xlsx/);
  });
});

describe('import with a personal API token', () => {
  it("lets a viewer's read-only token GET the export, and nothing more", async () => {
    const made = await viewer.post('/api/v1/tokens').send({ name: 'power team import', readOnly: true }).expect(201);
    const bearer = `Bearer ${made.body.secret as string}`;
    const res = await request(t.app).get(`/api/v1/cases/${released[0]!.id}/export?format=json`).set('Authorization', bearer).expect(200);
    expect(JSON.parse(res.text).checksum).toBe(released[0]!.checksum);
    const refused = await request(t.app).post(`/api/v1/cases/${released[0]!.id}/subscription`).set('Authorization', bearer);
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('read_only_token');
  });
});

describe('GET /api/v1/openapi.json', () => {
  it('describes every route the app answers (OpenAPI 3, generated from the zod schemas)', async () => {
    const doc = (await viewer.get('/api/v1/openapi.json').expect(200)).body as { openapi: string; paths: Record<string, Record<string, unknown>> };
    expect(doc.openapi).toMatch(/^3\./);
    const missing = listRoutes(t.app)
      .filter((r) => r.path.startsWith('/api/'))
      .map((r) => ({ method: r.method.toLowerCase(), path: r.path.replace(/:(\w+)/g, '{$1}') }))
      .filter((r) => !doc.paths[r.path]?.[r.method])
      .map((r) => `${r.method.toUpperCase()} ${r.path}`);
    expect(missing).toEqual([]);
    const derive = doc.paths['/api/v1/missions/{id}/cases/derive']?.['post'] as { requestBody?: unknown; responses: Record<string, unknown> };
    expect(derive.requestBody).toBeDefined();
    expect(Object.keys(derive.responses)).toContain('201');
  });

  it('lists no route the app does not answer', async () => {
    const doc = (await viewer.get('/api/v1/openapi.json').expect(200)).body as { paths: Record<string, Record<string, unknown>> };
    const answered = new Set(listRoutes(t.app).map((r) => `${r.method.toLowerCase()} ${r.path.replace(/:(\w+)/g, '{$1}')}`));
    const extra = Object.entries(doc.paths).flatMap(([path, ops]) => Object.keys(ops).map((m) => `${m} ${path}`)).filter((k) => !answered.has(k));
    expect(extra).toEqual([]);
  });
});
