import { describe, expect, it } from 'vitest';
import { environmentRequest } from '../api/environment';
import { getBody } from './bodies';
import { cylindricalEclipseFraction } from './eclipse';
import { computeEnvironment, type EnvironmentRequest } from './environment';
import { PhysicsError } from './physics-error';

const R = getBody('earth').radiusKm;
// The request of API.md's example.
const example: EnvironmentRequest = {
  bodyId: 'earth',
  orbit: { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6, raanDeg: 0, argPeriapsisDeg: 0 },
  epoch: '2027-03-20T12:00:00Z',
  betaDeg: 0,
  solarDistanceAu: 1.0, albedo: 0.3, olrWm2: 237,
  steps: 360,
  surfaces: [{ name: 'nadir panel', normal: 'nadir', areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 }],
};

describe('computeEnvironment (API.md "Environment computation")', () => {
  it('the API.md example: period by Kepler, eclipse near the cylindrical value (Gilmore ch. 2), overrides honoured', () => {
    const r = computeEnvironment(example);
    expect(r.periodS).toBeCloseTo(2 * Math.PI * Math.sqrt((R + 550) ** 3 / 398600.4418), 6);
    expect(r.semiMajorAxisKm).toBeCloseTo(6928.137, 6);
    expect(r.betaDeg).toBeCloseTo(0, 9);
    expect([r.solarFluxWm2, r.albedo, r.olrWm2]).toEqual([1361, 0.3, 237]);
    expect(Math.abs(r.eclipseFraction - cylindricalEclipseFraction(R, 550, 0))).toBeLessThan(2e-3);
    expect(r.eclipseDurationS).toBeCloseTo(r.eclipseFraction * r.periodS, 6);
    expect(r.profile).toHaveLength(360);
    expect(r.profile[0].tS).toBe(0);
  });

  it('the nadir panel\'s orbit-average IR is OLR (R/(R+h))^2 on a circular orbit (Howell nadir factor) and absorbed follows API.md', () => {
    const r = computeEnvironment(example);
    const avg = r.orbitAverage.surfaces[0];
    expect(avg.irWm2).toBeCloseTo(237 * (R / (R + 550)) ** 2, 9);
    expect(avg.absorbedW).toBeCloseTo(0.5 * (0.25 * (avg.solarWm2 + avg.albedoWm2) + 0.85 * avg.irWm2), 9);
    const inShadow = r.profile.filter((p) => p.sunlit === 0);
    expect(inShadow.length / 360).toBeCloseTo(r.umbraDurationS / r.periodS, 1);
    expect(inShadow.every((p) => p.surfaces[0].albedoWm2 === 0)).toBe(true);
  });

  it('without betaDeg the epoch sets beta; with it, the override wins and the epoch value is still reported', () => {
    const fromEpoch = computeEnvironment({ ...example, betaDeg: undefined });
    expect(fromEpoch.betaDeg).toBeCloseTo(fromEpoch.epochBetaDeg ?? Number.NaN, 9);
    const overridden = computeEnvironment({ ...example, betaDeg: 45 });
    expect(overridden.betaDeg).toBeCloseTo(45, 9);
    expect(overridden.eclipseFraction).toBeLessThan(fromEpoch.eclipseFraction);
  });

  it('elliptical orbits solve Kepler\'s equation: tS from periapsis, true anomaly 180 deg at half the period (Kepler, symmetry)', () => {
    const r = computeEnvironment({ ...example, orbit: { periapsisAltitudeKm: 500, apoapsisAltitudeKm: 30000, inclinationDeg: 28.5 }, steps: 12 });
    expect(r.profile[6].trueAnomalyDeg).toBeCloseTo(180, 9);
    expect(r.eccentricity).toBeGreaterThan(0.6);
    expect(r.profile.every((p) => p.surfaces.every((s) => Number.isFinite(s.absorbedW)))).toBe(true);
  });

  it('an orbit below the surface throws a PhysicsError that says by how much (API.md 422)', () => {
    const below = () => computeEnvironment({ ...example, orbit: { periapsisAltitudeKm: -312, apoapsisAltitudeKm: 550 } });
    expect(below).toThrow(PhysicsError);
    expect(below).toThrow('periapsis is 312 km below the surface of Earth');
  });

  // Its time is measured in bench/environment.bench.ts, row (f), never in a test.
  it('answers an orbit of 100000 steps, every step finite (API.md: steps up to 100000)', () => {
    const r = computeEnvironment({ ...example, steps: 100000 });
    expect(r.profile).toHaveLength(100000);
    expect(r.profile.every((p) => p.surfaces.every((s) => Number.isFinite(s.absorbedW)))).toBe(true);
  });

  it('the zod schema accepts API.md\'s example and refuses two orbit definitions, steps 11 and a bad normal (400s)', () => {
    expect(environmentRequest.safeParse(example).success).toBe(true);
    const two = environmentRequest.safeParse({ ...example, orbit: { ...example.orbit, periodS: 5700, eccentricity: 0 } });
    expect(two.success).toBe(false);
    expect(environmentRequest.safeParse({ ...example, steps: 11 }).success).toBe(false);
    const badNormal = environmentRequest.safeParse({ ...example, surfaces: [{ ...example.surfaces[0], normal: { x: 1, y: 1, z: 0 } }] });
    expect(badNormal.success).toBe(false);
    expect(environmentRequest.safeParse({ ...example, epoch: undefined, betaDeg: undefined }).success).toBe(false);
    const parsed = environmentRequest.parse({ ...example, orbit: { periodS: 5739, eccentricity: 0 } });
    expect(parsed.orbit.inclinationDeg).toBe(0);
    expect(computeEnvironment(parsed).semiMajorAxisKm).toBeCloseTo(6928.1, 0);
  });
});
