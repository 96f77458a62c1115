// Hostile input on every JSON route (fast-check): bodies that are invalid by construction, mixed
// with wrong types, huge and tiny numbers, NaN and Infinity as text, very long strings, deep
// nesting (up to 50,000 levels), __proto__ and constructor keys and extra fields, some of them
// with a Content-Encoding that is real, false, cut short or unsupported. No answer may be a 5xx or a success,
// every error has API.md's shape, nothing is written and Object.prototype stays as it was.
// The route list comes from the app, so a new JSON route without a sample body fails here.
// npm test sends TEST_RUNS bodies a route with a fixed seed, and checks that every route met every
// kind of breaking mutation and of Content-Encoding; `npm run bench:soak` sends 10,000 a route.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { breakingKinds, encodingKinds, hostileBodies, hostileRequests, probeEveryRoute, TEST_RUNS } from './hostile-bodies';
import { probeSceneForSuite } from './probe-scene-suite';
import { jsonRoutes, routeKey, sampleBody } from './route-samples';

const runs = Number(process.env['ECLIPTA_HOSTILE_RUNS'] ?? TEST_RUNS);

const suite = probeSceneForSuite();

describe('hostile JSON bodies', () => {
  it('has a sample body for every JSON route the app answers', () => {
    const keys = jsonRoutes(suite.t.app).map(routeKey);
    expect(keys.length).toBeGreaterThanOrEqual(30);
    expect(keys.filter((k) => sampleBody(k, suite.scene.ids) === undefined)).toEqual([]);
  });

  it('the generator makes what it promises: __proto__ keys, 1e400, "NaN", long strings, deep nesting', () => {
    const bodies = fc.sample(hostileBodies({ a: 1, b: { c: 'x' } }), { numRuns: 3000, seed: 8 });
    for (const pattern of [/"__proto__":/, /\b1e400\b/, /"NaN"/, /"Infinity"/, /x{4001}/, /\[{10}/, /\[{5000}/, /(\{"a":){5000}/, /^(?!\{)/]) {
      expect(bodies.some((b) => pattern.test(b)), String(pattern)).toBe(true);
    }
  });

  it('and sends some of them compressed, said to be compressed but not, cut short, or in an encoding the server does not take', () => {
    const requests = fc.sample(hostileRequests({ a: 1 }), { numRuns: 3000, seed: 8 });
    const encodings = new Set(requests.map((r) => r.headers['content-encoding'] ?? 'none'));
    for (const name of ['none', 'gzip', 'deflate', 'br', 'gzip, br', 'zstd']) expect(encodings.has(name), name).toBe(true);
    const gzipMagic = (r: { body: string | Buffer }) => Buffer.isBuffer(r.body) && r.body[0] === 0x1f && r.body[1] === 0x8b;
    expect(requests.some((r) => r.headers['content-encoding'] === 'gzip' && gzipMagic(r))).toBe(true);
    expect(requests.some((r) => r.headers['content-encoding'] === 'gzip' && typeof r.body === 'string')).toBe(true);
  });

  it('a well-formed sample still succeeds, so the refusals below are about the hostile parts', async () => {
    const res = await suite.client.send('POST', '/api/v1/units/convert', JSON.stringify(sampleBody('POST /api/v1/units/convert', suite.scene.ids)), { cookie: suite.scene.cookies['owner@kestrel.test'] ?? '' });
    expect(res.status).toBe(200);
  });
});

describe('every JSON route', () => {
  it(`answers ${runs} hostile bodies a route with a 4xx in API.md's shape and writes nothing`, async () => {
    const times = process.env['ECLIPTA_HOSTILE_TIMES'] ? (key: string, _sent: number, ms: number) => console.log(`${key}: ${ms} ms`) : undefined;
    const { failures, kindsByRoute } = await probeEveryRoute(suite, runs, 42, times);
    expect(failures).toEqual([]);
    // Fewer bodies than the soak, but every route still meets every kind of hostile request.
    const everyKind = [...breakingKinds.map((k) => `breaking ${k}`), ...encodingKinds.map((k) => `encoding ${k}`)];
    const missed = [...kindsByRoute].flatMap(([key, kinds]) => everyKind.filter((k) => !kinds.has(k)).map((k) => `${key}: ${k}`));
    expect(missed).toEqual([]);
    // The fuzz run's server log: no answer of 5xx, no unhandled error (issue 12, item 6).
    expect(suite.t.logLines.filter((line) => line.includes('"status":5') || line.includes('unhandled error'))).toEqual([]);
  }, 600_000);
});
