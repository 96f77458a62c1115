// The environment along an uploaded ephemeris: the CSV and the OEM of one trajectory agree, and along
// the circular-orbit fixture the loads match POST /environment/compute for the same orbit and epoch,
// over the whole file, over a window of one orbit, and in a load case made from that window.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import type { TrajectoryEnvironmentResponse } from '../../shared/api/ephemerides';
import type { CaseDetail } from '../../shared/api/cases';
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

describe('a window of the ephemeris', () => {
  /** POST /environment/compute for the fixture's own orbit and epoch: the analytic reference. */
  async function analyticOrbit(): Promise<EnvironmentResponse> {
    const compute = await analyst.post('/api/v1/environment/compute').send({ bodyId: 'earth', orbit: leoOrbit, epoch: fixtureEpoch, steps: 3600, surfaces: testSurfaces });
    expect(compute.status).toBe(200);
    return compute.body as EnvironmentResponse;
  }
  const after = (s: number) => new Date(Date.parse(fixtureEpoch) + s * 1000).toISOString();

  it('averages only its rows: one orbit of the file matches the analytic orbit of /environment/compute (averages within 1.5 %, sunlit share within 0.01; tolerance common practice, no source)', async () => {
    const analytic = await analyticOrbit();
    const whole = await environment(ids.csv);
    const orbit = await environment(ids.csv, { from: fixtureEpoch, to: after(analytic.periodS) });
    // rows every 60 s from 12:00:00: those up to the end of the first period
    expect(orbit.rows).toBe(Math.floor(analytic.periodS / 60) + 1);
    expect(orbit.window).toEqual({ from: fixtureEpoch, to: after(Math.floor(analytic.periodS / 60) * 60) });
    expect(whole.window).toEqual({ from: fixtureEpoch, to: '2027-03-20T16:00:00.000Z' });
    expect(orbit.points.at(-1)?.epoch).toBe(orbit.window.to);
    expect(Math.abs(orbit.averages.sunlitFraction - (1 - analytic.eclipseFraction))).toBeLessThan(0.01);
    testSurfaces.forEach((surface, i) => {
      const [got, expected] = [orbit.averages.surfaces[i].absorbedW, analytic.orbitAverage.surfaces[i].absorbedW];
      expect(Math.abs(got - expected) / expected, `${surface.name}: ${got} W over the window, ${expected} W analytic`).toBeLessThan(0.015);
    });
  });

  it('counts every row of the whole file even when its epochs carry sub-millisecond digits (OEM)', async () => {
    // the OEM fixture with every epoch 0.6 ms later: the stored summary writes epochs to the millisecond
    const text = readFileSync(path.join(fixturesDir, 'leo-circular.oem'), 'utf8')
      .replace(/^(\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2})\.000 /gm, '$1.0006 ')
      .replace('STOP_TIME = 2027-03-20T16:00:00.000', 'STOP_TIME = 2027-03-20T16:00:00.001');
    const res = await analyst.post(`/api/v1/missions/${missionId}/ephemerides`).attach('file', Buffer.from(text), 'sub-ms.oem');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const whole = await environment(res.body.id as string);
    expect(whole.rows).toBe(241);
    expect(whole.rows).toBe(res.body.rows);
  });

  it('refuses a window outside the ephemeris, reversed, or too short, naming the field', async () => {
    const url = `/api/v1/missions/${missionId}/ephemerides/${ids.csv}/environment`;
    const outside = await analyst.post(url).send({ from: '2027-03-21T00:00:00Z' });
    expect(outside.status).toBe(422);
    expect(outside.body.error.details[0].path).toBe('from');
    expect(outside.body.error.message).toMatch(/lies outside the ephemeris, which runs 2027-03-20T12:00:00.000Z – 2027-03-20T16:00:00.000Z/);
    const reversed = await analyst.post(url).send({ from: after(600), to: after(60) });
    expect(reversed.status).toBe(400);
    expect(reversed.body.error.details[0]).toMatchObject({ path: 'to', message: expect.stringMatching(/^from must be before to/) });
    // 30 s inside a 60 s step: one row
    const short = await analyst.post(url).send({ from: after(50), to: after(80) });
    expect(short.status).toBe(422);
    expect(short.body.error.message).toMatch(/holds 1 row of the ephemeris; a window needs at least two/);
  });
});

describe('a load case from an ephemeris window', () => {
  let thermal: request.Agent;
  beforeAll(async () => {
    thermal = await t.signIn('thermal@kestrel.test');
  });
  const casesUrl = () => `/api/v1/missions/${missionId}/ephemerides/${ids.csv}/cases`;

  it('records the trajectory and the osculating orbit (RV2COE, Vallado), and its loads match the analytic orbit of /environment/compute (within 1.5 %; beta within 0.1 deg)', async () => {
    const analytic = (await analyst.post('/api/v1/environment/compute').send({ bodyId: 'earth', orbit: leoOrbit, epoch: fixtureEpoch, steps: 3600, surfaces: testSurfaces })).body as EnvironmentResponse;
    const to = new Date(Date.parse(fixtureEpoch) + analytic.periodS * 1000).toISOString();
    const res = await thermal.post(casesUrl()).send({ name: 'Kestrel-1 one orbit from the file', from: fixtureEpoch, to, steps: 48 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const c = res.body as CaseDetail;
    expect(c).toMatchObject({ kind: 'custom', status: 'draft', revision: 1, name: 'Kestrel-1 one orbit from the file' });
    const upload = (await analyst.get(`/api/v1/missions/${missionId}/ephemerides/${ids.csv}`)).body as { sha256: string; name: string };
    expect(c.inputs.ephemeris).toEqual({ id: ids.csv, name: upload.name, fileName: 'leo-circular.csv', sha256: upload.sha256, from: fixtureEpoch, to: expect.any(String), rows: Math.floor(analytic.periodS / 60) + 1 });
    // the osculating orbit at the first row is the fixture's 550 km, 97.6 deg, RAAN 30 deg circle (RV2COE)
    expect(c.inputs.orbit.id).toBeNull();
    expect(c.inputs.orbit.periapsisAltitudeKm).toBeCloseTo(550, 2);
    expect(c.inputs.orbit.apoapsisAltitudeKm).toBeCloseTo(550, 2);
    expect(c.inputs.orbit.inclinationDeg).toBeCloseTo(97.6, 4);
    expect(c.inputs.orbit.raanDeg).toBeCloseTo(30, 4);
    expect(Math.abs(c.results.betaDeg - analytic.betaDeg)).toBeLessThan(0.1);
    expect(Math.abs(c.results.eclipseFraction - analytic.eclipseFraction)).toBeLessThan(0.01);
    const analyticTotal = analytic.orbitAverage.surfaces.reduce((s, l) => s + l.absorbedW, 0);
    expect(Math.abs(c.results.total.orbitAverageAbsorbedW - analyticTotal) / analyticTotal).toBeLessThan(0.015);
    // the series: 48 thinned steps from the window's start; the watts follow A alpha S for the solar part
    expect(c.results.tS[0]).toBe(0);
    expect(c.results.tS.length).toBeLessThanOrEqual(49);
    const nadir = c.results.surfaces[0];
    nadir.series.solarWm2.forEach((s, k) => expect(nadir.series.solarW[k]).toBeCloseTo(0.5 * 0.25 * s, 3));
    // the default heat-load margin is added (increase): DOMAIN.md default margins
    expect(c.results.total.orbitAverageWithMarginW).toBeGreaterThan(c.results.total.orbitAverageAbsorbedW);
    expect(c.inputs.rationale[0]).toMatch(/^loads along the ephemeris/);
    // the JSON export carries the trajectory it came from
    const exported = await thermal.get(`/api/v1/cases/${c.id}/export?format=json`);
    expect(exported.status).toBe(200);
    expect(JSON.parse(exported.text).inputs.ephemeris.sha256).toBe(upload.sha256);
  });

  it('spaces its series evenly in time however uneven the file is (every minute for an hour, then every five)', async () => {
    const lines = readFileSync(path.join(fixturesDir, 'leo-circular.csv'), 'utf8').trim().split('\n');
    // header, rows 0..60 (12:00-13:00 every 60 s), then every 5th row to 16:00 (300 s apart)
    const uneven = [lines[0], ...lines.slice(1).filter((_, i) => i <= 60 || i % 5 === 0)].join('\n') + '\n';
    const uploaded = await analyst.post(`/api/v1/missions/${missionId}/ephemerides`).field('frame', 'EME2000').attach('file', Buffer.from(uneven), 'uneven.csv');
    expect(uploaded.status, JSON.stringify(uploaded.body)).toBe(201);
    const res = await thermal.post(`/api/v1/missions/${missionId}/ephemerides/${uploaded.body.id}/cases`).send({ name: 'uneven file', steps: 24 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const { tS, periodS } = (res.body as CaseDetail).results;
    expect(periodS).toBe(4 * 3600);
    // 24 steps of 600 s over [0, 4 h): each the first row at or after k * 600 s, so at most 300 s late
    expect(tS).toHaveLength(24);
    tS.forEach((t, k) => {
      expect(t, `step ${k}`).toBeGreaterThanOrEqual(k * 600);
      expect(t, `step ${k}`).toBeLessThanOrEqual(k * 600 + 300);
    });
  });

  it('keeps its loads when renamed or given other margins, and refuses hand edits of its inputs', async () => {
    const created = (await thermal.post(casesUrl()).send({ name: 'whole file', properties: 'eol', margins: { heatLoadPercent: 10 } })).body as CaseDetail;
    const edited = await thermal.patch(`/api/v1/cases/${created.id}`).send({ name: 'whole file, 30 %', margins: { heatLoadPercent: 30 } });
    expect(edited.status, JSON.stringify(edited.body)).toBe(200);
    const after = edited.body as CaseDetail;
    expect(after.results.total.orbitAverageAbsorbedW).toBe(created.results.total.orbitAverageAbsorbedW);
    expect(after.results.surfaces[0].series).toEqual(created.results.surfaces[0].series);
    expect(after.results.total.orbitAverageWithMarginW).toBeCloseTo(created.results.total.orbitAverageAbsorbedW * 1.3, 3);
    const refused = await thermal.patch(`/api/v1/cases/${created.id}`).send({ inputs: { betaDeg: 10 } });
    expect(refused.status).toBe(422);
    expect(refused.body.error.details[0]).toMatchObject({ path: 'inputs.betaDeg', message: expect.stringContaining('(got 10)') });
    expect((await thermal.get(`/api/v1/cases/${created.id}`)).body.results).toEqual(after.results);
  });

  it('is for thermal engineers and owners: an analyst is refused (403), a bad body names its field (400)', async () => {
    const byAnalyst = await analyst.post(casesUrl()).send({ name: 'not mine' });
    expect(byAnalyst.status).toBe(403);
    const bad = await thermal.post(casesUrl()).send({ name: 'x', steps: 5 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('steps');
  });
});
