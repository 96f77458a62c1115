// Cheap authentication keeps its guarantees: an API token's use is written at most once a minute
// (with the clock under the test's control, not a timed test), and the look-ups that every request
// makes -- prepared once and reused -- still see an ended session, a revoked token or a removed
// membership on the very next request. Common practice, no source.
import Database from 'better-sqlite3';
import request from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { readSession, sessionUser } from '../../server/auth/session';
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


// What every request reads is remembered until the database changes (server/db/read-memo.ts): any
// write, through the app, straight on its connection, or by another connection (another process
// sharing the file), must show on the very next request. Common practice, no source.
describe('remembered reads are dropped by any write', () => {
  /** A second connection on the same file, as another server process would have. */
  function otherConnection(): Database.Database {
    return new Database(t.ctx.config.dbPath);
  }

  it('a session ended by another connection is refused on the very next request, with a token and with a cookie', async () => {
    const cookie = await signInCookie('thermal@kestrel.test');
    const { secret } = await makeToken(cookie, 'ended elsewhere');
    const bearer = { Authorization: `Bearer ${secret}` };
    for (let i = 0; i < 3; i++) {
      await request(t.app).get('/api/v1/cases').set('cookie', cookie).expect(200);
      await request(t.app).get('/api/v1/auth/me').set(bearer).expect(200);
    }
    const other = otherConnection();
    try {
      const userId = userIdOf(t, 'thermal@kestrel.test');
      other.prepare('UPDATE sessions SET ended_at = ? WHERE user_id = ? AND ended_at IS NULL').run(new Date().toISOString(), userId);
      await request(t.app).get('/api/v1/cases').set('cookie', cookie).expect(401);
      await request(t.app).get('/api/v1/auth/me').set('cookie', cookie).expect(401);
      other.prepare('UPDATE api_tokens SET revoked_at = ? WHERE user_id = ?').run(new Date().toISOString(), userId);
      const refused = await request(t.app).get('/api/v1/auth/me').set(bearer);
      expect(refused.status).toBe(401);
      expect(refused.body.error.message).toBe('This API token was revoked.');
    } finally {
      other.close();
    }
  });

  it('a session past its expiry is refused though its row was remembered (the clock is checked on every call)', async () => {
    const cookie = await signInCookie('analyst@kestrel.test');
    await request(t.app).get('/api/v1/auth/me').set('cookie', cookie).expect(200);
    const claims = readSession(t.ctx, decodeURIComponent(cookie.slice('eclipta_session='.length)));
    if (!claims) throw new Error('the cookie did not read');
    const expiresAt = (t.ctx.sqlite.prepare('SELECT expires_at FROM sessions WHERE id = ?').get(claims.sessionId) as { expires_at: string }).expires_at;
    expect(sessionUser(t.ctx.db, claims)?.id).toBe(userIdOf(t, 'analyst@kestrel.test'));
    expect(sessionUser(t.ctx.db, claims, new Date(Date.parse(expiresAt) - 1))?.id).toBe(userIdOf(t, 'analyst@kestrel.test'));
    expect(sessionUser(t.ctx.db, claims, new Date(expiresAt))).toBeUndefined();
  });

  it('auth/me and the case list show a change made by another connection, and one made straight on the app’s own connection', async () => {
    const cookie = await signInCookie('owner@kestrel.test');
    const me = async () => (await request(t.app).get('/api/v1/auth/me').set('cookie', cookie).expect(200)).body as { user: { name: string }; workspaces: { workspaceName: string }[] };
    const cases = async () => (await request(t.app).get('/api/v1/cases').set('cookie', cookie).expect(200)).body as { items: { id: string; name: string; inputsChanged: boolean }[] };
    const before = await cases();
    const first = before.items.find((c) => !c.inputsChanged && (c as { status?: string }).status !== 'superseded');
    if (!first) throw new Error('the demo has no current case');
    await me();
    const userId = userIdOf(t, 'owner@kestrel.test');
    const other = otherConnection();
    try {
      other.prepare('UPDATE users SET name = ? WHERE id = ?').run('Renamed Elsewhere', userId);
      other.prepare('UPDATE load_cases SET name = ? WHERE id = ?').run('Renamed case', first.id);
      other.prepare('UPDATE workspaces SET name = ? WHERE id = ?').run('Kestrel Renamed', workspaceIdOf(t, 'Kestrel'));
    } finally {
      other.close();
    }
    expect((await me()).user.name).toBe('Renamed Elsewhere');
    expect((await me()).workspaces.map((w) => w.workspaceName)).toContain('Kestrel Renamed');
    expect((await cases()).items.find((c) => c.id === first.id)?.name).toBe('Renamed case');

    t.ctx.sqlite.prepare('UPDATE users SET name = ? WHERE id = ?').run('Renamed Here', userId);
    expect((await me()).user.name).toBe('Renamed Here');
    // A mission change the case was made from turns its currency flag on at once.
    t.ctx.sqlite.prepare("UPDATE missions SET end_date = '2099-12-31' WHERE id = (SELECT mission_id FROM load_cases WHERE id = ?)").run(first.id);
    expect((await cases()).items.find((c) => c.id === first.id)?.inputsChanged).toBe(true);
    t.ctx.sqlite.prepare("UPDATE workspaces SET name = 'Kestrel' WHERE name = 'Kestrel Renamed'").run();
  });

  it('a member removed from a workspace loses its cases from the list and from auth/me on the very next request', async () => {
    const kestrel = workspaceIdOf(t, 'Kestrel');
    const owner = await signInCookie('owner@kestrel.test');
    const engineer = await signInCookie('thermal@kestrel.test');
    const listed = async () => ((await request(t.app).get('/api/v1/cases').set('cookie', engineer).expect(200)).body as { items: { workspaceId: string }[] }).items;
    expect((await listed()).some((c) => c.workspaceId === kestrel)).toBe(true);
    await request(t.app).delete(`/api/v1/workspaces/${kestrel}/members/${userIdOf(t, 'thermal@kestrel.test')}`).set('cookie', owner).expect(204);
    expect((await listed()).some((c) => c.workspaceId === kestrel)).toBe(false);
    const me = (await request(t.app).get('/api/v1/auth/me').set('cookie', engineer).expect(200)).body as { workspaces: { workspaceId: string }[] };
    expect(me.workspaces.some((w) => w.workspaceId === kestrel)).toBe(false);
  });
});
