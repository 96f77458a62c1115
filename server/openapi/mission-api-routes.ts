// Missions, orbits, surfaces, materials, the mission sweep and ephemerides (shared/api/missions.ts,
// shared/api/ephemerides.ts).
import { z } from 'zod';
import {
  ephemerisCaseCreate, ephemerisPointsPage, ephemerisPointsQuery, ephemerisSummary, ephemerisUploadFields, trajectoryEnvironmentRequest, trajectoryEnvironmentResponse,
} from '../../shared/api/ephemerides';
import { caseDetail } from '../../shared/api/cases';
import { environmentResponse } from '../../shared/api/environment';
import { environmentTable, environmentTablePut } from '../../shared/api/environment-table';
import { customBody, customBodyInput, customBodyList } from '../../shared/api/custom-bodies';
import {
  material, materialCreate, materialUpdate, mission, missionCreate, missionDetail, missionUpdate, orbit, orbitCreate, orbitUpdate,
  savedEnvironmentRequest, surface, surfaceCreate, surfaceUpdate, sweepQuery,
} from '../../shared/api/missions';
import type { ApiRoute } from './api-route';

const v1 = '/api/v1';
const items = <T extends z.ZodType>(schema: T) => z.object({ items: z.array(schema) });
const m = `${v1}/missions/:id`;

export const missionApiRoutes: ApiRoute[] = [
  { method: 'get', path: `${v1}/missions`, tag: 'missions', summary: 'Missions of every workspace of the caller', query: z.object({ includeArchived: z.enum(['true', 'false']).optional() }), response: items(mission) },
  { method: 'post', path: `${v1}/missions`, tag: 'missions', summary: 'Create a mission (analyst, thermal, owner)', body: missionCreate, status: 201, response: mission },
  { method: 'get', path: m, tag: 'missions', summary: 'A mission with its orbits and surfaces', response: missionDetail },
  { method: 'patch', path: m, tag: 'missions', summary: 'Change or archive a mission', body: missionUpdate, response: mission },
  { method: 'delete', path: m, tag: 'missions', summary: 'Delete a mission, its orbits and surfaces', status: 204 },
  { method: 'get', path: `${m}/orbits`, tag: 'orbits', summary: 'A mission’s orbits', response: items(orbit) },
  { method: 'post', path: `${m}/orbits`, tag: 'orbits', summary: 'Add an orbit (values may carry units)', body: orbitCreate, status: 201, response: orbit },
  { method: 'get', path: `${m}/orbits/:orbitId`, tag: 'orbits', summary: 'One orbit', response: orbit },
  { method: 'patch', path: `${m}/orbits/:orbitId`, tag: 'orbits', summary: 'Change an orbit', body: orbitUpdate, response: orbit },
  { method: 'delete', path: `${m}/orbits/:orbitId`, tag: 'orbits', summary: 'Delete an orbit', status: 204 },
  { method: 'post', path: `${m}/orbits/:orbitId/environment`, tag: 'orbits', summary: 'The environment of a saved orbit on the mission’s surfaces', body: savedEnvironmentRequest, response: environmentResponse },
  { method: 'get', path: `${m}/orbits/:orbitId/sweep`, tag: 'orbits', summary: 'Beta, eclipse, Sun distance and loads day by day (NDJSON, or CSV; columnar JSON or Arrow all at once)', query: sweepQuery, produces: ['application/x-ndjson', 'text/csv'], perStep: true },
  { method: 'get', path: `${m}/surfaces`, tag: 'surfaces', summary: 'A mission’s spacecraft surfaces', response: items(surface) },
  { method: 'post', path: `${m}/surfaces`, tag: 'surfaces', summary: 'Add a surface', body: surfaceCreate, status: 201, response: surface },
  { method: 'patch', path: `${m}/surfaces/:surfaceId`, tag: 'surfaces', summary: 'Change a surface', body: surfaceUpdate, response: surface },
  { method: 'delete', path: `${m}/surfaces/:surfaceId`, tag: 'surfaces', summary: 'Delete a surface', status: 204 },
  { method: 'get', path: `${v1}/materials`, tag: 'materials', summary: 'The material library and a workspace’s own materials', query: z.object({ workspaceId: z.string().optional() }), response: items(material) },
  { method: 'post', path: `${v1}/workspaces/:workspaceId/materials`, tag: 'materials', summary: 'Add a workspace material', body: materialCreate, status: 201, response: material },
  { method: 'patch', path: `${v1}/workspaces/:workspaceId/materials/:materialId`, tag: 'materials', summary: 'Change a workspace material', body: materialUpdate, response: material },
  { method: 'delete', path: `${v1}/workspaces/:workspaceId/materials/:materialId`, tag: 'materials', summary: 'Delete a workspace material', status: 204 },
  { method: 'get', path: `${v1}/workspaces/:workspaceId/environment-table`, tag: 'environment table', summary: 'The workspace’s own paired hot/cold albedo and OLR by inclination band and averaging time (any member)', response: environmentTable },
  { method: 'put', path: `${v1}/workspaces/:workspaceId/environment-table`, tag: 'environment table', summary: 'Replace the workspace’s environment table (owner, thermal)', body: environmentTablePut, response: environmentTable },
  { method: 'get', path: `${v1}/workspaces/:workspaceId/bodies`, tag: 'bodies', summary: 'The workspace’s own central bodies (any member); ids are "custom-" and a UUID, never a catalogue name', response: customBodyList },
  { method: 'post', path: `${v1}/workspaces/:workspaceId/bodies`, tag: 'bodies', summary: 'Add a body of the workspace’s own (owner, thermal, analyst): GM, radius, J2, about the Sun or a planet, albedo/OLR ranges, airless surface field, a source per value', body: customBodyInput, status: 201, response: customBody },
  { method: 'get', path: `${v1}/workspaces/:workspaceId/bodies/:bodyId`, tag: 'bodies', summary: 'One of the workspace’s own bodies', response: customBody },
  { method: 'put', path: `${v1}/workspaces/:workspaceId/bodies/:bodyId`, tag: 'bodies', summary: 'Change one of the workspace’s own bodies (owner, thermal, analyst)', body: customBodyInput, response: customBody },
  { method: 'delete', path: `${v1}/workspaces/:workspaceId/bodies/:bodyId`, tag: 'bodies', summary: 'Delete one of the workspace’s own bodies (owner, thermal, analyst); 409 while a mission uses it', status: 204 },
  { method: 'post', path: `${m}/ephemerides`, tag: 'ephemerides', summary: 'Upload an ephemeris (multipart: file, frame, name)', body: ephemerisUploadFields, bodyKind: 'multipart', status: 201, response: ephemerisSummary },
  { method: 'get', path: `${m}/ephemerides`, tag: 'ephemerides', summary: 'A mission’s ephemerides', response: items(ephemerisSummary) },
  { method: 'get', path: `${m}/ephemerides/:ephemerisId`, tag: 'ephemerides', summary: 'One ephemeris (summary)', response: ephemerisSummary },
  { method: 'get', path: `${m}/ephemerides/:ephemerisId/points`, tag: 'ephemerides', summary: 'A page of an ephemeris’ points', query: ephemerisPointsQuery, response: ephemerisPointsPage },
  { method: 'delete', path: `${m}/ephemerides/:ephemerisId`, tag: 'ephemerides', summary: 'Delete an ephemeris', status: 204 },
  { method: 'post', path: `${m}/ephemerides/:ephemerisId/environment`, tag: 'ephemerides', summary: 'The environment along an uploaded trajectory (optionally over a window)', body: trajectoryEnvironmentRequest, response: trajectoryEnvironmentResponse, perStep: true },
  { method: 'post', path: `${m}/ephemerides/:ephemerisId/cases`, tag: 'ephemerides', summary: 'A load case (custom, draft) from a window of the trajectory', body: ephemerisCaseCreate, status: 201, response: caseDetail },
];
