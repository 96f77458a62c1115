// Hostile input on every JSON route (fast-check): bodies that are invalid by construction, mixed
// with wrong types, huge and tiny numbers, NaN and Infinity as text, very long strings, deep
// nesting, __proto__ and constructor keys and extra fields. No answer may be a 5xx or a success,
// every error has API.md's shape, nothing is written and Object.prototype stays as it was.
// The route list comes from the app, so a new JSON route without a sample body fails here.
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hostileBodies, probe, startClient, type Client } from './hostile-bodies';
import { buildScene, concretePath, jsonRoutes, routeKey, sampleBody, validatesBody, type Scene } from './route-samples';
import { createTestApp, type TestApp } from './test-app';

const runs = Number(process.env['ECLIPTA_HOSTILE_RUNS'] ?? 1000);

let t: TestApp;
let scene: Scene;
let client: Client;
beforeAll(async () => {
  t = await createTestApp();
  scene = await buildScene(t);
  client = await startClient(t.app);
}, 60_000);
afterAll(async () => {
  await client.close();
  await t.close();
});

describe('hostile JSON bodies', () => {
  it('has a sample body for every JSON route the app answers', () => {
    const keys = jsonRoutes(t.app).map(routeKey);
    expect(keys.length).toBeGreaterThanOrEqual(30);
    expect(keys.filter((k) => sampleBody(k, scene.ids) === undefined)).toEqual([]);
  });

  it('the generator makes what it promises: __proto__ keys, 1e400, "NaN", long strings, deep nesting', () => {
    const bodies = fc.sample(hostileBodies({ a: 1, b: { c: 'x' } }), { numRuns: 3000, seed: 8 });
    for (const pattern of [/"__proto__":/, /\b1e400\b/, /"NaN"/, /"Infinity"/, /x{4001}/, /\[{10}/, /^(?!\{)/]) {
      expect(bodies.some((b) => pattern.test(b)), String(pattern)).toBe(true);
    }
  });

  it('a well-formed sample still succeeds, so the refusals below are about the hostile parts', async () => {
    const res = await client.send('POST', '/api/v1/units/convert', JSON.stringify(sampleBody('POST /api/v1/units/convert', scene.ids)), { cookie: scene.cookies['owner@kestrel.test'] ?? '' });
    expect(res.status).toBe(200);
  });
});

describe('every JSON route', () => {
  it(`answers ${runs} hostile bodies a route with a 4xx in API.md's shape and writes nothing`, async () => {
    const owner = { cookie: scene.cookies['owner@kestrel.test'] ?? '' };
    const failures: string[] = [];
    for (const route of jsonRoutes(t.app)) {
      const key = routeKey(route);
      const target = { method: route.method, path: concretePath(route, scene.ids), headers: owner, validatesBody: validatesBody(key) };
      const started = Date.now();
      try {
        await fc.assert(
          fc.asyncProperty(hostileBodies(sampleBody(key, scene.ids)), async (body) => {
            const problem = await probe(client, t.ctx.sqlite, target, body);
            if (problem) throw new Error(problem);
          }),
          { numRuns: runs, seed: 42, endOnFailure: true },
        );
      } catch (err) {
        failures.push(`${key}: ${err instanceof Error ? err.message.slice(0, 1500) : String(err)}`);
      }
      // The owner's session must outlive every route but sign-out (last), or later routes would only hear 401.
      if (key !== 'POST /api/v1/auth/sign-out' && (await client.send('GET', '/api/v1/auth/me', '', owner)).status !== 200) {
        failures.push(`${key}: the owner's session ended, so the routes after it were not really tried`);
      }
      if (process.env['ECLIPTA_HOSTILE_TIMES']) console.log(`${key}: ${Date.now() - started} ms`);
    }
    expect(failures).toEqual([]);
  }, 600_000);
});
