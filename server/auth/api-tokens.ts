// Personal API tokens: "ecl_" + 32 random bytes (base64url), stored as SHA-256 hex only.
import { eq } from 'drizzle-orm';
import type { ApiToken } from '../../shared/api/auth';
import type { Db } from '../db/database';
import { apiTokens, type ApiTokenRow } from '../db/schema';
import { newSecret, sha256Hex } from './secret-tokens';

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

export function createApiToken(
  db: Pick<Db, 'insert'>,
  userId: string,
  input: { name: string; readOnly: boolean; expiresInDays?: number | undefined },
): { row: ApiTokenRow; secret: string } {
  const { secret, hash } = newSecret(tokenPrefix);
  const expiresAt =
    input.expiresInDays === undefined ? null : new Date(Date.now() + input.expiresInDays * 86_400_000).toISOString();
  const row = db
    .insert(apiTokens)
    .values({ userId, name: input.name, readOnly: input.readOnly, tokenHash: hash, prefix: secret.slice(0, 12), expiresAt })
    .returning()
    .get();
  return { row, secret };
}

export type TokenLookup =
  | { ok: true; row: ApiTokenRow }
  | { ok: false; reason: 'unknown' | 'revoked' | 'expired' };

export function findApiToken(db: Db, secret: string, now = new Date()): TokenLookup {
  const row = db.select().from(apiTokens).where(eq(apiTokens.tokenHash, sha256Hex(secret))).get();
  if (!row) return { ok: false, reason: 'unknown' };
  if (row.revokedAt) return { ok: false, reason: 'revoked' };
  if (row.expiresAt && Date.parse(row.expiresAt) <= now.getTime()) return { ok: false, reason: 'expired' };
  return { ok: true, row };
}

/** Records use at most once a minute, so a busy script does not turn every read into a write. */
export function touchApiToken(db: Db, row: ApiTokenRow, now = new Date()): void {
  if (row.lastUsedAt && now.getTime() - Date.parse(row.lastUsedAt) < 60_000) return;
  db.update(apiTokens)
    .set({ lastUsedAt: now.toISOString() })
    .where(eq(apiTokens.id, row.id))
    .run();
}
