// A mission's attitude modes and phases (shared/api/phases.ts): every member reads; thermal
// engineers and owners change them (server/missions/phase-store.ts). Both collections have the
// same four routes: list, add, change, delete.
import { Router } from 'express';
import type { ZodType } from 'zod';
import { attitudeModeCreate, attitudeModeUpdate, phaseCreate, phaseUpdate } from '../../shared/api/phases';
import type { AppContext } from '../app-context';
import { requireUser, signedIn } from '../auth/middleware';
import type { Db } from '../db/database';
import { parse } from '../errors';
import { createMode, createPhase, deleteMode, deletePhase, listModes, listPhases, updateMode, updatePhase } from '../missions/phase-store';
import { pathParam } from '../path-param';

interface Collection<C extends ZodType, U extends ZodType> {
  path: string;
  param: string;
  create: C;
  update: U;
  list: (db: Db, userId: string, missionId: string) => unknown[];
  add: (db: Db, userId: string, missionId: string, input: C['_output']) => unknown;
  change: (db: Db, userId: string, missionId: string, itemId: string, input: U['_output']) => unknown;
  remove: (db: Db, userId: string, missionId: string, itemId: string) => void;
}

function collectionRoutes<C extends ZodType, U extends ZodType>(router: Router, ctx: AppContext, c: Collection<C, U>): void {
  const userId = (req: Parameters<typeof signedIn>[0]) => signedIn(req).user.id;
  const one = `/missions/:id/${c.path}/:${c.param}`;
  router.get(`/missions/:id/${c.path}`, requireUser, (req, res) => {
    res.json({ items: c.list(ctx.db, userId(req), pathParam(req, 'id')) });
  });
  router.post(`/missions/:id/${c.path}`, requireUser, (req, res) => {
    const input = parse(c.create, req.body);
    res.status(201).json(c.add(ctx.db, userId(req), pathParam(req, 'id'), input));
  });
  router.patch(one, requireUser, (req, res) => {
    const input = parse(c.update, req.body);
    res.json(c.change(ctx.db, userId(req), pathParam(req, 'id'), pathParam(req, c.param), input));
  });
  router.delete(one, requireUser, (req, res) => {
    c.remove(ctx.db, userId(req), pathParam(req, 'id'), pathParam(req, c.param));
    res.status(204).end();
  });
}

export function phaseRoutes(ctx: AppContext): Router {
  const router = Router();
  collectionRoutes(router, ctx, { path: 'attitude-modes', param: 'modeId', create: attitudeModeCreate, update: attitudeModeUpdate, list: listModes, add: createMode, change: updateMode, remove: deleteMode });
  collectionRoutes(router, ctx, { path: 'phases', param: 'phaseId', create: phaseCreate, update: phaseUpdate, list: listPhases, add: createPhase, change: updatePhase, remove: deletePhase });
  return router;
}
