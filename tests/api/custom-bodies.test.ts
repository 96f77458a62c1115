// A workspace's own central bodies: members read them, owners, thermal engineers and analysts write
// them (audited), bad input is a 4xx naming the field and the value, another workspace neither sees
// nor uses them, and the physics takes them as it takes the catalogue's: a custom airless body given
// the Moon's constants computes exactly the built-in Moon's environment (one rule in one place), and
// a custom moon at Europa's distance about Jupiter falls into Jupiter's shadow in the mission sweep.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getBody } from '../../shared/physics/bodies';
import { libraryMaterialIdOf } from './mission-fixtures';
import { createTestApp, workspaceIdOf, type TestApp } from './test-app';

let t: TestApp;
let thermal: request.Agent;
let analyst: request.Agent;
let viewer: request.Agent;
let plover: request.Agent;
let kestrel: string;

const moon = getBody('moon');
/** The built-in Moon's constants, entered as a workspace would enter them (radius typed with its unit). */
const moonLike = {
  name: 'Moon twin',
  gmKm3S2: moon.gmKm3S2,
  radiusKm: `${moon.radiusKm} km`,
  j2: moon.j2,
  place: { kind: 'planet', parentId: 'earth', orbitRadiusKm: moon.parentOrbit!.semiMajorAxisKm, periodDays: moon.parentOrbit!.periodDays },
  albedo: moon.albedo,
  olrWm2: moon.olrWm2,
  airless: { emissivity: moon.airless!.emissivity, nightFloorK: moon.airless!.nightFloorK },
  sources: { gmKm3S2: 'copied from the catalogue for the test', nightFloorK: 'copied from the catalogue for the test' },
};

beforeAll(async () => {
  t = await createTestApp();
  [thermal, analyst, viewer, plover] = await Promise.all(['thermal@kestrel.test', 'analyst@kestrel.test', 'viewer@kestrel.test', 'owner@plover.test'].map((e) => t.signIn(e)));
  kestrel = workspaceIdOf(t, 'Kestrel');
});
afterAll(() => t.close());

const bodiesUrl = () => `/api/v1/workspaces/${kestrel}/bodies`;

describe('a workspace\'s own bodies', () => {
  let twinId: string;

  it('a thermal engineer adds one (typed radius read in km, audited); a viewer reads it; a viewer may not add; another workspace sees nothing', async () => {
    const made = await thermal.post(bodiesUrl()).send(moonLike).expect(201);
    twinId = made.body.id;
    expect(twinId).toMatch(/^custom-[0-9a-f-]{36}$/);
    expect(made.body.radiusKm).toBe(moon.radiusKm);
    expect((await viewer.get(bodiesUrl()).expect(200)).body.items.map((b: { name: string }) => b.name)).toEqual(['Moon twin']);
    await viewer.post(bodiesUrl()).send({ ...moonLike, name: 'Viewer body' }).expect(403);
    await plover.get(bodiesUrl()).expect(404);
    await plover.get(`${bodiesUrl()}/${twinId}`).expect(404);
    const audit = t.ctx.sqlite.prepare("SELECT action, summary FROM audit_events WHERE target_id = ?").all(twinId) as { action: string; summary: string }[];
    expect(audit).toEqual([{ action: 'body.created', summary: 'Body "Moon twin" added (airless).' }]);
  });

  it('an analyst changes it; GET /bodies lists it after the catalogue for members only', async () => {
    const changed = await analyst.put(`${bodiesUrl()}/${twinId}`).send({ ...moonLike, sources: { ...moonLike.sources, albedo: 'catalogue' } }).expect(200);
    expect(changed.body.sources.albedo).toBe('catalogue');
    const listed = (await viewer.get('/api/v1/bodies').expect(200)).body as { id: string; workspaceId?: string; airless: boolean }[];
    expect(listed[0]!.id).toBe('mercury');
    expect(listed.find((b) => b.id === twinId)).toMatchObject({ workspaceId: kestrel, airless: true });
    const theirs = (await plover.get('/api/v1/bodies').expect(200)).body as { id: string }[];
    expect(theirs.some((b) => b.id === twinId)).toBe(false);
    await plover.get(`/api/v1/bodies/${twinId}`).expect(404);
    expect((await viewer.get(`/api/v1/bodies/${twinId}`).expect(200)).body.name).toBe('Moon twin');
  });

  it.each([
    [{ albedo: { min: 0.1, nominal: 1.4, max: 0.2 } }, 'albedo.nominal', '1.4'],
    [{ gmKm3S2: -5 }, 'gmKm3S2', '-5'],
    [{ place: { kind: 'sun', meanAu: 1, minAu: 1.2, maxAu: 1.3 } }, 'place.meanAu', 'below the least'],
    [{ airless: { emissivity: moon.airless!.emissivity, nightFloorK: { min: 90, nominal: 95, max: 900 } } }, 'airless.nightFloorK.max', '900'],
    [{ name: '' }, 'name', 'give the body a name'],
  ])('refuses %j with a 400 naming %s and what it got, and stores nothing', async (change, path, shown) => {
    const before = (await viewer.get(bodiesUrl()).expect(200)).body.items.length;
    const res = await thermal.post(bodiesUrl()).send({ ...moonLike, ...change }).expect(400);
    const detail = (res.body.error.details as { path: string; message: string }[]).find((d) => d.path === path);
    expect(detail?.message).toContain(shown);
    expect((await viewer.get(bodiesUrl()).expect(200)).body.items).toHaveLength(before);
  });

  it('refuses a radius in a unit that is not a length, naming the field', async () => {
    const res = await thermal.post(bodiesUrl()).send({ ...moonLike, radiusKm: '1737 kg' }).expect((r) => expect(r.status).toBeGreaterThanOrEqual(400));
    expect(res.status).toBeLessThan(500);
    expect(res.body.error.details[0].path).toBe('radiusKm');
    expect(res.body.error.message).toContain('kg');
  });

  // The same rule in one place: the compute route's surface temperature field and Lambertian albedo
  // read only the body's constants, so a custom airless body with the Moon's constants must give the
  // Moon's answer to the last digit (closed-form consistency; no outside source).
  it('computes with a custom airless body exactly what the built-in Moon gives with the same constants', async () => {
    const request = (bodyId: string) => ({
      bodyId, orbit: { periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 90 }, betaDeg: 20, solarDistanceAu: 1, steps: 72,
      surfaces: [{ name: 'nadir', normal: 'nadir', areaM2: 1, absorptivity: 0.3, emissivity: 0.85 }, { name: 'ram', normal: 'ram', areaM2: 1, absorptivity: 0.3, emissivity: 0.85 }],
    });
    const builtIn = (await viewer.post('/api/v1/environment/compute').send(request('moon')).expect(200)).body;
    const custom = (await viewer.post('/api/v1/environment/compute').send(request(twinId)).expect(200)).body;
    expect(custom.bodyId).toBe(twinId);
    expect(custom.irModel).toBe('surface-temperature');
    expect({ ...custom, bodyId: 'moon' }).toEqual(builtIn);
  });

  it('keeps an asteroid about the Sun at its entered distances and computes its environment at an epoch', async () => {
    const made = await thermal.post(bodiesUrl()).send({
      name: 'Invented asteroid', gmKm3S2: 0.5, radiusKm: '120 km', place: { kind: 'sun', meanAu: 2.6, minAu: 2.4, maxAu: 2.8 },
      albedo: { min: 0.05, nominal: 0.09, max: 0.12 }, olrWm2: { min: 20, nominal: 40, max: 45 },
    }).expect(201);
    const detail = (await viewer.get(`/api/v1/bodies/${made.body.id}`).expect(200)).body;
    expect(detail.solarDistanceAu).toEqual({ mean: 2.6, min: 2.4, max: 2.8 });
    const res = await viewer.post('/api/v1/environment/compute').send({
      bodyId: made.body.id, orbit: { periapsisAltitudeKm: 50, apoapsisAltitudeKm: 50 }, epoch: '2030-06-01T00:00:00Z', steps: 36,
      surfaces: [{ name: 'n', normal: 'nadir', areaM2: 1, absorptivity: 0.3, emissivity: 0.8 }],
    }).expect(200);
    // on its ellipse between the entered perihelion and aphelion: the inverse square law of 1361 W/m^2 at 1 AU
    expect(res.body.solarDistanceAu).toBeGreaterThanOrEqual(2.4);
    expect(res.body.solarDistanceAu).toBeLessThanOrEqual(2.8);
    expect(res.body.solarFluxWm2).toBeCloseTo(1361 / res.body.solarDistanceAu ** 2, 0);
    expect(res.body.irModel).toBe('uniform');
    // a year's mission on its ellipse: the hot case is taken nearest the Sun, the cold farthest (within the year's span of the ellipse)
    const mission = await thermal.post('/api/v1/missions').send({ workspaceId: kestrel, name: 'Asteroid flyer', bodyId: made.body.id, startDate: '2030-01-01', endDate: '2034-12-31' }).expect(201);
    const orbit = await thermal.post(`/api/v1/missions/${mission.body.id}/orbits`)
      .send({ name: 'Low', epoch: '2030-01-01T00:00:00Z', periapsisAltitudeKm: 50, apoapsisAltitudeKm: 50, inclinationDeg: 80 }).expect(201);
    await thermal.post(`/api/v1/missions/${mission.body.id}/surfaces`).send({ name: 'Radiator', normal: 'zenith', areaM2: 0.5, materialId: libraryMaterialIdOf(t, 'white silicone paint') }).expect(201);
    const cases = await thermal.post(`/api/v1/missions/${mission.body.id}/cases/derive`).send({ orbitId: orbit.body.id, name: 'Asteroid', steps: 24 }).expect(201);
    const byKind = Object.fromEntries((cases.body.items as { kind: string; inputs: { conditions: { solarDistanceAu: number } } }[]).map((c) => [c.kind, c.inputs.conditions.solarDistanceAu]));
    // five years span its whole 4.2-year orbit (Kepler's third law: 2.6^1.5 years): both ends are reached
    expect(byKind['hot']).toBeCloseTo(2.4, 2);
    expect(byKind['cold']).toBeCloseTo(2.8, 2);
  });

  it('refuses another workspace\'s body in a computation and in a mission with a 400 naming bodyId', async () => {
    const compute = await plover.post('/api/v1/environment/compute').send({
      bodyId: twinId, orbit: { periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100 }, betaDeg: 0, surfaces: [{ name: 'n', normal: 'nadir', areaM2: 1, absorptivity: 0.3, emissivity: 0.8 }],
    }).expect(400);
    expect(compute.body.error.details[0]).toMatchObject({ path: 'bodyId' });
    expect(compute.body.error.details[0].message).toContain(twinId);
    const ploverId = workspaceIdOf(t, 'Plover');
    const mission = await plover.post('/api/v1/missions').send({ workspaceId: ploverId, name: 'Borrowed body', bodyId: twinId, startDate: '2030-01-01', endDate: '2030-02-01' }).expect(400);
    expect(mission.body.error.details[0].path).toBe('bodyId');
    expect(t.ctx.sqlite.prepare("SELECT count(*) AS n FROM missions WHERE name = 'Borrowed body'").get()).toEqual({ n: 0 });
  });

  // Europa's mean distance and period about Jupiter (JPL SSD mean elements, from memory): a custom
  // moon there crosses Jupiter's umbra for about 2.5-3 h every 3.55 days (Jupiter satellite phenomena, from memory).
  it('sweeps a mission about a custom moon of Jupiter with Jupiter\'s shadow, derives its cases, and keeps the body while a mission uses it', async () => {
    const europa = getBody('europa');
    const made = await thermal.post(bodiesUrl()).send({
      name: 'Europa-like moon', gmKm3S2: europa.gmKm3S2, radiusKm: europa.radiusKm, j2: 0,
      place: { kind: 'planet', parentId: 'jupiter', orbitRadiusKm: '671100 km', periodDays: '85.23 h' },
      albedo: { min: 0.6, nominal: 0.67, max: 0.7 }, olrWm2: { min: 5, nominal: 7, max: 9 },
      airless: { emissivity: { min: 0.9, nominal: 0.94, max: 0.96 }, nightFloorK: { min: 70, nominal: 80, max: 90 } },
    });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    expect(made.body.place).toEqual({ kind: 'planet', parentId: 'jupiter', orbitRadiusKm: 671100, periodDays: expect.closeTo(3.55125, 4) });
    const mission = await thermal.post('/api/v1/missions').send({ workspaceId: kestrel, name: 'Custom moon orbiter', bodyId: made.body.id, startDate: '2034-03-01', endDate: '2034-03-31' }).expect(201);
    const orbit = await thermal.post(`/api/v1/missions/${mission.body.id}/orbits`)
      .send({ name: 'Low polar', epoch: '2034-03-01T00:00:00Z', periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 90 });
    expect(orbit.status, JSON.stringify(orbit.body)).toBe(201);
    const sweep = await viewer.get(`/api/v1/missions/${mission.body.id}/orbits/${orbit.body.id}/sweep?from=2034-03-01&to=2034-03-10`).buffer(true).parse((r, done) => {
      let text = '';
      r.on('data', (c: Buffer) => (text += c.toString()));
      r.on('end', () => done(null, text));
    }).expect(200);
    const days = (sweep.body as string).split('\n').filter(Boolean).map((l) => JSON.parse(l) as { type: string; longestShadowS?: number; longestShadowCastBy?: string[] }).filter((l) => l.type === 'day');
    const shadowed = days.filter((d) => d.longestShadowCastBy!.includes('jupiter'));
    expect(shadowed.length).toBeGreaterThanOrEqual(2);
    expect(shadowed.length).toBeLessThanOrEqual(3);
    for (const d of shadowed) expect(d.longestShadowS! / 3600).toBeGreaterThan(2.2);
    await thermal.post(`/api/v1/missions/${mission.body.id}/surfaces`).send({ name: 'Radiator', normal: 'zenith', areaM2: 0.5, materialId: libraryMaterialIdOf(t, 'white silicone paint') }).expect(201);
    const cases = await thermal.post(`/api/v1/missions/${mission.body.id}/cases/derive`).send({ orbitId: orbit.body.id, name: 'Custom moon', steps: 24 });
    expect(cases.status, JSON.stringify(cases.body)).toBe(201);
    const cold = (cases.body.items as { kind: string; inputs: { conditions: { surfaceField?: { nightFloorK: number } }; rationale: string[] } }[]).find((c) => c.kind === 'cold')!;
    // the cold case takes the night floor at the cold end of its range, and the longest shadow, Jupiter's
    expect(cold.inputs.conditions.surfaceField?.nightFloorK).toBe(70);
    expect(cold.inputs.rationale.join(' ')).toMatch(/Jupiter/);
    const refused = await thermal.delete(`${bodiesUrl()}/${made.body.id}`).expect(409);
    expect(refused.body.error.message).toContain('Custom moon orbiter');
  });

  it('deletes a body no mission uses (audited); a viewer may not', async () => {
    await viewer.delete(`${bodiesUrl()}/${twinId}`).expect(403);
    await thermal.delete(`${bodiesUrl()}/${twinId}`).expect(204);
    await viewer.get(`${bodiesUrl()}/${twinId}`).expect(404);
    const actions = (t.ctx.sqlite.prepare('SELECT action FROM audit_events WHERE target_id = ? ORDER BY at, rowid').all(twinId) as { action: string }[]).map((a) => a.action);
    expect(actions).toEqual(['body.created', 'body.updated', 'body.deleted']);
  });
});
