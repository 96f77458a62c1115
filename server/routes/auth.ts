// auth/*: sign-in and out, the signed-in user, password reset (shared/api/auth.ts).
import { Router } from 'express';
import { eq } from 'drizzle-orm';
import { passwordResetConfirm, passwordResetRequest, signIn } from '../../shared/api/auth';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import { meResponse } from '../auth/me-response';
import { requireUser, signedIn } from '../auth/middleware';
import { confirmPasswordReset, requestPasswordReset, resetRequestedMessage } from '../auth/password-reset';
import { burnPasswordCheck, verifyPassword } from '../auth/passwords';
import { clientAddress, passwordCheckLimits, RateLimiter, resetLimits } from '../auth/rate-limiter';
import { clearSessionCookie, endSessions, startSession } from '../auth/session';
import { users } from '../db/schema';
import { ApiError, parse } from '../errors';

const wrongCredentials = 'The e-mail address or password is not right.';

export function authRoutes(ctx: AppContext): Router {
  const router = Router();
  const limiter = new RateLimiter(ctx.db);

  router.post('/auth/sign-in', async (req, res) => {
    const input = parse(signIn, req.body);
    const limits = passwordCheckLimits(limiter, input.email, clientAddress(req));
    limits.check();
    const user = ctx.db.select().from(users).where(eq(users.email, input.email)).get();
    const ok = user
      ? await verifyPassword(input.password, user.passwordHash)
      : await burnPasswordCheck(input.password, ctx.config.bcryptCost);
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
    startSession(ctx, res, user);
    res.json(meResponse(ctx.db, user, { kind: 'session', readOnly: false }));
  });

  router.post('/auth/sign-out', requireUser, (req, res) => {
    const auth = signedIn(req);
    if (auth.sessionId) {
      const sessionId = auth.sessionId;
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
    clearSessionCookie(ctx, res);
    res.status(204).end();
  });

  router.get('/auth/me', requireUser, (req, res) => {
    const auth = signedIn(req);
    res.json(meResponse(ctx.db, auth.user, { kind: auth.kind, readOnly: auth.readOnly }));
  });

  router.post('/auth/password-reset', (req, res) => {
    const input = parse(passwordResetRequest, req.body);
    // The same limits, the same writes and the same answer whether or not the address has an
    // account; looking it up, writing the reset and mailing it happen after the answer.
    const keys = [
      [resetLimits.address, input.email.toLowerCase()],
      [resetLimits.client, clientAddress(req)],
      [resetLimits.everyone, '*'],
    ] as const;
    limiter.check(keys);
    limiter.record(keys);
    ctx.background.run('password reset mail', () => requestPasswordReset(ctx, input.email));
    res.status(202).json({ message: resetRequestedMessage });
  });

  router.post('/auth/password-reset/confirm', async (req, res) => {
    const input = parse(passwordResetConfirm, req.body);
    const outcome = await confirmPasswordReset(ctx, input.token, input.password);
    const tokens =
      outcome.tokensRevoked === 0
        ? ''
        : ` Your ${outcome.tokensRevoked} personal API token${outcome.tokensRevoked === 1 ? ' was' : 's were'} revoked; make new ones after signing in.`;
    res.json({ message: `Your password was changed and every session of your account was ended.${tokens} Sign in with the new password.` });
  });

  return router;
}
