// CSV ephemerides, read as a stream (plain lines split by hand, anything quoted by csv-parse): a header row naming epoch (ISO 8601 UTC) or t
// (seconds from the epoch given with the upload), x, y, z in km and optionally vx, vy, vz in km/s.
// Units may follow a name ("x_km", "x (km)"); metres in a header are refused outright.
import type { Readable } from 'node:stream';
import { StringDecoder } from 'node:string_decoder';
import { CsvError, parse, type Options, type Parser } from 'csv-parse';
import type { EphemerisChecker } from './ephemeris-checker';
import { parseEpochMs } from './epoch-text';

type Field = 'epoch' | 't' | 'x' | 'y' | 'z' | 'vx' | 'vy' | 'vz';

const aliases: Record<string, Field> = {
  epoch: 'epoch', utc: 'epoch', time_utc: 'epoch', t: 't', t_s: 't',
  x: 'x', y: 'y', z: 'z', vx: 'vx', vy: 'vy', vz: 'vz', x_dot: 'vx', y_dot: 'vy', z_dot: 'vz',
};
const expectedColumns = 'epoch (or t), x, y, z, and optionally vx, vy, vz';

interface Columns {
  byEpoch: boolean;
  epoch: number;
  x: number;
  y: number;
  z: number;
  /** -1 without velocities. */
  vx: number;
  vy: number;
  vz: number;
}

interface Header {
  index: Map<Field, number>;
  names: string[];
  columns?: Columns;
}

/** Splits "x (km)", "x [km]", "x_km" into the name and its unit. */
function nameAndUnit(cell: string): { name: string; unit: string } {
  const text = cell.trim().toLowerCase();
  const bracket = /^(.*?)\s*[([]\s*([^)\]]*)\s*[)\]]$/.exec(text);
  if (bracket) return { name: bracket[1].trim(), unit: bracket[2].trim() };
  const suffix = /^(v?[xyz]|[xyz]_dot|t)_(km|m|km_s|kms|m_s|s)$/.exec(text);
  if (suffix) return { name: suffix[1], unit: suffix[2] };
  return { name: text, unit: '' };
}

function readHeader(cells: string[], checker: EphemerisChecker, hasEpochField: boolean): Header | null {
  if (cells.length === 1) {
    const delimiter = [';', '\t', '|'].find((d) => cells[0].includes(d));
    if (delimiter) {
      checker.problem(0, undefined, cells[0], `the columns are separated by ${delimiter === '\t' ? 'tabs' : `"${delimiter}"`}; Eclipta reads comma-separated values`);
      return null;
    }
  }
  const index = new Map<Field, number>();
  cells.forEach((cell, i) => {
    const { name, unit } = nameAndUnit(cell);
    const field = aliases[name];
    if (!field) {
      checker.problem(0, cell, cell, `unknown column; the columns are ${expectedColumns}`);
      return;
    }
    if (index.has(field)) checker.problem(0, cell, cell, `the ${field} column appears twice`);
    const positional = field === 'x' || field === 'y' || field === 'z';
    if (positional && (unit === 'm' || unit === 'metres' || unit === 'meters')) {
      checker.problem(0, cell, cell, 'the header says metres; Eclipta expects km');
    } else if (!positional && field.startsWith('v') && (unit === 'm/s' || unit === 'm_s')) {
      checker.problem(0, cell, cell, 'the header says m/s; Eclipta expects km/s');
    }
    index.set(field, i);
  });
  const epochFields = ['epoch', 't'].filter((f) => index.has(f as Field));
  if (epochFields.length === 0) checker.problem(0, undefined, cells.join(','), `no epoch column; the columns are ${expectedColumns}`);
  if (epochFields.length === 2) checker.problem(0, 't', undefined, 'give either epoch or t, not both');
  if (index.has('t') && !hasEpochField) checker.problem(0, 't', undefined, 'the t column counts seconds from an epoch: send that epoch with the upload (field "epoch")');
  for (const f of ['x', 'y', 'z'] as const) if (!index.has(f)) checker.problem(0, f, undefined, `no ${f} column; the columns are ${expectedColumns}`);
  const velocities = (['vx', 'vy', 'vz'] as const).filter((f) => index.has(f));
  if (velocities.length > 0 && velocities.length < 3) checker.problem(0, undefined, velocities.join(','), 'give all three of vx, vy, vz or none');
  return checker.clean ? { index, names: cells.map((c) => c.trim()) } : null;
}

/**
 * How csv-parse reads an upload (the bench's csv-parse-alone baseline uses the same). No `trim`:
 * cells are trimmed where they are read (numbers, the epoch, the header), which costs less than
 * csv-parse trimming every field of every row; no cast, no raw, no info, for the same reason.
 */
export const csvParseOptions: Options = { bom: true, relax_column_count: true, skip_empty_lines: true, comment: '#' };

/**
 * Feeds the CSV rows of `input` to the checker; stops early once it has all the problems it keeps.
 * Nearly every ephemeris is plain numbers and epochs between commas, one row a line: such lines are
 * split here (LF or CRLF, a leading BOM dropped, "#" comments and empty lines skipped, as csv-parse
 * does with csvParseOptions), about three times faster than csv-parse. The first line with a quote
 * or a bare CR hands the rest of the file, from that line on, to csv-parse, which reads quoted
 * fields and reports what cannot be read, its record numbers counted on from the lines before.
 */
/** Longer than any line of numbers; a "line" this long goes to csv-parse. */
const MAX_PLAIN_LINE = 64 * 1024;

export function readCsvEphemeris(input: Readable, checker: EphemerisChecker, epochMs: number | null): Promise<void> {
  const decoder = new StringDecoder('utf8');
  let header: Header | null = null;
  let row = 0;
  /** Records read before csv-parse took over (the header included). */
  let recordsBefore = 0;
  let parser: Parser | null = null;
  let pending = '';
  let first = true;
  return new Promise<void>((resolve, reject) => {
    let settled = false;
    const finish = (err?: unknown) => {
      if (settled) return;
      settled = true;
      input.off('data', onData);
      input.off('end', onEnd);
      parser?.destroy();
      // Whatever is still coming is not read: let it drain.
      input.resume();
      if (err) reject(err);
      else resolve();
    };
    /** One record, from either reader. */
    const onRecord = (record: string[]) => {
      if (settled) return;
      if (header === null) {
        header = readHeader(record, checker, epochMs !== null);
        if (header === null) finish();
        return;
      }
      row++;
      readRow(row, record, header, checker, epochMs);
      if (checker.full) finish();
    };
    const atEnd = () => {
      if (header === null) checker.problem(0, undefined, undefined, 'the file is empty');
      finish();
    };
    const handOver = (rest: string) => {
      recordsBefore = header === null ? 0 : row + 1;
      const csv = parse(csvParseOptions);
      parser = csv;
      // Records are taken by 'data' callbacks rather than for-await: a promise per row would cost
      // more than the checks themselves.
      csv.on('data', onRecord);
      csv.on('end', atEnd);
      csv.on('error', (err) => {
        if (!(err instanceof CsvError)) {
          finish(err);
          return;
        }
        // A quote out of place and similar: csv-parse cannot go on past it.
        const records = recordsBefore + (typeof err.records === 'number' ? err.records : row + 1 - recordsBefore);
        checker.problem(records, undefined, undefined, `this line cannot be read as CSV: ${csvProblemWords(err.code)}`);
        finish();
      });
      csv.write(rest);
    };
    /** Splits the complete lines of `text`; answers what is left after the last line break. */
    const readLines = (text: string): string => {
      let start = 0;
      for (let nl = text.indexOf('\n'); nl >= 0 && !settled; nl = text.indexOf('\n', start)) {
        const end = nl > start && text.charCodeAt(nl - 1) === 13 ? nl - 1 : nl;
        const line = text.slice(start, end);
        if (line.includes('"') || line.includes('\r')) {
          handOver(text.slice(start));
          return '';
        }
        start = nl + 1;
        const hash = line.indexOf('#');
        const content = hash < 0 ? line : line.slice(0, hash);
        if (content !== '') onRecord(content.split(','));
      }
      return text.slice(start);
    };
    function onData(chunk: Buffer) {
      let text = decoder.write(chunk);
      if (parser) {
        // csv-parse is slower than the bytes come: hold the input back while it catches up.
        if (!parser.write(text)) {
          input.pause();
          parser.once('drain', () => input.resume());
        }
        return;
      }
      if (first && text !== '') {
        first = false;
        if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
      }
      pending = readLines(pending + text);
      // No line break for a long while: lines ended by CR alone, or one huge line. csv-parse reads those.
      if (!settled && (pending.includes('\r') || pending.length > MAX_PLAIN_LINE)) {
        handOver(pending);
        pending = '';
      }
    }
    function onEnd() {
      const last = decoder.end();
      if (parser) {
        parser.end(last);
        return;
      }
      // The last line may have no line break after it.
      const rest = readLines(pending + last + '\n');
      if (parser) (parser as Parser).end(rest);
      else if (!settled) atEnd();
    }
    input.on('data', onData);
    input.on('end', onEnd);
    input.on('error', finish);
  });
}

// csv-parse's own messages ("Invalid Opening Quote: a quote is found on field 0 at line 4") are
// for programmers; the user reads what is wrong with the line in words (the row is named beside).
const CSV_PROBLEMS: Readonly<Record<string, string>> = {
  INVALID_OPENING_QUOTE: 'a quote mark stands inside a value that did not start with one',
  CSV_INVALID_CLOSING_QUOTE: 'a quoted value has more text after its closing quote mark',
  CSV_QUOTE_NOT_CLOSED: 'a quoted value is never closed (a quote mark is missing)',
  CSV_NON_TRIMABLE_CHAR_AFTER_CLOSING_QUOTE: 'a quoted value has more text after its closing quote mark',
  CSV_RECORD_INCONSISTENT_COLUMNS: 'it has a different number of values than the header',
  CSV_MAX_RECORD_SIZE: 'the line is far longer than an ephemeris row',
  CSV_RECORD_INCONSISTENT_FIELDS_LENGTH: 'it has a different number of values than the header',
};

function csvProblemWords(code: string): string {
  return CSV_PROBLEMS[code] ?? 'its quoting or separators are not those of a CSV file';
}

function readRow(row: number, cells: string[], header: Header, checker: EphemerisChecker, epochMs: number | null): void {
  const expected = header.names.length;
  if (cells.length !== expected) {
    const which = cells.length < expected
      ? `missing column: ${header.names.slice(cells.length).join(', ')} (expected ${expected} values, found ${cells.length})`
      : `extra column: expected ${expected} values (${header.names.join(', ')}), found ${cells.length}`;
    checker.problem(row, cells.length < expected ? header.names[cells.length] : undefined, cells.length > expected ? cells.slice(expected).join(',') : undefined, which);
    return;
  }
  // Column positions are looked up once per file (columnsOf), not per row: a million rows add up.
  const c = header.columns ?? (header.columns = columnsOf(header));
  const names = header.names;
  let tMs: number | null;
  const epochText = cells[c.epoch];
  if (c.byEpoch) {
    // The untrimmed cell first: nearly every file writes its epochs without spaces around them.
    tMs = parseEpochMs(epochText) ?? (epochText.trim() === epochText ? null : parseEpochMs(epochText.trim()));
    if (tMs === null) checker.problem(row, names[c.epoch], epochText, 'not an ISO 8601 UTC epoch like 2027-03-20T12:00:00Z');
  } else {
    const seconds = checker.number(row, names[c.epoch], epochText);
    tMs = seconds === null || epochMs === null ? null : epochMs + seconds * 1000;
  }
  const x = checker.number(row, names[c.x], cells[c.x]);
  const y = checker.number(row, names[c.y], cells[c.y]);
  const z = checker.number(row, names[c.z], cells[c.z]);
  const hasV = c.vx >= 0;
  const vx = hasV ? checker.number(row, names[c.vx], cells[c.vx]) : null;
  const vy = hasV ? checker.number(row, names[c.vy], cells[c.vy]) : null;
  const vz = hasV ? checker.number(row, names[c.vz], cells[c.vz]) : null;
  checker.point(row, names[c.epoch], epochText, tMs, x, y, z, hasV, vx, vy, vz);
}

function columnsOf(header: Header): Columns {
  const at = (f: Field) => header.index.get(f) ?? -1;
  const byEpoch = header.index.has('epoch');
  return { byEpoch, epoch: byEpoch ? at('epoch') : at('t'), x: at('x'), y: at('y'), z: at('z'), vx: at('vx'), vy: at('vy'), vz: at('vz') };
}
