// The stateless thermal routes (API.md "Thermal solve"): a lumped-node model and one orbit's loads
// in, the periodic steady state out; and sizing of a radiator or a heater. Any signed-in role.
import { Router } from 'express';
import { asThermalSolveInput, thermalSizeRequest, thermalSolveRequest, type ThermalSizeResponse } from '../../shared/api/thermal';
import type { AppContext } from '../app-context';
import { requireUser } from '../auth/middleware';
import { parse } from '../errors';
import { sendJson } from '../json-stream';
import { answerThermalAsync, boundedModel } from '../thermal/thermal-failures';
import { thermalPool, whileClientWaits } from '../thermal/thermal-pool';

export function thermalRoutes(_ctx: AppContext): Router {
  const router = Router();

  router.post('/thermal/solve', requireUser, async (req, res) => {
    const model = boundedModel(asThermalSolveInput(parse(thermalSolveRequest, req.body)));
    await sendJson(res, await answerThermalAsync(thermalPool.run('solve', model, whileClientWaits(res)), 'impossible_model'));
  });

  router.post('/thermal/size', requireUser, async (req, res) => {
    const request = parse(thermalSizeRequest, req.body);
    const model = boundedModel(asThermalSolveInput(request));
    const { sizing } = request;
    const signal = whileClientWaits(res);
    const marginK = sizing.marginK ?? 0;
    const answer: ThermalSizeResponse = {
      sizing: sizing.kind === 'radiator'
        ? { kind: 'radiator' as const, ...await answerThermalAsync(thermalPool.run('radiator', { model, node: sizing.node, marginK }, signal)) }
        : { kind: 'heater' as const, ...await answerThermalAsync(thermalPool.run('heater', { model, node: sizing.node, marginK, maxDutyCycle: sizing.maxDutyCycle }, signal)) },
    };
    res.json(answer);
  });

  return router;
}
