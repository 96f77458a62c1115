// A workspace's own environment table (shared/api/environment-table.ts): members read it; owners
// and thermal engineers replace it. Case derivation uses it in place of the built-in pairs.
import { environmentTable as environmentTableSchema, environmentTablePut } from '../../shared/api/environment-table';
import { environmentTable, replaceEnvironmentTable } from '../environment/environment-table-store';
import { route, type ApiRoute } from '../http/api-route';
import { anyMember, thermalEditors } from '../workspaces/workspace-roles';

const path = '/api/v1/workspaces/:workspaceId/environment-table';
const tag = 'environment table';

export const environmentTableRoutes: ApiRoute[] = [
  route({
    method: 'get', path, tag, access: anyMember, response: environmentTableSchema,
    summary: 'The workspace’s own paired hot/cold albedo and OLR by inclination band and averaging time (any member)',
    handle: ({ ctx, param }) => environmentTable(ctx.db, param('workspaceId')),
  }),
  route({
    method: 'put', path, tag, summary: 'Replace the workspace’s environment table (owner, thermal)', access: thermalEditors, body: environmentTablePut, response: environmentTableSchema,
    handle: ({ ctx, auth, param, body }) => replaceEnvironmentTable(ctx.db, auth.user.id, param('workspaceId'), body()),
  }),
];
