import { afterEach, describe, expect, it, vi } from 'vitest';
import { parse } from 'csv-parse/browser/esm/sync';
import { csvField } from '../../../shared/csv/csv-cell';
import { buildCsv, csvHeader, downloadCsv } from './csv-download';

describe('CSV quoting (RFC 4180 section 2)', () => {
  it('rule 1: records end with CRLF', () => {
    const csv = buildCsv([{ header: 'a', values: [1, 2] }]);
    expect(csv).toBe('a\r\n1\r\n2\r\n');
  });

  it('rule 3: the header row carries the units', () => {
    const csv = buildCsv([
      { header: 'Time', unit: 'min', values: [0] },
      { header: 'Solar', unit: 'W/m²', values: [1361] },
    ]);
    expect(csv.split('\r\n')[0]).toBe('Time (min),Solar (W/m²)');
    expect(csvHeader({ header: 'Node', values: [] })).toBe('Node');
  });

  it('rule 4: plain fields are not quoted', () => {
    expect(csvField('Radiator panel')).toBe('Radiator panel');
    expect(csvField(-12.5)).toBe('-12.5');
  });

  it('rule 6: fields with a comma, a double quote or a line break are quoted', () => {
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('line1\r\nline2')).toBe('"line1\r\nline2"');
    expect(csvField('line1\nline2')).toBe('"line1\nline2"');
    expect(csvField('cr\ronly')).toBe('"cr\ronly"');
  });

  it('rule 7: a double quote inside is doubled (the RFC example "b""bb")', () => {
    expect(csvField('b"bb')).toBe('"b""bb"');
    expect(csvField('say "hot"')).toBe('"say ""hot"""');
  });

  it('keeps a node or surface named like a formula as text and negative numbers as numbers (OWASP CSV Injection)', () => {
    const csv = buildCsv([{ header: '=HYPERLINK("http://evil.test")', unit: '°C', values: [-12.5, 3] }]);
    expect(csv).toBe(`"'=HYPERLINK(""http://evil.test"") (°C)"\r\n-12.5\r\n3\r\n`);
  });

  it('writes missing values as empty fields and pads short columns', () => {
    const csv = buildCsv([
      { header: 'x', values: [1, 2, 3] },
      { header: 'y', values: [NaN, null] },
    ]);
    expect(csv).toBe('x,y\r\n1,\r\n2,\r\n3,\r\n');
  });

  it('round-trips awkward labels through csv-parse (a reference RFC 4180 reader)', () => {
    const labels = ['Panel +X, sunlit', 'He said "cold"', 'two\r\nlines', 'plain', ''];
    const csv = buildCsv([{ header: 'label', values: labels }]);
    const rows = parse(csv, { record_delimiter: '\r\n' }) as string[][];
    expect(rows.map((r) => r[0])).toEqual(['label', ...labels]);
  });
});

describe('downloadCsv', () => {
  afterEach(() => vi.restoreAllMocks());

  it('saves a UTF-8 Blob (with BOM) through a temporary link and revokes its URL', async () => {
    vi.useFakeTimers();
    let saved: Blob | undefined;
    const create = vi.fn((blob: Blob) => {
      saved = blob;
      return 'blob:eclipta-test';
    });
    const revoke = vi.fn();
    Object.assign(URL, { createObjectURL: create, revokeObjectURL: revoke });
    const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);

    downloadCsv('heat-loads', 'a\r\n1\r\n');
    expect(click).toHaveBeenCalledTimes(1);
    const clicked = click.mock.contexts[0] as HTMLAnchorElement | undefined;

    expect(clicked?.download).toBe('heat-loads.csv');
    expect(clicked?.getAttribute('href')).toBe('blob:eclipta-test');
    expect(document.body.contains(clicked ?? null)).toBe(false);
    expect(saved?.type).toBe('text/csv;charset=utf-8');
    const bytes = new Uint8Array(await (saved as Blob).arrayBuffer());
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    expect(new TextDecoder().decode(bytes.slice(3))).toBe('a\r\n1\r\n');
    expect(revoke).not.toHaveBeenCalled();
    vi.runAllTimers();
    expect(revoke).toHaveBeenCalledWith('blob:eclipta-test');
    vi.useRealTimers();
  });
});
