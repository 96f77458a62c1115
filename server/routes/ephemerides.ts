// ephemerides: trajectories uploaded to a mission, the environment along them and load cases
// from a window of them (shared/api/ephemerides.ts).
import { z } from 'zod';
import { caseDetail } from '../../shared/api/cases';
import {
  ephemerisCaseCreate, ephemerisPointsPage, ephemerisPointsQuery, ephemerisSummary, ephemerisUploadFields, trajectoryEnvironmentRequest, trajectoryEnvironmentResponse,
} from '../../shared/api/ephemerides';
import { missionForCases } from '../cases/case-access';
import { toDetail } from '../cases/case-views';
import { createEphemerisCase } from '../cases/ephemeris-case';
import { ephemerisEnvironment } from '../ephemerides/ephemeris-environment';
import { receiveEphemeris } from '../ephemerides/ephemeris-ingest';
import { deleteEphemeris, ephemerisMission, ephemerisOf, listEphemerides, pointsPage, toEphemerisSummary } from '../ephemerides/ephemeris-store';
import { route, type ApiRoute } from '../http/api-route';
import { answerForm, sendPerStep } from '../http/answer-formats';

const base = '/api/v1/missions/:id/ephemerides';
const e = `${base}/:ephemerisId`;
const tag = 'ephemerides';

export const ephemerisRoutes: ApiRoute[] = [
  route({
    method: 'post', path: base, tag, summary: 'Upload an ephemeris (multipart: file, frame, name)', access: 'signed-in',
    body: ephemerisUploadFields, bodyKind: 'multipart', status: 201, response: ephemerisSummary,
    handle: async ({ ctx, req, res, auth, param }) => {
      // Access first, so a viewer or a stranger is refused before a byte of the file is stored.
      const mission = ephemerisMission(ctx, auth.user.id, param('id'), 'edit');
      return toEphemerisSummary(await receiveEphemeris(ctx, req, res, mission, auth.user.id));
    },
  }),
  route({
    method: 'get', path: base, tag, summary: 'A mission’s ephemerides', access: 'signed-in', response: z.object({ items: z.array(ephemerisSummary) }),
    handle: ({ ctx, auth, param }) => ({ items: listEphemerides(ctx, ephemerisMission(ctx, auth.user.id, param('id'), 'read').id) }),
  }),
  route({
    method: 'get', path: e, tag, summary: 'One ephemeris (summary)', access: 'signed-in', response: ephemerisSummary,
    handle: ({ ctx, auth, param }) => toEphemerisSummary(ephemerisOf(ctx, ephemerisMission(ctx, auth.user.id, param('id'), 'read').id, param('ephemerisId'))),
  }),
  route({
    method: 'get', path: `${e}/points`, tag, summary: 'A page of an ephemeris’ points', access: 'signed-in', query: ephemerisPointsQuery, response: ephemerisPointsPage,
    handle: ({ ctx, auth, param, query }) => {
      const row = ephemerisOf(ctx, ephemerisMission(ctx, auth.user.id, param('id'), 'read').id, param('ephemerisId'));
      const { offset, limit } = query();
      return pointsPage(ctx, row, offset, limit);
    },
  }),
  route({
    method: 'post', path: `${e}/environment`, tag, summary: 'The environment along an uploaded trajectory (optionally over a window)', access: 'signed-in',
    body: trajectoryEnvironmentRequest, bodyOptional: true, response: trajectoryEnvironmentResponse, perStep: true,
    handle: async ({ ctx, req, res, auth, param, body }) => {
      const mission = ephemerisMission(ctx, auth.user.id, param('id'), 'read');
      const row = ephemerisOf(ctx, mission.id, param('ephemerisId'));
      const options = body();
      const form = answerForm(req);
      const answer = ephemerisEnvironment(ctx, mission, row, options);
      await sendPerStep(res, form, { answer: () => answer, key: 'points', stepKey: 'epoch' });
    },
  }),
  route({
    method: 'post', path: `${e}/cases`, tag, summary: 'A load case (custom, draft) from a window of the trajectory', access: 'signed-in',
    body: ephemerisCaseCreate, bodyOptional: true, status: 201, response: caseDetail,
    handle: ({ ctx, auth, param, body }) => {
      const user = auth.user;
      // Load cases are the thermal engineers' and owners' (403 for others, 404 for outsiders).
      const { mission } = missionForCases(ctx, user.id, param('id'));
      const ephemeris = ephemerisOf(ctx, mission.id, param('ephemerisId'));
      return toDetail(ctx.db, createEphemerisCase(ctx, user, mission, ephemeris, body()), user.id);
    },
  }),
  route({
    method: 'delete', path: e, tag, summary: 'Delete an ephemeris', access: 'signed-in', status: 204,
    handle: ({ ctx, auth, param }) => {
      const mission = ephemerisMission(ctx, auth.user.id, param('id'), 'edit');
      deleteEphemeris(ctx, mission, ephemerisOf(ctx, mission.id, param('ephemerisId')), auth.user.id);
    },
  }),
];
