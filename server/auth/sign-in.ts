// Signing in with a password and signing out, with their rate limits and audit events; the
// routes (server/routes/auth.ts) set and clear the cookie.
import { eq } from 'drizzle-orm';
import type { SignIn } from '../../shared/api/auth';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import { users, type UserRow } from '../db/schema';
import { ApiError } from '../errors';
import { burnPasswordCheck, verifyPassword } from './passwords';
import { passwordCheckLimits, rateLimiterOf } from './rate-limiter';
import type { RequestAuth } from './request-auth';
import { endSessions } from './session';

const wrongCredentials = 'The e-mail address or password is not right.';

/** The user whose e-mail and password these are (401 otherwise), counted by the sign-in limits. */
export async function signInWithPassword(ctx: AppContext, input: SignIn, client: string): Promise<UserRow> {
  const limits = passwordCheckLimits(rateLimiterOf(ctx.db), input.email, client);
  limits.check();
  const user = ctx.db.select().from(users).where(eq(users.email, input.email)).get();
  const ok = user ? await verifyPassword(input.password, user.passwordHash) : await burnPasswordCheck(input.password, ctx.config.bcryptCost);
  if (!user || !ok) {
    limits.failed();
    recordAudit(ctx.db, {
      workspaceId: null,
      actorUserId: user?.id ?? null,
      action: 'auth.sign_in_failed',
      targetType: 'user',
      targetId: user?.id ?? null,
      summary: `Failed sign-in for ${input.email}.`,
    });
    throw new ApiError(401, 'invalid_credentials', wrongCredentials);
  }
  limits.succeeded();
  recordAudit(ctx.db, {
    workspaceId: null,
    actorUserId: user.id,
    action: 'auth.signed_in',
    targetType: 'user',
    targetId: user.id,
    summary: `${user.email} signed in.`,
  });
  return user;
}

/** Ends the caller's session row (a token has none) with its audit event. */
export function signOut(ctx: AppContext, auth: RequestAuth): void {
  const sessionId = auth.sessionId;
  if (!sessionId) return;
  ctx.db.transaction((tx) => {
    endSessions(tx, { sessionId });
    recordAudit(tx, {
      workspaceId: null,
      actorUserId: auth.user.id,
      action: 'auth.signed_out',
      targetType: 'user',
      targetId: auth.user.id,
      summary: `${auth.user.email} signed out.`,
    });
  });
}
