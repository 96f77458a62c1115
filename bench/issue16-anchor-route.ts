// Bench only, never part of the product: loaded before server/main.ts (node --import, see
// bench-server.ts startServer's anchorRoute) to add one route to the server's table. It answers the
// compute request as the route did when issue 16 was filed, the path that issue measures as "today"
// ("answers 8.46 MB of uncompressed JSON in about 80 ms"; the target: "JSON default: at most one
// fifth of today's bytes on the wire when the client accepts compression, and no slower end to end
// than today (serialise without building 72,000 objects first)"): the same parse and compute, then
// the 3600 x 20 per-step objects built (environmentResult) and sent by res.json, i.e. one
// JSON.stringify of the whole answer, Express's ETag of it, never compressed (the server then
// compressed nothing). Everything before the handler (the dispatcher's steps, sign-in, the body) is
// the product's own, so the anchor and the product's compute route differ only in how they answer.
import { asEnvironmentRequest, environmentRequest, environmentResponse } from '../shared/api/environment';
import { computeEnvironmentColumns, environmentResult } from '../shared/physics/environment';
import { route, type ApiRoute } from '../server/http/api-route';
import { apiRoutes } from '../server/routes/api-routes';
import { limitWork } from '../server/work-limit';
import { ISSUE16_ANCHOR_PATH } from './bench-server';

const anchor = route({
  method: 'post', path: ISSUE16_ANCHOR_PATH, tag: 'bench', summary: 'Bench only: the compute answer as before issue 16', access: 'signed-in',
  body: environmentRequest, response: environmentResponse,
  handle: ({ body }) => {
    const request = body();
    limitWork([{ name: 'steps', count: request.steps }, { name: 'surfaces', count: request.surfaces.length }], 'steps', 'use fewer steps or fewer surfaces');
    // Returned, the dispatcher answers it with res.status(200).json(value), as the route once did.
    return environmentResult(computeEnvironmentColumns(asEnvironmentRequest(request)));
  },
});

// The server's table is built from this list when main.ts creates the app, after this module ran.
(apiRoutes as ApiRoute[]).push(anchor);
