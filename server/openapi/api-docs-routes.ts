// The documents that describe the API: the JSON Schema of a case export and OpenAPI 3. Signed-in
// callers only, like every route but the few public ones (API.md "Auth").
import { Router } from 'express';
import type { AppContext } from '../app-context';
import { requireUser } from '../auth/middleware';
import { loadCaseJsonSchema, openApiDocument } from './openapi-document';

export function apiDocsRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/schemas/load-case.json', requireUser, (_req, res) => {
    res.type('application/schema+json; charset=utf-8').send(JSON.stringify(loadCaseJsonSchema(ctx.config.publicUrl)));
  });
  router.get('/openapi.json', requireUser, (_req, res) => {
    res.json(openApiDocument(ctx.config.publicUrl));
  });
  return router;
}
