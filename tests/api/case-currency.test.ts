// Currency (issue 15 item 2): a released case knows the mission inputs it was made from; when a
// radiator grows afterwards, the case says what changed, and a new revision derived from the
// current inputs uses the new area, carries its reason into the export and the subscribers' mail.
// Common practice of configuration control, no source.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { kestrelLunar, libraryMaterialIdOf, missionIdOf } from './mission-fixtures';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let [thermal, owner] = [] as request.Agent[] as [request.Agent, request.Agent];
let missionId: string;

interface Detail {
  id: string;
  version: number;
  inputChanges: string[];
  inputs: { revisionReason?: string; conditions: { surfaces: { name: string; areaM2: number }[] } };
  results: { surfaces: { name: string; areaM2: number; orbitAverage: { absorbedW: number } }[] };
}

beforeAll(async () => {
  t = await createTestApp();
  [thermal, owner] = (await Promise.all(['thermal@kestrel.test', 'owner@kestrel.test'].map((e) => t.signIn(e)))) as [request.Agent, request.Agent];
  missionId = missionIdOf(t, kestrelLunar);
});
afterAll(() => t.close());

describe('a case that knows its inputs', () => {
  let hot: Detail;
  let surface: { id: string; name: string; areaM2: number };

  beforeAll(async () => {
    const orbitId = (t.ctx.sqlite.prepare('SELECT id FROM orbits WHERE mission_id = ?').get(missionId) as { id: string }).id;
    hot = ((await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, name: 'Currency' }).expect(201)).body.items as Detail[])[0]!;
    await thermal.post(`/api/v1/cases/${hot.id}/submit`).expect(200);
    await owner.post(`/api/v1/cases/${hot.id}/release`).expect(200);
    surface = t.ctx.sqlite.prepare('SELECT id, name, area_m2 AS areaM2 FROM surfaces WHERE mission_id = ? ORDER BY created_at, name').get(missionId) as typeof surface;
  });

  it('is current right after it is made', async () => {
    expect(((await thermal.get(`/api/v1/cases/${hot.id}`).expect(200)).body as Detail).inputChanges).toEqual([]);
  });

  it('says which input changed since, in words with the old and new values', async () => {
    await thermal.patch(`/api/v1/missions/${missionId}/surfaces/${surface.id}`).send({ areaM2: surface.areaM2 + 0.3 }).expect(200);
    const now = (await thermal.get(`/api/v1/cases/${hot.id}`).expect(200)).body as Detail;
    expect(now.inputChanges).toEqual([`surface "${surface.name}" area: ${surface.areaM2} m² -> ${surface.areaM2 + 0.3} m²`]);
    const list = (await thermal.get(`/api/v1/cases?missionId=${missionId}`).expect(200)).body.items as { id: string; inputsChanged: boolean }[];
    expect(list.find((c) => c.id === hot.id)!.inputsChanged).toBe(true);
  });

  it('derives a new revision from the current inputs with its reason, which the export and the mail carry', async () => {
    await owner.post(`/api/v1/cases/${hot.id}/subscription`).expect(200);
    const reason = `${surface.name} grew to ${surface.areaM2 + 0.3} m^2 (design review action 12)`;
    const rev2 = (await thermal.post(`/api/v1/cases/${hot.id}/revisions`).send({ reason, fromCurrentInputs: true }).expect(201)).body as Detail;
    expect(rev2.inputChanges).toEqual([]);
    expect(rev2.inputs.revisionReason).toBe(reason);
    expect(rev2.inputs.conditions.surfaces.find((s) => s.name === surface.name)!.areaM2).toBeCloseTo(surface.areaM2 + 0.3, 9);
    expect(rev2.results.surfaces.find((s) => s.name === surface.name)!.areaM2).toBeCloseTo(surface.areaM2 + 0.3, 9);
    await thermal.post(`/api/v1/cases/${rev2.id}/submit`).expect(200);
    await owner.post(`/api/v1/cases/${rev2.id}/release`).expect(200);
    const json = (await owner.get(`/api/v1/cases/${rev2.id}/export?format=json`).expect(200)).body as { inputs: { revisionReason: string } };
    expect(json.inputs.revisionReason).toBe(reason);
    const mail = await t.waitForMail('owner@kestrel.test', 'revision 2 released');
    expect(mail.text).toContain(`Reason for this revision: ${reason}`);
    const audit = t.ctx.sqlite.prepare("SELECT summary FROM audit_events WHERE action = 'case.revised' AND target_id = ?").get(rev2.id) as { summary: string };
    expect(audit.summary).toContain('derived again from the current mission inputs');
  });

  it('refuses an empty reason naming the field (400)', async () => {
    const res = await thermal.post(`/api/v1/cases/${hot.id}/revisions`).send({ reason: '  ' }).expect(400);
    expect(res.body.error.details[0].path).toBe('reason');
  });
});

// Issue 19 with issue 15: a hot or cold case of a mission flown in phases is the phase of most (least)
// heat, so a change to ANOTHER phase can change which phase drives it; the case keeps every phase it
// weighed and says what changed in any. Common practice of configuration control, no source.
describe('a case chosen among the phases of its mission', () => {
  type Phased = Detail & { kind: string; phase: string | null; variant: string | null; inputs: { phases?: { name: string }[] } };
  let m: { id: string; orbitId: string; zenith: string; sunHold: string; imaging: string };
  let hot: Phased, cold: Phased, survival: Phased;
  const changes = async (c: { id: string }) => ((await thermal.get(`/api/v1/cases/${c.id}`).expect(200)).body as Detail).inputChanges;
  const patchPhase = (phaseId: string, body: object) => thermal.patch(`/api/v1/missions/${m.id}/phases/${phaseId}`).send(body).expect(200);
  /** A mission of 2028-03-10 to 2028-04-30 with a circular orbit and a radiator of 1 m² to zenith. */
  async function missionWithRadiator(name: string): Promise<{ id: string; orbitId: string; surfaceId: string }> {
    const created = async (path: string, body: object) => ((await thermal.post(path).send(body).expect(201)).body as { id: string }).id;
    const id = await created('/api/v1/missions', { name, bodyId: 'earth', startDate: '2028-03-10', endDate: '2028-04-30' });
    const orbitId = await created(`/api/v1/missions/${id}/orbits`, {
      name: 'circular 600 km', epoch: '2028-03-10T00:00:00Z', periapsisAltitudeKm: 600, apoapsisAltitudeKm: 600, inclinationDeg: 97.8, raanDeg: 135,
    });
    const surfaceId = await created(`/api/v1/missions/${id}/surfaces`, { name: 'radiator', areaM2: 1, normal: 'zenith', materialId: libraryMaterialIdOf(t, 'silver-backed FEP') });
    return { id, orbitId, surfaceId };
  }

  beforeAll(async () => {
    const { id, orbitId, surfaceId } = await missionWithRadiator('Phases in the choice');
    const zenith = (await thermal.post(`/api/v1/missions/${id}/attitude-modes`).send({ name: 'radiator to zenith' }).expect(201)).body.id as string;
    const sun = (await thermal.post(`/api/v1/missions/${id}/attitude-modes`).send({ name: 'radiator to the Sun', pointing: [{ surfaceId, normal: 'sun' }] }).expect(201)).body.id as string;
    const phase = async (body: object) => (await thermal.post(`/api/v1/missions/${id}/phases`).send(body).expect(201)).body.id as string;
    const imaging = await phase({ name: 'Imaging', startDate: '2028-03-10', endDate: '2028-03-31', modeId: zenith, dissipation: [{ node: 'payload', dissipationW: 300 }] });
    const sunHold = await phase({ name: 'Sun hold', startDate: '2028-04-01', endDate: '2028-04-20', modeId: sun, dissipation: [{ node: 'payload', dissipationW: 20 }] });
    m = { id, orbitId, zenith, sunHold, imaging };
    // as in phases.test.ts: Imaging (300 W) drives the hot case, Sun hold (20 W) the cold, Imaging (least absorbed) the survival case
    [hot, cold, survival] = (await thermal.post(`/api/v1/missions/${id}/cases/derive`).send({ orbitId, name: 'Phased', steps: 60, survival: true }).expect(201)).body.items as [Phased, Phased, Phased];
    expect([hot, cold, survival].map((c) => [c.kind, c.phase, c.variant])).toEqual([['hot', 'Imaging', null], ['cold', 'Sun hold', null], ['cold', 'Imaging', 'survival']]);
  });

  it('keeps every phase it weighed and is current right after it is made', async () => {
    expect(hot.inputs.phases!.map((p) => p.name)).toEqual(['Imaging', 'Sun hold']);
    for (const c of [hot, cold, survival]) expect(await changes(c)).toEqual([]);
  });

  it("another phase's dissipation changed: the hot case says it with the old and new totals, like the cold case of that phase; the survival case its node's least", async () => {
    await patchPhase(m.sunHold, { dissipation: [{ node: 'payload', dissipationW: 40 }] });
    const line = 'phase "Sun hold" dissipation: 20 W -> 40 W';
    expect(await changes(hot)).toEqual([line]);
    expect(await changes(cold)).toEqual([line]);
    // survival dissipates each node's least over the phases, and its phase is chosen by absorbed load alone
    expect(await changes(survival)).toEqual(['survival dissipation of node "payload": 20 W -> 40 W']);
    const list = (await thermal.get(`/api/v1/cases?missionId=${m.id}`).expect(200)).body.items as { id: string; inputsChanged: boolean; inputChanges: string[] }[];
    expect(list.find((c) => c.id === hot.id)).toMatchObject({ inputsChanged: true, inputChanges: [line] });
  });

  it("a phase added, another phase's dates or mode changed: said in words", async () => {
    await thermal.post(`/api/v1/missions/${m.id}/phases`).send({ name: 'Extended operations', startDate: '2028-04-22', endDate: '2028-04-30', modeId: m.zenith }).expect(201);
    await patchPhase(m.sunHold, { endDate: '2028-04-21', modeId: m.zenith });
    expect(await changes(hot)).toEqual([
      'phase "Sun hold" end: 2028-04-20 -> 2028-04-21',
      'phase "Sun hold" attitude mode: radiator to the Sun -> radiator to zenith',
      'phase "Sun hold" dissipation: 20 W -> 40 W',
      'phase "Sun hold": surface "radiator" pointing changed',
      'phase "Extended operations" was added',
    ]);
  });

  it('a new revision from the current inputs chooses again among the phases as they are; renaming a phase afterwards changes nothing the choice weighed', async () => {
    await thermal.post(`/api/v1/cases/${hot.id}/submit`).expect(200);
    await owner.post(`/api/v1/cases/${hot.id}/release`).expect(200);
    const rev2 = (await thermal.post(`/api/v1/cases/${hot.id}/revisions`).send({ reason: 'phases replanned', fromCurrentInputs: true }).expect(201)).body as Phased;
    expect(rev2.inputs.phases!.map((p) => p.name)).toEqual(['Imaging', 'Sun hold', 'Extended operations']);
    expect(rev2.inputChanges).toEqual([]);
    // a name labels a phase; the loads and the choice do not depend on it (users would not want a new revision for it)
    await patchPhase(m.sunHold, { name: 'Safe hold' });
    expect(await changes(rev2)).toEqual([]);
    // ...but a change to the renamed phase names it as the case knew it and as it is called now
    await patchPhase(m.sunHold, { dissipation: [{ node: 'payload', dissipationW: 24.7 }] });
    expect(await changes(rev2)).toEqual(['phase "Sun hold" (now "Safe hold") dissipation: 40 W -> 24.7 W']);
    // to 0.1 W as "why this case" shows it, finer when 0.1 W would hide the change
    await patchPhase(m.sunHold, { dissipation: [{ node: 'payload', dissipationW: 40.02 }] });
    expect(await changes(rev2)).toEqual(['phase "Sun hold" (now "Safe hold") dissipation: 40 W -> 40.02 W']);
  });

  it('a case saved before the phases were kept reports its own phase only, never a false change; a mission without phases is not flagged when phases are added', async () => {
    // as stored before this change: no `phases` (the version goes up, as every write does)
    t.ctx.sqlite.prepare("UPDATE load_cases SET inputs = json_remove(inputs, '$.phases'), version = version + 1 WHERE id = ?").run(cold.id);
    const own = await changes(cold);
    expect(own).toEqual([
      'phase "Sun hold" (now "Safe hold") end: 2028-04-20 -> 2028-04-21',
      'phase "Sun hold" (now "Safe hold") attitude mode: radiator to the Sun -> radiator to zenith',
      'phase "Sun hold" (now "Safe hold") dissipation: 20 W -> 40 W',
      'surface "radiator" pointing changed',
    ]);
    await patchPhase(m.imaging, { dissipation: [{ node: 'payload', dissipationW: 500 }] });
    expect(await changes(cold)).toEqual(own);

    const { id: flat, orbitId } = await missionWithRadiator('No phases yet');
    const [flatHot] = (await thermal.post(`/api/v1/missions/${flat}/cases/derive`).send({ orbitId, steps: 60 }).expect(201)).body.items as [Phased];
    const mode = (await thermal.post(`/api/v1/missions/${flat}/attitude-modes`).send({ name: 'radiator to zenith' }).expect(201)).body.id as string;
    await thermal.post(`/api/v1/missions/${flat}/phases`).send({ name: 'Whole mission', startDate: '2028-03-10', endDate: '2028-04-30', modeId: mode }).expect(201);
    expect(await changes(flatHot)).toEqual([]);
  });
});
