import { describe, expect, it } from 'vitest';
import { STEFAN_BOLTZMANN as SIGMA } from './constants';
import { absorbedAtScale, distancePoint, perihelionAphelion, solarScaleAt } from './thermal-distance-study';
import type { ThermalSolveInput } from './thermal-model';

const K0 = 273.15;

describe('distance study', () => {
  it('scales solar flux by the inverse square of the distance (TSI 1361 W/m^2 at 1 AU, IAU 2015 B3): Mars at 1.524 AU gets 0.43 of 1 AU', () => {
    expect(solarScaleAt(1, 1361)).toBeCloseTo(1, 12);
    expect(solarScaleAt(1.524, 1361)).toBeCloseTo(1 / 1.524 ** 2, 12);
    // A case derived at perihelion (1414 W/m^2, 0.983 AU) moved to 1 AU: 1361 / 1414.
    expect(solarScaleAt(1, 1414)).toBeCloseTo(1361 / 1414, 12);
  });

  it('scales solar and albedo loads and keeps planetary IR (IR is the planet\'s own emission; from memory, Gilmore ch. 2)', () => {
    const w = absorbedAtScale({ solarW: [100, 0], albedoW: [20, 0], irW: [30, 30] }, 0.5);
    expect(w).toEqual([90, 30]);
  });

  it('takes Earth\'s perihelion and aphelion as a(1 - e), a(1 + e) (e = 0.0167: 0.983 and 1.017 AU, JPL mean elements)', () => {
    const [peri, aph] = perihelionAphelion('earth');
    expect(peri?.distanceAu).toBeCloseTo(0.983, 3);
    expect(aph?.distanceAu).toBeCloseTo(1.017, 3);
  });

  // At constant load and no control the radiator holds T_max when eps sigma A T^4 = Q_diss + A q_abs (d),
  // q_abs per m^2 of radiator scaled by (1 AU / d)^2: A = Q / (eps sigma T^4 - q_abs (1/d)^2) (radiator
  // equation, Gilmore, Spacecraft Thermal Control Handbook vol. 1; DOMAIN.md).
  for (const d of [0.723, 1, 1.524]) {
    it(`sizes the radiator at ${d} AU as the closed-form Stefan-Boltzmann balance`, () => {
      const qAbs = 150; // W/m^2 of radiator at 1 AU
      const areaM2 = 0.2;
      const scale = solarScaleAt(d, 1361);
      const model: ThermalSolveInput = {
        periodS: 5739, steps: 60,
        nodes: [{ name: 'radiator', capacitanceJK: 9000, initialC: 10, dissipationW: 80, absorbedW: absorbedAtScale({ solarW: [qAbs * areaM2], albedoW: [0], irW: [0] }, scale)[0] ?? 0, radiatorAreaM2: areaM2, emissivity: 0.85, maxC: 30 }],
      };
      const point = distancePoint(model, 'radiator', 0);
      const expected = 80 / (0.85 * SIGMA * (30 + K0) ** 4 - qAbs * scale);
      expect(point.solveRefused).toBeNull();
      expect(point.loops).toEqual([]);
      expect(expected).toBeGreaterThan(0);
      expect(Math.abs((point.radiator?.areaM2 ?? 0) - expected) / expected).toBeLessThan(2e-3);
    });
  }
});
