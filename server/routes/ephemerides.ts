// ephemerides: trajectories uploaded to a mission and the environment along them
// (shared/api/ephemerides.ts lists the routes and their shapes).
import { Router } from 'express';
import { ephemerisCaseCreate, ephemerisPointsQuery, trajectoryEnvironmentRequest } from '../../shared/api/ephemerides';
import type { AppContext } from '../app-context';
import { requireUser, signedIn } from '../auth/middleware';
import { missionForCases } from '../cases/case-access';
import { createEphemerisCase } from '../cases/ephemeris-case';
import { toDetail } from '../cases/case-views';
import { parse } from '../errors';
import { answerForm, sendPerStep } from '../http/answer-formats';
import { pathParam } from '../path-param';
import { ephemerisEnvironment } from '../ephemerides/ephemeris-environment';
import { receiveEphemeris } from '../ephemerides/ephemeris-ingest';
import { deleteEphemeris, ephemerisMission, ephemerisOf, listEphemerides, pointsPage, toEphemerisSummary } from '../ephemerides/ephemeris-store';

export function ephemerisRoutes(ctx: AppContext): Router {
  const router = Router();
  const base = '/missions/:id/ephemerides';

  router.post(base, requireUser, async (req, res) => {
    const user = signedIn(req).user;
    // Access first, so a viewer or a stranger is refused before a byte of the file is stored.
    const mission = ephemerisMission(ctx, user.id, pathParam(req, 'id'), 'edit');
    const row = await receiveEphemeris(ctx, req, res, mission, user.id);
    res.status(201).json(toEphemerisSummary(row));
  });

  router.get(base, requireUser, (req, res) => {
    const mission = ephemerisMission(ctx, signedIn(req).user.id, pathParam(req, 'id'), 'read');
    res.json({ items: listEphemerides(ctx, mission.id) });
  });

  router.get(`${base}/:ephemerisId`, requireUser, (req, res) => {
    const mission = ephemerisMission(ctx, signedIn(req).user.id, pathParam(req, 'id'), 'read');
    res.json(toEphemerisSummary(ephemerisOf(ctx, mission.id, pathParam(req, 'ephemerisId'))));
  });

  router.get(`${base}/:ephemerisId/points`, requireUser, (req, res) => {
    const mission = ephemerisMission(ctx, signedIn(req).user.id, pathParam(req, 'id'), 'read');
    const row = ephemerisOf(ctx, mission.id, pathParam(req, 'ephemerisId'));
    const query = parse(ephemerisPointsQuery, req.query);
    res.json(pointsPage(ctx, row, query.offset, query.limit));
  });

  router.post(`${base}/:ephemerisId/environment`, requireUser, async (req, res) => {
    const mission = ephemerisMission(ctx, signedIn(req).user.id, pathParam(req, 'id'), 'read');
    const row = ephemerisOf(ctx, mission.id, pathParam(req, 'ephemerisId'));
    const options = parse(trajectoryEnvironmentRequest, req.body ?? {});
    const form = answerForm(req);
    const answer = ephemerisEnvironment(ctx, mission, row, options);
    await sendPerStep(res, form, { answer: () => answer, key: 'points', stepKey: 'epoch' });
  });

  router.post(`${base}/:ephemerisId/cases`, requireUser, (req, res) => {
    const user = signedIn(req).user;
    // Load cases are the thermal engineers' and owners' (403 for others, 404 for outsiders).
    const { mission } = missionForCases(ctx, user.id, pathParam(req, 'id'));
    const ephemeris = ephemerisOf(ctx, mission.id, pathParam(req, 'ephemerisId'));
    const row = createEphemerisCase(ctx, user, mission, ephemeris, parse(ephemerisCaseCreate, req.body ?? {}));
    res.status(201).json(toDetail(ctx.db, row, user.id));
  });

  router.delete(`${base}/:ephemerisId`, requireUser, (req, res) => {
    const user = signedIn(req).user;
    const mission = ephemerisMission(ctx, user.id, pathParam(req, 'id'), 'edit');
    deleteEphemeris(ctx, mission, ephemerisOf(ctx, mission.id, pathParam(req, 'ephemerisId')), user.id);
    res.status(204).end();
  });

  return router;
}
