// Load cases through the API: derive, edit, review, four-eyes release, the 409 on released
// revisions, new revisions and the subscribers' mail, roles, and another workspace seeing nothing.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, publicUrl, workspaceIdOf, type TestApp } from './test-app';

let t: TestApp;
let thermal: request.Agent;
let owner: request.Agent;
let analyst: request.Agent;
let viewer: request.Agent;
let plover: request.Agent;
let missionId: string;
let orbitId: string;

beforeAll(async () => {
  t = await createTestApp();
  [thermal, owner, analyst, viewer, plover] = await Promise.all(
    ['thermal@kestrel.test', 'owner@kestrel.test', 'analyst@kestrel.test', 'viewer@kestrel.test', 'owner@plover.test'].map((e) => t.signIn(e)),
  );
  const m = t.ctx.sqlite.prepare("SELECT id FROM missions WHERE name = 'Kestrel Lunar pathfinder'").get() as { id: string };
  missionId = m.id;
  orbitId = (t.ctx.sqlite.prepare('SELECT id FROM orbits WHERE mission_id = ?').get(missionId) as { id: string }).id;
});
afterAll(() => t.close());

interface Detail {
  id: string;
  seriesId: string;
  name: string;
  kind: string;
  status: string;
  revision: number;
  checksum: string | null;
  updatedAt: string;
  releasedBy: { email: string } | null;
  inputs: { rationale: string[]; conditions: { betaDeg: number; properties: string }; margins: { heatLoadPercent: number; sources: { heatLoadPercent: string } } };
  results: { betaDeg: number; surfaces: { name: string; orbitAverage: { absorbedW: number } }[] };
}

const auditActions = (caseId: string) =>
  (t.ctx.sqlite.prepare('SELECT action FROM audit_events WHERE target_id = ? ORDER BY at, rowid').all(caseId) as { action: string }[]).map((r) => r.action);

describe('deriving cases', () => {
  it('gives a thermal engineer the hot and the cold draft, each with its rationale, and audits it', async () => {
    const res = await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, name: 'Lunar polar' }).expect(201);
    const items = res.body.items as Detail[];
    expect(items.map((c) => [c.name, c.kind, c.status, c.revision])).toEqual([
      ['Lunar polar hot', 'hot', 'draft', 1],
      ['Lunar polar cold', 'cold', 'draft', 1],
    ]);
    expect(items[0]?.inputs.conditions.properties).toBe('eol');
    expect(items[1]?.inputs.conditions.properties).toBe('bol');
    expect(items[0]?.inputs.rationale[0]).toMatch(/^solar flux \d+ W\/m² at [\d.]+ AU/);
    // Margins default to MIL-STD-1540's 25 % and say so (Gilmore ch. 19)
    expect(items[0]?.inputs.margins.heatLoadPercent).toBe(25);
    expect(items[0]?.inputs.margins.sources.heatLoadPercent).toMatch(/MIL-STD-1540/);
    expect(auditActions(items[0]!.id)).toEqual(['case.derived']);
  });

  it('refuses analysts and viewers (403) and hides the mission from another workspace (404)', async () => {
    expect((await analyst.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId })).status).toBe(403);
    expect((await viewer.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId })).status).toBe(403);
    expect((await plover.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId })).status).toBe(404);
  });

  it('names the field and the value of bad input (400)', async () => {
    const res = await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, margins: { heatLoadPercent: -5 } }).expect(400);
    expect(res.body.error.details[0].path).toBe('margins.heatLoadPercent');
    expect(res.body.error.details[0].message).toMatch(/-5/);
  });

  it('saves a custom case at a fixed beta and date', async () => {
    const res = await thermal
      .post(`/api/v1/missions/${missionId}/cases`)
      .send({ orbitId, name: 'Noon-midnight at beta 0', date: '2028-09-01', betaDeg: 0, properties: 'eol', normals: { 'Zenith radiator': 'sun' } })
      .expect(201);
    expect(res.body.kind).toBe('custom');
    expect(res.body.results.betaDeg).toBeCloseTo(0, 6);
    expect(res.body.inputs.attitude).toMatch(/Zenith radiator pointed at the Sun/);
  });
});

describe('a case from draft to release', () => {
  let hot: Detail;

  beforeAll(async () => {
    const res = await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, name: 'Lifecycle' }).expect(201);
    hot = (res.body.items as Detail[])[0]!;
  });

  it('lets the author edit a draft; the results are computed again', async () => {
    const res = await thermal.patch(`/api/v1/cases/${hot.id}`).send({ name: 'Lifecycle hot (beta 30)', inputs: { betaDeg: 30 } }).expect(200);
    expect(res.body.name).toBe('Lifecycle hot (beta 30)');
    expect(res.body.results.betaDeg).toBeCloseTo(30, 3);
    expect(res.body.inputs.rationale.at(-1)).toMatch(/changed by hand after the case was made: beta$/);
    expect(res.body.inputs.rationale.join('\n')).toMatch(/^beta 30\.0 deg on \d{4}-\d\d-\d\d with an eclipse [\d.]+ min, [\d.]+ W orbit-average absorbed: conditions changed by hand/m);
  });

  it('hides drafts from viewers and refuses their changes', async () => {
    expect((await viewer.get(`/api/v1/cases/${hot.id}`)).status).toBe(404);
    const list = await viewer.get('/api/v1/cases').expect(200);
    expect((list.body.items as Detail[]).every((c) => c.status === 'released' || c.status === 'superseded')).toBe(true);
    expect((list.body.items as Detail[]).length).toBeGreaterThanOrEqual(3);
  });

  it('goes to review, where it cannot be edited (409)', async () => {
    await thermal.post(`/api/v1/cases/${hot.id}/submit`).expect(200);
    const res = await thermal.patch(`/api/v1/cases/${hot.id}`).send({ name: 'late change' }).expect(409);
    expect(res.body.error.message).toMatch(/in review/);
  });

  it('cannot be released by its own author (four eyes, 403) nor by an analyst', async () => {
    const res = await thermal.post(`/api/v1/cases/${hot.id}/release`).expect(403);
    expect(res.body.error.code).toBe('four_eyes');
    expect(res.body.error.message).toMatch(/another thermal engineer or owner must release it/);
    expect((await analyst.post(`/api/v1/cases/${hot.id}/release`)).status).toBe(403);
  });

  it('is released by the owner with a checksum, who and when', async () => {
    const res = await owner.post(`/api/v1/cases/${hot.id}/release`).expect(200);
    expect(res.body.status).toBe('released');
    expect(res.body.checksum).toMatch(/^[0-9a-f]{64}$/);
    expect(res.body.releasedBy.email).toBe('owner@kestrel.test');
    expect(Date.parse(res.body.releasedAt)).toBeGreaterThan(Date.now() - 60_000);
    expect(auditActions(hot.id)).toEqual(['case.derived', 'case.edited', 'case.submitted', 'case.released']);
  });

  it('answers 409 to any change of the released revision and changes nothing; a viewer gets 403', async () => {
    const before = (await thermal.get(`/api/v1/cases/${hot.id}`).expect(200)).body as Detail;
    const res = await thermal.patch(`/api/v1/cases/${hot.id}`).send({ name: 'renamed', inputs: { betaDeg: 10 } }).expect(409);
    expect(res.body.error.message).toMatch(/released and cannot change/);
    expect((await thermal.post(`/api/v1/cases/${hot.id}/submit`)).status).toBe(409);
    expect((await viewer.patch(`/api/v1/cases/${hot.id}`).send({ name: 'x' })).status).toBe(403);
    expect((await viewer.post(`/api/v1/cases/${hot.id}/revisions`)).status).toBe(403);
    const after = (await thermal.get(`/api/v1/cases/${hot.id}`).expect(200)).body as Detail;
    expect(after).toEqual(before);
  });

  it('mails subscribers the orbit-average differences when a new revision is released, and supersedes the old one', async () => {
    await viewer.post(`/api/v1/cases/${hot.id}/subscription`).expect(200, { subscribed: true });
    const rev2 = (await thermal.post(`/api/v1/cases/${hot.id}/revisions`).expect(201)).body as Detail;
    expect([rev2.revision, rev2.status, rev2.seriesId]).toEqual([2, 'draft', hot.seriesId]);
    await thermal.patch(`/api/v1/cases/${rev2.id}`).send({ inputs: { betaDeg: 60 } }).expect(200);
    await thermal.post(`/api/v1/cases/${rev2.id}/submit`).expect(200);
    const released = (await owner.post(`/api/v1/cases/${rev2.id}/release`).expect(200)).body as Detail;

    const old = (await viewer.get(`/api/v1/cases/${hot.id}`).expect(200)).body as Detail;
    expect(old.status).toBe('superseded');
    const mail = await t.waitForMail('viewer@kestrel.test', 'revision 2 released');
    const workspaceId = workspaceIdOf(t, 'Kestrel');
    expect(mail.text).toContain(`${publicUrl}/w/${workspaceId}/cases/${rev2.id}`);
    expect(mail.text).toContain('beta: 30.0 deg -> 60.0 deg');
    const first = released.results.surfaces[0]!;
    const was = old.results.surfaces.find((s) => s.name === first.name)!;
    const diff = first.orbitAverage.absorbedW - was.orbitAverage.absorbedW;
    expect(mail.text).toContain(`${first.name}: ${was.orbitAverage.absorbedW.toFixed(1)} W -> ${first.orbitAverage.absorbedW.toFixed(1)} W (${diff >= 0 ? '+' : '-'}${Math.abs(diff).toFixed(1)} W)`);
  });

  it('compares two revisions: inputs and per-surface orbit averages with their differences', async () => {
    const list = (await thermal.get(`/api/v1/cases?missionId=${missionId}`).expect(200)).body.items as Detail[];
    const rev2 = list.find((c) => c.seriesId === hot.seriesId && c.revision === 2)!;
    const res = await viewer.get(`/api/v1/cases/${hot.id}/compare?with=${rev2.id}`).expect(200);
    const beta = (res.body.inputs as { path: string; a: unknown; b: unknown; changed: boolean }[]).find((i) => i.path === 'conditions.betaDeg');
    expect(beta).toEqual({ path: 'conditions.betaDeg', a: 30, b: 60, changed: true });
    // Asked the other way round, A is still the older revision: differences are new - old.
    const reversed = await viewer.get(`/api/v1/cases/${rev2.id}/compare?with=${hot.id}`).expect(200);
    expect([reversed.body.a.revision, reversed.body.b.revision]).toEqual([1, 2]);
    const s = res.body.surfaces[0];
    expect(s.absorbedW.difference).toBeCloseTo(s.absorbedW.b - s.absorbedW.a, 3);
  });

  it('filters the library by status', async () => {
    const res = await thermal.get('/api/v1/cases?status=superseded').expect(200);
    expect((res.body.items as Detail[]).map((c) => c.status)).not.toContain('draft');
    expect((res.body.items as Detail[]).some((c) => c.id === hot.id)).toBe(true);
    expect((await thermal.get('/api/v1/cases?status=final')).status).toBe(400);
  });
});

describe('another workspace', () => {
  it('sees none of Kestrel’s cases, by list or by id', async () => {
    const kestrelIds = (await owner.get('/api/v1/cases').expect(200)).body.items.map((c: Detail) => c.id) as string[];
    expect(kestrelIds.length).toBeGreaterThan(0);
    const theirs = (await plover.get('/api/v1/cases').expect(200)).body.items as Detail[];
    expect(theirs.filter((c) => kestrelIds.includes(c.id))).toEqual([]);
    for (const path of ['', '/export?format=json', '/export?format=csv', `/compare?with=${kestrelIds[1]}`]) {
      expect((await plover.get(`/api/v1/cases/${kestrelIds[0]}${path}`)).status).toBe(404);
    }
    expect((await plover.post(`/api/v1/cases/${kestrelIds[0]}/subscription`)).status).toBe(404);
  });
});
