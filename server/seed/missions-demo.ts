// Demo missions of the invented scenario: Kestrel's imaging smallsat in a sun-synchronous low Earth
// orbit (with its parking and disposal orbits) and a lunar pathfinder; Plover's Mars relay. Each
// orbit goes through the same reading as the API, so its canonical values are what a user would get.
import { getBody, type BodyId } from '../../shared/physics/bodies';
import { sunSynchronousInclinationDeg } from '../../shared/physics/sun-synchronous';
import { missions, orbits, surfaces } from '../db/schema';
import { libraryMaterialId } from '../missions/material-library';
import type { SurfaceNormal } from '../../shared/api/missions';
import { canonicalOrbit, type OrbitFields } from '../missions/orbit-values';
import type { DemoTeam } from './demo';
import type { ReadQuantity } from '../missions/quantity-reader';
import type { FeatureSeed } from './seed';

type Tx = Parameters<FeatureSeed>[0];

interface DemoMission {
  name: string;
  bodyId: BodyId;
  description: string;
  startDate: string;
  endDate: string;
  orbits: { name: string; epoch: string; input: OrbitFields }[];
  surfaces: { name: string; areaM2: number; normal: SurfaceNormal; material: string }[];
}

const earthRadiusKm = getBody('earth').radiusKm;
// Sun-synchronous at 540 km, rounded as an analyst would type it.
const ssoInclination = Math.round(sunSynchronousInclinationDeg(getBody('earth'), earthRadiusKm + 540) * 100) / 100;

const kestrelOne: DemoMission = {
  name: 'Kestrel-1 imaging smallsat',
  bodyId: 'earth',
  description: 'Earth-imaging smallsat in a sun-synchronous orbit at 540 km; parking, operational and disposal orbits; design life to end of 2031.',
  startDate: '2027-04-01',
  endDate: '2031-12-31',
  orbits: [
    { name: 'Parking after separation', epoch: '2027-04-01T09:30:00Z', input: { periapsisAltitudeKm: '480 km', apoapsisAltitudeKm: '545 km', inclinationDeg: ssoInclination, raanDeg: '160 deg' } },
    { name: 'Operational SSO 540 km', epoch: '2027-04-20T00:00:00Z', input: { periapsisAltitudeKm: '540 km', apoapsisAltitudeKm: '540 km', inclinationDeg: ssoInclination, raanDeg: '160 deg' } },
    { name: 'Disposal (perigee lowered)', epoch: '2031-10-01T00:00:00Z', input: { periapsisAltitudeKm: '250 km', apoapsisAltitudeKm: '540 km', inclinationDeg: ssoInclination, raanDeg: 160, argPeriapsisDeg: 90 } },
  ],
  surfaces: [
    { name: 'Nadir deck (imager)', areaM2: 0.36, normal: 'nadir', material: 'white silicone paint' },
    { name: 'Zenith radiator', areaM2: 0.24, normal: 'zenith', material: 'silver-backed FEP' },
    { name: 'Solar array', areaM2: 1.1, normal: 'sun', material: 'GaAs solar cells' },
    { name: 'Ram face blanket', areaM2: 0.3, normal: 'ram', material: 'aluminized polyimide, polyimide outward (blanket outer layer)' },
    { name: 'Wake face blanket', areaM2: 0.3, normal: 'wake', material: 'aluminized polyimide, polyimide outward (blanket outer layer)' },
    { name: 'Anti-sun side radiator', areaM2: 0.2, normal: 'anti-orbit-normal', material: 'optical solar reflector (silvered quartz)' },
  ],
};

const kestrelLunar: DemoMission = {
  name: 'Kestrel Lunar pathfinder',
  bodyId: 'moon',
  description: 'Small lunar orbiter on a 100 km polar orbit, one year of mapping.',
  startDate: '2028-06-01',
  endDate: '2029-05-31',
  orbits: [
    { name: 'Polar mapping orbit 100 km', epoch: '2028-06-01T00:00:00Z', input: { periapsisAltitudeKm: '100 km', apoapsisAltitudeKm: '100 km', inclinationDeg: '90 deg', raanDeg: 30 } },
  ],
  surfaces: [
    { name: 'Solar array', areaM2: 0.8, normal: 'sun', material: 'silicon solar cells' },
    { name: 'Zenith radiator', areaM2: 0.18, normal: 'zenith', material: 'optical solar reflector (silvered quartz)' },
    { name: 'Nadir instrument deck', areaM2: 0.25, normal: 'nadir', material: 'black paint' },
    { name: 'Ram face', areaM2: 0.2, normal: 'ram', material: 'white silicate paint' },
    { name: 'Wake face', areaM2: 0.2, normal: 'wake', material: 'polished aluminium' },
  ],
};

// Invented concept study: a low polar orbit about Europa, in Jupiter's shadow for about three
// hours every 3.55 days (the planet's shadow, parent-shadow.ts).
const kestrelEuropa: DemoMission = {
  name: 'Kestrel Europa orbiter (concept)',
  bodyId: 'europa',
  description: 'Concept study: 200 km polar orbit about Europa for six months of ice-shell mapping.',
  startDate: '2034-03-01',
  endDate: '2034-08-31',
  orbits: [
    // The epoch falls an hour before Europa leaves Jupiter's shadow (15:15-18:03 UTC that day), so the
    // orbit's plots show the planet's shadow and Europa's own.
    { name: 'Polar mapping orbit 200 km', epoch: '2034-03-03T17:00:00Z', input: { periapsisAltitudeKm: '200 km', apoapsisAltitudeKm: '200 km', inclinationDeg: '88 deg', raanDeg: 60 } },
  ],
  surfaces: [
    { name: 'Solar array', areaM2: 6, normal: 'sun', material: 'silicon solar cells' },
    { name: 'Zenith radiator', areaM2: 0.3, normal: 'zenith', material: 'optical solar reflector (silvered quartz)' },
    { name: 'Nadir instrument deck', areaM2: 0.4, normal: 'nadir', material: 'black paint' },
    { name: 'Ram face', areaM2: 0.3, normal: 'ram', material: 'white silicate paint' },
  ],
};

const ploverRelay: DemoMission = {
  name: 'Plover Mars relay',
  bodyId: 'mars',
  description: 'Communications relay in an elliptical Mars orbit.',
  startDate: '2029-02-01',
  endDate: '2033-01-31',
  orbits: [
    { name: 'Relay orbit', epoch: '2029-02-01T00:00:00Z', input: { periapsisAltitudeKm: '400 km', apoapsisAltitudeKm: '6000 km', inclinationDeg: '75 deg', raanDeg: 210, argPeriapsisDeg: 270 } },
  ],
  surfaces: [
    { name: 'High-gain side', areaM2: 0.9, normal: 'nadir', material: 'white silicone paint' },
    { name: 'Solar wing', areaM2: 3.2, normal: 'sun', material: 'GaAs solar cells' },
    { name: 'Radiator', areaM2: 0.4, normal: 'zenith', material: 'silver-backed FEP' },
    { name: 'Bus blanket', areaM2: 1.5, normal: 'ram', material: 'aluminized polyimide, polyimide outward (blanket outer layer)' },
  ],
};

function insertMission(tx: Tx, read: ReadQuantity, workspaceId: string, createdBy: string | null, demo: DemoMission): void {
  const body = getBody(demo.bodyId);
  const { orbits: demoOrbits, surfaces: demoSurfaces, ...fields } = demo;
  const mission = tx.insert(missions).values({ ...fields, workspaceId, createdBy }).returning().get();
  for (const o of demoOrbits) {
    tx.insert(orbits).values({ missionId: mission.id, name: o.name, epoch: o.epoch, input: o.input, ...canonicalOrbit(o.input, body, read) }).run();
  }
  for (const s of demoSurfaces) {
    tx.insert(surfaces).values({ missionId: mission.id, name: s.name, areaM2: s.areaM2, normal: s.normal, materialId: libraryMaterialId(tx, s.material) }).run();
  }
}

export const seedDemoMissions: FeatureSeed = (tx, team: DemoTeam, read) => {
  const analyst = team.users['analyst@kestrel.test']?.id ?? null;
  insertMission(tx, read, team.kestrel.id, analyst, kestrelOne);
  insertMission(tx, read, team.kestrel.id, analyst, kestrelLunar);
  insertMission(tx, read, team.kestrel.id, analyst, kestrelEuropa);
  insertMission(tx, read, team.plover.id, team.users['owner@plover.test']?.id ?? null, ploverRelay);
};
