// A workspace's own table of paired hot/cold albedo and OLR values by inclination band and
// averaging time (e.g. transcribed from NASA/TM-2001-211221, Anderson, Justus & Batts), each row
// with its source in the user's words, and the choice of the row a design case uses in place of
// the built-in provisional pairs.
// Leaves out: interpolation between averaging times or bands (a row applies as entered) and any
// check of the values against their source (the source text travels with the case instead).
import type { Body, BodyId } from './bodies';
import type { DesignPairs } from './design-environment';

export interface EnvironmentTableRow {
  bodyId: BodyId;
  inclinationMinDeg: number;
  inclinationMaxDeg: number;
  /** The averaging time the pairs hold for, s (the item's thermal time constant picks the row). */
  averagingTimeS: number;
  hot: { albedo: number; olrWm2: number };
  cold: { albedo: number; olrWm2: number };
  source: string;
}

/** The inclination band holds i, or 180 - i for a retrograde orbit (bands are usually given 0..90 deg). */
const inBand = (row: EnvironmentTableRow, inclinationDeg: number): boolean =>
  [inclinationDeg, 180 - inclinationDeg].some((i) => i >= row.inclinationMinDeg - 1e-9 && i <= row.inclinationMaxDeg + 1e-9);

const duration = (s: number): string => (s >= 3600 ? `${+(s / 3600).toFixed(2)} h` : s >= 60 ? `${+(s / 60).toFixed(2)} min` : `${s} s`);

/**
 * The hot and cold pairs from the table's row for the body and the orbit's inclination: the one
 * whose averaging time is nearest (on a log scale) to `averagingTimeS` when given, else the
 * shortest averaging time of the band (the most extreme values, conservative). Null when no row applies.
 */
export function pairsFromTable(rows: readonly EnvironmentTableRow[], body: Body, inclinationDeg: number, averagingTimeS?: number): DesignPairs | null {
  const band = rows.filter((r) => r.bodyId === body.id && inBand(r, inclinationDeg));
  if (band.length === 0) return null;
  const distance = (r: EnvironmentTableRow) => (averagingTimeS === undefined ? r.averagingTimeS : Math.abs(Math.log(r.averagingTimeS / averagingTimeS)));
  const row = band.reduce((best, r) => (distance(r) < distance(best) ? r : best));
  const why = averagingTimeS === undefined
    ? 'the shortest averaging time of the band (most extreme; no thermal time constant given)'
    : `the averaging time nearest the given ${duration(averagingTimeS)}`;
  const source = `the workspace's environment table: ${body.name}, inclination ${row.inclinationMinDeg}..${row.inclinationMaxDeg} deg, ` +
    `averaging ${duration(row.averagingTimeS)} (${why}); source: ${row.source}`;
  return {
    hot: { ...row.hot, source, provisional: false },
    cold: { ...row.cold, source, provisional: false },
  };
}
