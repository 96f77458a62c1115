// The order of the thermal solver's time stepping. The method is BDF2 (the two-step backward
// differentiation formula, second order; Hairer & Wanner, Solving Ordinary Differential Equations II,
// sec. V.1), with backward Euler only for the very first step. Against a closed-form periodic solution,
// halving the step should divide the error by about 2^2 = 4.
// Closed form: one node of capacitance C tied by G to a wall at T_w, under Q0 + Q1 sin(w t), has the
// periodic solution T = T_w + Q0/G + Q1 (G sin(w t) - C w cos(w t)) / (G^2 + (C w)^2)
// (the steady sinusoidal response of a first-order system; Incropera Ch. 5, from memory for the form).
import { describe, expect, it } from 'vitest';
import { KELVIN_OFFSET, type ThermalModelInput } from './thermal-model';
import { buildNetwork } from './thermal-network';
import { runPeriodic } from './thermal-periodic';

const periodS = 5739;
const C = 2e4;
const G = 2;
const Q0 = 40;
const Q1 = 50;
const wallC = -20;
const w = (2 * Math.PI) / periodS;
const exactC = (t: number) => wallC + Q0 / G + (Q1 * (G * Math.sin(w * t) - C * w * Math.cos(w * t))) / (G * G + (C * w) ** 2);

/** The largest difference from the closed form over the periodic orbit with `steps` steps per orbit, K. */
function errorWith(steps: number): number {
  const model: ThermalModelInput = {
    periodS, steps,
    nodes: [
      { name: 'mass', capacitanceJK: C, initialC: 0, absorbedW: Array.from({ length: steps }, (_, s) => Q0 + Q1 * Math.sin((w * s * periodS) / steps)) },
      { name: 'wall', initialC: wallC, fixedC: wallC },
    ],
    couplings: [{ from: 'mass', to: 'wall', conductanceWK: G }],
  };
  const net = buildNetwork(model);
  const run = runPeriodic(model, net, [], { toleranceK: 1e-9, maxOrbits: 400 });
  expect(run.settled).toBe(true);
  let worst = 0;
  run.samplesK[0].forEach((k, s) => (worst = Math.max(worst, Math.abs(k - KELVIN_OFFSET - exactC((s * periodS) / steps)))));
  return worst;
}

describe('time stepping converges at its stated order: BDF2, second order (Hairer & Wanner II, V.1)', () => {
  it('halving the step divides the error against the closed-form periodic solution by about 4 (2^p, p = 2)', () => {
    const errors = [30, 60, 120, 240].map(errorWith);
    const ratios = errors.slice(1).map((e, k) => errors[k] / e);
    for (const ratio of ratios) {
      expect(ratio).toBeGreaterThan(3.8);
      expect(ratio).toBeLessThan(4.2);
    }
    // Measured: 0.0325, 0.0082, 0.0021, 0.00052 K at 30, 60, 120, 240 steps (ratios 3.95, 3.99, 4.00).
    // and the error is small in absolute terms at the usual 120-360 steps per orbit
    expect(errors[2]).toBeLessThan(0.05);
  });
});
