// The work one request may ask for (issue 12, item 7), on every route that computes per-step ×
// per-surface (or per-node) results: each is refused with 413 too_much_work naming the two factors
// and the limit before any work, and changes nothing; a request just under the limit is served.
// The limit is this project's choice (server/work-limit.ts), no source.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { materials, missions, surfaces } from '../../server/db/schema';
import { MAX_CASE_SAMPLES, MAX_SAMPLES } from '../../server/work-limit';
import { createTestApp, userIdOf, workspaceIdOf, type TestApp } from './test-app';
import type request from 'supertest';

// Surfaces enough that 2,000 steps × surfaces is over the limit of an answer, and 200 steps over that of a case (199 not).
const SURFACES = 251;
const normals = ['nadir', 'zenith', 'ram', 'wake', 'orbit-normal', 'anti-orbit-normal'] as const;

let t: TestApp;
let thermal: request.Agent;
let missionId: string;
let orbitId: string;
let ephemerisId: string;

/** A mission of many invented panels, written straight to the database (251 POSTs would only be slower). */
function crowdedMission(): string {
  const workspaceId = workspaceIdOf(t, 'Kestrel');
  const createdBy = userIdOf(t, 'thermal@kestrel.test');
  return t.ctx.db.transaction((tx) => {
    const mission = tx.insert(missions).values({ workspaceId, name: 'Many panels', bodyId: 'earth', startDate: '2027-01-01', endDate: '2033-01-31', createdBy }).returning().get();
    const material = tx.insert(materials)
      .values({ workspaceId, name: 'many-panels paint', absorptivityBol: 0.3, emissivityBol: 0.8, absorptivityEol: 0.4, emissivityEol: 0.8, source: 'invented' })
      .returning().get();
    for (let i = 0; i < SURFACES; i++) {
      tx.insert(surfaces).values({ missionId: mission.id, name: `panel ${i + 1}`, areaM2: 0.1, normal: normals[i % normals.length]!, materialId: material.id }).run();
    }
    return mission.id;
  });
}

/** A 550 km circular orbit every 10 s (two-body, invented): rows × SURFACES is over the limit. */
function ephemerisCsv(rows: number): Buffer {
  const rKm = 6378.137 + 550;
  const periodS = 2 * Math.PI * Math.sqrt(rKm ** 3 / 398600.4418);
  const t0 = Date.parse('2027-03-20T12:00:00Z');
  const lines = ['epoch,x,y,z'];
  for (let i = 0; i < rows; i++) {
    const u = (2 * Math.PI * i * 10) / periodS;
    lines.push(`${new Date(t0 + i * 10_000).toISOString()},${(rKm * Math.cos(u)).toFixed(3)},${(rKm * Math.sin(u) * 0.2).toFixed(3)},${(rKm * Math.sin(u) * 0.98).toFixed(3)}`);
  }
  return Buffer.from(lines.join('\n') + '\n');
}

beforeAll(async () => {
  t = await createTestApp();
  thermal = await t.signIn('thermal@kestrel.test');
  missionId = crowdedMission();
  const orbit = await thermal.post(`/api/v1/missions/${missionId}/orbits`)
    .send({ name: 'LEO 550', periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6, epoch: '2027-03-20T12:00:00Z' });
  expect(orbit.status).toBe(201);
  orbitId = orbit.body.id;
  const ephemeris = await thermal.post(`/api/v1/missions/${missionId}/ephemerides`).field('frame', 'EME2000').attach('file', ephemerisCsv(2100), 'many.csv');
  expect(ephemeris.status).toBe(201);
  ephemerisId = ephemeris.body.id;
}, 60_000);
afterAll(async () => {
  await t.close();
});

const changes = () => (t.ctx.sqlite.prepare('SELECT total_changes() AS n').get() as { n: number }).n;

/** Sends the request and expects 413 too_much_work naming `product` (e.g. "steps × surfaces"), the limit, and nothing written. */
async function expectRefused(send: () => request.Test, product: string, path: string, limit = MAX_SAMPLES): Promise<void> {
  const before = changes();
  const res = await send();
  expect(res.status, JSON.stringify(res.body)).toBe(413);
  expect(res.body.error.code).toBe('too_much_work');
  expect(res.body.error.message.toLowerCase()).toContain(product.toLowerCase());
  expect(res.body.error.message).toContain(`more than the ${limit.toLocaleString('en-US')}`);
  expect(res.body.error.details).toEqual([{ path, message: expect.stringContaining(product) }]);
  expect(changes()).toBe(before);
}

describe(`over ${MAX_SAMPLES.toLocaleString('en-US')} samples (${MAX_CASE_SAMPLES.toLocaleString('en-US')} for a load case)`, () => {
  it('the compute route refuses steps × surfaces (the attack: 100,000 × 50)', async () => {
    const surfaceList = Array.from({ length: 50 }, (_, i) => ({ name: `p${i}`, normal: 'nadir', areaM2: 1, absorptivity: 0.3, emissivity: 0.8 }));
    await expectRefused(() => thermal.post('/api/v1/environment/compute').send({ bodyId: 'earth', orbit: { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550 }, betaDeg: 0, steps: 100_000, surfaces: surfaceList }), 'steps × surfaces = 100,000 × 50', 'steps');
  });

  it('a saved orbit\'s environment refuses steps × the mission\'s surfaces', async () => {
    await expectRefused(() => thermal.post(`/api/v1/missions/${missionId}/orbits/${orbitId}/environment`).send({ steps: 2000 }), `steps × surfaces of the mission = 2,000 × ${SURFACES}`, 'steps');
  });

  it('the mission sweep refuses days × surfaces', async () => {
    await expectRefused(() => thermal.get(`/api/v1/missions/${missionId}/orbits/${orbitId}/sweep?from=2027-01-01&to=2033-01-31`), `days × surfaces of the mission = 2,223 × ${SURFACES}`, 'stepDays');
  });

  it('the environment along an ephemeris, and a case from it, refuse rows × surfaces', async () => {
    await expectRefused(() => thermal.post(`/api/v1/missions/${missionId}/ephemerides/${ephemerisId}/environment`).send({}), `rows of the window × surfaces = 2,100 × ${SURFACES}`, 'to');
    await expectRefused(() => thermal.post(`/api/v1/missions/${missionId}/ephemerides/${ephemerisId}/cases`).send({ name: 'too big', steps: 200 }), `steps × surfaces = 200 × ${SURFACES}`, 'steps', MAX_CASE_SAMPLES);
  });

  it('deriving cases, a custom case and a case edit refuse steps × surfaces; 199 steps × 251 surfaces is derived', async () => {
    await expectRefused(() => thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, steps: 200 }), `steps × surfaces = 200 × ${SURFACES}`, 'steps', MAX_CASE_SAMPLES);
    await expectRefused(() => thermal.post(`/api/v1/missions/${missionId}/cases`).send({ orbitId, name: 'custom', date: '2027-06-21', steps: 200 }), `steps × surfaces = 200 × ${SURFACES}`, 'steps', MAX_CASE_SAMPLES);
    const atLimit = await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, name: 'At the limit', steps: 199 });
    expect(atLimit.status).toBe(201);
    await expectRefused(() => thermal.patch(`/api/v1/cases/${atLimit.body.items[0].id}`).send({ inputs: { steps: 2000 } }), `steps × surfaces = 2,000 × ${SURFACES}`, 'steps', MAX_CASE_SAMPLES);
  }, 60_000);

  it('the thermal solve and sizing refuse steps × nodes', async () => {
    const nodes = Array.from({ length: 6 }, (_, i) => ({ name: `n${i}`, capacitanceJK: 1000, initialC: 10, absorbedW: 5, radiatorAreaM2: 0.01, emissivity: 0.8 }));
    const model = { periodS: 5739, steps: 100_000, nodes };
    await expectRefused(() => thermal.post('/api/v1/thermal/solve').send(model), 'steps × nodes = 100,000 × 6', 'steps');
    await expectRefused(() => thermal.post('/api/v1/thermal/size').send({ ...model, sizing: { kind: 'radiator', node: 'n0' } }), 'steps × nodes = 100,000 × 6', 'steps');
    await expectRefused(() => thermal.post('/api/v1/thermal/solve').send({ ...model, steps: 10_000, substeps: 10 }), 'steps × substeps × nodes = 10,000 × 10 × 6', 'steps');
    // Within the limit for one orbit, but 2,000 orbits of it are ten times what the default 200 allow.
    await expectRefused(() => thermal.post('/api/v1/thermal/solve').send({ ...model, steps: 80_000, maxOrbits: 2000 }), 'steps × nodes × maxOrbits = 80,000 × 6 × 2,000', 'maxOrbits', MAX_SAMPLES * 200);
  });

  it('a saved thermal model run refuses the case\'s steps × the model\'s nodes', async () => {
    // Kestrel-1 of the demo seed has a handful of surfaces: 2,000 steps make a case within its limit.
    const kestrel = (t.ctx.sqlite.prepare("SELECT m.id AS missionId, o.id AS orbitId FROM missions m JOIN orbits o ON o.mission_id = m.id WHERE m.name = 'Kestrel-1 imaging smallsat'").get()) as { missionId: string; orbitId: string };
    const derived = await thermal.post(`/api/v1/missions/${kestrel.missionId}/cases/derive`).send({ orbitId: kestrel.orbitId, name: 'Fine', steps: 2000 });
    expect(derived.status).toBe(201);
    const nodes = Array.from({ length: 251 }, (_, i) => ({ name: `n${i}`, capacitanceJK: 1000, initialC: 10, dissipationW: 1, radiatorAreaM2: 0.01, emissivity: 0.8 }));
    const model = await thermal.post(`/api/v1/missions/${kestrel.missionId}/thermal-models`).send({ name: 'Many nodes', model: { nodes } });
    expect(model.status, JSON.stringify(model.body)).toBe(201);
    await expectRefused(() => thermal.post(`/api/v1/thermal-models/${model.body.id}/run`).send({ caseId: derived.body.items[0].id }), 'steps × nodes = 2,000 × 251', 'steps');
  }, 60_000);
});
