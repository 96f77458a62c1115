// A new revision computed again from the mission's current inputs, for the two kinds of case that are
// not derived: a custom case (its date and the values its author fixed, with the current orbit,
// surfaces and materials) and a case along an ephemeris window (the same file and window, the current
// surfaces and materials); and a 409 naming the ephemeris when it was deleted since.
// Common practice of configuration control, no source: the check is that the new revision equals a
// case made afresh from the same request today, and keeps what its author fixed.
import path from 'node:path';
import Ajv2020 from 'ajv/dist/2020';
import addFormats from 'ajv-formats';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CaseDetail } from '../../shared/api/cases';
import { kestrelLunar, missionIdOf } from './mission-fixtures';
import { createTestMission, fixturesDir } from './ephemeris-test-mission';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let [thermal, owner, analyst] = [] as request.Agent[] as [request.Agent, request.Agent, request.Agent];

beforeAll(async () => {
  t = await createTestApp();
  [thermal, owner, analyst] = (await Promise.all(['thermal@kestrel.test', 'owner@kestrel.test', 'analyst@kestrel.test'].map((e) => t.signIn(e)))) as [
    request.Agent, request.Agent, request.Agent,
  ];
});
afterAll(() => t.close());

async function released(made: CaseDetail): Promise<CaseDetail> {
  await thermal.post(`/api/v1/cases/${made.id}/submit`).expect(200);
  return (await owner.post(`/api/v1/cases/${made.id}/release`).expect(200)).body as CaseDetail;
}

function firstSurface(missionId: string): { id: string; name: string; areaM2: number } {
  return t.ctx.sqlite.prepare('SELECT id, name, area_m2 AS areaM2 FROM surfaces WHERE mission_id = ? ORDER BY created_at, name').get(missionId) as {
    id: string; name: string; areaM2: number;
  };
}

/** The case's JSON export follows the served JSON Schema (ajv, draft 2020-12). */
async function expectSchemaValid(c: CaseDetail): Promise<void> {
  const ajv = new Ajv2020({ allErrors: true, strict: false });
  addFormats(ajv);
  const validate = ajv.compile((await thermal.get('/api/v1/schemas/load-case.json').expect(200)).body);
  const doc = JSON.parse((await thermal.get(`/api/v1/cases/${c.id}/export?format=json`).expect(200)).text);
  expect({ valid: validate(doc), errors: validate.errors ?? null }).toEqual({ valid: true, errors: null });
}

const areaOf = (c: CaseDetail, name: string) => c.results.surfaces.find((s) => s.name === name)!.areaM2;

describe('a custom case, computed again from the current inputs', () => {
  let missionId: string;
  let orbitId: string;
  let rev1: CaseDetail;
  const request = { name: 'Custom currency', date: '2028-03-20', betaDeg: 31.5, albedo: 0.14, olrWm2: 5, properties: 'eol', steps: 60 };

  beforeAll(async () => {
    missionId = missionIdOf(t, kestrelLunar);
    orbitId = (t.ctx.sqlite.prepare('SELECT id FROM orbits WHERE mission_id = ?').get(missionId) as { id: string }).id;
    const made = (await thermal.post(`/api/v1/missions/${missionId}/cases`).send({ ...request, orbitId }).expect(201)).body as CaseDetail;
    expect(made.inputs.fixed).toEqual({ betaDeg: 31.5, albedo: 0.14, olrWm2: 5 });
    rev1 = await released(made);
  });

  it('says what changed, and a new revision keeps its date and fixed values with the grown surface', async () => {
    const surface = firstSurface(missionId);
    await thermal.patch(`/api/v1/missions/${missionId}/surfaces/${surface.id}`).send({ areaM2: surface.areaM2 + 0.4 }).expect(200);
    const stale = (await thermal.get(`/api/v1/cases/${rev1.id}`).expect(200)).body as CaseDetail;
    expect(stale.inputChanges).toEqual([`surface "${surface.name}" area: ${surface.areaM2} m² -> ${surface.areaM2 + 0.4} m²`]);
    expect(stale.currentInputsBlocked).toBeNull();
    // the list says it too, in the same words
    const list = (await thermal.get(`/api/v1/cases?missionId=${missionId}&kind=custom`).expect(200)).body.items as { id: string; inputsChanged: boolean; inputChanges: string[] }[];
    expect(list.find((c) => c.id === rev1.id)).toMatchObject({ inputsChanged: true, inputChanges: stale.inputChanges });

    const rev2 = (await thermal.post(`/api/v1/cases/${rev1.id}/revisions`).send({ reason: 'radiator grew', fromCurrentInputs: true }).expect(201)).body as CaseDetail;
    expect(rev2).toMatchObject({ kind: 'custom', revision: 2, status: 'draft', name: rev1.name, inputChanges: [] });
    const c = rev2.inputs.conditions;
    expect([c.date, c.betaDeg, c.albedo, c.olrWm2, c.properties, c.steps]).toEqual([request.date, 31.5, 0.14, 5, 'eol', 60]);
    expect(rev2.inputs.fixed).toEqual(rev1.inputs.fixed);
    expect(areaOf(rev2, surface.name)).toBeCloseTo(surface.areaM2 + 0.4, 9);
    expect(areaOf(rev1, surface.name)).toBeCloseTo(surface.areaM2, 9);
    // the same request made afresh today gives the same loads
    const fresh = (await thermal.post(`/api/v1/missions/${missionId}/cases`).send({ ...request, orbitId, name: 'Custom fresh' }).expect(201)).body as CaseDetail;
    expect(rev2.results.total).toEqual(fresh.results.total);
    expect(rev2.results.total.orbitAverageAbsorbedW).not.toBe(rev1.results.total.orbitAverageAbsorbedW);
    await expectSchemaValid(rev2);
  });

  it('takes the beta of the date from the orbit as it is now when its author did not fix one', async () => {
    const unfixed = await released(
      (await thermal.post(`/api/v1/missions/${missionId}/cases`).send({ name: 'Custom from the date', orbitId, date: '2028-03-20', steps: 48 }).expect(201)).body as CaseDetail,
    );
    const orbit = t.ctx.sqlite.prepare('SELECT inclination_deg AS i FROM orbits WHERE id = ?').get(orbitId) as { i: number };
    await analyst.patch(`/api/v1/missions/${missionId}/orbits/${orbitId}`).send({ inclinationDeg: orbit.i - 20 }).expect(200);
    const stale = (await thermal.get(`/api/v1/cases/${unfixed.id}`).expect(200)).body as CaseDetail;
    expect(stale.inputChanges.some((line) => /inclination/.test(line))).toBe(true);
    const rev2 = (await thermal.post(`/api/v1/cases/${unfixed.id}/revisions`).send({ reason: 'orbit lowered in inclination', fromCurrentInputs: true }).expect(201)).body as CaseDetail;
    expect(rev2.inputChanges).toEqual([]);
    expect(rev2.inputs.conditions.orbit.inclinationDeg).toBeCloseTo(orbit.i - 20, 9);
    expect(rev2.inputs.conditions.betaDeg).not.toBeCloseTo(unfixed.inputs.conditions.betaDeg, 3);
    expect(rev2.inputs.fixed).toBeUndefined();
  });
});

describe('a custom case made before its fixed values were kept apart', () => {
  it('keeps the beta and the albedo/OLR its setup lines and source say were given', async () => {
    const missionId = missionIdOf(t, kestrelLunar);
    const orbitId = (t.ctx.sqlite.prepare('SELECT id FROM orbits WHERE mission_id = ?').get(missionId) as { id: string }).id;
    const made = (await thermal.post(`/api/v1/missions/${missionId}/cases`).send({ name: 'Older custom', orbitId, date: '2028-06-01', betaDeg: -12.5, albedo: 0.2, olrWm2: 10, steps: 36 }).expect(201)).body as CaseDetail;
    const rev1 = await released(made);
    // as a case stored before `inputs.fixed` existed
    t.ctx.sqlite.prepare("UPDATE load_cases SET inputs = json_remove(inputs, '$.fixed') WHERE id = ?").run(rev1.id);
    const rev2 = (await thermal.post(`/api/v1/cases/${rev1.id}/revisions`).send({ reason: 'older case again', fromCurrentInputs: true }).expect(201)).body as CaseDetail;
    expect([rev2.inputs.conditions.betaDeg, rev2.inputs.conditions.albedo, rev2.inputs.conditions.olrWm2]).toEqual([-12.5, 0.2, 10]);
    expect(rev2.inputs.fixed).toEqual({ betaDeg: -12.5, albedo: 0.2, olrWm2: 10 });
  });
});

describe('a case from an ephemeris window, computed again from the current inputs', () => {
  let missionId: string;
  let ephemerisId: string;
  let rev1: CaseDetail;
  const window = { from: '2027-03-20T12:00:00Z', to: '2027-03-20T13:30:00Z' };

  beforeAll(async () => {
    missionId = createTestMission(t);
    const upload = await analyst.post(`/api/v1/missions/${missionId}/ephemerides`).field('frame', 'EME2000').attach('file', path.join(fixturesDir, 'leo-circular.csv'));
    expect(upload.status, JSON.stringify(upload.body)).toBe(201);
    ephemerisId = upload.body.id as string;
    const made = await thermal.post(`/api/v1/missions/${missionId}/ephemerides/${ephemerisId}/cases`).send({ name: 'Along the file', ...window, steps: 30, properties: 'eol' });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    rev1 = await released(made.body as CaseDetail);
  });

  it('keeps the file and the window and takes the grown surface, as a case made afresh from the window would', async () => {
    const surface = firstSurface(missionId);
    await thermal.patch(`/api/v1/missions/${missionId}/surfaces/${surface.id}`).send({ areaM2: surface.areaM2 * 2 }).expect(200);
    expect(((await thermal.get(`/api/v1/cases/${rev1.id}`).expect(200)).body as CaseDetail).inputChanges).toEqual([
      `surface "${surface.name}" area: ${surface.areaM2} m² -> ${surface.areaM2 * 2} m²`,
    ]);
    const rev2 = (await thermal.post(`/api/v1/cases/${rev1.id}/revisions`).send({ reason: 'panel doubled', fromCurrentInputs: true }).expect(201)).body as CaseDetail;
    expect(rev2.inputChanges).toEqual([]);
    expect(rev2.inputs.ephemeris).toEqual(rev1.inputs.ephemeris);
    expect(rev2.inputs.conditions.properties).toBe('eol');
    expect(rev2.results.tS).toEqual(rev1.results.tS);
    expect(areaOf(rev2, surface.name)).toBeCloseTo(surface.areaM2 * 2, 9);
    const fresh = await thermal.post(`/api/v1/missions/${missionId}/ephemerides/${ephemerisId}/cases`).send({ name: 'Fresh', ...window, steps: 30, properties: 'eol' }).expect(201);
    expect(rev2.results.total).toEqual((fresh.body as CaseDetail).results.total);
    // the doubled panel's solar share doubles: A alpha S per step
    const [was, now] = [rev1, rev2].map((c) => c.results.surfaces.find((s) => s.name === surface.name)!.orbitAverage.solarW);
    expect(now).toBeCloseTo(2 * was!, 2);
    await expectSchemaValid(rev2);
  });

  it('says when the ephemeris was deleted, and refuses to compute it again with a 409 naming it; the stored loads can still be revised', async () => {
    const name = (await analyst.get(`/api/v1/missions/${missionId}/ephemerides/${ephemerisId}`).expect(200)).body.name as string;
    await analyst.delete(`/api/v1/missions/${missionId}/ephemerides/${ephemerisId}`).expect(204);
    const now = (await thermal.get(`/api/v1/cases/${rev1.id}`).expect(200)).body as CaseDetail;
    expect(now.inputChanges).toContain(`ephemeris "${name}" was deleted`);
    expect(now.currentInputsBlocked).toContain(`The ephemeris "${name}"`);
    const refused = await thermal.post(`/api/v1/cases/${rev1.id}/revisions`).send({ reason: 'again', fromCurrentInputs: true }).expect(409);
    expect(refused.body.error.code).toBe('case_source_deleted');
    expect(refused.body.error.message).toContain(`The ephemeris "${name}" this case was computed along was deleted`);
    const kept = (await thermal.post(`/api/v1/cases/${rev1.id}/revisions`).send({ reason: 'stored loads kept' }).expect(201)).body as CaseDetail;
    expect(kept.results.total).toEqual(rev1.results.total);
  });
});

describe('a derived case whose orbit was deleted since', () => {
  it('says so, and refuses to derive it again with a 409 naming the orbit', async () => {
    const missionId = missionIdOf(t, kestrelLunar);
    const orbit = await analyst
      .post(`/api/v1/missions/${missionId}/orbits`)
      .send({ name: 'Short-lived survey orbit', epoch: '2028-03-20T12:00:00Z', periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 90, raanDeg: 0, argPeriapsisDeg: 0 });
    expect(orbit.status, JSON.stringify(orbit.body)).toBe(201);
    const [hot] = (await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId: orbit.body.id, name: 'Survey', steps: 36 }).expect(201)).body.items as CaseDetail[];
    const rev1 = await released(hot!);
    await analyst.delete(`/api/v1/missions/${missionId}/orbits/${orbit.body.id}`).expect(204);
    const now = (await thermal.get(`/api/v1/cases/${rev1.id}`).expect(200)).body as CaseDetail;
    expect(now.inputChanges).toContain('orbit "Short-lived survey orbit" was deleted');
    expect(now.currentInputsBlocked).toContain('The orbit "Short-lived survey orbit" this case was computed on was deleted');
    const refused = await thermal.post(`/api/v1/cases/${rev1.id}/revisions`).send({ reason: 'again', fromCurrentInputs: true }).expect(409);
    expect(refused.body.error).toMatchObject({ code: 'case_source_deleted', message: expect.stringContaining('"Short-lived survey orbit"') });
  });
});
