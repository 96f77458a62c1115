// The environment along an uploaded ephemeris: the CSV and the OEM of one trajectory agree, and along
// the circular-orbit fixture the loads match POST /environment/compute for the same orbit and epoch.
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import type { TrajectoryEnvironmentResponse } from '../../shared/api/ephemerides';
import type { EnvironmentResponse } from '../../shared/api/environment';
import { fixtureEpoch, leoOrbit } from '../../scripts/ephemeris-fixture-orbits';
import { createTestApp, type TestApp } from './test-app';
import { createTestMission, fixturesDir, testSurfaces } from './ephemeris-test-mission';

let t: TestApp;
let analyst: request.Agent;
let missionId: string;
const ids: Record<string, string> = {};

beforeAll(async () => {
  t = await createTestApp();
  analyst = await t.signIn('analyst@kestrel.test');
  missionId = createTestMission(t);
  for (const [key, file, frame] of [['csv', 'leo-circular.csv', 'EME2000'], ['oem', 'leo-circular.oem', '']] as const) {
    let call = analyst.post(`/api/v1/missions/${missionId}/ephemerides`);
    if (frame) call = call.field('frame', frame);
    const res = await call.attach('file', path.join(fixturesDir, file));
    if (res.status !== 201) throw new Error(`upload of ${file}: ${res.status} ${JSON.stringify(res.body)}`);
    ids[key] = res.body.id as string;
  }
});
afterAll(async () => {
  await t.close();
});

async function environment(id: string, body: object = {}): Promise<TrajectoryEnvironmentResponse> {
  const res = await analyst.post(`/api/v1/missions/${missionId}/ephemerides/${id}/environment`).send(body);
  if (res.status !== 200) throw new Error(`environment: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as TrajectoryEnvironmentResponse;
}

/** Time-weighted mean of f over [t0, t0 + spanS] (trapezoids, the last one cut by linear interpolation). */
function meanOver(points: TrajectoryEnvironmentResponse['points'], spanS: number, f: (p: TrajectoryEnvironmentResponse['points'][number]) => number): number {
  const t0 = Date.parse(points[0].epoch);
  let integral = 0;
  for (let i = 1; i < points.length; i++) {
    const [a, b] = [(Date.parse(points[i - 1].epoch) - t0) / 1000, (Date.parse(points[i].epoch) - t0) / 1000];
    if (a >= spanS) break;
    const end = Math.min(b, spanS);
    const fa = f(points[i - 1]);
    const fEnd = fa + ((f(points[i]) - fa) * (end - a)) / (b - a);
    integral += ((fa + fEnd) / 2) * (end - a);
  }
  return integral / spanS;
}

describe('environment along an ephemeris', () => {
  it('gives the same loads for the CSV and the OEM of one trajectory', async () => {
    const [csv, oem] = [await environment(ids.csv), await environment(ids.oem)];
    expect(oem.points.length).toBe(csv.points.length);
    expect(oem.points.map((p) => p.epoch)).toEqual(csv.points.map((p) => p.epoch));
    for (let i = 0; i < csv.points.length; i++) {
      expect(oem.points[i].sunlit).toBe(csv.points[i].sunlit);
      expect(oem.points[i].surfaces).toEqual(csv.points[i].surfaces);
    }
    expect(oem.averages).toEqual(csv.averages);
  });

  it('matches the analytic orbit of POST /environment/compute: orbit-average absorbed within 1.5 %, eclipse share within 0.01', async () => {
    const along = await environment(ids.csv);
    const compute = await analyst.post('/api/v1/environment/compute').send({
      bodyId: 'earth', orbit: leoOrbit, epoch: fixtureEpoch, steps: 3600, surfaces: testSurfaces,
    });
    expect(compute.status).toBe(200);
    const analytic = compute.body as EnvironmentResponse;
    // the ephemeris spans 4 h: average its first whole orbit, as the compute route averages one orbit
    const shadow = meanOver(along.points, analytic.periodS, (p) => 1 - p.sunlit);
    expect(Math.abs(shadow - analytic.eclipseFraction)).toBeLessThan(0.01);
    testSurfaces.forEach((surface, i) => {
      const mean = meanOver(along.points, analytic.periodS, (p) => p.surfaces[i].absorbedW);
      const expected = analytic.orbitAverage.surfaces[i].absorbedW;
      expect(Math.abs(mean - expected) / expected, `${surface.name}: ${mean} W along the file, ${expected} W analytic`).toBeLessThan(0.015);
    });
    // IR on the nadir panel depends only on the altitude: the same at every point
    const nadirIr = along.points.map((p) => p.surfaces[0].irWm2);
    expect(Math.max(...nadirIr) - Math.min(...nadirIr)).toBeLessThan(0.01);
    expect(nadirIr[0]).toBeCloseTo(analytic.orbitAverage.surfaces[0].irWm2, 1);
  });

  it('finds the velocities by finite differences when the file has none (the transfer orbit)', async () => {
    const res = await analyst
      .post(`/api/v1/missions/${missionId}/ephemerides`)
      .field('frame', 'EME2000')
      .field('epoch', fixtureEpoch)
      .attach('file', path.join(fixturesDir, 'gto-transfer.csv'));
    expect(res.status).toBe(201);
    const env = await environment(res.body.id as string, { maxPoints: 50 });
    expect(env.rows).toBe(361);
    // thinned to every 8th row (361 / 50 rounded up): rows 0, 8, …, 360, which is also the last
    expect(env.points.length).toBe(46);
    expect(env.points.at(-1)?.epoch).toBe('2027-03-20T18:00:00.000Z');
    // a nadir plate sees F = (R/(R+h))^2 (Howell catalogue, DOMAIN.md): IR = OLR F at the lowest and highest point
    const earthRadiusKm = 6378.137;
    for (const p of [env.points[0], env.points.reduce((a, b) => (b.altitudeKm > a.altitudeKm ? b : a))]) {
      const f = (earthRadiusKm / (earthRadiusKm + p.altitudeKm)) ** 2;
      expect(p.surfaces[0].irWm2).toBeCloseTo(env.olrWm2 * f, 6);
    }
    expect(env.points[0].altitudeKm).toBeCloseTo(300, 1);
  });

  it('uses EOL properties when asked: more absorbed solar on the Sun-pointing array', async () => {
    const [bol, eol] = [await environment(ids.csv), await environment(ids.csv, { properties: 'eol' })];
    const array = testSurfaces.findIndex((s) => s.normal === 'sun');
    const { areaM2, emissivity } = testSurfaces[array];
    // absorbed = A (alpha (solar + albedo) + epsilon IR) holds for the averages too (they are linear):
    // solve it for alpha; the test material has 0.25 BOL and 0.40 EOL
    const alphaOf = (e: TrajectoryEnvironmentResponse) => {
      const l = e.averages.surfaces[array];
      return (l.absorbedW / areaM2 - emissivity * l.irWm2) / (l.solarWm2 + l.albedoWm2);
    };
    expect(alphaOf(bol)).toBeCloseTo(0.25, 9);
    expect(alphaOf(eol)).toBeCloseTo(0.4, 9);
  });

  it('refuses a bad request body naming the field', async () => {
    const res = await analyst.post(`/api/v1/missions/${missionId}/ephemerides/${ids.csv}/environment`).send({ properties: 'mid-life' });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('properties');
  });
});
