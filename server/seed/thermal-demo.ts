// Demo thermal models for Kestrel-1 (invented): a battery on a thermostat heater, an electronics box
// bolted to the zenith radiator panel, and the structure behind the nadir deck; and two coupled
// pumped loops (a hull loop with a radiator, an equipment loop joined to it by a heat exchanger)
// whose flows hold their set points through eclipse. Runs after the missions and cases seeds and
// finds the mission and its surfaces by their demo names.
import { and, eq } from 'drizzle-orm';
import type { ThermalModelContent } from '../../shared/api/thermal-models';
import { recordAudit } from '../audit/audit-log';
import { missions, surfaces, thermalModels } from '../db/schema';
import type { FeatureSeed } from './seed';

const missionName = 'Kestrel-1 imaging smallsat';
// Aluminium 6061, about 900 J/(kg K) near room temperature [from memory; close to Gilmore's table].
const aluminiumJKgK = 900;
// Lithium-ion cells, about 1000 J/(kg K) [from memory].
const liIonJKgK = 1000;
// Water and propylene glycol, about 60/40: c_p near 3600 J/(kg K), density near 1040 kg/m^3 [from memory].
const coolantJKgK = 3600;
const coolantKgM3 = 1040;

export const seedDemoThermalModel: FeatureSeed = (tx, team) => {
  const thermal = team.users['thermal@kestrel.test'];
  const mission = tx.select().from(missions).where(and(eq(missions.workspaceId, team.kestrel.id), eq(missions.name, missionName))).get();
  if (!thermal || !mission) throw new Error(`the thermal model seed needs the demo team and the mission "${missionName}"`);
  const surfaceId = (name: string) => {
    const row = tx.select({ id: surfaces.id }).from(surfaces).where(and(eq(surfaces.missionId, mission.id), eq(surfaces.name, name))).get();
    if (!row) throw new Error(`the thermal model seed needs the surface "${name}" of "${missionName}"`);
    return row.id;
  };

  const model: ThermalModelContent = {
    nodes: [
      {
        name: 'battery', massKg: 2.4, specificHeatJKgK: liIonJKgK, initialC: 15,
        dissipationW: 1.5, hotDissipationW: 2.5, coldDissipationW: 0.8,
        minC: 0, maxC: 30, survivalMinC: -10, survivalMaxC: 45, surfaceIds: [],
      },
      {
        name: 'electronics box', massKg: 3.5, specificHeatJKgK: aluminiumJKgK, initialC: 20,
        // Imager and downlink on for part of each orbit in the cold case.
        dissipationW: 24, hotDissipationW: 30, coldDissipationW: { onW: 30, offW: 18, periodS: 5700, onS: 1800, phaseS: 600 },
        minC: -20, maxC: 50, survivalMinC: -35, survivalMaxC: 70, surfaceIds: [],
      },
      {
        name: 'radiator panel', massKg: 1.1, specificHeatJKgK: aluminiumJKgK, initialC: 0,
        // maxC is the box's mounting interface: the box runs some 15 K above the panel.
        minC: -60, maxC: 30, surfaceIds: [surfaceId('Zenith radiator')],
      },
      {
        // Wrapped in blankets: about 0.03 effective emittance over 0.8 m^2 [from memory, typical MLI].
        name: 'structure', massKg: 7, specificHeatJKgK: aluminiumJKgK, initialC: 5, radiatorAreaM2: 0.8, emissivity: 0.03,
        minC: -40, maxC: 60, surfaceIds: [],
      },
    ],
    couplings: [
      { from: 'electronics box', to: 'radiator panel', conductanceWK: 1.8 },
      { from: 'electronics box', to: 'structure', conductanceWK: 0.6 },
      { from: 'radiator panel', to: 'structure', conductanceWK: 0.4 },
      // Isolating mounts: the battery keeps to itself and its heater.
      { from: 'battery', to: 'structure', conductanceWK: 0.15 },
    ],
    radiativeCouplings: [{ from: 'battery', to: 'structure', areaM2: 0.08, effectiveEmissivity: 0.05, viewFactor: 1 }],
    heaters: [
      { name: 'battery heater', node: 'battery', powerW: 12, control: 'thermostat', onC: 6, offC: 9, busVoltage: { nominalV: 28, minV: 24, maxV: 32 } },
    ],
    loops: [],
    margins: { operatingK: 5, survivalK: 5 },
    maxDutyCycle: 0.75,
  };

  const insertModel = (name: string, description: string, content: ThermalModelContent, at: string) => {
    const row = tx
      .insert(thermalModels)
      .values({ missionId: mission.id, workspaceId: mission.workspaceId, name, description, model: content, createdBy: thermal.id, createdAt: at, updatedAt: at })
      .returning()
      .get();
    recordAudit(tx, {
      workspaceId: mission.workspaceId, actorUserId: thermal.id, action: 'thermal_model.created', targetType: 'thermal_model', targetId: row.id,
      summary: `Created thermal model "${row.name}" (${content.nodes.length} nodes) in "${mission.name}".`,
    });
  };
  insertModel('Kestrel-1 bus, 4 nodes', 'First look at the battery heater and the zenith radiator: battery, electronics box, radiator panel, structure.', model, '2026-06-10T10:00:00.000Z');
  insertModel(
    'Kestrel-1 pumped loops, 2 loops',
    'Study of a pumped cooling option: the hull loop carries heat from the exchanger and the hull to the radiators; the equipment loop holds the power unit at 25 C through the exchanger.',
    twoLoopModel(surfaceId),
    '2026-06-12T09:00:00.000Z',
  );
};

/** Two coupled loops (invented), each flow set by a PI controller on its own node. */
function twoLoopModel(surfaceId: (name: string) => string): ThermalModelContent {
  return {
    nodes: [
      {
        // The side walls under their blankets, taking the sun and the Earth through them.
        name: 'hull', massKg: 9, specificHeatJKgK: aluminiumJKgK, initialC: 10, minC: -50, maxC: 50,
        surfaceIds: [surfaceId('Ram face blanket'), surfaceId('Wake face blanket')],
      },
      {
        name: 'hull radiator', massKg: 2.5, specificHeatJKgK: aluminiumJKgK, initialC: 0, minC: -110, maxC: 40,
        surfaceIds: [surfaceId('Zenith radiator'), surfaceId('Anti-sun side radiator')],
      },
      { name: 'heat exchanger', massKg: 1.2, specificHeatJKgK: aluminiumJKgK, initialC: 10, minC: -20, maxC: 40, surfaceIds: [] },
      {
        name: 'power unit', massKg: 4, specificHeatJKgK: aluminiumJKgK, initialC: 25, minC: 0, maxC: 40, survivalMinC: -20, survivalMaxC: 55,
        dissipationW: 45, hotDissipationW: 55, coldDissipationW: { onW: 55, offW: 35, periodS: 5700, onS: 2400, phaseS: 900 },
        surfaceIds: [],
      },
    ],
    couplings: [{ from: 'hull', to: 'power unit', conductanceWK: 0.3 }],
    radiativeCouplings: [],
    heaters: [],
    loops: [
      {
        name: 'hull loop', specificHeatJKgK: coolantJKgK, densityKgM3: coolantKgM3, fluidMassKg: 1.5,
        path: [{ node: 'heat exchanger', conductanceWK: 40 }, { node: 'hull', conductanceWK: 3 }, { node: 'hull radiator', conductanceWK: 30 }],
        minFlowKgS: 0.00001, nominalFlowKgS: 0.004, maxFlowKgS: 0.03,
        // Gains kept low: the exchanger is light (about 1 kJ/K) and the coolant returns some 100 K colder in the cold case.
        controlNode: 'heat exchanger', setPointC: 12, proportionalKgSK: 0.0002, integralKgSKs: 0.000001, bandK: 0.5,
      },
      {
        name: 'equipment loop', specificHeatJKgK: coolantJKgK, densityKgM3: coolantKgM3, fluidMassKg: 0.8,
        path: [{ node: 'power unit', conductanceWK: 25 }, { node: 'heat exchanger', conductanceWK: 40 }],
        minFlowKgS: 0.00001, nominalFlowKgS: 0.003, maxFlowKgS: 0.02,
        controlNode: 'power unit', setPointC: 25, proportionalKgSK: 0.001, integralKgSKs: 0.000002, bandK: 0.5,
      },
    ],
    margins: { operatingK: 5, survivalK: 5 },
    maxDutyCycle: 0.75,
  };
}
