import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { computeEnvironment, computeEnvironmentColumns, type EnvironmentRequest } from './environment';
import { plateToSphereViewFactor } from './view-factors';

const R = getBody('earth').radiusKm;
const request: EnvironmentRequest = {
  bodyId: 'earth',
  orbit: { periapsisAltitudeKm: 500, apoapsisAltitudeKm: 4000, inclinationDeg: 63.4, raanDeg: 20, argPeriapsisDeg: 270 },
  epoch: '2027-06-21T00:00:00Z', albedo: 0.3, olrWm2: 237, steps: 240,
  surfaces: [
    { name: 'nadir panel', normal: 'nadir', areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 },
    { name: 'array', normal: 'sun', areaM2: 1.2, absorptivity: 0.9, emissivity: 0.8 },
    { name: 'tilted', normal: { x: 0.6, y: 0, z: -0.8 }, areaM2: 0.2, absorptivity: 0.4, emissivity: 0.5 },
  ],
};

describe('computeEnvironmentColumns (the compute route\'s physics in arrays)', () => {
  const columns = computeEnvironmentColumns(request);
  const answer = computeEnvironment(request);
  const { loads, averages } = columns;

  it('the API answer is built from the columns: every profile value, average and peak is the column\'s (consistency, no source)', () => {
    expect(answer.profile).toHaveLength(240);
    for (const [k, point] of answer.profile.entries()) {
      expect(point.tS).toBe(columns.grid.tS[k]);
      expect(point.sunlit).toBe(columns.shade.sunlit[k]);
      point.surfaces.forEach((s, j) => {
        expect([s.name, s.solarWm2, s.albedoWm2, s.irWm2, s.absorbedW])
          .toEqual([loads.names[j], loads.solarWm2[j][k], loads.albedoWm2[j][k], loads.irWm2[j][k], loads.absorbedW[j][k]]);
      });
    }
    expect(answer.orbitAverage.surfaces.map((s) => s.absorbedW)).toEqual([...averages.absorbedW]);
    expect(answer.peak.surfaces.map((s) => s.irWm2)).toEqual([...loads.peaks.irWm2]);
    expect(answer.eclipseFraction).toBe(columns.eclipse.eclipseFraction);
  });

  it('averages are the column means; an eccentric orbit\'s peaks are at least the column maxima (searched between samples too) (definition, no source)', () => {
    for (const component of ['solarWm2', 'albedoWm2', 'irWm2', 'absorbedW'] as const) {
      loads[component].forEach((values, j) => {
        expect(averages[component][j]).toBeCloseTo(values.reduce((sum, v) => sum + v, 0) / values.length, 9);
        expect(loads.peaks[component][j]).toBeGreaterThanOrEqual(Math.max(...values));
      });
    }
  });

  it('a Sun-pointed surface sees S times the sunlit share (cos incidence 1), and IR is OLR F with Howell\'s nadir factor (R/r)^2', () => {
    const radius = columns.grid.radiusKm;
    for (let k = 0; k < 240; k++) {
      expect(loads.solarWm2[1][k]).toBeCloseTo(columns.solarFluxWm2 * columns.shade.sunlit[k], 9);
      expect(loads.irWm2[0][k]).toBeCloseTo(237 * (R / radius[k]) ** 2, 9);
      expect(loads.irWm2[2][k]).toBeCloseTo(237 * plateToSphereViewFactor(radius[k], R, Math.acos(0.8)), 9);
    }
    // the orbit is elliptical, so the nadir IR must vary along it: the check above is not of a constant
    expect(Math.max(...loads.irWm2[0]) / Math.min(...loads.irWm2[0])).toBeGreaterThan(1.5);
  });

  it('absorbed = A (alpha (solar + albedo) + epsilon IR) at every sample (API.md)', () => {
    request.surfaces.forEach((s, j) => {
      for (let k = 0; k < 240; k += 7) {
        const expected = s.areaM2 * (s.absorptivity * (loads.solarWm2[j][k] + loads.albedoWm2[j][k]) + s.emissivity * loads.irWm2[j][k]);
        expect(loads.absorbedW[j][k]).toBeCloseTo(expected, 9);
      }
    });
  });
});
