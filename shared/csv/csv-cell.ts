// The one CSV cell writer of every CSV Eclipta writes, on the server (case export, mission sweep)
// and in the client (plot, environment, sweep and thermal-run downloads): RFC 4180 section 2
// quoting, and the OWASP "CSV Injection" defence, so a name typed as =HYPERLINK(…), +cmd|…, @… or
// -… reaches a spreadsheet as text, never as a formula.

export type CsvCell = string | number | null | undefined;

/**
 * Characters that make a spreadsheet read a cell as a formula (OWASP CSV Injection: = + - @, tab
 * and carriage return). A text cell starting with one gets a leading single quote, which
 * spreadsheets show as text and do not evaluate.
 */
const formulaStart = /^[=+\-@\t\r]/;

/** RFC 4180: a field holding a comma, a quote or a line break is quoted; ';' too, for locales that split on it. */
const needsQuotes = /[",;\r\n]/;

/**
 * One field. Numbers are written as numbers (a negative one stays a number, never prefixed);
 * missing and non-finite numbers as an empty field (a missing value, not "NaN"); text neutralised
 * against formulas, then quoted when needed, its quotes doubled.
 */
export function csvField(cell: CsvCell): string {
  if (cell === null || cell === undefined) return '';
  if (typeof cell === 'number') return Number.isFinite(cell) ? String(cell) : '';
  const text = formulaStart.test(cell) ? `'${cell}` : cell;
  return needsQuotes.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

/** One record, fields joined by commas, ended with CRLF (RFC 4180 rule 1). */
export function csvRecord(cells: readonly CsvCell[]): string {
  return cells.map(csvField).join(',') + '\r\n';
}
