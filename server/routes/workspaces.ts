// workspaces: the caller's workspaces, their members and the audit log (shared/api/workspaces.ts).
import { Router } from 'express';
import { auditQuery, memberUpdate, type Workspace } from '../../shared/api/workspaces';
import type { AppContext } from '../app-context';
import { pathParam } from '../path-param';
import { listAudit } from '../audit/audit-log';
import { userWorkspaces } from '../auth/me-response';
import { signedIn, requireUser, workspaceAccess } from '../auth/middleware';
import { parse } from '../errors';
import { changeMemberRole, listMembers, removeMember } from '../workspaces/members';

export function workspaceRoutes(ctx: AppContext): Router {
  const router = Router();
  const anyMember = workspaceAccess(ctx, ['owner', 'analyst', 'thermal', 'viewer']);
  const ownerOnly = workspaceAccess(ctx, ['owner']);

  router.get('/workspaces', requireUser, (req, res) => {
    const items: Workspace[] = userWorkspaces(ctx.db, signedIn(req).user.id).map((m) => ({
      id: m.workspaceId,
      name: m.workspaceName,
      role: m.role,
    }));
    res.json({ items });
  });

  router.get('/workspaces/:workspaceId/members', anyMember, (req, res) => {
    res.json({ items: listMembers(ctx.db, pathParam(req, 'workspaceId')) });
  });

  router.patch('/workspaces/:workspaceId/members/:userId', ownerOnly, (req, res) => {
    const input = parse(memberUpdate, req.body);
    const workspaceId = pathParam(req, 'workspaceId');
    const userId = pathParam(req, 'userId');
    res.json(changeMemberRole(ctx.db, workspaceId, userId, input.role, signedIn(req).user.id));
  });

  router.delete('/workspaces/:workspaceId/members/:userId', ownerOnly, (req, res) => {
    const workspaceId = pathParam(req, 'workspaceId');
    const userId = pathParam(req, 'userId');
    removeMember(ctx.db, workspaceId, userId, signedIn(req).user.id);
    res.status(204).end();
  });

  router.get('/workspaces/:workspaceId/audit', ownerOnly, (req, res) => {
    const filter = parse(auditQuery, req.query);
    res.json(listAudit(ctx.db, pathParam(req, 'workspaceId'), filter));
  });

  return router;
}
