import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { heatLoadFactor } from './design-environment';
import { osculatingOrbit, withMargins } from './trajectory-case';

describe('the heat-load margin (MIL-STD-1540 via Gilmore Vol. I ch. 19: hot cases add it, cold cases take it off)', () => {
  it('is 1.25 on a hot case and 0.75 on a cold one at the default 25 %', () => {
    expect(heatLoadFactor(25, 'increase')).toBe(1.25);
    expect(heatLoadFactor(25, 'decrease')).toBe(0.75);
  });

  it('moves only the margin columns of stored results', () => {
    const results = {
      surfaces: [{ name: 'a', orbitAverage: { absorbedW: 40, absorbedWithMarginW: 50 } }],
      total: { orbitAverageAbsorbedW: 40, orbitAverageWithMarginW: 50, peakAbsorbedW: 90 },
    };
    const moved = withMargins(results, { heatLoadPercent: 30 }, 'increase');
    expect(moved.surfaces[0]!.orbitAverage).toEqual({ absorbedW: 40, absorbedWithMarginW: 52 });
    expect(moved.total).toEqual({ orbitAverageAbsorbedW: 40, orbitAverageWithMarginW: 52, peakAbsorbedW: 90 });
    expect(withMargins(results, { heatLoadPercent: 30 }, 'decrease').total.orbitAverageWithMarginW).toBe(28);
  });
});

describe('osculatingOrbit', () => {
  it('gives the apsides above the surface and the period by Kepler\'s third law (Vallado ch. 2: a 7000 km Earth orbit takes 5828.5 s)', () => {
    const earth = getBody('earth');
    const orbit = osculatingOrbit({ semiMajorAxisKm: 7000, eccentricity: 0.01, inclinationDeg: 51.6, raanDeg: 10, argPeriapsisDeg: 20, trueAnomalyDeg: 0, pKm: 6999.3 }, earth);
    expect(orbit.periodS).toBeCloseTo(5828.5, 0);
    expect(orbit.periapsisAltitudeKm).toBeCloseTo(6930 - earth.radiusKm, 9);
    expect(orbit.apoapsisAltitudeKm).toBeCloseTo(7070 - earth.radiusKm, 9);
  });
});
