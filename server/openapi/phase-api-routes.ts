// A mission's attitude modes and phases (shared/api/phases.ts).
import { z } from 'zod';
import { attitudeMode, attitudeModeCreate, attitudeModeUpdate, missionPhase, phaseCreate, phaseUpdate } from '../../shared/api/phases';
import type { ApiRoute } from './api-route';

const m = '/api/v1/missions/:id';
const items = <T extends z.ZodType>(schema: T) => z.object({ items: z.array(schema) });

export const phaseApiRoutes: ApiRoute[] = [
  { method: 'get', path: `${m}/attitude-modes`, tag: 'phases', summary: 'The spacecraft’s attitude modes (any member)', response: items(attitudeMode) },
  { method: 'post', path: `${m}/attitude-modes`, tag: 'phases', summary: 'Add an attitude mode: a pointing per surface, yaw steering (thermal, owner)', body: attitudeModeCreate, status: 201, response: attitudeMode },
  { method: 'patch', path: `${m}/attitude-modes/:modeId`, tag: 'phases', summary: 'Change an attitude mode (thermal, owner)', body: attitudeModeUpdate, response: attitudeMode },
  { method: 'delete', path: `${m}/attitude-modes/:modeId`, tag: 'phases', summary: 'Delete an attitude mode no phase flies (thermal, owner; 409 naming the phases otherwise)', status: 204 },
  { method: 'get', path: `${m}/phases`, tag: 'phases', summary: 'The mission’s phases by start date (any member)', response: items(missionPhase) },
  { method: 'post', path: `${m}/phases`, tag: 'phases', summary: 'Add a phase: dates, attitude mode, dissipation per thermal-model node (thermal, owner)', body: phaseCreate, status: 201, response: missionPhase },
  { method: 'patch', path: `${m}/phases/:phaseId`, tag: 'phases', summary: 'Change a phase (thermal, owner)', body: phaseUpdate, response: missionPhase },
  { method: 'delete', path: `${m}/phases/:phaseId`, tag: 'phases', summary: 'Delete a phase (thermal, owner)', status: 204 },
];
