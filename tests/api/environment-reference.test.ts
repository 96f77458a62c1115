// The stateless physics routes checked against the outside world: published constants, a textbook
// worked example, handbook fluxes and hand calculations written out step by step. Each check names
// its source; "from memory" marks a value recalled from the named publication, not re-read here.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let analyst: request.Agent;

beforeAll(async () => {
  t = await createTestApp();
  analyst = await t.signIn('analyst@kestrel.test');
});
afterAll(() => t.close());

const figures = async (orbit: object, bodyId = 'earth') =>
  (await analyst.post('/api/v1/orbits/figures').send({ bodyId, orbit }).expect(200)).body;

/** A printed value's own precision: within `units` of its last printed digit. */
const nearPrinted = (actual: number, printed: string, units = 0.5) => {
  const decimals = printed.includes('.') ? printed.split('.')[1].length : 0;
  expect(Math.abs(actual - Number(printed)), `${actual} vs printed ${printed}`).toBeLessThanOrEqual(units * 10 ** -decimals + 1e-12);
};

describe('geostationary orbit (IERS sidereal day; Vallado, GEO radius)', () => {
  it('a period of one sidereal day, 86164.0905 s, is a circle of radius 42164.17 km (Vallado: 42 164.17 km, from memory)', async () => {
    const geo = await figures({ periodS: 86164.0905, eccentricity: 0 });
    nearPrinted(geo.semiMajorAxisKm, '42164.17', 1);
    nearPrinted(geo.apoapsisAltitudeKm, '35786.03', 1);
  });

  it('a radius of 42164.1696 km orbits in 86164.09 s, 1.0027379 revolutions per solar day (mean solar over sidereal day 1.00273790935, IERS Conventions; from memory)', async () => {
    const geo = await figures({ semiMajorAxisKm: 42164.1696, eccentricity: 0 });
    nearPrinted(geo.periodS, '86164.09', 1);
    nearPrinted(geo.meanMotionRevPerDay, '1.0027379');
  });
});

describe('Curtis, Orbital Mechanics for Engineering Students, Example 2.7 (3rd ed.; from memory)', () => {
  // zp = 400 km, e = 0.6, with Curtis's R = 6378 km: rp = 6778 km, ra = rp (1 + e)/(1 - e) = 27 112 km,
  // a = (rp + ra)/2 = 16 945 km; vp = sqrt(mu (1 + e)/rp) = sqrt(398600 x 1.6 / 6778) = 9.700 km/s;
  // T = 2 pi sqrt(a^3/mu) = 21 952 s = 6.098 h. Our R is 6378.137 km, so the altitudes are given 0.137 km lower.
  it('perigee speed 9.700 km/s, apogee radius 27 110 km, semi-major axis 16 945 km, period 6.098 h', async () => {
    const orbit = await figures({ periapsisAltitudeKm: 400 - 0.137, apoapsisAltitudeKm: 27112 - 6378.137 });
    nearPrinted(orbit.eccentricity, '0.6');
    nearPrinted(orbit.periapsisSpeedKmS, '9.700');
    expect(Math.abs(orbit.semiMajorAxisKm + orbit.eccentricity * orbit.semiMajorAxisKm - 27110)).toBeLessThan(5);
    nearPrinted(orbit.semiMajorAxisKm, '16945');
    nearPrinted(orbit.periodS / 3600, '6.098');
    // vis-viva at apogee: sqrt(mu (1 - e)/ra) = sqrt(398600 x 0.4 / 27112) = 2.425 km/s
    nearPrinted(orbit.apoapsisSpeedKmS, '2.425');
  });
});

describe('body constants vs the NASA Goddard planetary fact sheets (values re-typed here from memory)', () => {
  // GM in 10^6 km^3/s^2, equatorial radius in km, J2 in 10^-6, as the fact sheets print them. Re-typing
  // them independently of the catalogue catches transcription slips; it does not re-confirm the sheets.
  const sheets: Record<string, [gm: string, radius: string, j2: string]> = {
    mercury: ['0.022032', '2440.5', '50.3'], venus: ['0.32486', '6051.8', '4.458'], earth: ['0.39860', '6378.137', '1082.63'],
    moon: ['0.00490', '1738.1', '202.7'], mars: ['0.042828', '3396.2', '1960.45'], jupiter: ['126.687', '71492', '14736'],
    saturn: ['37.931', '60268', '16298'], uranus: ['5.7940', '25559', '3343.43'], neptune: ['6.8351', '24764', '3411'],
  };
  for (const [id, [gm, radius, j2]] of Object.entries(sheets)) {
    it(`${id}: GM ${gm} x 10^6 km^3/s^2, radius ${radius} km, J2 ${j2} x 10^-6`, async () => {
      const body = (await analyst.get(`/api/v1/bodies/${id}`).expect(200)).body;
      // one unit of the last printed digit: the sheets round, and revise GM now and then
      nearPrinted(body.gmKm3S2 / 1e6, gm, 1);
      nearPrinted(body.radiusKm, radius, 0.5);
      nearPrinted(body.j2 * 1e6, j2, 0.5);
    });
  }
});

describe('solar flux at perihelion and aphelion (DOMAIN.md; Gilmore Table 2.1)', () => {
  it('Earth with 1361 W/m^2: about 1408 at perihelion and 1317 at aphelion (DOMAIN.md)', async () => {
    const earth = (await analyst.get('/api/v1/bodies/earth').expect(200)).body;
    expect(earth.mean.solarFluxWm2).toBeCloseTo(1361, 0);
    expect(Math.abs(earth.perihelion.solarFluxWm2 - 1408)).toBeLessThan(1);
    expect(Math.abs(earth.aphelion.solarFluxWm2 - 1317)).toBeLessThan(1);
  });

  it('rescaled to the older 1367 W/m^2: 1414 and 1322 W/m^2 (Gilmore, Spacecraft Thermal Control Handbook Vol. I, Table 2.1)', async () => {
    const earth = (await analyst.get('/api/v1/bodies/earth').expect(200)).body;
    const toGilmore = 1367 / earth.mean.solarFluxWm2 / earth.mean.distanceAu ** 2;
    expect(Math.abs(earth.perihelion.solarFluxWm2 * toGilmore - 1414)).toBeLessThan(1);
    expect(Math.abs(earth.aphelion.solarFluxWm2 * toGilmore - 1322)).toBeLessThan(1);
  });

  it("Mars's perihelion and aphelion fluxes follow from 1.3814 and 1.6660 AU (NASA Mars fact sheet: 206.7 and 249.2 million km; from memory)", async () => {
    const mars = (await analyst.get('/api/v1/bodies/mars').expect(200)).body;
    expect(mars.perihelion.distanceAu * 149.5978707).toBeCloseTo(206.7, 0);
    expect(mars.aphelion.distanceAu * 149.5978707).toBeCloseTo(249.2, 0);
    // inverse square by hand: 1361 / 1.3814^2 = 713.2 W/m^2, 1361 / 1.6660^2 = 490.3 W/m^2
    expect(Math.abs(mars.perihelion.solarFluxWm2 - 713.2)).toBeLessThan(1.5);
    expect(Math.abs(mars.aphelion.solarFluxWm2 - 490.3)).toBeLessThan(1.5);
  });
});

describe("the compute route's answers against hand calculations (550 km circular Earth orbit)", () => {
  // R = 6378.137 km, a = 6928.137 km, mu = 398600.4418 km^3/s^2.
  const base = {
    bodyId: 'earth', orbit: { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6 },
    solarDistanceAu: 1, albedo: 0.3, olrWm2: 237, steps: 360,
    surfaces: [
      { name: 'nadir panel', normal: 'nadir', areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 },
      { name: 'side panel', normal: 'orbit-normal', areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 },
    ],
  };
  const compute = async (betaDeg: number) => (await analyst.post('/api/v1/environment/compute').send({ ...base, betaDeg }).expect(200)).body;

  it("period: a^3 = 3.32544e11 km^3, / mu = 834 279.6 s^2, sqrt = 913.389 s, x 2 pi = 5738.99 s (Kepler's third law)", async () => {
    nearPrinted((await compute(0)).periodS, '5738.99', 1);
  });

  it('eclipse at beta 0: sqrt(h^2 + 2Rh) = 2705.264 km, / a = 0.390475, acos / pi = 0.37231 (Gilmore ch. 2 cylinder; conical within 0.002)', async () => {
    const r = await compute(0);
    expect(Math.abs(r.eclipseFraction - 0.37231)).toBeLessThan(2e-3);
    expect(r.eclipseDurationS).toBeCloseTo(r.eclipseFraction * r.periodS, 6);
  });

  it('eclipse at beta 60: 0.390475 / cos 60 = 0.780950, acos / pi = 0.21474 (Gilmore ch. 2; conical within 0.002)', async () => {
    expect(Math.abs((await compute(60)).eclipseFraction - 0.21474)).toBeLessThan(2e-3);
  });

  it('beta 70 is above beta* = asin(6378.137 / 6928.137) = 67.02 deg: no eclipse (Gilmore ch. 2)', async () => {
    expect((await compute(70)).eclipseFraction).toBe(0);
  });

  it('nadir view factor (R/a)^2 = 0.847529: IR 237 x 0.847529 = 200.86 W/m^2 every step (Howell, nadir plate)', async () => {
    const r = await compute(0);
    for (const point of r.profile) expect(point.surfaces[0].irWm2).toBeCloseTo(200.86, 2);
  });

  it('absorbed at beta 90: nadir 0.5 x 0.85 x 200.86 = 85.37 W; orbit-normal 0.5 x (0.25 x 1361 + 0.85 x 237 x 0.257886) = 196.10 W (API.md formula, Howell tilted plate)', async () => {
    const r = await compute(90);
    const [nadir, side] = r.orbitAverage.surfaces;
    expect(nadir.absorbedW).toBeCloseTo(85.37, 2);
    expect(side.solarWm2).toBeCloseTo(1361, 6);
    // H = a/R = 1.086232, X = sqrt(H^2 - 1) = 0.424146; tilt 90 deg: F = 1/2 - asin(X/H)/pi - X/(pi H^2) = 0.257886
    expect(side.irWm2).toBeCloseTo(237 * 0.257886, 3);
    expect(side.absorbedW).toBeCloseTo(196.1, 1);
  });
});
