// The stateless physics routes (API.md "Environment computation", "Other fixed routes"): the body
// catalogue and one body, one orbit's environment and figures, the sun-synchronous orbit at an
// altitude, the beta history over a date range, and unit conversion for the client's fields.
// Any signed-in role may call them; malformed input is a 400, the physically impossible a 422.
import {
  asEnvironmentRequest, betaHistoryRequest, betaHistoryResponse, bodiesResponse, bodyDetail, environmentRequest, environmentResponse, orbitFiguresRequest,
  orbitFiguresResponse, sunSynchronousQuery, sunSynchronousResponse, unitConvertRequest, unitConvertResponse, type BodyDetailResponse,
} from '../../shared/api/environment';
import { bodySummaries, bodySummary, getBody, isBodyId, type Body } from '../../shared/physics/bodies';
import { isCustomBodyId } from '../../shared/physics/custom-bodies';
import type { AppContext } from '../app-context';
import { userWorkspaces } from '../auth/me-response';
import { listCustomBodies, useCustomBodyIn } from '../bodies/custom-body-store';
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

/** The caller's workspaces, where their own bodies may come from. */
const workspaceIdsOf = (ctx: AppContext, userId: string): string[] => userWorkspaces(ctx.db, userId).map((w) => w.workspaceId);

/** A body named in a path: the catalogue's, or one of the caller's workspaces' own (404 otherwise). */
function bodyFromPath(ctx: AppContext, userId: string, id: string): Body {
  const mine = isCustomBodyId(id) && listCustomBodies(ctx.db, workspaceIdsOf(ctx, userId)).some((b) => b.id === id);
  if (!isBodyId(id) && !mine) throw notFound(`There is no body "${id.slice(0, 80)}"; GET /api/v1/bodies lists them.`);
  return getBody(id);
}

/** A body named in a request body: a workspace's own only from the caller's workspaces (400 naming bodyId). */
function checkBodyOfCaller<T extends { bodyId: string }>(ctx: AppContext, userId: string, request: T): T {
  if (isCustomBodyId(request.bodyId)) useCustomBodyIn(ctx.db, workspaceIdsOf(ctx, userId), request.bodyId);
  return request;
}

/** The catalogue, then the caller's workspaces' own bodies, each with its workspace. */
const bodiesOf = (ctx: AppContext, userId: string) => [
  ...bodies(),
  ...listCustomBodies(ctx.db, workspaceIdsOf(ctx, userId)).map((b) => ({ ...bodySummary(getBody(b.id)), workspaceId: b.workspaceId })),
];

const bodyDetailOf = (ctx: AppContext, userId: string, id: string): BodyDetailResponse => {
  const body = bodyFromPath(ctx, userId, id);
  return { ...bodySummary(body), ...sunlightRange(body) };
};

export const environmentRoutes: ApiRoute[] = [
  route({
    method: 'get', path: `${v1}/bodies`, tag, access: 'signed-in', response: bodiesResponse,
    summary: 'The body catalogue with sources, then the caller’s workspaces’ own bodies (ids "custom-" and a UUID, each with its workspaceId)',
    handle: ({ ctx, auth }) => bodiesOf(ctx, auth.user.id),
  }),
  route({
    method: 'get', path: `${v1}/bodies/:bodyId`, tag, summary: 'One body with its sources', access: 'signed-in', response: bodyDetail,
    handle: ({ ctx, auth, param }) => bodyDetailOf(ctx, auth.user.id, param('bodyId')),
  }),
  route({
    method: 'get', path: `${v1}/bodies/:bodyId/sun-synchronous`, tag, summary: 'The sun-synchronous inclination for an altitude (422 where none exists)', access: 'signed-in',
    query: sunSynchronousQuery, response: sunSynchronousResponse,
    handle: ({ ctx, auth, param, query }) => {
      const body = bodyFromPath(ctx, auth.user.id, param('bodyId'));
      const q = query();
      return sunSynchronousOrbit(body, q.altitudeKm, q.eccentricity ?? 0);
    },
  }),
  route({
    method: 'post', path: `${v1}/orbits/figures`, tag, summary: 'Period, mean motion, J2 drift and speeds of an orbit', access: 'signed-in',
    body: orbitFiguresRequest, response: orbitFiguresResponse,
    handle: ({ ctx, auth, body }) => {
      const request = checkBodyOfCaller(ctx, auth.user.id, body());
      return orbitFigures(getBody(request.bodyId), request.orbit);
    },
  }),
  route({
    method: 'post', path: `${v1}/environment/compute`, tag, summary: 'One orbit’s thermal environment (stateless)', access: 'signed-in',
    body: environmentRequest, response: environmentResponse, perStep: true,
    handle: async ({ ctx, auth, req, res, body }) => {
      const request = checkBodyOfCaller(ctx, auth.user.id, body());
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
    handle: ({ ctx, auth, body }) => betaHistory(checkBodyOfCaller(ctx, auth.user.id, body())),
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
