// workspaces: the caller's workspaces, their members and the audit log (shared/api/workspaces.ts).
import { z } from 'zod';
import { auditEvent, auditQuery, member, memberUpdate, workspace } from '../../shared/api/workspaces';
import { listAudit } from '../audit/audit-log';
import { workspacesOf } from '../auth/me-response';
import { route, type ApiRoute } from '../http/api-route';
import { changeMemberRole, listMembers, removeMember } from '../workspaces/members';
import { anyMember, ownerOnly } from '../workspaces/workspace-roles';

const w = '/api/v1/workspaces/:workspaceId';

export const workspaceRoutes: ApiRoute[] = [
  route({
    method: 'get', path: '/api/v1/workspaces', tag: 'workspaces', summary: 'The caller’s workspaces', access: 'signed-in',
    response: z.object({ items: z.array(workspace) }),
    handle: ({ ctx, auth }) => ({ items: workspacesOf(ctx.db, auth.user.id) }),
  }),
  route({
    method: 'get', path: `${w}/members`, tag: 'workspaces', summary: 'Members of a workspace', access: anyMember,
    response: z.object({ items: z.array(member) }),
    handle: ({ ctx, param }) => ({ items: listMembers(ctx.db, param('workspaceId')) }),
  }),
  route({
    method: 'patch', path: `${w}/members/:userId`, tag: 'workspaces', summary: 'Change a member’s role (owner)', access: ownerOnly, body: memberUpdate, response: member,
    handle: ({ ctx, auth, param, body }) => changeMemberRole(ctx.db, param('workspaceId'), param('userId'), body().role, auth.user.id),
  }),
  route({
    method: 'delete', path: `${w}/members/:userId`, tag: 'workspaces', summary: 'Remove a member (owner)', access: ownerOnly, status: 204,
    handle: ({ ctx, auth, param }) => removeMember(ctx.db, param('workspaceId'), param('userId'), auth.user.id),
  }),
  route({
    method: 'get', path: `${w}/audit`, tag: 'workspaces', summary: 'The audit log, filtered (owner)', access: ownerOnly, query: auditQuery,
    response: z.object({ items: z.array(auditEvent), total: z.number() }),
    handle: ({ ctx, param, query }) => listAudit(ctx.db, param('workspaceId'), query()),
  }),
];
