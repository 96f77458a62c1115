import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { computeEnvironment } from './environment';
import { sweepMission, type MissionSweepRequest } from './mission-sweep';
import { sunFromBody } from './sun';
import { sunTrack } from './sun-track';
import { sunSynchronousInclinationDeg } from './sun-synchronous';

const DEG = Math.PI / 180;
const surfaces = [
  { name: 'nadir', normal: 'nadir' as const, areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 },
  { name: 'ram', normal: 'ram' as const, areaM2: 0.2, absorptivity: 0.9, emissivity: 0.8 },
  { name: 'array', normal: 'sun' as const, areaM2: 1, absorptivity: 0.88, emissivity: 0.8 },
  { name: 'tilted', normal: { x: 0.6, y: 0, z: -0.8 }, areaM2: 0.3, absorptivity: 0.4, emissivity: 0.6 },
];

describe('sweepMission (one orbit per date, the fast path of the mission sweep)', () => {
  it('each row equals computeEnvironment at that date with the node and periapsis drifted (consistency with the compute route)', () => {
    const orbit = { periapsisAltitudeKm: 600, apoapsisAltitudeKm: 2500, inclinationDeg: 63, raanDeg: 20, argPeriapsisDeg: 50 };
    const request: MissionSweepRequest = { bodyId: 'earth', orbit, epochStart: '2027-02-01T00:00:00Z', days: 90, stepDays: 30, steps: 360, surfaces };
    const sweep = sweepMission(request);
    expect(sweep.rows).toHaveLength(4);
    for (const [i, row] of sweep.rows.entries()) {
      const days = i * 30;
      const single = computeEnvironment({
        bodyId: 'earth', epoch: row.date, steps: 360, surfaces,
        orbit: { ...orbit, raanDeg: 20 + sweep.nodalRateDegPerDay * days, argPeriapsisDeg: 50 + sweep.apsidalRateDegPerDay * days },
      });
      // the sweep's Sun is interpolated between VSOP87 nodes: agreement to about 1e-6 relative
      expect(row.betaDeg).toBeCloseTo(single.betaDeg, 4);
      expect(row.eclipseFraction).toBeCloseTo(single.eclipseFraction, 4);
      for (const [j, load] of row.surfaces.entries()) {
        expect(load.absorbedW / single.orbitAverage.surfaces[j].absorbedW).toBeCloseTo(1, 4);
        expect(load.irWm2).toBeCloseTo(single.orbitAverage.surfaces[j].irWm2, 4);
      }
    }
  });

  it('a lunar orbiter: the airless surface temperature field and the Lambertian albedo, orbit averages as the compute route\'s for the same day; the nadir IR at night a few W/m^2, not the uniform 271 (LRO Diviner night 95-100 K, Williams et al. 2017, from memory; closed-form consistency with the compute route)', () => {
    const orbit = { periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 90, raanDeg: 40 };
    const sweep = sweepMission({ bodyId: 'moon', orbit, epochStart: '2027-03-01T12:00:00Z', days: 21, stepDays: 7, steps: 360, surfaces });
    expect(sweep.models.irModel).toBe('surface-temperature');
    expect(sweep.models.albedoModel).toBe('lambertian');
    expect(sweep.assumptions.join(' ')).toContain('radiative equilibrium');
    for (const [i, row] of sweep.rows.entries()) {
      const days = i * 7;
      const single = computeEnvironment({
        bodyId: 'moon', epoch: row.date, steps: 360, surfaces, orbit: { ...orbit, raanDeg: 40 + sweep.nodalRateDegPerDay * days },
      });
      expect(single.irModel).toBe('surface-temperature');
      for (const [j, load] of row.surfaces.entries()) {
        const reference = single.orbitAverage.surfaces[j];
        // the sweep's coarser cap quadrature: within 1 % of the compute route's (or 0.5 W/m^2 where the load is small)
        expect(Math.abs(load.irWm2 - reference.irWm2)).toBeLessThan(Math.max(0.5, 0.01 * reference.irWm2));
        expect(Math.abs(load.albedoWm2 - reference.albedoWm2)).toBeLessThan(Math.max(0.5, 0.01 * reference.albedoWm2));
      }
      // the same model at the night samples: a nadir plate sees the night floor, a few W/m^2
      const nightIr = Math.min(...single.profile.map((p) => p.surfaces[0]!.irWm2));
      expect(nightIr).toBeLessThan(10);
    }
    // with the uniform OLR asked for, the sweep keeps the old model: the orbit-average nadir IR is OLR x F (Howell catalogue)
    const uniform = sweepMission({ bodyId: 'moon', orbit, epochStart: '2027-03-01T12:00:00Z', days: 0, surfaces, olrWm2: 271 });
    expect(uniform.models.irModel).toBe('uniform');
    expect(uniform.rows[0].surfaces[0].irWm2).toBeCloseTo(271 * (1738.1 / 1838.1) ** 2, 0);
  });

  it('a sun-synchronous orbit holds its beta over a year while a 51.6 deg orbit swings through +/- (i + obliquity) (Vallado ch. 9; Gilmore ch. 2)', () => {
    const iss = sweepMission({ bodyId: 'earth', orbit: { periapsisAltitudeKm: 410, apoapsisAltitudeKm: 410, inclinationDeg: 51.6 }, epochStart: '2027-01-01T00:00:00Z', days: 365 });
    expect(iss.maxBetaDeg).toBeGreaterThan(70);
    expect(iss.minBetaDeg).toBeLessThan(-70);
    expect(Math.max(iss.maxBetaDeg, -iss.minBetaDeg)).toBeLessThanOrEqual(51.6 + 23.44);
    const a = 6378.137 + 700;
    const i = sunSynchronousInclinationDeg(getBody('earth'), a);
    const sso = sweepMission({ bodyId: 'earth', orbit: { semiMajorAxisKm: a, eccentricity: 0, inclinationDeg: i, raanDeg: 90 }, epochStart: '2027-03-21T00:00:00Z', days: 365, stepDays: 5 });
    // dawn-dusk plane: beta stays high all year (as beta-angle.spec.ts finds with the full Sun each date)
    expect(sso.minBetaDeg).toBeGreaterThan(55);
  });

  // From 1000 rows a sweep without a surface temperature field reads each fixed plate's Lambertian
  // albedo from a table by beta; a one-row sweep works the same day's cap integral directly.
  // Self-consistency of mission-sweep.ts (no outside source): within 1e-5 of the plate's value (a few 1e-6 seen).
  it('a long sweep\'s tabulated Lambertian albedo equals the day-by-day cap integral on the same days', () => {
    const normals = ['nadir', 'zenith', 'ram', 'wake', 'orbit-normal', 'anti-orbit-normal'] as const;
    const plates = normals.map((normal, i) => ({ name: normal, normal, areaM2: 1, absorptivity: 0.3 + 0.05 * i, emissivity: 0.8 }));
    const request: MissionSweepRequest = {
      bodyId: 'europa', orbit: { periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 85, raanDeg: 40 },
      epochStart: '2027-01-01T12:00:00Z', days: 1100, steps: 72, surfaces: plates, albedo: 0.68, olrWm2: 7,
    };
    const long = sweepMission(request);
    expect(long.models.albedoModel).toBe('lambertian');
    for (const day of [0, 137, 555, 1099]) {
      const date = new Date(Date.parse('2027-01-01T12:00:00Z') + day * 86400e3);
      const [one] = sweepMission({ ...request, epochStart: date, orbitEpoch: '2027-01-01T12:00:00Z', days: 0 }).rows;
      long.rows[day]!.surfaces.forEach((s, j) => {
        expect(Math.abs(s.albedoWm2 - one!.surfaces[j]!.albedoWm2)).toBeLessThanOrEqual(1e-5 * Math.max(1, one!.surfaces[j]!.albedoWm2));
      });
    }
  });

  it('refuses more than 20000 rows and a non-positive step', () => {
    const base = { bodyId: 'earth', orbit: { periodS: 6000, eccentricity: 0 }, epochStart: '2027-01-01T00:00:00Z' };
    expect(() => sweepMission({ ...base, days: 20000 })).toThrow(/20001 rows is more than 20000/);
    expect(() => sweepMission({ ...base, days: 10, stepDays: 0 })).toThrow(RangeError);
  });
});

describe('sunTrack (interpolated Sun for sweeps)', () => {
  it('stays within 1e-6 rad and 2e-6 AU of the full VSOP87 Sun over ten years, between nodes too (four-point Lagrange, A&S 25.2.13)', () => {
    for (const id of ['earth', 'moon', 'mars']) {
      const body = getBody(id);
      const start = Date.UTC(2027, 0, 1);
      const track = sunTrack(body, start, start + 3652 * 86400e3);
      const out = new Float64Array(3);
      for (let day = 0; day <= 3652; day += 37.3) {
        const ms = start + day * 86400e3;
        const distance = track.at(ms, out);
        const exact = sunFromBody(body, new Date(ms));
        const angle = Math.acos(Math.min(1, out[0] * exact.direction[0] + out[1] * exact.direction[1] + out[2] * exact.direction[2]));
        expect(angle, `${id} day ${day}`).toBeLessThan(1e-6);
        expect(Math.abs(distance - exact.distanceAu)).toBeLessThan(2e-6);
      }
    }
    expect(1e-6 / DEG * 3600).toBeLessThan(0.21);
  });
});
