// A case as a file for the teams that import it (DOMAIN.md "What importing teams need"): JSON that
// follows the served JSON Schema, or CSV per RFC 4180 that a spreadsheet opens as it is. Both carry
// the caution and the same checksum.
import type { CaseExport, CaseExportCase } from '../../shared/api/cases';
import { csvRecord } from '../../shared/csv/csv-cell';
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
  ['solarWm2', 'solar incident [W/m^2]'],
  ['albedoWm2', 'albedo incident [W/m^2]'],
  ['irWm2', 'IR incident [W/m^2]'],
  ['solarW', 'solar absorbed [W]'],
  ['albedoW', 'albedo absorbed [W]'],
  ['irW', 'IR absorbed [W]'],
  ['absorbedW', 'absorbed total [W]'],
] as const;

/**
 * The CSV export: first a block of "field [unit]", value rows (the metadata), a blank record, then
 * one row per time step with a column per surface and load component, units in the header, and
 * the orbit-average and peak rows. Every record has the same number of fields (RFC 4180).
 */
export function caseExportCsv(ctx: AppContext, row: LoadCaseRow): { csv: string; checksum: string } {
  const doc = caseExportJson(ctx, row);
  const { inputs: i, results: r } = doc;
  const c = i.conditions;
  const meta: [string, string | number | null][] = [
    ['format', `${doc.format} version ${doc.formatVersion}`],
    ['caution', doc.caution],
    ['case id', doc.case.id],
    ['case series id', doc.case.seriesId],
    ['name', doc.case.name],
    ['kind', doc.case.kind],
    ['revision', doc.case.revision],
    ['status', doc.status],
    ['checksum (sha256)', doc.checksum],
    ['checksum method', 'sha256 of the canonical JSON of case, inputs and results of the JSON export of this revision'],
    ['released by', doc.releasedBy ? `${doc.releasedBy.name} <${doc.releasedBy.email}>` : null],
    ['released at (UTC)', doc.case.releasedAt],
    ['exported at (UTC)', doc.exportedAt],
    ['mission', i.mission.name],
    ['body', `${i.body.name} (${i.body.id})`],
    ['body GM [km^3/s^2]', i.body.gmKm3S2],
    ['body radius [km]', i.body.radiusKm],
    ['body J2 [-]', i.body.j2],
    ['body constants sources', Object.entries(i.body.sources).map(([k, v]) => `${k}: ${v}`).join('; ')],
    ['orbit', i.orbit.name],
    ['orbit epoch (UTC)', i.orbit.epoch],
    ['semi-major axis [km]', i.orbit.semiMajorAxisKm],
    ['eccentricity [-]', i.orbit.eccentricity],
    ['inclination [deg]', i.orbit.inclinationDeg],
    ['RAAN at epoch [deg]', i.orbit.raanDeg],
    ['argument of periapsis [deg]', i.orbit.argPeriapsisDeg],
    ['period [s]', r.periodS],
    ['case date', c.date],
    ['beta [deg]', r.betaDeg],
    ['solar distance [AU]', c.solarDistanceAu],
    ['solar flux [W/m^2]', r.solarFluxWm2],
    ['albedo [-]', c.albedo],
    ['OLR [W/m^2]', c.olrWm2],
    ['albedo and OLR source', i.environmentSource],
    ['provisional values', i.provisional ? 'yes' : 'no'],
    ['property set', c.properties === 'eol' ? 'EOL (end of life)' : 'BOL (beginning of life)'],
    ['eclipse duration [s]', r.eclipseDurationS],
    ['eclipse fraction [-]', r.eclipseFraction],
    ['attitude', i.attitude],
    ['heat-load margin [%]', i.margins.heatLoadPercent],
    ['heat-load margin source', i.margins.sources.heatLoadPercent],
    ['temperature margin [C]', i.margins.temperatureMarginC],
    ['temperature margin source', i.margins.sources.temperatureMarginC],
    ...i.rationale.map((text, k): [string, string] => [`rationale ${k + 1}`, text]),
    ...i.surfaceDrivers.map((d): [string, string] => [`surface driver ${d.surface}`, d.text]),
    ...i.assumptions.map((text, k): [string, string] => [`assumption ${k + 1}`, text]),
  ];
  const width = Math.max(2, 2 + r.surfaces.length * componentColumns.length);
  const pad = (cells: (string | number | null)[]) => [...cells, ...new Array<null>(width - cells.length).fill(null)];
  const records: (string | number | null)[][] = meta.map(([k, v]) => pad([k, v]));
  records.push(pad([]));
  records.push(['tS [s]', 'sunlit [0-1]', ...r.surfaces.flatMap((s) => componentColumns.map(([, unit]) => `${s.name} ${unit}`))]);
  r.tS.forEach((t, k) => {
    records.push([t, r.sunlit[k] ?? null, ...r.surfaces.flatMap((s) => componentColumns.map(([key]) => s.series[key][k] ?? null))]);
  });
  records.push(['orbit average', null, ...r.surfaces.flatMap((s) => componentColumns.map(([key]) => s.orbitAverage[key]))]);
  records.push(['peak', null, ...r.surfaces.flatMap((s) => componentColumns.map(([key]) => s.peak[key]))]);
  records.push(pad([`orbit average with ${i.margins.heatLoadPercent} % margin, absorbed total [W]`, null, ...r.surfaces.flatMap((s) => componentColumns.map(([key]) => (key === 'absorbedW' ? s.orbitAverage.absorbedWithMarginW : null)))]));
  return { csv: records.map(csvRecord).join(''), checksum: doc.checksum };
}
