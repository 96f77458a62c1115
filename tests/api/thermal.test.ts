// The thermal routes through the app (API.md "Thermal solve"): a small model against hand
// calculations, heater figures, sizing, and how malformed and impossible models are answered.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, type TestApp } from './test-app';

const SIGMA = 5.670374419e-8; // Stefan-Boltzmann, CODATA 2018
const K0 = 273.15;

let t: TestApp;
let viewer: request.Agent;

beforeAll(async () => {
  t = await createTestApp();
  viewer = await t.signIn('viewer@kestrel.test');
});
afterAll(() => t.close());

// API.md's example, completed with the panel it couples the battery to.
const model = {
  periodS: 5739, steps: 360,
  nodes: [
    { name: 'battery', capacitanceJK: 9000, initialC: 10, dissipationW: 6, absorbedW: 0, radiatorAreaM2: 0, emissivity: 0.85, minC: 0, maxC: 30 },
    { name: 'panel', capacitanceJK: 4000, initialC: 0, absorbedW: 87, radiatorAreaM2: 0.3, emissivity: 0.85 },
  ],
  couplings: [{ from: 'battery', to: 'panel', conductanceWK: 0.8 }],
  heaters: [{ node: 'battery', powerW: 10, onC: 3, offC: 6 }],
};

describe('POST /api/v1/thermal/solve', () => {
  it('answers a two-node model as the hand calculation: panel by Stefan-Boltzmann, battery by Q/G above it', async () => {
    const res = await viewer.post('/api/v1/thermal/solve').send(model).expect(200);
    // Hand calculation: all 93 W leave through the panel, eps sigma A T^4 = 93 W; the battery sits 6 W / 0.8 W/K above.
    const panelC = (93 / (0.85 * SIGMA * 0.3)) ** 0.25 - K0;
    expect(res.body.converged).toBe(true);
    expect(res.body.orbits).toBeGreaterThanOrEqual(1);
    const [battery, panel] = res.body.nodes;
    expect(panel.meanC).toBeCloseTo(panelC, 1);
    expect(battery.meanC).toBeCloseTo(panelC + 6 / 0.8, 1);
    expect(battery.temperaturesC).toHaveLength(360);
    // The battery stays above 6 C, so the thermostat (on at 3 C) never runs.
    expect(res.body.heaters[0]).toMatchObject({ node: 'battery', dutyCycle: 0, orbitAverageW: 0, peakW: 0 });
  });

  it('reports duty cycle, orbit-average and peak power of a heater that runs (energy balance: duty = needed / installed)', async () => {
    const cold = { ...model, nodes: [model.nodes[0], { ...model.nodes[1], absorbedW: 60 }], heaters: [{ ...model.heaters[0], powerW: 40 }] };
    const res = await viewer.post('/api/v1/thermal/solve').send(cold).expect(200);
    const h = res.body.heaters[0];
    expect(h.dutyCycle).toBeGreaterThan(0);
    expect(h.dutyCycle).toBeLessThan(1);
    expect(h.peakW).toBe(40);
    expect(h.orbitAverageW).toBeCloseTo(h.dutyCycle * 40, 1);
    // Orbit energy in = out: heater + dissipation = radiated by the panel (orbit average).
    const panel = res.body.nodes[1];
    const radiated = panel.temperaturesC.reduce((a: number, c: number) => a + 0.85 * SIGMA * 0.3 * (c + K0) ** 4, 0) / 360;
    expect(Math.abs(h.orbitAverageW + 6 + 60 - radiated)).toBeLessThan(1);
  });

  it('answers 400 naming the field and the value for a coupling to a node the model does not have', async () => {
    const res = await viewer.post('/api/v1/thermal/solve')
      .send({ ...model, couplings: [{ from: 'battery', to: 'radiator', conductanceWK: 0.8 }] }).expect(400);
    expect(res.body.error.details[0].path).toBe('couplings.0.to');
    expect(res.body.error.details[0].message).toBe('no node is named "radiator" (got "radiator")');
  });

  it('cross-field checks name the value at their own path, not the whole model or node', async () => {
    const res = await viewer.post('/api/v1/thermal/solve')
      .send({ ...model, nodes: [{ ...model.nodes[0], minC: 10, maxC: 5 }, model.nodes[1]], heaters: [{ node: 'battery', powerW: 10, onC: 6, offC: 3 }, { node: 'battery', powerW: 5 }] })
      .expect(400);
    const details = res.body.error.details as { path: string; message: string }[];
    expect(details).toContainEqual({ path: 'nodes.0.maxC', message: 'maxC must be above minC (10 C) (got 5)' });
    expect(details).toContainEqual({ path: 'heaters.0.offC', message: 'offC must be above onC (6 C) (got 3)' });
    expect(details).toContainEqual({ path: 'heaters.1.onC', message: 'a thermostat needs onC (got nothing)' });
    for (const d of details) expect(d.message).not.toMatch(/got \{/);
  });

  it('answers 400 for an absorbedW array that is not one value per step, and for a repeated node name', async () => {
    const short = await viewer.post('/api/v1/thermal/solve')
      .send({ ...model, nodes: [{ ...model.nodes[0], absorbedW: [1, 2, 3] }, model.nodes[1]] }).expect(400);
    expect(short.body.error.details[0].path).toBe('nodes.0.absorbedW');
    expect(short.body.error.details[0].message).toMatch(/3 values.*360/);
    const twice = await viewer.post('/api/v1/thermal/solve')
      .send({ ...model, nodes: [model.nodes[0], { ...model.nodes[1], name: 'battery' }] }).expect(400);
    expect(twice.body.error.details[0].path).toBe('nodes.1.name');
  });

  // API.md "Coolant loops": the example loop, closed round a hull node and its radiator.
  const closedLoop = {
    name: 'hull loop', specificHeatJKgK: 3900, densityKgM3: 1030, fluidMassKg: 6,
    path: [{ node: 'battery', conductanceWK: 60 }, { node: 'panel', conductanceWK: 120 }],
    minFlowKgS: 0.001, nominalFlowKgS: 0.01, maxFlowKgS: 0.1,
    controlNode: 'battery', setPointC: 41, proportionalKgSK: 0.01, integralKgSKs: 0.00001, bandK: 0.1,
  };
  const loopModel = { ...model, heaters: [], nodes: model.nodes.map((n) => (n.name === 'panel' ? { ...n, radiatorAreaM2: 0.2 } : n)) };

  it('answers a closed loop with its coolant along the path, heat per element that closes within 0.5 %, and its control figures (API.md "Coolant loops")', async () => {
    const res = await viewer.post('/api/v1/thermal/solve').send({ ...loopModel, loops: [closedLoop] }).expect(200);
    const [loop] = res.body.loops;
    expect(loop.closed).toBe(true);
    expect(loop.coolantC.map((c: { node: string }) => c.node)).toEqual(['battery', 'panel']);
    expect(loop.coolantC[0].temperaturesC).toHaveLength(360);
    const heat = loop.heatW.map((h: { averageW: number }) => h.averageW);
    expect(Math.abs(heat[0] + heat[1])).toBeLessThanOrEqual(0.005 * (Math.abs(heat[0]) + Math.abs(heat[1])));
    expect(loop.control).toMatchObject({ node: 'battery', setPointC: 41, bandK: 0.1, pass: true });
    expect(loop.densityKgM3).toBe(1030);
  });

  it('answers 400 naming loops.0.controlNode when the flow can vary and no node is chosen, and a closed loop without its fluid mass', async () => {
    const { controlNode: _c, fluidMassKg: _m, ...rest } = closedLoop;
    const res = await viewer.post('/api/v1/thermal/solve').send({ ...loopModel, loops: [rest] }).expect(400);
    const paths = res.body.error.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['loops.0.controlNode', 'loops.0.fluidMassKg']));
    const unknown = await viewer.post('/api/v1/thermal/solve').send({ ...loopModel, loops: [{ ...closedLoop, controlNode: 'pump' }] }).expect(400);
    expect(unknown.body.error.details).toEqual(expect.arrayContaining([expect.objectContaining({ path: 'loops.0.controlNode', message: expect.stringContaining('"pump"') })]));
  });

  it('answers 422 not_converged when the model cannot settle in the allowed orbits', async () => {
    const res = await viewer.post('/api/v1/thermal/solve')
      .send({ ...model, maxOrbits: 1, start: 'initial', nodes: [{ ...model.nodes[0], capacitanceJK: 1e8, initialC: 60 }, model.nodes[1]] })
      .expect(422);
    expect(res.body.error.code).toBe('not_converged');
    expect(res.body.error.message).toMatch(/after 1 orbit: node "panel"/);
    expect(JSON.stringify(res.body)).not.toMatch(/NaN|Infinity/);
  });

  it('answers the last orbit, marked converged false, when asked to with whenUnsettled "last-orbit" (an addition to API.md)', async () => {
    const res = await viewer.post('/api/v1/thermal/solve')
      .send({ ...model, maxOrbits: 1, start: 'initial', whenUnsettled: 'last-orbit', nodes: [{ ...model.nodes[0], capacitanceJK: 1e8, initialC: 60 }, model.nodes[1]] })
      .expect(200);
    expect(res.body.converged).toBe(false);
    expect(res.body.pass).toBe(false);
    expect(res.body.orbits).toBe(1);
    expect(res.body.unsettled.node).toBe('panel');
    expect(res.body.unsettled.message).toMatch(/The figures shown are the last orbit's/);
    expect(res.body.nodes[0].temperaturesC).toHaveLength(360);
    const bad = await viewer.post('/api/v1/thermal/solve').send({ ...model, whenUnsettled: 'sometimes' }).expect(400);
    expect(bad.body.error.details[0].path).toBe('whenUnsettled');
  });

  it('answers 401 without a session', async () => {
    await request(t.app).post('/api/v1/thermal/solve').send(model).expect(401);
  });
});

describe('POST /api/v1/thermal/size', () => {
  it('sizes a radiator to the radiator equation A = Q / (eps sigma T^4 - q_abs) (DOMAIN.md; Gilmore)', async () => {
    const body = {
      periodS: 5739, steps: 120,
      nodes: [{ name: 'radiator', capacitanceJK: 9000, initialC: 10, dissipationW: 50, absorbedW: 20, radiatorAreaM2: 0.2, emissivity: 0.85, maxC: 30 }],
      sizing: { kind: 'radiator', node: 'radiator', marginK: 11 },
    };
    const res = await viewer.post('/api/v1/thermal/size').send(body).expect(200);
    const expected = 50 / (0.85 * SIGMA * (19 + K0) ** 4 - 20 / 0.2);
    expect(res.body.sizing.kind).toBe('radiator');
    expect(res.body.sizing.areaM2).toBeCloseTo(expected, 3);
    expect(res.body.sizing.targetMaxC).toBe(19);
  });

  it('answers 422 not_sizable when a thermostat switches on below the minimum plus margin', async () => {
    const res = await viewer.post('/api/v1/thermal/size')
      .send({ ...model, sizing: { kind: 'heater', node: 'battery', marginK: 5 } }).expect(422);
    expect(res.body.error.code).toBe('not_sizable');
    expect(res.body.error.message).toMatch(/3 °C, below the 5 °C/);
  });
});
