// Currency (issue 15 item 2): a released case knows the mission inputs it was made from; when a
// radiator grows afterwards, the case says what changed, and a new revision derived from the
// current inputs uses the new area, carries its reason into the export and the subscribers' mail.
// Common practice of configuration control, no source.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { kestrelLunar, missionIdOf } from './mission-fixtures';
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
