// Saved thermal models of a mission, their runs against load cases and their sizing
// (shared/api/thermal-models.ts). The work and the role checks are in server/thermal/.
import { Router } from 'express';
import { thermalDistanceStudyRequest, thermalModelCreate, thermalModelSizeRequest, thermalModelUpdate, thermalRunRequest } from '../../shared/api/thermal-models';
import type { AppContext } from '../app-context';
import { requireUser, signedIn } from '../auth/middleware';
import { parse } from '../errors';
import { answerForm, sendPerStep } from '../http/answer-formats';
import { pathParam } from '../path-param';
import { streamDistanceStudy } from '../thermal/thermal-distance-study';
import { lastRun, runModel, sizeModel } from '../thermal/thermal-model-runs';
import { whileClientWaits } from '../thermal/thermal-pool';
import { createModel, deleteModel, getModel, listModels, updateModel } from '../thermal/thermal-model-store';

export function thermalModelRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/missions/:id/thermal-models', requireUser, (req, res) => {
    res.json({ items: listModels(ctx.db, signedIn(req).user.id, pathParam(req, 'id')) });
  });

  router.post('/missions/:id/thermal-models', requireUser, (req, res) => {
    const input = parse(thermalModelCreate, req.body);
    res.status(201).json(createModel(ctx.db, signedIn(req).user.id, pathParam(req, 'id'), input));
  });

  router.get('/thermal-models/:id', requireUser, (req, res) => {
    res.json(getModel(ctx.db, signedIn(req).user.id, pathParam(req, 'id')));
  });

  router.patch('/thermal-models/:id', requireUser, (req, res) => {
    const input = parse(thermalModelUpdate, req.body);
    res.json(updateModel(ctx.db, signedIn(req).user.id, pathParam(req, 'id'), input));
  });

  router.delete('/thermal-models/:id', requireUser, (req, res) => {
    deleteModel(ctx.db, signedIn(req).user.id, pathParam(req, 'id'));
    res.status(204).end();
  });

  router.post('/thermal-models/:id/run', requireUser, async (req, res) => {
    const { caseId, maxOrbits } = parse(thermalRunRequest, req.body);
    const form = answerForm(req);
    const run = await runModel(ctx.db, signedIn(req).user.id, pathParam(req, 'id'), caseId, maxOrbits, whileClientWaits(res));
    await sendPerStep(res, form, { answer: () => run, key: 'result', stepKey: 'tS' });
  });

  router.get('/thermal-models/:id/runs/:caseId', requireUser, async (req, res) => {
    const form = answerForm(req);
    const run = lastRun(ctx.db, signedIn(req).user.id, pathParam(req, 'id'), pathParam(req, 'caseId'));
    await sendPerStep(res, form, { answer: () => run, key: 'result', stepKey: 'tS' });
  });

  router.post('/thermal-models/:id/size', requireUser, async (req, res) => {
    const body = parse(thermalModelSizeRequest, req.body);
    res.json(await sizeModel(ctx.db, signedIn(req).user.id, pathParam(req, 'id'), body, whileClientWaits(res)));
  });

  router.post('/thermal-models/:id/distance-study', requireUser, async (req, res) => {
    const body = parse(thermalDistanceStudyRequest, req.body);
    await streamDistanceStudy(ctx.db, ctx.logger, signedIn(req).user.id, pathParam(req, 'id'), body, res);
  });

  return router;
}
