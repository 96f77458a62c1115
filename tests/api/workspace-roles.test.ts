// What each role may do with members, invitations and the audit log, and workspace isolation
// (PRODUCT.md "Users and roles"; shared/api/workspaces.ts route list).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { createTestApp, userIdOf, workspaceIdOf, type TestApp } from './test-app';

let t: TestApp;
let kestrel: string;
const agents: Record<string, request.Agent> = {};

beforeAll(async () => {
  t = await createTestApp();
  kestrel = workspaceIdOf(t, 'Kestrel');
  for (const email of ['owner@kestrel.test', 'analyst@kestrel.test', 'thermal@kestrel.test', 'viewer@kestrel.test', 'owner@plover.test']) {
    agents[email] = await t.signIn(email);
  }
});
afterAll(async () => {
  await t.close();
});

const as = (email: string): request.Agent => {
  const agent = agents[email];
  if (!agent) throw new Error(`no agent for ${email}`);
  return agent;
};

describe('GET workspaces', () => {
  it('lists only the caller’s workspaces with their role', async () => {
    const res = await as('thermal@kestrel.test').get('/api/v1/workspaces');
    expect(res.body.items).toEqual([{ id: kestrel, name: 'Kestrel', role: 'thermal' }]);
    const plover = await as('owner@plover.test').get('/api/v1/workspaces');
    expect(plover.body.items.map((w: { name: string }) => w.name)).toEqual(['Plover']);
  });
});

describe('members', () => {
  it('may be listed by every role', async () => {
    for (const email of ['owner@kestrel.test', 'analyst@kestrel.test', 'thermal@kestrel.test', 'viewer@kestrel.test']) {
      const res = await as(email).get(`/api/v1/workspaces/${kestrel}/members`);
      expect(res.status).toBe(200);
      expect(res.body.items).toHaveLength(4);
    }
  });

  it('may have their role changed and be removed only by an owner (403 naming the role otherwise)', async () => {
    const viewerId = userIdOf(t, 'viewer@kestrel.test');
    // The message names roles as people say them (roleLabels), never their identifiers.
    for (const [role, label] of [['analyst', 'Mission analyst'], ['thermal', 'Thermal engineer'], ['viewer', 'Viewer']]) {
      const email = `${role}@kestrel.test`;
      const patch = await as(email).patch(`/api/v1/workspaces/${kestrel}/members/${viewerId}`).send({ role: 'analyst' });
      expect(patch.status).toBe(403);
      expect(patch.body.error.message).toBe(`Your role in this workspace is ${label}; this needs the Owner role.`);
      expect((await as(email).delete(`/api/v1/workspaces/${kestrel}/members/${viewerId}`)).status).toBe(403);
    }
    const changed = await as('owner@kestrel.test').patch(`/api/v1/workspaces/${kestrel}/members/${viewerId}`).send({ role: 'analyst' });
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ userId: viewerId, email: 'viewer@kestrel.test', role: 'analyst' });
    const back = await as('owner@kestrel.test').patch(`/api/v1/workspaces/${kestrel}/members/${viewerId}`).send({ role: 'viewer' });
    expect(back.body.role).toBe('viewer');
  });

  it('refuses an unknown role, naming the field and the value', async () => {
    const viewerId = userIdOf(t, 'viewer@kestrel.test');
    const res = await as('owner@kestrel.test').patch(`/api/v1/workspaces/${kestrel}/members/${viewerId}`).send({ role: 'admiral' });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('role');
    expect(res.body.error.details[0].message).toContain('"admiral"');
  });

  it('refuses to demote or remove the last owner (409)', async () => {
    const ownerId = userIdOf(t, 'owner@kestrel.test');
    const demote = await as('owner@kestrel.test').patch(`/api/v1/workspaces/${kestrel}/members/${ownerId}`).send({ role: 'viewer' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.message).toBe('A workspace needs at least one owner.');
    expect((await as('owner@kestrel.test').delete(`/api/v1/workspaces/${kestrel}/members/${ownerId}`)).status).toBe(409);
    const members = await as('owner@kestrel.test').get(`/api/v1/workspaces/${kestrel}/members`);
    expect(members.body.items.find((m: { userId: string }) => m.userId === ownerId).role).toBe('owner');
  });
});

describe('invitations and audit', () => {
  it('are the owner’s only', async () => {
    for (const role of ['analyst', 'thermal', 'viewer']) {
      const email = `${role}@kestrel.test`;
      expect((await as(email).get(`/api/v1/workspaces/${kestrel}/invitations`)).status).toBe(403);
      expect((await as(email).post(`/api/v1/workspaces/${kestrel}/invitations`).send({ email: 'x@kestrel.test', role: 'viewer' })).status).toBe(403);
      expect((await as(email).get(`/api/v1/workspaces/${kestrel}/audit`)).status).toBe(403);
    }
    expect((await as('owner@kestrel.test').get(`/api/v1/workspaces/${kestrel}/invitations`)).status).toBe(200);
  });

  it('shows the owner the role changes made above, with filters', async () => {
    const res = await as('owner@kestrel.test').get(`/api/v1/workspaces/${kestrel}/audit?action=member.role_changed`);
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(2);
    expect(res.body.items[0]).toMatchObject({
      actorEmail: 'owner@kestrel.test',
      action: 'member.role_changed',
      summary: 'Role of viewer@kestrel.test changed from Mission analyst to Viewer.',
    });
    const byOther = await as('owner@kestrel.test').get(`/api/v1/workspaces/${kestrel}/audit?actor=analyst@kestrel.test`);
    expect(byOther.body.total).toBe(0);
    const bad = await as('owner@kestrel.test').get(`/api/v1/workspaces/${kestrel}/audit?limit=0`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('limit');
  });

  it('lists events of one millisecond newest first too (one transaction writes several; common practice, no source)', async () => {
    // The two role changes above, put in the same millisecond, the older with the larger (random) id:
    // ordered by id the older came first.
    const changes = t.ctx.sqlite.prepare("SELECT rowid FROM audit_events WHERE action = 'member.role_changed' ORDER BY rowid").all() as { rowid: number }[];
    expect(changes).toHaveLength(2);
    const set = t.ctx.sqlite.prepare("UPDATE audit_events SET at = '2027-01-01T00:00:00.000Z', id = ? WHERE rowid = ?");
    set.run('ffffffff-ffff-4fff-bfff-ffffffffffff', changes[0]!.rowid);
    set.run('00000000-0000-4000-8000-000000000000', changes[1]!.rowid);
    const res = await as('owner@kestrel.test').get(`/api/v1/workspaces/${kestrel}/audit?action=member.role_changed`);
    expect(res.body.items.map((e: { summary: string }) => e.summary)).toEqual([
      'Role of viewer@kestrel.test changed from Mission analyst to Viewer.',
      'Role of viewer@kestrel.test changed from Viewer to Mission analyst.',
    ]);
  });
});

describe('isolation', () => {
  it('answers 404, never 403, to a non-member on every Kestrel route', async () => {
    const plover = as('owner@plover.test');
    const anyUser = userIdOf(t, 'analyst@kestrel.test');
    const answers = [
      await plover.get(`/api/v1/workspaces/${kestrel}/members`),
      await plover.patch(`/api/v1/workspaces/${kestrel}/members/${anyUser}`).send({ role: 'viewer' }),
      await plover.delete(`/api/v1/workspaces/${kestrel}/members/${anyUser}`),
      await plover.get(`/api/v1/workspaces/${kestrel}/invitations`),
      await plover.post(`/api/v1/workspaces/${kestrel}/invitations`).send({ email: 'spy@plover.test', role: 'owner' }),
      await plover.delete(`/api/v1/workspaces/${kestrel}/invitations/${anyUser}`),
      await plover.get(`/api/v1/workspaces/${kestrel}/audit`),
    ];
    for (const res of answers) {
      expect(res.status).toBe(404);
      expect(res.body.error.message).toBe(`No workspace with id "${kestrel}".`);
    }
    // Nothing changed for the analyst.
    const members = await as('owner@kestrel.test').get(`/api/v1/workspaces/${kestrel}/members`);
    expect(members.body.items.map((m: { email: string }) => m.email)).toContain('analyst@kestrel.test');
  });

  it('answers a non-existent workspace exactly like another team’s', async () => {
    const res = await as('owner@plover.test').get('/api/v1/workspaces/does-not-exist/members');
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('No workspace with id "does-not-exist".');
  });
});
