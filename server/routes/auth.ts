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
import { endSession, startSession } from '../auth/session';
import { SignInLimiter } from '../auth/sign-in-limiter';
import { users } from '../db/schema';
import { ApiError, parse } from '../errors';

const wrongCredentials = 'The e-mail address or password is not right.';

export function authRoutes(ctx: AppContext, limiter = new SignInLimiter()): Router {
  const router = Router();

  router.post('/auth/sign-in', async (req, res) => {
    const input = parse(signIn, req.body);
    const ip = req.ip ?? 'unknown';
    limiter.check(input.email, ip);
    const user = ctx.db.select().from(users).where(eq(users.email, input.email)).get();
    const ok = user
      ? await verifyPassword(input.password, user.passwordHash)
      : await burnPasswordCheck(input.password, ctx.config.bcryptCost);
    if (!user || !ok) {
      limiter.recordFailure(input.email, ip);
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
    limiter.recordSuccess(input.email, ip);
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

  router.post('/auth/sign-out', requireUser, (_req, res) => {
    endSession(ctx, res);
    res.status(204).end();
  });

  router.get('/auth/me', requireUser, (req, res) => {
    const auth = signedIn(req);
    res.json(meResponse(ctx.db, auth.user, { kind: auth.kind, readOnly: auth.readOnly }));
  });

  router.post('/auth/password-reset', (req, res) => {
    const input = parse(passwordResetRequest, req.body);
    // Not awaited: answering before the mail goes out keeps known and unknown addresses
    // indistinguishable by timing as well as by the answer.
    requestPasswordReset(ctx, input.email).catch((err: unknown) => {
      ctx.logger.error('password reset mail failed', { error: err instanceof Error ? err : String(err) });
    });
    res.status(202).json({ message: resetRequestedMessage });
  });

  router.post('/auth/password-reset/confirm', async (req, res) => {
    const input = parse(passwordResetConfirm, req.body);
    await confirmPasswordReset(ctx, input.token, input.password);
    res.json({ message: 'Your password was changed. Sign in with the new one.' });
  });

  return router;
}
