// Saved thermal models, their runs and sizing (shared/api/thermal-models.ts).
import { z } from 'zod';
import {
  thermalDistanceStudyRequest, thermalModelCreate, thermalModelDetail, thermalModelSizeRequest, thermalModelSizeResponse, thermalModelSummary, thermalModelUpdate,
  thermalRunRequest, thermalRunResponse,
} from '../../shared/api/thermal-models';
import type { ApiRoute } from './api-route';

const v1 = '/api/v1';
const m = `${v1}/thermal-models/:id`;

export const thermalModelApiRoutes: ApiRoute[] = [
  { method: 'get', path: `${v1}/missions/:id/thermal-models`, tag: 'thermal', summary: "A mission's saved thermal models (any member)", response: z.object({ items: z.array(thermalModelSummary) }) },
  { method: 'post', path: `${v1}/missions/:id/thermal-models`, tag: 'thermal', summary: 'Save a thermal model (thermal engineer or owner)', body: thermalModelCreate, status: 201, response: thermalModelDetail },
  { method: 'get', path: m, tag: 'thermal', summary: 'A saved thermal model with its last runs (any member)', response: thermalModelDetail },
  { method: 'patch', path: m, tag: 'thermal', summary: 'Change a thermal model (thermal engineer or owner)', body: thermalModelUpdate, response: thermalModelDetail },
  { method: 'delete', path: m, tag: 'thermal', summary: 'Delete a thermal model (thermal engineer or owner)', status: 204 },
  { method: 'post', path: `${m}/run`, tag: 'thermal', summary: 'Run the model on a load case of its mission (analyst, thermal engineer, owner); 422 when it does not converge', body: thermalRunRequest, response: thermalRunResponse, perStep: true },
  { method: 'get', path: `${m}/runs/:caseId`, tag: 'thermal', summary: 'The last run of the model on a load case (any member)', response: thermalRunResponse, perStep: true },
  { method: 'post', path: `${m}/size`, tag: 'thermal', summary: 'Radiator area in the hot case and heater power in the cold case (analyst, thermal engineer, owner)', body: thermalModelSizeRequest, response: thermalModelSizeResponse },
  { method: 'post', path: `${m}/distance-study`, tag: 'thermal', summary: 'The model on a load case with the Sun at other distances: pump flow and radiator area per distance, one NDJSON line each (analyst, thermal engineer, owner)', body: thermalDistanceStudyRequest, produces: ['application/x-ndjson'] },
];
