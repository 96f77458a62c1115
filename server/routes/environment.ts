// The stateless physics routes (API.md "Environment computation", "Other fixed routes"): the body
// catalogue and one body, one orbit's environment and figures, the sun-synchronous orbit at an
// altitude, the beta history over a date range, and unit conversion for the client's fields.
// Any signed-in role may call them; malformed input is a 400, the physically impossible a 422.
import {
  asEnvironmentRequest, betaHistoryRequest, betaHistoryResponse, bodiesResponse, bodyDetail, environmentRequest, environmentResponse, orbitFiguresRequest,
  orbitFiguresResponse, sunSynchronousQuery, sunSynchronousResponse, unitConvertRequest, unitConvertResponse, type BodyDetailResponse,
} from '../../shared/api/environment';
import { bodySummaries, getBody, isBodyId, type Body } from '../../shared/physics/bodies';
import { computeEnvironmentColumns, environmentResult } from '../../shared/physics/environment';
import { orbitFigures } from '../../shared/physics/orbit-figures';
import { sunlightRange } from '../../shared/physics/sun';
import { sunSynchronousOrbit } from '../../shared/physics/sun-synchronous';
import { betaHistory } from '../environment/beta-history';
import { notFound } from '../errors';
import { route, type ApiRoute } from '../http/api-route';
import { answerForm, sendPerStep } from '../http/answer-formats';
import { environmentColumnsAnswer, environmentJson } from '../http/environment-json';
import { convertTypedValue } from '../missions/quantity-reader';
import { limitWork } from '../work-limit';

const v1 = '/api/v1';
const tag = 'environment';

// The catalogue is constant data; computed once.
let catalogue: ReturnType<typeof bodySummaries> | null = null;
const bodies = () => (catalogue ??= bodySummaries());

function bodyFromPath(id: string): Body {
  if (!isBodyId(id)) throw notFound(`There is no body "${id}"; GET /api/v1/bodies lists them.`);
  return getBody(id);
}

function bodyDetailOf(id: string): BodyDetailResponse {
  const body = bodyFromPath(id);
  const summary = bodies().find((b) => b.id === body.id);
  if (!summary) throw notFound(`There is no body "${body.id}".`);
  return { ...summary, ...sunlightRange(body) };
}

export const environmentRoutes: ApiRoute[] = [
  route({
    method: 'get', path: `${v1}/bodies`, tag, summary: 'The body catalogue with sources', access: 'signed-in', response: bodiesResponse,
    handle: () => bodies(),
  }),
  route({
    method: 'get', path: `${v1}/bodies/:bodyId`, tag, summary: 'One body with its sources', access: 'signed-in', response: bodyDetail,
    handle: ({ param }) => bodyDetailOf(param('bodyId')),
  }),
  route({
    method: 'get', path: `${v1}/bodies/:bodyId/sun-synchronous`, tag, summary: 'The sun-synchronous inclination for an altitude (422 where none exists)', access: 'signed-in',
    query: sunSynchronousQuery, response: sunSynchronousResponse,
    handle: ({ param, query }) => {
      const body = bodyFromPath(param('bodyId'));
      const q = query();
      return sunSynchronousOrbit(body, q.altitudeKm, q.eccentricity ?? 0);
    },
  }),
  route({
    method: 'post', path: `${v1}/orbits/figures`, tag, summary: 'Period, mean motion, J2 drift and speeds of an orbit', access: 'signed-in',
    body: orbitFiguresRequest, response: orbitFiguresResponse,
    handle: ({ body }) => {
      const request = body();
      return orbitFigures(getBody(request.bodyId), request.orbit);
    },
  }),
  route({
    method: 'post', path: `${v1}/environment/compute`, tag, summary: 'One orbit’s thermal environment (stateless)', access: 'signed-in',
    body: environmentRequest, response: environmentResponse, perStep: true,
    handle: async ({ req, res, body }) => {
      const request = body();
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
    },
  }),
  route({
    method: 'post', path: `${v1}/environment/beta-history`, tag, summary: 'Beta, eclipse and Sun distance over a date range', access: 'signed-in',
    body: betaHistoryRequest, response: betaHistoryResponse,
    handle: ({ body }) => betaHistory(body()),
  }),
  route({
    method: 'post', path: `${v1}/units/convert`, tag, summary: 'Read a value with its unit in the unit asked for', access: 'signed-in',
    body: unitConvertRequest, response: unitConvertResponse,
    handle: async ({ body }) => {
      const request = body();
      return { value: await convertTypedValue(request.value, request.unit), unit: request.unit };
    },
  }),
];
