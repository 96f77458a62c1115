// The stateless thermal routes (API.md "Thermal solve"): a lumped-node model and one orbit's loads
// in, the periodic steady state out; and sizing of a radiator or a heater. Any signed-in role.
import { asThermalSolveInput, thermalSizeRequest, thermalSizeResponse, thermalSolveRequest, thermalSolveResponse } from '../../shared/api/thermal';
import { route, type ApiRoute } from '../http/api-route';
import { sendJson } from '../json-stream';
import { answerThermalAsync, boundedModel } from '../thermal/thermal-failures';
import { sizeThermal } from '../thermal/thermal-sizing';
import { thermalPool, whileClientWaits } from '../thermal/thermal-pool';

const v1 = '/api/v1';

export const thermalRoutes: ApiRoute[] = [
  route({
    method: 'post', path: `${v1}/thermal/solve`, tag: 'thermal', summary: 'A lumped-node model at periodic steady state (422 when it does not converge)', access: 'signed-in',
    body: thermalSolveRequest, response: thermalSolveResponse,
    handle: async ({ res, body }) => {
      const model = boundedModel(asThermalSolveInput(body()));
      await sendJson(res, await answerThermalAsync(thermalPool.run('solve', model, whileClientWaits(res)), 'impossible_model'));
    },
  }),
  route({
    method: 'post', path: `${v1}/thermal/size`, tag: 'thermal', summary: 'Radiator area for the hot case or heater power for the cold case', access: 'signed-in',
    body: thermalSizeRequest, response: thermalSizeResponse,
    handle: ({ res, body }) => sizeThermal(body(), whileClientWaits(res)),
  }),
];
