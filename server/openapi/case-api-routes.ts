// Load cases and the documents that describe the API (shared/api/cases.ts).
import { z } from 'zod';
import {
  caseComment, caseCommentCreate, caseCompareQuery, caseComparison, caseRevisionCreate, caseCreate, caseDerive, caseDetail, caseExport, caseExportQuery, caseList, caseListQuery, caseUpdate,
  derivedCases, subscriptionState, workspaceOverview,
} from '../../shared/api/cases';
import type { ApiRoute } from './api-route';

const v1 = '/api/v1';
const c = `${v1}/cases/:id`;
const editors = '(thermal engineer or owner)';

export const caseApiRoutes: ApiRoute[] = [
  { method: 'post', path: `${v1}/missions/:id/cases/derive`, tag: 'cases', summary: `Derive the hot and cold cases of an orbit; both saved as drafts ${editors}`, body: caseDerive, status: 201, response: derivedCases },
  { method: 'post', path: `${v1}/missions/:id/cases`, tag: 'cases', summary: `Add a custom case: fixed date, beta, properties, attitude ${editors}`, body: caseCreate, status: 201, response: caseDetail },
  { method: 'get', path: `${v1}/cases`, tag: 'cases', summary: 'The cases the caller may see (viewers: released and superseded only)', query: caseListQuery, response: caseList },
  { method: 'get', path: c, tag: 'cases', summary: 'A case with its inputs, rationale and results', response: caseDetail },
  { method: 'patch', path: c, tag: 'cases', summary: `Change a draft; 409 for any other status ${editors}`, body: caseUpdate, response: caseDetail },
  { method: 'post', path: `${c}/submit`, tag: 'cases', summary: `Submit a draft for review ${editors}`, response: caseDetail },
  { method: 'post', path: `${c}/release`, tag: 'cases', summary: 'Release a case in review: a thermal engineer or owner other than its author', response: caseDetail },
  { method: 'post', path: `${c}/return`, tag: 'cases', summary: 'Return a case in review to its author as a draft, with a comment kept in its history: a thermal engineer or owner other than its author', body: caseCommentCreate, response: caseDetail },
  { method: 'post', path: `${c}/comments`, tag: 'cases', summary: `Comment on a draft or a case in review ${editors}`, body: caseCommentCreate, status: 201, response: caseComment },
  { method: 'post', path: `${c}/revisions`, tag: 'cases', summary: `Start a new draft revision from a released one, with its reason; fromCurrentInputs derives a hot or cold case again from the mission as it is now ${editors}`, body: caseRevisionCreate, status: 201, response: caseDetail },
  { method: 'get', path: `${c}/compare`, tag: 'cases', summary: 'Two revisions side by side: inputs and per-surface orbit averages', query: caseCompareQuery, response: caseComparison },
  { method: 'post', path: `${c}/subscription`, tag: 'cases', summary: 'Follow the case: mail on every new release', response: subscriptionState },
  { method: 'delete', path: `${c}/subscription`, tag: 'cases', summary: 'Stop following the case', response: subscriptionState },
  { method: 'get', path: `${c}/export`, tag: 'cases', summary: 'The case as a file: JSON (load-case.json schema) or a tidy CSV (RFC 4180): one header row with units, a row per time step and surface (with the sunlit share, and past the parent planet about a moon), then per surface its orbit average and peak and the spacecraft total; case, revision, status, checksum, mission, body, orbit, date, beta, Sun distance, property set, heat-load margin and caution as columns on every row', query: caseExportQuery, response: caseExport, produces: ['application/json', 'text/csv'], perStep: true },
  { method: 'get', path: `${v1}/workspaces/:workspaceId/overview`, tag: 'cases', summary: 'What needs the caller in a workspace: cases waiting for their review, their drafts returned with a comment, the newest revisions of cases they follow, released cases whose inputs changed (members)', response: workspaceOverview },
  { method: 'get', path: `${v1}/schemas/load-case.json`, tag: 'documents', summary: 'JSON Schema (draft 2020-12) of a case’s JSON export', response: z.record(z.string(), z.unknown()) },
  { method: 'get', path: `${v1}/openapi.json`, tag: 'documents', summary: 'This document: the whole API in OpenAPI 3', response: z.record(z.string(), z.unknown()) },
];
