// Missions, their orbits and spacecraft surfaces, the material library and the mission sweep.
// Routes (under /api/v1). Editing: analyst, thermal, owner; reading: every member; others 404.
//   GET    missions?includeArchived=true          -> {items: mission[]}   (every workspace of the caller)
//   POST   missions                               missionCreate -> 201 mission
//   GET    missions/:id                           -> missionDetail (mission + orbits + surfaces)
//   PATCH  missions/:id                           missionUpdate -> mission   ({archived: true} archives)
//   DELETE missions/:id                           -> 204 (owner only; removes everything in it; 409 naming
//                                                   its released or superseded cases, which are never deleted)
//   GET    missions/:id/orbits                    -> {items: orbit[]}
//   POST   missions/:id/orbits                    orbitCreate -> 201 orbit
//   GET|PATCH|DELETE missions/:id/orbits/:orbitId  (PATCH orbitUpdate)
//   POST   missions/:id/orbits/:orbitId/environment  savedEnvironmentRequest -> environmentResponse
//             (the compute route on the saved orbit and the mission's surfaces with their materials)
//   GET    missions/:id/orbits/:orbitId/sweep?from=YYYY-MM-DD&to=YYYY-MM-DD&stepDays=1&properties=bol|eol
//             -> application/x-ndjson, one sweepLine per line: start, then one day each, then end
//             (defaults: the mission's start and end dates); ?format=csv answers the days as CSV
//   GET    missions/:id/surfaces                  -> {items: surface[]}
//   POST   missions/:id/surfaces                  surfaceCreate -> 201 surface
//   PATCH|DELETE missions/:id/surfaces/:surfaceId
//   GET    materials?workspaceId=                 -> {items: material[]}  (the library plus the workspace's own)
//   POST   workspaces/:workspaceId/materials      materialCreate -> 201 material
//   PATCH|DELETE workspaces/:workspaceId/materials/:materialId   (only a workspace's own materials)
import { z } from 'zod';
import { anyBodyId, anyBodyIdOut } from './body-id';
import { lineText, multilineText } from './text';
import { answerLayout } from './answer-formats';
import { samplings } from '../physics/orbit-sampling';
import { surfaceNormal } from './pointing';

const isoDate = z.iso.date({ message: 'is a date like 2027-03-20' });
const text = (label: string, max: number) => lineText(max, `the ${label} has at most ${max} characters`).min(1, `give the ${label}`);

/** A number in the field's own unit, or text with a unit ("550 km", "341.8 mi", "95 min"). */
export const quantity = z.union([z.number(), lineText(60).min(1)], {
  message: 'is a number or a value with its unit, e.g. "550 km"',
});

export const mission = z.object({
  id: z.string(),
  workspaceId: z.string(),
  name: z.string(),
  bodyId: anyBodyIdOut,
  description: z.string(),
  startDate: z.string(),
  endDate: z.string(),
  /** A crewed vehicle: result pages add the habitability caution. */
  crewed: z.boolean(),
  archived: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
});

const missionFields = {
  name: text('mission name', 120),
  bodyId: anyBodyId(),
  description: multilineText(4000).default(''),
  startDate: isoDate,
  endDate: isoDate,
  crewed: z.boolean().default(false),
};

const datesInOrder = (m: { startDate?: string; endDate?: string }) =>
  m.startDate === undefined || m.endDate === undefined || m.startDate <= m.endDate;
const datesMessage = { path: ['endDate'], message: 'the mission ends before it starts' };

export const missionCreate = z
  .strictObject({ workspaceId: z.string().max(64).optional(), ...missionFields })
  .refine(datesInOrder, datesMessage);

export const missionUpdate = z
  .strictObject({
    name: missionFields.name.optional(),
    bodyId: missionFields.bodyId.optional(),
    description: multilineText(4000).optional(),
    startDate: isoDate.optional(),
    endDate: isoDate.optional(),
    crewed: z.boolean().optional(),
    archived: z.boolean().optional(),
  })
  .refine(datesInOrder, datesMessage);

export const orbitDefinitions = ['altitudes', 'semi-major-axis', 'period'] as const;

/** What the user typed, kept as typed; each value a number in the field's unit or text with a unit. */
export const orbitFieldsInput = z.strictObject({
  periapsisAltitudeKm: quantity.optional(),
  apoapsisAltitudeKm: quantity.optional(),
  semiMajorAxisKm: quantity.optional(),
  eccentricity: z.number().optional(),
  periodS: quantity.optional(),
  inclinationDeg: quantity.optional(),
  raanDeg: quantity.optional(),
  argPeriapsisDeg: quantity.optional(),
});

export const orbitCreate = orbitFieldsInput.extend({
  name: text('orbit name', 80),
  epoch: z.iso.datetime({ offset: true, message: 'epoch is an ISO 8601 date and time, e.g. 2027-03-20T12:00:00Z' }),
});
export const orbitUpdate = orbitCreate.partial();

export const orbit = z.object({
  id: z.string(),
  missionId: z.string(),
  name: z.string(),
  definition: z.enum(orbitDefinitions),
  /** The fields as the user typed them, units included. */
  input: z.record(z.string(), z.union([z.number(), z.string()])),
  epoch: z.string(),
  // Canonical SI-style values (km, s, deg), whichever definition was used.
  periapsisAltitudeKm: z.number(),
  apoapsisAltitudeKm: z.number(),
  semiMajorAxisKm: z.number(),
  eccentricity: z.number(),
  periodS: z.number(),
  inclinationDeg: z.number(),
  raanDeg: z.number(),
  argPeriapsisDeg: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
});

export const material = z.object({
  id: z.string(),
  /** null for the built-in library (DOMAIN.md's table); a workspace id for a workspace's own. */
  workspaceId: z.string().nullable(),
  name: z.string(),
  absorptivityBol: z.number(),
  emissivityBol: z.number(),
  absorptivityEol: z.number(),
  emissivityEol: z.number(),
  source: z.string(),
});

const fraction = (label: string) =>
  z.number({ message: `${label} must be a number` }).min(0, `${label} is 0..1`).max(1, `${label} is 0..1`);

export const materialCreate = z.strictObject({
  name: text('material name', 120),
  absorptivityBol: fraction('absorptivityBol'),
  emissivityBol: fraction('emissivityBol'),
  absorptivityEol: fraction('absorptivityEol'),
  emissivityEol: fraction('emissivityEol'),
  source: lineText(300).default('workspace entry, no source given'),
});
export const materialUpdate = materialCreate.partial();

export { surfaceNormal };

export const surface = z.object({
  id: z.string(),
  missionId: z.string(),
  name: z.string(),
  areaM2: z.number(),
  normal: surfaceNormal,
  materialId: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});

export const surfaceCreate = z.strictObject({
  name: text('surface name', 80),
  /** m² as a number, or text with a unit ("0.5 m^2", "5000 cm^2"). */
  areaM2: quantity,
  normal: surfaceNormal,
  materialId: z.string().min(1, 'choose a material').max(64),
});
export const surfaceUpdate = surfaceCreate.partial();

export const missionDetail = mission.extend({ orbits: z.array(orbit), surfaces: z.array(surface) });

export const propertySets = ['bol', 'eol'] as const;

export const savedEnvironmentRequest = z.strictObject({
  steps: z.number().int().min(12, 'steps is 12..100000').max(100000, 'steps is 12..100000').default(360),
  properties: z.enum(propertySets).default('bol'),
  betaDeg: z.number().min(-90).max(90).optional(),
  albedo: z.number().min(0).max(1).optional(),
  olrWm2: z.number().min(0).max(20000).optional(),
  solarDistanceAu: z.number().positive().max(100).optional(),
  /** Default: evenly in eccentric anomaly for an orbit of e >= 0.1 (the periapsis pass in the plots), else evenly in time. */
  sampling: z.enum(samplings, { message: `sampling is one of ${samplings.join(', ')}` }).optional(),
});

export const sweepQuery = z.strictObject({
  from: isoDate.optional(),
  to: isoDate.optional(),
  stepDays: z.coerce.number().int().min(1, 'stepDays is 1..365').max(365, 'stepDays is 1..365').default(1),
  properties: z.enum(propertySets).default('bol'),
  format: z.enum(['ndjson', 'csv']).default('ndjson'),
  /** Columnar JSON of the whole sweep at once instead of the stream (API.md "Answer formats"). */
  layout: answerLayout,
});

export const sweepDay = z.object({
  type: z.literal('day'),
  index: z.number(),
  date: z.string(),
  betaDeg: z.number(),
  eclipseFraction: z.number(),
  eclipseDurationS: z.number(),
  solarDistanceAu: z.number(),
  solarFluxWm2: z.number(),
  surfaces: z.array(z.object({ surfaceId: z.string(), name: z.string(), absorbedW: z.number() })),
  /** The day's longest continuous shadow, penumbra included, s: the body's own, or about a moon a passage through its planet's shadow. */
  longestShadowS: z.number(),
  /** The bodies that cast it (body ids); empty without shadow. */
  longestShadowCastBy: z.array(z.string()),
  /** Its start (ISO 8601 UTC) when the planet takes part; null for the body's own shadow. */
  longestShadowStart: z.string().nullable(),
});

export const sweepLine = z.discriminatedUnion('type', [
  z.object({
    type: z.literal('start'), days: z.number(), from: z.string(), to: z.string(), stepDays: z.number(),
    /** The albedo and IR models used, in words, and the preliminary-design caution. */
    assumptions: z.array(z.string()).optional(),
  }),
  sweepDay,
  z.object({ type: z.literal('end'), days: z.number() }),
  z.object({ type: z.literal('error'), message: z.string() }),
]);

export type Mission = z.infer<typeof mission>;
export type MissionCreate = z.input<typeof missionCreate>;
export type MissionUpdate = z.input<typeof missionUpdate>;
export type MissionDetail = z.infer<typeof missionDetail>;
export type Orbit = z.infer<typeof orbit>;
export type OrbitCreate = z.input<typeof orbitCreate>;
export type Material = z.infer<typeof material>;
export type MaterialCreate = z.input<typeof materialCreate>;
export type Surface = z.infer<typeof surface>;
export type SurfaceCreate = z.input<typeof surfaceCreate>;
export type SurfaceNormal = z.infer<typeof surfaceNormal>;
export type SweepDay = z.infer<typeof sweepDay>;
export type SweepLine = z.infer<typeof sweepLine>;

/** GET /missions: archived missions are left out unless asked for. */
export const missionListQuery = z.object({
  includeArchived: z.enum(['true', 'false'], { message: 'includeArchived is true or false' }).optional(),
});

/** GET /materials: the library, and with workspaceId that workspace's own materials too. */
export const materialListQuery = z.object({ workspaceId: z.string().min(1).max(64).optional() });
