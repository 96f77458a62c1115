import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { computeEnvironment } from './environment';
import { defineOrbit } from './orbit-definition';
import { orbitSampler } from './orbit-position';
import { PhysicsError } from './physics-error';
import { solarFluxWm2, sunFromBody } from './sun';
import { trajectoryEnvironment, type TrajectorySample } from './trajectory-environment';
import { DEG, scale, type Vector3 } from './vector3';
import type { Surface } from './heat-loads';

const earth = getBody('earth');
const t0 = Date.parse('2027-06-21T00:00:00Z');
const panels: Surface[] = [
  { name: 'nadir', normal: 'nadir', areaM2: 1, absorptivity: 0.3, emissivity: 0.8 },
  { name: 'zenith', normal: 'zenith', areaM2: 1, absorptivity: 0.3, emissivity: 0.8 },
  { name: 'ram', normal: 'ram', areaM2: 1, absorptivity: 0.3, emissivity: 0.8 },
  { name: 'normal', normal: 'orbit-normal', areaM2: 1, absorptivity: 0.3, emissivity: 0.8 },
];

/** A 700 km circular orbit every stepS for one period, with exact velocities (v = dr/dt of the sampler). */
function circularSamples(stepS: number, withVelocity: boolean): TrajectorySample[] {
  const orbit = defineOrbit({ periapsisAltitudeKm: 700, apoapsisAltitudeKm: 700, inclinationDeg: 51.6, raanDeg: 40 }, earth);
  const at = orbitSampler(orbit);
  const speed = Math.sqrt(earth.gmKm3S2 / orbit.semiMajorAxisKm);
  const samples: TrajectorySample[] = [];
  for (let t = 0; t <= orbit.periodS; t += stepS) {
    const s = at(t);
    samples.push({ tMs: t0 + t * 1000, positionKm: s.positionKm, velocityKmS: withVelocity ? scale(s.ram, speed) : null });
  }
  return samples;
}

describe('trajectoryEnvironment', () => {
  it('surfaces pointed beyond the local frame (inertial, yaw-steered, a drive, a spinner) get the compute route\'s orbit averages for the same orbit and epoch (consistency; pointing.ts at each row)', () => {
    const pointed: Surface[] = [
      { name: 'inertial', normal: { inertial: { raDeg: 100, decDeg: 30 } }, areaM2: 1, absorptivity: 0.5, emissivity: 0.8 },
      { name: 'yaw', normal: { yawSteered: { normal: { x: 0.6, y: 0.8, z: 0 } } }, areaM2: 1, absorptivity: 0.5, emissivity: 0.8 },
      { name: 'drive', normal: { trackSun: { axis: 'orbit-normal' } }, areaM2: 1, absorptivity: 0.5, emissivity: 0.8 },
      { name: 'spinner', normal: { spin: { axis: { inertial: { raDeg: 0, decDeg: 90 } }, angleDeg: 70 } }, areaM2: 1, absorptivity: 0.5, emissivity: 0.8 },
    ];
    const result = trajectoryEnvironment(circularSamples(10, true), { body: earth, surfaces: pointed, albedo: 0.3, olrWm2: 237 });
    const single = computeEnvironment({
      bodyId: 'earth', orbit: { periapsisAltitudeKm: 700, apoapsisAltitudeKm: 700, inclinationDeg: 51.6, raanDeg: 40 },
      epoch: new Date(t0).toISOString(), albedo: 0.3, olrWm2: 237, steps: 600, surfaces: pointed,
    });
    for (const [j, load] of result.averages.surfaces.entries()) {
      const reference = single.orbitAverage.surfaces[j];
      // the trajectory's Sun moves over the orbit and its shadow edges fall between rows: within 1 W/m^2 (0.07 % of S)
      for (const key of ['solarWm2', 'albedoWm2', 'irWm2'] as const) expect(Math.abs(load[key] - reference[key]), `${load.name} ${key}`).toBeLessThan(1);
    }
  });

  it('a nadir plate sees OLR (R/r)^2 of IR at every point (Howell catalogue, plate facing the sphere)', () => {
    const result = trajectoryEnvironment(circularSamples(60, true), { body: earth, surfaces: panels });
    const f = (earth.radiusKm / (earth.radiusKm + 700)) ** 2;
    for (const p of result.points) {
      expect(p.altitudeKm).toBeCloseTo(700, 6);
      expect(p.surfaces[0].irWm2).toBeCloseTo(earth.olrWm2.nominal * f, 9);
      // a zenith plate faces away from the whole sphere at this altitude: no IR, no albedo
      expect(p.surfaces[1].irWm2).toBe(0);
      expect(p.surfaces[1].albedoWm2).toBe(0);
      // a planet has no parent planet's shadow
      expect(p.parentSunlit).toBeUndefined();
    }
  });

  it('a lunar orbiter: the surface temperature field and the Lambertian albedo at every row, orbit averages as the compute route\'s at the same epoch; the nadir IR over the night a few W/m^2, not the uniform 271 (LRO Diviner night 95-100 K, Williams et al. 2017, from memory; consistency with the compute route)', () => {
    const moon = getBody('moon');
    const elements = { periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 90, raanDeg: 40 };
    const orbit = defineOrbit(elements, moon);
    const at = orbitSampler(orbit);
    const speed = Math.sqrt(moon.gmKm3S2 / orbit.semiMajorAxisKm);
    const samples: TrajectorySample[] = [];
    for (let t = 0; t <= orbit.periodS + 1e-6; t += orbit.periodS / 360) {
      const s = at(t);
      samples.push({ tMs: t0 + t * 1000, positionKm: s.positionKm, velocityKmS: scale(s.ram, speed) });
    }
    const result = trajectoryEnvironment(samples, { body: moon, surfaces: panels, maxAltitudeKm: 100 });
    expect(result.models.irModel).toBe('surface-temperature');
    expect(result.models.albedoModel).toBe('lambertian');
    // on a circular orbit a plate fixed to the spacecraft sees an orbit average that depends only on beta and the solar flux:
    // the compute route at the trajectory's mean beta and flux (the Sun moves about 1 deg a day from the Moon: within 1.5 % or 0.5 W/m^2)
    const solarDistanceAu = Math.sqrt(solarFluxWm2(1) / result.meanSolarFluxWm2);
    const single = computeEnvironment({ bodyId: 'moon', orbit: elements, betaDeg: result.meanBetaDeg, solarDistanceAu, steps: 360, surfaces: panels });
    expect(single.irModel).toBe('surface-temperature');
    for (const [j, load] of result.averages.surfaces.entries()) {
      const reference = single.orbitAverage.surfaces[j];
      expect(Math.abs(load.irWm2 - reference.irWm2)).toBeLessThan(Math.max(0.5, 0.015 * reference.irWm2));
      expect(Math.abs(load.albedoWm2 - reference.albedoWm2)).toBeLessThan(Math.max(0.5, 0.015 * reference.albedoWm2));
    }
    const nadirIr = result.points.map((p) => p.surfaces[0].irWm2);
    expect(Math.min(...nadirIr)).toBeLessThan(10);
    // an OLR given asks for the uniform model, as in the compute route: OLR (R/r)^2 on a nadir plate (Howell catalogue)
    const uniform = trajectoryEnvironment(samples, { body: moon, surfaces: panels, olrWm2: 271, maxAltitudeKm: 100 });
    expect(uniform.points[0].surfaces[0].irWm2).toBeCloseTo(271 * (moon.radiusKm / (moon.radiusKm + 100)) ** 2, 6);
    // about a moon every point carries its planet's share of the Sun, and the combined sunlit share never exceeds it
    // (parent-shadow.ts: sunlit = max(0, f_moon + f_planet - 1); from memory)
    for (const p of result.points) {
      expect(p.parentSunlit).toBeGreaterThanOrEqual(0);
      expect(p.parentSunlit).toBeLessThanOrEqual(1);
      expect(p.sunlit).toBeLessThanOrEqual(p.parentSunlit! + 1e-12);
    }
  });

  it('finite-difference velocities give the loads of exact ones within 0.5 % (10 s steps; common practice, no source)', () => {
    const exact = trajectoryEnvironment(circularSamples(10, true), { body: earth, surfaces: panels });
    const differenced = trajectoryEnvironment(circularSamples(10, false), { body: earth, surfaces: panels });
    exact.averages.surfaces.forEach((l, i) => {
      const d = differenced.averages.surfaces[i];
      expect(Math.abs(d.absorbedW - l.absorbedW) / l.absorbedW, l.name).toBeLessThan(0.005);
    });
  });

  it('full Sun on the sunward side, umbra straight behind the body (shadow geometry)', () => {
    const sun = sunFromBody(earth, new Date(t0));
    const r = earth.radiusKm + 700;
    const along = (sign: number, dtS: number): TrajectorySample => {
      const position = scale(sun.directionIcrf, sign * r);
      // moving perpendicular to the Sun line, so zenith is along the Sun line
      const perpendicular: Vector3 = [-sun.directionIcrf[1], sun.directionIcrf[0], 0];
      return { tMs: t0 + dtS * 1000, positionKm: position, velocityKmS: scale(perpendicular, 7.5 / Math.hypot(...perpendicular)) };
    };
    const sunward = trajectoryEnvironment([along(1, 0), along(1, 1)], { body: earth, surfaces: panels });
    expect(sunward.points[0].sunlit).toBe(1);
    // zenith plate faces the Sun: S at the epoch's distance, cos 0
    expect(sunward.points[0].surfaces[1].solarWm2).toBeCloseTo(solarFluxWm2(sun.distanceAu), 6);
    const behind = trajectoryEnvironment([along(-1, 0), along(-1, 1)], { body: earth, surfaces: panels });
    expect(behind.points[0].sunlit).toBe(0);
    expect(behind.points[0].surfaces.every((l) => l.solarWm2 === 0 && l.albedoWm2 === 0)).toBe(true);
    expect(behind.averages.sunlitFraction).toBe(0);
  });

  it('weights averages by time: a long interval counts for more (trapezoidal rule)', () => {
    const samples = circularSamples(60, true);
    // keep rows 0, 1 and 50: the 49-step gap outweighs the single step
    const uneven = [samples[0], samples[1], samples[50]];
    const result = trajectoryEnvironment(uneven, { body: earth, surfaces: panels });
    const loads = result.points.map((p) => p.surfaces[2].absorbedW);
    const expected = (loads[0] * 30 + loads[1] * (30 + 49 * 30) + loads[2] * 49 * 30) / (50 * 60);
    expect(result.averages.surfaces[2].absorbedW).toBeCloseTo(expected, 9);
  });

  it('beta from r x v and the eclipse time over one orbit match the closed forms (DOMAIN.md: G Ch. 2)', () => {
    const result = trajectoryEnvironment(circularSamples(5, true), { body: earth, surfaces: panels });
    // sin beta = cos dec sin i sin(RAAN - RA) + sin dec cos i, with the Sun's RA and declination
    const sun = sunFromBody(earth, new Date(t0 + 2900_000));
    const [i, raan] = [51.6 * DEG, 40 * DEG];
    const beta = Math.asin(Math.cos(sun.decRad) * Math.sin(i) * Math.sin(raan - sun.raRad) + Math.sin(sun.decRad) * Math.cos(i));
    // the Sun moves about 0.04 deg over the orbit: means agree to 0.05 deg
    expect(Math.abs(result.meanBetaDeg - beta / DEG)).toBeLessThan(0.05);
    // cylindrical shadow: f = acos(sqrt(h^2 + 2Rh) / ((R+h) cos beta)) / pi; the conical umbra plus
    // half the penumbra lands within 1 % of it at 700 km (the penumbra is seconds long)
    const [R, h] = [earth.radiusKm, 700];
    const f = Math.acos(Math.sqrt(h * h + 2 * R * h) / ((R + h) * Math.cos(beta))) / Math.PI;
    expect(Math.abs((result.umbraS + result.penumbraS / 2) / result.spanS - f) / f).toBeLessThan(0.01);
    expect(result.penumbraS).toBeGreaterThan(0);
    expect(result.penumbraS).toBeLessThan(60);
    // every surface's own peak is at most the peak of the sum
    expect(result.peakTotalAbsorbedW).toBeGreaterThanOrEqual(Math.max(...result.peaks.surfaces.map((p) => p.absorbedW)));
  });

  it('refuses a trajectory of one point', () => {
    expect(() => trajectoryEnvironment(circularSamples(60, true).slice(0, 1), { body: earth, surfaces: panels })).toThrow(PhysicsError);
  });
});
