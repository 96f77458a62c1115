// Builds the whole server for a test file: a fresh database in a temporary folder, migrations,
// the demo seed and a real fake SMTP server, with the app driven by supertest.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import type { Express } from 'express';
import request from 'supertest';
import type { AppContext } from '../../server/app-context';
import { createApp } from '../../server/app';
import { createBackgroundWork } from '../../server/background-work';
import { loadConfig } from '../../server/config';
import { migrateDatabase, openDatabase } from '../../server/db/database';
import { createLogger } from '../../server/logger';
import type { ReceivedMail } from '../../server/mail/fake-smtp';
import { startMailer } from '../../server/mail/mailer';
import { seedDatabase } from '../../server/seed/seed';

export const demoPassword = 'eclipta-demo';
export const publicUrl = 'http://eclipta.test';

export interface TestApp {
  app: Express;
  ctx: AppContext;
  /** Every line the server logged, for checks that no secret was written. */
  logLines: string[];
  /** An agent holding the session cookie of a demo (or any) user. */
  signIn(email: string, password?: string): Promise<request.Agent>;
  /** Waits for a mail to this address whose subject contains the text, and answers it parsed. */
  waitForMail(to: string, subjectPart: string): Promise<ReceivedMail>;
  close(): Promise<void>;
}

export async function createTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const dir = mkdtempSync(path.join(tmpdir(), 'eclipta-api-'));
  const config = loadConfig({
    NODE_ENV: 'test',
    ECLIPTA_DATA_DIR: dir,
    ECLIPTA_DB_PATH: path.join(dir, 'eclipta.db'),
    ECLIPTA_PUBLIC_URL: publicUrl,
    ECLIPTA_LOG_LEVEL: 'debug',
    ...env,
  });
  const logLines: string[] = [];
  const logger = createLogger({ level: config.logLevel, write: (line) => logLines.push(line) });
  const { db, sqlite } = openDatabase(config.dbPath);
  migrateDatabase(db, config.migrationsDir);
  const mailer = await startMailer(config, logger);
  const background = createBackgroundWork(logger);
  const ctx: AppContext = { config, jwtSecret: randomBytes(32).toString('hex'), db, sqlite, mailer, logger, background };
  await seedDatabase(ctx);
  const app = createApp(ctx);

  return {
    app,
    ctx,
    logLines,
    async signIn(email, password = demoPassword) {
      const agent = request.agent(app);
      const res = await agent.post('/api/v1/auth/sign-in').send({ email, password });
      if (res.status !== 200) throw new Error(`sign-in of ${email} answered ${res.status}: ${JSON.stringify(res.body)}`);
      return agent;
    },
    async waitForMail(to, subjectPart) {
      const inbox = ctx.mailer.inbox;
      if (!inbox) throw new Error('no fake SMTP inbox in this test app');
      // 15 s: a deadline for a loaded machine (mail goes through the fake SMTP server), not a measure
      for (const deadline = Date.now() + 15_000; Date.now() < deadline;) {
        const found = inbox.list().find((m) => m.to.includes(to) && m.subject.includes(subjectPart));
        if (found) {
          const message = await inbox.get(found.id);
          if (message) return message;
        }
        await new Promise((resolve) => setTimeout(resolve, 50));
      }
      throw new Error(`no mail to ${to} with "${subjectPart}" arrived within 15 s`);
    },
    async close() {
      await ctx.background.idle();
      await mailer.close();
      sqlite.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** The single-use secret at the end of a link like http://eclipta.test/invite/<secret>. */
export function linkToken(text: string, route: 'invite' | 'reset-password'): string {
  const match = new RegExp(`${publicUrl.replace(/\./g, '\\.')}/${route}/([A-Za-z0-9_-]+)`).exec(text);
  if (!match?.[1]) throw new Error(`no ${route} link in the mail text: ${text}`);
  return match[1];
}

export function workspaceIdOf(t: TestApp, name: 'Kestrel' | 'Plover'): string {
  const row = t.ctx.sqlite.prepare('SELECT id FROM workspaces WHERE name = ?').get(name) as { id: string } | undefined;
  if (!row) throw new Error(`no workspace ${name}`);
  return row.id;
}

export function userIdOf(t: TestApp, email: string): string {
  const row = t.ctx.sqlite.prepare('SELECT id FROM users WHERE email = ?').get(email) as { id: string } | undefined;
  if (!row) throw new Error(`no user ${email}`);
  return row.id;
}
