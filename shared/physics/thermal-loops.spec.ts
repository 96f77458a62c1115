// Closed coolant loops against closed forms and textbook relations (issue 14, item 6).
import { describe, expect, it } from 'vitest';
import { STEFAN_BOLTZMANN as SIGMA } from './constants';
import { periodicFirstOrderLag } from './thermal-closed-forms';
import { recoveries } from './thermal-loop-results';
import type { CoolantLoopInput, ThermalSolveInput } from './thermal-model';
import { solveThermal } from './thermal-solver';

const K0 = 273.15;
const cp = 3900;

/** Equipment dissipating Q on a cold plate, a closed loop to a radiator panel; nothing else. */
function oneRadiator(flowKgS: number, loop: Partial<CoolantLoopInput> = {}, q = 120): ThermalSolveInput {
  return {
    periodS: 5400, steps: 180,
    nodes: [
      { name: 'equipment', capacitanceJK: 8000, initialC: 20, dissipationW: q },
      { name: 'radiator', capacitanceJK: 4000, initialC: 0, radiatorAreaM2: 0.6, emissivity: 0.85 },
    ],
    loops: [{
      name: 'loop', path: [{ node: 'equipment', conductanceWK: 40 }, { node: 'radiator', conductanceWK: 90 }], fluidMassKg: 1.5,
      specificHeatJKgK: cp, densityKgM3: 1030, minFlowKgS: flowKgS, maxFlowKgS: flowKgS, nominalFlowKgS: flowKgS, ...loop,
    }],
  };
}

/** Two loops (hull loop with a radiator seeing sun and eclipse; equipment loop through a heat exchanger), a PI on each. */
function twoLoops(): ThermalSolveInput {
  const steps = 240;
  const sun = Array.from({ length: steps }, (_, s) => (s / steps < 0.64 ? 1 : 0));
  return {
    periodS: 5600, steps,
    nodes: [
      { name: 'hull', capacitanceJK: 60000, initialC: 20, absorbedW: sun.map((f) => 40 + 260 * f), radiatorAreaM2: 0.4, emissivity: 0.3 },
      { name: 'hull radiator', capacitanceJK: 9000, initialC: 0, absorbedW: sun.map((f) => 20 + 90 * f), radiatorAreaM2: 1.8, emissivity: 0.88 },
      { name: 'exchanger', capacitanceJK: 3000, initialC: 15 },
      { name: 'power unit', capacitanceJK: 20000, initialC: 25, dissipationW: sun.map((f) => 180 + 60 * f) },
    ],
    couplings: [{ from: 'hull', to: 'power unit', conductanceWK: 0.5 }],
    loops: [
      {
        name: 'hull loop', path: [{ node: 'hull', conductanceWK: 60 }, { node: 'exchanger', conductanceWK: 150 }, { node: 'hull radiator', conductanceWK: 120 }],
        fluidMassKg: 6, specificHeatJKgK: cp, densityKgM3: 1030, minFlowKgS: 0.001, nominalFlowKgS: 0.03, maxFlowKgS: 0.2,
        controlNode: 'exchanger', setPointC: 15, proportionalKgSK: 0.01, integralKgSKs: 0.00001, bandK: 0.5,
      },
      {
        name: 'equipment loop', path: [{ node: 'power unit', conductanceWK: 80 }, { node: 'exchanger', conductanceWK: 150 }],
        fluidMassKg: 3, specificHeatJKgK: cp, densityKgM3: 1030, minFlowKgS: 0.001, nominalFlowKgS: 0.03, maxFlowKgS: 0.2,
        controlNode: 'power unit', setPointC: 35, proportionalKgSK: 0.01, integralKgSKs: 0.00001, bandK: 0.5,
      },
    ],
  };
}


describe('closed coolant loops', () => {
  it('a constant-flow loop with one radiator under a steady load: the radiator settles at (Q/(eps sigma A))^(1/4) whatever the flow (closed form: steady energy balance, Stefan-Boltzmann law)', () => {
    const expected = (120 / (0.85 * SIGMA * 0.6)) ** 0.25 - K0;
    const equipment: number[] = [];
    for (const flow of [0.003, 0.05, 1.2]) {
      const r = solveThermal(oneRadiator(flow));
      expect(r.nodes[1].meanC).toBeCloseTo(expected, 3);
      equipment.push(r.nodes[0].meanC);
      const heat = r.loops[0].heatW;
      expect(heat[0].averageW).toBeCloseTo(120, 2);
      expect(heat[1].averageW).toBeCloseTo(-120, 2);
    }
    // The flow changes what the equipment needs above the radiator, not the radiator itself.
    expect(equipment[0]).toBeGreaterThan(equipment[1] + 1);
  });

  it('each element takes eps m_dot c_p (T_node - T_in) with eps = 1 - exp(-NTU), NTU = UA/(m_dot c_p) (effectiveness-NTU, Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, ch. 11)', () => {
    for (const flow of [0.004, 0.02, 0.3]) {
      const r = solveThermal(oneRadiator(flow));
      const w = flow * cp;
      const tIn = r.loops[0].coolantC[1].temperaturesC.at(-1)!; // coolant leaving the radiator enters the cold plate
      const tOut = r.loops[0].coolantC[0].temperaturesC.at(-1)!;
      const plate = r.nodes[0].temperaturesC.at(-1)!;
      const eps = 1 - Math.exp(-40 / w);
      expect(tOut - tIn).toBeCloseTo(eps * (plate - tIn), 3);
      expect(w * (tOut - tIn)).toBeCloseTo(120, 1);
    }
  });

  it('a PI loop under a constant load holds its set point exactly (integral action: no steady-state error, Astrom & Murray, Feedback Systems, ch. 10)', () => {
    // A tight periodic tolerance: the integral's slow settling is what is being checked.
    const r = solveThermal({ ...oneRadiator(0.02, { minFlowKgS: 0.001, maxFlowKgS: 0.5, controlNode: 'equipment', setPointC: 0, proportionalKgSK: 0.01, integralKgSKs: 0.0001, bandK: 0.1 }), toleranceK: 1e-5, maxOrbits: 2000 });
    const loop = r.loops[0];
    expect(r.nodes[0].meanC).toBeCloseTo(0, 3);
    expect(loop.control?.maxDeviationK).toBeLessThan(0.01);
    expect(loop.control?.pass).toBe(true);
    expect(loop.saturatedFraction).toBe(0);
    // The flow it settles at is the one the effectiveness-NTU balance asks for (closed form).
    const radiatorC = (120 / (0.85 * SIGMA * 0.6)) ** 0.25 - K0;
    expect(loop.averageFlowKgS).toBeGreaterThan(0.001);
    expect(r.nodes[1].meanC).toBeCloseTo(radiatorC, 3);
  });

  it('a controller that cannot hold its set point sits at its flow limit and says so', () => {
    const r = solveThermal(oneRadiator(0.02, { minFlowKgS: 0.001, maxFlowKgS: 0.5, controlNode: 'equipment', setPointC: -60, bandK: 0.1 }));
    expect(r.loops[0].saturatedFraction).toBe(1);
    expect(r.loops[0].averageFlowKgS).toBeCloseTo(0.5, 6);
    expect(r.loops[0].control?.pass).toBe(false);
  });

  it('a node cooled by a loop steps like one first-order lag, tau = C/G with G = eps m_dot c_p (lumped capacitance, Incropera ch. 5; effectiveness-NTU ch. 11)', () => {
    const C = 9000;
    const flow = 0.002;
    const w = flow * cp;
    const G = w * (1 - Math.exp(-5 / w));
    const periodS = 6000;
    const onS = 2000;
    const q = 30;
    const r = solveThermal({
      periodS, steps: 600,
      nodes: [
        { name: 'unit', capacitanceJK: C, initialC: 0, dissipationW: { onW: q, periodS, onS } },
        // A sink tied to a 0 C wall, passed by the coolant with NTU far above 20.
        { name: 'sink', capacitanceJK: 1000, initialC: 0 },
        { name: 'wall', initialC: 0, fixedC: 0 },
      ],
      couplings: [{ from: 'sink', to: 'wall', conductanceWK: 1e6 }],
      loops: [{ name: 'loop', path: [{ node: 'unit', conductanceWK: 5 }, { node: 'sink', conductanceWK: 1e5 }], fluidMassKg: 0.005, specificHeatJKgK: cp, minFlowKgS: flow, maxFlowKgS: flow, nominalFlowKgS: flow }],
      start: 'initial',
    });
    const { at: exact } = periodicFirstOrderLag(q, G, C, onS, periodS);
    r.tS.forEach((t, k) => expect(Math.abs(r.nodes[0].temperaturesC[k] - exact(t))).toBeLessThan(0.05));
  });

  it("closes each closed loop's energy over the periodic orbit within 0.5 % of the heat it moves (API.md \"Coolant loops\"), and holds both set points through eclipse", () => {
    const r = solveThermal(twoLoops());
    for (const loop of r.loops) {
      expect(loop.closed).toBe(true);
      const sum = loop.heatW.reduce((a, h) => a + h.averageW, 0);
      const abs = loop.heatW.reduce((a, h) => a + Math.abs(h.averageW), 0);
      expect(abs).toBeGreaterThan(10);
      expect(Math.abs(sum)).toBeLessThanOrEqual(0.005 * abs);
      expect(loop.coolantC).toHaveLength(loop.heatW.length);
      expect(loop.control).not.toBeNull();
      expect(loop.control!.maxDeviationK).toBeLessThan(0.5);
      expect(loop.control!.pass).toBe(true);
    }
    // The exchanger is on both paths: what the equipment loop gives up there, the hull loop takes.
    const given = r.loops[1].heatW.find((h) => h.node === 'exchanger')!.averageW;
    const taken = r.loops[0].heatW.find((h) => h.node === 'exchanger')!.averageW;
    expect(taken).toBeCloseTo(-given, 0);
    // The power unit's mean sits at its set point (integral action).
    expect(r.nodes[3].meanC).toBeCloseTo(35, 1);
    expect(r.nodes[2].meanC).toBeCloseTo(15, 1);
  });

  it('feedforward from the known load profile narrows the deviation through eclipse', () => {
    const plain = solveThermal(twoLoops());
    const model = twoLoops();
    // The loop carries some 200 W at about 0.0026 kg/s: 1e-5 kg/s per W of load above the mean.
    const loops = model.loops!.map((l, k) => (k === 1 ? { ...l, feedforwardKgSW: 0.00001 } : l));
    const withFf = solveThermal({ ...model, loops });
    expect(withFf.loops[1].control!.maxDeviationK).toBeLessThan(plain.loops[1].control!.maxDeviationK);
  });

  it('times the return within the band after each eclipse entry and exit', () => {
    const sunlit = [1, 1, 1, 1, 0, 0, 0, 0];
    // 10 s per sample; leaves the band at entry, back two samples later; never leaves after exit.
    const temps = [20, 20, 20, 20, 20.5, 20.3, 20.05, 20, ];
    expect(recoveries(temps, sunlit, 20, 0.1, 80)).toEqual([
      { event: 'eclipse exit', atS: 0, returnS: 0 },
      { event: 'eclipse entry', atS: 40, returnS: 20 },
    ]);
  });
});

describe('closed loops refused', () => {
  it('names the path element that is a boundary node', () => {
    const model = oneRadiator(0.02);
    const nodes = model.nodes.map((n) => (n.name === 'radiator' ? { name: 'radiator', initialC: 0, fixedC: -20 } : n));
    expect(() => solveThermal({ ...model, nodes })).toThrow(/loops\.0\.path\.1\.node: "radiator" is not a node the coolant can exchange heat with/);
  });
});
