// Password reset by e-mail through the real fake SMTP server.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, demoPassword, linkToken, type TestApp } from './test-app';
import { cautionText } from '../../shared/api/caution';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('password reset', () => {
  it('answers 202 with the same body for a known and an unknown address, and mails only the known one', async () => {
    const known = await request(t.app).post('/api/v1/auth/password-reset').send({ email: 'thermal@kestrel.test' });
    const unknown = await request(t.app).post('/api/v1/auth/password-reset').send({ email: 'ghost@kestrel.test' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    await t.waitForMail('thermal@kestrel.test', 'Reset');
    expect(t.ctx.mailer.inbox?.list().some((m) => m.to.includes('ghost@kestrel.test'))).toBe(false);
  });

  it('sets the new password once: the old one and older sessions stop working, a second use is 400', async () => {
    const oldSession = await t.signIn('analyst@kestrel.test');
    await request(t.app).post('/api/v1/auth/password-reset').send({ email: 'analyst@kestrel.test' });
    const mail = await t.waitForMail('analyst@kestrel.test', 'Reset');
    // the preliminary-design caution, as in every mail (DOMAIN.md)
    expect(mail.text).toContain(cautionText);
    const token = linkToken(mail.text, 'reset-password');

    const short = await request(t.app).post('/api/v1/auth/password-reset/confirm').send({ token, password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.details[0].path).toBe('password');
    expect(short.body.error.details[0].message).not.toContain('"short"');

    const ok = await request(t.app).post('/api/v1/auth/password-reset/confirm').send({ token, password: 'a-brand-new-password' });
    expect(ok.status).toBe(200);

    const old = await request(t.app).post('/api/v1/auth/sign-in').send({ email: 'analyst@kestrel.test', password: demoPassword });
    expect(old.status).toBe(401);
    await t.signIn('analyst@kestrel.test', 'a-brand-new-password');
    expect((await oldSession.get('/api/v1/auth/me')).status).toBe(401);

    const again = await request(t.app).post('/api/v1/auth/password-reset/confirm').send({ token, password: 'yet-another-password' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');
  });

  it('refuses an expired link', async () => {
    await request(t.app).post('/api/v1/auth/password-reset').send({ email: 'viewer@kestrel.test' });
    const token = linkToken((await t.waitForMail('viewer@kestrel.test', 'Reset')).text, 'reset-password');
    t.ctx.sqlite.prepare('UPDATE password_resets SET expires_at = ?').run(new Date(Date.now() - 1000).toISOString());
    const res = await request(t.app).post('/api/v1/auth/password-reset/confirm').send({ token, password: 'a-brand-new-password' });
    expect(res.status).toBe(400);
  });

  it('keeps the link out of the log', () => {
    expect(t.logLines.join('\n')).not.toMatch(/reset-password\/[A-Za-z0-9_-]{16,}/);
  });
});
