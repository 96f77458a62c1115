// The orbit-end correction (thermal-orbit-correction.ts) on a node whose periodic state is known in
// closed form: one node of capacitance C tied by a conductance G to a wall at T_w, under a constant
// load Q. Its periodic state is the steady state T* = T_w + Q/G; from T0 an orbit of period P ends at
// T* + (T0 - T*) e^-x, x = P G / C (the lumped-capacitance exponential, Incropera, Fundamentals of
// Heat and Mass Transfer, Ch. 5). The exact distance from that end to the periodic state is
// F / (e^x - 1) for the orbit's drift F. The correction's rational form 1/x - (1/2)/(1 + x/6) matches
// it to second order at small x (slow nodes, where it matters); from x = 3 on it is no estimate of
// the distance (zero, then slightly negative), but there the orbit itself has closed all but e^-x of
// the gap. What the solver relies on is the corrected orbit map: the error left after an orbit and its
// jump, e0 (e^-x - f(x) (1 - e^-x)), is under a tenth of the error e0 it started with, for every x.
import { describe, expect, it } from 'vitest';
import { KELVIN_OFFSET, type ThermalModelInput } from './thermal-model';
import { ThermalControllers } from './thermal-controllers';
import { OrbitCorrection } from './thermal-orbit-correction';
import { buildNetwork } from './thermal-network';
import { solveThermal } from './thermal-solver';

const periodS = 5739;
const G = 2;
const Q = 30;
const wallC = -10;
const model = (capacitanceJK: number): ThermalModelInput => ({
  periodS, steps: 120,
  nodes: [{ name: 'mass', capacitanceJK, initialC: 40, dissipationW: Q }, { name: 'wall', initialC: wallC, fixedC: wallC }],
  couplings: [{ from: 'mass', to: 'wall', conductanceWK: G }],
});

/** For one orbit from T0 = 40 C: the correction's estimate, the exact distance, and the error left after the jump over the error before the orbit. */
function oneOrbit(x: number): { estimate: number; exact: number; shrink: number } {
  const m = model((periodS * G) / x);
  const net = buildNetwork(m);
  const starK = wallC + Q / G + KELVIN_OFFSET;
  const startK = 40 + KELVIN_OFFSET;
  const endK = starK + (startK - starK) * Math.exp(-x);
  const out = new Float64Array(1);
  new OrbitCorrection(net).distance(Float64Array.of((startK + endK) / 2), Float64Array.of(endK - startK), periodS, new ThermalControllers(m, net, []), new Float64Array(0), out);
  return { estimate: out[0], exact: starK - endK, shrink: (endK + out[0] - starK) / (startK - starK) };
}

describe('orbit-end correction against the closed-form periodic state of one node on a wall (Incropera Ch. 5)', () => {
  for (const x of [1e-4, 0.01, 0.1]) {
    // Relative error: the series' x^3 / 72 (bounded here by x^2 / 12), plus the 1e-9 / x the solver's
    // regularisation (C / (1e9 P) on the diagonal, so an unconnected node still factors) adds.
    it(`a slow node (x = P G / C = ${x}) is placed on its periodic state: the estimate is within x^2 / 12 + 2e-9 / x of the exact distance, relatively`, () => {
      const { estimate, exact } = oneOrbit(x);
      expect(Math.abs(estimate - exact) / Math.abs(exact)).toBeLessThan((x * x) / 12 + 2e-9 / x);
    });
  }

  it('for any time constant the error left after an orbit and its jump is under a tenth of the error before it (x from 1e-3 to 100)', () => {
    for (let x = 1e-3; x <= 100; x *= 1.25) {
      const { shrink } = oneOrbit(x);
      expect(Math.abs(shrink), `x = ${x}`).toBeLessThan(0.1);
    }
  });

  it('with the correction, a node with a 100 000-orbit time constant settles on T_w + Q/G within 0.01 K in a handful of orbits', () => {
    const r = solveThermal({ ...model((periodS * G) * 1e5), start: 'initial' });
    expect(r.converged).toBe(true);
    expect(r.orbits).toBeLessThan(20);
    expect(Math.abs(r.nodes[0].meanC - (wallC + Q / G))).toBeLessThan(0.01);
  });
});
