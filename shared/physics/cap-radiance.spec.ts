import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { bruteForceCapFlux } from './cap-brute-force';
import { capNodes, meanExitanceWm2, plateFluxes, plateNodes, surfaceTemperatureK, type SurfaceField } from './cap-radiance';
import { STEFAN_BOLTZMANN } from './constants';
import { computeEnvironment } from './environment';
import { solarFluxWm2 } from './sun';
import { plateToSphereViewFactor } from './view-factors';

const DEG = Math.PI / 180;

const bruteForce = bruteForceCapFlux;

const sunAt = (betaDeg: number, angleDeg: number) => {
  const [b, a] = [betaDeg * DEG, angleDeg * DEG];
  return [Math.cos(b) * Math.sin(a), Math.sin(b), Math.cos(b) * Math.cos(a)];
};
const plateAt = (tiltDeg: number, azimuthDeg = 0) => {
  const [t, a] = [tiltDeg * DEG, azimuthDeg * DEG];
  return [Math.sin(t) * Math.cos(a), Math.sin(t) * Math.sin(a), -Math.cos(t)];
};

describe('flux from a body of varying exitance, by quadrature over the visible cap', () => {
  const out = new Float64Array(2);

  it('with a uniform exitance the weights give the plate-to-sphere view factor for every tilt (Howell catalogue closed form, view-factors.ts)', () => {
    for (const h of [1.02, 1.1, 1.5, 6.6]) {
      for (let tilt = 0; tilt <= 180; tilt += 15) {
        const n = plateAt(tilt);
        plateFluxes(plateNodes(capNodes(h), n[0], n[1], n[2]), 0, 0, 1, 0, 0, 1, out);
        expect(Math.abs(out[1] - plateToSphereViewFactor(h, 1, tilt * DEG))).toBeLessThan(2e-3 / (h * h));
      }
    }
  });

  it('the Lambertian albedo integral matches brute-force numerical integration within 1 % (high orbits, side-looking plates at high beta) (Howell view-factor integral; no published table)', () => {
    for (const h of [1.05, 1.3, 6.6]) {
      for (const [tilt, azimuth] of [[0, 0], [45, 30], [90, 0], [90, 90], [120, 200]]) {
        for (const [beta, angle] of [[0, 30], [60, 80], [75, 120], [20, 95]]) {
          const [n, s] = [plateAt(tilt, azimuth), sunAt(beta, angle)];
          plateFluxes(plateNodes(capNodes(h), n[0], n[1], n[2]), s[0], s[1], s[2], 1, 0, 0, out);
          const reference = bruteForce(h, n, s, (mu) => Math.max(0, mu));
          // relative to the plate's view factor: near a zero the absolute error is what counts
          expect(Math.abs(out[0] - reference)).toBeLessThanOrEqual(0.01 * Math.max(reference, 0.05 * plateToSphereViewFactor(h, 1, tilt * DEG)));
        }
      }
    }
  });

  it('the engineering approximation S a F cos(theta) errs where the issue says it does: about +35 % at the GEO albedo peak on a nadir plate (NASA/TM-2001-211221 discussion as quoted in issue 13; from memory)', () => {
    const h = 42164 / 6378.137;
    plateFluxes(plateNodes(capNodes(h), 0, 0, -1), 0, 0, 1, 1, 0, 0, out);
    const approximation = plateToSphereViewFactor(h, 1, 0);
    expect(approximation / out[0] - 1).toBeGreaterThan(0.25);
    expect(approximation / out[0] - 1).toBeLessThan(0.45);
  });

  it('an airless field: day side max(S (1 - A) mu, night floor) over the cap matches brute force within 1 % (radiative equilibrium, Vasavada et al. 2012, from memory)', () => {
    const field: SurfaceField = { bondAlbedo: 0.68, emissivity: 0.93, nightFloorK: 90 };
    const flux = solarFluxWm2(5.2);
    const day = flux * (1 - field.bondAlbedo);
    const floor = field.emissivity * STEFAN_BOLTZMANN * 90 ** 4;
    for (const h of [1.1, 2]) {
      for (const [tilt, beta, angle] of [[0, 0, 80], [90, 30, 100], [60, 10, 170]]) {
        const [n, s] = [plateAt(tilt, 40), sunAt(beta, angle)];
        plateFluxes(plateNodes(capNodes(h), n[0], n[1], n[2]), s[0], s[1], s[2], 0, day, floor, out);
        const reference = bruteForce(h, n, s, (mu) => Math.max(day * mu, floor));
        expect(Math.abs(out[1] / reference - 1)).toBeLessThan(0.01);
      }
    }
  });

  it('the whole-body mean exitance is (1 - A) S / 4 plus the floor on the night side (energy balance)', () => {
    const field: SurfaceField = { bondAlbedo: 0.11, emissivity: 0.95, nightFloorK: 0 };
    expect(meanExitanceWm2(field, 1361)).toBeCloseTo((0.89 * 1361) / 4, 9);
  });
});

describe('airless surface temperatures by solar zenith angle', () => {
  const moon = getBody('moon');
  const mercury = getBody('mercury');
  const fieldOf = (body: typeof moon, bondAlbedo = body.albedo.nominal): SurfaceField => ({
    bondAlbedo, emissivity: body.airless?.emissivity.nominal ?? 1, nightFloorK: body.airless?.nightFloorK.nominal ?? 0,
  });

  it('Moon: about 390 K at the subsolar point, falling as cos(z)^(1/4), about 95-100 K at night (LRO Diviner, Williams et al. 2017, Icarus 283; from memory)', () => {
    const field = fieldOf(moon);
    const subsolar = surfaceTemperatureK(field, 1361, 1);
    expect(subsolar).toBeGreaterThan(380);
    expect(subsolar).toBeLessThan(400);
    // radiative equilibrium: T(z) = T(0) cos(z)^(1/4) on the day side
    expect(surfaceTemperatureK(field, 1361, Math.cos(60 * DEG))).toBeCloseTo(subsolar * Math.cos(60 * DEG) ** 0.25, 6);
    expect(surfaceTemperatureK(field, 1361, Math.cos(89.9 * DEG))).toBe(field.nightFloorK);
    expect(surfaceTemperatureK(field, 1361, -0.5)).toBeGreaterThanOrEqual(95);
    expect(surfaceTemperatureK(field, 1361, -0.5)).toBeLessThanOrEqual(100);
    // the hot end of the published ranges stays near Diviner's hottest equatorial noon (about 400 K, from memory)
    const hot = { ...field, bondAlbedo: moon.albedo.min, emissivity: moon.airless?.emissivity.max ?? 1 };
    expect(surfaceTemperatureK(hot, 1361 * 1.034, 1)).toBeLessThan(405);
  });

  it('Mercury: about 700 K at the subsolar point at perihelion, about 100 K at night (Vasavada, Paige & Wood 1999, Icarus 141; from memory)', () => {
    const field = fieldOf(mercury);
    const perihelionAu = mercury.semiMajorAxisAu * (1 - mercury.eccentricity);
    const subsolar = surfaceTemperatureK(field, solarFluxWm2(perihelionAu), 1);
    expect(subsolar).toBeGreaterThan(680);
    expect(subsolar).toBeLessThan(720);
    expect(surfaceTemperatureK(field, solarFluxWm2(perihelionAu), -1)).toBe(100);
  });
});

describe('airless bodies through the compute route', () => {
  const radiator = { name: 'radiator', normal: 'nadir' as const, areaM2: 1, absorptivity: 0.2, emissivity: 0.85 };

  it('a nadir radiator over the lunar night gets a few W/m^2 of IR, not the uniform 271 W/m^2 (LRO Diviner night about 95-100 K, Williams et al. 2017; from memory)', () => {
    // beta 0, 100 km circular: at tS = T/2 from the node... the point farthest from the Sun is where cos(z) of the sub-point is -1
    const answer = computeEnvironment({
      bodyId: 'moon', orbit: { periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 90 }, betaDeg: 0, solarDistanceAu: 1, steps: 360, surfaces: [radiator],
    });
    const ir = answer.profile.map((p) => p.surfaces[0]!.irWm2);
    const F = (1738.1 / 1838.1) ** 2;
    expect(Math.min(...ir)).toBeLessThan(10);
    expect(Math.min(...ir)).toBeCloseTo(0.95 * STEFAN_BOLTZMANN * 100 ** 4 * F, 3);
    // over the subsolar point: about S (1 - A) F, the day side's equilibrium exitance
    expect(Math.max(...ir) / (1361 * 0.89 * F)).toBeGreaterThan(0.97);
    expect(answer.irModel).toBe('surface-temperature');
    expect(answer.assumptions.join(' ')).toContain('radiative equilibrium');
  });

  it('a nadir plate over Mercury\'s subsolar point at perihelion gets about six times the uniform OLR\'s IR (issue 13, from the 700 K subsolar figure; from memory)', () => {
    const orbit = { periapsisAltitudeKm: 200, apoapsisAltitudeKm: 200, inclinationDeg: 90 };
    const common = { bodyId: 'mercury', orbit, betaDeg: 0, solarDistanceAu: 0.3075, steps: 360, surfaces: [radiator] };
    const field = Math.max(...computeEnvironment(common).profile.map((p) => p.surfaces[0]!.irWm2));
    const uniform = Math.max(...computeEnvironment({ ...common, irModel: 'uniform' }).profile.map((p) => p.surfaces[0]!.irWm2));
    expect(field / uniform).toBeGreaterThan(5);
    expect(field / uniform).toBeLessThan(7);
  });

  it('a body with an atmosphere keeps the uniform OLR and, in low orbit, the engineering albedo (stated default)', () => {
    const answer = computeEnvironment({
      bodyId: 'earth', orbit: { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550 }, betaDeg: 0, steps: 36, surfaces: [radiator],
    });
    expect([answer.irModel, answer.albedoModel, answer.surfaceField]).toEqual(['uniform', 'subsolar-cosine', null]);
    const geo = computeEnvironment({ bodyId: 'earth', orbit: { semiMajorAxisKm: 42164, eccentricity: 0 }, betaDeg: 0, steps: 36, surfaces: [radiator] });
    expect(geo.albedoModel).toBe('lambertian');
  });
});
