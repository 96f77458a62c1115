// Demo mission flown in phases (issue 19, invented): Kestrel-2, an ocean-colour smallsat with a
// body-mounted array, defined once in its spacecraft frame (the nadir-pointing frame); two attitude
// modes ("nadir imaging", its own frame, and "Sun safe", the array to the Sun while the spacecraft
// turns about the Sun line); three phases (launch and early orbit in Sun safe, commissioning and
// nominal operations in nadir imaging), each with its nodes' dissipation; a small thermal model;
// and the hot, cold and survival cold cases derived per phase by the thermal engineer (drafts).
import type { SurfaceNormal } from '../../shared/api/missions';
import type { PhaseDissipation } from '../../shared/api/phases';
import type { ThermalModelContent } from '../../shared/api/thermal-models';
import { getBody } from '../../shared/physics/bodies';
import { sunSynchronousInclinationDeg } from '../../shared/physics/sun-synchronous';
import { recordAudit } from '../audit/audit-log';
import { derivedCaseValues } from '../cases/case-derivation';
import { insertDraft } from '../cases/case-drafts';
import { attitudeModes, missionPhases, missions, orbits, surfaces, thermalModels } from '../db/schema';
import { libraryMaterialId } from '../missions/material-library';
import { canonicalOrbit } from '../missions/orbit-values';
import type { FeatureSeed } from './seed';

export const phasedMissionName = 'Kestrel-2 ocean-colour smallsat';
const earth = getBody('earth');
const ssoInclination = Math.round(sunSynchronousInclinationDeg(earth, earth.radiusKm + 600) * 100) / 100;

const demoSurfaces: { name: string; areaM2: number; normal: SurfaceNormal; material: string }[] = [
  { name: 'Nadir deck (camera)', areaM2: 0.3, normal: 'nadir', material: 'white silicone paint' },
  { name: 'Body-mounted array', areaM2: 0.5, normal: 'zenith', material: 'GaAs solar cells' },
  { name: '+Y radiator', areaM2: 0.2, normal: 'orbit-normal', material: 'silver-backed FEP' },
  { name: '-Y radiator', areaM2: 0.2, normal: 'anti-orbit-normal', material: 'silver-backed FEP' },
  { name: 'Ram face blanket', areaM2: 0.25, normal: 'ram', material: 'aluminized polyimide, polyimide outward (blanket outer layer)' },
  { name: 'Wake face blanket', areaM2: 0.25, normal: 'wake', material: 'aluminized polyimide, polyimide outward (blanket outer layer)' },
];

/**
 * Sun safe: the spacecraft spins slowly about the Sun line with the array facing the Sun (0° from the
 * spin axis), the side radiators and blankets at 90° and the camera deck facing away (180°); each
 * plate's loads averaged over a turn (shared/physics/pointing.ts).
 */
const spinning = (angleDeg: number): SurfaceNormal => ({ spin: { axis: 'sun', angleDeg } });
const sunSafePointing: Record<string, SurfaceNormal> = {
  'Body-mounted array': spinning(0),
  '+Y radiator': spinning(90),
  '-Y radiator': spinning(90),
  'Ram face blanket': spinning(90),
  'Wake face blanket': spinning(90),
  'Nadir deck (camera)': spinning(180),
};

// Invented dissipation (W): LEOP with the camera off, commissioning and nominal imaging a part of each orbit.
const phases: { name: string; startDate: string; endDate: string; mode: 'nadir imaging' | 'Sun safe'; dissipation: PhaseDissipation[] }[] = [
  {
    name: 'Launch and early orbit', startDate: '2028-01-10', endDate: '2028-01-24', mode: 'Sun safe',
    dissipation: [{ node: 'avionics', dissipationW: 12 }, { node: 'camera', dissipationW: 0 }, { node: 'battery', dissipationW: 1 }],
  },
  {
    name: 'Commissioning', startDate: '2028-01-25', endDate: '2028-03-31', mode: 'nadir imaging',
    dissipation: [
      { node: 'avionics', dissipationW: 18 },
      { node: 'camera', dissipationW: { onW: 15, offW: 2, periodS: 5800, onS: 1200 } },
      { node: 'battery', dissipationW: 2 },
    ],
  },
  {
    name: 'Nominal operations', startDate: '2028-04-01', endDate: '2030-12-31', mode: 'nadir imaging',
    dissipation: [
      { node: 'avionics', dissipationW: 20 },
      { node: 'camera', dissipationW: { onW: 22, offW: 3, periodS: 5800, onS: 1500 } },
      { node: 'battery', dissipationW: 2.5 },
    ],
  },
];

// Aluminium about 900 J/(kg K), lithium-ion cells about 1000 J/(kg K) [from memory].
const model = (surfaceId: (name: string) => string): ThermalModelContent => ({
  nodes: [
    { name: 'camera', massKg: 3, specificHeatJKgK: 900, initialC: 10, dissipationW: 10, minC: -10, maxC: 35, survivalMinC: -30, survivalMaxC: 50, surfaceIds: [surfaceId('Nadir deck (camera)')] },
    { name: 'avionics', massKg: 4, specificHeatJKgK: 900, initialC: 15, dissipationW: 18, minC: -20, maxC: 50, survivalMinC: -40, survivalMaxC: 70, surfaceIds: [surfaceId('+Y radiator'), surfaceId('-Y radiator')] },
    { name: 'battery', massKg: 1.8, specificHeatJKgK: 1000, initialC: 15, dissipationW: 2, minC: 0, maxC: 30, survivalMinC: -10, survivalMaxC: 45, surfaceIds: [] },
  ],
  couplings: [{ from: 'camera', to: 'avionics', conductanceWK: 0.5 }, { from: 'battery', to: 'avionics', conductanceWK: 0.2 }],
  radiativeCouplings: [],
  heaters: [{ name: 'battery heater', node: 'battery', powerW: 8, control: 'thermostat', onC: 5, offC: 8 }],
  loops: [],
  margins: { operatingK: 5, survivalK: 5 },
  maxDutyCycle: 0.75,
});

export const seedDemoPhases: FeatureSeed = (tx, team, read) => {
  const thermal = team.users['thermal@kestrel.test'];
  if (!thermal) throw new Error('the phases seed needs the demo thermal engineer');
  const at = '2026-07-01T09:00:00.000Z';
  const mission = tx.insert(missions).values({
    workspaceId: team.kestrel.id, createdBy: thermal.id, name: phasedMissionName, bodyId: 'earth',
    description: 'Ocean-colour smallsat at 600 km sun-synchronous; flown in phases: launch and early orbit in Sun safe, commissioning and three years of ocean-colour observation.',
    startDate: '2028-01-10', endDate: '2030-12-31',
  }).returning().get();
  const input = { periapsisAltitudeKm: '600 km', apoapsisAltitudeKm: '600 km', inclinationDeg: ssoInclination, raanDeg: '135 deg' };
  const orbit = tx.insert(orbits).values({ missionId: mission.id, name: 'SSO 600 km', epoch: '2028-01-10T00:00:00Z', input, ...canonicalOrbit(input, earth, read) }).returning().get();
  const ids = new Map<string, string>();
  for (const s of demoSurfaces) {
    const row = tx.insert(surfaces).values({ missionId: mission.id, name: s.name, areaM2: s.areaM2, normal: s.normal, materialId: libraryMaterialId(tx, s.material) }).returning().get();
    ids.set(s.name, row.id);
  }
  const surfaceId = (name: string) => ids.get(name) ?? '';
  const audit = (action: string, targetType: string, targetId: string, summary: string) =>
    recordAudit(tx, { workspaceId: mission.workspaceId, actorUserId: thermal.id, action, targetType, targetId, summary });

  const modeIds = new Map<string, string>();
  const modes = [
    { name: 'nadir imaging', description: 'Camera to nadir, array to zenith: the spacecraft frame as defined.', pointing: [] },
    {
      name: 'Sun safe', description: 'Array to the Sun, spinning slowly about the Sun line; entered after separation and on any fault.',
      pointing: Object.entries(sunSafePointing).map(([name, normal]) => ({ surfaceId: surfaceId(name), normal })),
    },
  ];
  for (const m of modes) {
    const row = tx.insert(attitudeModes).values({ missionId: mission.id, yawSteering: false, ...m, createdAt: at, updatedAt: at }).returning().get();
    modeIds.set(m.name, row.id);
    audit('attitude_mode.created', 'attitude_mode', row.id, `Attitude mode "${row.name}" added to mission "${mission.name}".`);
  }
  for (const p of phases) {
    const { mode, ...fields } = p;
    const row = tx.insert(missionPhases).values({ missionId: mission.id, ...fields, modeId: modeIds.get(mode) ?? '', createdAt: at, updatedAt: at }).returning().get();
    audit('phase.created', 'mission_phase', row.id, `Phase "${row.name}" ${row.startDate} to ${row.endDate} in mode "${mode}" added to mission "${mission.name}".`);
  }
  const modelRow = tx.insert(thermalModels).values({
    missionId: mission.id, workspaceId: mission.workspaceId, name: 'Kestrel-2 bus, 3 nodes',
    description: 'Camera, avionics on the side radiators, battery on its heater; each phase sets their dissipation.', model: model(surfaceId), createdBy: thermal.id, createdAt: at, updatedAt: at,
  }).returning().get();
  audit('thermal_model.created', 'thermal_model', modelRow.id, `Created thermal model "${modelRow.name}" (3 nodes) in "${mission.name}".`);

  for (const values of derivedCaseValues(tx, mission, { orbitId: orbit.id, name: 'Kestrel-2 SSO 600', steps: 120, survival: true })) {
    const row = insertDraft(tx, mission, thermal, values);
    audit('case.derived', 'load_case', row.id, `Derived ${row.kind} case "${row.name}" (revision 1, draft) for mission "${mission.name}".`);
  }
};

