// The stateless physics routes (API.md "Environment computation", "Other fixed routes"):
// the body catalogue and one orbit's environment. Any signed-in role may call them.
import { Router } from 'express';
import { asEnvironmentRequest, environmentRequest } from '../../shared/api/environment';
import { bodySummaries } from '../../shared/physics/bodies';
import { computeEnvironment } from '../../shared/physics/environment';
import type { AppContext } from '../app-context';
import { requireUser } from '../auth/middleware';
import { parse } from '../errors';

export function environmentRoutes(_ctx: AppContext): Router {
  const router = Router();

  // The catalogue is constant data; computed once.
  const bodies = bodySummaries();
  router.get('/bodies', requireUser, (_req, res) => {
    res.json(bodies);
  });

  router.post('/environment/compute', requireUser, (req, res) => {
    const request = parse(environmentRequest, req.body);
    res.json(computeEnvironment(asEnvironmentRequest(request)));
  });

  return router;
}
