// auth/*: health, sign-in and out, the signed-in user, password reset (shared/api/auth.ts).
import { z } from 'zod';
import { meResponse as meSchema, passwordResetConfirm, passwordResetRequest, signIn } from '../../shared/api/auth';
import { meResponse } from '../auth/me-response';
import { confirmPasswordReset, requestPasswordReset, resetRequestedMessage, resetConfirmedMessage } from '../auth/password-reset';
import { clientAddress, rateLimiterOf, resetLimits } from '../auth/rate-limiter';
import { clearSessionCookie, startSession } from '../auth/session';
import { signInWithPassword, signOut } from '../auth/sign-in';
import { route, type ApiRoute } from '../http/api-route';

const v1 = '/api/v1';
const message = z.object({ message: z.string() });

export const authRoutes: ApiRoute[] = [
  route({
    method: 'get', path: '/api/health', tag: 'service', summary: 'Health: {"status":"ok"} once migrations are applied', access: 'public',
    response: z.object({ status: z.literal('ok') }),
    handle: () => ({ status: 'ok' }),
  }),
  route({
    method: 'post', path: `${v1}/auth/sign-in`, tag: 'auth', summary: 'Sign in; sets the session cookie', access: 'public', body: signIn, response: meSchema,
    handle: async ({ ctx, req, res, body }) => {
      const user = await signInWithPassword(ctx, body(), clientAddress(req));
      startSession(ctx, res, user);
      return meResponse(ctx.db, user, { kind: 'session', readOnly: false });
    },
  }),
  route({
    method: 'post', path: `${v1}/auth/sign-out`, tag: 'auth', summary: 'Sign out', access: 'signed-in', status: 204,
    handle: ({ ctx, res, auth }) => {
      signOut(ctx, auth);
      clearSessionCookie(ctx, res);
    },
  }),
  route({
    method: 'get', path: `${v1}/auth/me`, tag: 'auth', summary: 'The caller, their workspaces and how they authenticated', access: 'signed-in', response: meSchema,
    handle: ({ ctx, auth }) => meResponse(ctx.db, auth.user, { kind: auth.kind, readOnly: auth.readOnly }),
  }),
  route({
    method: 'post', path: `${v1}/auth/password-reset`, tag: 'auth', summary: 'Mail a password-reset link (same answer for unknown addresses)', access: 'public',
    body: passwordResetRequest, status: 202, response: message,
    handle: ({ ctx, req, body }) => {
      const input = body();
      // The same limits, the same writes and the same answer whether or not the address has an
      // account; looking it up, writing the reset and mailing it happen after the answer.
      const keys = [
        [resetLimits.address, input.email.toLowerCase()],
        [resetLimits.client, clientAddress(req)],
        [resetLimits.everyone, '*'],
      ] as const;
      const limiter = rateLimiterOf(ctx.db);
      limiter.check(keys);
      limiter.record(keys);
      ctx.background.run('password reset mail', () => requestPasswordReset(ctx, input.email));
      return { message: resetRequestedMessage };
    },
  }),
  route({
    method: 'post', path: `${v1}/auth/password-reset/confirm`, tag: 'auth', summary: 'Set a new password with the link’s token', access: 'public',
    body: passwordResetConfirm, response: message,
    handle: async ({ ctx, body }) => {
      const input = body();
      const outcome = await confirmPasswordReset(ctx, input.token, input.password);
      return { message: resetConfirmedMessage(outcome.tokensRevoked) };
    },
  }),
];
