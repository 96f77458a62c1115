// A workspace's own environment table (shared/api/environment-table.ts): read by every member,
// replaced whole by owners and thermal engineers, in one transaction with its audit event.
import { asc, eq } from 'drizzle-orm';
import type { EnvironmentTablePut, EnvironmentTableResponse } from '../../shared/api/environment-table';
import type { EnvironmentTableRow } from '../../shared/physics/environment-table';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { environmentTableRows, type EnvironmentTableDbRow } from '../db/schema';
import type { DbLike } from '../missions/mission-access';

const toRow = (r: EnvironmentTableDbRow): EnvironmentTableRow => ({
  bodyId: r.bodyId, inclinationMinDeg: r.inclinationMinDeg, inclinationMaxDeg: r.inclinationMaxDeg, averagingTimeS: r.averagingTimeS,
  hot: { albedo: r.hotAlbedo, olrWm2: r.hotOlrWm2 }, cold: { albedo: r.coldAlbedo, olrWm2: r.coldOlrWm2 }, source: r.source,
});

const storedRows = (db: Pick<Db, 'select'>, workspaceId: string): EnvironmentTableDbRow[] =>
  db.select().from(environmentTableRows).where(eq(environmentTableRows.workspaceId, workspaceId)).orderBy(asc(environmentTableRows.position)).all();

/** The workspace's rows in the user's order. */
export const environmentTableRowsOf = (db: Pick<Db, 'select'>, workspaceId: string): EnvironmentTableRow[] => storedRows(db, workspaceId).map(toRow);

export function environmentTable(db: DbLike, workspaceId: string): EnvironmentTableResponse {
  const stored = storedRows(db, workspaceId);
  const updatedAt = stored.reduce<string | null>((latest, r) => (latest === null || r.createdAt > latest ? r.createdAt : latest), null);
  return { workspaceId, rows: stored.map(toRow), updatedAt };
}

/** Replaces the whole table; the audit event says how many rows were there before and after. */
export function replaceEnvironmentTable(db: Db, userId: string, workspaceId: string, input: EnvironmentTablePut): EnvironmentTableResponse {
  return db.transaction((tx) => {
    const before = environmentTableRowsOf(tx, workspaceId).length;
    tx.delete(environmentTableRows).where(eq(environmentTableRows.workspaceId, workspaceId)).run();
    const now = new Date().toISOString();
    input.rows.forEach((r, position) => {
      tx.insert(environmentTableRows).values({
        workspaceId, position, bodyId: r.bodyId, inclinationMinDeg: r.inclinationMinDeg, inclinationMaxDeg: r.inclinationMaxDeg,
        averagingTimeS: r.averagingTimeS, hotAlbedo: r.hot.albedo, hotOlrWm2: r.hot.olrWm2, coldAlbedo: r.cold.albedo, coldOlrWm2: r.cold.olrWm2,
        source: r.source, createdAt: now,
      }).run();
    });
    recordAudit(tx, {
      workspaceId, actorUserId: userId, action: 'environment_table.replaced', targetType: 'workspace', targetId: workspaceId,
      summary: `Environment table saved: ${input.rows.length} row(s) (before: ${before}).`,
    });
    return environmentTable(tx, workspaceId);
  });
}
