// Saved thermal models of a mission, their runs against load cases and their sizing
// (shared/api/thermal-models.ts). The work and the role checks are in server/thermal/.
import { z } from 'zod';
import {
  thermalDistanceStudyRequest, thermalModelCreate, thermalModelDetail, thermalModelSizeRequest, thermalModelSizeResponse, thermalModelSummary, thermalModelUpdate,
  thermalRunRequest, thermalRunResponse,
} from '../../shared/api/thermal-models';
import { route, type ApiRoute } from '../http/api-route';
import { answerForm, sendPerStep } from '../http/answer-formats';
import { streamDistanceStudy } from '../thermal/thermal-distance-study';
import { lastRun, runModel, sizeModel } from '../thermal/thermal-model-runs';
import { createModel, deleteModel, getModel, listModels, updateModel } from '../thermal/thermal-model-store';
import { whileClientWaits } from '../thermal/thermal-pool';

const v1 = '/api/v1';
const m = `${v1}/thermal-models/:id`;
const tag = 'thermal';

export const thermalModelRoutes: ApiRoute[] = [
  route({
    method: 'get', path: `${v1}/missions/:id/thermal-models`, tag, summary: "A mission's saved thermal models (any member)", access: 'signed-in',
    response: z.object({ items: z.array(thermalModelSummary) }),
    handle: ({ ctx, auth, param }) => ({ items: listModels(ctx.db, auth.user.id, param('id')) }),
  }),
  route({
    method: 'post', path: `${v1}/missions/:id/thermal-models`, tag, summary: 'Save a thermal model (thermal engineer or owner)', access: 'signed-in',
    body: thermalModelCreate, status: 201, response: thermalModelDetail,
    handle: ({ ctx, auth, param, body }) => createModel(ctx.db, auth.user.id, param('id'), body()),
  }),
  route({
    method: 'get', path: m, tag, summary: 'A saved thermal model with its last runs (any member)', access: 'signed-in', response: thermalModelDetail,
    handle: ({ ctx, auth, param }) => getModel(ctx.db, auth.user.id, param('id')),
  }),
  route({
    method: 'patch', path: m, tag, summary: 'Change a thermal model (thermal engineer or owner)', access: 'signed-in', body: thermalModelUpdate, response: thermalModelDetail,
    handle: ({ ctx, auth, param, body }) => updateModel(ctx.db, auth.user.id, param('id'), body()),
  }),
  route({
    method: 'delete', path: m, tag, summary: 'Delete a thermal model (thermal engineer or owner)', access: 'signed-in', status: 204,
    handle: ({ ctx, auth, param }) => deleteModel(ctx.db, auth.user.id, param('id')),
  }),
  route({
    method: 'post', path: `${m}/run`, tag, summary: 'Run the model on a load case of its mission (analyst, thermal engineer, owner); 422 when it does not converge', access: 'signed-in',
    body: thermalRunRequest, response: thermalRunResponse, perStep: true,
    handle: async ({ ctx, req, res, auth, param, body }) => {
      const { caseId, maxOrbits } = body();
      const form = answerForm(req);
      const run = await runModel(ctx.db, auth.user.id, param('id'), caseId, maxOrbits, whileClientWaits(res));
      await sendPerStep(res, form, { answer: () => run, key: 'result', stepKey: 'tS' });
    },
  }),
  route({
    method: 'get', path: `${m}/runs/:caseId`, tag, summary: 'The last run of the model on a load case (any member)', access: 'signed-in', response: thermalRunResponse, perStep: true,
    handle: async ({ ctx, req, res, auth, param }) => {
      const form = answerForm(req);
      const run = lastRun(ctx.db, auth.user.id, param('id'), param('caseId'));
      await sendPerStep(res, form, { answer: () => run, key: 'result', stepKey: 'tS' });
    },
  }),
  route({
    method: 'post', path: `${m}/size`, tag, summary: 'Radiator area in the hot case and heater power in the cold case (analyst, thermal engineer, owner)', access: 'signed-in',
    body: thermalModelSizeRequest, response: thermalModelSizeResponse,
    handle: ({ ctx, res, auth, param, body }) => sizeModel(ctx.db, auth.user.id, param('id'), body(), whileClientWaits(res)),
  }),
  route({
    method: 'post', path: `${m}/distance-study`, tag, access: 'signed-in', body: thermalDistanceStudyRequest, produces: ['application/x-ndjson'],
    summary: 'The model on a load case with the Sun at other distances: pump flow and radiator area per distance, one NDJSON line each (analyst, thermal engineer, owner)',
    handle: ({ ctx, res, auth, param, body }) => streamDistanceStudy(ctx.db, ctx.logger, auth.user.id, param('id'), body(), res),
  }),
];
