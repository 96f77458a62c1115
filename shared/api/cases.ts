// Load cases: derive, edit, review, release, compare, subscribe, export (API.md "Other fixed routes").
// Routes (under /api/v1). Thermal engineers and owners derive, edit, submit and release; every member
// reads, except that viewers see released and superseded revisions only; another workspace's case is 404.
//   POST   missions/:id/cases/derive        caseDerive -> 201 {items: [hot, cold]} (both saved as drafts)
//   POST   missions/:id/cases               caseCreate -> 201 caseDetail (a custom case, draft)
//   GET    cases?missionId=&status=&kind=   -> {items: caseSummary[]}
//   GET    cases/:id                        -> caseDetail
//   PATCH  cases/:id                        caseUpdate -> caseDetail (drafts only; else 409; 409 too when its
//                                            `version` is not the draft's: someone changed it meanwhile)
//   POST   cases/:id/submit                 -> caseDetail (draft -> review)
//   POST   cases/:id/release                -> caseDetail (review -> released; by a thermal engineer or
//                                              owner other than the author; supersedes the previous release;
//                                              409 when a newer revision of the series is released already)
//   POST   cases/:id/return                 caseCommentCreate -> caseDetail (review -> draft, by a reviewer
//                                            other than the author, the comment kept in the case's history)
//   POST   cases/:id/comments               caseCommentCreate -> 201 caseComment (on a draft or a case in review)
//   POST   cases/:id/revisions              -> 201 caseDetail (a new draft from a released or superseded one)
//   GET    cases/:id/compare?with=otherId   -> caseComparison
//   POST   cases/:id/subscription           -> {subscribed: true}    DELETE -> {subscribed: false}
//   GET    cases/:id/export?format=json|csv -> the case as a file (caseExport for JSON)
//   GET    workspaces/:workspaceId/overview -> workspaceOverview (what needs the caller; members only, else 404)
//   GET    schemas/load-case.json           -> the JSON Schema of caseExport
//   GET    openapi.json                     -> the whole API in OpenAPI 3
import { z } from 'zod';
import { lineText, multilineText } from './text';
import { answerLayout } from './answer-formats';
import { caseInputs, caseKinds, caseResultsContent, caseStatuses, propertySetValues } from './case-content';
import { surfaceNormal } from './missions';

const isoDate = z.iso.date({ message: 'is a date like 2028-03-20' });
const fraction = (label: string) => z.number({ message: `${label} must be a number` }).min(0, `${label} is 0..1`).max(1, `${label} is 0..1`);
const name = lineText(120, 'a case name has at most 120 characters').min(1, 'give the case a name');
const steps = z.number().int('steps is a whole number').min(12, 'steps is 12..2000').max(2000, 'steps is 12..2000');

export const marginsInput = z.strictObject({
  heatLoadPercent: z.number().min(0, 'heatLoadPercent is 0..200').max(200, 'heatLoadPercent is 0..200').optional(),
  temperatureMarginC: z.number().min(0, 'temperatureMarginC is 0..100').max(100, 'temperatureMarginC is 0..100').optional(),
});

export const pairInput = z.strictObject({
  albedo: fraction('albedo'),
  olrWm2: z.number().min(0, 'OLR cannot be negative').max(20000),
  source: lineText(300).min(1).default('entered by the user, no source given'),
});

export const caseDerive = z.strictObject({
  orbitId: z.string().min(1, 'choose an orbit').max(64),
  /** A name prefix: the cases are called "<name> hot" and "<name> cold". */
  name: name.optional(),
  properties: z.strictObject({ hot: z.enum(propertySetValues).default('eol'), cold: z.enum(propertySetValues).default('bol') }).optional(),
  margins: marginsInput.optional(),
  environment: z.strictObject({ hot: pairInput.optional(), cold: pairInput.optional() }).optional(),
  /** The item's thermal time constant: picks the averaging time of the workspace's environment table. */
  averagingTimeS: z.number({ message: 'averagingTimeS must be a number' }).positive('averagingTimeS must be above 0 s').max(1e7).optional(),
  steps: steps.default(120),
  /** A mission with phases: derive in this phase only (its id) instead of choosing the worst phase for each case. */
  phaseId: z.string().min(1, 'choose a phase').max(64).optional(),
  /** Also save the survival cold case: the cold case's loads with each node's least dissipation over the phases, heaters only. */
  survival: z.boolean().optional(),
});

/** A new revision: why it is made (shown in history, compare, exports and mail), and whether it is derived again from the mission's current inputs. */
export const caseRevisionCreate = z.strictObject({
  reason: lineText(500, 'a reason has at most 500 characters')
    .min(1, 'say why this revision is made')
    .optional()
    .describe('why this revision is made; kept as inputs.revisionReason, shown in history, compare, the exports and the subscribers\' mail'),
  fromCurrentInputs: z
    .boolean()
    .default(false)
    .describe(
      'false: the same inputs and loads as the revision it starts from. true: computed again from the mission as it is now: a hot or cold case derived ' +
        'again on its orbit; a custom case on its date with the values its author fixed (inputs.fixed) and the current orbit, surfaces and materials; ' +
        'a case from an ephemeris along the same window with the current surfaces and materials (409 case_source_deleted when the orbit or ephemeris was deleted)',
    ),
});

export const caseCreate = z.strictObject({
  orbitId: z.string().min(1, 'choose an orbit').max(64),
  name,
  date: isoDate,
  betaDeg: z.number().min(-90, 'beta is -90..90 deg').max(90, 'beta is -90..90 deg').optional().describe('deg; overrides the beta the date gives'),
  solarDistanceAu: z.number().positive('solar distance must be above 0 AU').max(100).optional().describe('AU; overrides the distance of the date'),
  albedo: fraction('albedo').optional(),
  olrWm2: z.number().min(0, 'OLR cannot be negative').max(20000).optional().describe('W/m^2'),
  properties: z.enum(propertySetValues).default('bol'),
  marginDirection: z.enum(['increase', 'decrease']).default('increase'),
  normals: z.record(lineText(80), surfaceNormal).optional().describe("attitude: surface name -> normal, over the mission's own normals"),
  attitude: lineText(300).optional().describe('the attitude in words, e.g. "safe mode, array to Sun"'),
  margins: marginsInput.optional(),
  steps: steps.default(120),
});

const materialInput = z.strictObject({
  name: lineText(120).min(1),
  absorptivityBol: fraction('absorptivityBol'),
  emissivityBol: fraction('emissivityBol'),
  absorptivityEol: fraction('absorptivityEol'),
  emissivityEol: fraction('emissivityEol'),
  source: lineText(300).default('entered by the user, no source given'),
});

export const caseSurfaceInput = z.strictObject({
  name: lineText(80).min(1, 'give the surface a name'),
  normal: surfaceNormal,
  areaM2: z.number().positive('area must be above 0 m²').max(10000),
  material: materialInput,
});

export const caseUpdate = z.strictObject({
  /**
   * The `version` of the draft the edit was made on. When given and the draft has changed since
   * (another edit, a submission), the PATCH is refused with 409 instead of overwriting that change.
   */
  version: z.number().int('version is a whole number').min(1, 'version counts from 1').optional(),
  name: name.optional(),
  margins: marginsInput.optional(),
  inputs: z
    .strictObject({
      date: isoDate.optional(),
      betaDeg: z.number().min(-90, 'beta is -90..90 deg').max(90, 'beta is -90..90 deg').optional(),
      solarDistanceAu: z.number().positive('solar distance must be above 0 AU').max(100).optional(),
      albedo: fraction('albedo').optional(),
      olrWm2: z.number().min(0, 'OLR cannot be negative').max(20000).optional(),
      properties: z.enum(propertySetValues).optional(),
      marginDirection: z.enum(['increase', 'decrease']).optional(),
      steps: steps.optional(),
      attitude: lineText(300).optional(),
      surfaces: z
        .array(caseSurfaceInput)
        .min(1, 'give at least one surface')
        .max(100)
        .refine((s) => new Set(s.map((x) => x.name)).size === s.length, { message: 'surface names must be unique' })
        .optional(),
    })
    .optional(),
});

export const caseListQuery = z.strictObject({
  missionId: z.string().max(64).optional(),
  status: z.enum(caseStatuses, { message: `status is one of ${caseStatuses.join(', ')}` }).optional(),
  kind: z.enum(caseKinds, { message: `kind is one of ${caseKinds.join(', ')}` }).optional(),
});

export const caseCompareQuery = z.strictObject({ with: z.string().min(1, 'give the id of the case to compare with').max(64) });
export const caseExportQuery = z.strictObject({
  format: z.enum(['json', 'csv'], { message: 'format is json or csv' }).default('json'),
  /** The JSON export is in columns already: the columnar layout answers it as it is (API.md "Answer formats"). */
  layout: answerLayout,
});

const person = z.object({ id: z.string(), name: z.string(), email: z.string() }).nullable();

export const caseSummary = z.object({
  id: z.string(),
  missionId: z.string(),
  missionName: z.string(),
  workspaceId: z.string(),
  seriesId: z.string(),
  name: z.string(),
  kind: z.enum(caseKinds),
  status: z.enum(caseStatuses),
  revision: z.number().int(),
  checksum: z.string().nullable(),
  author: person,
  releasedBy: person,
  releasedAt: z.string().nullable(),
  orbitAverageAbsorbedW: z.number().describe('W, the whole spacecraft, without margin'),
  betaDeg: z.number().describe('deg'),
  version: z.number().int().describe('counts the changes of this revision; a PATCH that names an older one is refused (409)'),
  createdAt: z.string(),
  updatedAt: z.string(),
  inputsChanged: z
    .boolean()
    .describe("true when the mission's inputs (surfaces, materials, orbit, body constants, dates, the ephemeris) changed since this revision was made; false for superseded revisions"),
  inputChanges: z
    .array(z.string())
    .describe('what changed in the mission since this revision was made, in words with old and new values (surfaces, materials, orbit, body constants, dates, a deleted ephemeris); empty when current (in lists, also for superseded revisions)'),
  /** The mission phase that drove the case (its name), null for a case of a mission without phases or a custom one. */
  phase: z.string().nullable(),
  /** "survival" for a survival cold case (kind cold: minimum dissipation, heaters only), null otherwise. */
  variant: z.enum(['survival']).nullable(),
});

export const caseActionNames = ['edit', 'submit', 'release', 'return', 'comment', 'newRevision'] as const;

export const caseComment = z.object({
  id: z.string(),
  revision: z.number().int().describe('the revision the comment was made on'),
  kind: z.enum(['comment', 'returned']).describe('returned: the reviewer sent the revision back to its author with this comment'),
  text: z.string(),
  author: person,
  createdAt: z.string(),
});

/** A comment on a case (draft or in review), and the reason a reviewer gives when returning one. */
export const caseCommentCreate = z.strictObject({
  text: multilineText(4000, 'a comment has at most 4000 characters')
    .pipe(z.string().min(1, 'write the comment'))
    .describe('the comment, or (returning a case) what its author should change; line breaks kept'),
});

export const caseDetail = caseSummary.extend({
  submittedBy: person,
  submittedAt: z.string().nullable(),
  subscribed: z.boolean().describe('the caller follows the case (mail on every new release)'),
  actions: z
    .array(z.enum(caseActionNames))
    .describe('what the caller may do with this revision now (role, status, four eyes: the author neither releases nor returns it); the server refuses the others'),
  comments: z.array(caseComment).describe('the review conversation of every revision of the case, oldest first'),
  currentInputsBlocked: z
    .string()
    .nullable()
    .describe('why a new revision cannot be computed again from the current inputs (its ephemeris or orbit was deleted); null when it can'),
  caution: z.string().describe('the preliminary-design caution'),
  inputs: caseInputs,
  results: caseResultsContent,
});

export const caseList = z.object({ items: z.array(caseSummary) });

/**
 * What needs the caller in one workspace (GET workspaces/:workspaceId/overview): cases in review by
 * someone else that the caller may release, the caller's drafts a reviewer returned (with the
 * reviewer's comment), the newest revisions of the cases the caller follows, and released cases whose
 * mission inputs changed since. Viewers see released and superseded revisions only, as in the list.
 */
export const workspaceOverview = z.object({
  waitingForReview: z.array(caseSummary).describe('cases in review written by someone else, which the caller may release or return (thermal engineers and owners; empty for others)'),
  returnedToMe: z.array(z.object({ case: caseSummary, comment: caseComment })).describe("the caller's drafts a reviewer returned, each with the reviewer's comment"),
  followed: z.array(caseSummary).describe('the newest revisions of followed cases, newest change first, at most 10'),
  stale: z.array(caseSummary).describe('released cases whose mission inputs changed since (inputsChanged)'),
});
export const derivedCases = z.object({ items: z.array(caseDetail) });
export const subscriptionState = z.object({ subscribed: z.boolean() });

const compared = z.object({ a: z.number(), b: z.number(), difference: z.number().describe('b - a (new - old)') });

export const caseComparison = z.object({
  a: caseSummary,
  b: caseSummary,
  inputs: z
    .array(z.object({ path: z.string().describe('the input\'s place in inputs, e.g. "margins.heatLoadPercent"'), a: z.unknown(), b: z.unknown(), changed: z.boolean() }))
    .describe('every scalar input of both, by path; a is the older revision, b the newer'),
  surfaces: z.array(
    z.object({
      name: z.string(),
      solarW: compared.nullable(),
      albedoW: compared.nullable(),
      irW: compared.nullable(),
      absorbedW: compared.nullable(),
      peakAbsorbedW: compared.nullable(),
    }),
  ),
  total: z.object({ orbitAverageAbsorbedW: compared }),
}).describe('two revisions side by side: a the older, b the newer, every difference b - a (new - old), loads in W');

/**
 * The hashed part of an export's metadata: only what never changes once released (people are named
 * by id here; their names and addresses travel outside the hash, since accounts can be renamed).
 */
export const caseExportCase = z.object({
  id: z.string(),
  seriesId: z.string(),
  revision: z.number().int(),
  name: z.string(),
  kind: z.enum(caseKinds),
  missionId: z.string(),
  workspaceId: z.string(),
  authorId: z.string().nullable(),
  releasedById: z.string().nullable(),
  releasedAt: z.string().nullable(),
});

export const caseExport = z
  .object({
    format: z.literal('eclipta.load-case'),
    formatVersion: z.literal(1),
    caution: z.string(),
    status: z.enum(caseStatuses),
    checksum: z.string().regex(/^[0-9a-f]{64}$/),
    checksumMethod: z.string(),
    exportedAt: z.string(),
    author: person,
    releasedBy: person,
    case: caseExportCase,
    inputs: caseInputs,
    results: caseResultsContent,
  })
  .describe('An Eclipta load case: metadata, every input with its source, per-surface loads over one orbit');

export type CaseDerive = z.input<typeof caseDerive>;
export type CaseCreate = z.input<typeof caseCreate>;
export type CaseDeriveParsed = z.output<typeof caseDerive>;
export type CaseCreateParsed = z.output<typeof caseCreate>;
export type CaseUpdateParsed = z.output<typeof caseUpdate>;
export type CaseRevisionParsed = z.output<typeof caseRevisionCreate>;
export type CaseUpdate = z.input<typeof caseUpdate>;
export type CaseSummary = z.infer<typeof caseSummary>;
export type CaseDetail = z.infer<typeof caseDetail>;
export type CaseComment = z.infer<typeof caseComment>;
export type CaseActionName = (typeof caseActionNames)[number];
export type CaseComparison = z.infer<typeof caseComparison>;
export type CaseExport = z.infer<typeof caseExport>;
export type CaseExportCase = z.infer<typeof caseExportCase>;
export type WorkspaceOverview = z.infer<typeof workspaceOverview>;
