// A workspace's own environment table (shared/api/environment-table.ts): members read it; owners
// and thermal engineers replace it. Case derivation uses it in place of the built-in pairs.
import { Router } from 'express';
import { environmentTablePut } from '../../shared/api/environment-table';
import type { Role } from '../../shared/api/workspaces';
import type { AppContext } from '../app-context';
import { signedIn, workspaceAccess } from '../auth/middleware';
import { environmentTable, replaceEnvironmentTable } from '../environment/environment-table-store';
import { parse } from '../errors';
import { readerRoles } from '../missions/mission-access';
import { pathParam } from '../path-param';

const tableEditors: readonly Role[] = ['owner', 'thermal'];

export function environmentTableRoutes(ctx: AppContext): Router {
  const router = Router();
  const path = '/workspaces/:workspaceId/environment-table';

  router.get(path, workspaceAccess(ctx, readerRoles), (req, res) => {
    res.json(environmentTable(ctx.db, pathParam(req, 'workspaceId')));
  });

  router.put(path, workspaceAccess(ctx, tableEditors), (req, res) => {
    const input = parse(environmentTablePut, req.body);
    res.json(replaceEnvironmentTable(ctx.db, signedIn(req).user.id, pathParam(req, 'workspaceId'), input));
  });

  return router;
}
