// Invitations: the owner's side under workspaces/:workspaceId/invitations, and the invitee's
// side under invitations/:token, which needs no sign-in (the link is the credential).
import { z } from 'zod';
import { invitationAccept, invitationPreview, meResponse as meSchema } from '../../shared/api/auth';
import { invitation, invitationCreate } from '../../shared/api/workspaces';
import { meResponse } from '../auth/me-response';
import { clientAddress } from '../auth/rate-limiter';
import { startSession } from '../auth/session';
import { route, type ApiRoute } from '../http/api-route';
import { acceptInvitation, createInvitation, listInvitations, previewInvitation, withdrawInvitation } from '../workspaces/invitations';
import { ownerOnly } from '../workspaces/workspace-roles';

const v1 = '/api/v1';
const w = `${v1}/workspaces/:workspaceId/invitations`;

export const invitationRoutes: ApiRoute[] = [
  route({
    method: 'get', path: w, tag: 'workspaces', summary: 'Open invitations (owner)', access: ownerOnly, response: z.object({ items: z.array(invitation) }),
    handle: ({ ctx, param }) => ({ items: listInvitations(ctx, param('workspaceId')) }),
  }),
  route({
    method: 'post', path: w, tag: 'workspaces', summary: 'Invite by e-mail (owner)', access: ownerOnly, body: invitationCreate, status: 201, response: invitation,
    handle: ({ ctx, auth, param, body }) => createInvitation(ctx, param('workspaceId'), body(), auth.user),
  }),
  route({
    method: 'delete', path: `${w}/:id`, tag: 'workspaces', summary: 'Withdraw an invitation (owner)', access: ownerOnly, status: 204,
    handle: ({ ctx, auth, param }) => withdrawInvitation(ctx, param('workspaceId'), param('id'), auth.user.id),
  }),
  route({
    method: 'get', path: `${v1}/invitations/:token`, tag: 'auth', summary: 'Preview an invitation', access: 'public', response: invitationPreview,
    handle: ({ ctx, param }) => previewInvitation(ctx, param('token')),
  }),
  route({
    method: 'post', path: `${v1}/invitations/:token/accept`, tag: 'auth', summary: 'Accept an invitation; sets the session cookie', access: 'public',
    body: invitationAccept, response: meSchema,
    handle: async ({ ctx, req, res, param, body }) => {
      const user = await acceptInvitation(ctx, param('token'), body(), clientAddress(req));
      startSession(ctx, res, user);
      return meResponse(ctx.db, user, { kind: 'session', readOnly: false });
    },
  }),
];
