// The stateless orbit and body tools through the app: orbit figures, the sun-synchronous orbit,
// the beta history, one body, unit conversion; how each answers malformed (400), impossible (422)
// and unknown (404) input, and that every one needs a signed-in user.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { betaAngleRad } from '../../shared/physics/beta-angle';
import { getBody } from '../../shared/physics/bodies';
import { sunFromBody } from '../../shared/physics/sun';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let viewer: request.Agent;

beforeAll(async () => {
  t = await createTestApp();
  viewer = await t.signIn('viewer@kestrel.test');
});
afterAll(() => t.close());

const DEG = Math.PI / 180;
const iss = { periapsisAltitudeKm: 400, apoapsisAltitudeKm: 420, inclinationDeg: 51.6, raanDeg: 30 };

describe('every tool needs a signed-in user', () => {
  it('answers 401 without credentials', async () => {
    const anonymous = request(t.app);
    await anonymous.post('/api/v1/orbits/figures').send({ bodyId: 'earth', orbit: iss }).expect(401);
    await anonymous.get('/api/v1/bodies/earth').expect(401);
    await anonymous.get('/api/v1/bodies/earth/sun-synchronous?altitudeKm=550').expect(401);
    await anonymous.post('/api/v1/environment/beta-history').send({}).expect(401);
    await anonymous.post('/api/v1/units/convert').send({ value: '1 km', unit: 'm' }).expect(401);
  });
});

describe('POST /api/v1/orbits/figures', () => {
  it('answers the figures; the shortest Earth orbit is 2 pi sqrt(R^3/mu) = 5069.3 s (Kepler, a = R)', async () => {
    const res = await viewer.post('/api/v1/orbits/figures').send({ bodyId: 'earth', orbit: iss }).expect(200);
    expect(res.body.minimumPeriodS).toBeCloseTo(5069.34, 1);
    expect(res.body.periapsisAltitudeKm).toBeCloseTo(400, 9);
    expect(res.body.periapsisSpeedKmS).toBeGreaterThan(res.body.apoapsisSpeedKmS);
    // the ISS-like node regresses about 5 deg/day (Vallado ch. 9; common knowledge of the ISS orbit)
    expect(res.body.nodalRateDegPerDay).toBeLessThan(-4.9);
    expect(res.body.nodalRateDegPerDay).toBeGreaterThan(-5.1);
    expect(res.body.meanMotionRevPerDay).toBeCloseTo(86400 / res.body.periodS, 9);
  });

  it('422 for a periapsis below the surface, 400 for a half-given definition', async () => {
    const below = await viewer.post('/api/v1/orbits/figures').send({ bodyId: 'mars', orbit: { periapsisAltitudeKm: -50, apoapsisAltitudeKm: 300 } }).expect(422);
    expect(below.body.error.message).toMatch(/50\.0 km below the surface of Mars/);
    const half = await viewer.post('/api/v1/orbits/figures').send({ bodyId: 'earth', orbit: { periapsisAltitudeKm: 500 } }).expect(400);
    expect(half.body.error.details[0].path).toBe('orbit.apoapsisAltitudeKm');
  });
});

describe('GET /api/v1/bodies/:bodyId/sun-synchronous', () => {
  it('Earth at 550 km: about 97.6 deg, the node turning 360 deg per tropical year (Vallado ch. 9; SMAD figure, from memory)', async () => {
    const res = await viewer.get('/api/v1/bodies/earth/sun-synchronous?altitudeKm=550').expect(200);
    expect(res.body.inclinationDeg).toBeCloseTo(97.6, 1);
    expect(res.body.nodalRateDegPerDay).toBeCloseTo(360 / 365.242189, 6);
    const eccentric = await viewer.get('/api/v1/bodies/earth/sun-synchronous?altitudeKm=550&eccentricity=0.05').expect(200);
    // p = a (1 - e^2) is smaller, J2 acts harder, so the orbit needs to lean less past 90 deg
    expect(eccentric.body.inclinationDeg).toBeLessThan(res.body.inclinationDeg);
  });

  it('422 where none exists, saying why; 404 for an unknown body; 400 for a missing or bad altitude', async () => {
    const high = await viewer.get('/api/v1/bodies/earth/sun-synchronous?altitudeKm=7000').expect(422);
    expect(high.body.error.message).toMatch(/no sun-synchronous orbit exists at 7000 km above Earth/);
    const venus = await viewer.get('/api/v1/bodies/venus/sun-synchronous?altitudeKm=300').expect(422);
    expect(venus.body.error.message).toMatch(/J2 is too small at any altitude/);
    await viewer.get('/api/v1/bodies/pluto/sun-synchronous?altitudeKm=300').expect(404);
    const missing = await viewer.get('/api/v1/bodies/earth/sun-synchronous').expect(400);
    expect(missing.body.error.details[0].path).toBe('altitudeKm');
    const text = await viewer.get('/api/v1/bodies/earth/sun-synchronous?altitudeKm=high').expect(400);
    expect(text.body.error.details[0].message).toMatch(/"high"/);
    await viewer.get('/api/v1/bodies/earth/sun-synchronous?altitudeKm=500&eccentricity=1.2').expect(400);
  });
});

describe('GET /api/v1/bodies/:bodyId', () => {
  it('answers one body with its sources and the Sun at perihelion, mean distance and aphelion; 404 for an unknown one', async () => {
    const res = await viewer.get('/api/v1/bodies/europa').expect(200);
    expect(res.body.kind).toBe('moon');
    expect(res.body.planetId).toBe('jupiter');
    expect(res.body.perihelion.distanceAu).toBeLessThan(res.body.aphelion.distanceAu);
    // inverse square: flux x distance^2 is the solar constant everywhere (1361 W/m^2, IAU 2015 B3)
    for (const p of [res.body.perihelion, res.body.mean, res.body.aphelion]) expect(p.solarFluxWm2 * p.distanceAu ** 2).toBeCloseTo(1361, 9);
    const missing = await viewer.get('/api/v1/bodies/vulcan').expect(404);
    expect(missing.body.error.message).toMatch(/"vulcan"/);
  });
});

describe('POST /api/v1/environment/beta-history', () => {
  const history = { bodyId: 'earth', orbit: iss, from: '2027-01-01T00:00:00Z', to: '2027-12-31T00:00:00Z', stepDays: 1 };

  it('a year of daily beta: the node drifts by J2, |beta| stays within i + obliquity (Gilmore ch. 2), eclipses vanish above beta*', async () => {
    const res = await viewer.post('/api/v1/environment/beta-history').send(history).expect(200);
    expect(res.body.items).toHaveLength(365);
    expect(res.body.maxBetaDeg).toBeLessThanOrEqual(51.6 + 23.44);
    expect(res.body.maxBetaDeg).toBeGreaterThan(65);
    expect(res.body.minBetaDeg).toBeLessThan(-65);
    const a = getBody('earth').radiusKm + 410;
    const betaStar = Math.asin(getBody('earth').radiusKm / (a * (1 + 0.0015))) / DEG;
    for (const item of res.body.items) {
      if (Math.abs(item.betaDeg) > betaStar + 0.5) expect(item.eclipseFraction).toBe(0);
      if (Math.abs(item.betaDeg) < 50) expect(item.eclipseFraction).toBeGreaterThan(0.3);
      expect(item.eclipseDurationS).toBeCloseTo(item.eclipseFraction * res.body.periodS, 6);
    }
  });

  it("each day's beta is Gilmore's formula with the Sun of that day and the node drifted at the answered J2 rate", async () => {
    const res = await viewer.post('/api/v1/environment/beta-history').send({ ...history, stepDays: 30 }).expect(200);
    for (const item of res.body.items.slice(0, 6)) {
      const days = (Date.parse(item.date) - Date.parse(history.from)) / 86400e3;
      const raan = (30 + res.body.nodalRateDegPerDay * days) * DEG;
      const sun = sunFromBody(getBody('earth'), new Date(item.date));
      // sin beta = cos dec sin i sin(RAAN - RA) + sin dec cos i  (Gilmore ch. 2); interpolated Sun within 1e-5 deg
      expect(Math.abs(item.betaDeg - betaAngleRad(sun.raRad, sun.decRad, 51.6 * DEG, raan) / DEG)).toBeLessThan(1e-5);
      expect(item.solarFluxWm2).toBeCloseTo(1361 / item.solarDistanceAu ** 2, 9);
    }
  });

  it('400 naming stepDays when the samples would exceed 20000, and for reversed dates', async () => {
    const long = await viewer.post('/api/v1/environment/beta-history').send({ ...history, to: '2087-01-01T00:00:00Z', stepDays: 1 }).expect(400);
    expect(long.body.error.details[0].path).toBe('stepDays');
    expect(long.body.error.details[0].message).toMatch(/21916 samples .* more than 20000/);
    const reversed = await viewer.post('/api/v1/environment/beta-history').send({ ...history, to: '2026-01-01T00:00:00Z' }).expect(400);
    expect(reversed.body.error.details[0].path).toBe('to');
    await viewer.post('/api/v1/environment/beta-history').send({ ...history, stepDays: 0 }).expect(400);
  });
});

describe('POST /api/v1/units/convert', () => {
  it('341.8 mi is 550.07 km (international mile 1609.344 m, NIST SP 811); a bare number is taken in the target unit', async () => {
    const res = await viewer.post('/api/v1/units/convert').send({ value: '341.8 mi', unit: 'km' }).expect(200);
    expect(res.body).toEqual({ value: expect.closeTo(550.0737792, 7), unit: 'km' });
    const bare = await viewer.post('/api/v1/units/convert').send({ value: 97.6, unit: 'deg' }).expect(200);
    expect(bare.body.value).toBe(97.6);
  });

  it('reads days and superscripts as the forms do (SI brochure table 8: 1 d = 86 400 s)', async () => {
    expect((await viewer.post('/api/v1/units/convert').send({ value: '14 d', unit: 's' }).expect(200)).body.value).toBe(1209600);
    expect((await viewer.post('/api/v1/units/convert').send({ value: '1.2 m²', unit: 'm^2' }).expect(200)).body.value).toBe(1.2);
    const unreadable = await viewer.post('/api/v1/units/convert').send({ value: '1.2 m²²', unit: 'm^2' }).expect(400);
    expect(unreadable.body.error.message).not.toMatch(/Unexpected|index/);
  });

  it('400 naming the dimensions when they differ, the unit when it is unknown', async () => {
    const mass = await viewer.post('/api/v1/units/convert').send({ value: '5 kg', unit: 'km' }).expect(400);
    expect(mass.body.error.message).toMatch(/"5 kg" is a mass, not a length/);
    expect(mass.body.error.details[0].path).toBe('value');
    const unknown = await viewer.post('/api/v1/units/convert').send({ value: '5 km', unit: 'furlongz' }).expect(400);
    expect(unknown.body.error.details[0].path).toBe('unit');
    await viewer.post('/api/v1/units/convert').send({ value: '5 km' }).expect(400);
  });
});
