import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { nodalRateRadS, periodS, semiMajorAxisForPeriodKm, solveKepler, speedKmS, trueAnomalyFromEccentric } from './kepler';
import { ConvergenceError, PhysicsError } from './physics-error';
import { sunSynchronousInclinationDeg } from './sun-synchronous';

const earth = getBody('earth');
const DEG = Math.PI / 180;

describe('Kepler period and vis-viva', () => {
  it('a 400 km Earth orbit has a period of about 92.6 min (DOMAIN.md [calc])', () => {
    expect(periodS(earth.radiusKm + 400, earth.gmKm3S2) / 60).toBeCloseTo(92.6, 1);
  });

  it('the geostationary radius 42164 km gives one sidereal day, 86164 s (Vallado, GEO radius; from memory)', () => {
    expect(periodS(42164.17, earth.gmKm3S2)).toBeCloseTo(86164.1, -1);
  });

  it('period -> semi-major axis inverts Kepler\'s third law (property, common practice)', () => {
    fc.assert(fc.property(fc.double({ min: 6500, max: 500000, noNaN: true }), (a) => {
      expect(semiMajorAxisForPeriodKm(periodS(a, earth.gmKm3S2), earth.gmKm3S2)).toBeCloseTo(a, 6);
    }));
  });

  it('circular speed at 400 km is about 7.67 km/s (Curtis, Orbital Mechanics, circular orbits; from memory)', () => {
    const r = earth.radiusKm + 400;
    expect(speedKmS(r, r, earth.gmKm3S2)).toBeCloseTo(7.67, 2);
  });
});

describe('Kepler\'s equation', () => {
  it('Vallado Example 2-1: M = 235.4 deg, e = 0.4 gives E = 220.512074767522 deg (from memory)', () => {
    expect(solveKepler(235.4 * DEG, 0.4) / DEG).toBeCloseTo(220.512074767522, 8);
  });

  it('the solution satisfies M = E - e sin E for any M and e < 0.99 (property, the equation itself)', () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), fc.double({ min: 0, max: 0.99, noNaN: true }), (m, e) => {
      const ecc = solveKepler(m, e);
      // compare on the circle: M = 2 pi and M = 0 are the same point
      const residual = ecc - e * Math.sin(ecc) - m;
      expect(Math.abs(Math.sin(residual))).toBeLessThan(1e-10);
      expect(Math.cos(residual)).toBeCloseTo(1, 12);
    }));
  });

  it('true anomaly is 90 deg where r = p, i.e. E = acos(e) (conic geometry, common practice)', () => {
    const e = 0.3;
    expect(Math.cos(trueAnomalyFromEccentric(Math.acos(e), e))).toBeCloseTo(0, 12);
  });

  it('refuses e >= 1 by naming the solver and the values, never NaN', () => {
    expect(() => solveKepler(1, 1)).toThrow(ConvergenceError);
    expect(() => solveKepler(1, 1)).toThrow(/Kepler solver.*e = 1/);
    expect(() => solveKepler(Number.NaN, 0.1)).toThrow(/M = NaN/);
  });
});

describe('J2 nodal precession and sun-synchronous inclination', () => {
  it('a sun-synchronous Earth orbit advances its node 0.9856 deg/day, 360 deg per tropical year (Vallado ch. 9)', () => {
    const a = earth.radiusKm + 700;
    const i = sunSynchronousInclinationDeg(earth, a) * DEG;
    expect((nodalRateRadS(earth, a, 0, i) / DEG) * 86400).toBeCloseTo(360 / 365.242189, 6);
  });

  it('sun-synchronous inclination at 800 km is about 98.6 deg (Vallado ch. 9 discussion; from memory)', () => {
    expect(sunSynchronousInclinationDeg(earth, earth.radiusKm + 800)).toBeCloseTo(98.6, 1);
  });

  it('sun-synchronous inclination at 700 km is about 98.2 deg (Wertz & Larson, SMAD, sun-synchronous figure; from memory)', () => {
    expect(sunSynchronousInclinationDeg(earth, earth.radiusKm + 700)).toBeCloseTo(98.2, 1);
  });

  it('a Mars sun-synchronous orbit at 400 km is near 92.9 deg (from memory: Mars SSO inclinations are about 93 deg)', () => {
    const mars = getBody('mars');
    expect(sunSynchronousInclinationDeg(mars, mars.radiusKm + 400)).toBeGreaterThan(92.5);
    expect(sunSynchronousInclinationDeg(mars, mars.radiusKm + 400)).toBeLessThan(93.5);
  });

  it('no Earth sun-synchronous orbit exists above about 6000 km: a clear error (Vallado ch. 9: cos i would exceed 1)', () => {
    expect(() => sunSynchronousInclinationDeg(earth, earth.radiusKm + 7000)).toThrow(PhysicsError);
    expect(() => sunSynchronousInclinationDeg(earth, earth.radiusKm + 7000)).toThrow(/no sun-synchronous orbit exists at 7000 km above Earth.*too high/);
    expect(() => sunSynchronousInclinationDeg(earth, earth.radiusKm + 5500)).not.toThrow();
  });

  it('Venus\'s tiny J2 allows no sun-synchronous orbit at any altitude (fact-sheet J2 4.458e-6; common practice)', () => {
    const venus = getBody('venus');
    expect(() => sunSynchronousInclinationDeg(venus, venus.radiusKm + 200)).toThrow(/J2 is too small at any altitude/);
  });
});
