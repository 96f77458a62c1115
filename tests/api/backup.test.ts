// Online backup while the server is writing, and a restore that brings exactly that state back.
import { mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { backupDatabase, restoreDatabase } from '../../server/db/backup';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let dir: string;

beforeAll(async () => {
  t = await createTestApp();
  dir = mkdtempSync(path.join(tmpdir(), 'eclipta-backup-'));
});
afterAll(async () => {
  await t.close();
  rmSync(dir, { recursive: true, force: true });
});

const tokenNames = (file: string): string[] => {
  const db = new Database(file, { readonly: true });
  try {
    return db.prepare('SELECT name FROM api_tokens ORDER BY name').all().map((r) => (r as { name: string }).name);
  } finally {
    db.close();
  }
};

describe('backup and restore', () => {
  it('backs up the live database and restores exactly the state at the backup', async () => {
    const owner = await t.signIn('owner@kestrel.test');
    await owner.post('/api/v1/tokens').send({ name: 'before the backup' }).expect(201);

    const backup = await backupDatabase(t.ctx.config.dbPath, path.join(dir, 'backups'), new Date('2027-01-02T03:04:05.678Z'));
    expect(path.basename(backup)).toBe('eclipta-2027-01-02T03-04-05-678Z.db');
    // a copy of every account: private to the server's user, like the database (issue 12, item 10)
    expect(statSync(backup).mode & 0o777).toBe(0o600);

    await owner.post('/api/v1/tokens').send({ name: 'after the backup' }).expect(201);

    const restored = path.join(dir, 'restored', 'eclipta.db');
    restoreDatabase(backup, restored);
    expect(tokenNames(restored)).toEqual(['before the backup']);
    const check = new Database(restored, { readonly: true });
    expect(check.pragma('integrity_check', { simple: true })).toBe('ok');
    check.close();
  });

  it('keeps the replaced database and refuses a file that is not an Eclipta database', async () => {
    const target = path.join(dir, 'target.db');
    const backup = await backupDatabase(t.ctx.config.dbPath, path.join(dir, 'more'));
    restoreDatabase(backup, target);
    const kept = restoreDatabase(backup, target);
    expect(readdirSync(dir)).toContain(path.basename(kept));

    const junk = path.join(dir, 'junk.db');
    writeFileSync(junk, 'this is not a database');
    expect(() => restoreDatabase(junk, target)).toThrow();
    const empty = path.join(dir, 'empty.db');
    new Database(empty).close();
    expect(() => restoreDatabase(empty, target)).toThrow(/not an Eclipta database/);
    // A refused restore leaves the database it would have replaced as it was.
    expect(tokenNames(target)).toEqual(['after the backup', 'before the backup']);
  });
});
