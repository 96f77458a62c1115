import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bruteForceCapFlux } from './cap-brute-force';
import { plateToSphereViewFactor } from './view-factors';

const DEG = Math.PI / 180;

/** Numerical view factor: the brute-force cap integral with a uniform exitance of 1 (cap-brute-force.ts). */
const numericViewFactor = (h: number, tiltRad: number, nPsi = 500, nPhi = 720): number =>
  bruteForceCapFlux(h, [Math.sin(tiltRad), 0, -Math.cos(tiltRad)], [0, 0, 1], () => 1, nPsi, nPhi);

describe('plate-to-sphere view factor', () => {
  it('a nadir plate sees F = (R/(R+h))^2 (DOMAIN.md; Howell catalogue)', () => {
    for (const h of [200, 400, 800, 35786]) {
      expect(plateToSphereViewFactor(6378 + h, 6378, 0)).toBeCloseTo((6378 / (6378 + h)) ** 2, 14);
    }
  });

  it('the closed form matches numerical integration over the visible cap for tilts 0..180 deg at 400 km, 2000 km and GEO', () => {
    for (const altitudeKm of [400, 2000, 35786]) {
      const h = (6378 + altitudeKm) / 6378;
      for (let tilt = 0; tilt <= 180; tilt += 15) {
        const closed = plateToSphereViewFactor(h, 1, tilt * DEG);
        expect(Math.abs(closed - numericViewFactor(h, tilt * DEG, 300, 480))).toBeLessThan(3e-4);
      }
    }
  });

  it('closed form vs numerical integration for random altitudes and tilts (property, fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1.01, max: 8, noNaN: true }), fc.double({ min: 0, max: Math.PI, noNaN: true }), (h, tilt) => {
        expect(Math.abs(plateToSphereViewFactor(h, 1, tilt) - numericViewFactor(h, tilt, 200, 360))).toBeLessThan(6e-4);
      }),
      { numRuns: 25 },
    );
  });

  it('is continuous where the plate\'s plane starts to cut the sphere, tilt = acos(R/r) (Howell: both branches meet)', () => {
    const h = 1.2;
    const edge = Math.acos(1 / h);
    expect(plateToSphereViewFactor(h, 1, edge + 1e-9)).toBeCloseTo(plateToSphereViewFactor(h, 1, edge - 1e-9), 7);
    expect(plateToSphereViewFactor(h, 1, Math.PI - edge - 1e-6)).toBeCloseTo(0, 5);
  });

  it('a vertical plate at the surface sees half its hemisphere filled by the ground: F -> 1/2 (common practice, no source)', () => {
    expect(plateToSphereViewFactor(1.000001, 1, 90 * DEG)).toBeCloseTo(0.5, 2);
  });

  it('a zenith plate in low orbit sees nothing of the body (geometry)', () => {
    expect(plateToSphereViewFactor(6778, 6378, Math.PI)).toBe(0);
  });
});
