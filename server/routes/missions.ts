// missions: the caller's missions across their workspaces (shared/api/missions.ts).
import { Router } from 'express';
import { z } from 'zod';
import { missionCreate, missionUpdate } from '../../shared/api/missions';
import type { AppContext } from '../app-context';
import { requireUser, signedIn } from '../auth/middleware';
import { parse } from '../errors';
import { missionFor } from '../missions/mission-access';
import { createMission, deleteMission, listMissions, missionDetail, updateMission } from '../missions/mission-store';
import { pathParam } from '../path-param';

const listQuery = z.object({
  includeArchived: z.enum(['true', 'false'], { message: 'includeArchived is true or false' }).optional(),
});

export function missionRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/missions', requireUser, (req, res) => {
    const query = parse(listQuery, req.query);
    res.json({ items: listMissions(ctx.db, signedIn(req).user.id, query.includeArchived === 'true') });
  });

  router.post('/missions', requireUser, (req, res) => {
    const input = parse(missionCreate, req.body);
    res.status(201).json(createMission(ctx.db, signedIn(req).user.id, input));
  });

  router.get('/missions/:id', requireUser, (req, res) => {
    const { mission } = missionFor(ctx.db, signedIn(req).user.id, pathParam(req, 'id'), 'read');
    res.json(missionDetail(ctx.db, mission));
  });

  router.patch('/missions/:id', requireUser, async (req, res) => {
    const input = parse(missionUpdate, req.body);
    res.json(await updateMission(ctx.db, signedIn(req).user.id, pathParam(req, 'id'), input));
  });

  router.delete('/missions/:id', requireUser, (req, res) => {
    deleteMission(ctx.db, signedIn(req).user.id, pathParam(req, 'id'));
    res.status(204).end();
  });

  return router;
}
