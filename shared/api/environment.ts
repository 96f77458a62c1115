// The two stateless environment routes (API.md "Environment computation", "Other fixed routes").
//   POST /api/v1/environment/compute   environmentRequest -> 200 environmentResponse   (any signed-in role)
//        physically impossible input (orbit below the surface, e >= 1, ...) -> 422 from PhysicsError
//   GET  /api/v1/bodies                                   -> 200 bodiesResponse (a bare array)
// Ranges here catch malformed input (400); physics/orbit-definition.ts refuses the impossible (422)
// so its messages can say by how much.
import { z } from 'zod';
import { anyBodyId, anyBodyIdOut } from './body-id';
import { lineText } from './text';
import type { EnvironmentRequest } from '../physics/environment';
import { albedoModels, irModels } from '../physics/cap-loads';
import { surfaceNormal } from './pointing';
import { samplings } from '../physics/orbit-sampling';
import { DAY_MS } from '../physics/constants';

const finite = (label: string) => z.number({ message: `${label} must be a number` });

/**
 * The largest size and period an orbit may be given with: beyond the sphere of influence of every
 * body in the catalogue (Neptune's Hill sphere is about 1.2e8 km; an orbit at that distance takes
 * about 3e9 s), and small enough that a^3 and the period stay finite numbers. From memory.
 */
export const MAX_ORBIT_KM = 1e9;
export const MAX_PERIOD_S = 1e10;
const distance = (label: string) => finite(label).max(MAX_ORBIT_KM, `${label} is at most ${MAX_ORBIT_KM.toExponential()} km`);
const angle = (label: string) => finite(label).min(-360, `${label} is -360..360 deg`).max(360, `${label} is -360..360 deg`);

/**
 * An orbit in numbers (km, s, deg): the compute route's, and every saved orbit's once its typed
 * values are converted (server/missions/orbit-values.ts), so both refuse the same values.
 */
export const orbitInput = z
  .strictObject({
    periapsisAltitudeKm: distance('periapsis altitude').optional(),
    apoapsisAltitudeKm: distance('apoapsis altitude').optional(),
    semiMajorAxisKm: distance('semi-major axis').optional(),
    eccentricity: finite('eccentricity').optional(),
    periodS: finite('period').max(MAX_PERIOD_S, `period is at most ${MAX_PERIOD_S.toExponential()} s`).optional(),
    inclinationDeg: finite('inclination').min(0, 'inclination is 0..180 deg').max(180, 'inclination is 0..180 deg').default(0),
    raanDeg: angle('RAAN').default(0),
    argPeriapsisDeg: angle('argument of periapsis').default(0),
  })
  .superRefine((o, ctx) => {
    const altitudes = o.periapsisAltitudeKm !== undefined || o.apoapsisAltitudeKm !== undefined;
    const definitions = [altitudes, o.semiMajorAxisKm !== undefined, o.periodS !== undefined].filter(Boolean).length;
    if (definitions !== 1) {
      ctx.addIssue({
        code: 'custom',
        message: definitions === 0
          ? 'define the orbit by periapsisAltitudeKm + apoapsisAltitudeKm, semiMajorAxisKm + eccentricity, or periodS + eccentricity'
          : 'define the orbit one way only: altitudes, semi-major axis or period',
      });
      return;
    }
    if (altitudes) {
      if (o.periapsisAltitudeKm === undefined) ctx.addIssue({ code: 'custom', path: ['periapsisAltitudeKm'], message: 'give the periapsis altitude too' });
      if (o.apoapsisAltitudeKm === undefined) ctx.addIssue({ code: 'custom', path: ['apoapsisAltitudeKm'], message: 'give the apoapsis altitude too' });
      if (o.eccentricity !== undefined) ctx.addIssue({ code: 'custom', path: ['eccentricity'], message: 'eccentricity follows from the two altitudes; leave it out' });
    } else if (o.eccentricity === undefined) {
      ctx.addIssue({ code: 'custom', path: ['eccentricity'], message: 'give the eccentricity (0 for a circular orbit)' });
    }
  });

export const surfaceInput = z.strictObject({
  name: lineText(80, 'a surface name has at most 80 characters').min(1, 'give the surface a name'),
  normal: surfaceNormal,
  areaM2: finite('area').positive('area must be above 0 m²').max(10000),
  absorptivity: finite('absorptivity').min(0, 'absorptivity is 0..1').max(1, 'absorptivity is 0..1'),
  emissivity: finite('emissivity').min(0, 'emissivity is 0..1').max(1, 'emissivity is 0..1'),
});

export const environmentRequest = z
  .strictObject({
    bodyId: anyBodyId(),
    orbit: orbitInput,
    epoch: z.iso.datetime({ offset: true, message: 'epoch is an ISO 8601 date and time, e.g. 2027-03-20T12:00:00Z' }).optional(),
    betaDeg: finite('beta').min(-90, 'beta is -90..90 deg').max(90, 'beta is -90..90 deg').optional(),
    solarDistanceAu: finite('solar distance').positive('solar distance must be above 0 AU').max(100).optional(),
    albedo: finite('albedo').min(0, 'albedo is 0..1').max(1, 'albedo is 0..1').optional(),
    olrWm2: finite('OLR').min(0, 'OLR cannot be negative').max(20000).optional(),
    steps: z.number().int('steps is a whole number').min(12, 'steps is 12..100000').max(100000, 'steps is 12..100000').default(360),
    sampling: z.enum(samplings, { message: `sampling is one of ${samplings.join(', ')}` }).optional(),
    albedoModel: z.enum(albedoModels, { message: `albedoModel is one of ${albedoModels.join(', ')}` }).optional(),
    irModel: z.enum(irModels, { message: `irModel is one of ${irModels.join(', ')}` }).optional(),
    surfaceEmissivity: finite('surface emissivity').gt(0, 'surface emissivity is above 0, up to 1').max(1, 'surface emissivity is above 0, up to 1').optional(),
    nightFloorK: finite('night floor temperature').min(0, 'the night floor temperature is 0..500 K').max(500, 'the night floor temperature is 0..500 K').optional(),
    surfaces: z
      .array(surfaceInput)
      .min(1, 'give at least one surface')
      .max(100, 'at most 100 surfaces')
      .refine((s) => new Set(s.map((x) => x.name)).size === s.length, { message: 'surface names must be unique' }),
  })
  .refine((r) => r.epoch !== undefined || r.betaDeg !== undefined, {
    path: ['epoch'],
    message: 'give an epoch (it sets the Sun) or a betaDeg',
  });

/** A surface's loads (incident fluxes and the power absorbed); the ephemeris answers use it too. */
export const surfaceLoad = z.object({
  name: z.string(),
  solarWm2: z.number(),
  albedoWm2: z.number(),
  irWm2: z.number(),
  absorbedW: z.number(),
});

export const environmentResponse = z.object({
  bodyId: z.string(),
  periodS: z.number(),
  semiMajorAxisKm: z.number(),
  eccentricity: z.number(),
  periapsisAltitudeKm: z.number(),
  apoapsisAltitudeKm: z.number(),
  betaDeg: z.number(),
  epochBetaDeg: z.number().nullable(),
  sunDirection: z.object({ x: z.number(), y: z.number(), z: z.number() }).describe(
    "the Sun's unit direction in the orbit's perifocal frame, held fixed over the orbit: x toward periapsis (the ascending node for a circular orbit, where tS counts from), y along the motion there, z along the orbit normal (z = sin beta)",
  ),
  solarDistanceAu: z.number(),
  solarFluxWm2: z.number(),
  albedo: z.number(),
  olrWm2: z.number(),
  albedoModel: z.enum(albedoModels),
  irModel: z.enum(irModels),
  sampling: z.enum(samplings),
  surfaceField: z.object({ bondAlbedo: z.number(), emissivity: z.number(), nightFloorK: z.number(), subsolarK: z.number() }).nullable(),
  /** Umbra plus half of penumbra. */
  eclipseFraction: z.number(),
  eclipseDurationS: z.number(),
  umbraDurationS: z.number(),
  penumbraDurationS: z.number(),
  nodalRateDegPerDay: z.number(),
  /** The planet a moon orbits; null for a planet. */
  parentBodyId: z.string().nullable(),
  /** Time of the orbit in the planet's shadow, penumbra included (a moon with an epoch). */
  parentShadowDurationS: z.number(),
  /** An orbit that makes little sense (beyond the sphere of influence, across moons' orbits, inside a Roche limit), in words. */
  warnings: z.array(z.string()),
  profile: z.array(z.object({
    tS: z.number(), trueAnomalyDeg: z.number(), sunlit: z.number(),
    /** About a moon: the share of the Sun the planet leaves (sunlit already counts it). */
    parentSunlit: z.number().optional(),
    surfaces: z.array(surfaceLoad),
  })),
  /** Each sample's share of the period (s) when sampled evenly in eccentric anomaly; null evenly in time. */
  sampleWeightsS: z.array(z.number()).nullable(),
  orbitAverage: z.object({ surfaces: z.array(surfaceLoad) }),
  peak: z.object({ surfaces: z.array(surfaceLoad) }),
  assumptions: z.array(z.string()),
});

const range = z.object({ min: z.number(), nominal: z.number(), max: z.number() });

export const bodySummary = z.object({
  id: anyBodyIdOut,
  /** A workspace's own body: its workspace (absent for the catalogue's). */
  workspaceId: z.string().optional(),
  name: z.string(),
  kind: z.enum(['planet', 'moon']),
  planetId: z.string(),
  gmKm3S2: z.number(),
  radiusKm: z.number(),
  j2: z.number(),
  poleRaDeg: z.number(),
  poleDecDeg: z.number(),
  solarDistanceAu: z.object({ mean: z.number(), min: z.number(), max: z.number() }),
  albedo: range,
  olrWm2: range,
  /** True where ranges await the published design tables; the screen says "provisional". */
  provisional: z.boolean(),
  /** A body without a thick atmosphere: its IR comes from a surface temperature field. */
  airless: z.boolean(),
  surfaceField: z.object({ emissivity: range, nightFloorK: range, sources: z.object({ emissivity: z.string(), nightFloorK: z.string() }) }).nullable(),
  sources: z.record(z.string(), z.string()),
});
export const bodiesResponse = z.array(bodySummary);

export type EnvironmentRequestInput = z.input<typeof environmentRequest>;
export type EnvironmentRequestParsed = z.infer<typeof environmentRequest>;
export type EnvironmentResponse = z.infer<typeof environmentResponse>;
export type BodySummaryResponse = z.infer<typeof bodySummary>;

// A parsed request must be something computeEnvironment accepts; this fails to compile if they drift apart.
export const asEnvironmentRequest = (parsed: EnvironmentRequestParsed): EnvironmentRequest => parsed;

// ---- Orbit figures, sun-synchronous orbits, beta history, one body, unit conversion ----------
//   POST /api/v1/orbits/figures                    orbitFiguresRequest -> orbitFiguresResponse
//   GET  /api/v1/bodies/:bodyId/sun-synchronous    ?altitudeKm=&eccentricity= -> sunSynchronousResponse (422 where none exists)
//   POST /api/v1/environment/beta-history          betaHistoryRequest -> betaHistoryResponse
//   GET  /api/v1/bodies/:bodyId                    -> bodyDetail (404 for an unknown body)
//   POST /api/v1/units/convert                     unitConvertRequest -> unitConvertResponse

const bodyIdField = anyBodyId();

export const orbitFiguresRequest = z.strictObject({ bodyId: bodyIdField, orbit: orbitInput });

export const orbitFiguresResponse = z.object({
  bodyId: z.string(),
  periodS: z.number(),
  meanMotionRadS: z.number(),
  meanMotionRevPerDay: z.number(),
  semiMajorAxisKm: z.number(),
  eccentricity: z.number(),
  periapsisAltitudeKm: z.number(),
  apoapsisAltitudeKm: z.number(),
  periapsisSpeedKmS: z.number(),
  apoapsisSpeedKmS: z.number(),
  nodalRateDegPerDay: z.number(),
  apsidalRateDegPerDay: z.number(),
  /** Circular orbit at the surface: the shortest period any orbit around the body can have. */
  minimumPeriodS: z.number(),
});

// Query strings arrive as text: read as numbers here so that the 400 can repeat what was typed.
const queryNumber = (label: string) =>
  z
    .string({ message: `give ${label} as a number` })
    .trim()
    .refine((text) => text !== '' && Number.isFinite(Number(text)), `${label} must be a number`)
    .transform(Number);

export const sunSynchronousQuery = z.strictObject({
  altitudeKm: queryNumber('altitudeKm'),
  eccentricity: queryNumber('eccentricity').pipe(z.number().min(0, 'eccentricity is 0..1').lt(1, 'eccentricity must be below 1')).optional(),
});

export const sunSynchronousResponse = z.object({
  bodyId: z.string(),
  /** Semi-major axis minus the body's radius. */
  altitudeKm: z.number(),
  semiMajorAxisKm: z.number(),
  eccentricity: z.number(),
  inclinationDeg: z.number(),
  nodalRateDegPerDay: z.number(),
  periodS: z.number(),
});

/** The most samples one beta history may hold. */
export const MAX_BETA_HISTORY_SAMPLES = 20000;
const isoDateTime = (label: string) =>
  z.iso.datetime({ offset: true, message: `${label} is an ISO 8601 date and time, e.g. 2027-03-20T00:00:00Z` });

export const betaHistoryRequest = z
  .strictObject({
    bodyId: bodyIdField,
    orbit: orbitInput,
    from: isoDateTime('from'),
    to: isoDateTime('to'),
    /** When the orbit's RAAN and argument of periapsis hold; `from` when left out. */
    epoch: isoDateTime('epoch').optional(),
    stepDays: finite('stepDays').positive('stepDays must be above 0').max(3650, 'stepDays is at most 3650'),
  })
  .superRefine((r, ctx) => {
    const span = Date.parse(r.to) - Date.parse(r.from);
    if (!(span >= 0)) {
      ctx.addIssue({ code: 'custom', path: ['to'], message: `to must not be before from (${r.from})` });
      return;
    }
    const samples = Math.floor(span / DAY_MS / r.stepDays + 1e-9) + 1;
    if (samples > MAX_BETA_HISTORY_SAMPLES) {
      ctx.addIssue({
        code: 'custom',
        path: ['stepDays'],
        message: `${samples} samples from ${r.from} to ${r.to} is more than ${MAX_BETA_HISTORY_SAMPLES}; use a larger stepDays`,
      });
    }
  });

export const betaHistoryResponse = z.object({
  bodyId: z.string(),
  periodS: z.number(),
  nodalRateDegPerDay: z.number(),
  apsidalRateDegPerDay: z.number(),
  items: z.array(z.object({
    date: z.string(),
    betaDeg: z.number(),
    raanDeg: z.number(),
    solarDistanceAu: z.number(),
    solarFluxWm2: z.number(),
    /** Umbra plus half of penumbra. */
    eclipseFraction: z.number(),
    eclipseDurationS: z.number(),
  })),
  minBetaDeg: z.number(),
  maxBetaDeg: z.number(),
  assumptions: z.array(z.string()),
});

const sunlightPoint = z.object({ distanceAu: z.number(), solarFluxWm2: z.number() });
export const bodyDetail = bodySummary.extend({
  perihelion: sunlightPoint,
  mean: sunlightPoint,
  aphelion: sunlightPoint,
});

export const unitConvertRequest = z.strictObject({
  value: z.union([lineText(100, 'value has at most 100 characters'), finite('value')], { message: 'value is a number or a text such as "341.8 mi"' }),
  unit: lineText(40, 'unit has at most 40 characters').min(1, 'give the unit to convert to, e.g. "km"'),
});
export const unitConvertResponse = z.object({ value: z.number(), unit: z.string() });

export type OrbitFiguresResponse = z.infer<typeof orbitFiguresResponse>;
export type SunSynchronousResponse = z.infer<typeof sunSynchronousResponse>;
export type BetaHistoryRequest = z.input<typeof betaHistoryRequest>;
export type BetaHistoryResponse = z.infer<typeof betaHistoryResponse>;
export type BodyDetailResponse = z.infer<typeof bodyDetail>;
export type UnitConvertResponse = z.infer<typeof unitConvertResponse>;
