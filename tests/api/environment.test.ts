// The stateless physics routes through the app: the body catalogue, the environment computation,
// and how impossible and malformed input is answered (API.md "Environment computation", "Errors").
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let viewer: request.Agent;

beforeAll(async () => {
  t = await createTestApp();
  viewer = await t.signIn('viewer@kestrel.test');
});
afterAll(() => t.close());

const leo = {
  bodyId: 'earth',
  orbit: { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6 },
  epoch: '2027-03-20T12:00:00Z',
  betaDeg: 0,
  steps: 360,
  surfaces: [{ name: 'nadir panel', normal: 'nadir', areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 }],
};

describe('GET /api/v1/bodies', () => {
  it('lists every body id API.md names, each with its sources', async () => {
    const res = await viewer.get('/api/v1/bodies').expect(200);
    const ids = (res.body as { id: string }[]).map((b) => b.id);
    for (const id of ['mercury', 'venus', 'earth', 'moon', 'mars', 'jupiter', 'saturn', 'uranus', 'neptune', 'europa', 'titan']) {
      expect(ids).toContain(id);
    }
    const earth = (res.body as { id: string; radiusKm: number; sources: object }[]).find((b) => b.id === 'earth');
    // Earth's equatorial radius 6378.137 km (WGS 84, from memory)
    expect(earth?.radiusKm).toBeCloseTo(6378.137, 2);
    expect(Object.keys(earth?.sources ?? {}).length).toBeGreaterThan(3);
  });
});

describe('POST /api/v1/environment/compute', () => {
  // The Sun's direction in the perifocal frame: closed form sin beta = s . h (h the orbit normal, z here),
  // beta the Sun's angle above the orbit plane (Gilmore, "Spacecraft Thermal Control Handbook" vol. 1, ch. 2, from memory).
  const sunOf = async (request: object) =>
    (await viewer.post('/api/v1/environment/compute').send(request).expect(200)).body as { betaDeg: number; sunDirection: { x: number; y: number; z: number } };
  it('gives the Sun as a unit vector in the orbit plane at beta = 0 and along +z / -z at beta = +90 / -90 deg (sin beta = s . h)', async () => {
    for (const betaDeg of [0, 90, -90, 35]) {
      const { sunDirection: s } = await sunOf({ ...leo, betaDeg });
      expect(Math.hypot(s.x, s.y, s.z)).toBeCloseTo(1, 12);
      expect(s.z).toBeCloseTo(Math.sin((betaDeg * Math.PI) / 180), 9);
    }
  });

  it('gives the Sun of an eccentric orbit from its epoch, z = sin beta, and x, y turning with the argument of periapsis', async () => {
    const eccentric = { ...leo, betaDeg: undefined, orbit: { periapsisAltitudeKm: 500, apoapsisAltitudeKm: 30000, inclinationDeg: 63.4, raanDeg: 40, argPeriapsisDeg: 0 } };
    const a = await sunOf(eccentric);
    const b = await sunOf({ ...eccentric, orbit: { ...eccentric.orbit, argPeriapsisDeg: 90 } });
    expect(a.sunDirection.z).toBeCloseTo(Math.sin((a.betaDeg * Math.PI) / 180), 9);
    // turning the periapsis 90 deg along the motion turns the Sun's in-plane angle from it by -90 deg (rotation of the frame, from memory)
    expect(b.sunDirection.x).toBeCloseTo(a.sunDirection.y, 9);
    expect(b.sunDirection.y).toBeCloseTo(-a.sunDirection.x, 9);
    expect(b.sunDirection.z).toBeCloseTo(a.sunDirection.z, 9);
  });

  it("answers API.md's example with Kepler's period and the absorbed-load formula", async () => {
    const res = await viewer.post('/api/v1/environment/compute').send(leo).expect(200);
    // Kepler's third law with GM = 398600.4418 km^3/s^2, a = 6928.137 km: 5739 s (API.md's example shape)
    expect(res.body.periodS).toBeCloseTo(5739, -1);
    expect(res.body.semiMajorAxisKm).toBeCloseTo(6928.137, 2);
    expect(res.body.profile).toHaveLength(360);
    // absorbedW = areaM2 x (absorptivity x (solar + albedo) + emissivity x ir) (API.md)
    for (const point of res.body.profile.slice(0, 20)) {
      const s = point.surfaces[0];
      expect(s.absorbedW).toBeCloseTo(0.5 * (0.25 * (s.solarWm2 + s.albedoWm2) + 0.85 * s.irWm2), 6);
    }
    expect(res.body.eclipseFraction).toBeGreaterThan(0.3);
    expect(res.body.eclipseFraction).toBeLessThan(0.4);
  });

  it("warns, without refusing, of a Europa orbit beyond Europa's sphere of influence, and names Jupiter as its parent (Laplace a (m/M)^(2/5))", async () => {
    const res = await viewer
      .post('/api/v1/environment/compute')
      .send({ ...leo, bodyId: 'europa', betaDeg: undefined, orbit: { periapsisAltitudeKm: 200, apoapsisAltitudeKm: 20000, inclinationDeg: 80 } })
      .expect(200);
    expect(res.body.parentBodyId).toBe('jupiter');
    expect(res.body.warnings).toHaveLength(1);
    expect(res.body.warnings[0]).toMatch(/sphere of influence \(9,\d{3} km/);
    expect(res.body.assumptions.some((a: string) => a.startsWith('warning: '))).toBe(true);
    expect(typeof res.body.profile[0].parentSunlit).toBe('number');
  });

  it('refuses a periapsis below the surface with 422 saying by how much', async () => {
    const res = await viewer
      .post('/api/v1/environment/compute')
      .send({ ...leo, orbit: { periapsisAltitudeKm: -312, apoapsisAltitudeKm: 500 } })
      .expect(422);
    expect(res.body.error.message).toMatch(/312 km below the surface of Earth/);
  });

  it('refuses e >= 1 with 422', async () => {
    const res = await viewer
      .post('/api/v1/environment/compute')
      .send({ ...leo, orbit: { semiMajorAxisKm: 8000, eccentricity: 1.2 } })
      .expect((r) => expect([400, 422]).toContain(r.status));
    expect(res.body.error.message).toMatch(/eccentricity/i);
  });

  it('answers 400 naming the field and the value for too few steps', async () => {
    const res = await viewer.post('/api/v1/environment/compute').send({ ...leo, steps: 5 }).expect(400);
    expect(res.body.error.details[0].path).toBe('steps');
    expect(res.body.error.details[0].message).toMatch(/5/);
  });

  it('answers 400 for an unknown body', async () => {
    const res = await viewer.post('/api/v1/environment/compute').send({ ...leo, bodyId: 'pluto' }).expect(400);
    expect(res.body.error.details[0].path).toBe('bodyId');
  });
});
