// Builds the Express app from an AppContext. main.ts only listens; tests drive this on port 0.
import express, { Router, type Express } from 'express';
import cookieParser from 'cookie-parser';
import helmet from 'helmet';
import type { AppContext } from './app-context';
import { authenticate } from './auth/middleware';
import { apiNotFound, errorMiddleware } from './errors';
import { jsonBody } from './json-body';
import { bodyIdleTimeout } from './request-timeouts';
import { compressAnswers } from './http/answer-compression';
import { clientFiles, hasClient } from './http/client-files';
import { adminRoutes } from './routes/admin';
import { authRoutes } from './routes/auth';
import { caseRoutes } from './routes/cases';
import { environmentRoutes } from './routes/environment';
import { environmentTableRoutes } from './routes/environment-table';
import { customBodyRoutes } from './routes/custom-bodies';
import { lookupCustomBody } from './bodies/custom-body-store';
import { setCustomBodyLookup } from '../shared/physics/bodies';
import { ephemerisRoutes } from './routes/ephemerides';
import { invitationRoutes } from './routes/invitations';
import { materialRoutes } from './routes/materials';
import { missionRoutes } from './routes/missions';
import { orbitRoutes } from './routes/orbits';
import { surfaceRoutes } from './routes/surfaces';
import { thermalRoutes } from './routes/thermal';
import { thermalModelRoutes } from './routes/thermal-models';
import { tokenRoutes } from './routes/tokens';
import { workspaceRoutes } from './routes/workspaces';

export type FeatureRoutes = (ctx: AppContext) => Router;

/** Every feature's router, mounted under /api/v1 in this order; a new feature adds one entry. */
export const featureRoutes: FeatureRoutes[] = [
  authRoutes,
  tokenRoutes,
  workspaceRoutes,
  invitationRoutes,
  adminRoutes,
  environmentRoutes,
  thermalRoutes,
  missionRoutes,
  orbitRoutes,
  surfaceRoutes,
  materialRoutes,
  environmentTableRoutes,
  customBodyRoutes,
  ephemerisRoutes,
  caseRoutes,
  thermalModelRoutes,
];

export interface AppOptions {
  /** Built client to serve; defaults to the config's clientDir. */
  clientDir?: string;
}

export function createApp(ctx: AppContext, options: AppOptions = {}): Express {
  // The physics finds a workspace's own bodies (custom-...) in this app's database.
  setCustomBodyLookup((id) => lookupCustomBody(ctx.db, id));
  const app = express();
  app.disable('x-powered-by');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // Angular inserts component styles as <style> elements at run time.
          styleSrc: ["'self'", "'unsafe-inline'"],
          fontSrc: ["'self'", 'data:'],
          imgSrc: ["'self'", 'data:', 'blob:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          upgradeInsecureRequests: ctx.config.publicUrl.startsWith('https:') ? [] : null,
        },
      },
      // Plain-http local use must not be told to switch to https for a year.
      strictTransportSecurity: ctx.config.publicUrl.startsWith('https:'),
    }),
  );

  app.use((req, res, next) => {
    const started = process.hrtime.bigint();
    res.on('finish', () => {
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      // The path only: query strings, bodies, cookies and headers may carry secrets.
      ctx.logger.info('request', {
        method: req.method,
        path: req.originalUrl.split('?')[0],
        status: res.statusCode,
        ms: Math.round(ms * 10) / 10,
      });
    });
    next();
  });

  app.get('/api/health', (_req, res) => {
    res.json({ status: 'ok' });
  });

  app.use('/api', compressAnswers);
  const api = Router();
  api.use(bodyIdleTimeout(ctx.config));
  api.use(jsonBody());
  api.use(cookieParser());
  api.use(authenticate(ctx));
  for (const routes of featureRoutes) api.use(routes(ctx));
  app.use('/api/v1', api);
  app.use('/api', apiNotFound);

  const clientDir = options.clientDir ?? ctx.config.clientDir;
  if (hasClient(clientDir)) app.use(clientFiles(clientDir));

  app.use(errorMiddleware(ctx.logger));
  return app;
}
