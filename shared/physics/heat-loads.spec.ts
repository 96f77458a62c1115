import { describe, expect, it } from 'vitest';
import { absorbedW, localNormal, surfaceLoad, type LoadPoint, type Surface } from './heat-loads';
import { PhysicsError } from './physics-error';

const R = 6378.137;
const r = R + 550;
const F_NADIR = (R / r) ** 2;
const plate = (normal: Surface['normal']): Surface => ({ name: 'p', normal, areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 });
const point = (sunLocal: [number, number, number], sunlit = 1): LoadPoint => ({
  sunLocal, sunlit, solarFluxWm2: 1361, albedo: 0.3, olrWm2: 237, radiusKm: r, bodyRadiusKm: R,
});

describe('heat loads on flat plates', () => {
  it('over the subsolar point a nadir plate gets S a F and OLR F, F = (R/(R+h))^2 (DOMAIN.md common approximation; Howell)', () => {
    const load = surfaceLoad(plate('nadir'), localNormal('nadir', [0, 0, 1]), point([0, 0, 1]));
    expect(load.solarWm2).toBe(0);
    expect(load.albedoWm2).toBeCloseTo(1361 * 0.3 * F_NADIR, 10);
    expect(load.irWm2).toBeCloseTo(237 * F_NADIR, 10);
  });

  it('absorbed = A (alpha (solar + albedo) + epsilon ir) (API.md)', () => {
    const s = plate('nadir');
    expect(absorbedW(s, 100, 200, 300)).toBeCloseTo(0.5 * (0.25 * 300 + 0.85 * 300), 12);
  });

  it('albedo falls as cos of the solar zenith angle and vanishes on the night side (DOMAIN.md [P])', () => {
    const n = localNormal('nadir', [0, 0, 1]);
    const at60 = surfaceLoad(plate('nadir'), n, point([Math.sin(Math.PI / 3), 0, Math.cos(Math.PI / 3)]));
    expect(at60.albedoWm2).toBeCloseTo(1361 * 0.3 * F_NADIR * 0.5, 10);
    expect(surfaceLoad(plate('nadir'), n, point([0, 0, -1], 0)).albedoWm2).toBe(0);
  });

  it('a Sun-pointed plate gets the full flux in sunlight, a share in penumbra and none in umbra (inverse square, Lambert)', () => {
    const sun: [number, number, number] = [0.6, 0, 0.8];
    expect(surfaceLoad(plate('sun'), localNormal('sun', sun), point(sun)).solarWm2).toBeCloseTo(1361, 10);
    expect(surfaceLoad(plate('sun'), localNormal('sun', sun), point(sun, 0.4)).solarWm2).toBeCloseTo(544.4, 10);
    expect(surfaceLoad(plate('sun'), localNormal('sun', sun), point(sun, 0)).solarWm2).toBe(0);
  });

  it('a custom vector {x: 1, y: 0, z: 0} is the ram face; a zenith plate in LEO sees no albedo or IR', () => {
    const sun: [number, number, number] = [0.6, 0, 0.8];
    const custom = surfaceLoad(plate({ x: 2, y: 0, z: 0 }), localNormal({ x: 2, y: 0, z: 0 }, sun), point(sun));
    const ram = surfaceLoad(plate('ram'), localNormal('ram', sun), point(sun));
    expect(custom).toEqual(ram);
    expect(ram.solarWm2).toBeCloseTo(1361 * 0.6, 10);
    const zenith = surfaceLoad(plate('zenith'), localNormal('zenith', sun), point(sun));
    expect([zenith.albedoWm2, zenith.irWm2]).toEqual([0, 0]);
  });

  it('refuses a zero-length normal', () => {
    expect(() => localNormal({ x: 0, y: 0, z: 0 }, [0, 0, 1], 'surfaces.0.normal')).toThrow(PhysicsError);
  });
});
