// Answers read from the database remembered until the database changes: what every authenticated
// request reads again and again (its session or token row with the user, the user's workspaces,
// the case list) is read once per change of the database instead of once per request (issue 16
// item 3; `npm run bench -- auth`).
//
// "The database changed" is exact and cheap: one prepared statement reading SQLite's
// total_changes() (rows this connection inserted, updated or deleted since it opened, counted when
// the statement runs, so a write of this process shows at once) and PRAGMA data_version (which
// changes when another connection, in this process or another, commits; it does not move for this
// connection's own commits, hence both). Any write anywhere therefore empties the memory, so
// sign-out, a password reset, a token's revocation or a member's removal take effect on the very
// next request, exactly as when every request read the rows itself. Inside an open transaction
// nothing is remembered or served (its writes could still be rolled back). What is remembered is
// frozen: it is shared by every request that reads it until the next change.
import type { Db, Sqlite } from './database';
import { preparedPer } from './prepared';

/** How many answers are remembered per database before the memory is emptied. */
const maxEntries = 5_000;

interface Memory {
  /** Rows changed by this connection and the data version when the entries were read. */
  changes: number;
  version: number;
  entries: Map<string, unknown>;
  totalChanges: () => number;
  dataVersion: () => number;
  sqlite: Sqlite;
}

const memoryOf = preparedPer((db: Db): Memory => {
  // drizzle keeps the better-sqlite3 handle it was made with as $client (not in the Db type).
  const sqlite = (db as Db & { $client: Sqlite }).$client;
  // Two plain statements: reading the pragma as a table in one SELECT cost about twice as much.
  const totalChanges = sqlite.prepare<[], number>('SELECT total_changes()').pluck();
  const dataVersion = sqlite.prepare<[], number>('PRAGMA data_version').pluck();
  return {
    changes: -1,
    version: -1,
    entries: new Map(),
    totalChanges: () => totalChanges.get() as number,
    dataVersion: () => dataVersion.get() as number,
    sqlite,
  };
});

/** True when the database is as it was when the entries were read; else empties them and keeps the new generation. */
function unchanged(memory: Memory): boolean {
  const changes = memory.totalChanges();
  const version = memory.dataVersion();
  if (changes === memory.changes && version === memory.version) return true;
  memory.entries.clear();
  memory.changes = changes;
  memory.version = version;
  return false;
}

function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const inner of Object.values(value)) deepFreeze(inner);
  }
  return value;
}

/**
 * `read()`'s answer, remembered under `key` for as long as the database does not change (any
 * write, by this connection or another). `read` must depend on nothing but the database and the
 * key (no clock: check times on what it returns). The answer is frozen, so callers must not change it.
 */
export function memoisedRead<T>(db: Db, key: string, read: () => T): T {
  const memory = memoryOf(db);
  if (memory.sqlite.inTransaction) return read();
  if (unchanged(memory) && memory.entries.has(key)) return memory.entries.get(key) as T;
  const value = deepFreeze(read());
  // Remembered only when reading it wrote nothing, so it belongs to the generation it is kept under.
  if (unchanged(memory)) {
    if (memory.entries.size >= maxEntries) memory.entries.clear();
    memory.entries.set(key, value);
  }
  return value;
}
