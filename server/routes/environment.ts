// The stateless physics routes (API.md "Environment computation", "Other fixed routes"): the body
// catalogue and one body, one orbit's environment and figures, the sun-synchronous orbit at an
// altitude, the beta history over a date range, and unit conversion for the client's fields.
// Any signed-in role may call them; malformed input is a 400, the physically impossible a 422.
import { Router, type Request } from 'express';
import {
  asEnvironmentRequest, betaHistoryRequest, environmentRequest, orbitFiguresRequest, sunSynchronousQuery, unitConvertRequest,
  type BetaHistoryResponse, type BodyDetailResponse,
} from '../../shared/api/environment';
import { bodySummaries, bodySummary, getBody, isBodyId, type Body } from '../../shared/physics/bodies';
import { isCustomBodyId } from '../../shared/physics/custom-bodies';
import { listCustomBodies, useCustomBodyIn } from '../bodies/custom-body-store';
import { userWorkspaces } from '../auth/me-response';
import { computeEnvironmentColumns, environmentResult } from '../../shared/physics/environment';
import { environmentColumnsAnswer, environmentJson } from '../http/environment-json';
import { sweepMission } from '../../shared/physics/mission-sweep';
import { orbitFigures } from '../../shared/physics/orbit-figures';
import { sunlightRange } from '../../shared/physics/sun';
import { sunSynchronousOrbit } from '../../shared/physics/sun-synchronous';
import type { AppContext } from '../app-context';
import { requireUser, signedIn } from '../auth/middleware';
import { notFound, parse } from '../errors';
import { limitWork } from '../work-limit';
import { answerForm, sendPerStep } from '../http/answer-formats';
import { normaliseUnitText, kindOfUnit } from '../../shared/physics/typed-units';
import { loadUnits, readQuantityIn } from '../missions/quantity-reader';

const DAY_MS = 86400e3;

const BETA_HISTORY_ASSUMPTIONS = [
  'the node and the periapsis drift at their first-order J2 secular rates from the orbit epoch; size, shape and inclination stay fixed',
  'the Sun from VSOP87 and the IAU pole of the body; a moon sees the Sun from its planet',
  'eclipseFraction counts umbra plus half of penumbra (conical shadow, Sun as a uniform disk, no atmosphere), the Sun held fixed over each orbit',
];

/** The caller's workspaces, where their own bodies may come from. */
const workspaceIdsOf = (ctx: AppContext, req: Request): string[] => userWorkspaces(ctx.db, signedIn(req).user.id).map((w) => w.workspaceId);

/** A body named in a path: the catalogue's, or one of the caller's workspaces' own (404 otherwise). */
function bodyFromPath(ctx: AppContext, req: Request, id: string): Body {
  const mine = isCustomBodyId(id) && listCustomBodies(ctx.db, workspaceIdsOf(ctx, req)).some((b) => b.id === id);
  if (!isBodyId(id) && !mine) throw notFound(`There is no body "${id.slice(0, 80)}"; GET /api/v1/bodies lists them.`);
  return getBody(id);
}

/** A body named in a request body: a workspace's own only from the caller's workspaces (400 naming bodyId). */
const checkBodyOfCaller = (ctx: AppContext, req: Request, bodyId: string): void => {
  if (isCustomBodyId(bodyId)) useCustomBodyIn(ctx.db, workspaceIdsOf(ctx, req), bodyId);
};

export function environmentRoutes(ctx: AppContext): Router {
  const router = Router();

  // The catalogue is constant data; computed once.
  const bodies = bodySummaries();
  // then the caller's workspaces' own bodies, each with its workspace
  router.get('/bodies', requireUser, (req, res) => {
    const own = listCustomBodies(ctx.db, workspaceIdsOf(ctx, req)).map((b) => ({ ...bodySummary(getBody(b.id)), workspaceId: b.workspaceId }));
    res.json([...bodies, ...own]);
  });

  router.get('/bodies/:bodyId', requireUser, (req, res) => {
    const body = bodyFromPath(ctx, req, req.params['bodyId'] as string);
    const detail: BodyDetailResponse = { ...bodySummary(body), ...sunlightRange(body) };
    res.json(detail);
  });

  router.get('/bodies/:bodyId/sun-synchronous', requireUser, (req, res) => {
    const body = bodyFromPath(ctx, req, req.params['bodyId'] as string);
    const query = parse(sunSynchronousQuery, req.query);
    res.json(sunSynchronousOrbit(body, query.altitudeKm, query.eccentricity ?? 0));
  });

  router.post('/orbits/figures', requireUser, (req, res) => {
    const request = parse(orbitFiguresRequest, req.body);
    checkBodyOfCaller(ctx, req, request.bodyId);
    res.json(orbitFigures(getBody(request.bodyId), request.orbit));
  });

  router.post('/environment/compute', requireUser, async (req, res) => {
    const request = parse(environmentRequest, req.body);
    checkBodyOfCaller(ctx, req, request.bodyId);
    limitWork([{ name: 'steps', count: request.steps }, { name: 'surfaces', count: request.surfaces.length }], 'steps', 'use fewer steps or fewer surfaces');
    const form = answerForm(req);
    const columns = computeEnvironmentColumns(asEnvironmentRequest(request));
    await sendPerStep(res, form, {
      json: () => environmentJson(columns),
      answer: () => environmentResult(columns),
      columns: () => environmentColumnsAnswer(columns),
      key: 'profile',
      stepKey: 'tS',
    });
  });

  router.post('/environment/beta-history', requireUser, (req, res) => {
    const request = parse(betaHistoryRequest, req.body);
    checkBodyOfCaller(ctx, req, request.bodyId);
    const fromMs = Date.parse(request.from);
    const sweep = sweepMission({
      bodyId: request.bodyId,
      orbit: request.orbit,
      epochStart: new Date(fromMs),
      orbitEpoch: request.epoch ?? new Date(fromMs),
      days: (Date.parse(request.to) - fromMs) / DAY_MS,
      stepDays: request.stepDays,
    });
    const answer: BetaHistoryResponse = {
      bodyId: sweep.bodyId,
      periodS: sweep.periodS,
      nodalRateDegPerDay: sweep.nodalRateDegPerDay,
      apsidalRateDegPerDay: sweep.apsidalRateDegPerDay,
      items: sweep.rows.map((r) => ({
        date: r.date, betaDeg: r.betaDeg, raanDeg: r.raanDeg, solarDistanceAu: r.solarDistanceAu, solarFluxWm2: r.solarFluxWm2,
        eclipseFraction: r.eclipseFraction, eclipseDurationS: r.eclipseDurationS,
      })),
      minBetaDeg: sweep.minBetaDeg,
      maxBetaDeg: sweep.maxBetaDeg,
      assumptions: BETA_HISTORY_ASSUMPTIONS,
    };
    res.json(answer);
  });

  router.post('/units/convert', requireUser, async (req, res) => {
    const request = parse(unitConvertRequest, req.body);
    const { convertQuantity } = await loadUnits();
    // A unit of the typed-unit table is read as the forms read it ("14 d", "1.2 m²"); others by mathjs.
    const value = kindOfUnit(request.unit) ? readQuantityIn(request.value, normaliseUnitText(request.unit), 'value') : convertQuantity(request.value, request.unit);
    res.json({ value, unit: request.unit });
  });

  return router;
}
