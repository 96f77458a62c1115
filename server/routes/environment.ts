// The stateless physics routes (API.md "Environment computation", "Other fixed routes"): the body
// catalogue and one body, one orbit's environment and figures, the sun-synchronous orbit at an
// altitude, the beta history over a date range, and unit conversion for the client's fields.
// Any signed-in role may call them; malformed input is a 400, the physically impossible a 422.
import { Router } from 'express';
import {
  asEnvironmentRequest, betaHistoryRequest, environmentRequest, orbitFiguresRequest, sunSynchronousQuery, unitConvertRequest,
  type BetaHistoryResponse, type BodyDetailResponse,
} from '../../shared/api/environment';
import { bodySummaries, getBody, isBodyId, type Body } from '../../shared/physics/bodies';
import { computeEnvironmentColumns, environmentResult } from '../../shared/physics/environment';
import { environmentColumnsAnswer, environmentJsonPieces } from '../http/environment-json';
import { sweepMission } from '../../shared/physics/mission-sweep';
import { orbitFigures } from '../../shared/physics/orbit-figures';
import { sunlightRange } from '../../shared/physics/sun';
import { sunSynchronousOrbit } from '../../shared/physics/sun-synchronous';
import type { AppContext } from '../app-context';
import { requireUser } from '../auth/middleware';
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

function bodyFromPath(id: string): Body {
  if (!isBodyId(id)) throw notFound(`There is no body "${id}"; GET /api/v1/bodies lists them.`);
  return getBody(id);
}

export function environmentRoutes(_ctx: AppContext): Router {
  const router = Router();

  // The catalogue is constant data; computed once.
  const bodies = bodySummaries();
  router.get('/bodies', requireUser, (_req, res) => {
    res.json(bodies);
  });

  router.get('/bodies/:bodyId', requireUser, (req, res) => {
    const body = bodyFromPath(req.params['bodyId'] as string);
    const summary = bodies.find((b) => b.id === body.id);
    if (!summary) throw notFound(`There is no body "${body.id}".`);
    const detail: BodyDetailResponse = { ...summary, ...sunlightRange(body) };
    res.json(detail);
  });

  router.get('/bodies/:bodyId/sun-synchronous', requireUser, (req, res) => {
    const body = bodyFromPath(req.params['bodyId'] as string);
    const query = parse(sunSynchronousQuery, req.query);
    res.json(sunSynchronousOrbit(body, query.altitudeKm, query.eccentricity ?? 0));
  });

  router.post('/orbits/figures', requireUser, (req, res) => {
    const request = parse(orbitFiguresRequest, req.body);
    res.json(orbitFigures(getBody(request.bodyId), request.orbit));
  });

  router.post('/environment/compute', requireUser, async (req, res) => {
    const request = parse(environmentRequest, req.body);
    limitWork([{ name: 'steps', count: request.steps }, { name: 'surfaces', count: request.surfaces.length }], 'steps', 'use fewer steps or fewer surfaces');
    const form = answerForm(req);
    const columns = computeEnvironmentColumns(asEnvironmentRequest(request));
    await sendPerStep(res, form, {
      json: () => environmentJsonPieces(columns),
      answer: () => environmentResult(columns),
      columns: () => environmentColumnsAnswer(columns),
      key: 'profile',
      stepKey: 'tS',
    });
  });

  router.post('/environment/beta-history', requireUser, (req, res) => {
    const request = parse(betaHistoryRequest, req.body);
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
