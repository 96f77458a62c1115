// The audit log: who changed what, written in the same transaction as the change itself.
// Summaries are for people and never hold secrets (no passwords, tokens or links).
import { and, count, desc, eq, gte, lte, sql, type SQL } from 'drizzle-orm';
import type { AuditEvent } from '../../shared/api/workspaces';
import type { Db } from '../db/database';
import { auditEvents, users } from '../db/schema';

export interface AuditEntry {
  workspaceId: string | null;
  actorUserId: string | null;
  action: string;
  targetType: string;
  targetId?: string | null;
  summary: string;
}

/** Pass the transaction's handle when inside one; Drizzle's transaction shares the Db API. */
export function recordAudit(db: Pick<Db, 'insert'>, entry: AuditEntry): void {
  db.insert(auditEvents)
    .values({ ...entry, targetId: entry.targetId ?? null, at: new Date().toISOString() })
    .run();
}

export interface AuditFilter {
  action?: string | undefined;
  /** The actor's e-mail address. */
  actor?: string | undefined;
  since?: string | undefined;
  until?: string | undefined;
  limit: number;
  offset: number;
}

export function listAudit(db: Db, workspaceId: string, filter: AuditFilter): { items: AuditEvent[]; total: number } {
  const conditions: SQL[] = [eq(auditEvents.workspaceId, workspaceId)];
  if (filter.action) conditions.push(eq(auditEvents.action, filter.action));
  if (filter.actor) conditions.push(eq(users.email, filter.actor.trim().toLowerCase()));
  // Stored as UTC ISO text, so the bounds are normalised to the same form before comparing.
  if (filter.since) conditions.push(gte(auditEvents.at, new Date(filter.since).toISOString()));
  if (filter.until) conditions.push(lte(auditEvents.at, new Date(filter.until).toISOString()));
  const where = and(...conditions);

  const items = db
    .select({
      id: auditEvents.id,
      at: auditEvents.at,
      actorEmail: users.email,
      action: auditEvents.action,
      targetType: auditEvents.targetType,
      targetId: auditEvents.targetId,
      summary: auditEvents.summary,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .where(where)
    // newest first; within one millisecond (one transaction writes several) by insertion, not by the random id
    .orderBy(desc(auditEvents.at), desc(sql`"audit_events".rowid`))
    .limit(filter.limit)
    .offset(filter.offset)
    .all();
  const totalRow = db
    .select({ n: count() })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorUserId))
    .where(where)
    .get();
  return { items, total: totalRow?.n ?? 0 };
}
