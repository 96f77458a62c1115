// The distance study of a saved model (issue 14 item 3) through the app, on the two-loop demo model:
// one NDJSON line per distance, the flows at the case's own distance equal to a run's, the radiator
// shrinking as the Sun moves away, and bad requests refused before the answer begins.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { kestrelOne, missionIdOf } from './mission-fixtures';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let thermal: request.Agent;
let modelId: string;
let hotCase: { id: string };

interface Point { type: 'point'; label: string; distanceAu: number; solarScale: number; settled: boolean; loops: { name: string; averageKgS: number; peakKgS: number; averageLMin: number | null; peakLMin: number | null }[]; radiator: { areaM2: number } | null; radiatorRefused: string | null; solveRefused: string | null }
type Line = { type: 'start'; distances: { label: string; distanceAu: number }[]; case: { solarFluxWm2: number }; assumptions: string[] } | Point | { type: 'end'; points: number };

beforeAll(async () => {
  t = await createTestApp();
  thermal = await t.signIn('thermal@kestrel.test');
  const missionId = missionIdOf(t, kestrelOne);
  const list = await thermal.get(`/api/v1/missions/${missionId}/thermal-models`).expect(200);
  modelId = (list.body.items as { id: string; name: string }[]).find((m) => m.name === 'Kestrel-1 pumped loops, 2 loops')!.id;
  const cases = (await thermal.get(`/api/v1/cases?missionId=${missionId}&status=released`).expect(200)).body.items as { id: string; kind: string }[];
  hotCase = cases.find((c) => c.kind === 'hot')!;
});
afterAll(() => t.close());

const study = (body: object) => thermal.post(`/api/v1/thermal-models/${modelId}/distance-study`).send(body)
  .buffer(true).parse((res, done) => {
    let text = '';
    res.on('data', (c: Buffer) => (text += c.toString('utf8')));
    res.on('end', () => done(null, text));
  });
const lines = (text: string): Line[] => text.trim().split('\n').map((l) => JSON.parse(l) as Line);

describe('POST /api/v1/thermal-models/:id/distance-study', () => {
  it('answers one line per distance, nearest first; at the case\'s own distance the pump flows are the run\'s (same loads)', async () => {
    const run = (await thermal.post(`/api/v1/thermal-models/${modelId}/run`).send({ caseId: hotCase.id }).expect(200)).body;
    const first = await study({ caseId: hotCase.id, node: 'hull radiator', distancesAu: [1.5] }).expect(200);
    const caseFlux = (lines(first.body as string)[0] as { case: { solarFluxWm2: number } }).case.solarFluxWm2;
    // The case's own distance from its flux, inverse square from 1361 W/m^2 at 1 AU (IAU 2015 B3).
    const caseAu = Math.sqrt(1361 / caseFlux);
    const res = await study({ caseId: hotCase.id, node: 'hull radiator', distancesAu: [1.5, caseAu, 0.8], missionRange: true }).expect(200);
    expect(res.headers['content-type']).toMatch(/application\/x-ndjson/);
    const all = lines(res.body as string);
    expect(all[0]?.type).toBe('start');
    expect(all.at(-1)).toEqual({ type: 'end', points: 5 });
    const points = all.filter((l): l is Point => l.type === 'point');
    expect(points.map((p) => p.distanceAu)).toEqual([...points.map((p) => p.distanceAu)].sort((a, b) => a - b));
    expect(points.map((p) => p.label)).toEqual(expect.arrayContaining(['Earth perihelion', 'Earth aphelion']));
    const own = points.find((p) => Math.abs(p.solarScale - 1) < 1e-9)!;
    for (const loop of run.result.loops as { name: string; averageFlowKgS: number; flowKgS: number[] }[]) {
      const mine = own.loops.find((l) => l.name === loop.name)!;
      expect(mine.averageKgS).toBeCloseTo(loop.averageFlowKgS, 9);
      expect(mine.peakKgS).toBeCloseTo(Math.max(...loop.flowKgS), 9);
      // L/min = kg/s / density * 1000 L/m^3 * 60 s/min, density 1040 kg/m^3 (the demo's coolant).
      expect(mine.averageLMin).toBeCloseTo((loop.averageFlowKgS / 1040) * 60_000, 9);
    }
    // Less sunlight farther out: the radiator that holds the set point is smaller (radiator equation, Gilmore).
    const areas = points.map((p) => p.radiator?.areaM2 ?? NaN);
    // (the hot case sits at Earth's perihelion, so two of the five points are one distance)
    for (let i = 1; i < areas.length; i++) expect(areas[i]).toBeLessThanOrEqual((areas[i - 1] ?? 0) + 1e-12);
    expect(areas.at(-1)).toBeLessThan(0.9 * (areas[0] ?? 0));
    expect(points.every((p) => p.solveRefused === null)).toBe(true);
  }, 120_000);

  it('refuses an unknown node, no distance, too many, and a distance out of range with 400 naming the field, before any line', async () => {
    const unknown = await thermal.post(`/api/v1/thermal-models/${modelId}/distance-study`).send({ caseId: hotCase.id, node: 'pump', distancesAu: [1] }).expect(400);
    expect(unknown.body.error.details[0]).toMatchObject({ path: 'node', message: expect.stringContaining('"pump"') });
    const none = await thermal.post(`/api/v1/thermal-models/${modelId}/distance-study`).send({ caseId: hotCase.id, node: 'hull radiator' }).expect(400);
    expect(none.body.error.details[0].path).toBe('distancesAu');
    const many = await thermal.post(`/api/v1/thermal-models/${modelId}/distance-study`).send({ caseId: hotCase.id, node: 'hull radiator', distancesAu: Array.from({ length: 13 }, (_, i) => 1 + i / 10) }).expect(400);
    expect(many.body.error.details[0].path).toBe('distancesAu');
    const far = await thermal.post(`/api/v1/thermal-models/${modelId}/distance-study`).send({ caseId: hotCase.id, node: 'hull radiator', distancesAu: [0] }).expect(400);
    expect(far.body.error.details[0]).toMatchObject({ path: 'distancesAu.0', message: expect.stringContaining('0.05..50 AU') });
  });
});
