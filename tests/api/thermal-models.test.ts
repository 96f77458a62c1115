// Saved thermal models through the API: create, read, change, delete, the checks that name the
// field and the value, roles and workspace isolation, and runs against the demo load cases that
// agree with the stateless POST /thermal/solve and with a hand energy balance.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { STEFAN_BOLTZMANN } from '../../shared/physics/constants';
import { auditFor, kestrelOne, missionIdOf, ploverRelay } from './mission-fixtures';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let thermal: request.Agent;
let owner: request.Agent;
let analyst: request.Agent;
let viewer: request.Agent;
let plover: request.Agent;
let missionId: string;
let demoModelId: string;
let hotCaseId: string;
let coldCaseId: string;

const surfaceIdOf = (mission: string, name: string) =>
  (t.ctx.sqlite.prepare('SELECT id FROM surfaces WHERE mission_id = ? AND name = ?').get(mission, name) as { id: string }).id;
const modelCount = () => (t.ctx.sqlite.prepare('SELECT count(*) AS n FROM thermal_models').get() as { n: number }).n;

interface CaseSurface { name: string; areaM2: number; emissivity: number; series: { absorbedW: number[] } }
interface CaseDetailBody { inputs: { margins: { heatLoadPercent: number; temperatureMarginC: number }; conditions: { marginDirection: string } }; results: { periodS: number; tS: number[]; surfaces: CaseSurface[] } }
interface NodeResult { name: string; minC: number; maxC: number; meanC: number; temperaturesC: number[]; limits: { pass: boolean }[] }

const smallModel = (zenithId: string) => ({
  name: 'Two-node check',
  model: {
    nodes: [
      { name: 'box', capacitanceJK: 4000, initialC: 20, dissipationW: 10, hotDissipationW: 15, coldDissipationW: 5, minC: -10, maxC: 40 },
      { name: 'panel', capacitanceJK: 1500, initialC: 0, surfaceIds: [zenithId] },
    ],
    couplings: [{ from: 'box', to: 'panel', conductanceWK: 1.2 }],
    heaters: [{ node: 'box', powerW: 8, onC: 0, offC: 4 }],
  },
});

beforeAll(async () => {
  t = await createTestApp();
  [thermal, owner, analyst, viewer, plover] = await Promise.all(
    ['thermal@kestrel.test', 'owner@kestrel.test', 'analyst@kestrel.test', 'viewer@kestrel.test', 'owner@plover.test'].map((e) => t.signIn(e)),
  );
  missionId = missionIdOf(t, kestrelOne);
  const list = await thermal.get(`/api/v1/missions/${missionId}/thermal-models`).expect(200);
  demoModelId = (list.body.items as { id: string; name: string }[]).find((m) => m.name === 'Kestrel-1 bus, 4 nodes')!.id;
  const cases = (await thermal.get(`/api/v1/cases?missionId=${missionId}&status=released`).expect(200)).body.items as { id: string; kind: string }[];
  hotCaseId = cases.find((c) => c.kind === 'hot')!.id;
  coldCaseId = cases.find((c) => c.kind === 'cold')!.id;
});
afterAll(() => t.close());

describe('saved models', () => {
  it('lists the demo model to every member and hides it from another workspace', async () => {
    for (const agent of [viewer, analyst]) {
      const res = await agent.get(`/api/v1/missions/${missionId}/thermal-models`).expect(200);
      expect((res.body.items as { name: string; nodeCount: number }[]).map((m) => [m.name, m.nodeCount]).sort()).toEqual([['Kestrel-1 bus, 4 nodes', 4], ['Kestrel-1 pumped loops, 2 loops', 4]]);
    }
    expect((await plover.get(`/api/v1/missions/${missionId}/thermal-models`)).status).toBe(404);
    const hidden = await plover.get(`/api/v1/thermal-models/${demoModelId}`);
    expect(hidden.status).toBe(404);
    expect(hidden.body.error.message).toMatch(/No thermal model/);
    expect((await plover.post(`/api/v1/thermal-models/${demoModelId}/run`).send({ caseId: hotCaseId })).status).toBe(404);
  });

  it('lets a thermal engineer create, change and delete a model, each audited', async () => {
    const zenith = surfaceIdOf(missionId, 'Zenith radiator');
    const created = await thermal.post(`/api/v1/missions/${missionId}/thermal-models`).send(smallModel(zenith)).expect(201);
    const id = created.body.id as string;
    expect(created.body.model.nodes[1].surfaceIds).toEqual([zenith]);
    expect(created.body.model.maxDutyCycle).toBe(0.75); // DOMAIN.md 70-80 %, the middle
    const renamed = await thermal.patch(`/api/v1/thermal-models/${id}`).send({ name: 'Two-node check, renamed' }).expect(200);
    expect(renamed.body.name).toBe('Two-node check, renamed');
    expect(renamed.body.updatedAt >= created.body.updatedAt).toBe(true);
    await owner.delete(`/api/v1/thermal-models/${id}`).expect(204);
    expect((await thermal.get(`/api/v1/thermal-models/${id}`)).status).toBe(404);
    expect(auditFor(t, id).map((a) => a.action)).toEqual(['thermal_model.created', 'thermal_model.updated', 'thermal_model.deleted']);
  });

  it('refuses analysts and viewers a change (403 naming the role) and writes nothing', async () => {
    const before = modelCount();
    const body = smallModel(surfaceIdOf(missionId, 'Zenith radiator'));
    for (const agent of [analyst, viewer]) {
      const res = await agent.post(`/api/v1/missions/${missionId}/thermal-models`).send(body);
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/Thermal engineer/);
    }
    expect((await analyst.patch(`/api/v1/thermal-models/${demoModelId}`).send({ name: 'x' })).status).toBe(403);
    expect((await viewer.delete(`/api/v1/thermal-models/${demoModelId}`)).status).toBe(403);
    expect(modelCount()).toBe(before);
  });
});

describe('validation', () => {
  const post = (model: unknown) => thermal.post(`/api/v1/missions/${missionId}/thermal-models`).send({ name: 'bad', model });
  const base = () => smallModel(surfaceIdOf(missionId, 'Zenith radiator')).model;

  it('names an unknown node in a coupling, a heater and a loop, with the value', async () => {
    const before = modelCount();
    const res = await post({
      ...base(),
      couplings: [{ from: 'box', to: 'pannel', conductanceWK: 1 }],
      heaters: [{ node: 'batery', powerW: 5, onC: 0, offC: 3 }],
      loops: [{ name: 'loop', nodes: ['pump plate'], inletC: 10, specificHeatJKgK: 3500, setPointC: 20, controlNode: 'pump plate', minFlowKgS: 0, maxFlowKgS: 0.1, nominalFlowKgS: 0.05 }],
    });
    expect(res.status).toBe(400);
    const details = res.body.error.details as { path: string; message: string }[];
    expect(details).toEqual(expect.arrayContaining([
      { path: 'model.couplings.0.to', message: 'no node is named "pannel" (got "pannel")' },
      { path: 'model.heaters.0.node', message: 'no node is named "batery" (got "batery")' },
      { path: 'model.loops.0.nodes.0', message: 'no node is named "pump plate" (got "pump plate")' },
    ]));
    expect(modelCount()).toBe(before);
  });

  it('says what a conductance must be and what it got', async () => {
    const res = await post({ ...base(), couplings: [{ from: 'box', to: 'panel', conductanceWK: -1 }] });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toContainEqual({ path: 'model.couplings.0.conductanceWK', message: 'conductanceWK must be above 0 W/K (got -1)' });
  });

  it("refuses a surface of another mission and a surface owned twice", async () => {
    const ploverSurface = surfaceIdOf(missionIdOf(t, ploverRelay), 'Radiator');
    const zenith = surfaceIdOf(missionId, 'Zenith radiator');
    const m = base();
    const res = await post({ ...m, nodes: [{ ...m.nodes[0], surfaceIds: [zenith] }, { ...m.nodes[1], surfaceIds: [zenith, ploverSurface] }] });
    expect(res.status).toBe(400);
    const paths = (res.body.error.details as { path: string; message: string }[]).map((d) => d.path);
    expect(paths).toEqual(['model.nodes.1.surfaceIds.0', 'model.nodes.1.surfaceIds.1']);
    expect(res.body.error.message).toContain('already belongs to node "box"');
  });

  it('keeps the old model when a change is refused', async () => {
    const before = (await thermal.get(`/api/v1/thermal-models/${demoModelId}`).expect(200)).body;
    const res = await thermal.patch(`/api/v1/thermal-models/${demoModelId}`).send({ name: 'renamed', model: { ...before.model, heaters: [{ node: 'nobody', powerW: 1, onC: 0, offC: 2 }] } });
    expect(res.status).toBe(400);
    const after = (await thermal.get(`/api/v1/thermal-models/${demoModelId}`).expect(200)).body;
    expect(after.name).toBe(before.name);
    expect(after.updatedAt).toBe(before.updatedAt);
  });
});

describe('runs against a load case', () => {
  it('gives the same temperatures as POST /thermal/solve on the same inputs, and keeps the run', async () => {
    const run = await thermal.post(`/api/v1/thermal-models/${demoModelId}/run`).send({ caseId: coldCaseId }).expect(200);
    const stateless = await thermal.post('/api/v1/thermal/solve').send(run.body.solveRequest).expect(200);
    const nodes = run.body.result.nodes as NodeResult[];
    expect(nodes.map((n) => n.name)).toEqual(['battery', 'electronics box', 'radiator panel', 'structure']);
    expect(nodes.map((n) => n.temperaturesC)).toEqual((stateless.body.nodes as NodeResult[]).map((n) => n.temperaturesC));
    // the battery heater names a 24-32 V bus: duty and power at both ends of it
    const heater = run.body.result.heaters[0];
    expect(heater.atMinVoltage.voltageV).toBe(24);
    expect(heater.atMaxVoltage.voltageV).toBe(32);
    // P = V^2 / R: 12 W at 28 V is 12 (24/28)^2 W at 24 V
    expect(heater.atMinVoltage.powerW).toBeCloseTo(12 * (24 / 28) ** 2, 3);
    expect(heater.atMinVoltage.dutyCycle).toBeGreaterThanOrEqual(heater.atMaxVoltage.dutyCycle);
    expect(run.body.case.kind).toBe('cold');
    // the case's orbit period said in the unit that reads best (a ~95 min low orbit in minutes, not "5726.6 s")
    const texts: string[] = [];
    JSON.stringify(run.body, (_k, v: unknown) => (typeof v === 'string' && texts.push(v), v));
    const loadsLine = texts.find((x) => x.startsWith('Loads from case')) ?? '';
    expect(loadsLine).toMatch(/samples over \d+\.\d\d min\.$/);
    expect(run.body.inputs[1].dissipation).toMatch(/^30 W for 1800 s every 5700 s, 18 W otherwise$/);
    const kept = await viewer.get(`/api/v1/thermal-models/${demoModelId}/runs/${coldCaseId}`).expect(200);
    expect(kept.body.result.nodes[0].minC).toBe(nodes[0]!.minC);
    expect(kept.body.stale).toBe(false);
    expect(auditFor(t, demoModelId).map((a) => a.action)).toContain('thermal_model.run');
  });

  it("sums each node's surfaces from the case with the case's heat-load margin", async () => {
    const loadCase = (await thermal.get(`/api/v1/cases/${hotCaseId}`).expect(200)).body as CaseDetailBody;
    const run = await analyst.post(`/api/v1/thermal-models/${demoModelId}/run`).send({ caseId: hotCaseId }).expect(200);
    const zenith = loadCase.results.surfaces.find((s) => s.name === 'Zenith radiator')!;
    const { heatLoadPercent } = loadCase.inputs.margins;
    expect(loadCase.inputs.conditions.marginDirection).toBe('increase');
    const panel = (run.body.solveRequest.nodes as { name: string; absorbedW: number[]; radiatorAreaM2: number; emissivity: number }[]).find((n) => n.name === 'radiator panel')!;
    expect(panel.absorbedW).toHaveLength(loadCase.results.tS.length);
    panel.absorbedW.forEach((w, k) => expect(w).toBeCloseTo(zenith.series.absorbedW[k]! * (1 + heatLoadPercent / 100), 3));
    expect(panel.radiatorAreaM2).toBe(zenith.areaM2);
    expect(panel.emissivity).toBeCloseTo(zenith.emissivity, 6);
    expect(run.body.solveRequest.periodS).toBe(loadCase.results.periodS);
    expect(run.body.inputs[0].dissipation).toBe('2.5 W'); // the battery's hot-case value
  });

  it('holds one heavy node at the Stefan-Boltzmann balance of its orbit-average load (energy balance, common practice)', async () => {
    const zenith = surfaceIdOf(missionId, 'Zenith radiator');
    const created = await thermal
      .post(`/api/v1/missions/${missionId}/thermal-models`)
      .send({ name: 'Heavy plate', model: { nodes: [{ name: 'plate', capacitanceJK: 1e6, initialC: 0, dissipationW: 20, surfaceIds: [zenith] }] } })
      .expect(201);
    const run = await thermal.post(`/api/v1/thermal-models/${created.body.id}/run`).send({ caseId: hotCaseId }).expect(200);
    const loadCase = (await thermal.get(`/api/v1/cases/${hotCaseId}`).expect(200)).body as CaseDetailBody;
    const s = loadCase.results.surfaces.find((x) => x.name === 'Zenith radiator')!;
    const absorbed = (s.series.absorbedW.reduce((a, b) => a + b, 0) / s.series.absorbedW.length) * (1 + loadCase.inputs.margins.heatLoadPercent / 100);
    // eps sigma A T^4 = Q + absorbed: so large a capacitance that the orbit's swing is negligible
    const expectedC = ((20 + absorbed) / (s.emissivity * STEFAN_BOLTZMANN * s.areaM2)) ** 0.25 - 273.15;
    const plate = run.body.result.nodes[0] as NodeResult;
    expect(plate.meanC).toBeCloseTo(expectedC, 1);
    expect(plate.maxC - plate.minC).toBeLessThan(0.1);
  });

  it('a run that does not settle in the orbits allowed answers its last orbit, marked, naming the node; the orbits are a setting of the run', async () => {
    const run = await thermal.post(`/api/v1/thermal-models/${demoModelId}/run`).send({ caseId: coldCaseId, maxOrbits: 1 }).expect(200);
    expect(run.body.result.converged).toBe(false);
    expect(run.body.result.pass).toBe(false);
    expect(run.body.result.orbits).toBe(1);
    const names = (run.body.result.nodes as NodeResult[]).map((n) => n.name);
    expect(names).toContain(run.body.result.unsettled.node);
    expect(run.body.result.unsettled.message).toMatch(/^Not settled after 1 orbit: node "[^"]+"/);
    expect(run.body.result.nodes[0].temperaturesC).toHaveLength(run.body.case.steps);
    expect(run.body.solveRequest.maxOrbits).toBe(1);
    const kept = await thermal.get(`/api/v1/thermal-models/${demoModelId}/runs/${coldCaseId}`).expect(200);
    expect(kept.body.result.converged).toBe(false);
    const settled = await thermal.post(`/api/v1/thermal-models/${demoModelId}/run`).send({ caseId: coldCaseId, maxOrbits: 400 }).expect(200);
    expect(settled.body.result.converged).toBe(true);
    expect(settled.body.result.unsettled).toBeNull();
    const bad = await thermal.post(`/api/v1/thermal-models/${demoModelId}/run`).send({ caseId: coldCaseId, maxOrbits: 0 }).expect(400);
    expect(bad.body.error.details[0]).toEqual({ path: 'maxOrbits', message: expect.stringContaining('1..2000') });
  });

  it('lets analysts run, not viewers; refuses a case of another mission; marks a run stale after a change', async () => {
    expect((await viewer.post(`/api/v1/thermal-models/${demoModelId}/run`).send({ caseId: hotCaseId })).status).toBe(403);
    const otherMission = await thermal.post(`/api/v1/thermal-models/${demoModelId}/run`).send({ caseId: 'not-a-case' });
    expect(otherMission.status).toBe(404);
    expect(otherMission.body.error.message).toMatch(/^caseId: no load case with id "not-a-case"/);
    expect((await thermal.post(`/api/v1/thermal-models/${demoModelId}/run`).send({})).status).toBe(400);
    await thermal.patch(`/api/v1/thermal-models/${demoModelId}`).send({ description: 'touched' }).expect(200);
    const detail = (await thermal.get(`/api/v1/thermal-models/${demoModelId}`).expect(200)).body as { runs: { case: { kind: string }; stale: boolean }[] };
    expect(detail.runs.length).toBeGreaterThanOrEqual(2);
    expect(detail.runs.every((r) => r.stale)).toBe(true);
  });
});

describe('sizing', () => {
  it('sizes the radiator in the hot case and the heater in the cold case within the duty-cycle limit', async () => {
    const res = await analyst
      .post(`/api/v1/thermal-models/${demoModelId}/size`)
      .send({ caseHotId: hotCaseId, caseColdId: coldCaseId, node: 'radiator panel', heaterNode: 'battery' })
      .expect(200);
    const { radiator, heater, margins, maxDutyCycle } = res.body;
    expect(margins).toEqual({ hotK: 5, coldK: 5 });
    expect(radiator.case.kind).toBe('hot');
    expect(radiator.sizing.areaM2).toBeGreaterThan(0);
    expect(radiator.sizing.targetMaxC).toBe(30 - 5);
    expect(radiator.sizing.achievedMaxC).toBeLessThanOrEqual(25 + 1e-6);
    expect(heater.case.kind).toBe('cold');
    expect(heater.sizing.targetMinC).toBe(0 + 5);
    expect(heater.sizing.achievedMinC).toBeGreaterThanOrEqual(5 - 1e-6);
    expect(heater.sizing.dutyCycleAtMinVoltage).toBeLessThanOrEqual(maxDutyCycle + 1e-9);
    expect(heater.sizing.powerAtMinVoltageW).toBeCloseTo(heater.sizing.powerW * (24 / 28) ** 2, 6);
    expect(radiator.sizing.note).toBeNull();
    expect(JSON.stringify(res.body)).not.toMatch(/NaN|null K|undefined/);
  });

  it('a node that needs no radiator is answered 0 m^2 with the reason, not a bare zero', async () => {
    // The demo structure (maxC 60 C, 5 K margin) stays far below 55 C in the hot case with no radiator at all.
    const res = await analyst
      .post(`/api/v1/thermal-models/${demoModelId}/size`)
      .send({ caseHotId: hotCaseId, caseColdId: coldCaseId, node: 'structure', heaterNode: 'battery' })
      .expect(200);
    const { radiator } = res.body;
    expect(radiator.sizing.areaM2).toBe(0);
    expect(radiator.sizing.achievedMaxC).toBeLessThan(55);
    expect(radiator.sizing.note).toMatch(/^No radiator is needed: even with none, structure peaks at -?\d+\.\d °C, within 55 °C \(its maximum less the 5 K margin\)/);
  });

  it('says why a node cannot be sized and names an unknown node', async () => {
    const refused = await thermal
      .post(`/api/v1/thermal-models/${demoModelId}/size`)
      .send({ caseHotId: hotCaseId, caseColdId: coldCaseId, node: 'structure' })
      .expect(200);
    expect(refused.body.heater.sizing).toBeNull();
    expect(refused.body.heater.refused).toMatch(/structure has no heater/);
    const unknown = await thermal.post(`/api/v1/thermal-models/${demoModelId}/size`).send({ caseHotId: hotCaseId, caseColdId: coldCaseId, node: 'antenna' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.details).toEqual([{ path: 'node', message: expect.stringContaining('no node is named "antenna"') }]);
    expect((await viewer.post(`/api/v1/thermal-models/${demoModelId}/size`).send({ caseHotId: hotCaseId, caseColdId: coldCaseId, node: 'battery' })).status).toBe(403);
  });
});

describe('the two-loop demo model (issue 14)', () => {
  it('holds both set points within their bands on the released hot and cold cases; each loop closes its energy within 0.5 % (API.md "Coolant loops")', async () => {
    const list = await thermal.get(`/api/v1/missions/${missionId}/thermal-models`).expect(200);
    const loopsModel = (list.body.items as { id: string; name: string }[]).find((m) => m.name === 'Kestrel-1 pumped loops, 2 loops')!;
    for (const caseId of [hotCaseId, coldCaseId]) {
      const run = (await thermal.post(`/api/v1/thermal-models/${loopsModel.id}/run`).send({ caseId }).expect(200)).body;
      for (const loop of run.result.loops as { closed: boolean; heatW: { averageW: number }[]; control: { pass: boolean; maxDeviationK: number } }[]) {
        expect(loop.closed).toBe(true);
        expect(loop.control.pass).toBe(true);
        const sum = loop.heatW.reduce((a, h) => a + h.averageW, 0);
        const abs = loop.heatW.reduce((a, h) => a + Math.abs(h.averageW), 0);
        expect(Math.abs(sum)).toBeLessThanOrEqual(0.005 * abs);
      }
      // The case has one eclipse: an entry and an exit for each of the two controlled nodes.
      expect((run.recoveries as { event: string }[]).map((r) => r.event).sort()).toEqual(['eclipse entry', 'eclipse entry', 'eclipse exit', 'eclipse exit']);
    }
  });
});
