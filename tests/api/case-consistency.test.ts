// One source of truth per case (issue 15 item 1): a case is derived, its margin edited from 25 %
// to 30 %, submitted and released; every sentence of its "why" and every figure in its exports
// must then agree with its own record (conditions, results, margins). Common practice, no source:
// the check is that the words quote the record, not a second computation.
import { parse as parseCsv } from 'csv-parse/sync';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { whyRecordOf, type CaseInputs, type CaseResultsContent } from '../../shared/api/case-content';
import { caseRationale } from '../../shared/physics/case-why';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let thermal: request.Agent;
let owner: request.Agent;
let missionId: string;
let orbitId: string;

interface Detail {
  id: string;
  kind: 'hot' | 'cold' | 'custom';
  version: number;
  inputs: CaseInputs;
  results: CaseResultsContent;
}

beforeAll(async () => {
  t = await createTestApp();
  [thermal, owner] = await Promise.all(['thermal@kestrel.test', 'owner@kestrel.test'].map((e) => t.signIn(e)));
  const m = t.ctx.sqlite.prepare("SELECT id FROM missions WHERE name = 'Kestrel Lunar pathfinder'").get() as { id: string };
  missionId = m.id;
  orbitId = (t.ctx.sqlite.prepare('SELECT id FROM orbits WHERE mission_id = ?').get(missionId) as { id: string }).id;
});
afterAll(() => t.close());

/** Every check that the words of a case quote its own record. */
function expectWordsMatchRecord(c: { kind: Detail['kind']; inputs: CaseInputs; results: CaseResultsContent }): void {
  const r = c.results;
  const text = c.inputs.rationale.join('\n');
  // Built again from the record, the words are the stored ones.
  expect(c.inputs.rationale).toEqual(caseRationale(whyRecordOf(c.kind, c.inputs, r)));
  // The numbers the words quote are the record's (the tiles show the same fields).
  expect(text).toContain(`solar flux ${r.solarFluxWm2.toFixed(0)} W/m² at ${c.inputs.conditions.solarDistanceAu.toFixed(4)} AU`);
  expect(text).toContain(`beta ${r.betaDeg.toFixed(1)} deg on ${c.inputs.conditions.date}`);
  expect(text).toContain(`(${r.total.orbitAverageAbsorbedW.toFixed(1)} W)`);
  const sign = c.kind === 'hot' ? '+' : '-';
  expect(text).toContain(`heat loads ${sign}${c.inputs.margins.heatLoadPercent} %`);
  expect(text).toContain(`${r.total.orbitAverageWithMarginW.toFixed(1)} W orbit-average with margin`);
  // Units as engineers write them: W/m² and m², never a caret power; a temperature margin (a
  // difference of temperatures) in K (common practice, no source).
  expect(text).not.toMatch(/\^[23]/);
  expect(text).toContain(`temperature margin ${c.inputs.margins.temperatureMarginC} K`);
  // The day quoted as the shortest (hot) or longest (cold) eclipse never beats the case it is set against.
  const x = c.inputs.decision!.eclipseExtreme;
  if (x) expect((c.kind === 'hot' ? 1 : -1) * (r.total.orbitAverageAbsorbedW - x.orbitAverageAbsorbedW)).toBeGreaterThanOrEqual(0);
  // The Sun distance is named with its own day, which the decision records.
  expect(text).toContain(c.inputs.decision!.sun.date);
  // The per-surface words of the case's own day quote the case's surface loads.
  for (const d of c.inputs.surfaceDrivers.filter((x) => x.sameAsCase)) {
    const s = r.surfaces.find((x) => x.name === d.surface)!;
    expect(d.text).toContain(`${s.orbitAverage.absorbedW.toFixed(1)} W orbit-average absorbed`);
  }
}

describe('a case derived, edited and released says the same everywhere', () => {
  let cases: Detail[];

  beforeAll(async () => {
    cases = (await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, name: 'Consistency' }).expect(201)).body.items;
  });

  it('derives hot and cold cases whose "why" quotes their own results', () => {
    expect(cases.map((c) => c.kind)).toEqual(['hot', 'cold']);
    for (const c of cases) expectWordsMatchRecord(c);
  });

  it('holds on the sun-synchronous orbit too, where the scan\'s coarse ranking and the case\'s own figures once disagreed', async () => {
    const m = t.ctx.sqlite.prepare("SELECT id FROM missions WHERE name = 'Kestrel-1 imaging smallsat'").get() as { id: string };
    const o = t.ctx.sqlite.prepare("SELECT id FROM orbits WHERE mission_id = ? AND name = 'Operational SSO 540 km'").get(m.id) as { id: string };
    const sso: Detail[] = (await thermal.post(`/api/v1/missions/${m.id}/cases/derive`).send({ orbitId: o.id, name: 'Consistency SSO' }).expect(201)).body.items;
    for (const c of sso) expectWordsMatchRecord(c);
  });

  it('changes every sentence with the margin (25 % -> 30 %), and the released exports carry the same words and figures', async () => {
    for (const c of cases) {
      expect(c.inputs.margins.heatLoadPercent).toBe(25);
      const edited: Detail = (await thermal.patch(`/api/v1/cases/${c.id}`).send({ version: c.version, margins: { heatLoadPercent: 30 } }).expect(200)).body;
      expect(edited.inputs.rationale.join('\n')).not.toMatch(/heat loads [+-]25 %/);
      expectWordsMatchRecord(edited);
      await thermal.post(`/api/v1/cases/${c.id}/submit`).expect(200);
      await owner.post(`/api/v1/cases/${c.id}/release`).expect(200);

      const json = (await owner.get(`/api/v1/cases/${c.id}/export?format=json`).expect(200)).body as { case: { kind: Detail['kind'] }; inputs: CaseInputs; results: CaseResultsContent };
      expect(json.inputs.margins.heatLoadPercent).toBe(30);
      expectWordsMatchRecord({ kind: json.case.kind, inputs: json.inputs, results: json.results });
      const csv = (await owner.get(`/api/v1/cases/${c.id}/export?format=csv`).expect(200)).text;
      const rows = parseCsv(csv, { columns: true }) as Record<string, string>[];
      const total = rows.find((r) => r['row'] === 'orbit average' && r['surface'] === 'spacecraft total')!;
      expect(Number(total['heat-load margin (%)'])).toBe(30);
      expect(Number(total['absorbed total with margin (W)'])).toBeCloseTo(json.results.total.orbitAverageWithMarginW, 3);
    }
  });

  it('keeps hand edits in the words: a beta set by hand is said to be, with the record\'s figures', async () => {
    const again: Detail[] = (await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, name: 'Consistency by hand' }).expect(201)).body.items;
    const hot = again[0]!;
    const edited: Detail = (await thermal.patch(`/api/v1/cases/${hot.id}`).send({ version: hot.version, inputs: { betaDeg: 10 } }).expect(200)).body;
    const text = edited.inputs.rationale.join('\n');
    expect(text).toContain(`beta ${edited.results.betaDeg.toFixed(1)} deg on ${edited.inputs.conditions.date} with an eclipse`);
    expect(text).toContain(`${edited.results.total.orbitAverageAbsorbedW.toFixed(1)} W orbit-average absorbed: conditions changed by hand`);
    expect(text).toMatch(/changed by hand after the case was made: beta$/);
    expect(edited.inputs.rationale).toEqual(caseRationale(whyRecordOf('hot', edited.inputs, edited.results)));
  });

  it('mails a revision that changed nothing as such, with no invented changes, and with the caution (issue 15 item 5)', async () => {
    const hot = cases[0]!;
    await owner.post(`/api/v1/cases/${hot.id}/subscription`).expect(200);
    const rev2: Detail = (await thermal.post(`/api/v1/cases/${hot.id}/revisions`).expect(201)).body;
    await thermal.post(`/api/v1/cases/${rev2.id}/submit`).expect(200);
    await owner.post(`/api/v1/cases/${rev2.id}/release`).expect(200);
    const mail = await t.waitForMail('owner@kestrel.test', 'revision 2 released');
    expect(mail.text).toMatch(/No orbit-average absorbed load, margin or beta changed from revision 1/);
    expect(mail.text).not.toMatch(/ -> /);
    expect(mail.text).toMatch(/Preliminary-design estimate from simplified models/);
  });
});
