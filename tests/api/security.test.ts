// Security properties beyond those in sign-in.test.ts (cookie flags, Origin check, sign-in limit) and
// api-tokens.test.ts (scopes, revocation, expiry): the headers every answer carries, the Secure flag
// behind https, expired and forged sessions, the cross-site check's edge cases, where uploads live,
// and a scan of a real server's log file for every secret the session handled.
import jwt from 'jsonwebtoken';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { uploadsDir } from '../../server/ephemerides/ephemeris-upload';
import { childSignIn, startChildServer } from './child-server';
import { createTestApp, linkToken, userIdOf, type TestApp } from './test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('headers', () => {
  it('sends a content security policy that allows scripts from the server only, on pages and API answers', async () => {
    for (const url of ['/api/health', '/api/v1/auth/me']) {
      const res = await request(t.app).get(url);
      const csp = String(res.headers['content-security-policy']);
      const scriptSrc = /(?:^|;)\s*script-src ([^;]*)/.exec(csp)?.[1];
      expect(scriptSrc).toBe("'self'");
      expect(csp).toMatch(/object-src 'none'/);
      expect(csp).toMatch(/frame-ancestors 'none'/);
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect(res.headers['x-powered-by']).toBeUndefined();
    }
  });
});

describe('sessions', () => {
  it('sets the Secure flag on the session cookie when the public URL is https', async () => {
    const secure = await createTestApp({ ECLIPTA_PUBLIC_URL: 'https://eclipta.example' });
    try {
      const res = await request(secure.app).post('/api/v1/auth/sign-in').send({ email: 'viewer@kestrel.test', password: 'eclipta-demo' });
      const cookie = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('eclipta_session=')) ?? '';
      expect(cookie).toMatch(/; Secure/);
      expect(cookie).toMatch(/; HttpOnly/);
      expect(cookie).toMatch(/; SameSite=Strict/);
      expect(res.headers['strict-transport-security']).toMatch(/max-age=/);
    } finally {
      await secure.close();
    }
  });

  it('refuses a session token past its expiry, one signed with another secret, and an unsigned one', async () => {
    const sub = userIdOf(t, 'owner@kestrel.test');
    // a real sign-in's token, and forgeries naming the same open session
    const signedIn = await request(t.app).post('/api/v1/auth/sign-in').send({ email: 'owner@kestrel.test', password: 'eclipta-demo' });
    const valid = (signedIn.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('eclipta_session='))?.split(';')[0]?.slice('eclipta_session='.length) ?? '';
    const { sid } = jwt.decode(valid) as { sid: string };
    const nowS = Math.floor(Date.now() / 1000);
    const expired = jwt.sign({ sid, iat: nowS - 7200, exp: nowS - 60 }, t.ctx.jwtSecret, { algorithm: 'HS256', subject: sub });
    const otherSecret = jwt.sign({ sid }, 'x'.repeat(48), { algorithm: 'HS256', subject: sub, expiresIn: 3600 });
    const unsigned = `${Buffer.from('{"alg":"none","typ":"JWT"}').toString('base64url')}.${Buffer.from(JSON.stringify({ sub, sid, iat: nowS, exp: nowS + 3600 })).toString('base64url')}.`;
    // well signed, but for no session row (as a token from before sessions were kept)
    const noSession = jwt.sign({}, t.ctx.jwtSecret, { algorithm: 'HS256', subject: sub, expiresIn: 3600 });
    expect((await request(t.app).get('/api/v1/auth/me').set('cookie', `eclipta_session=${valid}`)).status).toBe(200);
    for (const token of [expired, otherSecret, unsigned, noSession]) {
      const res = await request(t.app).get('/api/v1/auth/me').set('cookie', `eclipta_session=${token}`);
      expect(res.status).toBe(401);
      // the stale cookie is cleared rather than sent again on every request
      expect(String(res.headers['set-cookie'])).toMatch(/eclipta_session=;/);
    }
  });

  it('refuses cookie-borne changes from Origin "null" and from a look-alike host, and takes its own origin', async () => {
    const owner = await t.signIn('owner@kestrel.test');
    for (const origin of ['null', 'http://eclipta.test.evil.example', 'https://eclipta.test:8443', 'not a url']) {
      const res = await owner.post('/api/v1/tokens').set('origin', origin).send({ name: 'from elsewhere' });
      expect({ origin, status: res.status, code: res.body.error?.code }).toEqual({ origin, status: 403, code: 'cross_site' });
    }
    expect((await owner.post('/api/v1/tokens').set('origin', 'http://eclipta.test').send({ name: 'from our page' })).status).toBe(201);
    // reading is not a change: a foreign Origin on a GET is answered (CORS keeps the answer from the other site)
    expect((await owner.get('/api/v1/tokens').set('origin', 'https://evil.example')).status).toBe(200);
  });
});

describe('uploads', () => {
  it('live in the data dir, outside the folder the client is served from', () => {
    const relative = path.relative(t.ctx.config.clientDir, uploadsDir(t.ctx.config));
    expect(relative.startsWith('..')).toBe(true);
    expect(uploadsDir(t.ctx.config).startsWith(t.ctx.config.dataDir)).toBe(true);
  });
});

describe('the log file of a running server', () => {
  let dir: string;
  beforeAll(() => {
    dir = mkdtempSync(path.join(tmpdir(), 'eclipta-log-'));
  });
  afterAll(() => {
    rmSync(dir, { recursive: true, force: true });
  });

  it('holds no password, session, API token, reset or invitation secret, nor the signing secret', async () => {
    const logFile = path.join(dir, 'eclipta.log');
    const jwtSecret = 'log-test-signing-secret-' + 'k'.repeat(24);
    const server = await startChildServer(path.join(dir, 'data'), { ECLIPTA_LOG_FILE: logFile, ECLIPTA_JWT_SECRET: jwtSecret, ECLIPTA_LOG_LEVEL: 'debug', ECLIPTA_OUTBOX_LINKS: 'shown' });
    const secrets: string[] = [jwtSecret, 'eclipta-demo'];
    try {
      const post = (url: string, body: unknown, headers: Record<string, string> = {}) =>
        fetch(server.url + url, { method: 'POST', headers: { 'content-type': 'application/json', ...headers }, body: JSON.stringify(body) });
      // a wrong password, then a right one
      await post('/api/v1/auth/sign-in', { email: 'analyst@kestrel.test', password: 'wrong-password-typed-here' });
      secrets.push('wrong-password-typed-here');
      const cookie = await childSignIn(server.url, 'owner@kestrel.test');
      secrets.push(cookie.slice('eclipta_session='.length));
      // a personal token, used as a bearer and in a malformed header
      const token = (await (await post('/api/v1/tokens', { name: 'log test' }, { cookie })).json()) as { secret: string };
      secrets.push(token.secret);
      await fetch(`${server.url}/api/v1/missions?token=${token.secret}`, { headers: { authorization: `Bearer ${token.secret}` } });
      await fetch(`${server.url}/api/v1/missions`, { headers: { authorization: `Basic ${token.secret}` } });
      // a password reset and an invitation, their links read from the server's own inbox
      await post('/api/v1/auth/password-reset', { email: 'thermal@kestrel.test' });
      await post(`/api/v1/workspaces/${await workspaceOf(server.url, cookie)}/invitations`, { email: 'log.invitee@kestrel.test', role: 'viewer' }, { cookie });
      const texts = await mailTexts(server.url, cookie);
      const reset = linkToken(texts.find((m) => m.includes('reset-password/')) ?? '', 'reset-password');
      const invite = linkToken(texts.find((m) => m.includes('/invite/')) ?? '', 'invite');
      secrets.push(reset, invite);
      await fetch(`${server.url}/api/v1/invitations/${invite}`);
      await post(`/api/v1/invitations/${invite}/accept`, { name: 'Log Invitee', password: 'invitee-new-password' });
      await post('/api/v1/auth/password-reset/confirm', { token: reset, password: 'thermal-new-password' });
      secrets.push('invitee-new-password', 'thermal-new-password');
    } finally {
      server.child.kill('SIGTERM');
      await server.exited;
    }
    const log = readFileSync(logFile, 'utf8');
    // the scan is meaningful: the log did record these requests
    expect(log).toMatch(/"path":"\/api\/v1\/auth\/password-reset\/confirm"/);
    expect(log.split('\n').length).toBeGreaterThan(10);
    for (const secret of secrets) expect(log.includes(secret), `a secret of ${secret.length} characters is in the log`).toBe(false);
  }, 90_000);
});

async function workspaceOf(url: string, cookie: string): Promise<string> {
  const body = (await (await fetch(`${url}/api/v1/workspaces`, { headers: { cookie } })).json()) as { items?: { id: string; name: string }[] } | { id: string; name: string }[];
  const items = Array.isArray(body) ? body : (body.items ?? []);
  const kestrel = items.find((w) => w.name === 'Kestrel');
  if (!kestrel) throw new Error('no Kestrel workspace');
  return kestrel.id;
}

async function mailTexts(url: string, cookie: string): Promise<string[]> {
  // 15 s: a deadline for a loaded machine, not a measure
  for (const deadline = Date.now() + 15_000; Date.now() < deadline;) {
    const list = (await (await fetch(`${url}/api/v1/admin/mail`, { headers: { cookie } })).json()) as { items: { id: string }[] };
    if (list.items.length >= 2) {
      return Promise.all(list.items.map(async (m) => ((await (await fetch(`${url}/api/v1/admin/mail/${m.id}`, { headers: { cookie } })).json()) as { text: string }).text));
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error('the reset and invitation mails did not arrive');
}
