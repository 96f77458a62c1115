// The case list reads each case's orbit-average absorbed power and beta angle from two columns
// copied out of the results when they are written (migration case_list_summary), not by parsing every case's
// results JSON on each list: the list must show exactly the numbers of the results, after a
// derivation, an edit and a new revision, and for cases written before the migration.
// Common practice, no source.
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { migrateDatabase, openDatabase } from '../../server/db/database';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let thermal: request.Agent;
const dir = mkdtempSync(path.join(tmpdir(), 'eclipta-case-summary-'));

beforeAll(async () => {
  t = await createTestApp();
  thermal = await t.signIn('thermal@kestrel.test');
});
afterAll(async () => {
  await t.close();
  rmSync(dir, { recursive: true, force: true });
});

interface Listed {
  id: string;
  orbitAverageAbsorbedW: number;
  betaDeg: number;
}

/** Every listed case's two numbers beside the ones in its stored results. */
async function listedAgainstResults(): Promise<{ listed: Listed; stored: { w: number; beta: number; columnsSet: boolean } }[]> {
  const res = await thermal.get('/api/v1/cases').expect(200);
  return (res.body.items as Listed[]).map((listed) => {
    const row = t.ctx.sqlite
      .prepare('SELECT results, orbit_average_absorbed_w AS w, beta_deg AS beta FROM load_cases WHERE id = ?')
      .get(listed.id) as { results: string; w: number | null; beta: number | null };
    const results = JSON.parse(row.results) as { betaDeg: number; total: { orbitAverageAbsorbedW: number } };
    return { listed, stored: { w: results.total.orbitAverageAbsorbedW, beta: results.betaDeg, columnsSet: row.w !== null && row.beta !== null } };
  });
}

describe('the case list summary columns', () => {
  it('match the results of seeded, derived, edited and revised cases', async () => {
    const missionId = (t.ctx.sqlite.prepare("SELECT id FROM missions WHERE name = 'Kestrel Lunar pathfinder'").get() as { id: string }).id;
    const orbitId = (t.ctx.sqlite.prepare('SELECT id FROM orbits WHERE mission_id = ?').get(missionId) as { id: string }).id;
    const derived = await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, name: 'Summary check' }).expect(201);
    const hot = (derived.body.items as { id: string }[])[0]!;
    await thermal.patch(`/api/v1/cases/${hot.id}`).send({ inputs: { betaDeg: 30 } }).expect(200);
    const released = (t.ctx.sqlite.prepare("SELECT id FROM load_cases WHERE status = 'released' LIMIT 1").get() as { id: string }).id;
    await thermal.post(`/api/v1/cases/${released}/revisions`).expect(201);

    const pairs = await listedAgainstResults();
    expect(pairs.length).toBeGreaterThanOrEqual(6);
    for (const { listed, stored } of pairs) {
      expect(stored.columnsSet).toBe(true);
      expect(listed.orbitAverageAbsorbedW).toBe(stored.w);
      expect(listed.betaDeg).toBe(stored.beta);
    }
    const edited = pairs.find((p) => p.listed.id === hot.id);
    expect(edited?.listed.betaDeg).toBeCloseTo(30, 3);
  });

  it('are filled by the migration for cases written before it', () => {
    // A migrations folder holding those before case_list_summary only: the schema before the summary columns.
    const folder = path.join(dir, 'migrations-before-summary');
    mkdirSync(path.join(folder, 'meta'), { recursive: true });
    const journal = JSON.parse(readFileSync('migrations/meta/_journal.json', 'utf8')) as { entries: { idx: number; tag: string }[] };
    const summaryIdx = journal.entries.find((e) => e.tag.endsWith('_case_list_summary'))?.idx ?? -1;
    expect(summaryIdx).toBeGreaterThan(0);
    journal.entries = journal.entries.filter((e) => e.idx < summaryIdx);
    for (const e of journal.entries) cpSync(`migrations/${e.tag}.sql`, path.join(folder, `${e.tag}.sql`));
    writeFileSync(path.join(folder, 'meta', '_journal.json'), JSON.stringify(journal));

    const file = path.join(dir, 'before.db');
    const old = openDatabase(file);
    old.sqlite.pragma('foreign_keys = OFF');
    migrateDatabase(old.db, folder);
    const results = JSON.stringify({ betaDeg: -12.5, total: { orbitAverageAbsorbedW: 321.25, orbitAverageWithMarginW: 400, peakAbsorbedW: 500 } });
    old.sqlite
      .prepare(
        `INSERT INTO load_cases (id, mission_id, workspace_id, series_id, revision, name, kind, status, inputs, results, created_at, updated_at)
         VALUES ('c1', 'm', 'w', 's', 1, 'old case', 'hot', 'released', '{}', ?, '2026-01-01T00:00:00.000Z', '2026-01-01T00:00:00.000Z')`,
      )
      .run(results);
    old.sqlite.close();

    const now = openDatabase(file);
    migrateDatabase(now.db, 'migrations');
    const row = now.sqlite.prepare("SELECT orbit_average_absorbed_w AS w, beta_deg AS beta FROM load_cases WHERE id = 'c1'").get();
    now.sqlite.close();
    expect(row).toEqual({ w: 321.25, beta: -12.5 });
  });
});
