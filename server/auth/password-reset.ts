// Password reset by e-mail: a single-use secret valid for one hour, stored hashed.
import { and, eq, isNull } from 'drizzle-orm';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import { apiTokens, passwordResets, users } from '../db/schema';
import { badRequest } from '../errors';
import { passwordResetMail } from '../mail/messages';
import { hashPassword } from './passwords';
import { newSecret, sha256Hex } from './secret-tokens';
import { endSessions } from './session';

const resetValidMs = 60 * 60 * 1000;

export const resetRequestedMessage =
  'If an account with this e-mail address exists, a message with a link to choose a new password is on its way.';

/** What the confirmation answers, naming the API tokens the reset revoked. */
export function resetConfirmedMessage(tokensRevoked: number): string {
  const tokens =
    tokensRevoked === 0
      ? ''
      : ` Your ${tokensRevoked} personal API token${tokensRevoked === 1 ? ' was' : 's were'} revoked; make new ones after signing in.`;
  return `Your password was changed and every session of your account was ended.${tokens} Sign in with the new password.`;
}

/**
 * Creates a reset for a known address and mails it; does nothing for an unknown one. Run it as
 * background work (ctx.background), never inside the request: the request's answer and its time
 * must not depend on whether the address exists.
 */
export async function requestPasswordReset(ctx: AppContext, email: string): Promise<void> {
  const user = ctx.db.select().from(users).where(eq(users.email, email)).get();
  if (!user) return;
  const { secret, hash } = newSecret();
  const expiresAt = new Date(Date.now() + resetValidMs).toISOString();
  ctx.db.transaction((tx) => {
    tx.insert(passwordResets).values({ userId: user.id, tokenHash: hash, expiresAt }).run();
    recordAudit(tx, {
      workspaceId: null,
      actorUserId: user.id,
      action: 'auth.password_reset_requested',
      targetType: 'user',
      targetId: user.id,
      summary: `Password reset requested for ${user.email}.`,
    });
  });
  await ctx.mailer.send(
    passwordResetMail({ to: user.email, link: `${ctx.config.publicUrl}/reset-password/${secret}`, expiresAt }),
  );
}

export interface ResetOutcome {
  sessionsEnded: number;
  tokensRevoked: number;
}

/**
 * Sets the new password; every session of the account ends and every personal API token it had
 * is revoked (whoever asked for the reset may be the one holding them), all in one transaction.
 */
export async function confirmPasswordReset(ctx: AppContext, token: string, password: string): Promise<ResetOutcome> {
  const reset = ctx.db.select().from(passwordResets).where(eq(passwordResets.tokenHash, sha256Hex(token))).get();
  if (!reset || reset.usedAt || Date.parse(reset.expiresAt) <= Date.now()) {
    throw badRequest('This password reset link is not valid any more: it was used or has expired. Ask for a new one.', [
      { path: 'token', message: 'is not a valid, unused reset link' },
    ], 'invalid_token');
  }
  const passwordHash = await hashPassword(password, ctx.config.bcryptCost);
  const now = new Date().toISOString();
  return ctx.db.transaction((tx) => {
    // Marking it used only if still unused closes the race of two confirmations at once.
    const claimed = tx
      .update(passwordResets)
      .set({ usedAt: now })
      .where(and(eq(passwordResets.id, reset.id), isNull(passwordResets.usedAt)))
      .run();
    if (claimed.changes !== 1) {
      throw badRequest('This password reset link was already used. Ask for a new one.', undefined, 'invalid_token');
    }
    // Any other outstanding links for this account stop working too.
    tx.update(passwordResets)
      .set({ usedAt: now })
      .where(and(eq(passwordResets.userId, reset.userId), isNull(passwordResets.usedAt)))
      .run();
    tx.update(users).set({ passwordHash, passwordChangedAt: now }).where(eq(users.id, reset.userId)).run();
    recordAudit(tx, {
      workspaceId: null,
      actorUserId: reset.userId,
      action: 'auth.password_reset',
      targetType: 'user',
      targetId: reset.userId,
      summary: 'Password changed through a reset link.',
    });
    const sessionsEnded = endSessions(tx, { userId: reset.userId });
    const revoked = tx
      .update(apiTokens)
      .set({ revokedAt: now })
      .where(and(eq(apiTokens.userId, reset.userId), isNull(apiTokens.revokedAt)))
      .returning({ name: apiTokens.name })
      .all();
    if (revoked.length > 0) {
      recordAudit(tx, {
        workspaceId: null,
        actorUserId: reset.userId,
        action: 'token.revoked',
        targetType: 'user',
        targetId: reset.userId,
        summary: `Password reset: ${revoked.length} personal API token${revoked.length === 1 ? '' : 's'} revoked (${revoked.map((r) => JSON.stringify(r.name)).join(', ')}).`,
      });
    }
    return { sessionsEnded, tokensRevoked: revoked.length };
  });
}
