// The accounts side of the schema: users, workspaces and memberships, credentials (API tokens,
// sessions, invitations, password resets), rate-limit attempts and the audit log. The feature
// tables reference these; server/db/schema.ts gathers every table file into the one schema.
import { sql } from 'drizzle-orm';
import { index, integer, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { roles } from '../../shared/api/workspaces';
import { createdAt, id } from './columns';

export const users = sqliteTable('users', {
  id: id(),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  isAdmin: integer('is_admin', { mode: 'boolean' }).notNull().default(false),
  /** When a reset last set the password (the sessions it ended are in the sessions table). */
  passwordChangedAt: text('password_changed_at'),
  createdAt: createdAt(),
});

export const workspaces = sqliteTable('workspaces', {
  id: id(),
  name: text('name').notNull(),
  createdAt: createdAt(),
});

/** A row that belongs to one workspace and goes with it. */
export const workspaceRef = () =>
  text('workspace_id')
    .notNull()
    .references(() => workspaces.id, { onDelete: 'cascade' });

export const memberships = sqliteTable(
  'memberships',
  {
    id: id(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    workspaceId: workspaceRef(),
    role: text('role', { enum: roles }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('memberships_user_workspace').on(t.userId, t.workspaceId), index('memberships_workspace').on(t.workspaceId)],
);

export const apiTokens = sqliteTable(
  'api_tokens',
  {
    id: id(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    /** SHA-256 hex of the secret; the secret itself is shown once and never stored. */
    tokenHash: text('token_hash').notNull().unique(),
    prefix: text('prefix').notNull(),
    readOnly: integer('read_only', { mode: 'boolean' }).notNull().default(false),
    createdAt: createdAt(),
    expiresAt: text('expires_at'),
    lastUsedAt: text('last_used_at'),
    revokedAt: text('revoked_at'),
  },
  (t) => [index('api_tokens_user').on(t.userId)],
);

export const invitations = sqliteTable(
  'invitations',
  {
    id: id(),
    workspaceId: workspaceRef(),
    email: text('email').notNull(),
    role: text('role', { enum: roles }).notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    // Keeps the invitation (and its audit trail) if the inviter's account goes.
    invitedBy: text('invited_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    expiresAt: text('expires_at').notNull(),
    acceptedAt: text('accepted_at'),
  },
  (t) => [index('invitations_workspace').on(t.workspaceId)],
);

export const passwordResets = sqliteTable('password_resets', {
  id: id(),
  userId: text('user_id')
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull().unique(),
  createdAt: createdAt(),
  expiresAt: text('expires_at').notNull(),
  usedAt: text('used_at'),
});

/**
 * One row per sign-in: the session cookie (a signed JWT) names its row, and a request is let in
 * only while the row is open. Sign-out ends one row; a password reset ends all of a user's rows.
 */
export const sessions = sqliteTable(
  'sessions',
  {
    id: id(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
    expiresAt: text('expires_at').notNull(),
    endedAt: text('ended_at'),
  },
  (t) => [index('sessions_user').on(t.userId)],
);

/**
 * Attempts counted by the rate limits (server/auth/rate-limiter.ts), kept in the database so that a
 * restart does not forget them. `bucket` names the limit, `key` what it counts by (an e-mail, a
 * client address, or "*" for all), `atMs` is milliseconds since 1970.
 */
export const rateLimitHits = sqliteTable(
  'rate_limit_hits',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    bucket: text('bucket').notNull(),
    key: text('key').notNull(),
    atMs: integer('at_ms').notNull(),
  },
  (t) => [index('rate_limit_hits_bucket_key_at').on(t.bucket, t.key, t.atMs)],
);

export const auditEvents = sqliteTable(
  'audit_events',
  {
    id: id(),
    /** Null for instance-wide events such as a sign-in. */
    workspaceId: text('workspace_id').references(() => workspaces.id, { onDelete: 'cascade' }),
    actorUserId: text('actor_user_id').references(() => users.id, { onDelete: 'set null' }),
    /** Dotted verb, e.g. "member.role_changed", "auth.sign_in_failed". */
    action: text('action').notNull(),
    targetType: text('target_type').notNull(),
    targetId: text('target_id'),
    summary: text('summary').notNull(),
    at: text('at')
      .notNull()
      .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ', 'now'))`),
  },
  (t) => [index('audit_events_workspace_at').on(t.workspaceId, t.at)],
);

export type UserRow = typeof users.$inferSelect;
export type WorkspaceRow = typeof workspaces.$inferSelect;
export type MembershipRow = typeof memberships.$inferSelect;
export type ApiTokenRow = typeof apiTokens.$inferSelect;
export type InvitationRow = typeof invitations.$inferSelect;
export type PasswordResetRow = typeof passwordResets.$inferSelect;
export type SessionRow = typeof sessions.$inferSelect;
export type AuditEventRow = typeof auditEvents.$inferSelect;
