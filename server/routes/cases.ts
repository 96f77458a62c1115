// cases: load cases of a mission (shared/api/cases.ts). Who may see or change a case is decided by
// caseFor and missionForCases (server/cases/case-access.ts); the work is in server/cases/.
import {
  caseComment, caseCommentCreate, caseCompareQuery, caseComparison, caseCreate, caseDerive, caseDetail, caseExport, caseExportQuery, caseList, caseListQuery,
  caseRevisionCreate, caseUpdate, derivedCases, subscriptionState, workspaceOverview as workspaceOverviewSchema,
} from '../../shared/api/cases';
import { caseFor, caseToCompareWith, missionForCases } from '../cases/case-access';
import { deriveCases } from '../cases/case-derivation';
import { createCustomCase } from '../cases/custom-case';
import { sendCaseExport } from '../cases/case-export-answer';
import { commentOnCase, newRevision, releaseCase, requireReviewer, returnCase, setSubscription, submitCase, updateCase } from '../cases/case-lifecycle';
import { workspaceOverview } from '../cases/case-overview';
import { caseListJson, commentsOf, compareCases, toDetail } from '../cases/case-views';
import { route, type ApiRoute } from '../http/api-route';
import { anyMember } from '../workspaces/workspace-roles';

const v1 = '/api/v1';
const c = `${v1}/cases/:id`;
const tag = 'cases';
const editors = '(thermal engineer or owner)';

export const caseRoutes: ApiRoute[] = [
  route({
    method: 'post', path: `${v1}/missions/:id/cases/derive`, tag, summary: `Derive the hot and cold cases of an orbit; both saved as drafts ${editors}`, access: 'signed-in',
    body: caseDerive, status: 201, response: derivedCases,
    handle: ({ ctx, auth, param, body }) => {
      const { mission } = missionForCases(ctx, auth.user.id, param('id'));
      const rows = deriveCases(ctx, auth.user, mission, body());
      return { items: rows.map((r) => toDetail(ctx.db, r, auth.user.id)) };
    },
  }),
  route({
    method: 'post', path: `${v1}/missions/:id/cases`, tag, summary: `Add a custom case: fixed date, beta, properties, attitude ${editors}`, access: 'signed-in',
    body: caseCreate, status: 201, response: caseDetail,
    handle: ({ ctx, auth, param, body }) => {
      const { mission } = missionForCases(ctx, auth.user.id, param('id'));
      return toDetail(ctx.db, createCustomCase(ctx, auth.user, mission, body()), auth.user.id);
    },
  }),
  route({
    method: 'get', path: `${v1}/cases`, tag, summary: 'The cases the caller may see (viewers: released and superseded only)', access: 'signed-in',
    query: caseListQuery, response: caseList,
    // Answered as JSON text kept until the database changes (the same bytes res.json would send).
    handle: ({ ctx, auth, query, res }) => {
      res.status(200).type('application/json').send(caseListJson(ctx, auth.user.id, query()));
    },
  }),
  route({
    method: 'get', path: `${v1}/workspaces/:workspaceId/overview`, tag, access: anyMember, response: workspaceOverviewSchema,
    summary: 'What needs the caller in a workspace: cases waiting for their review, their drafts returned with a comment, the newest revisions of cases they follow, released cases whose inputs changed (members)',
    handle: ({ ctx, auth, membership }) => workspaceOverview(ctx, auth.user.id, membership.workspaceId, membership.role),
  }),
  route({
    method: 'get', path: c, tag, summary: 'A case with its inputs, rationale and results', access: 'signed-in', response: caseDetail,
    handle: ({ ctx, auth, param }) => toDetail(ctx.db, caseFor(ctx, auth.user.id, param('id')).row, auth.user.id),
  }),
  route({
    method: 'patch', path: c, tag, summary: `Change a draft; 409 for any other status ${editors}`, access: 'signed-in', body: caseUpdate, response: caseDetail,
    handle: ({ ctx, auth, param, body }) => {
      const { row } = caseFor(ctx, auth.user.id, param('id'), true);
      return toDetail(ctx.db, updateCase(ctx, auth.user, row, body()), auth.user.id);
    },
  }),
  route({
    method: 'post', path: `${c}/submit`, tag, summary: `Submit a draft for review ${editors}`, access: 'signed-in', response: caseDetail,
    handle: ({ ctx, auth, param }) => toDetail(ctx.db, submitCase(ctx, auth.user, caseFor(ctx, auth.user.id, param('id'), true).row), auth.user.id),
  }),
  route({
    method: 'post', path: `${c}/release`, tag, summary: 'Release a case in review: a thermal engineer or owner other than its author', access: 'signed-in', response: caseDetail,
    handle: async ({ ctx, auth, param }) => {
      const { row } = caseFor(ctx, auth.user.id, param('id'), true);
      return toDetail(ctx.db, await releaseCase(ctx, auth.user, row), auth.user.id);
    },
  }),
  route({
    method: 'post', path: `${c}/return`, tag, access: 'signed-in', body: caseCommentCreate, response: caseDetail,
    summary: 'Return a case in review to its author as a draft, with a comment kept in its history: a thermal engineer or owner other than its author',
    handle: ({ ctx, auth, param, body }) => {
      const { row } = caseFor(ctx, auth.user.id, param('id'), true);
      requireReviewer(row, auth.user);
      return toDetail(ctx.db, returnCase(ctx, auth.user, row, body().text), auth.user.id);
    },
  }),
  route({
    method: 'post', path: `${c}/comments`, tag, summary: `Comment on a draft or a case in review ${editors}`, access: 'signed-in', body: caseCommentCreate, status: 201, response: caseComment,
    handle: ({ ctx, auth, param, body }) => {
      const { row } = caseFor(ctx, auth.user.id, param('id'), true);
      const made = commentOnCase(ctx, auth.user, row, body().text);
      return commentsOf(ctx.db, row.seriesId).find((comment) => comment.id === made.id) ?? null;
    },
  }),
  route({
    method: 'post', path: `${c}/revisions`, tag, access: 'signed-in', body: caseRevisionCreate, bodyOptional: true, status: 201, response: caseDetail,
    summary: `Start a new draft revision from a released one, with its reason; fromCurrentInputs computes it again from the mission as it is now (hot, cold, custom, or along its ephemeris window; 409 when its orbit or ephemeris was deleted) ${editors}`,
    handle: ({ ctx, auth, param, body }) => {
      const { row } = caseFor(ctx, auth.user.id, param('id'), true);
      return toDetail(ctx.db, newRevision(ctx, auth.user, row, body()), auth.user.id);
    },
  }),
  route({
    method: 'get', path: `${c}/compare`, tag, summary: 'Two revisions side by side: inputs and per-surface orbit averages', access: 'signed-in',
    query: caseCompareQuery, response: caseComparison,
    handle: ({ ctx, auth, param, query }) => {
      const { row } = caseFor(ctx, auth.user.id, param('id'));
      return compareCases(ctx.db, row, caseToCompareWith(ctx, auth.user.id, row, query().with));
    },
  }),
  // Any member who may see a case may follow it, viewers included: they are the importing teams.
  route({
    method: 'post', path: `${c}/subscription`, tag, summary: 'Follow the case: mail on every new release', access: 'signed-in', response: subscriptionState,
    handle: ({ ctx, auth, param }) => setSubscription(ctx, auth.user, caseFor(ctx, auth.user.id, param('id')).row, true),
  }),
  route({
    method: 'delete', path: `${c}/subscription`, tag, summary: 'Stop following the case', access: 'signed-in', response: subscriptionState,
    handle: ({ ctx, auth, param }) => setSubscription(ctx, auth.user, caseFor(ctx, auth.user.id, param('id')).row, false),
  }),
  route({
    method: 'get', path: `${c}/export`, tag, access: 'signed-in', query: caseExportQuery, response: caseExport, produces: ['application/json', 'text/csv'], perStep: true,
    summary: 'The case as a file: JSON (load-case.json schema) or a tidy CSV (RFC 4180): one header row with units, a row per time step and surface (with the sunlit share, and past the parent planet about a moon), then per surface its orbit average and peak and the spacecraft total; case, revision, status, checksum, mission, body, orbit, date, beta, Sun distance, property set, heat-load margin and caution as columns on every row',
    handle: ({ ctx, req, res, auth, param, query }) => {
      const { row } = caseFor(ctx, auth.user.id, param('id'));
      return sendCaseExport(ctx, req, res, auth, row, query());
    },
  }),
];
