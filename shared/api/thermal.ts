// The stateless thermal routes (API.md "Thermal solve"); a saved model (per mission) has the same shape.
//   POST /api/v1/thermal/solve  thermalSolveRequest -> 200 thermalSolveResponse          (any signed-in role)
//        no periodic state in the allowed orbits -> 422 code "not_converged"
//   POST /api/v1/thermal/size   thermalSizeRequest  -> 200 thermalSizeResponse            (any signed-in role)
//        nothing can meet the target (no radiator area, no heater power) -> 422 code "not_sizable"
// API.md fixes the core fields; the rest (radiative couplings, bus voltage, PI control, loops,
// margins, survival limits, solver options) are optional extensions.
import { z } from 'zod';
import { lineText } from './text';
import type { ThermalSolveInput } from '../physics/thermal-model';

const num = (label: string) => z.number({ message: `${label} must be a number` });
const celsius = (label: string) => num(label).min(-273.15, `${label} cannot be below absolute zero (-273.15 C)`).max(5000, `${label} is at most 5000 C`);
const name = lineText(80, 'a name has at most 80 characters').min(1, 'give a name');
const fraction = (label: string) => num(label).min(0, `${label} is 0..1`).max(1, `${label} is 0..1`);

const load = (label: string) => num(label).min(0, `${label} cannot be negative`).max(1e7);
const series = (label: string) =>
  z.union([load(label), z.array(load(label)).min(1)], { message: `${label} is a number or an array of one value per step` });

export const dissipationSchedule = z
  .strictObject({
    onW: num('onW').min(0, 'onW cannot be negative'),
    offW: num('offW').min(0, 'offW cannot be negative').optional(),
    periodS: num('periodS').positive('periodS must be above 0 s'),
    onS: num('onS').min(0, 'onS cannot be negative'),
    phaseS: num('phaseS').min(0, 'phaseS cannot be negative').optional(),
  })
  .refine((s) => s.onS <= s.periodS, { path: ['onS'], message: 'onS cannot be longer than periodS' });

/** A constant (W) or an on/off schedule; per-step arrays belong to a case, not to a saved model or a phase. */
export const savedDissipation = (label: string) =>
  z.union([num(label).min(0, `${label} cannot be negative`).max(1e7), dissipationSchedule], { message: `${label} is a number of W or an on/off schedule` });

export const thermalNode = z
  .strictObject({
    name,
    capacitanceJK: num('capacitanceJK').positive('capacitanceJK must be above 0 J/K').max(1e12).optional(),
    massKg: num('massKg').positive('massKg must be above 0 kg').optional(),
    specificHeatJKgK: num('specificHeatJKgK').positive('specificHeatJKgK must be above 0 J/(kg K)').optional(),
    initialC: celsius('initialC'),
    dissipationW: z.union([series('dissipationW'), dissipationSchedule]).optional(),
    absorbedW: series('absorbedW').optional(),
    radiatorAreaM2: num('radiatorAreaM2').min(0, 'radiatorAreaM2 cannot be negative').max(1e4).optional(),
    emissivity: fraction('emissivity').optional(),
    sinkC: celsius('sinkC').optional(),
    fixedC: celsius('fixedC').optional(),
    minC: celsius('minC').optional(),
    maxC: celsius('maxC').optional(),
    survivalMinC: celsius('survivalMinC').optional(),
    survivalMaxC: celsius('survivalMaxC').optional(),
  })
  .superRefine((node, ctx) => {
    const hasCapacitance = node.capacitanceJK !== undefined || (node.massKg !== undefined && node.specificHeatJKgK !== undefined);
    if (node.fixedC === undefined && !hasCapacitance) {
      ctx.addIssue({ code: 'custom', path: ['capacitanceJK'], message: 'give capacitanceJK, or massKg and specificHeatJKgK (or fixedC for a boundary)' });
    }
    if ((node.radiatorAreaM2 ?? 0) > 0 && node.emissivity === undefined) {
      ctx.addIssue({ code: 'custom', path: ['emissivity'], message: 'a node with a radiator needs its emissivity' });
    }
    if (node.minC !== undefined && node.maxC !== undefined && node.minC >= node.maxC) {
      ctx.addIssue({ code: 'custom', path: ['maxC'], message: `maxC must be above minC (${node.minC} C)` });
    }
    if (node.survivalMinC !== undefined && node.survivalMaxC !== undefined && node.survivalMinC >= node.survivalMaxC) {
      ctx.addIssue({ code: 'custom', path: ['survivalMaxC'], message: `survivalMaxC must be above survivalMinC (${node.survivalMinC} C)` });
    }
  });

export const conductiveCoupling = z.strictObject({
  from: name,
  to: name,
  conductanceWK: num('conductanceWK').positive('conductanceWK must be above 0 W/K').max(1e6),
});

export const radiativeCoupling = z.strictObject({
  from: name,
  to: name,
  areaM2: num('areaM2').positive('areaM2 must be above 0 m²').max(1e4),
  effectiveEmissivity: fraction('effectiveEmissivity'),
  viewFactor: fraction('viewFactor'),
});

export const busVoltage = z
  .strictObject({
    nominalV: num('nominalV').positive('nominalV must be above 0 V'),
    minV: num('minV').positive('minV must be above 0 V'),
    maxV: num('maxV').positive('maxV must be above 0 V'),
  })
  .refine((b) => b.minV <= b.nominalV && b.nominalV <= b.maxV, { message: 'the bus range needs minV <= nominalV <= maxV' });

export const heater = z
  .strictObject({
    name: name.optional(),
    node: name,
    powerW: num('powerW').min(0, 'powerW cannot be negative').max(1e6),
    control: z.enum(['thermostat', 'pi'], { message: 'control is thermostat or pi' }).optional(),
    onC: celsius('onC').optional(),
    offC: celsius('offC').optional(),
    setPointC: celsius('setPointC').optional(),
    proportionalWK: num('proportionalWK').min(0).optional(),
    integralWKs: num('integralWKs').min(0).optional(),
    busVoltage: busVoltage.optional(),
  })
  .superRefine((h, ctx) => {
    if ((h.control ?? 'thermostat') === 'thermostat') {
      if (h.onC === undefined) ctx.addIssue({ code: 'custom', path: ['onC'], message: 'a thermostat needs onC' });
      if (h.offC === undefined) ctx.addIssue({ code: 'custom', path: ['offC'], message: 'a thermostat needs offC' });
      if (h.onC !== undefined && h.offC !== undefined && h.offC <= h.onC) {
        ctx.addIssue({ code: 'custom', path: ['offC'], message: `offC must be above onC (${h.onC} C)` });
      }
    } else if (h.setPointC === undefined) {
      ctx.addIssue({ code: 'custom', path: ['setPointC'], message: 'a PI heater needs setPointC' });
    }
  });

/**
 * A pumped loop (API.md "Coolant loops"): closed with a `path` and no `inletC` (the coolant's
 * temperature computed), or open with `nodes` and `inletC` (coolant supplied at a fixed temperature).
 * With minFlowKgS < maxFlowKgS a PI controller sets the flow and `controlNode` is required.
 */
export const coolantLoop = z
  .strictObject({
    name,
    nodes: z.array(name).min(1, 'a loop cools at least one node').optional(),
    inletC: celsius('inletC').optional(),
    effectiveness: fraction('effectiveness').optional(),
    path: z.array(z.strictObject({
      node: name,
      conductanceWK: num('conductanceWK').positive('conductanceWK must be above 0 W/K').max(1e6),
    })).min(1, 'a closed loop passes at least one node').max(200, 'a path has at most 200 elements').optional(),
    fluidMassKg: num('fluidMassKg').positive('fluidMassKg must be above 0 kg').max(1e6).optional(),
    densityKgM3: num('densityKgM3').positive('densityKgM3 must be above 0 kg/m³').max(30000).optional(),
    specificHeatJKgK: num('specificHeatJKgK').positive('specificHeatJKgK must be above 0 J/(kg K)'),
    setPointC: celsius('setPointC').optional(),
    controlNode: name.optional(),
    minFlowKgS: num('minFlowKgS').min(0, 'minFlowKgS cannot be negative'),
    maxFlowKgS: num('maxFlowKgS').positive('maxFlowKgS must be above 0 kg/s'),
    nominalFlowKgS: num('nominalFlowKgS').positive('nominalFlowKgS must be above 0 kg/s'),
    proportionalKgSK: num('proportionalKgSK').min(0).optional(),
    integralKgSKs: num('integralKgSKs').min(0).optional(),
    bandK: num('bandK').positive('bandK must be above 0 K').max(100).optional(),
    feedforwardKgSW: num('feedforwardKgSW').min(-10, 'feedforwardKgSW is -10..10 kg/s per W').max(10, 'feedforwardKgSW is -10..10 kg/s per W').optional(),
    feedforwardLeadS: num('feedforwardLeadS').min(-1e6).max(1e6).optional(),
  })
  .superRefine((l, ctx) => {
    if (!(l.minFlowKgS <= l.nominalFlowKgS && l.nominalFlowKgS <= l.maxFlowKgS)) {
      ctx.addIssue({ code: 'custom', path: ['nominalFlowKgS'], message: `the flows need minFlowKgS <= nominalFlowKgS <= maxFlowKgS (got ${l.minFlowKgS}, ${l.nominalFlowKgS}, ${l.maxFlowKgS})` });
    }
    const closed = l.path !== undefined && l.inletC === undefined;
    if (closed) {
      if (l.nodes !== undefined) ctx.addIssue({ code: 'custom', path: ['nodes'], message: 'a closed loop lists its nodes in path; give nodes only with inletC (an open loop)' });
      if (l.fluidMassKg === undefined) ctx.addIssue({ code: 'custom', path: ['fluidMassKg'], message: 'a closed loop needs the mass of its coolant (fluidMassKg)' });
    } else {
      if (l.path !== undefined) ctx.addIssue({ code: 'custom', path: ['inletC'], message: 'a loop with a path is closed: its coolant temperature is computed, so leave out inletC' });
      if (l.inletC === undefined) ctx.addIssue({ code: 'custom', path: ['path'], message: 'give the path of a closed loop, or nodes and inletC for coolant supplied at a fixed temperature' });
      if (l.nodes === undefined && l.path === undefined) ctx.addIssue({ code: 'custom', path: ['nodes'], message: 'an open loop lists the nodes it cools' });
    }
    if (l.minFlowKgS < l.maxFlowKgS) {
      if (l.controlNode === undefined) ctx.addIssue({ code: 'custom', path: ['controlNode'], message: `the flow can vary (${l.minFlowKgS} to ${l.maxFlowKgS} kg/s): choose the one node it controls` });
      if (l.setPointC === undefined) ctx.addIssue({ code: 'custom', path: ['setPointC'], message: 'a controlled loop needs its set point' });
    }
  });

const modelShape = {
  periodS: num('periodS').positive('periodS must be above 0 s').max(1e9),
  steps: z.number().int('steps is a whole number').min(12, 'steps is 12..100000').max(100000, 'steps is 12..100000'),
  nodes: z.array(thermalNode).min(1, 'give at least one node').max(5000, 'at most 5000 nodes'),
  couplings: z.array(conductiveCoupling).max(50000).optional(),
  radiativeCouplings: z.array(radiativeCoupling).max(50000).optional(),
  heaters: z.array(heater).max(1000).optional(),
  loops: z.array(coolantLoop).max(100).optional(),
  margins: z.strictObject({
    operatingK: num('operatingK').min(0, 'a margin cannot be negative').max(100).optional(),
    survivalK: num('survivalK').min(0, 'a margin cannot be negative').max(100).optional(),
  }).optional(),
  toleranceK: num('toleranceK').min(1e-6, 'toleranceK is 1e-6..10 K').max(10, 'toleranceK is 1e-6..10 K').optional(),
  maxOrbits: z.number().int('maxOrbits is a whole number').min(1, 'maxOrbits is 1..2000').max(2000, 'maxOrbits is 1..2000').optional(),
  substeps: z.number().int('substeps is a whole number').min(1, 'substeps is 1..100').max(100, 'substeps is 1..100').optional(),
  start: z.enum(['orbit-average', 'initial'], { message: 'start is orbit-average or initial' }).optional(),
  /** 'refuse' (the default, API.md): 422 when no periodic state is reached; 'last-orbit': 200 with the last orbit, converged false. */
  whenUnsettled: z.enum(['refuse', 'last-orbit'], { message: 'whenUnsettled is refuse or last-orbit' }).optional(),
};

type ModelFields = z.infer<z.ZodObject<typeof modelShape>>;

/** Checks that cross fields: names unique, references to nodes that exist, one value per step. */
function checkReferences(m: ModelFields, ctx: z.RefinementCtx): void {
  const names = new Map<string, number>();
  m.nodes.forEach((node, i) => {
    if (names.has(node.name)) ctx.addIssue({ code: 'custom', path: ['nodes', i, 'name'], message: `node name ${JSON.stringify(node.name)} is already used by nodes.${names.get(node.name)}` });
    else names.set(node.name, i);
    for (const field of ['absorbedW', 'dissipationW'] as const) {
      const v = node[field];
      if (Array.isArray(v) && v.length !== m.steps) {
        ctx.addIssue({ code: 'custom', path: ['nodes', i, field], message: `${field} has ${v.length} values; give one per step (${m.steps})` });
      }
    }
  });
  const known = (path: (string | number)[], value: string) => {
    if (!names.has(value)) ctx.addIssue({ code: 'custom', path, message: `no node is named ${JSON.stringify(value)}` });
  };
  const free = (path: (string | number)[], value: string, what: string) => {
    const i = names.get(value);
    if (i === undefined) known(path, value);
    else if (m.nodes[i].fixedC !== undefined) ctx.addIssue({ code: 'custom', path, message: `${what} cannot act on ${JSON.stringify(value)}, a boundary at a fixed temperature` });
  };
  for (const [list, key] of [[m.couplings, 'couplings'], [m.radiativeCouplings, 'radiativeCouplings']] as const) {
    (list ?? []).forEach((c, k) => {
      known([key, k, 'from'], c.from);
      known([key, k, 'to'], c.to);
      if (c.from === c.to) ctx.addIssue({ code: 'custom', path: [key, k, 'to'], message: `a coupling joins two different nodes (both are ${JSON.stringify(c.to)})` });
    });
  }
  (m.heaters ?? []).forEach((h, k) => free(['heaters', k, 'node'], h.node, 'a heater'));
  (m.loops ?? []).forEach((l, k) => {
    (l.nodes ?? []).forEach((n, j) => free(['loops', k, 'nodes', j], n, 'a loop'));
    (l.path ?? []).forEach((e, j) => free(['loops', k, 'path', j, 'node'], e.node, 'a loop'));
    const seen = new Set<string>();
    (l.path ?? []).forEach((e, j) => {
      if (seen.has(e.node)) ctx.addIssue({ code: 'custom', path: ['loops', k, 'path', j, 'node'], message: `the path passes ${JSON.stringify(e.node)} twice` });
      seen.add(e.node);
    });
    // The controlled node may be any node of the model (a loop can hold a node it reaches through a coupling).
    if (l.controlNode !== undefined) free(['loops', k, 'controlNode'], l.controlNode, 'a loop controller');
  });
}

export const thermalSolveRequest = z.strictObject(modelShape).superRefine(checkReferences);

export const thermalSizing = z.discriminatedUnion('kind', [
  z.strictObject({
    kind: z.literal('radiator'),
    node: name,
    marginK: num('marginK').min(0, 'a margin cannot be negative').max(100).optional(),
  }),
  z.strictObject({
    kind: z.literal('heater'),
    node: name,
    marginK: num('marginK').min(0, 'a margin cannot be negative').max(100).optional(),
    /** Default 0.75: the middle of DOMAIN.md's 70-80 % at minimum bus voltage [M]. */
    maxDutyCycle: num('maxDutyCycle').gt(0, 'maxDutyCycle is above 0, at most 1').max(1, 'maxDutyCycle is above 0, at most 1').optional(),
  }),
], { message: 'sizing.kind is radiator or heater' });

export const thermalSizeRequest = z
  .strictObject({ ...modelShape, sizing: thermalSizing })
  .superRefine((r, ctx) => {
    checkReferences(r, ctx);
    if (!r.nodes.some((n) => n.name === r.sizing.node)) ctx.addIssue({ code: 'custom', path: ['sizing', 'node'], message: `no node is named ${JSON.stringify(r.sizing.node)}` });
  });

const limitCheck = z.object({
  kind: z.enum(['operating', 'survival']),
  minC: z.number().nullable(),
  maxC: z.number().nullable(),
  marginK: z.number(),
  coldMarginK: z.number().nullable(),
  hotMarginK: z.number().nullable(),
  pass: z.boolean(),
});

const voltageResult = z.object({
  voltageV: z.number(), powerW: z.number(), dutyCycle: z.number(), orbitAverageW: z.number(), peakW: z.number(), nodeMinC: z.number(),
});

export const thermalSolveResponse = z.object({
  /** False only when the request asked for the last orbit of a run that did not settle (`whenUnsettled`). */
  converged: z.boolean(),
  /** Why the answer is the last orbit and not the periodic state; null when it settled. */
  unsettled: z.object({
    node: z.string(), lastChangeK: z.number(), remainingK: z.number(), endC: z.number(), toleranceK: z.number(), message: z.string(),
  }).nullable(),
  orbits: z.number().int(),
  periodOrbits: z.number().int(),
  averagedOrbits: z.number().int(),
  residualK: z.number(),
  tS: z.array(z.number()),
  nodes: z.array(z.object({
    name: z.string(), minC: z.number(), maxC: z.number(), meanC: z.number(), temperaturesC: z.array(z.number()), limits: z.array(limitCheck),
  })),
  heaters: z.array(z.object({
    name: z.string(), node: z.string(), dutyCycle: z.number(), orbitAverageW: z.number(), peakW: z.number(), powerW: z.array(z.number()),
    atMinVoltage: voltageResult.optional(), atMaxVoltage: voltageResult.optional(),
  })),
  loops: z.array(z.object({
    name: z.string(), closed: z.boolean(), flowKgS: z.array(z.number()), averageFlowKgS: z.number(), nominalFlowKgS: z.number(), averageToNominal: z.number(), heatRemovedW: z.number(),
    coolantC: z.array(z.object({ node: z.string(), temperaturesC: z.array(z.number()) })),
    heatW: z.array(z.object({ node: z.string(), averageW: z.number() })),
    saturatedFraction: z.number(),
    densityKgM3: z.number().nullable(),
    control: z.object({ node: z.string(), setPointC: z.number(), bandK: z.number(), maxDeviationK: z.number(), outsideBandS: z.number(), pass: z.boolean() }).nullable(),
  })),
  pass: z.boolean(),
  assumptions: z.array(z.string()),
});

export const thermalSizeResponse = z.object({
  sizing: z.union([
    z.object({ kind: z.literal('radiator'), node: z.string(), areaM2: z.number(), equationAreaM2: z.number().nullable(), targetMaxC: z.number(), achievedMaxC: z.number(), solves: z.number(), note: z.string().nullable() }),
    z.object({
      kind: z.literal('heater'), node: z.string(), powerW: z.number(), minVoltageV: z.number().nullable(), powerAtMinVoltageW: z.number(),
      dutyCycleAtMinVoltage: z.number(), orbitAverageAtMinVoltageW: z.number(), maxDutyCycle: z.number(), targetMinC: z.number(), achievedMinC: z.number(), solves: z.number(), note: z.string().nullable(),
    }),
  ]),
});

export type ThermalSolveRequestInput = z.input<typeof thermalSolveRequest>;
export type ThermalSolveRequest = z.infer<typeof thermalSolveRequest>;
export type ThermalSolveResponse = z.infer<typeof thermalSolveResponse>;
export type ThermalSizeRequest = z.infer<typeof thermalSizeRequest>;
export type ThermalSizeResponse = z.infer<typeof thermalSizeResponse>;

// A parsed request must be something the solver accepts; this fails to compile if they drift apart.
export const asThermalSolveInput = (parsed: ThermalSolveRequest | ThermalSizeRequest): ThermalSolveInput => parsed;
