// tokens: the caller's personal API tokens (shared/api/auth.ts).
import { z } from 'zod';
import { apiToken, tokenCreate, tokenCreated } from '../../shared/api/auth';
import { issueApiToken, listApiTokens, revokeApiToken } from '../auth/api-tokens';
import { route, type ApiRoute } from '../http/api-route';

const v1 = '/api/v1';

export const tokenRoutes: ApiRoute[] = [
  route({
    method: 'get', path: `${v1}/tokens`, tag: 'tokens', summary: 'The caller’s personal API tokens', access: 'signed-in',
    response: z.object({ items: z.array(apiToken) }),
    handle: ({ ctx, auth }) => ({ items: listApiTokens(ctx.db, auth.user.id) }),
  }),
  route({
    method: 'post', path: `${v1}/tokens`, tag: 'tokens', summary: 'Create a personal API token (the secret is shown once)', access: 'signed-in',
    body: tokenCreate, status: 201, response: tokenCreated,
    // Signed in, not another token: checked before the body is read.
    handle: ({ ctx, auth, body }) => issueApiToken(ctx.db, auth, body),
  }),
  route({
    method: 'delete', path: `${v1}/tokens/:id`, tag: 'tokens', summary: 'Revoke a token', access: 'signed-in', status: 204,
    handle: ({ ctx, auth, param }) => revokeApiToken(ctx.db, auth.user.id, param('id')),
  }),
];
