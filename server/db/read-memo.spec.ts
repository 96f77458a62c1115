// memoisedRead: an answer is read once while the database does not change, and read again after
// any write -- this connection's (SQLite's total_changes()), another connection's (PRAGMA
// data_version, https://sqlite.org/pragma.html#pragma_data_version) -- and never served from
// inside a transaction. Common practice, no source.
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { Db } from './database';
import { memoisedRead } from './read-memo';

let dir: string;
let sqlite: Database.Database;
let db: Db;

beforeEach(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'eclipta-read-memo-'));
  sqlite = new Database(path.join(dir, 'db.sqlite'));
  sqlite.pragma('journal_mode = WAL');
  sqlite.exec('CREATE TABLE t (id INTEGER PRIMARY KEY, v TEXT); INSERT INTO t (v) VALUES (\'a\')');
  db = drizzle(sqlite) as unknown as Db;
});
afterEach(() => {
  sqlite.close();
  rmSync(dir, { recursive: true, force: true });
});

/** Reads t's value and counts the reads. */
function counted(): { read: () => { v: string }; reads: () => number } {
  let n = 0;
  const statement = sqlite.prepare('SELECT v FROM t WHERE id = 1');
  return { read: () => (n++, statement.get() as { v: string }), reads: () => n };
}

describe('memoisedRead', () => {
  it('reads once while nothing is written, and answers the same frozen value', () => {
    const { read, reads } = counted();
    const a = memoisedRead(db, 'k', read);
    const b = memoisedRead(db, 'k', read);
    expect(b).toBe(a);
    expect(reads()).toBe(1);
    expect(Object.isFrozen(a)).toBe(true);
  });

  it('reads again after a write on the same connection, even one that changes no value', () => {
    const { read, reads } = counted();
    memoisedRead(db, 'k', read);
    sqlite.prepare("UPDATE t SET v = 'b' WHERE id = 1").run();
    expect(memoisedRead(db, 'k', read).v).toBe('b');
    sqlite.prepare("UPDATE t SET v = 'b' WHERE id = 1").run();
    memoisedRead(db, 'k', read);
    expect(reads()).toBe(3);
  });

  it('reads again after another connection commits a write', () => {
    const { read, reads } = counted();
    memoisedRead(db, 'k', read);
    const other = new Database(path.join(dir, 'db.sqlite'));
    try {
      other.prepare("UPDATE t SET v = 'elsewhere' WHERE id = 1").run();
    } finally {
      other.close();
    }
    expect(memoisedRead(db, 'k', read).v).toBe('elsewhere');
    expect(reads()).toBe(2);
  });

  it('keeps nothing read inside a transaction that is then rolled back', () => {
    const { read } = counted();
    memoisedRead(db, 'k', read);
    const rolledBack = sqlite.transaction(() => {
      sqlite.prepare("UPDATE t SET v = 'never' WHERE id = 1").run();
      expect(memoisedRead(db, 'k', read).v).toBe('never');
      throw new Error('roll back');
    });
    expect(() => rolledBack()).toThrow('roll back');
    expect(memoisedRead(db, 'k', read).v).toBe('a');
  });

  it('keeps different keys apart', () => {
    expect(memoisedRead(db, 'one', () => 1)).toBe(1);
    expect(memoisedRead(db, 'two', () => 2)).toBe(2);
    expect(memoisedRead(db, 'one', () => 3)).toBe(1);
  });
});
