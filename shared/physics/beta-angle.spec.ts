import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { betaAngleRad, betaFromVectorsRad, betaHistory, noEclipseBetaRad } from './beta-angle';
import { getBody } from './bodies';
import { defineOrbit } from './orbit-definition';
import { orbitBasis } from './orbit-position';
import { sunFromBody } from './sun';
import { sunSynchronousInclinationDeg } from './sun-synchronous';
import { fromSpherical } from './vector3';

const DEG = Math.PI / 180;
const earth = getBody('earth');

describe('beta angle', () => {
  it('Gilmore ch. 2 formula equals the direct vector computation asin(orbit normal . Sun) (property)', () => {
    fc.assert(fc.property(
      fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), fc.double({ min: -Math.PI / 2, max: Math.PI / 2, noNaN: true }),
      fc.double({ min: 0, max: Math.PI, noNaN: true }), fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
      (ra, dec, i, raan) => {
        const direct = betaFromVectorsRad(orbitBasis(i, raan, 0).w, fromSpherical(ra, dec));
        expect(betaAngleRad(ra, dec, i, raan)).toBeCloseTo(direct, 10);
      },
    ));
  });

  it('beta* = asin(R/(R+h)) is about 70.2 deg at 400 km (DOMAIN.md [calc], Gilmore ch. 2)', () => {
    expect(noEclipseBetaRad(earth.radiusKm, earth.radiusKm + 400) / DEG).toBeCloseTo(70.2, 1);
  });

  it('over a year |beta| stays within i + obliquity for Earth (DOMAIN.md, Gilmore ch. 2) and reaches close to it', () => {
    const orbit = defineOrbit({ periapsisAltitudeKm: 400, apoapsisAltitudeKm: 400, inclinationDeg: 51.6 }, earth);
    const start = new Date('2027-01-01T00:00:00Z');
    const history = betaHistory(earth, orbit, start, start, new Date('2028-01-01T00:00:00Z'), 6 * 3600);
    const extreme = Math.max(...history.map((s) => Math.abs(s.betaDeg)));
    expect(extreme).toBeLessThanOrEqual(51.6 + 23.44 + 1e-6);
    expect(extreme).toBeGreaterThan(70);
  });

  it('a sun-synchronous orbit keeps its node at a fixed angle to the Sun: beta drifts little over a year (Vallado ch. 9)', () => {
    const a = earth.radiusKm + 700;
    const orbit = defineOrbit({ semiMajorAxisKm: a, eccentricity: 0, inclinationDeg: sunSynchronousInclinationDeg(earth, a), raanDeg: 90 }, earth);
    const start = new Date('2027-03-21T00:00:00Z');
    const history = betaHistory(earth, orbit, start, start, new Date('2028-03-20T00:00:00Z'), 86400 * 5);
    const betas = history.map((s) => s.betaDeg);
    // Dawn-dusk plane: beta stays high all year; the equation of time and declination swing it by some degrees.
    expect(Math.min(...betas)).toBeGreaterThan(55);
    // The node turns once per tropical year: back to its start (mod 360) after 365.2422 days.
    const drift = (orbit.nodalRateRadS * 365.242189 * 86400) / DEG;
    expect(drift).toBeCloseTo(360, 4);
  });

  it('the beta of an epoch matches the Sun position module and the formula together (consistency, no source)', () => {
    const at = new Date('2027-06-21T12:00:00Z');
    const sun = sunFromBody(earth, at);
    const direct = betaFromVectorsRad(orbitBasis(97.6 * DEG, 30 * DEG, 0).w, sun.direction);
    expect(betaAngleRad(sun.raRad, sun.decRad, 97.6 * DEG, 30 * DEG)).toBeCloseTo(direct, 12);
  });
});
