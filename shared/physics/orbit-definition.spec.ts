import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { defineOrbit } from './orbit-definition';
import { PhysicsError } from './physics-error';

const earth = getBody('earth');

function errorOf(fn: () => unknown): PhysicsError {
  try {
    fn();
  } catch (error) {
    if (error instanceof PhysicsError) return error;
    throw error;
  }
  throw new Error('expected a PhysicsError');
}

describe('the three orbit definitions of API.md', () => {
  it('altitudes, axis + e and period + e describe the same 500 x 1500 km orbit (conic geometry, Vallado ch. 2)', () => {
    const byAltitudes = defineOrbit({ periapsisAltitudeKm: 500, apoapsisAltitudeKm: 1500, inclinationDeg: 51.6 }, earth);
    const byAxis = defineOrbit({ semiMajorAxisKm: byAltitudes.semiMajorAxisKm, eccentricity: byAltitudes.eccentricity }, earth);
    const byPeriod = defineOrbit({ periodS: byAltitudes.periodS, eccentricity: byAltitudes.eccentricity }, earth);
    expect(byAltitudes.semiMajorAxisKm).toBeCloseTo(earth.radiusKm + 1000, 9);
    expect(byAltitudes.eccentricity).toBeCloseTo(1000 / (2 * earth.radiusKm + 2000), 12);
    expect(byAxis.periapsisAltitudeKm).toBeCloseTo(500, 6);
    expect(byPeriod.apoapsisAltitudeKm).toBeCloseTo(1500, 6);
  });

  it('vis-viva: periapsis speed times periapsis radius equals apoapsis speed times apoapsis radius (angular momentum, Vallado ch. 2)', () => {
    const o = defineOrbit({ periapsisAltitudeKm: 300, apoapsisAltitudeKm: 35786 }, earth);
    expect(o.periapsisSpeedKmS * o.periapsisKm).toBeCloseTo(o.apoapsisSpeedKmS * o.apoapsisKm, 6);
    // GTO perigee speed is about 10.2 km/s (Curtis, Hohmann transfer to GEO; from memory)
    expect(o.periapsisSpeedKmS).toBeCloseTo(10.15, 1);
  });

  it('angles default to 0 and a circular orbit counts from the ascending node', () => {
    const o = defineOrbit({ semiMajorAxisKm: 7000, eccentricity: 0, argPeriapsisDeg: 45 }, earth);
    expect([o.inclinationRad, o.raanRad, o.argPeriapsisRad, o.circular]).toEqual([0, 0, 0, true]);
  });
});

describe('refusing the impossible', () => {
  it('a periapsis 312 km below the surface says so', () => {
    const e = errorOf(() => defineOrbit({ periapsisAltitudeKm: -312, apoapsisAltitudeKm: 800 }, earth));
    expect(e.code).toBe('impossible_orbit');
    expect(e.message).toBe('periapsis is 312 km below the surface of Earth');
    expect(e.details[0].path).toBe('orbit.periapsisAltitudeKm');
  });

  it('a semi-major axis and eccentricity whose periapsis dips into Mars says by how much', () => {
    const mars = getBody('mars');
    const e = errorOf(() => defineOrbit({ semiMajorAxisKm: 4000, eccentricity: 0.2 }, mars));
    expect(e.message).toBe(`periapsis is ${(mars.radiusKm - 3200).toFixed(0)} km below the surface of Mars`);
  });

  it('a period below the grazing orbit names that minimum: about 84.5 min for Earth (the Schuler period, ~84.4 min; from memory)', () => {
    const e = errorOf(() => defineOrbit({ periodS: 4000, eccentricity: 0 }, earth));
    expect(e.message).toMatch(/shorter than the shortest possible orbit around Earth at eccentricity 0: 50\d\d s \(84\.\d min\)/);
    const grazing = Number(/: (\d+) s/.exec(e.message)?.[1]);
    expect(grazing / 60).toBeGreaterThan(84.3);
    expect(grazing / 60).toBeLessThan(84.6);
  });

  it('e >= 1, negative eccentricity, apoapsis below periapsis and two definitions at once are refused', () => {
    expect(errorOf(() => defineOrbit({ semiMajorAxisKm: 9000, eccentricity: 1 }, earth)).message).toMatch(/e must be below 1/);
    expect(errorOf(() => defineOrbit({ periodS: 9000, eccentricity: -0.1 }, earth)).message).toMatch(/cannot be negative, got -0.1/);
    expect(errorOf(() => defineOrbit({ periapsisAltitudeKm: 800, apoapsisAltitudeKm: 500 }, earth)).message).toMatch(/below periapsis/);
    expect(errorOf(() => defineOrbit({ semiMajorAxisKm: 7000, periodS: 6000, eccentricity: 0 }, earth)).code).toBe('invalid_orbit_definition');
    expect(errorOf(() => defineOrbit({ periodS: -5, eccentricity: 0 }, earth)).message).toMatch(/period must be positive, got -5 s/);
  });
});
