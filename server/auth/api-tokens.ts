// Personal API tokens: "ecl_" + 32 random bytes (base64url), stored as SHA-256 hex only.
import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import type { ApiToken, TokenCreated } from '../../shared/api/auth';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { preparedPer } from '../db/prepared';
import { apiTokens, users, type ApiTokenRow, type UserRow } from '../db/schema';
import { forbidden, notFound } from '../errors';
import type { RequestAuth } from './request-auth';
import { newSecret, sha256Hex } from './secret-tokens';
import { DAY_MS } from '../../shared/physics/constants';

export const tokenPrefix = 'ecl_';

export function toApiToken(row: ApiTokenRow): ApiToken {
  return {
    id: row.id,
    name: row.name,
    readOnly: row.readOnly,
    prefix: row.prefix,
    createdAt: row.createdAt,
    lastUsedAt: row.lastUsedAt,
    expiresAt: row.expiresAt,
  };
}

type NewTokenInput = { name: string; readOnly: boolean; expiresInDays?: number | undefined };

export function createApiToken(
  db: Pick<Db, 'insert'>,
  userId: string,
  input: NewTokenInput,
): { row: ApiTokenRow; secret: string } {
  const { secret, hash } = newSecret(tokenPrefix);
  const expiresAt =
    input.expiresInDays === undefined ? null : new Date(Date.now() + input.expiresInDays * DAY_MS).toISOString();
  const row = db
    .insert(apiTokens)
    .values({ userId, name: input.name, readOnly: input.readOnly, tokenHash: hash, prefix: secret.slice(0, 12), expiresAt })
    .returning()
    .get();
  return { row, secret };
}

export type TokenLookup =
  | { ok: true; row: ApiTokenRow; user: UserRow }
  | { ok: false; reason: 'unknown' | 'revoked' | 'expired' };

const tokenWithUser = preparedPer((db: Db) =>
  db
    .select({ row: apiTokens, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(eq(apiTokens.tokenHash, sql.placeholder('hash')))
    .prepare(),
);

/**
 * The token of a secret and its owner, read from the database on every request (one prepared
 * query, no cache), so a revoked token is refused at once.
 */
export function findApiToken(db: Db, secret: string, now = new Date()): TokenLookup {
  const found = tokenWithUser(db).get({ hash: sha256Hex(secret) });
  if (!found) return { ok: false, reason: 'unknown' };
  const { row, user } = found;
  if (row.revokedAt) return { ok: false, reason: 'revoked' };
  if (row.expiresAt && Date.parse(row.expiresAt) <= now.getTime()) return { ok: false, reason: 'expired' };
  return { ok: true, row, user };
}

/** How long a token's recorded last use may lag behind its real last use. */
export const tokenUseResolutionMs = 60_000;

const recordTokenUse = preparedPer((db: Db) =>
  db
    .update(apiTokens)
    .set({ lastUsedAt: sql`${sql.placeholder('at')}` })
    .where(eq(apiTokens.id, sql.placeholder('id')))
    .prepare(),
);

/**
 * Records use at most once a minute, so a busy script does not turn every read into a write: the
 * row read for this request says when use was last recorded.
 */
export function touchApiToken(db: Db, row: ApiTokenRow, now = new Date()): void {
  if (row.lastUsedAt && now.getTime() - Date.parse(row.lastUsedAt) < tokenUseResolutionMs) return;
  recordTokenUse(db).run({ at: now.toISOString(), id: row.id });
}

/** The user's tokens that are not revoked, newest first. */
export function listApiTokens(db: Db, userId: string): ApiToken[] {
  return db
    .select()
    .from(apiTokens)
    .where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)))
    .orderBy(desc(apiTokens.createdAt))
    .all()
    .map(toApiToken);
}

/** A new token with its audit event; only a signed-in session may make one (checked before the input is read). */
export function issueApiToken(db: Db, auth: RequestAuth, readInput: () => NewTokenInput): TokenCreated {
  // A leaked token must not be able to mint more tokens that outlive its revocation.
  if (auth.kind !== 'session') throw forbidden('Create API tokens while signed in, not with another token.');
  const input = readInput();
  const user = auth.user;
  const created = db.transaction((tx) => {
    const made = createApiToken(tx, user.id, input);
    recordAudit(tx, {
      workspaceId: null,
      actorUserId: user.id,
      action: 'token.created',
      targetType: 'api_token',
      targetId: made.row.id,
      summary: `API token "${made.row.name}" created${made.row.readOnly ? ' (read-only)' : ''}.`,
    });
    return made;
  });
  return { token: toApiToken(created.row), secret: created.secret };
}

/** Revokes one of the user's own tokens with its audit event (404 for anyone else's). */
export function revokeApiToken(db: Db, userId: string, id: string): void {
  db.transaction((tx) => {
    const row = tx
      .select()
      .from(apiTokens)
      .where(and(eq(apiTokens.id, id), eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)))
      .get();
    if (!row) throw notFound(`No API token with id ${JSON.stringify(id.slice(0, 80))}.`);
    tx.update(apiTokens).set({ revokedAt: new Date().toISOString() }).where(eq(apiTokens.id, id)).run();
    recordAudit(tx, {
      workspaceId: null,
      actorUserId: userId,
      action: 'token.revoked',
      targetType: 'api_token',
      targetId: id,
      summary: `API token "${row.name}" revoked.`,
    });
  });
}
