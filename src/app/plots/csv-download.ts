// CSV files for plot data and tables, written to RFC 4180 (section 2) so spreadsheets and
// propagator-side scripts read them the same way: CRLF line ends, a header row, fields quoted
// when they hold a comma, a double quote or a line break, and quotes inside doubled. Cells go
// through the one writer every Eclipta CSV uses (shared/csv/csv-cell.ts), which also keeps text
// that starts like a formula (= + - @) from being evaluated by a spreadsheet.
import { csvRecord, type CsvCell } from '../../../shared/csv/csv-cell';

export interface CsvColumn {
  readonly header: string;
  /** Written into the header as "Time (min)" so the unit travels with the numbers. */
  readonly unit?: string;
  readonly values: readonly CsvCell[];
}

export function csvHeader(column: CsvColumn): string {
  return column.unit ? `${column.header} (${column.unit})` : column.header;
}

/** The whole file; columns of unequal length are padded with empty fields. */
export function buildCsv(columns: readonly CsvColumn[]): string {
  const rowCount = Math.max(0, ...columns.map((c) => c.values.length));
  let csv = csvRecord(columns.map(csvHeader));
  for (let r = 0; r < rowCount; r++) csv += csvRecord(columns.map((c) => c.values[r]));
  return csv;
}

/**
 * Saves `csv` as a file through a Blob and a temporary object URL. The byte-order mark is there
 * because spreadsheet programs otherwise read UTF-8 units such as "W/m²" and "°C" as another code page.
 */
export function downloadCsv(fileName: string, csv: string, doc: Document = document): void {
  const blob = new Blob(['\uFEFF', csv], { type: 'text/csv;charset=utf-8' });
  const url = URL.createObjectURL(blob);
  const link = doc.createElement('a');
  link.href = url;
  link.download = fileName.endsWith('.csv') ? fileName : `${fileName}.csv`;
  link.style.display = 'none';
  doc.body.appendChild(link);
  link.click();
  link.remove();
  // Revoked on the next task: some browsers start reading the URL only after click() returns.
  setTimeout(() => URL.revokeObjectURL(url), 0);
}
