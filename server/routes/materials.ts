// materials: the built-in library and each workspace's own (shared/api/missions.ts).
import { Router } from 'express';
import { z } from 'zod';
import { materialCreate, materialUpdate } from '../../shared/api/missions';
import type { AppContext } from '../app-context';
import { memberRole, noWorkspace, requireUser, signedIn, workspaceAccess } from '../auth/middleware';
import { parse } from '../errors';
import { editorRoles } from '../missions/mission-access';
import { createMaterial, deleteMaterial, listMaterials, updateMaterial } from '../missions/material-store';
import { pathParam } from '../path-param';

const listQuery = z.object({ workspaceId: z.string().min(1).max(64).optional() });

export function materialRoutes(ctx: AppContext): Router {
  const router = Router();
  const editor = workspaceAccess(ctx, editorRoles);

  router.get('/materials', requireUser, (req, res) => {
    const { workspaceId } = parse(listQuery, req.query);
    const user = signedIn(req).user;
    if (workspaceId !== undefined && !memberRole(ctx.db, user.id, workspaceId)) throw noWorkspace(workspaceId);
    res.json({ items: listMaterials(ctx.db, user.id, workspaceId) });
  });

  router.post('/workspaces/:workspaceId/materials', editor, (req, res) => {
    const input = parse(materialCreate, req.body);
    res.status(201).json(createMaterial(ctx.db, signedIn(req).user.id, pathParam(req, 'workspaceId'), input));
  });

  router.patch('/workspaces/:workspaceId/materials/:materialId', editor, (req, res) => {
    const input = parse(materialUpdate, req.body);
    const sent = new Set(Object.keys(req.body as object));
    res.json(updateMaterial(ctx.db, signedIn(req).user.id, pathParam(req, 'workspaceId'), pathParam(req, 'materialId'), input, sent));
  });

  router.delete('/workspaces/:workspaceId/materials/:materialId', editor, (req, res) => {
    deleteMaterial(ctx.db, signedIn(req).user.id, pathParam(req, 'workspaceId'), pathParam(req, 'materialId'));
    res.status(204).end();
  });

  return router;
}
