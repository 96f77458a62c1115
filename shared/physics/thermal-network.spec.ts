import { describe, expect, it } from 'vitest';
import { STEFAN_BOLTZMANN as SIGMA } from './constants';
import { periodicFirstOrderLag } from './thermal-closed-forms';
import { ThermalConvergenceError, type ThermalSolveInput } from './thermal-model';
import { solveThermal } from './thermal-solver';

const K0 = 273.15;
const orbit = { periodS: 5739, steps: 360 };

describe('thermal solver against analytic results', () => {
  it('one radiating node settles where Q = eps sigma A T^4 (Stefan-Boltzmann law)', () => {
    const r = solveThermal({ ...orbit, nodes: [{ name: 'box', capacitanceJK: 9000, initialC: 10, dissipationW: 100, radiatorAreaM2: 0.5, emissivity: 0.85 }] });
    const expected = (100 / (0.85 * SIGMA * 0.5)) ** 0.25 - K0;
    expect(r.nodes[0].meanC).toBeCloseTo(expected, 2);
    expect(r.nodes[0].maxC - r.nodes[0].minC).toBeLessThan(0.01);
  });

  it('with a sink: Q = eps sigma A (T^4 - T_sink^4) (Stefan-Boltzmann law, net exchange with a black sink)', () => {
    const r = solveThermal({ ...orbit, nodes: [{ name: 'box', capacitanceJK: 9000, initialC: 10, dissipationW: 40, radiatorAreaM2: 0.3, emissivity: 0.9, sinkC: -40 }] });
    const expected = (40 / (0.9 * SIGMA * 0.3) + (K0 - 40) ** 4) ** 0.25 - K0;
    expect(r.nodes[0].meanC).toBeCloseTo(expected, 2);
  });

  it('a node switched on and off follows the lumped-capacitance exponential, tau = C/G (Incropera, Fundamentals of Heat and Mass Transfer, Ch. 5)', () => {
    const C = 9000;
    const G = 1.5;
    const periodS = 6000;
    const onS = 2000;
    const q = 30;
    const r = solveThermal({
      periodS, steps: 600,
      nodes: [
        { name: 'unit', capacitanceJK: C, initialC: 0, dissipationW: { onW: q, periodS, onS } },
        { name: 'plate', initialC: 0, fixedC: 0 },
      ],
      couplings: [{ from: 'unit', to: 'plate', conductanceWK: G }],
    });
    // Periodic solution of C dT/dt = Q - G T: rise toward Q/G while on, decay toward 0 while off.
    const { at: exact, low, high } = periodicFirstOrderLag(q, G, C, onS, periodS);
    r.tS.forEach((t, k) => expect(Math.abs(r.nodes[0].temperaturesC[k] - exact(t))).toBeLessThan(0.02));
    expect(r.nodes[0].maxC).toBeCloseTo(high, 1);
    expect(r.nodes[0].minC).toBeCloseTo(low, 1);
  });

  it('two nodes in conduction to a wall match the series-resistance solution (Incropera Ch. 3)', () => {
    const r = solveThermal({
      ...orbit,
      nodes: [
        { name: 'board', capacitanceJK: 800, initialC: 20, dissipationW: 12 },
        { name: 'bracket', capacitanceJK: 300, initialC: 20 },
        { name: 'deck', initialC: 10, fixedC: 10 },
      ],
      couplings: [{ from: 'board', to: 'bracket', conductanceWK: 0.6 }, { from: 'bracket', to: 'deck', conductanceWK: 2 }],
    });
    // T_board = T_deck + Q (R1 + R2), R = 1/G
    expect(r.nodes[0].meanC).toBeCloseTo(10 + 12 * (1 / 0.6 + 1 / 2), 2);
    expect(r.nodes[1].meanC).toBeCloseTo(10 + 12 / 2, 2);
    expect(r.nodes[2].temperaturesC.every((t) => t === 10)).toBe(true);
  });

  it('radiative exchange sigma A eps F (T1^4 - T2^4) between two nodes (Stefan-Boltzmann; Incropera Ch. 13)', () => {
    const r = solveThermal({
      ...orbit,
      nodes: [
        { name: 'box', capacitanceJK: 2000, initialC: 20, dissipationW: 20 },
        { name: 'panel', capacitanceJK: 4000, initialC: 0, radiatorAreaM2: 0.4, emissivity: 0.85 },
      ],
      radiativeCouplings: [{ from: 'box', to: 'panel', areaM2: 0.3, effectiveEmissivity: 0.6, viewFactor: 0.8 }],
    });
    const panelK = (20 / (0.85 * SIGMA * 0.4)) ** 0.25;
    const boxK = (panelK ** 4 + 20 / (SIGMA * 0.3 * 0.6 * 0.8)) ** 0.25;
    expect(r.nodes[1].meanC).toBeCloseTo(panelK - K0, 2);
    expect(r.nodes[0].meanC).toBeCloseTo(boxK - K0, 2);
  });

  it('a stiff network (1 J/K bracket on 1000 W/K) stays stable and lands on the series solution (Incropera Ch. 3)', () => {
    const r = solveThermal({
      ...orbit,
      nodes: [
        { name: 'sensor', capacitanceJK: 1, initialC: 0, dissipationW: 5 },
        { name: 'mount', capacitanceJK: 50000, initialC: 0 },
        { name: 'wall', initialC: -10, fixedC: -10 },
      ],
      couplings: [{ from: 'sensor', to: 'mount', conductanceWK: 1000 }, { from: 'mount', to: 'wall', conductanceWK: 0.5 }],
    });
    expect(r.nodes[1].meanC).toBeCloseTo(-10 + 5 / 0.5, 2);
    expect(r.nodes[0].meanC).toBeCloseTo(-10 + 5 / 0.5 + 5 / 1000, 2);
  });
});

describe('heaters and loops against energy balances', () => {
  const heated = (heater: Partial<NonNullable<ThermalSolveInput['heaters']>[number]>): ThermalSolveInput => ({
    ...orbit,
    nodes: [{ name: 'battery', capacitanceJK: 9000, initialC: 10, minC: 0, maxC: 30 }, { name: 'wall', initialC: -20, fixedC: -20 }],
    couplings: [{ from: 'battery', to: 'wall', conductanceWK: 0.5 }],
    heaters: [{ node: 'battery', powerW: 30, onC: 3, offC: 6, ...heater }],
  });

  it('a thermostat on a constant load: duty cycle = power needed / power installed (energy balance, common practice)', () => {
    const r = solveThermal(heated({}));
    const h = r.heaters[0];
    const needed = 0.5 * (r.nodes[0].meanC + 20);
    expect(h.dutyCycle).toBeCloseTo(needed / 30, 3);
    // With the band's middle as the mean temperature: 0.5 W/K x (4.5 + 20) K / 30 W
    expect(h.dutyCycle).toBeCloseTo((0.5 * 24.5) / 30, 2);
    expect(h.orbitAverageW).toBeCloseTo(h.dutyCycle * 30, 2);
    expect(h.peakW).toBe(30);
    expect(r.nodes[0].minC).toBeGreaterThan(2.9);
    expect(r.nodes[0].maxC).toBeLessThan(6.1);
  });

  it('at minimum bus voltage the heater gives (V/V_nom)^2 of its power and runs longer (P = V^2/R, DOMAIN.md)', () => {
    const r = solveThermal(heated({ busVoltage: { nominalV: 28, minV: 24, maxV: 32 } }));
    const low = r.heaters[0].atMinVoltage!;
    const high = r.heaters[0].atMaxVoltage!;
    // DOMAIN.md: 24 V on a heater rated for 28 V gives 73 % of its power
    expect(low.powerW / 30).toBeCloseTo(0.735, 3);
    expect(high.powerW).toBeCloseTo(30 * (32 / 28) ** 2, 3);
    expect(low.dutyCycle).toBeCloseTo((0.5 * 24.5) / low.powerW, 2);
    expect(low.dutyCycle).toBeGreaterThan(r.heaters[0].dutyCycle);
    expect(high.dutyCycle).toBeLessThan(r.heaters[0].dutyCycle);
  });

  it('a PI heater holds its set point with the power the loss needs, G (T_set - T_wall) (energy balance, common practice)', () => {
    const r = solveThermal(heated({ control: 'pi', setPointC: 5, onC: undefined, offC: undefined }));
    expect(r.nodes[0].meanC).toBeCloseTo(5, 1);
    expect(r.heaters[0].orbitAverageW).toBeCloseTo(0.5 * 25, 1);
  });

  it('a coolant loop removes Q = eff m_dot c_p (T - T_in) and its flow settles where that holds the set point (DOMAIN.md)', () => {
    const r = solveThermal({
      ...orbit,
      nodes: [{ name: 'amplifier', capacitanceJK: 5000, initialC: 20, dissipationW: 80 }],
      loops: [{ name: 'loop A', nodes: ['amplifier'], inletC: 10, specificHeatJKgK: 3500, effectiveness: 0.8, setPointC: 25, controlNode: 'amplifier', minFlowKgS: 0.0005, maxFlowKgS: 0.01, nominalFlowKgS: 0.002 }],
    });
    const loop = r.loops[0];
    expect(r.nodes[0].meanC).toBeCloseTo(25, 1);
    expect(loop.averageFlowKgS).toBeCloseTo(80 / (0.8 * 3500 * 15), 5);
    expect(loop.heatRemovedW).toBeCloseTo(80, 0);
    expect(loop.averageToNominal).toBeCloseTo(loop.averageFlowKgS / 0.002, 3);
  });

  it('limits with margins: 11 K (MIL-STD-1540, correlated passive model; Gilmore Ch. 19) turns a pass into a fail', () => {
    const model = heated({});
    expect(solveThermal(model).pass).toBe(true);
    const withMargin = solveThermal({ ...model, margins: { operatingK: 11 } });
    expect(withMargin.pass).toBe(false);
    const check = withMargin.nodes[0].limits[0];
    expect(check.kind).toBe('operating');
    expect(check.coldMarginK).toBeCloseTo(withMargin.nodes[0].minC - 11, 3);
  });
});

describe('periodic steady state', () => {
  it('the accelerated run lands within 0.05 K of plain orbit-after-orbit repetition run to 1e-4 K (common practice, no source)', () => {
    const model: ThermalSolveInput = {
      ...orbit,
      nodes: [
        { name: 'panel', capacitanceJK: 3000, initialC: 0, radiatorAreaM2: 0.3, emissivity: 0.85, absorbedW: Array.from({ length: 360 }, (_, s) => (s < 230 ? 120 * Math.sin((Math.PI * s) / 230) : 0)) },
        { name: 'unit', capacitanceJK: 40000, initialC: 0, dissipationW: 15 },
      ],
      couplings: [{ from: 'panel', to: 'unit', conductanceWK: 1.2 }],
    };
    const fast = solveThermal(model);
    const plain = solveThermal({ ...model, start: 'initial', accelerate: false, toleranceK: 1e-4 });
    expect(fast.orbits).toBeLessThan(plain.orbits);
    fast.nodes.forEach((node, i) => node.temperaturesC.forEach((t, k) => expect(Math.abs(t - plain.nodes[i].temperaturesC[k])).toBeLessThan(0.05)));
  });

  // One node, C dT/dt = Q - eps sigma A T^4: the periodic state of a constant load is its steady state.
  const slow = (capacitanceJK: number): ThermalSolveInput => ({
    ...orbit,
    nodes: [{ name: 'mass', capacitanceJK, initialC: 20, dissipationW: 60, radiatorAreaM2: 0.4, emissivity: 0.85 }],
  });
  const stefanBoltzmannC = (60 / (0.85 * SIGMA * 0.4)) ** 0.25 - K0;

  for (const capacitanceJK of [1e9, 1e12]) {
    it(`a slow node (C = ${capacitanceJK} J/K) on a constant load lands on Q = eps sigma A T^4 within 0.05 K from either start (Stefan-Boltzmann law)`, () => {
      for (const start of ['orbit-average', 'initial'] as const) {
        const r = solveThermal({ ...slow(capacitanceJK), start });
        expect(Math.abs(r.nodes[0].meanC - stefanBoltzmannC)).toBeLessThan(0.05);
        expect(Math.abs(r.nodes[0].minC - stefanBoltzmannC)).toBeLessThan(0.05);
      }
    });
  }

  it('a slow node changing by less than the tolerance per orbit is not taken as settled: plain repetition gives up instead (tau = C / (4 eps sigma A T^3), Stefan-Boltzmann law linearised)', () => {
    // From 20 C the node cools by about 0.0005 K per orbit (82 W net over 1e9 J/K) and tau is near
    // 140 000 orbits (4 eps sigma A T^3 = 1.26 W/K at 254 K): 0.01 K per orbit says nothing here.
    const model: ThermalSolveInput = { ...slow(1e9), start: 'initial', accelerate: false, maxOrbits: 3 };
    expect(() => solveThermal(model)).toThrow(ThermalConvergenceError);
  });

  it('a model that cannot settle in the allowed orbits throws ThermalConvergenceError naming the orbits and the change', () => {
    const model: ThermalSolveInput = { ...orbit, maxOrbits: 2, start: 'initial', accelerate: false, nodes: [{ name: 'slab', capacitanceJK: 1e7, initialC: 80, radiatorAreaM2: 0.1, emissivity: 0.8 }] };
    expect(() => solveThermal(model)).toThrow(ThermalConvergenceError);
    expect(() => solveThermal(model)).toThrow(/2 orbits.*K/);
  });
});
