// A scene of real Kestrel objects for the whole-API tests (authorization matrix, hostile input):
// every path parameter of every route filled with the id of an existing object, and one valid body
// per JSON route. Built through the API as the Kestrel owner, so the objects are what users make.
import path from 'node:path';
import request from 'supertest';
import { listRoutes } from '../../server/route-list';
import { apiRoutes } from '../../server/routes/api-routes';
import { fixturesDir } from './ephemeris-test-mission';
import { linkToken, userIdOf, workspaceIdOf, type TestApp } from './test-app';

export interface SceneIds {
  workspaceId: string;
  ploverWorkspaceId: string;
  viewerUserId: string;
  missionId: string;
  orbitId: string;
  surfaceId: string;
  materialId: string;
  /** A body of Kestrel's own (custom-…). */
  customBodyId: string;
  ephemerisId: string;
  /** A draft hot case of Kestrel-1 (derived for the scene). */
  draftCaseId: string;
  /** The cold draft of the same derivation, submitted for review by the thermal engineer. */
  reviewCaseId: string;
  releasedCaseId: string;
  thermalModelId: string | null;
  tokenId: string;
  invitationId: string;
  invitationSecret: string;
  mailId: string;
}

export interface Scene {
  ids: SceneIds;
  /** Cookie header values ("eclipta_session=…") by demo e-mail. */
  cookies: Record<string, string>;
  /** A read-only personal API token of the Kestrel owner. */
  readOnlyToken: string;
}

export const demoEmails = ['owner@kestrel.test', 'analyst@kestrel.test', 'thermal@kestrel.test', 'viewer@kestrel.test', 'owner@plover.test'] as const;

export const routeKey = (r: { method: string; path: string }): string => `${r.method} ${r.path}`;

async function sessionCookie(t: TestApp, email: string): Promise<string> {
  const res = await request(t.app).post('/api/v1/auth/sign-in').send({ email, password: 'eclipta-demo' });
  const setCookie = res.headers['set-cookie'] as unknown as string[] | undefined;
  const cookie = setCookie?.find((c) => c.startsWith('eclipta_session='))?.split(';')[0];
  if (res.status !== 200 || !cookie) throw new Error(`sign-in of ${email} answered ${res.status}`);
  return cookie;
}

function expectStatus(res: request.Response, status: number, what: string): Record<string, unknown> {
  if (res.status !== status) throw new Error(`scene: ${what} answered ${res.status}: ${JSON.stringify(res.body).slice(0, 300)}`);
  return res.body as Record<string, unknown>;
}

const one = (t: TestApp, sql: string, ...params: string[]): string => {
  const row = t.ctx.sqlite.prepare(sql).get(...params) as { id: string } | undefined;
  if (!row) throw new Error(`scene: nothing for ${sql}`);
  return row.id;
};

/** A body of the workspace's own, about the Sun (invented). */
export const sampleCustomBody = {
  name: 'Scene asteroid', gmKm3S2: 0.4, radiusKm: '110 km', place: { kind: 'sun', meanAu: 2.6, minAu: 2.4, maxAu: 2.8 },
  albedo: { min: 0.05, nominal: 0.08, max: 0.1 }, olrWm2: { min: 30, nominal: 45, max: 50 },
  airless: { emissivity: { min: 0.9, nominal: 0.95, max: 0.97 }, nightFloorK: { min: 60, nominal: 70, max: 80 } },
};

/** A small saved thermal model: one bus node on the mission's first surface. */
export const sampleThermalModel = (surfaceId: string) => ({
  name: 'Scene bus model',
  model: {
    nodes: [
      { name: 'bus', capacitanceJK: 20000, initialC: 20, dissipationW: 15, surfaceIds: [surfaceId], minC: -10, maxC: 40 },
      { name: 'battery', capacitanceJK: 9000, initialC: 15, dissipationW: 4, minC: 0, maxC: 30 },
    ],
    couplings: [{ from: 'bus', to: 'battery', conductanceWK: 0.8 }],
  },
});

export async function buildScene(t: TestApp): Promise<Scene> {
  const cookies: Record<string, string> = {};
  for (const email of demoEmails) cookies[email] = await sessionCookie(t, email);
  const as = (email: string) => ({ cookie: cookies[email] ?? '' });
  const owner = as('owner@kestrel.test');
  const api = request(t.app);

  const workspaceId = workspaceIdOf(t, 'Kestrel');
  const missionId = one(t, 'SELECT id FROM missions WHERE name = ?', 'Kestrel-1 imaging smallsat');
  const orbitId = one(t, 'SELECT id FROM orbits WHERE mission_id = ? ORDER BY name', missionId);
  const surfaceId = one(t, 'SELECT id FROM surfaces WHERE mission_id = ? ORDER BY name', missionId);
  const releasedCaseId = one(t, "SELECT id FROM load_cases WHERE mission_id = ? AND status = 'released' ORDER BY name", missionId);

  const token = expectStatus(await api.post('/api/v1/tokens').set(owner).send({ name: 'scene token' }), 201, 'token');
  const readOnly = expectStatus(await api.post('/api/v1/tokens').set(owner).send({ name: 'scene read-only', readOnly: true }), 201, 'read-only token');
  const material = expectStatus(
    await api.post(`/api/v1/workspaces/${workspaceId}/materials`).set(owner)
      .send({ name: 'scene grey paint', absorptivityBol: 0.5, emissivityBol: 0.85, absorptivityEol: 0.6, emissivityEol: 0.85 }),
    201, 'material',
  );
  const customBody = expectStatus(await api.post(`/api/v1/workspaces/${workspaceId}/bodies`).set(owner).send(sampleCustomBody), 201, 'custom body');
  const ephemeris = expectStatus(
    await api.post(`/api/v1/missions/${missionId}/ephemerides`).set(owner).field('frame', 'EME2000').attach('file', path.join(fixturesDir, 'leo-bom.csv')),
    201, 'ephemeris',
  );
  const derived = expectStatus(
    await api.post(`/api/v1/missions/${missionId}/cases/derive`).set(as('thermal@kestrel.test')).send({ orbitId, name: 'Scene', steps: 24 }),
    201, 'derive',
  );
  const [hot, cold] = (derived['items'] as { id: string }[]).map((c) => c.id);
  if (!hot || !cold) throw new Error('scene: derive gave fewer than two cases');
  expectStatus(await api.post(`/api/v1/cases/${cold}/submit`).set(as('thermal@kestrel.test')).send({}), 200, 'submit');

  let thermalModelId: string | null = null;
  if (listRoutes(t.app).some((r) => r.path === '/api/v1/missions/:id/thermal-models' && r.method === 'POST')) {
    const model = expectStatus(await api.post(`/api/v1/missions/${missionId}/thermal-models`).set(owner).send(sampleThermalModel(surfaceId)), 201, 'thermal model');
    thermalModelId = String(model['id']);
    expectStatus(await api.post(`/api/v1/thermal-models/${thermalModelId}/run`).set(owner).send({ caseId: releasedCaseId }), 200, 'thermal run');
  }

  const invitee = 'scene.invitee@kestrel.test';
  const invitation = expectStatus(await api.post(`/api/v1/workspaces/${workspaceId}/invitations`).set(owner).send({ email: invitee, role: 'viewer' }), 201, 'invitation');
  const mail = await t.waitForMail(invitee, '');
  const invitationSecret = linkToken(mail.text, 'invite');

  return {
    cookies,
    readOnlyToken: String(readOnly['secret']),
    ids: {
      workspaceId,
      ploverWorkspaceId: workspaceIdOf(t, 'Plover'),
      viewerUserId: userIdOf(t, 'viewer@kestrel.test'),
      missionId, orbitId, surfaceId, releasedCaseId, thermalModelId,
      materialId: String(material['id']),
      customBodyId: String(customBody['id']),
      ephemerisId: String(ephemeris['id']),
      draftCaseId: hot,
      reviewCaseId: cold,
      tokenId: String((token['token'] as { id: string }).id),
      invitationId: String(invitation['id']),
      invitationSecret,
      mailId: mail.id,
    },
  };
}

// Routes whose :id must be a case in a particular state to mean anything.
const caseIdFor: Record<string, keyof SceneIds> = {
  'POST /api/v1/cases/:id/release': 'reviewCaseId',
  'POST /api/v1/cases/:id/return': 'reviewCaseId',
  'POST /api/v1/cases/:id/revisions': 'releasedCaseId',
};

/** The route's path with every parameter replaced by a scene id; throws for a parameter it does not know. */
export function concretePath(route: { method: string; path: string }, ids: SceneIds): string {
  const key = routeKey(route);
  return route.path.replace(/\/([\w-]+)\/:(\w+)/g, (_all, parent: string, param: string) => {
    let id: string | null | undefined;
    if (param === 'id') {
      id = {
        tokens: ids.tokenId,
        invitations: ids.invitationId,
        mail: ids.mailId,
        missions: ids.missionId,
        cases: ids[caseIdFor[key] ?? 'draftCaseId'],
        'thermal-models': ids.thermalModelId,
      }[parent];
    } else {
      id = {
        workspaceId: ids.workspaceId,
        userId: ids.viewerUserId,
        orbitId: ids.orbitId,
        surfaceId: ids.surfaceId,
        materialId: ids.materialId,
        ephemerisId: ids.ephemerisId,
        caseId: ids.releasedCaseId,
        // a workspace's own body under /workspaces, a catalogue body under /bodies
        bodyId: route.path.startsWith('/api/v1/workspaces/') ? ids.customBodyId : 'earth',
        token: ids.invitationSecret,
      }[param];
    }
    if (!id) throw new Error(`route ${key}: the scene has no id for :${param} after /${parent}`);
    return `/${parent}/${id}`;
  });
}

const orbit = { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6, raanDeg: 0, argPeriapsisDeg: 0 };
const surfaces = [{ name: 'nadir panel', normal: 'nadir', areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 }];
const solveModel = {
  periodS: 5739, steps: 36,
  nodes: [
    { name: 'battery', capacitanceJK: 9000, initialC: 10, dissipationW: 6, absorbedW: 0, radiatorAreaM2: 0.05, emissivity: 0.85, minC: 0, maxC: 30 },
    { name: 'panel', capacitanceJK: 4000, initialC: 0, absorbedW: 20, radiatorAreaM2: 0.2, emissivity: 0.85 },
  ],
  couplings: [{ from: 'battery', to: 'panel', conductanceWK: 0.8 }],
  heaters: [{ node: 'battery', powerW: 10, onC: 3, offC: 6 }],
};

/** One valid body per JSON route (what a correct client sends); the hostile tests start from these. */
export function sampleBody(key: string, ids: SceneIds): unknown {
  const samples: Record<string, unknown> = {
    'POST /api/v1/auth/sign-in': { email: 'viewer@kestrel.test', password: 'not the password' },
    'POST /api/v1/auth/sign-out': {},
    'POST /api/v1/auth/password-reset': { email: 'nobody@kestrel.test' },
    'POST /api/v1/auth/password-reset/confirm': { token: 'no-such-reset-token-000000', password: 'a-long-new-password' },
    'POST /api/v1/tokens': { name: 'hostile token', readOnly: true, expiresInDays: 30 },
    'PATCH /api/v1/workspaces/:workspaceId/members/:userId': { role: 'viewer' },
    'POST /api/v1/workspaces/:workspaceId/invitations': { email: 'hostile.invitee@kestrel.test', role: 'viewer' },
    'POST /api/v1/invitations/:token/accept': { name: 'Scene Invitee', password: 'a-long-new-password' },
    'POST /api/v1/orbits/figures': { bodyId: 'earth', orbit },
    'POST /api/v1/environment/compute': { bodyId: 'earth', orbit, epoch: '2027-03-20T12:00:00Z', steps: 24, surfaces },
    'POST /api/v1/environment/beta-history': { bodyId: 'earth', orbit, from: '2027-01-01T00:00:00Z', to: '2027-01-10T00:00:00Z', stepDays: 3 },
    'POST /api/v1/units/convert': { value: '550 km', unit: 'm' },
    'POST /api/v1/thermal/solve': solveModel,
    'POST /api/v1/thermal/size': { ...solveModel, sizing: { kind: 'radiator', node: 'battery' } },
    'POST /api/v1/missions': { workspaceId: ids.workspaceId, name: 'Hostile mission', bodyId: 'earth', description: '', startDate: '2027-01-01', endDate: '2028-01-01' },
    'PATCH /api/v1/missions/:id': { description: 'edited by the scene' },
    'POST /api/v1/missions/:id/orbits': { name: 'Hostile orbit', epoch: '2027-03-20T12:00:00Z', ...orbit },
    'PATCH /api/v1/missions/:id/orbits/:orbitId': { raanDeg: 10 },
    'POST /api/v1/missions/:id/orbits/:orbitId/environment': { steps: 24, properties: 'eol' },
    'POST /api/v1/missions/:id/surfaces': { name: 'Hostile panel', areaM2: 0.1, normal: 'zenith', materialId: ids.materialId },
    'PATCH /api/v1/missions/:id/surfaces/:surfaceId': { areaM2: '0.25 m^2' },
    'POST /api/v1/workspaces/:workspaceId/materials': { name: 'hostile paint', absorptivityBol: 0.3, emissivityBol: 0.8, absorptivityEol: 0.4, emissivityEol: 0.8 },
    'PATCH /api/v1/workspaces/:workspaceId/materials/:materialId': { absorptivityEol: 0.65 },
    'POST /api/v1/workspaces/:workspaceId/bodies': { ...sampleCustomBody, name: 'Hostile asteroid' },
    'PUT /api/v1/workspaces/:workspaceId/bodies/:bodyId': { ...sampleCustomBody, name: 'Scene asteroid, changed' },
    'PUT /api/v1/workspaces/:workspaceId/environment-table': {
      rows: [{ bodyId: 'earth', inclinationMinDeg: 30, inclinationMaxDeg: 60, averagingTimeS: 896, hot: { albedo: 0.3, olrWm2: 260 }, cold: { albedo: 0.2, olrWm2: 200 }, source: 'invented for the test' }],
    },
    'POST /api/v1/missions/:id/ephemerides/:ephemerisId/environment': { properties: 'bol', maxPoints: 20 },
    'POST /api/v1/missions/:id/cases/derive': { orbitId: ids.orbitId, name: 'Hostile', steps: 12 },
    'POST /api/v1/missions/:id/cases': { orbitId: ids.orbitId, name: 'Hostile custom', date: '2027-06-01', betaDeg: 10, steps: 12 },
    'POST /api/v1/missions/:id/ephemerides/:ephemerisId/cases': { name: 'Hostile from a trajectory', steps: 12, properties: 'eol' },
    'PATCH /api/v1/cases/:id': { name: 'Scene hot, renamed', margins: { heatLoadPercent: 20 } },
    'POST /api/v1/cases/:id/submit': {},
    'POST /api/v1/cases/:id/release': {},
    'POST /api/v1/cases/:id/return': { text: 'Sent back by the hostile-input scene' },
    'POST /api/v1/cases/:id/comments': { text: 'A comment from the hostile-input scene' },
    'POST /api/v1/cases/:id/revisions': {},
    'POST /api/v1/cases/:id/subscription': {},
    'POST /api/v1/missions/:id/thermal-models': sampleThermalModel(ids.surfaceId),
    'PATCH /api/v1/thermal-models/:id': { description: 'edited by the scene' },
    'POST /api/v1/thermal-models/:id/run': { caseId: ids.releasedCaseId },
    'POST /api/v1/thermal-models/:id/size': { caseHotId: ids.releasedCaseId, caseColdId: ids.releasedCaseId, node: 'bus' },
    'POST /api/v1/thermal-models/:id/distance-study': { caseId: ids.releasedCaseId, node: 'bus', distancesAu: [1] },
  };
  return samples[key];
}

const multipartRoutes = new Set(apiRoutes.filter((r) => r.bodyKind === 'multipart').map((r) => `${r.method.toUpperCase()} ${r.path}`));

/** Every route of the app that takes a JSON body: POST, PATCH and PUT, except multipart uploads. */
export function jsonRoutes(app: Parameters<typeof listRoutes>[0]): { method: string; path: string }[] {
  const routes = listRoutes(app).filter((r) => ['POST', 'PATCH', 'PUT'].includes(r.method) && !multipartRoutes.has(routeKey(r)));
  // Signing out ends the caller's session on the server: last, or every later route would only hear 401.
  const signOut = (r: { path: string }) => r.path === '/api/v1/auth/sign-out';
  return [...routes.filter((r) => !signOut(r)), ...routes.filter(signOut)];
}

const bodyRoutes = new Set(apiRoutes.filter((r) => r.body).map((r) => `${r.method.toUpperCase()} ${r.path}`));

/** True when the OpenAPI description gives the route a body schema (routes like submit read none). */
export const validatesBody = (key: string): boolean => bodyRoutes.has(key);
