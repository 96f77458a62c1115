// Invitations through the real fake SMTP server: the mail's link is the only way in.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, demoPassword, linkToken, workspaceIdOf, type TestApp } from './test-app';
import { cautionText } from '../../shared/api/caution';

let t: TestApp;
let owner: request.Agent;
let kestrel: string;
beforeAll(async () => {
  t = await createTestApp();
  owner = await t.signIn('owner@kestrel.test');
  kestrel = workspaceIdOf(t, 'Kestrel');
});
afterAll(async () => {
  await t.close();
});

describe('inviting a new person', () => {
  let token = '';

  it('creates the invitation and mails a link to the client’s /invite route', async () => {
    const res = await owner.post(`/api/v1/workspaces/${kestrel}/invitations`).send({ email: 'New.Engineer@Kestrel.test', role: 'thermal' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: 'new.engineer@kestrel.test', role: 'thermal', invitedBy: 'Ines Varga', acceptedAt: null });
    const days = (Date.parse(res.body.expiresAt) - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.99);
    expect(days).toBeLessThan(7.01);
    const mail = await t.waitForMail('new.engineer@kestrel.test', 'Kestrel');
    expect(mail.from).toBe('no-reply@eclipta.local');
    // the preliminary-design caution, as in every mail (DOMAIN.md)
    expect(mail.text).toContain(cautionText);
    expect(mail.text).toContain('with the role Thermal engineer.'); // the role as people say it, not its identifier
    token = linkToken(mail.text, 'invite');
    // Only the hash is stored.
    expect(t.ctx.sqlite.prepare('SELECT count(*) AS n FROM invitations WHERE token_hash = ?').get(token)).toEqual({ n: 0 });
  });

  it('shows a preview without sign-in', async () => {
    const res = await request(t.app).get(`/api/v1/invitations/${token}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ email: 'new.engineer@kestrel.test', workspaceName: 'Kestrel', role: 'thermal', existingUser: false });
  });

  it('needs a name for a new account', async () => {
    const res = await request(t.app).post(`/api/v1/invitations/${token}/accept`).send({ password: 'a-long-new-password' });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('name');
  });

  it('creates the account, adds the membership and signs the new user in; the link then stops working', async () => {
    const agent = request.agent(t.app);
    const res = await agent.post(`/api/v1/invitations/${token}/accept`).send({ name: 'Noor Hallam', password: 'a-long-new-password' });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: 'new.engineer@kestrel.test', name: 'Noor Hallam' });
    expect(res.body.workspaces).toEqual([{ workspaceId: kestrel, workspaceName: 'Kestrel', role: 'thermal' }]);
    expect((await agent.get('/api/v1/auth/me')).status).toBe(200);
    const again = await request(t.app).post(`/api/v1/invitations/${token}/accept`).send({ name: 'X', password: 'a-long-new-password' });
    expect(again.status).toBe(404);
    const fresh = await t.signIn('new.engineer@kestrel.test', 'a-long-new-password');
    expect((await fresh.get(`/api/v1/workspaces/${kestrel}/members`)).status).toBe(200);
    const audit = await owner.get(`/api/v1/workspaces/${kestrel}/audit?action=member.joined`);
    expect(audit.body.items[0].summary).toBe('new.engineer@kestrel.test accepted the invitation and joined as Thermal engineer.');
  });
});

describe('inviting someone who already has an account', () => {
  it('asks for that account’s password, then adds the membership', async () => {
    const res = await owner.post(`/api/v1/workspaces/${kestrel}/invitations`).send({ email: 'owner@plover.test', role: 'viewer' });
    expect(res.status).toBe(201);
    const token = linkToken((await t.waitForMail('owner@plover.test', 'Kestrel')).text, 'invite');
    expect((await request(t.app).get(`/api/v1/invitations/${token}`)).body.existingUser).toBe(true);
    const wrong = await request(t.app).post(`/api/v1/invitations/${token}/accept`).send({ password: 'not-my-password' });
    expect(wrong.status).toBe(401);
    const ok = await request(t.app).post(`/api/v1/invitations/${token}/accept`).send({ password: demoPassword });
    expect(ok.status).toBe(200);
    expect(ok.body.workspaces.map((w: { workspaceName: string; role: string }) => `${w.workspaceName}:${w.role}`)).toEqual([
      'Kestrel:viewer',
      'Plover:owner',
    ]);
  });

  it('refuses to invite a current member (409) and an address that is not one (400 naming it)', async () => {
    expect((await owner.post(`/api/v1/workspaces/${kestrel}/invitations`).send({ email: 'analyst@kestrel.test', role: 'viewer' })).status).toBe(409);
    const bad = await owner.post(`/api/v1/workspaces/${kestrel}/invitations`).send({ email: 'not-an-address', role: 'viewer' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0]).toMatchObject({ path: 'email' });
    expect(bad.body.error.details[0].message).toContain('not-an-address');
  });
});

describe('withdrawing an invitation', () => {
  it('makes its link stop working', async () => {
    const res = await owner.post(`/api/v1/workspaces/${kestrel}/invitations`).send({ email: 'later@kestrel.test', role: 'analyst' });
    const token = linkToken((await t.waitForMail('later@kestrel.test', 'Kestrel')).text, 'invite');
    expect((await owner.delete(`/api/v1/workspaces/${kestrel}/invitations/${res.body.id}`)).status).toBe(204);
    expect((await request(t.app).get(`/api/v1/invitations/${token}`)).status).toBe(404);
  });
});

describe('admin mail view', () => {
  it('lists the received mail for the instance administrator only', async () => {
    const list = await owner.get('/api/v1/admin/mail');
    expect(list.status).toBe(200);
    expect(list.body.items.length).toBeGreaterThanOrEqual(3);
    const first = list.body.items[0];
    const one = await owner.get(`/api/v1/admin/mail/${first.id}`);
    expect(one.body.subject).toBe(first.subject);
    // the link is the invitee's secret: hidden here (ECLIPTA_OUTBOX_LINKS=shown shows it)
    expect(one.body.text).toContain('[invitation link hidden: only its recipient may use it]');
    expect(one.body.text).not.toContain('/invite/');
    expect(one.body.hiddenLinks).toBe(1);
    const analyst = await t.signIn('analyst@kestrel.test');
    expect((await analyst.get('/api/v1/admin/mail')).status).toBe(403);
    expect((await owner.get('/api/v1/admin/mail/nope')).status).toBe(404);
  });
});

describe('the server log', () => {
  it('holds no invitation link secret', () => {
    const log = t.logLines.join('\n');
    expect(log).toContain('/api/v1/invitations/[redacted]');
    expect(log).not.toMatch(/invite\/[A-Za-z0-9_-]{16,}/);
  });
});
