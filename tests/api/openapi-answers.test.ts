// The OpenAPI document against what the routes answer: every GET route with a JSON answer, and the
// case routes that write (derive, custom case, comment, return, new revision), called on a scene of
// real objects; each answer must follow its documented schema (ajv, OpenAPI 3.0 `nullable`) and hold
// no field the document does not describe. Common practice for an API description, no source.
import Ajv from 'ajv';
import addFormats from 'ajv-formats';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiRoutes } from '../../server/routes/api-routes';
import { buildScene, concretePath, sampleBody, type Scene } from './route-samples';
import { createTestApp, type TestApp } from './test-app';

interface Schema {
  $ref?: string;
  type?: string;
  nullable?: boolean;
  properties?: Record<string, Schema>;
  additionalProperties?: boolean | Schema;
  items?: Schema;
  allOf?: Schema[];
  anyOf?: Schema[];
  oneOf?: Schema[];
}

interface OpenApiDoc {
  paths: Record<string, Record<string, { responses: Record<string, { content?: Record<string, { schema: Schema }> }> }>>;
  components: { schemas?: Record<string, Schema> };
}

let t: TestApp;
let scene: Scene;
let doc: OpenApiDoc;

beforeAll(async () => {
  t = await createTestApp();
  scene = await buildScene(t);
  doc = (await request(t.app).get('/api/v1/openapi.json').set('cookie', scene.cookies['owner@kestrel.test']!).expect(200)).body as OpenApiDoc;
}, 60_000);
afterAll(() => t.close());

const resolve = (s: Schema): Schema => (s.$ref ? resolve(doc.components.schemas?.[s.$ref.replace('#/components/schemas/', '')] ?? {}) : s);

/** The fields of an answer its schema does not describe, as paths ("inputs.fixed"); an open object (no properties) describes all. */
function undocumented(value: unknown, schema: Schema, at: string): string[] {
  const s = resolve(schema);
  const branches = [...(s.allOf ?? []), ...(s.anyOf ?? []), ...(s.oneOf ?? [])].map(resolve);
  if (value === null || typeof value !== 'object') return [];
  if (Array.isArray(value)) {
    const items = s.items ?? branches.find((b) => b.items)?.items;
    return items ? value.flatMap((v, k) => (k < 3 ? undocumented(v, items, `${at}[${k}]`) : [])) : [];
  }
  const objectSchemas = [s, ...branches].filter((b) => b.properties || b.additionalProperties !== undefined);
  if (objectSchemas.length === 0) return [];
  const out: string[] = [];
  for (const [key, v] of Object.entries(value)) {
    const path = at ? `${at}.${key}` : key;
    const prop = objectSchemas.find((b) => b.properties?.[key])?.properties?.[key];
    const extra = objectSchemas.find((b) => typeof b.additionalProperties === 'object' || b.additionalProperties === true)?.additionalProperties;
    if (prop) out.push(...undocumented(v, prop, path));
    else if (typeof extra === 'object') out.push(...undocumented(v, extra, path));
    else if (extra !== true && objectSchemas.every((b) => b.properties)) out.push(path);
  }
  return out;
}

/** OpenAPI 3.0's boolean exclusive bounds and `nullable` as ajv (JSON Schema draft 7) reads them. */
function forAjv(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(forAjv);
  if (value === null || typeof value !== 'object') return value;
  const out: Record<string, unknown> = Object.fromEntries(Object.entries(value).map(([k, v]) => [k, forAjv(v)]));
  for (const [flag, bound] of [['exclusiveMinimum', 'minimum'], ['exclusiveMaximum', 'maximum']] as const) {
    if (typeof out[flag] === 'boolean') {
      if (out[flag]) out[flag] = out[bound];
      else delete out[flag];
      if (typeof out[flag] === 'number') delete out[bound];
    }
  }
  if (out['nullable'] === true) {
    delete out['nullable'];
    // OpenAPI 3.0.3 asks a nullable enum to list null itself; zod-to-openapi does, so add it only where missing.
    if (Array.isArray(out['enum']) && !out['enum'].includes(null)) out['enum'] = [...(out['enum'] as unknown[]), null];
    if (typeof out['type'] === 'string') return { ...out, type: [out['type'], 'null'] };
    return { anyOf: [out, { type: 'null' }] };
  }
  return out;
}

function checkAnswer(method: string, path: string, status: number, body: unknown): { undocumented: string[]; invalid: unknown } {
  const openApiPath = path.replace(/:(\w+)/g, '{$1}');
  const schema = doc.paths[openApiPath]?.[method]?.responses[String(status)]?.content?.['application/json']?.schema;
  if (!schema) return { undocumented: [`no JSON schema documented for ${method.toUpperCase()} ${path} ${status}`], invalid: null };
  const ajv = new Ajv({ allErrors: true, strict: false });
  addFormats(ajv);
  for (const [name, s] of Object.entries(doc.components.schemas ?? {})) ajv.addSchema(forAjv(s) as object, `#/components/schemas/${name}`);
  const validate = ajv.compile(forAjv(schema) as object);
  return { undocumented: undocumented(body, schema, ''), invalid: validate(body) ? null : validate.errors?.slice(0, 3) };
}

const owner = () => scene.cookies['owner@kestrel.test']!;
const queries: Record<string, string> = {
  'GET /api/v1/cases/:id/compare': '?with=RELEASED',
  'GET /api/v1/cases/:id/export': '?format=json',
  'GET /api/v1/bodies/:bodyId/sun-synchronous': '?altitudeKm=550',
};

describe('the OpenAPI document describes what the routes answer', () => {
  it('every GET route with a JSON answer, called as the Kestrel owner', async () => {
    const routes = apiRoutes.filter((r) => r.method === 'get' && r.response && !r.path.includes('openapi.json') && !r.path.includes('schemas/'));
    const problems: Record<string, unknown> = {};
    let checked = 0;
    for (const route of routes) {
      const key = `GET ${route.path}`;
      const url = concretePath({ method: 'GET', path: route.path }, scene.ids) + (queries[key] ?? '').replace('RELEASED', scene.ids.releasedCaseId);
      const res = await request(t.app).get(url).set('cookie', owner()).set('origin', 'http://eclipta.test');
      if (res.status !== (route.status ?? 200)) {
        problems[key] = `answered ${res.status}: ${JSON.stringify(res.body).slice(0, 200)}`;
        continue;
      }
      const found = checkAnswer('get', route.path, res.status, res.body);
      checked++;
      if (found.undocumented.length > 0 || found.invalid) problems[key] = found;
    }
    expect(problems).toEqual({});
    expect(checked).toBeGreaterThan(25);
  }, 120_000);

  it('the case routes that write: derive, custom case, comment, return to the author, new revision', async () => {
    const problems: Record<string, unknown> = {};
    const calls: [string, string, number][] = [
      ['post', '/api/v1/missions/:id/cases/derive', 201],
      ['post', '/api/v1/missions/:id/cases', 201],
      ['post', '/api/v1/cases/:id/comments', 201],
      ['post', '/api/v1/cases/:id/return', 200],
      ['post', '/api/v1/cases/:id/revisions', 201],
    ];
    const as = { 'post /api/v1/cases/:id/return': 'owner@kestrel.test' } as Record<string, string>;
    for (const [method, path, status] of calls) {
      const key = `${method.toUpperCase()} ${path}`;
      const cookie = scene.cookies[as[`${method} ${path}`] ?? 'thermal@kestrel.test']!;
      const body = path.endsWith('/revisions') ? { reason: 'documented answer check', fromCurrentInputs: true } : sampleBody(key, scene.ids);
      const res = await request(t.app).post(concretePath({ method: method.toUpperCase(), path }, scene.ids)).set('cookie', cookie).set('origin', 'http://eclipta.test').send(body as object);
      if (res.status !== status) {
        problems[key] = `answered ${res.status}: ${JSON.stringify(res.body).slice(0, 200)}`;
        continue;
      }
      const found = checkAnswer(method, path, res.status, res.body);
      if (found.undocumented.length > 0 || found.invalid) problems[key] = found;
    }
    expect(problems).toEqual({});
  }, 120_000);

  it('says in words what the review and currency fields mean (OpenAPI and the load-case JSON Schema)', async () => {
    const json = (path: string, method: string, status: string) => resolve(doc.paths[path]![method]!.responses[status]!.content!['application/json']!.schema);
    const described = (schema: Schema, fields: string[]) =>
      fields.filter((f) => !(resolve(schema.properties?.[f] ?? {}) as { description?: string }).description && !(schema.properties?.[f] as { description?: string } | undefined)?.description);
    const detail = json('/api/v1/cases/{id}', 'get', '200');
    expect(described(detail, ['actions', 'comments', 'inputChanges', 'currentInputsBlocked', 'inputsChanged', 'caution', 'version'])).toEqual([]);
    expect(described(resolve(detail.properties!['inputs']!), ['revisionReason', 'fixed', 'handEdited', 'facts', 'decision', 'ephemeris'])).toEqual([]);
    expect(described(resolve(detail.properties!['results']!), ['parentSunlit', 'sunlit', 'tS'])).toEqual([]);
    expect(described(json('/api/v1/workspaces/{workspaceId}/overview', 'get', '200'), ['waitingForReview', 'returnedToMe', 'followed', 'stale'])).toEqual([]);
    const revisionBody = (doc.paths['/api/v1/cases/{id}/revisions']!['post'] as unknown as { requestBody: { content: Record<string, { schema: Schema }> } }).requestBody;
    expect(described(resolve(revisionBody.content['application/json']!.schema), ['reason', 'fromCurrentInputs'])).toEqual([]);
    const loadCase = (await request(t.app).get('/api/v1/schemas/load-case.json').set('cookie', owner()).expect(200)).body as { properties: Record<string, { properties: Record<string, { description?: string }> }> };
    for (const [part, field] of [['inputs', 'revisionReason'], ['inputs', 'fixed'], ['results', 'parentSunlit']] as const) {
      expect(loadCase.properties[part]!.properties[field]?.description, `${part}.${field}`).toBeTruthy();
    }
  });

  it('finds a field the document leaves out (the check can fail)', () => {
    const schema = { type: 'object', properties: { a: { type: 'object', properties: { b: { type: 'number' } } } } };
    expect(undocumented({ a: { b: 1, c: 2 }, d: [] }, schema, '')).toEqual(['a.c', 'd']);
  });
});
