// The accounts, sessions and mail findings of the outside attack (issue 12, items 1, 4, 5 and part
// of 10), each tried again the way the attacker did it. docs/RELIABILITY.md "Outside attack
// findings: accounts, sessions and mail" lists them with their fixes.
import { chmodSync, mkdirSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import type { BackgroundWork } from '../../server/background-work';
import { resetLimits, signInLimits } from '../../server/auth/rate-limiter';
import { ConfigError, loadConfig } from '../../server/config';
import { startChildServer } from './child-server';
import { createTestApp, demoPassword, linkToken, publicUrl, userIdOf, workspaceIdOf, type TestApp } from './test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});
// Each test starts with no attempts counted, as the tests all come from one client address.
beforeEach(() => {
  t.ctx.sqlite.prepare('DELETE FROM rate_limit_hits').run();
});

const resetRequest = (email: string) => request(t.app).post('/api/v1/auth/password-reset').send({ email });
const signInRequest = (email: string, password: string) => request(t.app).post('/api/v1/auth/sign-in').send({ email, password });
const mailsTo = (email: string) => (t.ctx.mailer.inbox?.list() ?? []).filter((m) => m.to.includes(email));
const audit = (action: string, targetId: string) =>
  t.ctx.sqlite.prepare('SELECT summary FROM audit_events WHERE action = ? AND target_id = ? ORDER BY at, rowid').all(action, targetId) as { summary: string }[];

/** A session cookie ("eclipta_session=…") of a fresh sign-in. */
async function sessionCookie(email: string, password = demoPassword): Promise<string> {
  const res = await signInRequest(email, password);
  const cookie = (res.headers['set-cookie'] as unknown as string[] | undefined)?.find((c) => c.startsWith('eclipta_session='))?.split(';')[0];
  if (res.status !== 200 || !cookie) throw new Error(`sign-in of ${email} answered ${res.status}`);
  return cookie;
}

async function apiToken(email: string, readOnly: boolean): Promise<string> {
  const agent = await t.signIn(email);
  const res = await agent.post('/api/v1/tokens').send({ name: `attack test ${readOnly ? 'read-only' : 'full'}`, readOnly }).expect(201);
  return res.body.secret as string;
}

describe('item 1: no escalation through the mail outbox', () => {
  it("refuses every API token of the administrator, read-only or not, on the outbox's list and message (403)", async () => {
    await resetRequest('viewer@kestrel.test').expect(202);
    const { id } = await t.waitForMail('viewer@kestrel.test', 'Reset');
    // the administrator's own session reads it
    await (await t.signIn('owner@kestrel.test')).get(`/api/v1/admin/mail/${id}`).expect(200);
    for (const readOnly of [true, false]) {
      const token = await apiToken('owner@kestrel.test', readOnly);
      for (const url of ['/api/v1/admin/mail', `/api/v1/admin/mail/${id}`]) {
        const res = await request(t.app).get(url).set('authorization', `Bearer ${token}`);
        expect({ readOnly, url, status: res.status, code: res.body.error?.code }).toEqual({ readOnly, url, status: 403, code: 'session_required' });
      }
    }
  });

  it("does not hand another user's live reset link to the administrator: the outbox hides it, and the secret stays unknown", async () => {
    await resetRequest('owner@plover.test').expect(202);
    const sent = await t.waitForMail('owner@plover.test', 'Reset');
    const secret = linkToken(sent.text, 'reset-password');
    const owner = await t.signIn('owner@kestrel.test');
    const shown = await owner.get(`/api/v1/admin/mail/${sent.id}`).expect(200);
    expect(JSON.stringify(shown.body)).not.toContain(secret);
    expect(shown.body.text).toContain('[password reset link hidden: only its recipient may use it]');
    expect(shown.body.hiddenLinks).toBe(1);
    // the rest of the message is there to read
    expect(shown.body.text).toContain('The link works once and until');
  });

  it('shows the links as sent only when the development flag ECLIPTA_OUTBOX_LINKS=shown is set', async () => {
    const dev = await createTestApp({ ECLIPTA_OUTBOX_LINKS: 'shown' });
    try {
      await request(dev.app).post('/api/v1/auth/password-reset').send({ email: 'thermal@kestrel.test' }).expect(202);
      const sent = await dev.waitForMail('thermal@kestrel.test', 'Reset');
      const owner = await dev.signIn('owner@kestrel.test');
      const shown = await owner.get(`/api/v1/admin/mail/${sent.id}`).expect(200);
      expect(shown.body.text).toContain(`${publicUrl}/reset-password/${linkToken(sent.text, 'reset-password')}`);
      expect(shown.body.hiddenLinks).toBe(0);
    } finally {
      await dev.close();
    }
  });

  it('sends at most 3 reset mails for one address an hour: 30 requests give 3 mails and 27 answers of 429', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 30; i++) statuses.push((await resetRequest('analyst@kestrel.test')).status);
    expect(statuses.filter((s) => s === 202)).toHaveLength(resetLimits.address.max);
    expect(statuses.filter((s) => s === 429)).toHaveLength(30 - resetLimits.address.max);
    await t.ctx.background.idle();
    expect(mailsTo('analyst@kestrel.test').filter((m) => m.subject.includes('Reset'))).toHaveLength(3);
    // an unknown address meets the same limit, so the 429 tells nothing about accounts
    const unknown: number[] = [];
    for (let i = 0; i < 4; i++) unknown.push((await resetRequest('ghost@kestrel.test')).status);
    expect(unknown).toEqual([202, 202, 202, 429]);
  });

  it('limits one client to 10 reset requests an hour across addresses, with Retry-After', async () => {
    for (let i = 0; i < resetLimits.client.max; i++) await resetRequest(`nobody-${i}@example.test`).expect(202);
    const refused = await resetRequest('someone-else@example.test').expect(429);
    expect(refused.body.error.code).toBe('rate_limited');
    expect(refused.body.error.message).toMatch(/^Too many password reset requests from your network address\. Try again in 60 minutes\.$/);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(3500);
  });

  it('limits reset requests of all clients together (200 an hour)', async () => {
    const insert = t.ctx.sqlite.prepare('INSERT INTO rate_limit_hits (bucket, key, at_ms) VALUES (?, ?, ?)');
    // 200 requests from other clients in the last hour, as many addresses would send them
    for (let i = 0; i < resetLimits.everyone.max; i++) insert.run(resetLimits.everyone.bucket, '*', Date.now() - 1000);
    const refused = await resetRequest('owner@kestrel.test').expect(429);
    expect(refused.body.error.message).toMatch(/^Too many password reset requests right now\./);
  });

  it('does the same work for a known and an unknown address inside the request; the look-up and the mail come after the answer', async () => {
    const real = t.ctx.background;
    const held: (() => Promise<void>)[] = [];
    const holding: BackgroundWork = { run: (_label, job) => void held.push(job), idle: () => Promise.resolve() };
    const resetsBefore = t.ctx.sqlite.prepare('SELECT count(*) AS n FROM password_resets').get() as { n: number };
    t.ctx.background = holding;
    try {
      const known = await resetRequest('owner@kestrel.test');
      const unknown = await resetRequest('no-such-user@kestrel.test');
      expect([known.status, unknown.status]).toEqual([202, 202]);
      expect(known.body).toEqual(unknown.body);
      expect(Object.keys(known.headers).sort()).toEqual(Object.keys(unknown.headers).sort());
      // each queued one job and did nothing with the account yet
      expect(held).toHaveLength(2);
      expect(t.ctx.sqlite.prepare('SELECT count(*) AS n FROM password_resets').get()).toEqual(resetsBefore);
      expect(audit('auth.password_reset_requested', userIdOf(t, 'owner@kestrel.test'))).toEqual([]);
    } finally {
      t.ctx.background = real;
    }
    for (const job of held) await job();
    await t.waitForMail('owner@kestrel.test', 'Reset');
    expect(mailsTo('no-such-user@kestrel.test')).toEqual([]);
  });
});

describe('item 4: leaving a workspace ends its mail', () => {
  it('removing a member deletes his subscriptions to the workspace\'s cases (audited), and a later release mails him nothing', async () => {
    const kestrel = workspaceIdOf(t, 'Kestrel');
    const released = t.ctx.sqlite
      .prepare("SELECT id, series_id AS seriesId FROM load_cases WHERE status = 'released' AND workspace_id = ? ORDER BY revision DESC LIMIT 1")
      .get(kestrel) as { id: string; seriesId: string };
    const [viewer, analyst, thermal, owner] = await Promise.all(
      ['viewer@kestrel.test', 'analyst@kestrel.test', 'thermal@kestrel.test', 'owner@kestrel.test'].map((e) => t.signIn(e)),
    );
    await viewer.post(`/api/v1/cases/${released.id}/subscription`).expect(200);
    await analyst.post(`/api/v1/cases/${released.id}/subscription`).expect(200);
    const viewerId = userIdOf(t, 'viewer@kestrel.test');

    await owner.delete(`/api/v1/workspaces/${kestrel}/members/${viewerId}`).expect(204);
    expect(t.ctx.sqlite.prepare('SELECT count(*) AS n FROM case_subscriptions WHERE user_id = ?').get(viewerId)).toEqual({ n: 0 });
    expect(audit('member.removed', viewerId).at(-1)?.summary).toMatch(/Their 1 case subscription ended with it\.$/);

    // The mailer's own check: a subscription left behind by any other way reaches no non-member.
    const outsiderId = userIdOf(t, 'owner@plover.test');
    t.ctx.sqlite.prepare('INSERT INTO case_subscriptions (id, case_series_id, user_id, created_at) VALUES (?, ?, ?, ?)').run(crypto.randomUUID(), released.seriesId, outsiderId, new Date().toISOString());

    const draft = (await thermal.post(`/api/v1/cases/${released.id}/revisions`).expect(201)).body as { id: string; revision: number };
    await thermal.post(`/api/v1/cases/${draft.id}/submit`).expect(200);
    await owner.post(`/api/v1/cases/${draft.id}/release`).expect(200);
    // the release went out through the real fake SMTP to the member who still subscribes...
    await t.waitForMail('analyst@kestrel.test', `revision ${draft.revision} released`);
    // ...and to nobody outside the workspace
    expect(mailsTo('viewer@kestrel.test').filter((m) => m.subject.includes('released'))).toEqual([]);
    expect(mailsTo('owner@plover.test').filter((m) => m.subject.includes('released'))).toEqual([]);
  });
});

describe('item 5: sessions end when the user says so', () => {
  it('after sign-out the old cookie gets 401 on auth/me and on POST missions', async () => {
    const cookie = await sessionCookie('analyst@kestrel.test');
    const mission = { name: 'Session test', bodyId: 'earth', startDate: '2028-01-01', endDate: '2029-01-01', workspaceId: workspaceIdOf(t, 'Kestrel') };
    const withCookie = <T extends request.Test>(r: T) => r.set('cookie', cookie).set('origin', publicUrl);
    await withCookie(request(t.app).get('/api/v1/auth/me')).expect(200);
    await withCookie(request(t.app).post('/api/v1/missions')).send(mission).expect(201);
    await withCookie(request(t.app).post('/api/v1/auth/sign-out')).expect(204);
    expect((await withCookie(request(t.app).get('/api/v1/auth/me'))).status).toBe(401);
    expect((await withCookie(request(t.app).post('/api/v1/missions')).send(mission)).status).toBe(401);
    expect(audit('auth.signed_out', userIdOf(t, 'analyst@kestrel.test'))).toHaveLength(1);
  });

  it("signing out ends that session only, not the user's others", async () => {
    const laptop = await sessionCookie('thermal@kestrel.test');
    const desk = await sessionCookie('thermal@kestrel.test');
    await request(t.app).post('/api/v1/auth/sign-out').set('cookie', laptop).expect(204);
    await request(t.app).get('/api/v1/auth/me').set('cookie', desk).expect(200);
  });

  it('a password reset ends every session at once (no waiting for a new second) and revokes the API tokens made before it, audited', async () => {
    const email = 'viewer@kestrel.test';
    // the viewer was removed from Kestrel above; sessions and tokens do not need a workspace
    const cookie = await sessionCookie(email);
    const token = await apiToken(email, true);
    await request(t.app).get('/api/v1/auth/me').set('authorization', `Bearer ${token}`).expect(200);
    const userId = userIdOf(t, email);
    const { n: live } = t.ctx.sqlite.prepare('SELECT count(*) AS n FROM api_tokens WHERE user_id = ? AND revoked_at IS NULL').get(userId) as { n: number };
    expect(live).toBeGreaterThanOrEqual(1);
    await resetRequest(email).expect(202);
    const mails = await t.waitForMail(email, 'Reset');
    const confirmed = await request(t.app)
      .post('/api/v1/auth/password-reset/confirm')
      .send({ token: linkToken(mails.text, 'reset-password'), password: 'viewer-new-password' })
      .expect(200);
    expect(confirmed.body.message).toContain(`every session of your account was ended. Your ${live} personal API token${live === 1 ? ' was' : 's were'} revoked`);
    expect((await request(t.app).get('/api/v1/auth/me').set('cookie', cookie)).status).toBe(401);
    const tokenAnswer = await request(t.app).get('/api/v1/auth/me').set('authorization', `Bearer ${token}`);
    expect([tokenAnswer.status, tokenAnswer.body.error.message]).toEqual([401, 'This API token was revoked.']);
    expect(audit('token.revoked', userId).at(-1)?.summary).toMatch(new RegExp(`^Password reset: ${live} personal API tokens? revoked`));
    expect(t.ctx.sqlite.prepare('SELECT count(*) AS n FROM api_tokens WHERE user_id = ? AND revoked_at IS NULL').get(userId)).toEqual({ n: 0 });
    // the new password signs in as usual
    await sessionCookie(email, 'viewer-new-password');
  });
});

describe('item 10: origin check, sign-in limits, invitation acceptance', () => {
  it('compares the whole origin (scheme, host, port) and refuses a cross-site request that sends no Origin', async () => {
    const cookie = await sessionCookie('owner@kestrel.test');
    const tokenPost = (headers: Record<string, string>) => {
      const req = request(t.app).post('/api/v1/tokens').set('cookie', cookie);
      for (const [name, value] of Object.entries(headers)) req.set(name, value);
      return req.send({ name: 'origin test' });
    };
    for (const origin of ['https://eclipta.test', 'http://eclipta.test:8080', 'http://eclipta.test.evil.example']) {
      const res = await tokenPost({ origin });
      expect({ origin, status: res.status, code: res.body.error?.code }).toEqual({ origin, status: 403, code: 'cross_site' });
    }
    for (const site of ['cross-site', 'same-site']) {
      const res = await tokenPost({ 'sec-fetch-site': site });
      expect({ site, status: res.status }).toEqual({ site, status: 403 });
    }
    await tokenPost({ origin: publicUrl }).expect(201);
    await tokenPost({ origin: 'http://eclipta.test:80' }).expect(201); // the same origin, port spelt out
    await tokenPost({ 'sec-fetch-site': 'same-origin' }).expect(201);
    await tokenPost({}).expect(201); // a script without a browser's headers
  });

  it('limits one client across e-mails: 20 e-mails with one try each meet the limit, then even a right password waits', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 20; i++) statuses.push((await signInRequest(`guess-${i}@kestrel.test`, 'Summer2026!')).status);
    expect(statuses.slice(0, signInLimits.client.max).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(signInLimits.client.max).every((s) => s === 429)).toBe(true);
    const right = await signInRequest('owner@kestrel.test', demoPassword);
    expect(right.status).toBe(429);
    expect(right.body.error.message).toMatch(/^Too many failed sign-in attempts from your network address\. Try again in 15 minutes\.$/);
  });

  it('remembers failed sign-ins across a restart (a new app on the same database)', async () => {
    for (let i = 0; i < signInLimits.accountClient.max; i++) await signInRequest('owner@plover.test', `wrong-${i}`).expect(401);
    const restarted = createApp({ ...t.ctx });
    const res = await request(restarted).post('/api/v1/auth/sign-in').send({ email: 'owner@plover.test', password: demoPassword });
    expect(res.status).toBe(429);
  });

  it('limits password checks of an invitation for an existing account like sign-in', async () => {
    const plover = await t.signIn('owner@plover.test');
    const ploverId = workspaceIdOf(t, 'Plover');
    await plover.post(`/api/v1/workspaces/${ploverId}/invitations`).send({ email: 'thermal@kestrel.test', role: 'viewer' }).expect(201);
    const secret = linkToken((await t.waitForMail('thermal@kestrel.test', 'Plover')).text, 'invite');
    const accept = (password: string) => request(t.app).post(`/api/v1/invitations/${secret}/accept`).send({ password });
    for (let i = 0; i < signInLimits.accountClient.max; i++) await accept(`wrong-${i}-password`).expect(401);
    const blocked = await accept(demoPassword);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.message).toMatch(/^Too many sign-in attempts for this account\./);
    // the failures count for sign-in too: the same account from the same client waits there as well
    expect((await signInRequest('thermal@kestrel.test', demoPassword)).status).toBe(429);
  });
});

describe('item 10: private files and the listening address', () => {
  it('listens on 127.0.0.1 unless HOST says otherwise, and refuses a HOST that is no address or host name', () => {
    expect(loadConfig({}).host).toBe('127.0.0.1');
    expect(loadConfig({ HOST: '0.0.0.0' }).host).toBe('0.0.0.0');
    expect(loadConfig({ HOST: '::1' }).host).toBe('::1');
    expect(loadConfig({ HOST: 'eclipta.internal' }).host).toBe('eclipta.internal');
    for (const bad of ['every interface', 'http://0.0.0.0', '10.0.0.1:80']) {
      expect(() => loadConfig({ HOST: bad })).toThrow(ConfigError);
      expect(() => loadConfig({ HOST: bad })).toThrow(`HOST must be an IP address or a host name to listen on, such as 127.0.0.1 or 0.0.0.0, not ${JSON.stringify(bad)}.`);
    }
  });

  it('a running server keeps its data dir 0700 and the database, its journal, stored mail and the signing secret 0600', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'eclipta-modes-'));
    const dataDir = path.join(dir, 'data');
    // as an older version (or a careless mkdir) left it: open to every user
    mkdirSync(dataDir);
    chmodSync(dataDir, 0o755);
    const server = await startChildServer(dataDir);
    try {
      await fetch(`${server.url}/api/v1/auth/password-reset`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'owner@kestrel.test' }) });
      const mailDir = path.join(dataDir, 'mail');
      for (let i = 0; i < 100 && !readdirSync(mailDir).some((f) => f.endsWith('.eml')); i++) await new Promise((resolve) => setTimeout(resolve, 100));
      const mode = (file: string) => statSync(file).mode & 0o777;
      expect({ dataDir: mode(dataDir), mail: mode(mailDir) }).toEqual({ dataDir: 0o700, mail: 0o700 });
      const files = ['eclipta.db', 'eclipta.db-wal', 'eclipta.db-shm', 'jwt-secret', ...readdirSync(mailDir).map((f) => path.join('mail', f))];
      expect(files.filter((f) => f.endsWith('.eml'))).toHaveLength(1);
      for (const file of files) expect({ file, mode: mode(path.join(dataDir, file)).toString(8) }).toEqual({ file, mode: '600' });
      expect(server.output.find((l) => l.includes('Eclipta is listening'))).toContain('"host":"127.0.0.1"');
    } finally {
      server.child.kill('SIGTERM');
      await server.exited;
      rmSync(dir, { recursive: true, force: true });
    }
  }, 90_000);
});
