// Orbits of a mission through the API: the three definitions, input kept as typed beside canonical
// values, unit and physics refusals naming the field and value, nothing half-written, roles and
// isolation, and the environment of a saved orbit (shared/api/missions.ts).
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { environmentResponse } from '../../shared/api/environment';
import { orbit } from '../../shared/api/missions';
import { auditFor, countRows, kestrelOne, libraryMaterialIdOf, missionIdOf, orbitIdOf, ploverRelay } from './mission-fixtures';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let analyst: request.Agent;
let viewer: request.Agent;
let plover: request.Agent;
let missionId: string;

// Earth GM 398600.4418 km^3/s^2 (IERS/WGS 84 value, from memory); the body catalogue answers it.
let earthGm: number;
let earthRadiusKm: number;

beforeAll(async () => {
  t = await createTestApp();
  [analyst, viewer, plover] = await Promise.all([t.signIn('analyst@kestrel.test'), t.signIn('viewer@kestrel.test'), t.signIn('owner@plover.test')]);
  const { body } = await analyst.post('/api/v1/missions').send({ name: 'Orbit tests', bodyId: 'earth', startDate: '2028-01-01', endDate: '2029-01-01' }).expect(201);
  missionId = body.id;
  const earth = ((await viewer.get('/api/v1/bodies')).body as { id: string; gmKm3S2: number; radiusKm: number }[]).find((b) => b.id === 'earth');
  earthGm = earth?.gmKm3S2 ?? NaN;
  earthRadiusKm = earth?.radiusKm ?? NaN;
});
afterAll(() => t.close());

const epoch = '2028-03-20T00:00:00Z';
const post = (body: object) => analyst.post(`/api/v1/missions/${missionId}/orbits`).send({ name: 'o', epoch, ...body });

describe('POST /api/v1/missions/:id/orbits', () => {
  it("keeps '341.8 mi' as typed and stores 550.07 km (1 mi = 1.609344 km exactly, international mile)", async () => {
    const res = await post({ periapsisAltitudeKm: '341.8 mi', apoapsisAltitudeKm: '341.8 mi', inclinationDeg: '97.6 deg' }).expect(201);
    const saved = orbit.parse(res.body);
    expect(saved.input).toEqual({ periapsisAltitudeKm: '341.8 mi', apoapsisAltitudeKm: '341.8 mi', inclinationDeg: '97.6 deg' });
    expect(saved.definition).toBe('altitudes');
    expect(saved.periapsisAltitudeKm).toBeCloseTo(550.07, 2);
    expect(saved.semiMajorAxisKm).toBeCloseTo(earthRadiusKm + 341.8 * 1.609344, 6);
    // Kepler's third law: T = 2 pi sqrt(a^3 / GM)
    expect(saved.periodS).toBeCloseTo(2 * Math.PI * Math.sqrt(saved.semiMajorAxisKm ** 3 / earthGm), 3);
    expect(auditFor(t, saved.id)[0]).toMatchObject({ action: 'orbit.created' });
  });

  it("reads a period of '95 min' into the semi-major axis by Kepler's third law", async () => {
    const res = await post({ periodS: '95 min', eccentricity: 0.001, raanDeg: '0.5 rad' }).expect(201);
    expect(res.body.definition).toBe('period');
    expect(res.body.periodS).toBeCloseTo(5700, 6);
    expect(res.body.semiMajorAxisKm).toBeCloseTo(Math.cbrt((earthGm * 5700 ** 2) / (4 * Math.PI ** 2)), 6);
    // 0.5 rad = 28.6479 deg (180/pi)
    expect(res.body.raanDeg).toBeCloseTo(0.5 * (180 / Math.PI), 9);
  });

  it('takes the semi-major axis with an eccentricity; bare numbers are in the field unit', async () => {
    const res = await post({ semiMajorAxisKm: 7000, eccentricity: 0.01, inclinationDeg: 51.6 }).expect(201);
    expect(res.body).toMatchObject({ definition: 'semi-major-axis', semiMajorAxisKm: 7000, eccentricity: 0.01, inclinationDeg: 51.6 });
    // r_p = a (1 - e), altitude above the equatorial radius
    expect(res.body.periapsisAltitudeKm).toBeCloseTo(7000 * 0.99 - earthRadiusKm, 6);
  });

  it('holds several orbits per mission', async () => {
    const res = await viewer.get(`/api/v1/missions/${missionId}/orbits`).expect(200);
    expect(res.body.items.length).toBe(3);
  });

  // Before any other quantity of this file needs mathjs: the first such quantity loads it, and the
  // write is made once, complete (NIST SP 811 appendix B: 1 ft = 0.3048 m exactly).
  it("reads a unit outside the typed-unit table with mathjs, loaded when first needed: '1804462 ft' is 550.00 km, one row and one audit event", async () => {
    const before = countRows(t, 'orbits');
    const res = await post({ name: 'in feet', periapsisAltitudeKm: '1804462 ft', apoapsisAltitudeKm: '1804462 ft', inclinationDeg: 97.6 }).expect(201);
    const saved = orbit.parse(res.body);
    expect(saved.periapsisAltitudeKm).toBeCloseTo(1804462 * 0.3048e-3, 9);
    expect(saved.input).toEqual({ periapsisAltitudeKm: '1804462 ft', apoapsisAltitudeKm: '1804462 ft', inclinationDeg: 97.6 });
    expect(countRows(t, 'orbits')).toBe(before + 1);
    expect(auditFor(t, saved.id).map((a) => a.action)).toEqual(['orbit.created']);
  });

  it.each([
    [{ periapsisAltitudeKm: '5 kg', apoapsisAltitudeKm: 500 }, 400, 'orbit.periapsisAltitudeKm: "5 kg" is a mass, not a length'],
    [{ periodS: '95 km', eccentricity: 0 }, 400, 'orbit.periodS: "95 km" is a length, not a time'],
    [{ periapsisAltitudeKm: 500, apoapsisAltitudeKm: 500, inclinationDeg: '12 parsnips' }, 400, 'orbit.inclinationDeg: "parsnips" is not a unit this field reads; use deg or rad'],
    // the compute route's own words: saved orbits and compute share one schema
    [{ periapsisAltitudeKm: 500, apoapsisAltitudeKm: 500, inclinationDeg: 200 }, 400, 'orbit.inclinationDeg: inclination is 0..180 deg (got 200)'],
    [{ periapsisAltitudeKm: 500, apoapsisAltitudeKm: 500, periodS: 5700 }, 400, 'define the orbit one way only'],
    [{ periapsisAltitudeKm: -312, apoapsisAltitudeKm: 500 }, 422, '312 km below the surface of Earth'],
    [{ semiMajorAxisKm: 7000, eccentricity: 1.2 }, 422, 'eccentricity 1.2 is not a closed orbit'],
    [{ periodS: '60 min', eccentricity: 0 }, 422, 'shorter than the shortest possible orbit around Earth'],
  ])('refuses %j with %i naming the field and value, writing no row', async (fields, status, message) => {
    const before = countRows(t, 'orbits');
    const res = await post(fields).expect(status);
    expect(res.body.error.message).toContain(message);
    expect(countRows(t, 'orbits')).toBe(before);
  });

  it('refuses a malformed epoch and unknown fields with 400', async () => {
    const res = await post({ epoch: '20 March', periapsisAltitudeKm: 500, apoapsisAltitudeKm: 500 }).expect(400);
    expect(res.body.error.details[0].path).toBe('epoch');
    expect(res.body.error.message).toContain('"20 March"');
    const unknown = await post({ periapsisAltitudeKm: 500, apoapsisAltitudeKm: 500, altitude: 3 }).expect(400);
    expect(unknown.body.error.message).toContain('"altitude"');
  });

  it('refuses what the compute route refuses, with the same schema and limits (issue 12): huge altitudes, angles and periods, typed or not', async () => {
    const surfaces = [{ name: 'n', normal: 'nadir', areaM2: 1, absorptivity: 0.2, emissivity: 0.8 }];
    const cases: [object, string][] = [
      [{ periapsisAltitudeKm: 500, apoapsisAltitudeKm: 1e308 }, 'apoapsisAltitudeKm'],
      [{ periapsisAltitudeKm: 500, apoapsisAltitudeKm: 600, raanDeg: 1e308 }, 'raanDeg'],
      [{ periapsisAltitudeKm: 500, apoapsisAltitudeKm: 600, argPeriapsisDeg: -1e308 }, 'argPeriapsisDeg'],
      [{ semiMajorAxisKm: 1e308, eccentricity: 0 }, 'semiMajorAxisKm'],
      [{ periodS: 1e308, eccentricity: 0 }, 'periodS'],
    ];
    for (const [fields, field] of cases) {
      const before = countRows(t, 'orbits', 'mission_id = ?', missionId);
      const saved = await post(fields);
      expect(saved.status, JSON.stringify(saved.body)).toBe(400);
      expect(saved.body.error.details[0].path).toBe(`orbit.${field}`);
      expect(countRows(t, 'orbits', 'mission_id = ?', missionId)).toBe(before);
      const computed = await analyst.post('/api/v1/environment/compute').send({ bodyId: 'earth', betaDeg: 0, orbit: fields, surfaces });
      expect(computed.status, JSON.stringify(computed.body)).toBe(400);
      expect(computed.body.error.details[0]).toEqual(saved.body.error.details[0]);
    }
    // typed with a unit, the converted value meets the same limit
    const typed = await post({ periapsisAltitudeKm: 500, apoapsisAltitudeKm: 600, raanDeg: '1e308 deg' }).expect(400);
    expect(typed.body.error.details[0]).toMatchObject({ path: 'orbit.raanDeg', message: expect.stringContaining('RAAN is -360..360 deg') });
  });

  it('is 403 for a viewer and 404 for another workspace', async () => {
    const body = { name: 'x', epoch, periapsisAltitudeKm: 500, apoapsisAltitudeKm: 500 };
    await viewer.post(`/api/v1/missions/${missionId}/orbits`).send(body).expect(403);
    await plover.post(`/api/v1/missions/${missionId}/orbits`).send(body).expect(404);
  });
});

describe('GET|PATCH|DELETE /api/v1/missions/:id/orbits/:orbitId', () => {
  it("is 404 for another workspace's orbit, also under the caller's own mission", async () => {
    const kestrelMission = missionIdOf(t, kestrelOne);
    const kestrelOrbit = orbitIdOf(t, kestrelMission, 'Operational SSO 540 km');
    await plover.get(`/api/v1/missions/${kestrelMission}/orbits/${kestrelOrbit}`).expect(404);
    await plover.get(`/api/v1/missions/${missionIdOf(t, ploverRelay)}/orbits/${kestrelOrbit}`).expect(404);
    await plover.patch(`/api/v1/missions/${missionIdOf(t, ploverRelay)}/orbits/${kestrelOrbit}`).send({ name: 'x' }).expect(404);
    await viewer.get(`/api/v1/missions/${kestrelMission}/orbits/${kestrelOrbit}`).expect(200);
  });

  it('changes the definition (stored shape fields of the old one go) and audits what changed', async () => {
    const { body: created } = await post({ name: 'to change', periapsisAltitudeKm: '400 km', apoapsisAltitudeKm: '600 km', raanDeg: 10 }).expect(201);
    const res = await analyst.patch(`/api/v1/missions/${missionId}/orbits/${created.id}`).send({ periodS: '100 min', eccentricity: 0 }).expect(200);
    expect(res.body.input).toEqual({ raanDeg: 10, periodS: '100 min', eccentricity: 0 });
    expect(res.body).toMatchObject({ definition: 'period', periodS: 6000, raanDeg: 10 });
    const summary = auditFor(t, created.id).at(-1)?.summary ?? '';
    expect(summary).toContain('periodS null -> "100 min"');

    // Only the apoapsis: the stored periapsis is gone with the old definition, so this is refused.
    const refused = await analyst.patch(`/api/v1/missions/${missionId}/orbits/${created.id}`).send({ apoapsisAltitudeKm: '700 km' }).expect(400);
    expect(refused.body.error.message).toContain('periapsis');
    const unchanged = await viewer.get(`/api/v1/missions/${missionId}/orbits/${created.id}`).expect(200);
    expect(unchanged.body.periodS).toBe(6000);
  });

  it('deletes an orbit (viewer refused), audited', async () => {
    const { body: created } = await post({ name: 'to delete', periapsisAltitudeKm: 500, apoapsisAltitudeKm: 500 }).expect(201);
    await viewer.delete(`/api/v1/missions/${missionId}/orbits/${created.id}`).expect(403);
    await analyst.delete(`/api/v1/missions/${missionId}/orbits/${created.id}`).expect(204);
    await analyst.get(`/api/v1/missions/${missionId}/orbits/${created.id}`).expect(404);
    expect(auditFor(t, created.id).map((e) => e.action)).toEqual(['orbit.created', 'orbit.deleted']);
  });
});

describe('POST /api/v1/missions/:id/orbits/:orbitId/environment', () => {
  it('matches the compute route on the same orbit and surfaces, and labels each surface', async () => {
    const kestrelMission = missionIdOf(t, kestrelOne);
    const orbitId = orbitIdOf(t, kestrelMission, 'Operational SSO 540 km');
    const res = await viewer.post(`/api/v1/missions/${kestrelMission}/orbits/${orbitId}/environment`).send({ steps: 120, properties: 'eol' }).expect(200);
    expect(environmentResponse.safeParse(res.body).success).toBe(true);
    const paint = res.body.surfaces.find((s: { materialName: string }) => s.materialName === 'white silicone paint');
    // EOL absorptivity of white silicone paint: middle of DOMAIN.md's 0.4-0.6 (from memory)
    expect(paint).toMatchObject({ name: 'Nadir deck (imager)', absorptivity: 0.5, emissivity: 0.83 });

    const { body: detail } = await viewer.get(`/api/v1/missions/${kestrelMission}`).expect(200);
    const saved = detail.orbits.find((o: { id: string }) => o.id === orbitId);
    const compute = await viewer
      .post('/api/v1/environment/compute')
      .send({
        bodyId: 'earth',
        epoch: saved.epoch,
        steps: 120,
        orbit: { semiMajorAxisKm: saved.semiMajorAxisKm, eccentricity: saved.eccentricity, inclinationDeg: saved.inclinationDeg, raanDeg: saved.raanDeg },
        surfaces: res.body.surfaces.map((s: { name: string; id: string; absorptivity: number; emissivity: number }) => {
          const surface = detail.surfaces.find((d: { id: string }) => d.id === s.id);
          return { name: s.name, normal: surface.normal, areaM2: surface.areaM2, absorptivity: s.absorptivity, emissivity: s.emissivity };
        }),
      })
      .expect(200);
    expect(res.body.betaDeg).toBeCloseTo(compute.body.betaDeg, 9);
    expect(res.body.orbitAverage).toEqual(compute.body.orbitAverage);
  });

  it('uses BOL by default, and answers eclipse and beta for a mission without surfaces', async () => {
    const { body: created } = await post({ name: 'bare', periapsisAltitudeKm: 500, apoapsisAltitudeKm: 500 }).expect(201);
    const res = await viewer.post(`/api/v1/missions/${missionId}/orbits/${created.id}/environment`).send({}).expect(200);
    expect(res.body.surfaces).toEqual([]);
    expect(res.body.properties).toBe('bol');
    expect(res.body.eclipseFraction).toBeGreaterThan(0);

    await analyst
      .post(`/api/v1/missions/${missionId}/surfaces`)
      .send({ name: 'black', areaM2: 1, normal: 'zenith', materialId: libraryMaterialIdOf(t, 'black paint') })
      .expect(201);
    const bol = await viewer.post(`/api/v1/missions/${missionId}/orbits/${created.id}/environment`).send({ steps: 36 }).expect(200);
    // black paint BOL 0.95 / 0.87 (DOMAIN.md, Fortescue Table 11.3 / Gilmore App. A)
    expect(bol.body.surfaces[0]).toMatchObject({ absorptivity: 0.95, emissivity: 0.87 });
  });

  it('refuses bad options with 400 and other workspaces with 404', async () => {
    const kestrelMission = missionIdOf(t, kestrelOne);
    const orbitId = orbitIdOf(t, kestrelMission, 'Operational SSO 540 km');
    const res = await viewer.post(`/api/v1/missions/${kestrelMission}/orbits/${orbitId}/environment`).send({ properties: 'mol' }).expect(400);
    expect(res.body.error.details[0].path).toBe('properties');
    await plover.post(`/api/v1/missions/${kestrelMission}/orbits/${orbitId}/environment`).send({}).expect(404);
  });
});
