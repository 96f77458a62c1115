// The documents that describe the API: the JSON Schema of a case export and OpenAPI 3, made from
// the route declarations the dispatcher serves. Signed-in callers only, like every route but the
// few public ones (API.md "Auth").
import { z } from 'zod';
import { route, type ApiRoute } from '../http/api-route';
import { loadCaseJsonSchema, openApiDocument } from '../openapi/openapi-document';

const document = z.record(z.string(), z.unknown());

export const apiDocsRoutes: ApiRoute[] = [
  route({
    method: 'get', path: '/api/v1/schemas/load-case.json', tag: 'documents', summary: 'JSON Schema (draft 2020-12) of a case’s JSON export', access: 'signed-in', response: document,
    handle: ({ ctx, res }) => {
      res.type('application/schema+json; charset=utf-8').send(JSON.stringify(loadCaseJsonSchema(ctx.config.publicUrl)));
    },
  }),
  route({
    method: 'get', path: '/api/v1/openapi.json', tag: 'documents', summary: 'This document: the whole API in OpenAPI 3', access: 'signed-in', response: document,
    handle: ({ ctx, routes }) => openApiDocument(ctx.config.publicUrl, routes),
  }),
];
