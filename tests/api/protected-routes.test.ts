// Every route but health, sign-in, password reset and the invitation links answers 401 without
// credentials (API.md "Auth"). The route list comes from the app itself, so a new route is covered.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listRoutes } from '../../server/route-list';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});

const publicRoutes = new Set([
  'GET /api/health',
  'POST /api/v1/auth/sign-in',
  'POST /api/v1/auth/password-reset',
  'POST /api/v1/auth/password-reset/confirm',
  'GET /api/v1/invitations/:token',
  'POST /api/v1/invitations/:token/accept',
]);

function concrete(path: string): string {
  return path.replace(/:\w+/g, '00000000-0000-4000-8000-000000000000');
}

describe('anonymous callers', () => {
  it('finds the routes of the contract in the app', () => {
    const keys = listRoutes(t.app).map((r) => `${r.method} ${r.path}`);
    for (const expected of [
      'GET /api/v1/auth/me',
      'DELETE /api/v1/tokens/:id',
      'PATCH /api/v1/workspaces/:workspaceId/members/:userId',
      'GET /api/v1/workspaces/:workspaceId/audit',
      'GET /api/v1/admin/mail/:id',
      ...publicRoutes,
    ]) {
      expect(keys).toContain(expected);
    }
  });

  it('get 401 with the unauthenticated error on every protected route', async () => {
    const routes = listRoutes(t.app).filter((r) => r.path.startsWith('/api/') && !publicRoutes.has(`${r.method} ${r.path}`));
    expect(routes.length).toBeGreaterThanOrEqual(14);
    for (const route of routes) {
      const res = await request(t.app)[route.method.toLowerCase() as 'get' | 'post' | 'patch' | 'put' | 'delete'](concrete(route.path)).send({});
      expect({ route: `${route.method} ${route.path}`, status: res.status, body: res.body }).toEqual({
        route: `${route.method} ${route.path}`,
        status: 401,
        body: { error: { code: 'unauthenticated', message: 'Sign in to continue.' } },
      });
    }
  });

  it('may use the health check and the public invitation preview', async () => {
    expect((await request(t.app).get('/api/health')).body).toEqual({ status: 'ok' });
    const preview = await request(t.app).get('/api/v1/invitations/no-such-token');
    expect(preview.status).toBe(404);
    expect(preview.body.error.code).toBe('invitation_not_found');
  });
});
