// Missions through the API: listing across workspaces, create/patch/archive/delete, roles, isolation
// between workspaces, the audit trail and a change of body that moves the orbits (shared/api/missions.ts).
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mission, missionDetail } from '../../shared/api/missions';
import { addTwoWorkspaceUser, auditFor, countRows, kestrelLunar, kestrelOne, missionIdOf, ploverRelay, tokenOf } from './mission-fixtures';
import { createTestApp, workspaceIdOf, type TestApp } from './test-app';

let t: TestApp;
let analyst: request.Agent;
let viewer: request.Agent;
let plover: request.Agent;
let owner: request.Agent;

beforeAll(async () => {
  t = await createTestApp();
  [analyst, viewer, plover, owner] = await Promise.all(
    ['analyst@kestrel.test', 'viewer@kestrel.test', 'owner@plover.test', 'owner@kestrel.test'].map((e) => t.signIn(e)),
  );
});
afterAll(() => t.close());

const newMission = { name: 'Test cubesat', bodyId: 'earth', startDate: '2028-01-01', endDate: '2029-01-01' };

describe('GET /api/v1/missions', () => {
  it("lists the caller's workspaces' missions only, each in the mission shape", async () => {
    const kestrel = await viewer.get('/api/v1/missions').expect(200);
    const names = (kestrel.body.items as { name: string }[]).map((m) => m.name);
    expect(names).toEqual(expect.arrayContaining([kestrelOne, kestrelLunar]));
    expect(names).not.toContain(ploverRelay);
    for (const item of kestrel.body.items) expect(mission.safeParse(item).success).toBe(true);

    const own = await plover.get('/api/v1/missions').expect(200);
    expect((own.body.items as { name: string }[]).map((m) => m.name)).toEqual([ploverRelay]);
  });

  it('refuses a malformed includeArchived naming the value', async () => {
    const res = await viewer.get('/api/v1/missions?includeArchived=yes').expect(400);
    expect(res.body.error.message).toMatch(/includeArchived.*"yes"/);
  });
});

describe('GET /api/v1/missions/:id', () => {
  it('answers the detail with orbits and surfaces to any member', async () => {
    const res = await viewer.get(`/api/v1/missions/${missionIdOf(t, kestrelOne)}`).expect(200);
    // In the order they were added (the seed adds them within one millisecond).
    expect(missionDetail.parse(res.body).orbits.map((o) => o.name)).toEqual(['Parking after separation', 'Operational SSO 540 km', 'Disposal (perigee lowered)']);
    expect(res.body.surfaces.length).toBeGreaterThanOrEqual(4);
  });

  it("is 404 for another workspace's mission on every verb, as for a missing one", async () => {
    const id = missionIdOf(t, kestrelOne);
    for (const res of [
      await plover.get(`/api/v1/missions/${id}`),
      await plover.patch(`/api/v1/missions/${id}`).send({ name: 'taken' }),
      await plover.delete(`/api/v1/missions/${id}`),
      await plover.get(`/api/v1/missions/${id}/orbits`),
      await plover.get(`/api/v1/missions/${id}/surfaces`),
    ]) {
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('not_found');
    }
    const missing = await plover.get('/api/v1/missions/00000000-0000-4000-8000-000000000000').expect(404);
    expect(missing.body.error.message).toBe(`No mission with id "00000000-0000-4000-8000-000000000000".`);
    expect(countRows(t, 'missions', 'name = ?', kestrelOne)).toBe(1);
  });
});

describe('POST /api/v1/missions', () => {
  it('creates in the only workspace of the caller and writes an audit event naming it', async () => {
    const res = await analyst.post('/api/v1/missions').send(newMission).expect(201);
    expect(mission.parse(res.body)).toMatchObject({ ...newMission, workspaceId: workspaceIdOf(t, 'Kestrel'), archived: false, crewed: false, description: '' });
    const events = auditFor(t, res.body.id);
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ action: 'mission.created', workspace_id: workspaceIdOf(t, 'Kestrel') });
    expect(events[0]?.summary).toContain('"Test cubesat"');
  });

  it('asks a member of two workspaces which one, naming them', async () => {
    addTwoWorkspaceUser(t, 'two@kestrel.test');
    const two = await t.signIn('two@kestrel.test');
    const res = await two.post('/api/v1/missions').send(newMission).expect(400);
    expect(res.body.error.details[0].path).toBe('workspaceId');
    expect(res.body.error.message).toContain('Kestrel');
    expect(res.body.error.message).toContain('Plover');
    // Named, it works where the role allows and is refused where it does not.
    await two.post('/api/v1/missions').send({ ...newMission, name: 'Two', workspaceId: workspaceIdOf(t, 'Kestrel') }).expect(201);
    const refused = await two.post('/api/v1/missions').send({ ...newMission, workspaceId: workspaceIdOf(t, 'Plover') }).expect(403);
    expect(refused.body.error.message).toMatch(/Viewer/);
  });

  it('is 404 for a workspace the caller is not in', async () => {
    await plover.post('/api/v1/missions').send({ ...newMission, workspaceId: workspaceIdOf(t, 'Kestrel') }).expect(404);
  });

  it('refuses a viewer and a read-only token with 403, writing nothing', async () => {
    const before = countRows(t, 'missions');
    const res = await viewer.post('/api/v1/missions').send(newMission).expect(403);
    expect(res.body.error.message).toMatch(/Viewer/);
    const token = await tokenOf(analyst, true);
    await request(t.app).get('/api/v1/missions').set('Authorization', `Bearer ${token}`).expect(200);
    const byToken = await request(t.app).post('/api/v1/missions').set('Authorization', `Bearer ${token}`).send(newMission).expect(403);
    expect(byToken.body.error.code).toBe('read_only_token');
    expect(countRows(t, 'missions')).toBe(before);
  });

  it.each([
    [{ ...newMission, bodyId: 'pluto' }, 'bodyId', /"pluto"/],
    [{ ...newMission, endDate: '2027-01-01' }, 'endDate', /ends before it starts/],
    [{ ...newMission, startDate: '2028-13-01' }, 'startDate', /"2028-13-01"/],
    [{ ...newMission, name: '  ' }, 'name', /mission name/],
    [{ ...newMission, colour: 'red' }, undefined, /"colour"/],
  ])('answers 400 naming the field and value (%#)', async (body, path, message) => {
    const res = await analyst.post('/api/v1/missions').send(body).expect(400);
    expect(res.body.error.details[0].path).toBe(path);
    expect(res.body.error.message).toMatch(message);
  });
});

describe('PATCH /api/v1/missions/:id', () => {
  it('archives (hidden from the list unless asked) and un-archives, each audited', async () => {
    const { body: created } = await analyst.post('/api/v1/missions').send({ ...newMission, name: 'To archive' }).expect(201);
    const archived = await analyst.patch(`/api/v1/missions/${created.id}`).send({ archived: true }).expect(200);
    expect(archived.body.archived).toBe(true);
    const listed = await viewer.get('/api/v1/missions').expect(200);
    expect((listed.body.items as { id: string }[]).map((m) => m.id)).not.toContain(created.id);
    const all = await viewer.get('/api/v1/missions?includeArchived=true').expect(200);
    expect((all.body.items as { id: string }[]).map((m) => m.id)).toContain(created.id);
    await analyst.patch(`/api/v1/missions/${created.id}`).send({ archived: false }).expect(200);
    expect(auditFor(t, created.id).map((e) => e.action)).toEqual(['mission.created', 'mission.archived', 'mission.unarchived']);
  });

  it('names the fields that changed in the audit summary', async () => {
    const { body: created } = await analyst.post('/api/v1/missions').send({ ...newMission, name: 'Renamed later' }).expect(201);
    await analyst.patch(`/api/v1/missions/${created.id}`).send({ name: 'Renamed', endDate: '2030-06-30' }).expect(200);
    const summary = auditFor(t, created.id).at(-1)?.summary ?? '';
    expect(summary).toContain('name "Renamed later" -> "Renamed"');
    expect(summary).toContain('endDate "2029-01-01" -> "2030-06-30"');
  });

  it('refuses an end before the stored start, naming endDate', async () => {
    const res = await analyst.patch(`/api/v1/missions/${missionIdOf(t, kestrelLunar)}`).send({ endDate: '2020-01-01' }).expect(400);
    expect(res.body.error.details[0].path).toBe('endDate');
    expect(res.body.error.message).toContain('2020-01-01');
  });

  it('is 403 for a viewer', async () => {
    await viewer.patch(`/api/v1/missions/${missionIdOf(t, kestrelLunar)}`).send({ archived: true }).expect(403);
  });

  it('moves the orbits to a new body, or refuses the whole change when one cannot fit', async () => {
    const { body: created } = await analyst.post('/api/v1/missions').send({ ...newMission, name: 'Body swap' }).expect(201);
    const { body: low } = await analyst
      .post(`/api/v1/missions/${created.id}/orbits`)
      .send({ name: 'low', epoch: '2028-01-01T00:00:00Z', periapsisAltitudeKm: '100 km', apoapsisAltitudeKm: '100 km' })
      .expect(201);
    await analyst.patch(`/api/v1/missions/${created.id}`).send({ bodyId: 'moon' }).expect(200);
    const moved = await analyst.get(`/api/v1/missions/${created.id}/orbits/${low.id}`).expect(200);
    // Altitudes typed stay altitudes: a = R_moon + 100 km, with R_moon from the body catalogue.
    const moon = ((await analyst.get('/api/v1/bodies')).body as { id: string; radiusKm: number }[]).find((b) => b.id === 'moon');
    expect(moved.body.semiMajorAxisKm).toBeCloseTo((moon?.radiusKm ?? 0) + 100, 6);
    expect(moved.body.periapsisAltitudeKm).toBeCloseTo(100, 6);

    // 2.5 h fits the Moon (shortest orbit about 1.8 h) but not Jupiter (about 3 h): 2 pi sqrt(R^3 / GM).
    await analyst.post(`/api/v1/missions/${created.id}/orbits`).send({ name: 'by period', epoch: '2028-01-01T00:00:00Z', periodS: '2.5 h', eccentricity: 0 }).expect(201);
    const refused = await analyst.patch(`/api/v1/missions/${created.id}`).send({ bodyId: 'jupiter', name: 'never' }).expect(422);
    expect(refused.body.error.message).toContain('"by period"');
    const after = await analyst.get(`/api/v1/missions/${created.id}`).expect(200);
    expect(after.body).toMatchObject({ bodyId: 'moon', name: 'Body swap' });
    expect(after.body.orbits.find((o: { id: string }) => o.id === low.id).semiMajorAxisKm).toBeCloseTo(moved.body.semiMajorAxisKm, 9);
  });
});

describe('DELETE /api/v1/missions/:id', () => {
  it('removes the mission with its orbits and surfaces, audited; only the owner may (mission-delete.test.ts has released cases)', async () => {
    const id = missionIdOf(t, kestrelLunar);
    expect(countRows(t, 'orbits', 'mission_id = ?', id)).toBeGreaterThan(0);
    await viewer.delete(`/api/v1/missions/${id}`).expect(403);
    await analyst.delete(`/api/v1/missions/${id}`).expect(403);
    await owner.delete(`/api/v1/missions/${id}`).expect(204);
    expect(countRows(t, 'orbits', 'mission_id = ?', id)).toBe(0);
    expect(countRows(t, 'surfaces', 'mission_id = ?', id)).toBe(0);
    await analyst.get(`/api/v1/missions/${id}`).expect(404);
    const event = auditFor(t, id).at(-1);
    expect(event?.action).toBe('mission.deleted');
    expect(event?.summary).toMatch(/Kestrel Lunar pathfinder.* 1 orbit, 5 surfaces,/);
  });
});
