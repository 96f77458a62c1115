// Cheap authentication keeps its guarantees: an API token's use is written at most once a minute
// (with the clock under the test's control, not a timed test), and the look-ups that every request
// makes -- prepared once and reused -- still see an ended session, a revoked token or a removed
// membership on the very next request. Common practice, no source.
import request from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { readSession } from '../../server/auth/session';
import { createTestApp, demoPassword, userIdOf, workspaceIdOf, type TestApp } from './test-app';

let t: TestApp;

beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});
afterEach(() => {
  vi.useRealTimers();
});

async function signInCookie(email: string): Promise<string> {
  const res = await request(t.app).post('/api/v1/auth/sign-in').send({ email, password: demoPassword });
  expect(res.status).toBe(200);
  const cookie = res.headers['set-cookie'] as unknown as string[] | undefined;
  const value = cookie?.find((c) => c.startsWith('eclipta_session='))?.split(';')[0];
  if (!value) throw new Error('no session cookie');
  return value;
}

async function makeToken(cookie: string, name: string): Promise<{ id: string; secret: string }> {
  const res = await request(t.app).post('/api/v1/tokens').set('cookie', cookie).send({ name });
  expect(res.status).toBe(201);
  return { id: res.body.token.id, secret: res.body.secret };
}

const lastUsed = (id: string): string | null =>
  (t.ctx.sqlite.prepare('SELECT last_used_at FROM api_tokens WHERE id = ?').get(id) as { last_used_at: string | null }).last_used_at;

describe('token use', () => {
  it('is recorded on first use, not again within the minute, and again once a minute has passed', async () => {
    const cookie = await signInCookie('owner@kestrel.test');
    const { id, secret } = await makeToken(cookie, 'busy script');
    const bearer = { Authorization: `Bearer ${secret}` };
    const start = Date.parse('2027-03-20T12:00:00.000Z');
    // Only Date is faked: the HTTP stack's timers run as usual.
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(start);
    await request(t.app).get('/api/v1/auth/me').set(bearer).expect(200);
    expect(lastUsed(id)).toBe('2027-03-20T12:00:00.000Z');

    for (const secondsLater of [1, 30, 59.999]) {
      vi.setSystemTime(start + secondsLater * 1000);
      await request(t.app).get('/api/v1/auth/me').set(bearer).expect(200);
      expect(lastUsed(id)).toBe('2027-03-20T12:00:00.000Z');
    }

    vi.setSystemTime(start + 60_000);
    await request(t.app).get('/api/v1/auth/me').set(bearer).expect(200);
    expect(lastUsed(id)).toBe('2027-03-20T12:01:00.000Z');
    vi.setSystemTime(start + 90_000);
    await request(t.app).get('/api/v1/auth/me').set(bearer).expect(200);
    expect(lastUsed(id)).toBe('2027-03-20T12:01:00.000Z');
  });

  it('a busy script makes no write at all between the once-a-minute records', async () => {
    const cookie = await signInCookie('owner@kestrel.test');
    const { secret } = await makeToken(cookie, 'busier script');
    const bearer = { Authorization: `Bearer ${secret}` };
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(Date.parse('2027-03-21T08:00:00.000Z'));
    await request(t.app).get('/api/v1/cases').set(bearer).expect(200);
    const changesBefore = t.ctx.sqlite.prepare('SELECT total_changes() AS n').get() as { n: number };
    for (let i = 0; i < 20; i++) {
      vi.setSystemTime(Date.parse('2027-03-21T08:00:00.000Z') + i * 2000);
      await request(t.app).get('/api/v1/cases').set(bearer).expect(200);
    }
    const changesAfter = t.ctx.sqlite.prepare('SELECT total_changes() AS n').get() as { n: number };
    expect(changesAfter.n).toBe(changesBefore.n);
  });
});

describe('revocation is immediate despite statements prepared once and reused', () => {
  it('a signed-out session is refused on the very next request, the user’s other session still works', async () => {
    const laptop = await signInCookie('analyst@kestrel.test');
    const phone = await signInCookie('analyst@kestrel.test');
    for (let i = 0; i < 3; i++) await request(t.app).get('/api/v1/auth/me').set('cookie', laptop).expect(200);
    await request(t.app).post('/api/v1/auth/sign-out').set('cookie', laptop).expect(204);
    await request(t.app).get('/api/v1/auth/me').set('cookie', laptop).expect(401);
    await request(t.app).get('/api/v1/cases').set('cookie', laptop).expect(401);
    await request(t.app).get('/api/v1/auth/me').set('cookie', phone).expect(200);
  });

  it('a revoked API token is refused on the very next request', async () => {
    const cookie = await signInCookie('owner@kestrel.test');
    const { id, secret } = await makeToken(cookie, 'soon revoked');
    const bearer = { Authorization: `Bearer ${secret}` };
    for (let i = 0; i < 3; i++) await request(t.app).get('/api/v1/cases').set(bearer).expect(200);
    await request(t.app).delete(`/api/v1/tokens/${id}`).set('cookie', cookie).expect(204);
    const refused = await request(t.app).get('/api/v1/cases').set(bearer);
    expect(refused.status).toBe(401);
    expect(refused.body.error.message).toBe('This API token was revoked.');
  });

  it('a member removed from a workspace is refused its routes on the very next request', async () => {
    const kestrel = workspaceIdOf(t, 'Kestrel');
    const owner = await signInCookie('owner@kestrel.test');
    const viewer = await signInCookie('viewer@kestrel.test');
    for (let i = 0; i < 3; i++) await request(t.app).get(`/api/v1/workspaces/${kestrel}/members`).set('cookie', viewer).expect(200);
    await request(t.app).delete(`/api/v1/workspaces/${kestrel}/members/${userIdOf(t, 'viewer@kestrel.test')}`).set('cookie', owner).expect(204);
    await request(t.app).get(`/api/v1/workspaces/${kestrel}/members`).set('cookie', viewer).expect(404);
  });
});

describe('session signatures checked once', () => {
  it('a token checked before is still refused once expired, and a forged one never passes', async () => {
    const cookie = await signInCookie('thermal@kestrel.test');
    const token = decodeURIComponent(cookie.slice('eclipta_session='.length));
    const claims = readSession(t.ctx, token);
    expect(claims?.userId).toBe(userIdOf(t, 'thermal@kestrel.test'));
    expect(readSession(t.ctx, token)).toEqual(claims);
    const expiresAtMs = (JSON.parse(Buffer.from(token.split('.')[1]!, 'base64url').toString('utf8')) as { exp: number }).exp * 1000;
    expect(readSession(t.ctx, token, expiresAtMs - 1)).toEqual(claims);
    expect(readSession(t.ctx, token, expiresAtMs)).toBeNull();
    const [header, payload, signature] = token.split('.') as [string, string, string];
    const otherSignature = signature.slice(0, -2) + (signature.endsWith('AA') ? 'BB' : 'AA');
    expect(readSession(t.ctx, `${header}.${payload}.${otherSignature}`)).toBeNull();
    const otherPayload = Buffer.from(JSON.stringify({ sid: claims?.sessionId, sub: userIdOf(t, 'owner@kestrel.test'), exp: expiresAtMs / 1000 })).toString('base64url');
    expect(readSession(t.ctx, `${header}.${otherPayload}.${signature}`)).toBeNull();
  });
});

