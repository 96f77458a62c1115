// What a load case holds: the snapshot of its inputs and its results (physics/design-cases.ts).
// These schemas describe the stored JSON, the case routes' answers and the JSON export, and the
// JSON Schema served at /api/v1/schemas/load-case.json is generated from them.
import { z } from 'zod';
import { anyBodyIdOut } from './body-id';
import type { CaseDecision, CaseWhyRecord } from '../physics/case-why';
import type { CaseConditions, CaseResults, SurfaceDriver, ScanSummary } from '../physics/design-cases';
import type { Margins } from '../physics/design-environment';
import { samplings } from '../physics/orbit-sampling';
import { surfaceNormal } from './missions';
import { casePhase, casePhaseCompared } from './phases';

export const caseKinds = ['hot', 'cold', 'custom'] as const;
export const caseStatuses = ['draft', 'review', 'released', 'superseded'] as const;
export const propertySetValues = ['bol', 'eol'] as const;

const num = z.number();
const range = z.object({ min: num, nominal: num, max: num });

export const caseMaterial = z.object({
  name: z.string(),
  absorptivityBol: num,
  emissivityBol: num,
  absorptivityEol: num,
  emissivityEol: num,
  source: z.string(),
});

export const caseSurface = z.object({
  name: z.string(),
  normal: surfaceNormal,
  areaM2: num.describe('m^2'),
  material: caseMaterial,
});

export const caseConditions = z.object({
  bodyId: anyBodyIdOut,
  /** Canonical elements: km, deg. */
  orbit: z.object({
    semiMajorAxisKm: num,
    eccentricity: num,
    inclinationDeg: num,
    raanDeg: num,
    argPeriapsisDeg: num,
  }),
  orbitEpoch: z.string().describe('ISO 8601 UTC epoch of the orbit elements'),
  date: z.string().describe('YYYY-MM-DD: the day the node and the Sun azimuth are taken from'),
  orbitStart: z.string().optional().describe("ISO 8601 UTC: where the case's orbit starts when not at 12:00 UTC of date (a moon's orbiter in its planet's shadow)"),
  betaDeg: num,
  solarDistanceAu: num,
  albedo: num,
  olrWm2: num,
  properties: z.enum(propertySetValues).describe('bol: beginning of life; eol: end of life'),
  marginDirection: z.enum(['increase', 'decrease']),
  steps: z.number().int(),
  surfaces: z.array(caseSurface),
  surfaceField: z
    .object({ emissivity: num, nightFloorK: num.describe('K') })
    .optional()
    .describe("an airless body's surface temperature field (its Bond albedo is `albedo`); absent: uniform OLR"),
  sampling: z.enum(samplings).optional().describe('time (default): series evenly spaced in time; eccentric-anomaly: evenly in eccentric anomaly, dense at periapsis'),
});

export const caseMargins = z.object({
  heatLoadPercent: num,
  temperatureMarginC: num,
  sources: z.object({ heatLoadPercent: z.string(), temperatureMarginC: z.string() }),
});

export const surfaceDriver = z.object({
  surface: z.string(),
  date: z.string(),
  betaDeg: num,
  orbitAverageAbsorbedW: num,
  sameAsCase: z.boolean(),
  text: z.string(),
});

export const scanSummary = z.object({
  startDate: z.string(),
  endDate: z.string(),
  days: num,
  candidates: num,
  betaMinDeg: num,
  betaMaxDeg: num,
  solarDistanceMinAu: num,
  solarDistanceMaxAu: num,
  spansFullYear: z.boolean(),
});

const dayFigures = z.object({ date: z.string(), betaDeg: num });
export const caseDecision = z.object({
  sun: z.object({ basis: z.enum(['mission', 'perihelion', 'aphelion']), date: z.string().describe('YYYY-MM-DD the mission is closest to (hot) or farthest from (cold) the Sun'), distanceAu: num }),
  day: dayFigures.describe('the day the derivation chose for beta'),
  eclipseExtreme: dayFigures.extend({ eclipseDurationS: num, orbitAverageAbsorbedW: num }).nullable().describe('the day of the shortest (hot) or longest (cold) eclipse when it is another day'),
  pair: z.object({
    albedo: num,
    olrWm2: num,
    source: z.string(),
    surfaceField: z
      .object({ emissivity: num, nightFloorK: num.describe('K'), subsolarK: num.describe('K'), albedoRange: z.boolean().describe('true when both ends of the Bond albedo range were tried') })
      .optional()
      .describe("an airless body: the surface temperature field the IR comes from, at the hot or cold end of its ranges"),
  }),
  shadow: z
    .object({
      durationS: num.describe('s'),
      date: z.string().describe('YYYY-MM-DD'),
      start: z.string().describe('ISO 8601 UTC'),
      castBy: z.array(z.string()).describe('the bodies whose shadow it is (the planet, and the moon itself)'),
    })
    .optional()
    .describe("about a moon (cold case): the mission's longest shadow the planet takes part in, which set the case's orbit"),
  properties: z.enum(propertySetValues),
  phase: z
    .object({
      id: z.string(), name: z.string(), startDate: z.string(), endDate: z.string(), modeName: z.string(),
      by: z.enum(['heat', 'environment']).optional()
        .describe('what chose the phase: "heat" the most (hot) or least (cold) orbit-average absorbed load plus the dissipation the phase names; "environment" the absorbed load alone (the survival cold case, whose dissipation is the same in every phase; absent on cases derived before dissipation counted)'),
      compared: z.array(z.object({
        name: z.string(),
        orbitAverageAbsorbedW: num.describe('total orbit-average absorbed W without margin'),
        dissipationW: num.optional().describe("orbit-average dissipation of the nodes the phase names, W (an on/off schedule's mean over the orbit); present when the phases were compared by heat"),
        notNamed: z.array(z.string()).optional().describe('nodes another phase names and this one does not, counted 0 W in its total'),
      })).describe("every phase's own case of this kind"),
    })
    .optional()
    .describe('a mission flown in phases: the phase that drove this case'),
  survival: z
    .object({ nodes: z.array(z.object({ node: z.string(), dissipationW: num, phase: z.string() })) })
    .optional()
    .describe("a survival cold case: each thermal-model node's least dissipation over the phases (W) and the phase giving it; other nodes dissipate nothing, heaters only"),
});

export const caseInputs = z.object({
  mission: z.object({ id: z.string(), name: z.string(), startDate: z.string(), endDate: z.string(), crewed: z.boolean() }),
  body: z.object({
    id: anyBodyIdOut,
    name: z.string(),
    gmKm3S2: num,
    radiusKm: num,
    j2: num,
    solarDistanceAu: z.object({ mean: num, min: num, max: num }),
    albedo: range,
    olrWm2: range,
    provisional: z.boolean(),
    sources: z.record(z.string(), z.string()),
  }),
  orbit: z.object({
    id: z.string().nullable(),
    name: z.string(),
    epoch: z.string(),
    periapsisAltitudeKm: num,
    apoapsisAltitudeKm: num,
    semiMajorAxisKm: num,
    eccentricity: num,
    periodS: num,
    inclinationDeg: num,
    raanDeg: num,
    argPeriapsisDeg: num,
  }),
  attitude: z.string().describe('how the surfaces are pointed, in words'),
  conditions: caseConditions,
  environmentSource: z.string(),
  provisional: z.boolean().describe('true when a value awaits its published table'),
  margins: caseMargins,
  rationale: z.array(z.string()),
  surfaceDrivers: z.array(surfaceDriver),
  scan: scanSummary.nullable(),
  assumptions: z.array(z.string()),
  decision: caseDecision.optional().describe('hot and cold cases: what the derivation decided; the rationale lines are built from it, the conditions and the results'),
  facts: z.array(z.string()).optional().describe('custom cases and cases from an ephemeris: how the case was set up, the rationale lines before the margins'),
  handEdited: z.array(z.string()).optional().describe('condition keys changed by hand since the case was made'),
  fixed: z
    .object({
      betaDeg: num.optional(),
      solarDistanceAu: num.optional(),
      albedo: num.optional(),
      olrWm2: num.optional(),
      normals: z.record(z.string(), surfaceNormal).optional().describe('surface name -> normal, over the mission\'s own'),
    })
    .optional()
    .describe('custom cases: the values their author fixed over what the date and the mission give; a new revision derived from the current inputs keeps them'),
  revisionReason: z.string().optional().describe('why this revision was made, as its author gave it'),
  phase: casePhase.optional().describe("the mission phase this case was derived in: its dates, attitude mode and its nodes' dissipation, as they were"),
  phases: z
    .array(casePhaseCompared)
    .optional()
    .describe("a case chosen among the mission's phases: every phase as it was when the choice was made; absent on cases derived in one phase asked for, on missions without phases, and on cases made before it was kept"),
  /** Set when the case was computed along a window of an uploaded ephemeris rather than a Keplerian orbit. */
  ephemeris: z
    .object({
      id: z.string(),
      name: z.string(),
      fileName: z.string(),
      sha256: z.string().describe('SHA-256 of the uploaded file'),
      from: z.string().describe('ISO 8601 UTC epoch of the first row used'),
      to: z.string().describe('ISO 8601 UTC epoch of the last row used'),
      rows: z.number().int().describe('rows of the ephemeris in the window, every one counted in the averages and peaks'),
    })
    .optional()
    .describe('the trajectory a case from an ephemeris was computed along; its orbit is the osculating one at the first row'),
});

const loadSummary = z.object({
  solarWm2: num, albedoWm2: num, irWm2: num, solarW: num, albedoW: num, irW: num, absorbedW: num,
});

export const caseSurfaceResult = z.object({
  name: z.string(),
  areaM2: num,
  absorptivity: num,
  emissivity: num,
  series: z.object({
    solarWm2: z.array(num), albedoWm2: z.array(num), irWm2: z.array(num),
    solarW: z.array(num), albedoW: z.array(num), irW: z.array(num), absorbedW: z.array(num),
  }).describe('one value per time step of tS: incident fluxes in W/m^2, absorbed loads in W'),
  orbitAverage: loadSummary.extend({ absorbedWithMarginW: num }),
  peak: loadSummary,
});

export const caseResultsContent = z.object({
  periodS: num,
  betaDeg: num,
  solarFluxWm2: num,
  eclipseFraction: num.describe('umbra plus half of penumbra, fraction of the period'),
  eclipseDurationS: num,
  umbraDurationS: num,
  penumbraDurationS: num,
  tS: z.array(num).describe('s from periapsis (from the ascending node for a circular orbit; from the first row for a case from an ephemeris)'),
  weightS: z.array(num).optional().describe("each sample's share of the period in s, when the series are not evenly spaced in time"),
  sunlit: z.array(num).describe('1 full sun, 0 umbra'),
  parentSunlit: z
    .array(num)
    .optional()
    .describe(
      "about a moon, one value per time step of tS: the share of the Sun's disk past its planet alone (1 clear of the planet's shadow, 0 in its umbra); " +
        'only when the planet\'s shadow falls on the orbit (or the ephemeris window). sunlit already includes it. The CSV export\'s column "sunlit past the parent planet (0-1)", empty when absent',
    ),
  surfaces: z.array(caseSurfaceResult),
  total: z.object({ orbitAverageAbsorbedW: num, orbitAverageWithMarginW: num, peakAbsorbedW: num }),
});

export type CaseKind = (typeof caseKinds)[number];
export type CaseStatus = (typeof caseStatuses)[number];
export type CaseInputs = z.infer<typeof caseInputs>;
export type StoredConditions = z.infer<typeof caseConditions>;
export type CaseResultsContent = z.infer<typeof caseResultsContent>;

// The physics' shapes must fit the stored ones; these fail to compile if they drift apart.
/** Stored conditions are what evaluateCase takes (with the orbit in its canonical form). */
export const asConditions = (c: z.infer<typeof caseConditions>): CaseConditions => c;
export const asStoredResults = (r: CaseResults): CaseResultsContent => r;
export const asStoredMargins = (m: Margins): z.infer<typeof caseMargins> => m;
export const asStoredDriver = (d: SurfaceDriver): z.infer<typeof surfaceDriver> => d;
export const asStoredScan = (s: ScanSummary): z.infer<typeof scanSummary> => s;
export const asStoredDecision = (d: CaseDecision): z.infer<typeof caseDecision> => d;

/** The record a case's words are built from (physics/case-why.ts), read from a stored case. */
export function whyRecordOf(kind: CaseKind, inputs: CaseInputs, results: CaseResultsContent): CaseWhyRecord {
  // A case stored before its setup was kept apart: its lines without the margin one are its setup.
  const facts = inputs.decision ? undefined : (inputs.facts ?? inputs.rationale.filter((line) => !/^heat loads |heat-load margin/.test(line)));
  return {
    kind, bodyName: inputs.body.name, conditions: inputs.conditions, results, margins: inputs.margins,
    decision: inputs.decision, facts, handEdited: inputs.handEdited,
  };
}
