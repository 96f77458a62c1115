// The workspace overview says what needs the member (issue 15 item 7): cases waiting for their review,
// their drafts returned with a comment, the newest revisions of cases they follow, and released cases
// whose mission inputs changed since. Common practice of engineering review, no source.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let thermal: request.Agent;
let owner: request.Agent;
let viewer: request.Agent;
let workspaceId: string;
let missionId: string;
let hotId: string;
let coldId: string;

interface Summary { id: string; name: string; status: string; revision: number; author: { name: string } | null }
interface Overview {
  waitingForReview: Summary[];
  returnedToMe: { case: Summary; comment: { text: string; kind: string } }[];
  followed: Summary[];
  stale: Summary[];
}

const overviewOf = async (agent: request.Agent) => (await agent.get(`/api/v1/workspaces/${workspaceId}/overview`).expect(200)).body as Overview;
const ids = (list: Summary[]) => list.map((c) => c.id);

beforeAll(async () => {
  t = await createTestApp();
  [thermal, owner, viewer] = await Promise.all(['thermal@kestrel.test', 'owner@kestrel.test', 'viewer@kestrel.test'].map((e) => t.signIn(e)));
  const m = t.ctx.sqlite.prepare("SELECT id, workspace_id FROM missions WHERE name = 'Kestrel Lunar pathfinder'").get() as { id: string; workspace_id: string };
  missionId = m.id;
  workspaceId = m.workspace_id;
  const orbitId = (t.ctx.sqlite.prepare('SELECT id FROM orbits WHERE mission_id = ?').get(m.id) as { id: string }).id;
  const items = (await thermal.post(`/api/v1/missions/${m.id}/cases/derive`).send({ orbitId, name: 'Overview walk' }).expect(201)).body.items as Summary[];
  [hotId, coldId] = [items[0]!.id, items[1]!.id];
  await thermal.post(`/api/v1/cases/${hotId}/submit`).expect(200);
  await thermal.post(`/api/v1/cases/${coldId}/submit`).expect(200);
});
afterAll(() => t.close());

describe('what needs me', () => {
  it('lists a case in review under "waiting for my review" for a reviewer other than its author, not for the author or a viewer', async () => {
    expect(ids((await overviewOf(owner)).waitingForReview)).toEqual(expect.arrayContaining([hotId, coldId]));
    expect(ids((await overviewOf(thermal)).waitingForReview)).not.toContain(hotId);
    expect((await overviewOf(viewer)).waitingForReview).toEqual([]);
  });

  it('lists a draft returned to its author with the reviewer\'s comment, for the author only', async () => {
    await owner.post(`/api/v1/cases/${hotId}/return`).send({ text: 'Use 30 % margin as agreed at PDR.' }).expect(200);
    const mine = (await overviewOf(thermal)).returnedToMe;
    expect(mine.map((r) => r.case.id)).toEqual([hotId]);
    expect(mine[0]!.comment).toMatchObject({ kind: 'returned', text: 'Use 30 % margin as agreed at PDR.' });
    expect((await overviewOf(owner)).returnedToMe).toEqual([]);
    expect(ids((await overviewOf(owner)).waitingForReview)).not.toContain(hotId);
  });

  it('lists the newest revisions of the cases I follow, a release first, and nothing of cases I do not follow', async () => {
    await owner.post(`/api/v1/cases/${coldId}/release`).expect(200);
    expect(ids((await overviewOf(viewer)).followed)).not.toContain(coldId);
    await viewer.post(`/api/v1/cases/${coldId}/subscription`).expect(200);
    const followed = (await overviewOf(viewer)).followed;
    expect(followed.map((c) => [c.id, c.status])[0]).toEqual([coldId, 'released']);
    const second = (await thermal.post(`/api/v1/cases/${coldId}/revisions`).send({ reason: 'Radiator grew' }).expect(201)).body as Summary;
    await thermal.post(`/api/v1/cases/${coldId}/subscription`).expect(200);
    const thermalFollowed = (await overviewOf(thermal)).followed;
    expect(ids(thermalFollowed).slice(0, 2)).toEqual([second.id, coldId]);
  });

  it('lists a released case as stale once a mission input it was made from changed', async () => {
    expect(ids((await overviewOf(viewer)).stale)).not.toContain(coldId);
    const surface = t.ctx.sqlite.prepare('SELECT id, area_m2 FROM surfaces WHERE mission_id = ? LIMIT 1').get(missionId) as { id: string; area_m2: number };
    t.ctx.sqlite.prepare('UPDATE surfaces SET area_m2 = ? WHERE id = ?').run(surface.area_m2 * 1.25, surface.id);
    expect(ids((await overviewOf(viewer)).stale)).toContain(coldId);
    expect(ids((await overviewOf(owner)).stale)).toContain(coldId);
  });
});
