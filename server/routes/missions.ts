// missions: the caller's missions across their workspaces, their orbits with the environment and
// the mission sweep, their surfaces, and the materials (shared/api/missions.ts). Who may read or
// change a mission is decided by its workspace role in server/missions/mission-access.ts.
import { z } from 'zod';
import { environmentResponse } from '../../shared/api/environment';
import {
  material, materialCreate, materialListQuery, materialUpdate, mission, missionCreate, missionDetail as missionDetailSchema, missionListQuery, missionUpdate,
  orbit, orbitCreate, orbitUpdate, savedEnvironmentRequest, surface, surfaceCreate, surfaceUpdate, sweepQuery,
} from '../../shared/api/missions';
import { route, type ApiRoute } from '../http/api-route';
import { sendJson } from '../json-stream';
import { createMaterial, deleteMaterial, listMaterials, updateMaterial } from '../missions/material-store';
import { missionFor, orbitOf } from '../missions/mission-access';
import { toOrbit } from '../missions/mission-responses';
import { createMission, deleteMission, listMissions, missionDetail, updateMission } from '../missions/mission-store';
import { createOrbit, deleteOrbit, listOrbits, updateOrbit } from '../missions/orbit-store';
import { savedEnvironment } from '../missions/saved-environment';
import { sendSweep } from '../missions/sweep-answer';
import { createSurface, deleteSurface, listSurfaces, updateSurface } from '../missions/surface-store';
import { missionEditors } from '../workspaces/workspace-roles';

const v1 = '/api/v1';
const m = `${v1}/missions/:id`;
const items = <T extends z.ZodType>(schema: T) => z.object({ items: z.array(schema) });

export const missionRoutes: ApiRoute[] = [
  route({
    method: 'get', path: `${v1}/missions`, tag: 'missions', summary: 'Missions of every workspace of the caller', access: 'signed-in',
    query: missionListQuery, response: items(mission),
    handle: ({ ctx, auth, query }) => ({ items: listMissions(ctx.db, auth.user.id, query().includeArchived === 'true') }),
  }),
  route({
    method: 'post', path: `${v1}/missions`, tag: 'missions', summary: 'Create a mission (analyst, thermal, owner)', access: 'signed-in',
    body: missionCreate, status: 201, response: mission,
    handle: ({ ctx, auth, body }) => createMission(ctx.db, auth.user.id, body()),
  }),
  route({
    method: 'get', path: m, tag: 'missions', summary: 'A mission with its orbits and surfaces', access: 'signed-in', response: missionDetailSchema,
    handle: ({ ctx, auth, param }) => missionDetail(ctx.db, missionFor(ctx.db, auth.user.id, param('id'), 'read').mission),
  }),
  route({
    method: 'patch', path: m, tag: 'missions', summary: 'Change or archive a mission', access: 'signed-in', body: missionUpdate, response: mission,
    handle: ({ ctx, auth, param, body }) => updateMission(ctx.db, auth.user.id, param('id'), body()),
  }),
  route({
    method: 'delete', path: m, tag: 'missions', summary: 'Delete a mission, its orbits and surfaces', access: 'signed-in', status: 204,
    handle: ({ ctx, auth, param }) => deleteMission(ctx.db, auth.user.id, param('id')),
  }),

  route({
    method: 'get', path: `${m}/orbits`, tag: 'orbits', summary: 'A mission’s orbits', access: 'signed-in', response: items(orbit),
    handle: ({ ctx, auth, param }) => ({ items: listOrbits(ctx.db, missionFor(ctx.db, auth.user.id, param('id'), 'read').mission.id) }),
  }),
  route({
    method: 'post', path: `${m}/orbits`, tag: 'orbits', summary: 'Add an orbit (values may carry units)', access: 'signed-in', body: orbitCreate, status: 201, response: orbit,
    handle: ({ ctx, auth, param, body }) => createOrbit(ctx.db, auth.user.id, param('id'), body()),
  }),
  route({
    method: 'get', path: `${m}/orbits/:orbitId`, tag: 'orbits', summary: 'One orbit', access: 'signed-in', response: orbit,
    handle: ({ ctx, auth, param }) => toOrbit(orbitOf(ctx.db, missionFor(ctx.db, auth.user.id, param('id'), 'read').mission.id, param('orbitId'))),
  }),
  route({
    method: 'patch', path: `${m}/orbits/:orbitId`, tag: 'orbits', summary: 'Change an orbit', access: 'signed-in', body: orbitUpdate, response: orbit,
    handle: ({ ctx, auth, param, body }) => updateOrbit(ctx.db, auth.user.id, param('id'), param('orbitId'), body()),
  }),
  route({
    method: 'delete', path: `${m}/orbits/:orbitId`, tag: 'orbits', summary: 'Delete an orbit', access: 'signed-in', status: 204,
    handle: ({ ctx, auth, param }) => deleteOrbit(ctx.db, auth.user.id, param('id'), param('orbitId')),
  }),
  // A computation, not a change: every member may run it.
  route({
    method: 'post', path: `${m}/orbits/:orbitId/environment`, tag: 'orbits', summary: 'The environment of a saved orbit on the mission’s surfaces', access: 'signed-in',
    body: savedEnvironmentRequest, bodyOptional: true, response: environmentResponse,
    handle: async ({ ctx, res, auth, param, body }) => {
      const { mission } = missionFor(ctx.db, auth.user.id, param('id'), 'read');
      const orbit = orbitOf(ctx.db, mission.id, param('orbitId'));
      await sendJson(res, savedEnvironment(ctx.db, mission, orbit, body()));
    },
  }),
  route({
    method: 'get', path: `${m}/orbits/:orbitId/sweep`, tag: 'orbits', access: 'signed-in', query: sweepQuery, produces: ['application/x-ndjson', 'text/csv'], perStep: true,
    summary: 'Beta, eclipse, Sun distance and loads day by day (NDJSON, or CSV; columnar JSON or Arrow all at once)',
    handle: ({ ctx, req, res, auth, param, query }) => {
      const { mission } = missionFor(ctx.db, auth.user.id, param('id'), 'read');
      const orbit = orbitOf(ctx.db, mission.id, param('orbitId'));
      return sendSweep(ctx, req, res, mission, orbit, query());
    },
  }),

  route({
    method: 'get', path: `${m}/surfaces`, tag: 'surfaces', summary: 'A mission’s spacecraft surfaces', access: 'signed-in', response: items(surface),
    handle: ({ ctx, auth, param }) => ({ items: listSurfaces(ctx.db, missionFor(ctx.db, auth.user.id, param('id'), 'read').mission.id) }),
  }),
  route({
    method: 'post', path: `${m}/surfaces`, tag: 'surfaces', summary: 'Add a surface', access: 'signed-in', body: surfaceCreate, status: 201, response: surface,
    handle: ({ ctx, auth, param, body }) => createSurface(ctx.db, auth.user.id, param('id'), body()),
  }),
  route({
    method: 'patch', path: `${m}/surfaces/:surfaceId`, tag: 'surfaces', summary: 'Change a surface', access: 'signed-in', body: surfaceUpdate, response: surface,
    handle: ({ ctx, auth, param, body }) => updateSurface(ctx.db, auth.user.id, param('id'), param('surfaceId'), body()),
  }),
  route({
    method: 'delete', path: `${m}/surfaces/:surfaceId`, tag: 'surfaces', summary: 'Delete a surface', access: 'signed-in', status: 204,
    handle: ({ ctx, auth, param }) => deleteSurface(ctx.db, auth.user.id, param('id'), param('surfaceId')),
  }),

  route({
    method: 'get', path: `${v1}/materials`, tag: 'materials', summary: 'The material library and a workspace’s own materials', access: 'signed-in',
    query: materialListQuery, response: items(material),
    handle: ({ ctx, auth, query }) => ({ items: listMaterials(ctx.db, auth.user.id, query().workspaceId) }),
  }),
  route({
    method: 'post', path: `${v1}/workspaces/:workspaceId/materials`, tag: 'materials', summary: 'Add a workspace material', access: missionEditors,
    body: materialCreate, status: 201, response: material,
    handle: ({ ctx, auth, param, body }) => createMaterial(ctx.db, auth.user.id, param('workspaceId'), body()),
  }),
  route({
    method: 'patch', path: `${v1}/workspaces/:workspaceId/materials/:materialId`, tag: 'materials', summary: 'Change a workspace material', access: missionEditors,
    body: materialUpdate, response: material,
    handle: ({ ctx, req, auth, param, body }) => {
      const input = body();
      return updateMaterial(ctx.db, auth.user.id, param('workspaceId'), param('materialId'), input, new Set(Object.keys(req.body as object)));
    },
  }),
  route({
    method: 'delete', path: `${v1}/workspaces/:workspaceId/materials/:materialId`, tag: 'materials', summary: 'Delete a workspace material', access: missionEditors, status: 204,
    handle: ({ ctx, auth, param }) => deleteMaterial(ctx.db, auth.user.id, param('workspaceId'), param('materialId')),
  }),
];
