import { describe, expect, it } from 'vitest';
import { STEFAN_BOLTZMANN as SIGMA } from './constants';
import { DEFAULT_MAX_HEATER_DUTY, ThermalModelError, type ThermalSolveInput } from './thermal-model';
import { heaterPowerFor, radiatorAreaFor } from './thermal-sizing';

const K0 = 273.15;

describe('radiator sizing', () => {
  it('with constant loads matches the radiator equation A = Q / (eps sigma T^4 - q_abs) (DOMAIN.md; Gilmore)', () => {
    const model: ThermalSolveInput = {
      periodS: 5739, steps: 120,
      nodes: [{ name: 'radiator', capacitanceJK: 9000, initialC: 10, dissipationW: 50, absorbedW: 20, radiatorAreaM2: 0.2, emissivity: 0.85, maxC: 30 }],
    };
    const r = radiatorAreaFor(model, 'radiator', 5);
    // T = max - margin = 25 C; q_abs = 20 W / 0.2 m^2 absorbed per m^2 of radiator
    const expected = 50 / (0.85 * SIGMA * (25 + K0) ** 4 - 20 / 0.2);
    expect(r.equationAreaM2).toBeCloseTo(expected, 8);
    expect(Math.abs(r.areaM2 - expected) / expected).toBeLessThan(2e-3);
    expect(r.achievedMaxC).toBeLessThanOrEqual(25 + 1e-9);
  });

  it('with a sunlit/eclipse load needs more area than the orbit-average equation, since the peak sets it (common practice)', () => {
    const absorbedW = Array.from({ length: 120 }, (_, s) => (s < 78 ? 40 : 0));
    const model: ThermalSolveInput = {
      periodS: 5739, steps: 120,
      nodes: [{ name: 'radiator', capacitanceJK: 3000, initialC: 10, dissipationW: 50, absorbedW, radiatorAreaM2: 0.2, emissivity: 0.85, maxC: 30 }],
    };
    const r = radiatorAreaFor(model, 'radiator', 0);
    expect(r.areaM2).toBeGreaterThan(r.equationAreaM2 ?? Infinity);
    expect(r.achievedMaxC).toBeLessThanOrEqual(30 + 1e-9);
    expect(r.achievedMaxC).toBeGreaterThan(29.9);
  });
});

describe('heater sizing', () => {
  const cold = (onC: number): ThermalSolveInput => ({
    periodS: 5739, steps: 120,
    nodes: [{ name: 'battery', capacitanceJK: 9000, initialC: 10, minC: 0 }, { name: 'wall', initialC: -20, fixedC: -20 }],
    couplings: [{ from: 'battery', to: 'wall', conductanceWK: 0.5 }],
    heaters: [{ node: 'battery', powerW: 5, onC, offC: onC + 3, busVoltage: { nominalV: 28, minV: 24, maxV: 32 } }],
  });

  it('sizes the power so the duty cycle at minimum voltage is the 75 % limit (energy balance; DOMAIN.md 70-80 % [M])', () => {
    const r = heaterPowerFor(cold(6), 'battery', 5);
    expect(r.maxDutyCycle).toBe(DEFAULT_MAX_HEATER_DUTY);
    expect(r.dutyCycleAtMinVoltage).toBeLessThanOrEqual(0.75);
    expect(r.dutyCycleAtMinVoltage).toBeGreaterThan(0.74);
    // Needed power: G (T_mean - T_wall) with the band's middle, 7.5 C; installed = needed / (0.75 (24/28)^2)
    const needed = 0.5 * (7.5 + 20);
    expect(r.powerW).toBeCloseTo(needed / (0.75 * (24 / 28) ** 2), 0);
    expect(r.powerAtMinVoltageW).toBeCloseTo(r.powerW * (24 / 28) ** 2, 6);
    expect(r.achievedMinC).toBeGreaterThanOrEqual(5);
  });

  it('refuses a thermostat that switches on below the minimum plus margin', () => {
    expect(() => heaterPowerFor(cold(2), 'battery', 5)).toThrow(ThermalModelError);
    expect(() => heaterPowerFor(cold(2), 'battery', 5)).toThrow(/switches on at 2 °C, below the 5 °C/);
  });
});
