// Issue 12, item 2: a released load case is never destroyed by a side door. An analyst could
// DELETE the mission of a released case and the cascade erased it for every importing team; now
// only an owner deletes a mission, never one holding released or superseded revisions (409 naming
// them), the database refuses any cascade that reaches them, and a deletion that is allowed is
// audited with everything it removed and leaves no subscription behind.
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fixturesDir } from './ephemeris-test-mission';
import { auditFor, kestrelAgents, kestrelOne, type KestrelAgents, libraryMaterialIdOf, missionIdOf } from './mission-fixtures';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let { owner, analyst, thermal, viewer } = {} as KestrelAgents;

beforeAll(async () => {
  t = await createTestApp();
  ({ owner, analyst, thermal, viewer } = await kestrelAgents(t));
});
afterAll(() => t.close());

const count = (sql: string, ...params: string[]) => (t.ctx.sqlite.prepare(sql).get(...params) as { n: number }).n;
const keptCases = (missionId: string) =>
  t.ctx.sqlite.prepare("SELECT name, revision, status FROM load_cases WHERE mission_id = ? AND status IN ('released', 'superseded') ORDER BY name, revision").all(missionId) as {
    name: string; revision: number; status: string;
  }[];

describe('deleting the mission of released cases', () => {
  it('is refused to analysts and thermal engineers (403): only the owner deletes a mission', async () => {
    const id = missionIdOf(t, kestrelOne);
    for (const agent of [analyst, thermal, viewer]) {
      const res = await agent.delete(`/api/v1/missions/${id}`);
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/needs the Owner role/);
    }
    await analyst.get(`/api/v1/missions/${id}`).expect(200);
  });

  it('is refused to the owner too (409), naming every released and superseded case; nothing is removed and archiving still works', async () => {
    const id = missionIdOf(t, kestrelOne);
    const before = keptCases(id);
    expect(before.some((c) => c.status === 'released')).toBe(true);
    expect(before.some((c) => c.status === 'superseded')).toBe(true);
    const res = await owner.delete(`/api/v1/missions/${id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('mission_has_released_cases');
    for (const c of before) expect(res.body.error.message).toContain(`"${c.name}" revision ${c.revision} (${c.status})`);
    expect(res.body.error.message).toMatch(/archive it instead/);
    expect(res.body.error.details).toHaveLength(before.length);
    expect(keptCases(id)).toEqual(before);
    expect(count('SELECT count(*) AS n FROM orbits WHERE mission_id = ?', id)).toBeGreaterThan(0);
    await owner.patch(`/api/v1/missions/${id}`).send({ archived: true }).expect(200);
    expect((await owner.delete(`/api/v1/missions/${id}`)).status).toBe(409);
    await owner.patch(`/api/v1/missions/${id}`).send({ archived: false }).expect(200);
  });

  it('cannot happen below the routes either: the database refuses a cascade from the mission or the workspace that reaches a released revision', () => {
    const id = missionIdOf(t, kestrelOne);
    const before = keptCases(id);
    expect(() => t.ctx.sqlite.prepare('DELETE FROM missions WHERE id = ?').run(id)).toThrow(/released load cases are never deleted/);
    expect(() => t.ctx.sqlite.prepare("DELETE FROM workspaces WHERE name = 'Kestrel'").run()).toThrow(/released load cases are never deleted/);
    expect(() => t.ctx.sqlite.prepare("DELETE FROM load_cases WHERE status = 'superseded'").run()).toThrow(/released load cases are never deleted/);
    expect(keptCases(id)).toEqual(before);
  });
});

describe('deleting a mission without releases', () => {
  it('is done by the owner with orbits, surfaces, ephemeris, thermal model, drafts and their subscriptions, each listed in the audit event', async () => {
    const mission = await analyst
      .post('/api/v1/missions')
      .send({ name: 'Scratch study', bodyId: 'earth', startDate: '2027-03-01', endDate: '2027-12-31' })
      .expect(201);
    const id = mission.body.id as string;
    const orbit = await analyst
      .post(`/api/v1/missions/${id}/orbits`)
      .send({ name: 'LEO', epoch: '2027-03-20T12:00:00Z', periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6 })
      .expect(201);
    const surface = await thermal
      .post(`/api/v1/missions/${id}/surfaces`)
      .send({ name: 'zenith radiator', areaM2: 0.3, normal: 'zenith', materialId: libraryMaterialIdOf(t, 'white silicone paint') })
      .expect(201);
    const upload = await analyst.post(`/api/v1/missions/${id}/ephemerides`).field('frame', 'EME2000').attach('file', path.join(fixturesDir, 'leo-circular.csv'));
    expect(upload.status, JSON.stringify(upload.body)).toBe(201);
    const model = {
      name: 'One node',
      model: { nodes: [{ name: 'panel', capacitanceJK: 1500, initialC: 0, surfaceIds: [surface.body.id] }], couplings: [], heaters: [] },
    };
    await thermal.post(`/api/v1/missions/${id}/thermal-models`).send(model).expect(201);
    const derived = await thermal.post(`/api/v1/missions/${id}/cases/derive`).send({ orbitId: orbit.body.id, name: 'Scratch' }).expect(201);
    const [hot] = derived.body.items as { id: string; seriesId: string }[];
    await thermal.post(`/api/v1/cases/${hot!.id}/submit`).expect(200);
    await owner.post(`/api/v1/cases/${hot!.id}/subscription`).expect(200);
    expect(count('SELECT count(*) AS n FROM case_subscriptions WHERE case_series_id = ?', hot!.seriesId)).toBe(1);

    await analyst.delete(`/api/v1/missions/${id}`).expect(403);
    await owner.delete(`/api/v1/missions/${id}`).expect(204);

    await owner.get(`/api/v1/missions/${id}`).expect(404);
    for (const table of ['orbits', 'surfaces', 'ephemerides', 'thermal_models', 'load_cases']) {
      expect(count(`SELECT count(*) AS n FROM ${table} WHERE mission_id = ?`, id), table).toBe(0);
    }
    // no subscription is left pointing at a series that no longer has any revision
    expect(count('SELECT count(*) AS n FROM case_subscriptions WHERE case_series_id NOT IN (SELECT series_id FROM load_cases)')).toBe(0);
    const event = auditFor(t, id).at(-1);
    expect(event?.action).toBe('mission.deleted');
    expect(event?.summary).toBe(
      'Mission "Scratch study" deleted with 1 orbit, 1 surface, 1 ephemeris (' + String(upload.body.rows) + ' rows), 1 thermal model with 0 stored runs, ' +
        '2 unreleased load cases ("Scratch cold" revision 1, draft; "Scratch hot" revision 1, review), 1 subscription.',
    );
  });
});

describe('other deletions that a released case came from', () => {
  it('leave the released case, its export and its checksum as they were: orbits, surfaces, the ephemeris and the thermal model go, the case stays', async () => {
    const id = missionIdOf(t, kestrelOne);
    const upload = await analyst.post(`/api/v1/missions/${id}/ephemerides`).field('frame', 'EME2000').attach('file', path.join(fixturesDir, 'leo-circular.csv'));
    expect(upload.status, JSON.stringify(upload.body)).toBe(201);
    const made = await thermal.post(`/api/v1/missions/${id}/ephemerides/${upload.body.id}/cases`).send({ name: 'From the file', steps: 24 });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    await thermal.post(`/api/v1/cases/${made.body.id}/submit`).expect(200);
    const released = await owner.post(`/api/v1/cases/${made.body.id}/release`).expect(200);
    const releasedIds = (t.ctx.sqlite.prepare("SELECT id FROM load_cases WHERE mission_id = ? AND status = 'released'").all(id) as { id: string }[]).map((r) => r.id);
    expect(releasedIds).toContain(released.body.id);
    const exports = async () =>
      Promise.all(releasedIds.map(async (caseId) => (await viewer.get(`/api/v1/cases/${caseId}/export?format=json`).expect(200)).headers['x-eclipta-checksum'] as string));
    const before = await exports();

    await analyst.delete(`/api/v1/missions/${id}/ephemerides/${upload.body.id}`).expect(204);
    const detail = await analyst.get(`/api/v1/missions/${id}`).expect(200);
    for (const o of detail.body.orbits as { id: string }[]) await analyst.delete(`/api/v1/missions/${id}/orbits/${o.id}`).expect(204);
    for (const s of detail.body.surfaces as { id: string }[]) await thermal.delete(`/api/v1/missions/${id}/surfaces/${s.id}`).expect(204);
    const models = await thermal.get(`/api/v1/missions/${id}/thermal-models`).expect(200);
    for (const m of models.body.items as { id: string }[]) await thermal.delete(`/api/v1/thermal-models/${m.id}`).expect(204);

    expect(await exports()).toEqual(before);
    expect(before.every((c) => /^[0-9a-f]{64}$/.test(c))).toBe(true);
  });
});
