// Ephemerides: trajectories uploaded as files (API.md "Other fixed routes"), and the environment
// computed along them. Uploading and deleting: analyst, thermal, owner; reading: every member;
// another workspace's mission answers 404.
//   POST   missions/:id/ephemerides                multipart: file, frame, name, epoch? -> 201 ephemerisSummary
//            a refused file: 400 {"error": {"code": "invalid_ephemeris", "details": [{row, column, value, message}]}}
//            (row 1 is the first data row after the header; row 0 the header or the file as a whole)
//            beyond ECLIPTA_UPLOAD_LIMIT_MB: 413 too_large
//   GET    missions/:id/ephemerides                -> {items: ephemerisSummary[]}
//   GET    missions/:id/ephemerides/:ephemerisId   -> ephemerisSummary
//   GET    missions/:id/ephemerides/:ephemerisId/points?offset=0&limit=1000 -> ephemerisPointsPage
//   DELETE missions/:id/ephemerides/:ephemerisId   -> 204 (its points go too)
//   POST   missions/:id/ephemerides/:ephemerisId/environment  trajectoryEnvironmentRequest
//            -> trajectoryEnvironmentResponse (the mission's surfaces with their materials; optionally
//               over a window from..to of the ephemeris)
//   POST   missions/:id/ephemerides/:ephemerisId/cases  ephemerisCaseCreate -> 201 caseDetail (a custom
//            case, draft, from a window of the ephemeris; thermal engineers and owners)
import { z } from 'zod';
import { surfaceLoad } from './environment';
import { lineText } from './text';
import { ephemerisFrames, type EphemerisFrame } from './plain-lists';

/** Inertial frames accepted, centred on the mission's body; GCRF only for the Earth. */
export { ephemerisFrames, type EphemerisFrame };

export const ephemerisUploadFields = z.strictObject({
  name: lineText(120, 'the name has at most 120 characters').optional(),
  /** Required for CSV; an OEM file names its own REF_FRAME, which must agree when both are given. */
  frame: lineText(40).optional(),
  /** The origin of a CSV's `t` column (seconds), ISO 8601 UTC. */
  epoch: z.iso
    .datetime({ offset: true, message: 'epoch is an ISO 8601 date and time in UTC, e.g. 2027-03-20T12:00:00Z' })
    .optional()
    .or(z.literal('').transform(() => undefined)),
});

export const ephemerisSummary = z.object({
  id: z.string(),
  missionId: z.string(),
  name: z.string(),
  frame: z.string(),
  format: z.enum(['csv', 'oem']),
  rows: z.number(),
  startEpoch: z.string(),
  endEpoch: z.string(),
  /** Median step between rows, s. */
  stepS: z.number(),
  minAltitudeKm: z.number(),
  maxAltitudeKm: z.number(),
  hasVelocity: z.boolean(),
  sha256: z.string(),
  fileName: z.string(),
  createdAt: z.string(),
});

export const ephemerisPointsQuery = z.strictObject({
  offset: z.coerce.number().int().min(0, 'offset is 0 or more').default(0),
  limit: z.coerce.number().int().min(1, 'limit is 1..10000').max(10000, 'limit is 1..10000').default(1000),
});

export const ephemerisPoint = z.object({
  seq: z.number(),
  epoch: z.string(),
  xKm: z.number(),
  yKm: z.number(),
  zKm: z.number(),
  vxKmS: z.number().nullable(),
  vyKmS: z.number().nullable(),
  vzKmS: z.number().nullable(),
});

export const ephemerisPointsPage = z.object({
  items: z.array(ephemerisPoint),
  offset: z.number(),
  limit: z.number(),
  total: z.number(),
});

const windowEpoch = (field: string) =>
  z.iso.datetime({ offset: true, message: `${field} is an ISO 8601 date and time in UTC, e.g. 2027-03-20T12:00:00Z` }).optional();

/** A part of the ephemeris, from and to epochs included; either end defaults to the ephemeris' own. */
const timeWindow = {
  from: windowEpoch('from'),
  to: windowEpoch('to'),
};
const windowOrder = (w: { from?: string | undefined; to?: string | undefined }) => !w.from || !w.to || Date.parse(w.from) < Date.parse(w.to);
const windowOrderError = { message: 'from must be before to', path: ['to'] };

export const trajectoryEnvironmentRequest = z
  .strictObject({
    properties: z.enum(['bol', 'eol']).default('bol'),
    /** Points returned (evenly thinned); the averages always use every row of the window. */
    maxPoints: z.number().int().min(2, 'maxPoints is 2..20000').max(20000, 'maxPoints is 2..20000').default(2000),
    albedo: z.number().min(0, 'albedo is 0..1').max(1, 'albedo is 0..1').optional(),
    olrWm2: z.number().min(0, 'OLR cannot be negative').max(20000).optional(),
    ...timeWindow,
  })
  .refine(windowOrder, windowOrderError);

/**
 * A load case from a window of the ephemeris (thermal engineers and owners): its loads at every
 * row of the window, thinned to `steps` for the stored series; averages and peaks over every row.
 */
export const ephemerisCaseCreate = z
  .strictObject({
    name: lineText(120, 'a case name has at most 120 characters').min(1, 'give the case a name'),
    properties: z.enum(['bol', 'eol']).default('bol'),
    marginDirection: z.enum(['increase', 'decrease']).default('increase'),
    albedo: z.number().min(0, 'albedo is 0..1').max(1, 'albedo is 0..1').optional(),
    olrWm2: z.number().min(0, 'OLR cannot be negative').max(20000).optional(),
    margins: z
      .strictObject({
        heatLoadPercent: z.number().min(0, 'heatLoadPercent is 0..200').max(200, 'heatLoadPercent is 0..200').optional(),
        temperatureMarginC: z.number().min(0, 'temperatureMarginC is 0..100').max(100, 'temperatureMarginC is 0..100').optional(),
      })
      .optional(),
    steps: z.number().int('steps is a whole number').min(12, 'steps is 12..2000').max(2000, 'steps is 12..2000').default(360),
    ...timeWindow,
  })
  .refine(windowOrder, windowOrderError);


export const trajectoryEnvironmentResponse = z.object({
  ephemerisId: z.string(),
  bodyId: z.string(),
  properties: z.enum(['bol', 'eol']),
  albedo: z.number(),
  olrWm2: z.number(),
  rows: z.number(),
  /** The first and last epochs of the rows used (the whole ephemeris unless a window was asked for). */
  window: z.object({ from: z.string(), to: z.string() }),
  points: z.array(
    z.object({ epoch: z.string(), altitudeKm: z.number(), sunlit: z.number(), surfaces: z.array(surfaceLoad) }),
  ),
  /** Time-weighted over the window (trapezoidal), every row. */
  averages: z.object({ sunlitFraction: z.number(), surfaces: z.array(surfaceLoad) }),
  peaks: z.object({ surfaces: z.array(surfaceLoad) }),
  assumptions: z.array(z.string()),
});

export type EphemerisUploadFields = z.infer<typeof ephemerisUploadFields>;
export type EphemerisSummary = z.infer<typeof ephemerisSummary>;
export type EphemerisPoint = z.infer<typeof ephemerisPoint>;
export type EphemerisPointsPage = z.infer<typeof ephemerisPointsPage>;
export type TrajectoryEnvironmentRequest = z.input<typeof trajectoryEnvironmentRequest>;
export type TrajectoryEnvironmentResponse = z.infer<typeof trajectoryEnvironmentResponse>;
export type EphemerisCaseCreate = z.input<typeof ephemerisCaseCreate>;
export type EphemerisCaseCreateParsed = z.output<typeof ephemerisCaseCreate>;
