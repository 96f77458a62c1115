// A mission with surfaces for the ephemeris tests, written straight to the database so these tests
// do not depend on the missions routes; and the counts a refused upload must leave unchanged.
import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { materials, missions, surfaces } from '../../server/db/schema';
import type { BodyId } from '../../shared/physics/bodies';
import type { Surface } from '../../shared/physics/heat-loads';
import { userIdOf, workspaceIdOf, type TestApp } from './test-app';

export const fixturesDir = path.resolve(import.meta.dirname, '..', '..', 'fixtures', 'ephemerides');

/** Invented panel set: one material, five orientations (nadir, zenith, ram, orbit normal, Sun-pointing). */
export const testSurfaces: Surface[] = [
  { name: 'nadir panel', normal: 'nadir', areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 },
  { name: 'zenith radiator', normal: 'zenith', areaM2: 0.3, absorptivity: 0.25, emissivity: 0.85 },
  { name: 'ram face', normal: 'ram', areaM2: 0.2, absorptivity: 0.25, emissivity: 0.85 },
  { name: 'side panel', normal: 'orbit-normal', areaM2: 0.2, absorptivity: 0.25, emissivity: 0.85 },
  { name: 'solar array', normal: 'sun', areaM2: 1.0, absorptivity: 0.25, emissivity: 0.85 },
];

export function createTestMission(t: TestApp, bodyId: BodyId = 'earth', workspace: 'Kestrel' | 'Plover' = 'Kestrel'): string {
  const workspaceId = workspaceIdOf(t, workspace);
  const createdBy = userIdOf(t, workspace === 'Kestrel' ? 'analyst@kestrel.test' : 'owner@plover.test');
  return t.ctx.db.transaction((tx) => {
    const mission = tx
      .insert(missions)
      .values({ workspaceId, name: `Ephemeris test ${bodyId}`, bodyId, startDate: '2027-03-01', endDate: '2027-12-31', createdBy })
      .returning()
      .get();
    const material = tx
      .insert(materials)
      .values({ workspaceId, name: 'test white paint', absorptivityBol: 0.25, emissivityBol: 0.85, absorptivityEol: 0.4, emissivityEol: 0.85, source: 'test value, no source' })
      .returning()
      .get();
    for (const s of testSurfaces) {
      tx.insert(surfaces).values({ missionId: mission.id, name: s.name, areaM2: s.areaM2, normal: s.normal, materialId: material.id }).run();
    }
    return mission.id;
  });
}

export interface Trace {
  ephemerides: number;
  points: number;
  blocks: number;
  uploads: string[];
}

/** What an upload could leave behind: rows in both tables, files in the uploads folder. */
export function trace(t: TestApp): Trace {
  const count = (table: string) => (t.ctx.sqlite.prepare(`SELECT count(*) AS n FROM ${table}`).get() as { n: number }).n;
  const points = (t.ctx.sqlite.prepare('SELECT coalesce(sum(points), 0) AS n FROM ephemeris_point_blocks').get() as { n: number }).n;
  const uploads = path.join(t.ctx.config.dataDir, 'uploads');
  return {
    ephemerides: count('ephemerides'),
    points,
    blocks: count('ephemeris_point_blocks'),
    uploads: existsSync(uploads) ? readdirSync(uploads).sort() : [],
  };
}
