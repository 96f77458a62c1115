// The authorization matrix: every route the Express app answers (listRoutes, not a hand-kept list),
// called as anonymous, as each Kestrel role, with the owner's read-only token and as the owner of
// another workspace, against the table below (PRODUCT.md "Users and roles", API.md "Auth" and
// "Errors"). A route without a rule fails the test. Path parameters are real Kestrel objects, so an
// outsider's 404 means "hidden", not "no such id".
//
// Each caller gets a fresh server and scene, so one caller's deletions cannot change another's answers.
import path from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { listRoutes, type RouteInfo } from '../../server/route-list';
import { fixturesDir } from './ephemeris-test-mission';
import { buildScene, concretePath, routeKey, sampleBody, type Scene } from './route-samples';
import { createTestApp, type TestApp } from './test-app';

const callers = ['anonymous', 'owner', 'analyst', 'thermal', 'viewer', 'read-only token', 'outsider'] as const;
type Caller = (typeof callers)[number];

/**
 * What each caller gets, in the order of `callers`. "ok" is past the access checks: 2xx, or a
 * refusal of the input or the state (400, 409, 413, 422); 401, 403 and 404 are exact.
 */
type Outcome = 'ok' | '401' | '403' | '404';

// Column order: anonymous owner analyst thermal viewer read-only-token outsider
const rules: Record<string, string> = {
  'GET /api/health': 'ok ok ok ok ok ok ok',
  // public; a read-only token may not send writes of any kind
  'POST /api/v1/auth/sign-in': 'ok ok ok ok ok 403 ok',
  'POST /api/v1/auth/sign-out': '401 ok ok ok ok 403 ok',
  'GET /api/v1/auth/me': '401 ok ok ok ok ok ok',
  'POST /api/v1/auth/password-reset': 'ok ok ok ok ok 403 ok',
  'POST /api/v1/auth/password-reset/confirm': 'ok ok ok ok ok 403 ok',
  // personal tokens: everyone their own; the scene's token is the owner's, hidden from others
  'GET /api/v1/tokens': '401 ok ok ok ok ok ok',
  'POST /api/v1/tokens': '401 ok ok ok ok 403 ok',
  'DELETE /api/v1/tokens/:id': '401 ok 404 404 404 403 404',
  // workspace administration: owners only; members may list members
  'GET /api/v1/workspaces': '401 ok ok ok ok ok ok',
  'GET /api/v1/workspaces/:workspaceId/members': '401 ok ok ok ok ok 404',
  'PATCH /api/v1/workspaces/:workspaceId/members/:userId': '401 ok 403 403 403 403 404',
  'DELETE /api/v1/workspaces/:workspaceId/members/:userId': '401 ok 403 403 403 403 404',
  'GET /api/v1/workspaces/:workspaceId/overview': '401 ok ok ok ok ok 404',
  'GET /api/v1/workspaces/:workspaceId/audit': '401 ok 403 403 403 ok 404',
  'GET /api/v1/workspaces/:workspaceId/invitations': '401 ok 403 403 403 ok 404',
  'POST /api/v1/workspaces/:workspaceId/invitations': '401 ok 403 403 403 403 404',
  'DELETE /api/v1/workspaces/:workspaceId/invitations/:id': '401 ok 403 403 403 403 404',
  'GET /api/v1/invitations/:token': 'ok ok ok ok ok ok ok',
  'POST /api/v1/invitations/:token/accept': 'ok ok ok ok ok 403 ok',
  // the instance administrator (owner@kestrel.test) only, signed in: no API token reads other users' mail
  'GET /api/v1/admin/mail': '401 ok 403 403 403 403 403',
  'GET /api/v1/admin/mail/:id': '401 ok 403 403 403 403 403',
  // stateless physics: any signed-in user
  'GET /api/v1/bodies': '401 ok ok ok ok ok ok',
  'GET /api/v1/bodies/:bodyId': '401 ok ok ok ok ok ok',
  'GET /api/v1/bodies/:bodyId/sun-synchronous': '401 ok ok ok ok ok ok',
  'POST /api/v1/orbits/figures': '401 ok ok ok ok 403 ok',
  'POST /api/v1/environment/compute': '401 ok ok ok ok 403 ok',
  'POST /api/v1/environment/beta-history': '401 ok ok ok ok 403 ok',
  'POST /api/v1/units/convert': '401 ok ok ok ok 403 ok',
  'POST /api/v1/thermal/solve': '401 ok ok ok ok 403 ok',
  'POST /api/v1/thermal/size': '401 ok ok ok ok 403 ok',
  // missions, orbits, ephemerides: analysts, thermal engineers and owners change; viewers read
  'GET /api/v1/missions': '401 ok ok ok ok ok ok',
  'POST /api/v1/missions': '401 ok ok ok 403 403 404',
  'GET /api/v1/missions/:id': '401 ok ok ok ok ok 404',
  'PATCH /api/v1/missions/:id': '401 ok ok ok 403 403 404',
  // deleting a whole mission: the owner only (and never one with released cases: 409, still "ok")
  'DELETE /api/v1/missions/:id': '401 ok 403 403 403 403 404',
  'GET /api/v1/missions/:id/orbits': '401 ok ok ok ok ok 404',
  'POST /api/v1/missions/:id/orbits': '401 ok ok ok 403 403 404',
  'GET /api/v1/missions/:id/orbits/:orbitId': '401 ok ok ok ok ok 404',
  'PATCH /api/v1/missions/:id/orbits/:orbitId': '401 ok ok ok 403 403 404',
  'DELETE /api/v1/missions/:id/orbits/:orbitId': '401 ok ok ok 403 403 404',
  // computing the environment of a saved orbit changes nothing: viewers may
  'POST /api/v1/missions/:id/orbits/:orbitId/environment': '401 ok ok ok ok 403 404',
  'GET /api/v1/missions/:id/orbits/:orbitId/sweep': '401 ok ok ok ok ok 404',
  // surfaces and materials: the missions feature lets analysts edit them too (PRODUCT.md lists
  // surfaces under the thermal role; see docs/RELIABILITY.md)
  'GET /api/v1/missions/:id/surfaces': '401 ok ok ok ok ok 404',
  'POST /api/v1/missions/:id/surfaces': '401 ok ok ok 403 403 404',
  'PATCH /api/v1/missions/:id/surfaces/:surfaceId': '401 ok ok ok 403 403 404',
  'DELETE /api/v1/missions/:id/surfaces/:surfaceId': '401 ok ok ok 403 403 404',
  'GET /api/v1/materials': '401 ok ok ok ok ok ok',
  'POST /api/v1/workspaces/:workspaceId/materials': '401 ok ok ok 403 403 404',
  'PATCH /api/v1/workspaces/:workspaceId/materials/:materialId': '401 ok ok ok 403 403 404',
  'DELETE /api/v1/workspaces/:workspaceId/materials/:materialId': '401 ok ok ok 403 403 404',
  // the workspace's environment table: every member reads; owners and thermal engineers replace it
  'GET /api/v1/workspaces/:workspaceId/environment-table': '401 ok ok ok ok ok 404',
  'PUT /api/v1/workspaces/:workspaceId/environment-table': '401 ok 403 ok 403 403 404',
  // the workspace's own bodies: every member reads; owners, analysts and thermal engineers write
  'GET /api/v1/workspaces/:workspaceId/bodies': '401 ok ok ok ok ok 404',
  'POST /api/v1/workspaces/:workspaceId/bodies': '401 ok ok ok 403 403 404',
  'GET /api/v1/workspaces/:workspaceId/bodies/:bodyId': '401 ok ok ok ok ok 404',
  'PUT /api/v1/workspaces/:workspaceId/bodies/:bodyId': '401 ok ok ok 403 403 404',
  'DELETE /api/v1/workspaces/:workspaceId/bodies/:bodyId': '401 ok ok ok 403 403 404',
  'POST /api/v1/missions/:id/ephemerides': '401 ok ok ok 403 403 404',
  'GET /api/v1/missions/:id/ephemerides': '401 ok ok ok ok ok 404',
  'GET /api/v1/missions/:id/ephemerides/:ephemerisId': '401 ok ok ok ok ok 404',
  'GET /api/v1/missions/:id/ephemerides/:ephemerisId/points': '401 ok ok ok ok ok 404',
  'POST /api/v1/missions/:id/ephemerides/:ephemerisId/environment': '401 ok ok ok ok 403 404',
  'DELETE /api/v1/missions/:id/ephemerides/:ephemerisId': '401 ok ok ok 403 403 404',
  // load cases: thermal engineers and owners make and change them; a viewer sees released
  // revisions only, so the scene's draft is 404 to a viewer, like to a non-member
  'POST /api/v1/missions/:id/cases/derive': '401 ok 403 ok 403 403 404',
  'POST /api/v1/missions/:id/cases': '401 ok 403 ok 403 403 404',
  'POST /api/v1/missions/:id/ephemerides/:ephemerisId/cases': '401 ok 403 ok 403 403 404',
  'GET /api/v1/cases': '401 ok ok ok ok ok ok',
  'GET /api/v1/cases/:id': '401 ok ok ok 404 ok 404',
  'PATCH /api/v1/cases/:id': '401 ok 403 ok 404 403 404',
  'POST /api/v1/cases/:id/submit': '401 ok 403 ok 404 403 404',
  // the case in review was written by the thermal engineer: the four-eyes rule refuses them (403)
  'POST /api/v1/cases/:id/release': '401 ok 403 403 404 403 404',
  // returning to the author is a reviewer's act too (four eyes); comments: thermal engineers and owners
  'POST /api/v1/cases/:id/return': '401 ok 403 403 404 403 404',
  'POST /api/v1/cases/:id/comments': '401 ok 403 ok 404 403 404',
  'POST /api/v1/cases/:id/revisions': '401 ok 403 ok 403 403 404',
  'GET /api/v1/cases/:id/compare': '401 ok ok ok 404 ok 404',
  'POST /api/v1/cases/:id/subscription': '401 ok ok ok 404 403 404',
  'DELETE /api/v1/cases/:id/subscription': '401 ok ok ok 404 403 404',
  'GET /api/v1/cases/:id/export': '401 ok ok ok 404 ok 404',
  'GET /api/v1/schemas/load-case.json': '401 ok ok ok ok ok ok',
  'GET /api/v1/openapi.json': '401 ok ok ok ok ok ok',
  // saved thermal models: every member reads; thermal engineers and owners edit; analysts run and size
  'GET /api/v1/missions/:id/thermal-models': '401 ok ok ok ok ok 404',
  'POST /api/v1/missions/:id/thermal-models': '401 ok 403 ok 403 403 404',
  'GET /api/v1/thermal-models/:id': '401 ok ok ok ok ok 404',
  'PATCH /api/v1/thermal-models/:id': '401 ok 403 ok 403 403 404',
  'DELETE /api/v1/thermal-models/:id': '401 ok 403 ok 403 403 404',
  'POST /api/v1/thermal-models/:id/run': '401 ok ok ok 403 403 404',
  'GET /api/v1/thermal-models/:id/runs/:caseId': '401 ok ok ok ok ok 404',
  'POST /api/v1/thermal-models/:id/size': '401 ok ok ok 403 403 404',
  'POST /api/v1/thermal-models/:id/distance-study': '401 ok ok ok 403 403 404',
  // the client's own pages: the same index.html for everyone (only when the client is built)
  'GET /{*splat}': 'ok ok ok ok ok ok ok',
};

const queries: Record<string, string> = {
  'GET /api/v1/cases/:id/export': '?format=json',
  'GET /api/v1/bodies/:bodyId/sun-synchronous': '?altitudeKm=550',
  'GET /api/v1/missions/:id/orbits/:orbitId/sweep': '?stepDays=30',
};

function outcome(status: number): Outcome | string {
  if (status === 401 || status === 403 || status === 404) return String(status);
  if ((status >= 200 && status < 300) || [400, 409, 413, 422].includes(status)) return 'ok';
  return String(status);
}

function expected(key: string, caller: Caller): string | undefined {
  const row = rules[key]?.split(' ');
  return row?.[callers.indexOf(caller)];
}

// Deletions last, the deepest first and the mission (which takes its orbits, models and cases
// with it) at the very end, so that a caller's own deletions never hide what it calls next.
function callOrder(routes: RouteInfo[]): RouteInfo[] {
  const depth = (r: RouteInfo) => (r.path === '/api/v1/missions/:id' ? 0 : r.path.split('/').length);
  // Signing out ends the caller's session on the server, so it comes after everything else.
  const signOut = (r: RouteInfo) => r.path === '/api/v1/auth/sign-out';
  const keep = routes.filter((r) => r.method !== 'DELETE' && !signOut(r));
  const deletions = routes.filter((r) => r.method === 'DELETE').sort((a, b) => depth(b) - depth(a));
  return [...keep, ...deletions, ...routes.filter(signOut)];
}

// Where the hostile tests' sample is refused on purpose, the matrix sends what a real caller would.
const matrixBodies: Record<string, unknown> = {
  'POST /api/v1/auth/sign-in': { email: 'analyst@kestrel.test', password: 'eclipta-demo' },
};

function credentials(scene: Scene, caller: Caller): Record<string, string> {
  const cookie = (email: string) => ({ cookie: scene.cookies[email] ?? '' });
  switch (caller) {
    case 'anonymous': return {};
    case 'owner': return cookie('owner@kestrel.test');
    case 'analyst': return cookie('analyst@kestrel.test');
    case 'thermal': return cookie('thermal@kestrel.test');
    case 'viewer': return cookie('viewer@kestrel.test');
    case 'read-only token': return { authorization: `Bearer ${scene.readOnlyToken}` };
    case 'outsider': return cookie('owner@plover.test');
  }
}

async function call(t: TestApp, scene: Scene, route: RouteInfo, caller: Caller): Promise<request.Response> {
  const key = routeKey(route);
  const url = route.path.startsWith('/api/') ? concretePath(route, scene.ids) + (queries[key] ?? '') : '/missions';
  const method = route.method.toLowerCase() as 'get' | 'post' | 'patch' | 'put' | 'delete';
  const req = request(t.app)[method](url).set(credentials(scene, caller));
  if (key === 'POST /api/v1/missions/:id/ephemerides') {
    return req.field('frame', 'EME2000').field('name', `matrix ${caller}`).attach('file', path.join(fixturesDir, 'leo-bom.csv'));
  }
  if (method === 'get' || method === 'delete') return req;
  return req.send((matrixBodies[key] ?? sampleBody(key, scene.ids) ?? {}) as object);
}

const opened: TestApp[] = [];
afterAll(async () => {
  for (const t of opened) await t.close();
});

describe('authorization matrix', () => {
  it('has a rule for every route the app answers, and no rule for a route it does not', async () => {
    const t = await createTestApp();
    opened.push(t);
    const keys = listRoutes(t.app).map(routeKey);
    const missing = keys.filter((k) => !rules[k]);
    expect(missing.map((k) => `route ${k} has no rule`)).toEqual([]);
    // a rule for a removed route is stale; the client fallback exists only with a built client
    expect(Object.keys(rules).filter((k) => !keys.includes(k) && k !== 'GET /{*splat}')).toEqual([]);
    for (const [key, row] of Object.entries(rules)) expect(row.split(' '), key).toHaveLength(callers.length);
  });

  it.each(callers)('answers %s as the table says on every route', async (caller) => {
    const t = await createTestApp();
    opened.push(t);
    const scene = await buildScene(t);
    const wrong: string[] = [];
    for (const route of callOrder(listRoutes(t.app))) {
      const key = routeKey(route);
      const want = expected(key, caller);
      if (!want) {
        wrong.push(`route ${key} has no rule`);
        continue;
      }
      const res = await call(t, scene, route, caller);
      const got = outcome(res.status);
      if (got !== want) wrong.push(`${key}: expected ${want}, got ${res.status} ${JSON.stringify(res.body?.error ?? '').slice(0, 160)}`);
      // every refusal is in API.md's shape
      if (res.status >= 400 && route.path.startsWith('/api/') && typeof res.body?.error?.code !== 'string') wrong.push(`${key}: ${res.status} without an error body`);
    }
    expect(wrong).toEqual([]);
  }, 120_000);
});
