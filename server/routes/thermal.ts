// The stateless thermal routes (API.md "Thermal solve"): a lumped-node model and one orbit's loads
// in, the periodic steady state out; and sizing of a radiator or a heater. Any signed-in role.
import { Router } from 'express';
import { asThermalSolveInput, thermalSizeRequest, thermalSolveRequest, type ThermalSizeResponse } from '../../shared/api/thermal';
import { heaterPowerFor, radiatorAreaFor } from '../../shared/physics/thermal-sizing';
import { solveThermal } from '../../shared/physics/thermal-solver';
import type { AppContext } from '../app-context';
import { requireUser } from '../auth/middleware';
import { parse } from '../errors';
import { sendJson } from '../json-stream';
import { answerThermal, boundedModel } from '../thermal/thermal-failures';

export function thermalRoutes(_ctx: AppContext): Router {
  const router = Router();

  router.post('/thermal/solve', requireUser, async (req, res) => {
    const model = boundedModel(asThermalSolveInput(parse(thermalSolveRequest, req.body)));
    await sendJson(res, answerThermal(() => solveThermal(model), 'impossible_model'));
  });

  router.post('/thermal/size', requireUser, (req, res) => {
    const request = parse(thermalSizeRequest, req.body);
    const model = boundedModel(asThermalSolveInput(request));
    const { sizing } = request;
    const answer: ThermalSizeResponse = answerThermal(() => ({
      sizing: sizing.kind === 'radiator'
        ? { kind: 'radiator' as const, ...radiatorAreaFor(model, sizing.node, sizing.marginK ?? 0) }
        : { kind: 'heater' as const, ...heaterPowerFor(model, sizing.node, sizing.marginK ?? 0, sizing.maxDutyCycle) },
    }));
    res.json(answer);
  });

  return router;
}
