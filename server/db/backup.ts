// Online backup and restore of the SQLite file. The backup uses SQLite's online backup API
// (through better-sqlite3), so it is consistent while the server keeps writing. A restore replaces
// the database file and must run while the server is stopped; it refuses a file that fails
// SQLite's integrity check or is not an Eclipta database.
import Database from 'better-sqlite3';
import { copyFileSync, existsSync, mkdirSync, renameSync, rmSync } from 'node:fs';
import path from 'node:path';
import { makePrivate } from '../private-files';

/** "2026-12-01T20-15-03-123Z": a timestamp that sorts and is safe in a file name. */
export function backupStamp(at = new Date()): string {
  return at.toISOString().replace(/[:.]/g, '-');
}

export async function backupDatabase(dbPath: string, backupDir: string, at = new Date()): Promise<string> {
  if (!existsSync(dbPath)) throw new Error(`There is no database at ${dbPath} to back up.`);
  mkdirSync(backupDir, { recursive: true });
  const target = path.join(backupDir, `eclipta-${backupStamp(at)}.db`);
  const source = new Database(dbPath, { fileMustExist: true });
  try {
    await source.backup(target);
  } finally {
    source.close();
  }
  // A copy of every account and case: for the server's user only, like the database itself.
  makePrivate(target);
  return target;
}

function checkBackup(file: string): void {
  const candidate = new Database(file, { readonly: true, fileMustExist: true });
  try {
    const result = candidate.pragma('integrity_check', { simple: true });
    if (result !== 'ok') throw new Error(`${file} fails SQLite's integrity check: ${String(result)}`);
    const tables = candidate.prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name = 'users'").all();
    if (tables.length === 0) throw new Error(`${file} is not an Eclipta database (it has no users table).`);
  } finally {
    candidate.close();
  }
}

/** Replaces the database with a checked backup; the replaced file is kept beside it as .before-restore. */
export function restoreDatabase(backupFile: string, dbPath: string): string {
  if (!existsSync(backupFile)) throw new Error(`There is no backup at ${backupFile}.`);
  checkBackup(backupFile);
  mkdirSync(path.dirname(dbPath), { recursive: true });
  const kept = `${dbPath}.before-restore`;
  if (existsSync(dbPath)) renameSync(dbPath, kept);
  // The old write-ahead log belongs to the old file and must not be replayed onto the backup.
  for (const suffix of ['-wal', '-shm']) rmSync(dbPath + suffix, { force: true });
  const staged = `${dbPath}.restoring`;
  copyFileSync(backupFile, staged);
  makePrivate(staged);
  renameSync(staged, dbPath);
  return kept;
}
