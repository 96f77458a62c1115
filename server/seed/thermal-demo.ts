// Demo thermal model for Kestrel-1 (invented): a battery on a thermostat heater, an electronics box
// bolted to the zenith radiator panel, and the structure behind the nadir deck. Runs after the
// missions and cases seeds and finds the mission and its surfaces by their demo names.
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

  const row = tx
    .insert(thermalModels)
    .values({
      missionId: mission.id, workspaceId: mission.workspaceId, name: 'Kestrel-1 bus, 4 nodes',
      description: 'First look at the battery heater and the zenith radiator: battery, electronics box, radiator panel, structure.',
      model, createdBy: thermal.id, createdAt: '2026-06-10T10:00:00.000Z', updatedAt: '2026-06-10T10:00:00.000Z',
    })
    .returning()
    .get();
  recordAudit(tx, {
    workspaceId: mission.workspaceId, actorUserId: thermal.id, action: 'thermal_model.created', targetType: 'thermal_model', targetId: row.id,
    summary: `Created thermal model "${row.name}" (${model.nodes.length} nodes) in "${mission.name}".`,
  });
};
