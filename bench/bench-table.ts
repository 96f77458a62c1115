// What a bench file hands back to bench/run.ts: rows of one table, the first row's keys naming the columns.
export type BenchCell = string | number;
export type BenchRow = Record<string, BenchCell>;
/** The default export of every bench/*.bench.ts. */
export type Bench = () => Promise<BenchRow[]>;

const show = (cell: BenchCell | undefined): string =>
  cell === undefined ? '' : typeof cell === 'number' ? (Number.isInteger(cell) ? String(cell) : cell.toFixed(cell < 10 ? 2 : 1)) : cell;

/** A plain-text table: numbers right-aligned, text left-aligned. A row of one cell is a note: it runs on past its column instead of widening it. */
export function formatTable(rows: readonly BenchRow[]): string {
  if (rows.length === 0) return '(no rows)';
  const columns = [...new Set(rows.flatMap((r) => Object.keys(r)))];
  const cells = rows.map((r) => columns.map((c) => show(r[c])));
  const sizing = cells.filter((_, i) => Object.keys(rows[i]).length > 1);
  const widths = columns.map((c, i) => Math.max(c.length, ...sizing.map((row) => row[i].length)));
  const line = (values: string[], numeric: boolean[]) =>
    values.map((v, i) => (numeric[i] ? v.padStart(widths[i]) : v.padEnd(widths[i]))).join('  ').trimEnd();
  const numeric = columns.map((c) => rows.every((r) => typeof r[c] === 'number' || r[c] === undefined));
  return [line(columns, numeric.map(() => false)), line(widths.map((w) => '-'.repeat(w)), numeric), ...cells.map((row) => line(row, numeric))].join('\n');
}
