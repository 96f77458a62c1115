// Builds the Express app from an AppContext. main.ts only listens; tests drive this on port 0.
import express, { type Express } from 'express';
import type { AppContext } from './app-context';
import { errorMiddleware } from './errors';
import { clientFiles, hasClient } from './http/client-files';
import { requestLog } from './http/request-log';
import { securityHeaders } from './http/security-headers';
import { routeDispatcher } from './http/route-dispatch';
import { rememberRouteTable } from './route-list';
import { apiRoutes } from './routes/api-routes';
import { lookupCustomBody } from './bodies/custom-body-store';
import { setCustomBodyLookup } from '../shared/physics/bodies';

export interface AppOptions {
  /** Built client to serve; defaults to the config's clientDir. */
  clientDir?: string;
}

export function createApp(ctx: AppContext, options: AppOptions = {}): Express {
  // The physics finds a workspace's own bodies (custom-...) in this app's database.
  setCustomBodyLookup((id) => lookupCustomBody(ctx.db, id));
  const app = express();
  app.disable('x-powered-by');
  app.use(securityHeaders(ctx.config.publicUrl));
  app.use(requestLog(ctx.logger));

  // Every declared route, answered from one table (server/http/route-dispatch.ts).
  app.use(routeDispatcher(ctx, apiRoutes));
  rememberRouteTable(app, apiRoutes);

  const clientDir = options.clientDir ?? ctx.config.clientDir;
  if (hasClient(clientDir)) app.use(clientFiles(clientDir));

  app.use(errorMiddleware(ctx.logger));
  return app;
}
