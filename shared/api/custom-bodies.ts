// A workspace's own central bodies (physics/custom-bodies.ts) and the body ids every request takes.
//   GET    /api/v1/workspaces/:workspaceId/bodies              -> customBodyList   (any member)
//   POST   /api/v1/workspaces/:workspaceId/bodies              customBodyInput -> customBody, 201 (owner, thermal, analyst)
//   PUT    /api/v1/workspaces/:workspaceId/bodies/:bodyId      customBodyInput -> customBody (owner, thermal, analyst)
//   DELETE /api/v1/workspaces/:workspaceId/bodies/:bodyId      -> 204; 409 while a mission uses it
// GET /api/v1/bodies lists them after the catalogue, for the caller's workspaces.
// A custom body's id is "custom-" and a UUID: the catalogue's ids are lowercase English names, so
// the two can never clash. Radii and periods are typed quantities ("1,200 km", "3.5 d").
import { z } from 'zod';
import { customBodyIdPattern } from './body-id';
import { quantity } from './missions';
import { lineText } from './text';

const planetIds = ['mercury', 'venus', 'earth', 'mars', 'jupiter', 'saturn', 'uranus', 'neptune'] as const;
const num = (label: string) => z.number({ message: `${label} must be a number` }).refine(Number.isFinite, `${label} must be a finite number`);
const source = lineText(300, 'a source has at most 300 characters').default('');

/** min <= nominal <= max, within [low, high]. */
const rangeOf = (label: string, low: number, high: number, unit: string) =>
  z
    .strictObject({
      min: num(`the least ${label}`).pipe(z.number().min(low, `${label} is ${low}..${high}${unit}`).max(high, `${label} is ${low}..${high}${unit}`)),
      nominal: num(`the nominal ${label}`).pipe(z.number().min(low, `${label} is ${low}..${high}${unit}`).max(high, `${label} is ${low}..${high}${unit}`)),
      max: num(`the greatest ${label}`).pipe(z.number().min(low, `${label} is ${low}..${high}${unit}`).max(high, `${label} is ${low}..${high}${unit}`)),
    })
    .refine((r) => r.min <= r.nominal, { path: ['nominal'], message: `the nominal ${label} is below the least` })
    .refine((r) => r.nominal <= r.max, { path: ['max'], message: `the greatest ${label} is below the nominal` });

const sunPlace = z
  .strictObject({
    kind: z.literal('sun'),
    meanAu: num('the mean distance from the Sun').pipe(z.number().positive('the distance from the Sun is above 0 AU').max(1000, 'the distance from the Sun is at most 1000 AU')),
    minAu: num('the least distance from the Sun').pipe(z.number().positive('the distance from the Sun is above 0 AU').max(1000, 'the distance from the Sun is at most 1000 AU')),
    maxAu: num('the greatest distance from the Sun').pipe(z.number().positive('the distance from the Sun is above 0 AU').max(1000, 'the distance from the Sun is at most 1000 AU')),
  })
  .refine((p) => p.minAu <= p.meanAu, { path: ['meanAu'], message: 'the mean distance is below the least' })
  .refine((p) => p.meanAu <= p.maxAu, { path: ['maxAu'], message: 'the greatest distance is below the mean' });

const planetPlace = z.strictObject({
  kind: z.literal('planet'),
  parentId: z.enum(planetIds, { message: `the planet it orbits is one of ${planetIds.join(', ')}` }),
  /** Typed: "671,100 km", a bare number in km. */
  orbitRadiusKm: quantity,
  /** Typed: "3.55 d", "85.2 h", a bare number in days. */
  periodDays: quantity,
});

export const customBodyInput = z.strictObject({
  name: lineText(80, 'a body name has at most 80 characters').min(1, 'give the body a name'),
  gmKm3S2: num('GM').pipe(z.number().positive('GM must be above 0 km³/s²').max(2e8, 'GM is at most 2e8 km³/s² (a little above Jupiter)')),
  /** Typed: "1,737.4 km", a bare number in km. */
  radiusKm: quantity,
  j2: num('J2').pipe(z.number().min(-0.1, 'J2 is -0.1..0.1').max(0.1, 'J2 is -0.1..0.1')).default(0),
  place: z.discriminatedUnion('kind', [sunPlace, planetPlace], { message: 'place is {kind: "sun", meanAu, minAu, maxAu} or {kind: "planet", parentId, orbitRadiusKm, periodDays}' }),
  albedo: rangeOf('albedo', 0, 1, ''),
  olrWm2: rangeOf('OLR', 0, 20000, ' W/m²'),
  /** Absent or null: a body with an atmosphere (uniform OLR). */
  airless: z
    .strictObject({ emissivity: rangeOf('surface emissivity', 0.01, 1, ''), nightFloorK: rangeOf('night floor temperature', 0, 500, ' K') })
    .nullable()
    .default(null),
  sources: z
    .strictObject({
      gmKm3S2: source, radiusKm: source, j2: source, place: source, albedo: source, olrWm2: source, emissivity: source, nightFloorK: source,
    })
    .partial()
    .default({}),
});

const range = z.object({ min: z.number(), nominal: z.number(), max: z.number() });

export const customBody = z.object({
  id: z.string().regex(customBodyIdPattern),
  workspaceId: z.string(),
  name: z.string(),
  gmKm3S2: z.number(),
  radiusKm: z.number(),
  j2: z.number(),
  place: z.discriminatedUnion('kind', [
    z.object({ kind: z.literal('sun'), meanAu: z.number(), minAu: z.number(), maxAu: z.number() }),
    z.object({ kind: z.literal('planet'), parentId: z.enum(planetIds), orbitRadiusKm: z.number(), periodDays: z.number() }),
  ]),
  albedo: range,
  olrWm2: range,
  airless: z.object({ emissivity: range, nightFloorK: range }).nullable(),
  sources: z.record(z.string(), z.string()),
  createdAt: z.string(),
  updatedAt: z.string(),
});

export const customBodyList = z.object({ items: z.array(customBody) });

export type CustomBodyInput = z.infer<typeof customBodyInput>;
export type CustomBodyResponse = z.infer<typeof customBody>;
