// Hostile JSON bodies for every JSON route, and the check each answer must pass: the one source of
// the probe bodies and of the run over every route, shared by the hostile-input test (npm test,
// TEST_RUNS bodies a route, a fixed seed) and bench/soak.ts (10,000 a route, random seeds).
//
// A body is a route's valid sample with one mutation that makes it invalid by construction
// (protected from the later mutations) (an
// unknown key such as __proto__, a string far over every length limit, 1e400 (Infinity once
// parsed), "NaN"/"Infinity" where a number was, or a body that is not an object at all) plus up to
// three more hostile mutations of any kind (wrong types, huge and tiny numbers, deep nesting,
// removed fields). Bodies are written as JSON text by hand so that "__proto__" keys and numbers
// such as 1e400 reach the server exactly as an attacker would send them. hostileRequests() sends
// some of them with a hostile Content-Encoding as well (real, declared only, cut short, unsupported).
import fc from 'fast-check';
import type { AddressInfo } from 'node:net';
import { brotliCompressSync, constants as zlibConstants, deflateSync, gzipSync } from 'node:zlib';
import { Agent, request as httpRequest, type Server } from 'node:http';
import type { Express } from 'express';
import { errorBody } from '../../shared/api/errors';
import type { Sqlite } from '../../server/db/database';
import { buildScene, concretePath, jsonRoutes, routeKey, sampleBody, validatesBody, type Scene } from './route-samples';
import { createTestApp, type TestApp } from './test-app';

type Json = { raw: string } | { items: Json[] } | { pairs: [string, Json][] };

function toAst(value: unknown): Json {
  if (Array.isArray(value)) return { items: value.map(toAst) };
  if (value !== null && typeof value === 'object') return { pairs: Object.entries(value).map(([k, v]) => [k, toAst(v)]) };
  return { raw: JSON.stringify(value) };
}

function render(node: Json): string {
  if ('raw' in node) return node.raw;
  if ('items' in node) return `[${node.items.map(render).join(',')}]`;
  return `{${node.pairs.map(([k, v]) => `${JSON.stringify(k)}:${render(v)}`).join(',')}}`;
}

interface Place {
  node: Json;
  set: (n: Json) => void;
  /** The containers above the node, the root first. */
  parents: Json[];
}

/** Every node of the tree with a setter that replaces it (the root's setter replaces the body). */
function places(root: { body: Json }): Place[] {
  const out: Place[] = [];
  const visit = (node: Json, set: (n: Json) => void, parents: Json[]) => {
    out.push({ node, set, parents });
    const below = [...parents, node];
    if ('items' in node) node.items.forEach((child, i) => visit(child, (n) => (node.items[i] = n), below));
    if ('pairs' in node) node.pairs.forEach((pair) => visit(pair[1], (n) => (pair[1] = n), below));
  };
  visit(root.body, (n) => (root.body = n), []);
  return out;
}

/**
 * Nesting under the server's depth limit (64, reaches the schemas) and far over it (up to 50,000
 * levels, where recursive code would overflow the stack: refused before parsing).
 */
const depth = fc.oneof(fc.integer({ min: 10, max: 60 }), fc.integer({ min: 65, max: 2000 }), fc.integer({ min: 5000, max: 50_000 }));
const deep = (open: string, inner: string, close: string) => depth.map((d) => open.repeat(d) + inner + close.repeat(d));

/** Strings over every length limit of the API (the longest text field allows 4000 characters). */
const overlongString = fc.oneof({ weight: 9, arbitrary: fc.integer({ min: 4001, max: 20_000 }) }, { weight: 1, arbitrary: fc.integer({ min: 20_000, max: 1_000_000 }) }).map((n) => JSON.stringify('x'.repeat(n)));
/** What no number field accepts: Infinity (1e400 parses to it), NaN and Infinity as text. */
const notANumber = fc.constantFrom('1e400', '-1e400', '"NaN"', '"Infinity"', '"-Infinity"', '"NaN km"', '"Infinity km"', '"1e400"', '"-1e999 m"');
const breakingValue = fc.oneof(overlongString, notANumber);

/** Keys that are no field of any body. */
const unknownKey = fc.oneof(
  fc.constantFrom('__proto__', 'constructor', 'prototype', 'toString', 'valueOf', 'hasOwnProperty', 'isAdmin', '\u0000', ''),
  fc.string({ minLength: 1, maxLength: 12 }).map((s) => `extra ${s}`),
);

const hostileValue = fc.oneof(
  fc.constantFrom('null', 'true', 'false', '[]', '{}', '0', '-1', '""', '"text"'),
  fc.constantFrom('1.7976931348623157e308', '-1.7976931348623157e308', '9007199254740993', '1e21', '123456789012345678901234567890'),
  fc.constantFrom('5e-324', '-5e-324', '1e-300', '-0', '0.000000000000000000001'),
  fc.constantFrom('"__proto__"', '"constructor"', '{"__proto__":{"polluted":true}}', '{"constructor":{"prototype":{"polluted":true}}}'),
  fc.string({ unit: 'grapheme', maxLength: 40 }).map((s) => JSON.stringify(s)),
  fc.double({ noNaN: true, noDefaultInfinity: true }).map((x) => JSON.stringify(x)),
  fc.jsonValue({ maxDepth: 3 }).map((v) => JSON.stringify(v)),
  deep('[', '', ']'),
  deep('{"a":', '0', '}'),
  breakingValue,
);

type Mutation =
  | { kind: 'replace'; at: number; value: string }
  | { kind: 'add'; at: number; key: string; value: string }
  | { kind: 'remove'; at: number; index: number }
  | { kind: 'wrap'; at: number };

const anyMutation: fc.Arbitrary<Mutation> = fc.oneof(
  fc.record({ kind: fc.constant('replace' as const), at: fc.nat(), value: hostileValue }),
  fc.record({ kind: fc.constant('add' as const), at: fc.nat(), key: unknownKey, value: hostileValue }),
  fc.record({ kind: fc.constant('remove' as const), at: fc.nat(), index: fc.nat() }),
  fc.record({ kind: fc.constant('wrap' as const), at: fc.nat() }),
);

/** Applies a mutation unless it would replace or remove a protected node (the breaking one or a container of it). */
function apply(root: { body: Json }, m: Mutation, kept: Set<Json>): void {
  const all = places(root);
  if (m.kind === 'add' || m.kind === 'remove') {
    const objects = all.map((p) => p.node).filter((n): n is { pairs: [string, Json][] } => 'pairs' in n);
    const target = objects[m.at % Math.max(1, objects.length)];
    if (!target) return;
    if (m.kind === 'add') target.pairs.push([m.key, { raw: m.value }]);
    else if (target.pairs.length > 0) {
      const index = m.index % target.pairs.length;
      const pair = target.pairs[index];
      if (pair && !kept.has(pair[1])) target.pairs.splice(index, 1);
    }
    return;
  }
  const target = all[m.at % all.length];
  if (!target || (m.kind === 'replace' && kept.has(target.node))) return;
  const replacement: Json = m.kind === 'replace' ? { raw: m.value } : { items: [target.node] };
  // A wrapper around the breaking node guards it like the node's own containers do.
  if (m.kind === 'wrap' && kept.has(target.node)) kept.add(replacement);
  target.set(replacement);
}

/**
 * The breaking mutation: an unknown key in an object of the body, a leaf replaced by a breaking
 * value, or a body that is not an object. Applied last so no other mutation can undo it.
 */
const breaking = fc.oneof(
  fc.record({ kind: fc.constant('add' as const), at: fc.nat(), key: unknownKey, value: hostileValue }),
  fc.record({ kind: fc.constant('leaf' as const), at: fc.nat(), text: overlongString, number: notANumber }),
  fc.record({ kind: fc.constant('root' as const), value: fc.oneof(fc.constantFrom('null', '[]', '0', '"{}"', 'true'), fc.jsonValue().filter((v) => v === null || typeof v !== 'object' || Array.isArray(v)).map((v) => JSON.stringify(v))) }),
);

type BreakingMutation = typeof breaking extends fc.Arbitrary<infer T> ? T : never;
export type BreakingKind = BreakingMutation['kind'];

/** Bodies derived from `sample`, each invalid by construction, with the kind of their breaking mutation. */
function labelledBodies(sample: unknown): fc.Arbitrary<{ body: string; breaking: BreakingKind }> {
  return fc.tuple(breaking, fc.array(anyMutation, { maxLength: 3 })).map(([first, mutations]) => ({ body: mutated(sample, first, mutations), breaking: first.kind }));
}

/** Bodies derived from `sample`, each invalid by construction. */
export function hostileBodies(sample: unknown): fc.Arbitrary<string> {
  return labelledBodies(sample).map((b) => b.body);
}

/** `sample` with the breaking mutation applied last, so that none of the others can undo it. */
function mutated(sample: unknown, first: BreakingMutation, mutations: Mutation[]): string {
  if (first.kind === 'root') return first.value;
  const root = { body: toAst(structuredClone(sample)) };
  if (!('pairs' in root.body)) root.body = { pairs: [] };
  let broken: Json;
  if (first.kind === 'add') {
    const objects = places(root).map((p) => p.node).filter((n): n is { pairs: [string, Json][] } => 'pairs' in n);
    broken = { raw: first.value };
    objects[first.at % objects.length]?.pairs.push([first.key, broken]);
  } else {
    // A leaf that held a string gets an overlong one; a number gets Infinity or NaN.
    const leaves = places(root).filter((p) => 'raw' in p.node && /^["\d-]/.test(p.node.raw));
    const leaf = leaves[first.at % Math.max(1, leaves.length)];
    broken = { raw: leaf && 'raw' in leaf.node && leaf.node.raw.startsWith('"') ? first.text : first.number };
    if (leaf) leaf.set(broken);
    else if ('pairs' in root.body) root.body.pairs.push(['extra field', broken]);
  }
  const brokenPlace = places(root).find((p) => p.node === broken);
  const kept = new Set<Json>([broken, ...(brokenPlace?.parents ?? [])]);
  for (const m of mutations) apply(root, m, kept);
  return render(root.body);
}

/** A hostile body as sent: maybe compressed, maybe only said to be, with its headers. */
export interface HostileRequest {
  body: string | Buffer;
  headers: Record<string, string>;
  /** What makes it hostile: the breaking mutation and the Content-Encoding's kind (for the coverage count). */
  kinds: { breaking: BreakingKind; encoding: EncodingKind };
}

// Brotli at its fastest: its default (11) takes seconds on the megabyte-long strings.
const brotliFast = (body: string) => brotliCompressSync(body, { params: { [zlibConstants.BROTLI_PARAM_QUALITY]: 1 } });
const compressors = { gzip: (body: string) => gzipSync(body, { level: 1 }), deflate: (body: string) => deflateSync(body, { level: 1 }), br: brotliFast } as const;
type Compressed = keyof typeof compressors;
const compressed = fc.constantFrom<Compressed>('gzip', 'deflate', 'br');

/**
 * What the Content-Encoding says and what the bytes are: mostly plain JSON; else the body truly
 * compressed (still invalid inside), a compression declared but not applied, a compressed body cut
 * short, or an encoding the server does not take (several at once, compress, zstd, made up).
 */
const encoding = fc.oneof(
  { weight: 12, arbitrary: fc.constant({ kind: 'plain' as const }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('compressed' as const), name: compressed }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('declared' as const), name: compressed }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('truncated' as const), name: compressed, keep: fc.double({ min: 0, max: 0.95, noNaN: true }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('unsupported' as const), header: fc.constantFrom('gzip, br', 'compress', 'zstd', 'x-gzip2', 'identity, gzip', '*') }) },
);

export type EncodingKind = (typeof encoding extends fc.Arbitrary<infer T> ? T : never)['kind'];
export const breakingKinds: readonly BreakingKind[] = ['add', 'leaf', 'root'];
export const encodingKinds: readonly EncodingKind[] = ['plain', 'compressed', 'declared', 'truncated', 'unsupported'];

/** Hostile bodies of hostileBodies(), some of them with a hostile Content-Encoding as well. */
export function hostileRequests(sample: unknown): fc.Arbitrary<HostileRequest> {
  return fc.tuple(labelledBodies(sample), encoding).map(([{ body, breaking: broken }, enc]): HostileRequest => {
    const kinds = { breaking: broken, encoding: enc.kind };
    switch (enc.kind) {
      case 'plain':
        return { body, headers: {}, kinds };
      case 'compressed':
        return { body: compressors[enc.name](body), headers: { 'content-encoding': enc.name }, kinds };
      case 'declared':
        return { body, headers: { 'content-encoding': enc.name }, kinds };
      case 'truncated': {
        const whole = compressors[enc.name](body);
        return { body: whole.subarray(0, Math.floor(whole.length * enc.keep)), headers: { 'content-encoding': enc.name }, kinds };
      }
      case 'unsupported':
        return { body, headers: { 'content-encoding': enc.header }, kinds };
    }
  });
}

/** A light in-process client: the app on a random port, node:http with one kept-alive socket. */
export interface Client {
  send(method: string, path: string, body: string | Buffer, headers: Record<string, string>): Promise<{ status: number; text: string }>;
  close(): Promise<void>;
}

export async function startClient(app: Express): Promise<Client> {
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const port = (server.address() as AddressInfo).port;
  const agent = new Agent({ keepAlive: true, maxSockets: 1 });
  return {
    send: (method, path, body, headers) =>
      new Promise((resolve, reject) => {
        const req = httpRequest(
          { host: '127.0.0.1', port, method, path, agent, headers: { 'content-type': 'application/json', 'content-length': Buffer.byteLength(body), ...headers } },
          (res) => {
            const chunks: Buffer[] = [];
            res.on('data', (c: Buffer) => chunks.push(c));
            res.on('end', () => resolve({ status: res.statusCode ?? 0, text: Buffer.concat(chunks).toString('utf8') }));
            res.on('error', reject);
          },
        );
        req.setNoDelay(true);
        req.on('error', reject);
        req.end(body);
      }),
    close: () => new Promise((resolve) => {
      agent.destroy();
      server.closeAllConnections();
      server.close(() => resolve());
    }),
  };
}

/** The app with its scene of Kestrel objects and a client on a random port: what every probing run starts from. */
export interface ProbeScene {
  t: TestApp;
  scene: Scene;
  client: Client;
  close(): Promise<void>;
}

export async function startProbeScene(env: Record<string, string> = {}): Promise<ProbeScene> {
  const t = await createTestApp(env);
  const scene = await buildScene(t);
  const client = await startClient(t.app);
  return {
    t,
    scene,
    client,
    close: async () => {
      await client.close();
      await t.close();
    },
  };
}

const prototypeNames = (): string => Object.getOwnPropertyNames(Object.prototype).sort().join(',');

export interface ProbeTarget {
  method: string;
  path: string;
  headers: Record<string, string>;
  /** False for routes that read no body (sign-out, submit…): any body may then succeed. */
  validatesBody: boolean;
}

/** Sends one hostile request and answers what is wrong with the answer, or null when all is well. */
export async function probe(client: Client, sqlite: Sqlite, target: ProbeTarget, hostile: HostileRequest): Promise<string | null> {
  const changes = () => (sqlite.prepare('SELECT total_changes() AS n').get() as { n: number }).n;
  const before = changes();
  const proto = prototypeNames();
  const res = await client.send(target.method, target.path, hostile.body, { ...target.headers, ...hostile.headers });
  const wrote = changes() !== before;
  const encoded = hostile.headers['content-encoding'];
  const where = `${target.method} ${target.path}${encoded ? ` (Content-Encoding: ${encoded})` : ''} answered ${res.status}`;
  if (prototypeNames() !== proto || (Object.prototype as Record<string, unknown>)['polluted'] !== undefined) return `${where} and Object.prototype changed`;
  if (res.status >= 500) return `${where}: ${res.text.slice(0, 300)}`;
  if (res.status < 400) {
    if (target.validatesBody) return `${where} to a body that is invalid by construction`;
    return null;
  }
  let parsed: unknown;
  try {
    parsed = JSON.parse(res.text);
  } catch {
    return `${where} with a body that is not JSON: ${res.text.slice(0, 200)}`;
  }
  const shape = errorBody.strict().safeParse(parsed);
  if (!shape.success) return `${where} with an error not in API.md's shape: ${res.text.slice(0, 300)}`;
  if (shape.data.error.message.trim() === '') return `${where} with an empty message`;
  if (wrote) return `${where} but wrote to the database`;
  return null;
}

/**
 * Hostile requests a route gets in `npm test` (a fixed seed); bench/soak.ts sends SOAK_RUNS (10,000)
 * with fresh seeds. The rarest kinds are each Content-Encoding but plain (1 in 16 each): at 100 a
 * route, any seed misses one of the four with a chance of 4 (15/16)^100, about 0.6 %, and the test
 * checks that this seed missed none on any route.
 */
export const TEST_RUNS = 100;

export interface RouteProbing {
  /** A line for each failing route: its key, what was wrong and the request that showed it. */
  failures: string[];
  /** Requests sent in all. */
  total: number;
  /** Per route, the kinds of hostile request it was sent ("breaking add", "encoding truncated", ...). */
  kindsByRoute: Map<string, Set<string>>;
}

/**
 * `runs` hostile requests (a property of fast-check, `seed`) on every JSON route the app answers,
 * as the Kestrel owner; the owner's session must outlive every route but sign-out (tried last), or
 * the routes after it would only have heard 401. `onRoute` hears each route as it is done.
 */
export async function probeEveryRoute(
  { t, scene, client }: ProbeScene, runs: number, seed: number,
  onRoute?: (key: string, sent: number, ms: number, failed: boolean) => void,
): Promise<RouteProbing> {
  const owner = { cookie: scene.cookies['owner@kestrel.test'] ?? '' };
  const out: RouteProbing = { failures: [], total: 0, kindsByRoute: new Map() };
  for (const route of jsonRoutes(t.app)) {
    const key = routeKey(route);
    const kinds = new Set<string>();
    out.kindsByRoute.set(key, kinds);
    const target = { method: route.method, path: concretePath(route, scene.ids), headers: owner, validatesBody: validatesBody(key) };
    const started = Date.now();
    const result = await fc.check(
      fc.asyncProperty(hostileRequests(sampleBody(key, scene.ids)), async (hostile) => {
        kinds.add(`breaking ${hostile.kinds.breaking}`).add(`encoding ${hostile.kinds.encoding}`);
        const problem = await probe(client, t.ctx.sqlite, target, hostile);
        if (problem) throw new Error(problem);
      }),
      { numRuns: runs, seed, endOnFailure: true },
    );
    out.total += result.numRuns;
    if (result.failed) out.failures.push(`${key}: ${String(result.errorInstance ?? '').slice(0, 1500)} counterexample ${JSON.stringify(result.counterexample)?.slice(0, 500) ?? ''}`);
    if (key !== 'POST /api/v1/auth/sign-out' && (await client.send('GET', '/api/v1/auth/me', '', owner)).status !== 200) {
      out.failures.push(`${key}: the owner's session ended, so the routes after it were not really tried`);
    }
    onRoute?.(key, result.numRuns, Date.now() - started, result.failed);
  }
  return out;
}
