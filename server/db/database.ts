// Opens the SQLite file with the settings every connection needs and applies the generated
// migrations. The migrations folder is passed in (from the config, resolved against the working
// directory) so the same code runs under tsx and from the esbuild bundle in dist/server/.
import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import * as schema from './schema';
import { makePrivate } from '../private-files';
import { ensureMaterialLibrary } from '../missions/material-library';
import { packPointsAggregate } from '../ephemerides/point-blocks';

export type Db = BetterSQLite3Database<typeof schema>;
export type Sqlite = Database.Database;
/** The handle a transaction callback gets. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** A database handle or a transaction's: both answer the same queries. */
export type DbOrTx = Db | Tx;

export interface OpenedDatabase {
  db: Db;
  sqlite: Sqlite;
}

export function openDatabase(file: string): OpenedDatabase {
  if (file !== ':memory:') mkdirSync(path.dirname(file), { recursive: true });
  const sqlite = new Database(file);
  // WAL lets readers go on while a write commits; foreign keys are off by default in SQLite.
  sqlite.pragma('journal_mode = WAL');
  // In WAL mode NORMAL is safe from corruption: a commit is durable once the WAL is synced at the
  // next checkpoint, and a power cut can lose only the last commits, never leave a torn database.
  // FULL would sync on every commit, which a large ephemeris upload pays for in full.
  sqlite.pragma('synchronous = NORMAL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  // Used by the migration that moved ephemeris points into blocks.
  sqlite.aggregate('eclipta_pack_points', packPointsAggregate);
  // The database holds every account and case: the server's user only (see private-files.ts).
  if (file !== ':memory:') makePrivate(file, `${file}-wal`, `${file}-shm`);
  return { db: drizzle(sqlite, { schema }), sqlite };
}

export function migrateDatabase(db: Db, migrationsFolder: string): void {
  migrate(db, { migrationsFolder });
  // Reference data the schema implies, so it is there with or without the demo seed.
  ensureMaterialLibrary(db);
}
