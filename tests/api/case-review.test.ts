// Review as engineers do it (issue 15 item 3): a reviewer returns a case in review to its author
// with a comment kept in the case's history, comments on a case in review, and releases it after
// the fix; the author is never offered what the server refuses (four eyes), and the audit log
// names the case by its name. Common practice of engineering review, no source.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let thermal: request.Agent;
let owner: request.Agent;
let viewer: request.Agent;
let caseId: string;

interface Detail {
  id: string;
  name: string;
  status: string;
  version: number;
  actions: string[];
  comments: { kind: string; text: string; revision: number; author: { name: string } | null }[];
}

beforeAll(async () => {
  t = await createTestApp();
  [thermal, owner, viewer] = await Promise.all(['thermal@kestrel.test', 'owner@kestrel.test', 'viewer@kestrel.test'].map((e) => t.signIn(e)));
  const m = t.ctx.sqlite.prepare("SELECT id FROM missions WHERE name = 'Kestrel Lunar pathfinder'").get() as { id: string };
  const orbitId = (t.ctx.sqlite.prepare('SELECT id FROM orbits WHERE mission_id = ?').get(m.id) as { id: string }).id;
  const items = (await thermal.post(`/api/v1/missions/${m.id}/cases/derive`).send({ orbitId, name: 'Review walk' }).expect(201)).body.items as Detail[];
  caseId = items[0]!.id;
});
afterAll(() => t.close());

const get = async (agent: request.Agent) => (await agent.get(`/api/v1/cases/${caseId}`).expect(200)).body as Detail;

describe('review with a way back', () => {
  it('offers the author edit, submit and comment on a draft, and only comment once it is in review (no release of their own)', async () => {
    expect((await get(thermal)).actions).toEqual(['edit', 'submit', 'comment']);
    await thermal.post(`/api/v1/cases/${caseId}/submit`).expect(200);
    expect((await get(thermal)).actions).toEqual(['comment']);
    expect((await get(owner)).actions).toEqual(['release', 'return', 'comment']);
    // What is not offered is refused.
    expect((await thermal.post(`/api/v1/cases/${caseId}/release`)).status).toBe(403);
    expect((await thermal.post(`/api/v1/cases/${caseId}/return`).send({ text: 'mine' })).status).toBe(403);
  });

  it('keeps a reviewer\'s comment on a case in review, and refuses an empty one naming the field', async () => {
    const made = await owner.post(`/api/v1/cases/${caseId}/comments`).send({ text: 'Which albedo table is this?' }).expect(201);
    expect(made.body).toMatchObject({ kind: 'comment', text: 'Which albedo table is this?', revision: 1, author: { name: expect.any(String) } });
    const empty = await owner.post(`/api/v1/cases/${caseId}/comments`).send({ text: '   ' }).expect(400);
    expect(empty.body.error.details[0].path).toBe('text');
  });

  it('returns the case to its author as a draft with the comment in its history, and audits it by name', async () => {
    const returned = (await owner.post(`/api/v1/cases/${caseId}/return`).send({ text: 'Use 30 % margin as agreed at PDR.' }).expect(200)).body as Detail;
    expect(returned.status).toBe('draft');
    expect(returned.comments.map((c) => c.kind)).toEqual(['comment', 'returned']);
    expect(returned.comments[1]!.text).toBe('Use 30 % margin as agreed at PDR.');
    const summary = (t.ctx.sqlite.prepare("SELECT summary FROM audit_events WHERE action = 'case.returned' AND target_id = ?").get(caseId) as { summary: string }).summary;
    expect(summary).toContain(`"${returned.name}" revision 1`);
    expect(summary).not.toContain(caseId);
    expect((await get(thermal)).actions).toEqual(['edit', 'submit', 'comment']);
  });

  it('lets the author fix and resubmit, and the reviewer release; the history stays, a released case takes no comments (409)', async () => {
    const draft = await get(thermal);
    await thermal.patch(`/api/v1/cases/${caseId}`).send({ version: draft.version, margins: { heatLoadPercent: 30 } }).expect(200);
    await thermal.post(`/api/v1/cases/${caseId}/comments`).send({ text: 'Margin set to 30 %.' }).expect(201);
    await thermal.post(`/api/v1/cases/${caseId}/submit`).expect(200);
    const released = (await owner.post(`/api/v1/cases/${caseId}/release`).expect(200)).body as Detail;
    expect(released.status).toBe('released');
    expect(released.comments.map((c) => c.text)).toEqual(['Which albedo table is this?', 'Use 30 % margin as agreed at PDR.', 'Margin set to 30 %.']);
    expect((await owner.post(`/api/v1/cases/${caseId}/comments`).send({ text: 'late' })).status).toBe(409);
    expect((await get(viewer)).actions).toEqual([]);
    expect((await get(owner)).actions).toEqual(['newRevision']);
  });
});
