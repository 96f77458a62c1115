// The OpenAPI 3 description of the whole API, generated from the route declarations
// (server/routes/api-routes.ts, the list the dispatcher serves) and their zod schemas of shared/api/
// with @asteasolutions/zod-to-openapi, and the JSON Schema of a case export from zod 4's own converter.
import { OpenAPIRegistry, OpenApiGeneratorV3 } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { caseExport } from '../../shared/api/cases';
import { answerLayoutQuery } from '../../shared/api/answer-formats';
import { errorBody } from '../../shared/api/errors';
import { ARROW_STREAM } from '../http/answer-formats';
import type { ApiRoute } from '../http/api-route';

const openApiPath = (path: string) => path.replace(/:(\w+)/g, '{$1}');
const pathParams = (path: string) => [...path.matchAll(/:(\w+)/g)].map((m) => m[1] ?? '');

const perStepDescription =
  'Success. Per-step results in the form asked for (API.md "Answer formats"): the JSON below by default; with ?layout=columns the same ' +
  'answer with its list of per-step objects as one array per quantity (and, per surface, one entry holding an array per quantity), ' +
  'names and units unchanged; compressed (br or gzip) when Accept-Encoding allows.';
const arrowDescription =
  'Asked for with Accept: application/vnd.apache.arrow.stream. An Apache Arrow IPC stream: one row per step, one column per quantity ' +
  '(a per-surface or per-node quantity is the column "<name>.<quantity>", e.g. "nadir.absorbedW"), units as in the JSON names; every other ' +
  'field of the answer is in the schema metadata under its own name (text as it is, numbers and structures as JSON).';

const errorStatuses: Record<string, string> = {
  '400': 'Malformed or out-of-range input; details name each field and value',
  '401': 'Not signed in (no session cookie, no valid API token)',
  '403': 'Signed in but not allowed (role, read-only token, four-eyes rule)',
  '404': 'Not found, also for another workspace’s object',
  '409': 'Conflict, e.g. changing a released revision',
  '422': 'Well formed but physically impossible',
};

function register(registry: OpenAPIRegistry, route: ApiRoute): void {
  const names = pathParams(route.path);
  const params = names.length > 0 ? z.object(Object.fromEntries(names.map((n) => [n, z.string()]))) : undefined;
  const status = String(route.status ?? 200);
  const content: Record<string, { schema: z.ZodType }> = {};
  if (route.response) content['application/json'] = { schema: route.response };
  for (const type of route.produces ?? []) if (!content[type]) content[type] = { schema: z.string() };
  if (route.perStep) content[ARROW_STREAM] = { schema: z.string().meta({ format: 'binary', description: arrowDescription }) };
  const query = route.perStep && !route.query?.shape['layout'] ? (route.query ?? z.object({})).extend(answerLayoutQuery.shape) : route.query;
  const bodyContent = route.body
    ? route.bodyKind === 'multipart'
      ? { 'multipart/form-data': { schema: route.body instanceof z.ZodObject ? route.body.extend({ file: z.string().meta({ format: 'binary' }) }) : route.body } }
      : { 'application/json': { schema: route.body } }
    : undefined;
  registry.registerPath({
    method: route.method,
    path: openApiPath(route.path),
    summary: route.summary,
    tags: [route.tag],
    ...(route.access === 'public' ? { security: [] } : {}),
    request: {
      ...(params ? { params } : {}),
      ...(query ? { query } : {}),
      ...(bodyContent ? { body: { content: bodyContent, required: !route.bodyOptional } } : {}),
    },
    responses: {
      [status]: { description: status === '204' ? 'Done, no content' : route.perStep ? perStepDescription : 'Success', ...(Object.keys(content).length > 0 ? { content } : {}) },
      ...Object.fromEntries(
        Object.entries(errorStatuses)
          .filter(([code]) => !(route.access === 'public' && code === '401'))
          .map(([code, description]) => [code, { description, content: { 'application/json': { schema: errorBody } } }]),
      ),
    },
  });
}

const cached = new WeakMap<readonly ApiRoute[], object>();

/** The document of these routes (made once per list; the server's public URL is its one server). */
export function openApiDocument(publicUrl: string, routes: readonly ApiRoute[]): object {
  const made = cached.get(routes);
  if (made) return made;
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'apiToken', { type: 'http', scheme: 'bearer', description: 'A personal API token: Authorization: Bearer <token>' });
  registry.registerComponent('securitySchemes', 'session', { type: 'apiKey', in: 'cookie', name: 'eclipta_session' });
  for (const route of routes) register(registry, route);
  const document = new OpenApiGeneratorV3(registry.definitions).generateDocument({
    openapi: '3.0.3',
    info: {
      title: 'Eclipta API',
      version: '1',
      description: 'Orbital thermal environment, hot and cold load cases, thermal models. Errors: {"error": {"code", "message", "details"}}. ' +
        'Every answer is compressed (br or gzip) when the request accepts it. Per-step results also come as columnar JSON (?layout=columns) ' +
        'and as an Apache Arrow IPC stream (Accept: application/vnd.apache.arrow.stream).',
    },
    servers: [{ url: publicUrl }],
    security: [{ apiToken: [] }, { session: [] }],
  });
  cached.set(routes, document);
  return document;
}

let schemaCache: object | null = null;

/** The JSON Schema of a case's JSON export (draft 2020-12). */
export function loadCaseJsonSchema(publicUrl: string): object {
  schemaCache ??= {
    $id: `${publicUrl}/api/v1/schemas/load-case.json`,
    title: 'Eclipta load case',
    ...z.toJSONSchema(caseExport, { target: 'draft-2020-12', io: 'output', unrepresentable: 'any' }),
  };
  return schemaCache;
}
