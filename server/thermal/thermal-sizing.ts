// Sizing with the stateless model (POST /thermal/size): the radiator area for the hot case or the
// heater power for the cold case, worked out in the thermal pool while the client waits.
import type { z } from 'zod';
import { asThermalSolveInput, type thermalSizeRequest, type ThermalSizeResponse } from '../../shared/api/thermal';
import { answerThermalAsync, boundedModel } from './thermal-failures';
import { thermalPool } from './thermal-pool';

export async function sizeThermal(request: z.output<typeof thermalSizeRequest>, signal: AbortSignal): Promise<ThermalSizeResponse> {
  const model = boundedModel(asThermalSolveInput(request));
  const { sizing } = request;
  const marginK = sizing.marginK ?? 0;
  return {
    sizing: sizing.kind === 'radiator'
      ? { kind: 'radiator' as const, ...await answerThermalAsync(thermalPool.run('radiator', { model, node: sizing.node, marginK }, signal)) }
      : { kind: 'heater' as const, ...await answerThermalAsync(thermalPool.run('heater', { model, node: sizing.node, marginK, maxDutyCycle: sizing.maxDutyCycle }, signal)) },
  };
}
