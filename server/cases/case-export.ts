// A case as a file for the teams that import it (DOMAIN.md "What importing teams need"): JSON that
// follows the served JSON Schema, or a tidy CSV per RFC 4180 that a spreadsheet or pandas opens as it
// is. Both carry the caution and the same checksum.
import type { CaseExport, CaseExportCase } from '../../shared/api/cases';
import { csvRecord } from '../../shared/csv/csv-cell';
import { round } from '../../shared/physics/rounding';
import { pointingWords } from '../../shared/physics/pointing-words';
import type { AppContext } from '../app-context';
import type { LoadCaseRow } from '../db/schema';
import { canonicalJson, checksumMethod, sha256Hex } from './canonical-json';
import { cautionFor, personOf } from './case-views';

/** The part of an export the checksum covers: what never changes once the revision is released. */
export function hashedContent(row: LoadCaseRow): Pick<CaseExport, 'case' | 'inputs' | 'results'> {
  const meta: CaseExportCase = {
    id: row.id, seriesId: row.seriesId, revision: row.revision, name: row.name, kind: row.kind,
    missionId: row.missionId, workspaceId: row.workspaceId, authorId: row.authorId, releasedById: row.releasedBy, releasedAt: row.releasedAt,
  };
  return { case: meta, inputs: row.inputs, results: row.results };
}

export const caseChecksum = (row: LoadCaseRow): string => sha256Hex(canonicalJson(hashedContent(row)));

export function exportedCase(ctx: AppContext, row: LoadCaseRow): Omit<CaseExport, 'checksum' | 'exportedAt'> {
  return {
    format: 'eclipta.load-case',
    formatVersion: 1,
    caution: cautionFor(row.inputs.mission.crewed),
    status: row.status,
    checksumMethod,
    author: personOf(ctx.db, row.authorId),
    releasedBy: personOf(ctx.db, row.releasedBy),
    ...hashedContent(row),
  };
}

/** The JSON export; a draft's checksum is its content's hash now, a released one's is the stored value. */
export function caseExportJson(ctx: AppContext, row: LoadCaseRow): CaseExport {
  const content = exportedCase(ctx, row);
  const checksum = row.checksum ?? caseChecksum(row);
  return { ...content, checksum, exportedAt: new Date().toISOString() };
}

const componentColumns = [
  ['solarWm2', 'solar incident (W/m^2)', 2],
  ['albedoWm2', 'albedo incident (W/m^2)', 2],
  ['irWm2', 'IR incident (W/m^2)', 2],
  ['solarW', 'solar absorbed (W)', 3],
  ['albedoW', 'albedo absorbed (W)', 3],
  ['irW', 'IR absorbed (W)', 3],
  ['absorbedW', 'absorbed total (W)', 3],
] as const;

/** The metadata columns, repeated on every row so each row stands alone (DEVELOPERS.md "Case CSV"). */
const metaColumns = [
  'case', 'revision', 'status', 'checksum (sha256)', 'mission', 'body', 'orbit', 'case date (UTC)', 'beta (deg)', 'solar distance (AU)',
  'property set', 'heat-load margin (%)', 'phase', 'variant',
] as const;

/** Every column of the case CSV, in order: what the export's documentation lists. */
export const caseCsvColumns = [
  ...metaColumns, 'row', 'step', 'time from periapsis (s)', 'sunlit (0-1)', 'sunlit past the parent planet (0-1)', 'surface', 'pointing',
  ...componentColumns.map(([, header]) => header), 'absorbed total with margin (W)', 'caution',
] as const;

/** A step's sunlit share, and past the parent planet alone about a moon when the case holds it. */
type Shade = [number | undefined, number | undefined];

/** Rounded to what the quantity means (W/m^2 to 0.01, W to 0.001, s to 0.1): no floating-point noise. */
const rounded = (x: number | null | undefined, digits: number): number | null => (x === null || x === undefined ? null : round(x, digits));

/**
 * The CSV export, tidy: one header row with units, then one row per time step and surface
 * (row = "step"; "sunlit past the parent planet" is the planet's shadow about a moon, empty where the
 * case holds none: not a moon, or the planet's shadow does not fall on its orbit), per surface its "orbit average" and "peak", and the spacecraft's total as the
 * surface "spacecraft total". The case's metadata and the caution are columns repeated on every
 * row; the inputs in full, the "why" and the assumptions are in the JSON export.
 */
export function caseExportCsv(ctx: AppContext, row: LoadCaseRow): { csv: string; checksum: string } {
  const doc = caseExportJson(ctx, row);
  const { inputs, results } = doc;
  const conditions = inputs.conditions;
  const meta = [
    doc.case.name, doc.case.revision, doc.status, doc.checksum, inputs.mission.name, inputs.body.name, inputs.orbit.name, conditions.date, rounded(results.betaDeg, 3),
    rounded(conditions.solarDistanceAu, 6), conditions.properties.toUpperCase(), inputs.margins.heatLoadPercent, inputs.phase?.name ?? '', inputs.decision?.survival ? 'survival' : '',
  ];
  // each surface's pointing in words (pointing.ts), from the case's own conditions
  const pointing = new Map(conditions.surfaces.map((s) => [s.name, pointingWords(s.normal)]));
  const line = (kind: string, step: number | null, t: number | null, sunlit: Shade | null, surface: string, loads: (number | null)[], withMargin: number | null) =>
    csvRecord([...meta, kind, step, rounded(t, 1), rounded(sunlit?.[0], 4), rounded(sunlit?.[1], 4), surface, pointing.get(surface) ?? null, ...loads, rounded(withMargin, 3), doc.caution]);
  const loadsOf = (pick: (key: (typeof componentColumns)[number][0]) => number | undefined) =>
    componentColumns.map(([key, , digits]) => rounded(pick(key), digits));
  const out = [csvRecord([...caseCsvColumns])];
  results.tS.forEach((t, k) => {
    const sunlit: Shade = [results.sunlit[k], results.parentSunlit?.[k]];
    for (const s of results.surfaces) out.push(line('step', k + 1, t, sunlit, s.name, loadsOf((key) => s.series[key][k]), null));
  });
  for (const s of results.surfaces) {
    out.push(line('orbit average', null, null, null, s.name, loadsOf((key) => s.orbitAverage[key]), s.orbitAverage.absorbedWithMarginW));
    out.push(line('peak', null, null, null, s.name, loadsOf((key) => s.peak[key]), null));
  }
  const totalOnly = (w: number) => componentColumns.map(([key]) => (key === 'absorbedW' ? rounded(w, 3) : null));
  out.push(line('orbit average', null, null, null, 'spacecraft total', totalOnly(results.total.orbitAverageAbsorbedW), results.total.orbitAverageWithMarginW));
  out.push(line('peak', null, null, null, 'spacecraft total', totalOnly(results.total.peakAbsorbedW), null));
  return { csv: out.join(''), checksum: doc.checksum };
}
