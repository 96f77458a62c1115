// Issue 12, item 3: revisions stay in order, and one draft's concurrent edits do not silently lose
// each other. Two drafts made from the same release could both be submitted, and releasing the
// newer then the older left the older released; a PATCH overwrote whatever another engineer had
// saved in between. Now an older revision is never released over a newer one (409), and a PATCH
// that names the `version` it was made on is refused (409) when the draft has moved on.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { kestrelOne, missionIdOf } from './mission-fixtures';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let owner: request.Agent;
let thermal: request.Agent;

interface Detail {
  id: string;
  seriesId: string;
  name: string;
  status: string;
  revision: number;
  version: number;
  inputs: { margins: { heatLoadPercent: number } };
}

beforeAll(async () => {
  t = await createTestApp();
  [owner, thermal] = await Promise.all(['owner@kestrel.test', 'thermal@kestrel.test'].map((e) => t.signIn(e)));
});
afterAll(() => t.close());

const statusOf = (seriesId: string) =>
  Object.fromEntries(
    (t.ctx.sqlite.prepare('SELECT revision, status FROM load_cases WHERE series_id = ? ORDER BY revision').all(seriesId) as { revision: number; status: string }[]).map((r) => [
      r.revision,
      r.status,
    ]),
  );

/** A released case of the demo mission with a fresh series of its own: derive, submit, release. */
async function releasedCase(name: string): Promise<Detail> {
  const missionId = missionIdOf(t, kestrelOne);
  const orbitId = (t.ctx.sqlite.prepare('SELECT id FROM orbits WHERE mission_id = ? ORDER BY created_at, rowid LIMIT 1').get(missionId) as { id: string }).id;
  const derived = await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, name, steps: 24 }).expect(201);
  const hot = (derived.body.items as Detail[])[0]!;
  await thermal.post(`/api/v1/cases/${hot.id}/submit`).expect(200);
  return (await owner.post(`/api/v1/cases/${hot.id}/release`).expect(200)).body as Detail;
}

describe('releasing revisions out of order', () => {
  it('refuses to release a revision older than the released one (409); the newer stays released', async () => {
    const first = await releasedCase('Order check');
    const second = (await thermal.post(`/api/v1/cases/${first.id}/revisions`).expect(201)).body as Detail;
    const third = (await thermal.post(`/api/v1/cases/${first.id}/revisions`).expect(201)).body as Detail;
    expect([second.revision, third.revision]).toEqual([2, 3]);
    await thermal.post(`/api/v1/cases/${second.id}/submit`).expect(200);
    await thermal.post(`/api/v1/cases/${third.id}/submit`).expect(200);

    await owner.post(`/api/v1/cases/${third.id}/release`).expect(200);
    const refused = await owner.post(`/api/v1/cases/${second.id}/release`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('case_revision_out_of_order');
    expect(refused.body.error.message).toMatch(/"Order check hot" revision 2 cannot be released: revision 3 is released already and is newer/);
    expect(statusOf(first.seriesId)).toEqual({ 1: 'superseded', 2: 'review', 3: 'released' });
    const released = (await owner.get(`/api/v1/cases?status=released`).expect(200)).body.items as Detail[];
    expect(released.filter((c) => c.seriesId === first.seriesId).map((c) => c.revision)).toEqual([3]);
  });

  it('still releases them in order: the older, then the newer, each superseding the one before', async () => {
    const first = await releasedCase('In order');
    const second = (await thermal.post(`/api/v1/cases/${first.id}/revisions`).expect(201)).body as Detail;
    const third = (await thermal.post(`/api/v1/cases/${first.id}/revisions`).expect(201)).body as Detail;
    for (const c of [second, third]) await thermal.post(`/api/v1/cases/${c.id}/submit`).expect(200);
    await owner.post(`/api/v1/cases/${second.id}/release`).expect(200);
    await owner.post(`/api/v1/cases/${third.id}/release`).expect(200);
    expect(statusOf(first.seriesId)).toEqual({ 1: 'superseded', 2: 'superseded', 3: 'released' });
  });
});

describe('two engineers editing one draft', () => {
  it('refuses the edit made on a version that someone else has changed since (409 naming who), and keeps their change', async () => {
    const released = await releasedCase('Edit race');
    const draft = (await thermal.post(`/api/v1/cases/${released.id}/revisions`).expect(201)).body as Detail;
    // both open the same draft
    const seenByThermal = (await thermal.get(`/api/v1/cases/${draft.id}`).expect(200)).body as Detail;
    const seenByOwner = (await owner.get(`/api/v1/cases/${draft.id}`).expect(200)).body as Detail;
    expect(seenByOwner.version).toBe(seenByThermal.version);

    const first = await thermal.patch(`/api/v1/cases/${draft.id}`).send({ version: seenByThermal.version, name: 'Edit race, renamed' }).expect(200);
    expect(first.body.version).toBe(seenByThermal.version + 1);

    const stale = await owner.patch(`/api/v1/cases/${draft.id}`).send({ version: seenByOwner.version, margins: { heatLoadPercent: 10 } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('case_edit_conflict');
    expect(stale.body.error.message).toMatch(/changed by someone else while you edited it \(last by .+ at \d{4}-\d\d-\d\d \d\d:\d\d UTC\)/);
    expect(stale.body.error.message).toContain(`your edit was made on version ${seenByOwner.version}, it is now at version ${seenByThermal.version + 1}`);
    const now = (await owner.get(`/api/v1/cases/${draft.id}`).expect(200)).body as Detail;
    expect(now.name).toBe('Edit race, renamed');
    expect(now.inputs.margins.heatLoadPercent).toBe(seenByThermal.inputs.margins.heatLoadPercent);

    // made again on the version it now has, the edit goes through
    const again = await owner.patch(`/api/v1/cases/${draft.id}`).send({ version: now.version, margins: { heatLoadPercent: 10 } }).expect(200);
    expect(again.body).toMatchObject({ name: 'Edit race, renamed', version: now.version + 1, inputs: { margins: { heatLoadPercent: 10 } } });
  });

  it('counts a submission as a change too, and keeps PATCH without a version working for existing scripts (API.md)', async () => {
    const released = await releasedCase('Script edit');
    const draft = (await thermal.post(`/api/v1/cases/${released.id}/revisions`).expect(201)).body as Detail;
    const edited = await thermal.patch(`/api/v1/cases/${draft.id}`).send({ name: 'Script edit, no version' }).expect(200);
    expect(edited.body.version).toBe(draft.version + 1);
    const submitted = await thermal.post(`/api/v1/cases/${draft.id}/submit`).expect(200);
    expect(submitted.body.version).toBe(edited.body.version + 1);
    const bad = await thermal.patch(`/api/v1/cases/${draft.id}`).send({ version: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('version');
  });
});
