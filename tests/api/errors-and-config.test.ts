// The error shape of API.md "Errors" and the start-up configuration of API.md "Running".
import express from 'express';
import { mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { brotliCompressSync, brotliDecompressSync, gunzipSync, gzipSync } from 'node:zlib';
import http, { type IncomingHttpHeaders } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { ConfigError, loadConfig, resolveJwtSecret } from '../../server/config';
import { errorMiddleware } from '../../server/errors';
import { createLogger } from '../../server/logger';
import { createTestApp, workspaceIdOf, type TestApp } from './test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('error answers', () => {
  it('are JSON 404 for an unknown /api route', async () => {
    const res = await request(t.app).get('/api/v1/no-such-thing?x=1');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/json/);
    expect(res.body).toEqual({ error: { code: 'no_route', message: 'No API route GET /api/v1/no-such-thing.' } });
  });

  it('are 400 invalid_json for a malformed JSON body', async () => {
    const res = await request(t.app).post('/api/v1/auth/sign-in').set('Content-Type', 'application/json').send('{"email": "a@b.c",');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.js/);
  });

  it('are 413 for a body over the limit', async () => {
    const res = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a@b.c', password: 'x'.repeat(3 * 1024 * 1024) }));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
  });

  it('name the field and the value of invalid input, but never a password', async () => {
    const owner = await t.signIn('owner@kestrel.test');
    const res = await owner.post(`/api/v1/workspaces/${workspaceIdOf(t, 'Kestrel')}/invitations`).send({ email: 'someone@kestrel.test', role: 42 });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([{ path: 'role', message: expect.stringContaining('(got 42)') }]);
    expect(res.body.error.message).toMatch(/^role: /);
    const reset = await request(t.app).post('/api/v1/auth/password-reset/confirm').send({ token: 'x', password: 'tiny-pw' });
    expect(reset.status).toBe(400);
    expect(JSON.stringify(reset.body)).not.toContain('tiny-pw');
  });

  it('answer 500 without a stack and log the stack', async () => {
    const lines: string[] = [];
    const app = express();
    app.get('/boom', () => {
      throw new Error('database exploded');
    });
    app.use(errorMiddleware(createLogger({ level: 'error', write: (l) => lines.push(l) })));
    const res = await request(app).get('/boom');
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe('internal');
    expect(JSON.stringify(res.body)).not.toContain('database exploded');
    expect(lines.join('\n')).toContain('database exploded');
    expect(lines.join('\n')).toMatch(/errors-and-config\.test\.ts/);
  });
});

describe('the built client', () => {
  it('is served with a CSP, and every non-API path falls back to its index.html', async () => {
    const clientDir = mkdtempSync(path.join(tmpdir(), 'eclipta-client-'));
    writeFileSync(path.join(clientDir, 'index.html'), '<!doctype html><title>Eclipta test page</title>');
    writeFileSync(path.join(clientDir, 'main.js'), 'console.log(1);');
    const app = createApp(t.ctx, { clientDir });
    const deep = await request(app).get('/invite/some-token');
    expect(deep.status).toBe(200);
    expect(deep.text).toContain('Eclipta test page');
    expect(deep.headers['content-security-policy']).toContain("script-src 'self'");
    expect((await request(app).get('/main.js')).text).toBe('console.log(1);');
    const api = await request(app).get('/api/v1/missing');
    expect(api.status).toBe(404);
    expect(api.body.error.code).toBe('no_route');
  });

  it('sends the build\'s .br/.gz copies as the browser accepts them, hashed names cached for a year, index.html revalidated', async () => {
    const clientDir = mkdtempSync(path.join(tmpdir(), 'eclipta-client-'));
    const script = 'console.log("hashed");'.repeat(50);
    writeFileSync(path.join(clientDir, 'index.html'), '<!doctype html><title>Eclipta test page</title>');
    writeFileSync(path.join(clientDir, 'index.html.br'), brotliCompressSync('<!doctype html><title>Eclipta test page</title>'));
    writeFileSync(path.join(clientDir, 'main-ABCD1234.js'), script);
    writeFileSync(path.join(clientDir, 'main-ABCD1234.js.br'), brotliCompressSync(script));
    writeFileSync(path.join(clientDir, 'main-ABCD1234.js.gz'), gzipSync(script));
    writeFileSync(path.join(clientDir, 'favicon.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
    const app = createApp(t.ctx, { clientDir });
    // Over a real socket: supertest would decompress before the test could see the bytes.
    const server = app.listen(0);
    const port = (server.address() as AddressInfo).port;
    const get = (page: string, encoding: string) => new Promise<{ headers: IncomingHttpHeaders; body: Buffer }>((resolve, reject) => {
      http.get(`http://127.0.0.1:${port}${page}`, { headers: { 'accept-encoding': encoding } }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ headers: res.headers, body: Buffer.concat(chunks) }));
      }).on('error', reject);
    });
    try {
      // What Chromium sends: gzip listed before br, both accepted; br is the smaller.
      const br = await get('/main-ABCD1234.js', 'gzip, deflate, br, zstd');
      expect(br.headers['content-encoding']).toBe('br');
      expect(br.headers['content-type']).toMatch(/javascript/);
      expect(br.headers['vary']).toMatch(/Accept-Encoding/);
      // RFC 8246: immutable, with a year's max-age (common practice for content-hashed names)
      expect(br.headers['cache-control']).toBe('public, max-age=31536000, immutable');
      expect(brotliDecompressSync(br.body).toString()).toBe(script);
      const gz = await get('/main-ABCD1234.js', 'gzip');
      expect(gz.headers['content-encoding']).toBe('gzip');
      expect(gunzipSync(gz.body).toString()).toBe(script);
      const plain = await get('/main-ABCD1234.js', 'identity');
      expect(plain.headers['content-encoding']).toBeUndefined();
      expect(plain.body.toString()).toBe(script);
      for (const page of ['/', '/missions/abc', '/favicon.svg']) {
        expect((await get(page, 'br')).headers['cache-control']).toBe('no-cache');
      }
      const deep = await get('/missions/abc', 'br');
      expect(deep.headers['content-encoding']).toBe('br');
      expect(deep.headers['content-type']).toMatch(/text\/html/);
      expect(brotliDecompressSync(deep.body).toString()).toContain('Eclipta test page');
    } finally {
      server.close();
    }
    expect((await request(app).get('/..%2F..%2Fetc%2Fpasswd')).text).toContain('Eclipta test page');
  });
});

describe('configuration', () => {
  it('uses the defaults of API.md "Running"', () => {
    const config = loadConfig({}, '/srv/eclipta');
    expect(config.port).toBe(4300);
    expect(config.dbPath).toBe('/srv/eclipta/data/eclipta.db');
    expect(config.dataDir).toBe('/srv/eclipta/data');
    expect(config.seed).toBe('demo');
    expect(config.demoPassword).toBe('eclipta-demo');
    expect(config.smtpUrl).toBeNull();
    expect(config.publicUrl).toBe('http://localhost:4300');
    expect(config.sessionHours).toBe(12);
  });

  it('throws a ConfigError naming the variable and the value', () => {
    const cases: [Record<string, string>, RegExp][] = [
      [{ PORT: 'abc' }, /^PORT must be a whole number from 0 to 65535, not "abc"\.$/],
      [{ PORT: '70000' }, /PORT.*"70000"/],
      [{ ECLIPTA_SEED: 'lots' }, /ECLIPTA_SEED.*"lots"/],
      [{ ECLIPTA_SESSION_HOURS: '-1' }, /ECLIPTA_SESSION_HOURS.*"-1"/],
      [{ ECLIPTA_PUBLIC_URL: 'ftp://x' }, /ECLIPTA_PUBLIC_URL.*"ftp:\/\/x"/],
      [{ ECLIPTA_LOG_LEVEL: 'loud' }, /ECLIPTA_LOG_LEVEL.*"loud"/],
      [{ SMTP_URL: 'mail.example' }, /SMTP_URL/],
    ];
    for (const [env, message] of cases) {
      expect(() => loadConfig(env)).toThrow(ConfigError);
      expect(() => loadConfig(env)).toThrow(message);
    }
  });

  it('generates the signing secret once and keeps it in the data dir with mode 0600', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'eclipta-secret-'));
    const config = loadConfig({ ECLIPTA_DATA_DIR: dir });
    const first = resolveJwtSecret(config);
    expect(first.length).toBeGreaterThanOrEqual(32);
    expect(resolveJwtSecret(config)).toBe(first);
    const file = path.join(dir, 'jwt-secret');
    expect(readFileSync(file, 'utf8').trim()).toBe(first);
    expect(statSync(file).mode & 0o777).toBe(0o600);
    expect(resolveJwtSecret(loadConfig({ ECLIPTA_DATA_DIR: dir, ECLIPTA_JWT_SECRET: 'k'.repeat(40) }))).toBe('k'.repeat(40));
  });
});
