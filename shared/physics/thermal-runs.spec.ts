// Issue 14 item 5: runs that never leave the engineer empty-handed. Each of these was a failure an
// engineer met (a run with no answer, sizing answering NaN or a silent zero, solver messages with
// NaN and no node); each test reproduces it and checks the answer names the node, time and values.
import { describe, expect, it } from 'vitest';
import { STEFAN_BOLTZMANN as SIGMA } from './constants';
import { ThermalConvergenceError, ThermalModelError, type ThermalSolveInput } from './thermal-model';
import { heaterPowerFor, radiatorAreaFor } from './thermal-sizing';
import { solveThermal } from './thermal-solver';

const K0 = 273.15;

/** What `work` throws (the test fails if it throws nothing). */
function thrownBy(work: () => unknown): Error {
  try {
    work();
  } catch (e) {
    return e as Error;
  }
  throw new Error('expected an error, got an answer');
}
const sunlit = (w: number) => Array.from({ length: 120 }, (_, s) => (s < 78 ? w : 0));

/** Three nodes that run fine in a cold case: a battery with a thermostat, a sunlit panel, a tray. */
const threeNodes = (onC: number): ThermalSolveInput => ({
  periodS: 5739, steps: 120,
  nodes: [
    { name: 'battery', capacitanceJK: 9000, initialC: 10, dissipationW: 2, minC: 0, maxC: 30 },
    { name: 'panel', capacitanceJK: 3000, initialC: 0, absorbedW: sunlit(30), radiatorAreaM2: 0.3, emissivity: 0.85, minC: -40, maxC: 60 },
    { name: 'tray', capacitanceJK: 5000, initialC: 0, radiatorAreaM2: 0.05, emissivity: 0.8 },
  ],
  couplings: [{ from: 'battery', to: 'panel', conductanceWK: 0.8 }, { from: 'battery', to: 'tray', conductanceWK: 0.5 }],
  heaters: [{ node: 'battery', powerW: 10, onC, offC: onC + 3 }],
});

/** A slab far from its periodic state: 1e7 J/K radiating from 80 C takes many orbits to cool. */
const slowSlab: ThermalSolveInput = {
  periodS: 5739, steps: 120, maxOrbits: 2, start: 'initial', accelerate: false,
  nodes: [{ name: 'slab', capacitanceJK: 1e7, initialC: 80, radiatorAreaM2: 0.1, emissivity: 0.8 }],
};

describe('a run that does not settle', () => {
  it('answers its last orbit, marked converged false, naming the node, its change and where it ended (asked for with whenUnsettled)', () => {
    const r = solveThermal({ ...slowSlab, whenUnsettled: 'last-orbit' });
    expect(r.converged).toBe(false);
    expect(r.pass).toBe(false);
    expect(r.orbits).toBe(2);
    expect(r.unsettled?.node).toBe('slab');
    // Energy balance over the last orbit (common practice): C dT = -eps sigma A T^4 dt, so the slab
    // cools by about eps sigma A T^4 P / C over one orbit near 80 C, some 0.19 K.
    const coolingK = (0.8 * SIGMA * 0.1 * (80 + K0) ** 4 * 5739) / 1e7;
    expect(r.unsettled!.lastChangeK).toBeLessThan(0);
    expect(Math.abs(Math.abs(r.unsettled!.lastChangeK) - coolingK) / coolingK).toBeLessThan(0.05);
    expect(r.unsettled!.endC).toBeCloseTo(r.nodes[0].temperaturesC[119], 0);
    expect(r.unsettled!.message).toMatch(/Not settled after 2 orbits: node "slab" still cooled by 0\.\d{3} K over the last orbit, ending it at 79\.\d °C/);
    expect(r.nodes[0].temperaturesC).toHaveLength(120);
    expect(r.nodes[0].temperaturesC.every(Number.isFinite)).toBe(true);
  });

  it('by default refuses (API.md: 422) with the same words: the node, the orbits and the figures, never NaN', () => {
    const caught = thrownBy(() => solveThermal(slowSlab));
    expect(caught).toBeInstanceOf(ThermalConvergenceError);
    const e = caught as ThermalConvergenceError;
    expect(e.message).toMatch(/node "slab"/);
    expect(e.message).toMatch(/2 orbits/);
    expect(e.message).not.toMatch(/NaN|Infinity/);
    expect(e.orbits).toBe(2);
    expect(Number.isFinite(e.residualK)).toBe(true);
    expect(e.path).toBe('nodes.0');
  });

  it('a node with no way to lose its heat is named with its temperature climb, orbit by orbit (energy balance: Q P / C per orbit)', () => {
    // 60 W into 1000 J/K with no coupling or radiator: 60 x 5739 / 1000 = 344 K per orbit.
    const model: ThermalSolveInput = {
      periodS: 5739, steps: 120, maxOrbits: 3, whenUnsettled: 'last-orbit',
      nodes: [{ name: 'sealed box', capacitanceJK: 1000, initialC: 20, dissipationW: 60 }, { name: 'wall', capacitanceJK: 5000, initialC: 0, radiatorAreaM2: 0.1, emissivity: 0.8 }],
    };
    const r = solveThermal(model);
    expect(r.converged).toBe(false);
    expect(r.unsettled?.node).toBe('sealed box');
    expect(r.unsettled!.lastChangeK).toBeCloseTo(344.34, 1);
    expect(r.unsettled!.message).toMatch(/"sealed box" still warmed by 344\.\d{3} K/);
  });

  it('a step that breaks down names the node, the time and the values, in words without NaN', () => {
    // A megawatt heater on a 1 J/K node: each step would add MJ to it.
    const model: ThermalSolveInput = {
      periodS: 5739, steps: 120, start: 'initial',
      nodes: [{ name: 'tiny bracket', capacitanceJK: 1, initialC: 20, radiatorAreaM2: 0.001, emissivity: 0.1 }],
      heaters: [{ node: 'tiny bracket', powerW: 1e6, onC: 30, offC: 40 }],
    };
    const caught = thrownBy(() => solveThermal(model));
    expect(caught).toBeInstanceOf(ThermalConvergenceError);
    const message = caught.message;
    expect(message).toMatch(/"tiny bracket"/);
    expect(message).toMatch(/orbit 1/);
    expect(message).toMatch(/\d+\.\d s/);
    expect(message).not.toMatch(/NaN|Infinity|undefined/);
  });
  it('a network that cannot be solved (a negative capacitance, which the API refuses but the solver may still meet) names the node', () => {
    const model: ThermalSolveInput = {
      periodS: 5739, steps: 120,
      nodes: [{ name: 'good', capacitanceJK: 1000, initialC: 0 }, { name: 'bad bracket', capacitanceJK: -100, initialC: 0 }],
      couplings: [{ from: 'good', to: 'bad bracket', conductanceWK: 0.5 }],
    };
    const caught = thrownBy(() => solveThermal(model));
    expect(caught).toBeInstanceOf(ThermalConvergenceError);
    expect(caught.message).toMatch(/could not be solved at node "bad bracket"/);
    expect(caught.message).not.toMatch(/NaN|undefined/);
  });
});

describe('sizing never answers NaN or a silent zero', () => {
  it('heater sizing on a three-node model that runs fine, with the thermostat on at the very minimum, says why no power fits', () => {
    const model = threeNodes(0);
    expect(solveThermal(model).converged).toBe(true);
    const caught = thrownBy(() => heaterPowerFor(model, 'battery', 0));
    expect(caught).toBeInstanceOf(ThermalModelError);
    const message = caught.message;
    expect(message).not.toMatch(/NaN|periodic state in \d+ orbits/);
    expect(message).toMatch(/battery/);
    expect(message).toMatch(/switches on at 0 °C/);
    expect(message).toMatch(/above 0 °C/);
  });

  it('heater sizing with room between the thermostat and the minimum still sizes it (energy balance at 75 % duty)', () => {
    const r = heaterPowerFor(threeNodes(3), 'battery', 0);
    expect(r.note).toBeNull();
    expect(r.dutyCycleAtMinVoltage).toBeLessThanOrEqual(0.75);
    expect(r.dutyCycleAtMinVoltage).toBeGreaterThan(0.74);
    expect(r.achievedMinC).toBeGreaterThanOrEqual(0);
  });

  it('radiator sizing on a node that stays cool without one answers 0 m^2 with the reason and its peak, not a bare zero', () => {
    const r = radiatorAreaFor(threeNodes(3), 'panel', 0);
    expect(r.areaM2).toBe(0);
    expect(r.note).toMatch(/No radiator is needed: even with none, panel peaks at -?\d+\.\d °C, within 60 °C/);
    expect(r.achievedMaxC).toBeLessThan(60);
  });

  it('a heater that is not needed answers 0 W with the reason', () => {
    const warm = threeNodes(3);
    const r = heaterPowerFor({ ...warm, nodes: warm.nodes.map((n) => (n.name === 'battery' ? { ...n, minC: -90 } : n)) }, 'battery', 0);
    expect(r.powerW).toBe(0);
    expect(r.note).toMatch(/No heater is needed: even with it off, battery stays at or above -\d+\.\d °C/);
  });

  it('no radiator area fits: the answer says how hot the node still is at the largest area tried', () => {
    // Absorbed 2000 W/m^2 on an eps 0.1 radiator: eps sigma T^4 at 30 C is 48 W/m^2, far below it.
    const model: ThermalSolveInput = {
      periodS: 5739, steps: 120,
      nodes: [{ name: 'hot plate', capacitanceJK: 3000, initialC: 10, dissipationW: 5, absorbedW: 200, radiatorAreaM2: 0.1, emissivity: 0.1, maxC: 30 }],
    };
    expect(() => radiatorAreaFor(model, 'hot plate', 0)).toThrow(/No radiator area up to 10000 m² holds hot plate at or below 30 °C: it still peaks at \d+\.\d °C with/);
  });
});
