// The loop benchmark's invented network (issue 14): the 100 nodes and 300 couplings of
// thermal-bench-model.ts without its thermostats, and two closed coolant loops under PI control —
// a hull loop through three units, a heat exchanger unit and two radiating panels, and an equipment
// loop through two units and the same exchanger.
import type { ThermalModelInput } from '../shared/physics/thermal-model';
import { benchThermalModel } from './thermal-bench-model';

export function benchLoopModel(setPoints: { hull: number; equipment: number } = { hull: 31, equipment: 32.15 }): ThermalModelInput {
  const { heaters: _heaters, ...base } = benchThermalModel();
  const coolant = { specificHeatJKgK: 3600, densityKgM3: 1040 };
  return {
    ...base,
    loops: [
      {
        name: 'hull loop', ...coolant, fluidMassKg: 2,
        path: [
          { node: 'unit 1', conductanceWK: 20 }, { node: 'unit 2', conductanceWK: 20 }, { node: 'unit 3', conductanceWK: 20 },
          { node: 'unit 4', conductanceWK: 30 }, { node: 'panel 1', conductanceWK: 25 }, { node: 'panel 2', conductanceWK: 25 },
        ],
        minFlowKgS: 0.0005, nominalFlowKgS: 0.005, maxFlowKgS: 0.05,
        controlNode: 'unit 4', setPointC: setPoints.hull, proportionalKgSK: 0.0005, integralKgSKs: 0.000002, bandK: 0.5,
      },
      {
        name: 'equipment loop', ...coolant, fluidMassKg: 1,
        path: [{ node: 'unit 10', conductanceWK: 15 }, { node: 'unit 11', conductanceWK: 15 }, { node: 'unit 4', conductanceWK: 30 }],
        minFlowKgS: 0.0005, nominalFlowKgS: 0.004, maxFlowKgS: 0.04,
        controlNode: 'unit 10', setPointC: setPoints.equipment, proportionalKgSK: 0.0005, integralKgSKs: 0.000002, bandK: 0.5,
      },
    ],
  };
}
