// surfaces of a mission (shared/api/missions.ts).
import { Router } from 'express';
import { surfaceCreate, surfaceUpdate } from '../../shared/api/missions';
import type { AppContext } from '../app-context';
import { requireUser, signedIn } from '../auth/middleware';
import { parse } from '../errors';
import { missionFor } from '../missions/mission-access';
import { createSurface, deleteSurface, listSurfaces, updateSurface } from '../missions/surface-store';
import { pathParam } from '../path-param';

export function surfaceRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/missions/:id/surfaces', requireUser, (req, res) => {
    const { mission } = missionFor(ctx.db, signedIn(req).user.id, pathParam(req, 'id'), 'read');
    res.json({ items: listSurfaces(ctx.db, mission.id) });
  });

  router.post('/missions/:id/surfaces', requireUser, async (req, res) => {
    const input = parse(surfaceCreate, req.body);
    res.status(201).json(await createSurface(ctx.db, signedIn(req).user.id, pathParam(req, 'id'), input));
  });

  router.patch('/missions/:id/surfaces/:surfaceId', requireUser, async (req, res) => {
    const input = parse(surfaceUpdate, req.body);
    res.json(await updateSurface(ctx.db, signedIn(req).user.id, pathParam(req, 'id'), pathParam(req, 'surfaceId'), input));
  });

  router.delete('/missions/:id/surfaces/:surfaceId', requireUser, (req, res) => {
    deleteSurface(ctx.db, signedIn(req).user.id, pathParam(req, 'id'), pathParam(req, 'surfaceId'));
    res.status(204).end();
  });

  return router;
}
