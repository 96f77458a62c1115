// A workspace's own central bodies (shared/api/custom-bodies.ts): members read them; owners,
// thermal engineers and analysts add, change and delete them. GET /bodies (routes/environment.ts)
// lists them beside the catalogue for the caller's workspaces.
import { Router } from 'express';
import { customBodyInput } from '../../shared/api/custom-bodies';
import type { AppContext } from '../app-context';
import { signedIn, workspaceAccess } from '../auth/middleware';
import { createCustomBody, customBodyIn, deleteCustomBody, listCustomBodies, updateCustomBody } from '../bodies/custom-body-store';
import { parse } from '../errors';
import { editorRoles, readerRoles } from '../missions/mission-access';
import { loadUnits } from '../missions/quantity-reader';
import { pathParam } from '../path-param';

export function customBodyRoutes(ctx: AppContext): Router {
  const router = Router();
  const list = '/workspaces/:workspaceId/bodies';
  const one = '/workspaces/:workspaceId/bodies/:bodyId';

  router.get(list, workspaceAccess(ctx, readerRoles), (req, res) => {
    res.json({ items: listCustomBodies(ctx.db, [pathParam(req, 'workspaceId')]) });
  });

  router.post(list, workspaceAccess(ctx, editorRoles), async (req, res) => {
    const input = parse(customBodyInput, req.body);
    // radius, orbit radius and period are typed quantities
    await loadUnits();
    res.status(201).json(createCustomBody(ctx.db, signedIn(req).user.id, pathParam(req, 'workspaceId'), input));
  });

  router.get(one, workspaceAccess(ctx, readerRoles), (req, res) => {
    res.json(customBodyIn(ctx.db, pathParam(req, 'workspaceId'), pathParam(req, 'bodyId')));
  });

  router.put(one, workspaceAccess(ctx, editorRoles), async (req, res) => {
    const input = parse(customBodyInput, req.body);
    await loadUnits();
    res.json(updateCustomBody(ctx.db, signedIn(req).user.id, pathParam(req, 'workspaceId'), pathParam(req, 'bodyId'), input));
  });

  router.delete(one, workspaceAccess(ctx, editorRoles), (req, res) => {
    deleteCustomBody(ctx.db, signedIn(req).user.id, pathParam(req, 'workspaceId'), pathParam(req, 'bodyId'));
    res.status(204).end();
  });

  return router;
}
