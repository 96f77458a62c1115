// A workspace's own central bodies (shared/api/custom-bodies.ts): members read them; owners,
// thermal engineers and analysts add, change and delete them. GET /bodies (routes/environment.ts)
// lists them beside the catalogue for the caller's workspaces.
import { customBody, customBodyInput, customBodyList } from '../../shared/api/custom-bodies';
import { createCustomBody, customBodyIn, deleteCustomBody, listCustomBodies, updateCustomBody } from '../bodies/custom-body-store';
import { route, type ApiRoute } from '../http/api-route';
import { anyMember, missionEditors } from '../workspaces/workspace-roles';

const list = '/api/v1/workspaces/:workspaceId/bodies';
const one = '/api/v1/workspaces/:workspaceId/bodies/:bodyId';
const tag = 'bodies';

export const customBodyRoutes: ApiRoute[] = [
  route({
    method: 'get', path: list, tag, access: anyMember, response: customBodyList,
    summary: 'The workspace’s own central bodies (any member); ids are "custom-" and a UUID, never a catalogue name',
    handle: ({ ctx, param }) => ({ items: listCustomBodies(ctx.db, [param('workspaceId')]) }),
  }),
  route({
    method: 'post', path: list, tag, access: missionEditors, body: customBodyInput, status: 201, response: customBody,
    summary: 'Add a body of the workspace’s own (owner, thermal, analyst): GM, radius, J2, about the Sun or a planet, albedo/OLR ranges, airless surface field, a source per value',
    // radius, orbit radius and period are typed quantities
    handle: ({ ctx, auth, param, body }) => createCustomBody(ctx.db, auth.user.id, param('workspaceId'), body()),
  }),
  route({
    method: 'get', path: one, tag, access: anyMember, response: customBody, summary: 'One of the workspace’s own bodies',
    handle: ({ ctx, param }) => customBodyIn(ctx.db, param('workspaceId'), param('bodyId')),
  }),
  route({
    method: 'put', path: one, tag, access: missionEditors, body: customBodyInput, response: customBody,
    summary: 'Change one of the workspace’s own bodies (owner, thermal, analyst)',
    handle: ({ ctx, auth, param, body }) => updateCustomBody(ctx.db, auth.user.id, param('workspaceId'), param('bodyId'), body()),
  }),
  route({
    method: 'delete', path: one, tag, access: missionEditors, status: 204,
    summary: 'Delete one of the workspace’s own bodies (owner, thermal, analyst); 409 while a mission uses it',
    handle: ({ ctx, auth, param }) => {
      deleteCustomBody(ctx.db, auth.user.id, param('workspaceId'), param('bodyId'));
    },
  }),
];
