// A mission's attitude modes and phases (shared/api/phases.ts): every member reads; thermal
// engineers and owners change them (server/missions/phase-store.ts decides, by the mission's
// workspace role: 404 to non-members, 403 naming the roles).
import { z } from 'zod';
import { attitudeMode, attitudeModeCreate, attitudeModeUpdate, missionPhase, phaseCreate, phaseUpdate } from '../../shared/api/phases';
import { route, type ApiRoute } from '../http/api-route';
import { createMode, createPhase, deleteMode, deletePhase, listModes, listPhases, updateMode, updatePhase } from '../missions/phase-store';

const m = '/api/v1/missions/:id';
const items = <T extends z.ZodType>(schema: T) => z.object({ items: z.array(schema) });

export const phaseRoutes: ApiRoute[] = [
  route({
    method: 'get', path: `${m}/attitude-modes`, tag: 'phases', summary: 'The spacecraft’s attitude modes (any member)', access: 'signed-in', response: items(attitudeMode),
    handle: ({ ctx, auth, param }) => ({ items: listModes(ctx.db, auth.user.id, param('id')) }),
  }),
  route({
    method: 'post', path: `${m}/attitude-modes`, tag: 'phases', summary: 'Add an attitude mode: a pointing per surface, yaw steering (thermal, owner)', access: 'signed-in',
    body: attitudeModeCreate, status: 201, response: attitudeMode,
    handle: ({ ctx, auth, param, body }) => createMode(ctx.db, auth.user.id, param('id'), body()),
  }),
  route({
    method: 'patch', path: `${m}/attitude-modes/:modeId`, tag: 'phases', summary: 'Change an attitude mode (thermal, owner)', access: 'signed-in',
    body: attitudeModeUpdate, response: attitudeMode,
    handle: ({ ctx, auth, param, body }) => updateMode(ctx.db, auth.user.id, param('id'), param('modeId'), body()),
  }),
  route({
    method: 'delete', path: `${m}/attitude-modes/:modeId`, tag: 'phases', summary: 'Delete an attitude mode no phase flies (thermal, owner; 409 naming the phases otherwise)', access: 'signed-in', status: 204,
    handle: ({ ctx, auth, param }) => deleteMode(ctx.db, auth.user.id, param('id'), param('modeId')),
  }),
  route({
    method: 'get', path: `${m}/phases`, tag: 'phases', summary: 'The mission’s phases by start date (any member)', access: 'signed-in', response: items(missionPhase),
    handle: ({ ctx, auth, param }) => ({ items: listPhases(ctx.db, auth.user.id, param('id')) }),
  }),
  route({
    method: 'post', path: `${m}/phases`, tag: 'phases', summary: 'Add a phase: dates, attitude mode, dissipation per thermal-model node (thermal, owner)', access: 'signed-in',
    body: phaseCreate, status: 201, response: missionPhase,
    handle: ({ ctx, auth, param, body }) => createPhase(ctx.db, auth.user.id, param('id'), body()),
  }),
  route({
    method: 'patch', path: `${m}/phases/:phaseId`, tag: 'phases', summary: 'Change a phase (thermal, owner)', access: 'signed-in',
    body: phaseUpdate, response: missionPhase,
    handle: ({ ctx, auth, param, body }) => updatePhase(ctx.db, auth.user.id, param('id'), param('phaseId'), body()),
  }),
  route({
    method: 'delete', path: `${m}/phases/:phaseId`, tag: 'phases', summary: 'Delete a phase (thermal, owner)', access: 'signed-in', status: 204,
    handle: ({ ctx, auth, param }) => deletePhase(ctx.db, auth.user.id, param('id'), param('phaseId')),
  }),
];
