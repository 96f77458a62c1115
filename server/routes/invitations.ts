// Invitations: the owner's side under workspaces/:workspaceId/invitations, and the invitee's
// side under invitations/:token, which needs no sign-in (the link is the credential).
import { Router } from 'express';
import { invitationAccept } from '../../shared/api/auth';
import { invitationCreate } from '../../shared/api/workspaces';
import type { AppContext } from '../app-context';
import { pathParam } from '../path-param';
import { meResponse } from '../auth/me-response';
import { signedIn, workspaceAccess } from '../auth/middleware';
import { clientAddress } from '../auth/rate-limiter';
import { startSession } from '../auth/session';
import { parse } from '../errors';
import {
  acceptInvitation,
  createInvitation,
  listInvitations,
  previewInvitation,
  withdrawInvitation,
} from '../workspaces/invitations';

export function invitationRoutes(ctx: AppContext): Router {
  const router = Router();
  const ownerOnly = workspaceAccess(ctx, ['owner']);

  router.get('/workspaces/:workspaceId/invitations', ownerOnly, (req, res) => {
    res.json({ items: listInvitations(ctx, pathParam(req, 'workspaceId')) });
  });

  router.post('/workspaces/:workspaceId/invitations', ownerOnly, async (req, res) => {
    const input = parse(invitationCreate, req.body);
    res.status(201).json(await createInvitation(ctx, pathParam(req, 'workspaceId'), input, signedIn(req).user));
  });

  router.delete('/workspaces/:workspaceId/invitations/:id', ownerOnly, (req, res) => {
    const workspaceId = pathParam(req, 'workspaceId');
    const id = pathParam(req, 'id');
    withdrawInvitation(ctx, workspaceId, id, signedIn(req).user.id);
    res.status(204).end();
  });

  router.get('/invitations/:token', (req, res) => {
    res.json(previewInvitation(ctx, pathParam(req, 'token')));
  });

  router.post('/invitations/:token/accept', async (req, res) => {
    const input = parse(invitationAccept, req.body);
    const user = await acceptInvitation(ctx, pathParam(req, 'token'), input, clientAddress(req));
    startSession(ctx, res, user);
    res.json(meResponse(ctx.db, user, { kind: 'session', readOnly: false }));
  });

  return router;
}
