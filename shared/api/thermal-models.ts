// Saved thermal models per mission, and their runs against a mission's load cases.
// Routes (under /api/v1). Thermal engineers and owners create and edit; analysts may also run and
// size (computing, nothing of the model changes); every member reads; another workspace's is 404.
//   GET    missions/:id/thermal-models          -> {items: thermalModelSummary[]}
//   POST   missions/:id/thermal-models          thermalModelCreate -> 201 thermalModelDetail
//   GET    thermal-models/:id                   -> thermalModelDetail
//   PATCH  thermal-models/:id                   thermalModelUpdate -> thermalModelDetail
//   DELETE thermal-models/:id                   -> 204
//   POST   thermal-models/:id/run               {caseId} -> thermalRunResponse (the last run per case is kept)
//   GET    thermal-models/:id/runs/:caseId      -> thermalRunResponse (the kept one)
//   POST   thermal-models/:id/size              thermalModelSizeRequest -> thermalModelSizeResponse
//   POST   thermal-models/:id/distance-study    thermalDistanceStudyRequest -> NDJSON of DistanceStudyLine (start, one per distance, end)
// A model is the body of POST /thermal/solve (shared/api/thermal.ts) without the orbit: the period,
// the steps and each node's absorbed load come from the case it is run against.
import { z } from 'zod';
import { bodyIds } from '../physics/bodies';
import type { DistancePointResult, StudyDistance } from '../physics/thermal-distance-study';
import { lineText, multilineText } from './text';
import { caseKinds, caseStatuses } from './case-content';
import { conductiveCoupling, coolantLoop, heater, radiativeCoupling, thermalNode, thermalSolveResponse, thermalSizeResponse, savedDissipation } from './thermal';

const num = (label: string) => z.number({ message: `${label} must be a number` });
const modelName = lineText(120, 'a model name has at most 120 characters').min(1, 'give the model a name');

// The stateless node without the case's per-step load; the solve schema checks the rest on save.
export const savedThermalNode = z
  .strictObject(thermalNode.shape)
  .omit({ absorbedW: true, dissipationW: true })
  .extend({
    /** Used for any case without a value of its own (custom cases). */
    dissipationW: savedDissipation('dissipationW').optional(),
    hotDissipationW: savedDissipation('hotDissipationW').optional(),
    coldDissipationW: savedDissipation('coldDissipationW').optional(),
    /** The mission's surfaces whose absorbed load the node takes, and through which it radiates. */
    surfaceIds: z.array(z.string().min(1).max(64)).max(100).default([]),
  });

export const thermalModelContent = z.strictObject({
  nodes: z.array(savedThermalNode).min(1, 'give at least one node').max(500, 'at most 500 nodes in a saved model'),
  couplings: z.array(conductiveCoupling).max(5000).default([]),
  radiativeCouplings: z.array(radiativeCoupling).max(5000).default([]),
  heaters: z.array(heater).max(200).default([]),
  loops: z.array(coolantLoop).max(50).default([]),
  margins: z
    .strictObject({
      operatingK: num('operatingK').min(0, 'a margin cannot be negative').max(100).optional(),
      survivalK: num('survivalK').min(0, 'a margin cannot be negative').max(100).optional(),
    })
    .default({}),
  /** Heater sizing limit at minimum bus voltage; 0.75 is the middle of DOMAIN.md's 70-80 % [M]. */
  maxDutyCycle: num('maxDutyCycle').gt(0, 'maxDutyCycle is above 0, at most 1').max(1, 'maxDutyCycle is above 0, at most 1').default(0.75),
  toleranceK: num('toleranceK').min(1e-6, 'toleranceK is 1e-6..10 K').max(10, 'toleranceK is 1e-6..10 K').optional(),
  maxOrbits: z.number().int('maxOrbits is a whole number').min(1, 'maxOrbits is 1..2000').max(2000, 'maxOrbits is 1..2000').optional(),
  substeps: z.number().int('substeps is a whole number').min(1, 'substeps is 1..100').max(100, 'substeps is 1..100').optional(),
});

export const thermalModelCreate = z.strictObject({
  name: modelName,
  description: multilineText(2000).default(''),
  model: thermalModelContent,
});

export const thermalModelUpdate = z.strictObject({
  name: modelName.optional(),
  description: multilineText(2000).optional(),
  /** The whole model: tables are replaced together, so a reference never points at a removed node. */
  model: thermalModelContent.optional(),
});

export const thermalRunRequest = z.strictObject({
  caseId: z.string().min(1, 'choose a load case').max(64),
  /** Orbits allowed for this run (else the model's maxOrbits, else 200); a run that does not settle answers its last orbit. */
  maxOrbits: z.number({ message: 'maxOrbits must be a number' }).int('maxOrbits is a whole number').min(1, 'maxOrbits is 1..2000').max(2000, 'maxOrbits is 1..2000').optional(),
});

export const thermalModelSizeRequest = z.strictObject({
  caseHotId: z.string().min(1, 'choose the hot case').max(64),
  caseColdId: z.string().min(1, 'choose the cold case').max(64),
  /** The node whose radiator is sized in the hot case (and whose heater, unless heaterNode). */
  node: lineText(80).min(1, 'choose a node'),
  heaterNode: lineText(80).min(1).optional(),
  /** Defaults: the model's operating margin, and its maxDutyCycle. */
  marginK: num('marginK').min(0, 'a margin cannot be negative').max(100).optional(),
  maxDutyCycle: num('maxDutyCycle').gt(0, 'maxDutyCycle is above 0, at most 1').max(1, 'maxDutyCycle is above 0, at most 1').optional(),
});

/** Most distances one study may ask for (each is a solve and a radiator sizing). */
export const MAX_STUDY_DISTANCES = 12;

export const thermalDistanceStudyRequest = z.strictObject({
  caseId: z.string().min(1, 'choose a load case').max(64),
  /** The node whose radiator is sized at each distance. */
  node: lineText(80).min(1, 'choose the radiator node'),
  distancesAu: z.array(num('distancesAu').min(0.05, 'a distance is 0.05..50 AU').max(50, 'a distance is 0.05..50 AU')).max(MAX_STUDY_DISTANCES).optional(),
  /** Bodies whose mean distance from the Sun is taken. */
  bodyIds: z.array(z.enum(bodyIds, { message: `a body is one of ${bodyIds.join(', ')}` })).max(MAX_STUDY_DISTANCES).optional(),
  /** The perihelion and aphelion of the mission's body (or of its planet). */
  missionRange: z.boolean({ message: 'missionRange is true or false' }).optional(),
  /** Default: the model's operating margin, else the case's. */
  marginK: num('marginK').min(0, 'a margin cannot be negative').max(100).optional(),
}).superRefine((body, ctx) => {
  const count = (body.distancesAu?.length ?? 0) + (body.bodyIds?.length ?? 0) + (body.missionRange ? 2 : 0);
  if (count === 0) ctx.addIssue({ code: 'custom', path: ['distancesAu'], message: 'give at least one distance, body or the mission\'s perihelion and aphelion' });
  if (count > MAX_STUDY_DISTANCES) ctx.addIssue({ code: 'custom', path: ['distancesAu'], message: `at most ${MAX_STUDY_DISTANCES} distances in one study (got ${count})` });
});
export type ThermalDistanceStudyRequest = z.input<typeof thermalDistanceStudyRequest>;

/** The study's answer, one JSON line at a time. */
export type DistanceStudyLine =
  | {
      type: 'start';
      model: { id: string; name: string };
      case: { id: string; name: string; kind: string; revision: number; solarFluxWm2: number };
      node: string;
      marginK: number;
      distances: StudyDistance[];
      assumptions: string[];
    }
  | ({ type: 'point'; index: number; label: string; distanceAu: number; solarFluxWm2: number; solarScale: number } & DistancePointResult)
  | { type: 'end'; points: number }
  | { type: 'error'; message: string };

const person = z.object({ id: z.string(), name: z.string(), email: z.string() }).nullable();

const caseRef = z.object({
  id: z.string(),
  name: z.string(),
  kind: z.enum(caseKinds),
  status: z.enum(caseStatuses),
  revision: z.number().int(),
});

export const thermalRunSummary = z.object({
  case: caseRef,
  pass: z.boolean(),
  ranAt: z.string(),
  /** The model changed after this run. */
  stale: z.boolean(),
});

export const thermalModelSummary = z.object({
  id: z.string(),
  missionId: z.string(),
  workspaceId: z.string(),
  name: z.string(),
  description: z.string(),
  nodeCount: z.number().int(),
  heaterCount: z.number().int(),
  createdBy: person,
  createdAt: z.string(),
  updatedAt: z.string(),
});

export const thermalModelDetail = thermalModelSummary.extend({
  crewed: z.boolean(),
  model: thermalModelContent,
  runs: z.array(thermalRunSummary),
});

/** What each node was given from the case: the sum over its surfaces, and what it radiates through. */
export const thermalRunNodeInput = z.object({
  name: z.string(),
  surfaces: z.array(z.string()),
  orbitAverageAbsorbedW: z.number(),
  peakAbsorbedW: z.number(),
  radiatorAreaM2: z.number(),
  emissivity: z.number().nullable(),
  dissipation: z.string(),
});

export const thermalRunResponse = z.object({
  model: z.object({ id: z.string(), name: z.string(), updatedAt: z.string() }),
  case: caseRef.extend({ periodS: z.number(), steps: z.number().int(), eclipseFraction: z.number(), sunlit: z.array(z.number()) }),
  crewed: z.boolean(),
  ranAt: z.string(),
  stale: z.boolean(),
  inputs: z.array(thermalRunNodeInput),
  /** Exactly what went to the solver: POST it to /thermal/solve to repeat the run. */
  solveRequest: z.record(z.string(), z.unknown()),
  result: thermalSolveResponse,
  /** Per controlled loop: the time its node takes to return within the band after each eclipse entry and exit (null: it does not before the next). Runs kept from before loops were judged have none. */
  recoveries: z.array(z.object({
    loop: z.string(), node: z.string(), event: z.enum(['eclipse entry', 'eclipse exit']), atS: z.number(), returnS: z.number().nullable(),
  })).optional(),
  assumptions: z.array(z.string()),
});

const sizingOf = <T extends z.ZodType>(schema: T) => z.object({ case: caseRef, sizing: schema.nullable(), refused: z.string().nullable() });
const [radiatorSizing, heaterSizing] = thermalSizeResponse.shape.sizing.options;

export const thermalModelSizeResponse = z.object({
  radiator: sizingOf(radiatorSizing),
  heater: sizingOf(heaterSizing),
  /** The operating margins the sizing held: from the model, else the case's temperature margin. */
  margins: z.object({ hotK: z.number(), coldK: z.number() }),
  maxDutyCycle: z.number(),
});

export type SavedThermalNode = z.infer<typeof savedThermalNode>;
export type ThermalModelContent = z.infer<typeof thermalModelContent>;
export type ThermalModelContentInput = z.input<typeof thermalModelContent>;
export type ThermalModelCreate = z.input<typeof thermalModelCreate>;
export type ThermalModelUpdate = z.input<typeof thermalModelUpdate>;
export type ThermalModelSummary = z.infer<typeof thermalModelSummary>;
export type ThermalModelDetail = z.infer<typeof thermalModelDetail>;
export type ThermalRunResponse = z.infer<typeof thermalRunResponse>;
export type ThermalRunNodeInput = z.infer<typeof thermalRunNodeInput>;
export type ThermalModelSizeRequest = z.input<typeof thermalModelSizeRequest>;
export type ThermalModelSizeResponse = z.infer<typeof thermalModelSizeResponse>;
