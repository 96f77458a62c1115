// Every pointing form through the API (API.md "Environment computation", "Attitudes beyond the local
// orbital frame"; shared/api/pointing.ts): the compute route, saved surfaces with their audit words,
// and the 400s that name the field of a wrong form. The physics is checked in
// shared/physics/pointing.spec.ts; here the routes carry it.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { surface } from '../../shared/api/missions';
import { auditFor, kestrelOne, libraryMaterialIdOf, missionIdOf } from './mission-fixtures';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let viewer: request.Agent;
let thermal: request.Agent;
let missionId: string;

beforeAll(async () => {
  t = await createTestApp();
  [viewer, thermal] = await Promise.all(['viewer@kestrel.test', 'thermal@kestrel.test'].map((e) => t.signIn(e)));
  missionId = missionIdOf(t, kestrelOne);
});
afterAll(() => t.close());

const plate = (name: string, normal: unknown) => ({ name, normal, areaM2: 1, absorptivity: 0.9, emissivity: 0.8 });
const compute = (surfaces: unknown[], extra: object = {}) => viewer.post('/api/v1/environment/compute').send({
  bodyId: 'earth', orbit: { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 51.6 }, betaDeg: 30, steps: 120, surfaces, ...extra,
});

describe('POST /api/v1/environment/compute with every pointing form', () => {
  it('answers each form; a drive about the orbit normal gets S cos(beta) in sunlight (closed form) and two-axis tracking the Sun-pointed loads', async () => {
    const res = await compute([
      plate('sun', 'sun'),
      plate('both', { trackSun: { axis: 'both' } }),
      plate('drive', { trackSun: { axis: 'orbit-normal' } }),
      plate('inertial', { inertial: { raDeg: 0, decDeg: 90 } }),
      plate('spinner', { spin: { axis: { inertial: { raDeg: 0, decDeg: 90 } }, angleDeg: 90 } }),
      plate('yaw', { yawSteered: { normal: 'anti-orbit-normal' } }),
    ]).expect(200);
    const lit = (res.body.profile as { sunlit: number; surfaces: { solarWm2: number }[] }[]).find((p) => p.sunlit === 1)!;
    expect(lit.surfaces[2].solarWm2).toBeCloseTo(res.body.solarFluxWm2 * Math.cos(30 * Math.PI / 180), 6);
    const [sun, both, , , , yaw] = res.body.orbitAverage.surfaces as { solarWm2: number; albedoWm2: number; irWm2: number }[];
    expect(both).toEqual({ ...sun, name: 'both' });
    // the yaw-steered -y face never sees the Sun
    expect(yaw.solarWm2).toBe(0);
    expect(res.body.assumptions.join(' ')).not.toMatch(/NaN/);
    // the answer says how it treated each form it used
    expect(res.body.assumptions.join(' ')).toMatch(/spinning plates: loads averaged over a turn/);
    expect(res.body.assumptions.join(' ')).toMatch(/yaw steering: .*the -y face never sees it/);
  });

  it.each([
    [{ inertial: { raDeg: 400, decDeg: 0 } }, /raDeg \(right ascension\) is 0\.\.360/],
    [{ inertial: { raDeg: 10 } }, /inertial\.decDeg/],
    [{ trackSun: { axis: 'sun' } }, /drive cannot turn about the Sun|"both"/],
    [{ spin: { axis: { spin: { axis: 'sun', angleDeg: 10 } }, angleDeg: 90 } }, /spin\.axis/],
    [{ spin: { axis: 'sun', angleDeg: 200 } }, /angleDeg \(from the spin axis\) is 0\.\.180/],
    [{ yawSteered: { normal: { x: 0, y: 0, z: 0 } } }, /unit vector/],
    [{ pointAt: 'moon' }, /a normal is one of/],
  ])('refuses %j with a 400 naming the field', async (normal, message) => {
    const res = await compute([plate('bad', normal)]).expect(400);
    const text = `${res.body.error.message} ${JSON.stringify(res.body.error.details)}`;
    expect(text).toMatch(message);
    expect(text).toContain('surfaces.0.normal');
    expect(text).not.toMatch(/NaN|invalid_union/);
  });
});

describe('saved surfaces take every pointing form', () => {
  it('stores a spinner and an inertial plate, gives them back as sent and says the pointing in words in the audit trail', async () => {
    const materialId = libraryMaterialIdOf(t, 'GaAs solar cells');
    const path = `/api/v1/missions/${missionId}/surfaces`;
    const spinner = { spin: { axis: 'sun', angleDeg: 90 } };
    const created = await thermal.post(path).send({ name: 'Drum panel', areaM2: '0.8 m^2', normal: spinner, materialId }).expect(201);
    expect(surface.parse(created.body).normal).toEqual(spinner);
    expect(auditFor(t, created.body.id)[0].summary).toContain('on a body spinning about the Sun, 90° from the spin axis');
    const inertial = { inertial: { raDeg: 83.6, decDeg: 22 } };
    const changed = await thermal.patch(`${path}/${created.body.id}`).send({ normal: inertial }).expect(200);
    expect(changed.body.normal).toEqual(inertial);
    expect(auditFor(t, created.body.id).at(-1)?.summary).toContain('fixed in inertial space at right ascension 83.6°, declination 22°');
    const listed = await viewer.get(`/api/v1/missions/${missionId}`).expect(200);
    expect((listed.body.surfaces as { name: string; normal: unknown }[]).find((s) => s.name === 'Drum panel')?.normal).toEqual(inertial);
    const refused = await thermal.patch(`${path}/${created.body.id}`).send({ normal: { trackSun: { axis: { x: 0, y: 2, z: 0 } } } }).expect(400);
    expect(refused.body.error.message).toMatch(/normal/);
    await thermal.delete(`${path}/${created.body.id}`).expect(204);
  });
});

describe('cases from pointed surfaces', () => {
  it('derive with a spinner and a yaw-steered face, and the case CSV says each surface\'s pointing in words', async () => {
    const materialId = libraryMaterialIdOf(t, 'GaAs solar cells');
    const path = `/api/v1/missions/${missionId}/surfaces`;
    const spinner = await thermal.post(path).send({ name: 'Drum band', areaM2: 0.5, normal: { spin: { axis: 'sun', angleDeg: 90 } }, materialId }).expect(201);
    const yaw = await thermal.post(path).send({ name: 'Yawed radiator', areaM2: 0.3, normal: { yawSteered: { normal: 'anti-orbit-normal' } }, materialId }).expect(201);
    const orbitId = (t.ctx.sqlite.prepare('SELECT id FROM orbits WHERE mission_id = ?').get(missionId) as { id: string }).id;
    const derived = await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, name: 'Pointed' }).expect(201);
    const hot = derived.body.items[0] as { id: string; inputs: { attitude: string }; results: { surfaces: { name: string; orbitAverage: { solarWm2: number } }[] } };
    expect(hot.inputs.attitude).toContain('Drum band on a body spinning about the Sun, 90° from the spin axis');
    // the yaw-steered -y face never sees the Sun (our definition of yaw steering)
    expect(hot.results.surfaces.find((s) => s.name === 'Yawed radiator')?.orbitAverage.solarWm2).toBe(0);
    const csv = await thermal.get(`/api/v1/cases/${hot.id}/export?format=csv`).expect(200);
    expect(csv.text.split('\n')[0]).toContain(',surface,pointing,');
    // RFC 4180: a cell holding a comma is quoted
    expect(csv.text).toContain('Drum band,"on a body spinning about the Sun, 90° from the spin axis (loads averaged over a turn)"');
    expect(csv.text).toContain('Yawed radiator,"facing the anti-orbit-normal before yaw, on a spacecraft yaw-steered');
    for (const id of [spinner.body.id, yaw.body.id]) await thermal.delete(`${path}/${id}`).expect(204);
  });
});
