// tokens: the caller's personal API tokens (shared/api/auth.ts).
import { Router } from 'express';
import { and, desc, eq, isNull } from 'drizzle-orm';
import { tokenCreate, type TokenCreated } from '../../shared/api/auth';
import type { AppContext } from '../app-context';
import { pathParam } from '../path-param';
import { recordAudit } from '../audit/audit-log';
import { createApiToken, toApiToken } from '../auth/api-tokens';
import { requireUser, signedIn } from '../auth/middleware';
import { apiTokens } from '../db/schema';
import { forbidden, notFound, parse } from '../errors';

export function tokenRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/tokens', requireUser, (req, res) => {
    const rows = ctx.db
      .select()
      .from(apiTokens)
      .where(and(eq(apiTokens.userId, signedIn(req).user.id), isNull(apiTokens.revokedAt)))
      .orderBy(desc(apiTokens.createdAt))
      .all();
    res.json({ items: rows.map(toApiToken) });
  });

  router.post('/tokens', requireUser, (req, res) => {
    // A leaked token must not be able to mint more tokens that outlive its revocation.
    if (signedIn(req).kind !== 'session') throw forbidden('Create API tokens while signed in, not with another token.');
    const input = parse(tokenCreate, req.body);
    const user = signedIn(req).user;
    const created = ctx.db.transaction((tx) => {
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
    const body: TokenCreated = { token: toApiToken(created.row), secret: created.secret };
    res.status(201).json(body);
  });

  router.delete('/tokens/:id', requireUser, (req, res) => {
    const user = signedIn(req).user;
    const id = pathParam(req, 'id');
    ctx.db.transaction((tx) => {
      const row = tx
        .select()
        .from(apiTokens)
        .where(and(eq(apiTokens.id, id), eq(apiTokens.userId, user.id), isNull(apiTokens.revokedAt)))
        .get();
      if (!row) throw notFound(`No API token with id ${JSON.stringify(id.slice(0, 80))}.`);
      tx.update(apiTokens).set({ revokedAt: new Date().toISOString() }).where(eq(apiTokens.id, id)).run();
      recordAudit(tx, {
        workspaceId: null,
        actorUserId: user.id,
        action: 'token.revoked',
        targetType: 'api_token',
        targetId: id,
        summary: `API token "${row.name}" revoked.`,
      });
    });
    res.status(204).end();
  });

  return router;
}
