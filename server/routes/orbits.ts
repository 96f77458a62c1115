// orbits of a mission, their environment and the mission sweep (shared/api/missions.ts).
import { Router } from 'express';
import { orbitCreate, orbitUpdate, savedEnvironmentRequest, sweepQuery } from '../../shared/api/missions';
import type { AppContext } from '../app-context';
import { requireUser, signedIn } from '../auth/middleware';
import { parse } from '../errors';
import { answerForm, sendPerStep } from '../http/answer-formats';
import { sendJson } from '../json-stream';
import { missionFor, orbitOf } from '../missions/mission-access';
import { toOrbit } from '../missions/mission-responses';
import { createOrbit, deleteOrbit, listOrbits, updateOrbit } from '../missions/orbit-store';
import { missionSurfaces, savedEnvironment } from '../missions/saved-environment';
import { planSweep, sweepAssumptions, sweepChunkComputer } from '../missions/sweep-days';
import { collectSweep, csvFileName, streamSweep } from '../missions/sweep-stream';
import { pathParam } from '../path-param';

export function orbitRoutes(ctx: AppContext): Router {
  const router = Router();
  const userId = (req: Parameters<typeof signedIn>[0]) => signedIn(req).user.id;

  router.get('/missions/:id/orbits', requireUser, (req, res) => {
    const { mission } = missionFor(ctx.db, userId(req), pathParam(req, 'id'), 'read');
    res.json({ items: listOrbits(ctx.db, mission.id) });
  });

  router.post('/missions/:id/orbits', requireUser, async (req, res) => {
    const input = parse(orbitCreate, req.body);
    res.status(201).json(await createOrbit(ctx.db, userId(req), pathParam(req, 'id'), input));
  });

  router.get('/missions/:id/orbits/:orbitId', requireUser, (req, res) => {
    const { mission } = missionFor(ctx.db, userId(req), pathParam(req, 'id'), 'read');
    res.json(toOrbit(orbitOf(ctx.db, mission.id, pathParam(req, 'orbitId'))));
  });

  router.patch('/missions/:id/orbits/:orbitId', requireUser, async (req, res) => {
    const input = parse(orbitUpdate, req.body);
    res.json(await updateOrbit(ctx.db, userId(req), pathParam(req, 'id'), pathParam(req, 'orbitId'), input));
  });

  router.delete('/missions/:id/orbits/:orbitId', requireUser, (req, res) => {
    deleteOrbit(ctx.db, userId(req), pathParam(req, 'id'), pathParam(req, 'orbitId'));
    res.status(204).end();
  });

  // A computation, not a change: every member may run it.
  router.post('/missions/:id/orbits/:orbitId/environment', requireUser, async (req, res) => {
    const { mission } = missionFor(ctx.db, userId(req), pathParam(req, 'id'), 'read');
    const orbit = orbitOf(ctx.db, mission.id, pathParam(req, 'orbitId'));
    const request = parse(savedEnvironmentRequest, req.body ?? {});
    await sendJson(res, savedEnvironment(ctx.db, mission, orbit, request));
  });

  router.get('/missions/:id/orbits/:orbitId/sweep', requireUser, async (req, res) => {
    const { mission } = missionFor(ctx.db, userId(req), pathParam(req, 'id'), 'read');
    const orbit = orbitOf(ctx.db, mission.id, pathParam(req, 'orbitId'));
    const query = parse(sweepQuery, req.query);
    const plan = planSweep(mission, query);
    const surfaces = missionSurfaces(ctx.db, mission.id, query.properties);
    const form = answerForm(req, query.layout);
    const computeDays = sweepChunkComputer(mission, orbit, plan, surfaces);
    const assumptions = sweepAssumptions(mission, orbit, plan);
    if (form !== 'json') {
      // Columns or Arrow: the whole sweep at once (API.md "Answer formats"); the stream is the default.
      const series = await collectSweep(plan, computeDays);
      const answer = { from: plan.from, to: plan.to, stepDays: plan.stepDays, days: plan.days, properties: query.properties, assumptions, series };
      await sendPerStep(res, form, { answer: () => answer, key: 'series', stepKey: 'date' });
      return;
    }
    await streamSweep({
      res,
      logger: ctx.logger,
      plan,
      surfaces,
      format: query.format,
      fileName: csvFileName(mission.name, orbit.name, 'sweep', plan.from, plan.to, query.properties),
      crewed: mission.crewed,
      computeDays,
      assumptions,
    });
  });

  return router;
}
