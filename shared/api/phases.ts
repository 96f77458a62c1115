// A mission's attitude modes and phases (issue 19 items 2 and 3).
// Routes (under /api/v1). Thermal engineers and owners edit; analysts and viewers read; another
// workspace's mission is 404.
//   GET    missions/:id/attitude-modes                  -> {items: attitudeMode[]}
//   POST   missions/:id/attitude-modes                  attitudeModeCreate -> 201 attitudeMode
//   PATCH  missions/:id/attitude-modes/:modeId          attitudeModeUpdate -> attitudeMode
//   DELETE missions/:id/attitude-modes/:modeId          -> 204 (409 naming the phases that fly it)
//   GET    missions/:id/phases                          -> {items: missionPhase[]} (by start date)
//   POST   missions/:id/phases                          phaseCreate -> 201 missionPhase
//   PATCH  missions/:id/phases/:phaseId                 phaseUpdate -> missionPhase
//   DELETE missions/:id/phases/:phaseId                 -> 204
// A surface is defined once (its own `normal` in the spacecraft's local frame); a mode gives each
// surface it lists a pointing, any `normal` the compute route accepts (surfaceNormal); surfaces it
// does not list keep their own normal. `yawSteering` wraps each local-orbital normal of the mode as
// {"yawSteered": {"normal": n}} when computing (shared/physics/attitude-modes.ts).
// A phase's dissipation names thermal-model nodes by name: a constant in W or the saved models'
// on/off schedule ({onW, offW, periodS, onS, phaseS}); a node a phase does not name keeps its
// model's own dissipation in that phase's cases.
import { z } from 'zod';
import { lineText, multilineText } from './text';
import { surfaceNormal } from './missions';
import { savedDissipation } from './thermal';

const isoDate = z.iso.date({ message: 'is a date like 2027-03-20' });
const text = (label: string, max: number) => lineText(max, `the ${label} has at most ${max} characters`).min(1, `give the ${label}`);
const id = (label: string) => z.string().min(1, `choose ${label}`).max(64);

const unique = <T>(key: (x: T) => string, what: string) => (list: readonly T[], ctx: z.core.$RefinementCtx<readonly T[]>) => {
  const seen = new Set<string>();
  list.forEach((x, i) => {
    const k = key(x);
    if (seen.has(k)) ctx.addIssue({ code: 'custom', path: [i], input: k, message: `${what} ${JSON.stringify(k)} is listed twice` });
    seen.add(k);
  });
};

export const modePointing = z.strictObject({
  surfaceId: id('a surface'),
  normal: surfaceNormal,
});

const modeFields = {
  name: text('mode name', 80),
  description: multilineText(1000).default(''),
  /** Rotate about nadir to keep the Sun off the orbit-normal faces: each local-orbital normal of the mode is yaw-steered. */
  yawSteering: z.boolean().default(false),
  pointing: z.array(modePointing).max(200).superRefine(unique((p: z.infer<typeof modePointing>) => p.surfaceId, 'surface')).default([]),
};

export const attitudeModeCreate = z.strictObject(modeFields);
export const attitudeModeUpdate = z.strictObject({
  name: modeFields.name.optional(),
  description: multilineText(1000).optional(),
  yawSteering: z.boolean().optional(),
  pointing: z.array(modePointing).max(200).superRefine(unique((p: z.infer<typeof modePointing>) => p.surfaceId, 'surface')).optional(),
});

export const attitudeMode = z.object({
  id: z.string(),
  missionId: z.string(),
  name: z.string(),
  description: z.string(),
  yawSteering: z.boolean(),
  /** Surfaces the mode points, with the surface's name for reading; a surface since removed is left out. */
  pointing: z.array(modePointing.extend({ surfaceName: z.string() })),
  createdAt: z.string(),
  updatedAt: z.string(),
});

export const phaseDissipation = z.strictObject({
  node: text('node name', 80),
  dissipationW: savedDissipation('dissipationW'),
});

const datesInOrder = (p: { startDate?: string | undefined; endDate?: string | undefined }) =>
  p.startDate === undefined || p.endDate === undefined || p.startDate <= p.endDate;
const datesMessage = { path: ['endDate'], message: 'the phase ends before it starts' };
const dissipationList = z.array(phaseDissipation).max(500).superRefine(unique((d: z.infer<typeof phaseDissipation>) => d.node, 'node'));

export const phaseCreate = z
  .strictObject({
    name: text('phase name', 80),
    description: multilineText(1000).default(''),
    /** Both days included, 00:00 to 24:00 UTC. */
    startDate: isoDate,
    endDate: isoDate,
    modeId: id('an attitude mode'),
    dissipation: dissipationList.default([]),
  })
  .refine(datesInOrder, datesMessage);

export const phaseUpdate = z
  .strictObject({
    name: text('phase name', 80).optional(),
    description: multilineText(1000).optional(),
    startDate: isoDate.optional(),
    endDate: isoDate.optional(),
    modeId: id('an attitude mode').optional(),
    dissipation: dissipationList.optional(),
  })
  .refine(datesInOrder, datesMessage);

export const missionPhase = z.object({
  id: z.string(),
  missionId: z.string(),
  name: z.string(),
  description: z.string(),
  startDate: z.string(),
  endDate: z.string(),
  modeId: z.string(),
  modeName: z.string(),
  dissipation: z.array(phaseDissipation),
  createdAt: z.string(),
  updatedAt: z.string(),
});

/** A phase as a case keeps it (inputs.phase): its dates, its mode's pointing and its dissipation, frozen with the case. */
export const casePhase = z.object({
  id: z.string(),
  name: z.string(),
  startDate: z.string(),
  endDate: z.string(),
  mode: z.object({ id: z.string(), name: z.string(), yawSteering: z.boolean() }),
  dissipation: z.array(phaseDissipation),
});

/**
 * A case chosen among the mission's phases keeps every phase as it was when the choice was made: what
 * the choice depended on (its dates, its attitude mode and the normal that mode gave each surface, its
 * orbit-average dissipation), so a change to any phase says the case is out of date. Names do not enter it.
 */
export const casePhaseCompared = z.object({
  id: z.string(),
  name: z.string(),
  startDate: z.string(),
  endDate: z.string(),
  mode: z.object({ id: z.string(), name: z.string() }),
  normals: z.record(z.string(), surfaceNormal).describe('surface name -> the normal it had in the mode'),
  dissipationW: z.number().describe("orbit-average dissipation of the nodes the phase names, W, over the case's orbit"),
});

export type AttitudeMode = z.infer<typeof attitudeMode>;
export type AttitudeModeCreate = z.input<typeof attitudeModeCreate>;
export type MissionPhase = z.infer<typeof missionPhase>;
export type PhaseCreate = z.input<typeof phaseCreate>;
export type PhaseDissipation = z.infer<typeof phaseDissipation>;
export type CasePhase = z.infer<typeof casePhase>;
export type CasePhaseCompared = z.infer<typeof casePhaseCompared>;
