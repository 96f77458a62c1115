// Personal API tokens: Bearer works wherever the cookie does; read-only tokens only read;
// revoked and expired tokens are refused; only the SHA-256 of a secret is stored.
import { createHash } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, userIdOf, workspaceIdOf, type TestApp } from './test-app';

let t: TestApp;
let session: request.Agent;
let kestrel: string;

async function makeToken(body: Record<string, unknown>): Promise<{ id: string; secret: string }> {
  const res = await session.post('/api/v1/tokens').send(body);
  expect(res.status).toBe(201);
  return { id: res.body.token.id, secret: res.body.secret };
}

beforeAll(async () => {
  t = await createTestApp();
  session = await t.signIn('owner@kestrel.test');
  kestrel = workspaceIdOf(t, 'Kestrel');
});
afterAll(async () => {
  await t.close();
});

describe('API tokens', () => {
  it('are created once with their secret, listed without it and stored as SHA-256 only', async () => {
    const res = await session.post('/api/v1/tokens').send({ name: 'import script', expiresInDays: 30 });
    expect(res.status).toBe(201);
    expect(res.body.secret).toMatch(/^ecl_[A-Za-z0-9_-]{43}$/);
    expect(res.body.token).toMatchObject({ name: 'import script', readOnly: false, lastUsedAt: null });
    expect(res.body.secret.startsWith(res.body.token.prefix)).toBe(true);
    const list = await session.get('/api/v1/tokens');
    expect(list.body.items).toHaveLength(1);
    expect(JSON.stringify(list.body)).not.toContain(res.body.secret);
    const row = t.ctx.sqlite.prepare('SELECT token_hash FROM api_tokens WHERE id = ?').get(res.body.token.id) as { token_hash: string };
    expect(row.token_hash).toBe(createHash('sha256').update(res.body.secret).digest('hex'));
  });

  it('sign a script in through Authorization: Bearer with the owner’s rights', async () => {
    const { secret } = await makeToken({ name: 'full' });
    const me = await request(t.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${secret}`);
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe('owner@kestrel.test');
    expect(me.body.auth).toEqual({ kind: 'token', readOnly: false });
    const viewerId = userIdOf(t, 'viewer@kestrel.test');
    const patch = await request(t.app)
      .patch(`/api/v1/workspaces/${kestrel}/members/${viewerId}`)
      .set('Authorization', `Bearer ${secret}`)
      .send({ role: 'viewer' });
    expect(patch.status).toBe(200);
    const used = await session.get('/api/v1/tokens');
    expect(used.body.items.find((x: { name: string }) => x.name === 'full').lastUsedAt).not.toBeNull();
  });

  it('that are read-only may read but get 403 on any write', async () => {
    const { secret } = await makeToken({ name: 'reader', readOnly: true });
    const bearer = { Authorization: `Bearer ${secret}` };
    const read = await request(t.app).get(`/api/v1/workspaces/${kestrel}/members`).set(bearer);
    expect(read.status).toBe(200);
    expect((await request(t.app).get('/api/v1/auth/me').set(bearer)).body.auth).toEqual({ kind: 'token', readOnly: true });
    const viewerId = userIdOf(t, 'viewer@kestrel.test');
    for (const write of [
      request(t.app).patch(`/api/v1/workspaces/${kestrel}/members/${viewerId}`).set(bearer).send({ role: 'analyst' }),
      request(t.app).post(`/api/v1/workspaces/${kestrel}/invitations`).set(bearer).send({ email: 'ro@kestrel.test', role: 'viewer' }),
      request(t.app).delete(`/api/v1/workspaces/${kestrel}/members/${viewerId}`).set(bearer),
    ]) {
      const res = await write;
      expect(res.status).toBe(403);
      expect(res.body.error.message).toBe('This API token is read-only.');
    }
    const members = await session.get(`/api/v1/workspaces/${kestrel}/members`);
    expect(members.body.items.find((m: { userId: string }) => m.userId === viewerId).role).toBe('viewer');
  });

  it('cannot mint further tokens', async () => {
    const { secret } = await makeToken({ name: 'minter' });
    const res = await request(t.app).post('/api/v1/tokens').set('Authorization', `Bearer ${secret}`).send({ name: 'child' });
    expect(res.status).toBe(403);
  });

  it('stop working once revoked (401), and another user cannot revoke them', async () => {
    const { id, secret } = await makeToken({ name: 'to revoke' });
    const other = await t.signIn('analyst@kestrel.test');
    expect((await other.delete(`/api/v1/tokens/${id}`)).status).toBe(404);
    expect((await session.delete(`/api/v1/tokens/${id}`)).status).toBe(204);
    const res = await request(t.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${secret}`);
    expect(res.status).toBe(401);
    expect(res.body.error.message).toBe('This API token was revoked.');
    expect((await session.get('/api/v1/tokens')).body.items.map((x: { id: string }) => x.id)).not.toContain(id);
  });

  it('stop working once expired (401)', async () => {
    const { id, secret } = await makeToken({ name: 'short', expiresInDays: 1 });
    t.ctx.sqlite.prepare('UPDATE api_tokens SET expires_at = ? WHERE id = ?').run(new Date(Date.now() - 1000).toISOString(), id);
    const res = await request(t.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${secret}`);
    expect(res.status).toBe(401);
    expect(res.body.error.message).toBe('This API token has expired.');
  });

  it('refuse an invented or malformed token with 401', async () => {
    for (const header of ['Bearer ecl_invented', 'Bearer something-else', 'Basic dXNlcjpwYXNz']) {
      const res = await request(t.app).get('/api/v1/auth/me').set('Authorization', header);
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe('invalid_token');
    }
  });

  it('never appear in the server log', () => {
    const log = t.logLines.join('\n');
    expect(t.logLines.length).toBeGreaterThan(10);
    expect(log).not.toMatch(/ecl_[A-Za-z0-9_-]{20,}/);
    expect(log).not.toContain('eclipta-demo');
  });
});
