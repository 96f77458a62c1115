// The CSV cell writer against OWASP's "CSV Injection" guidance (owasp.org/www-community/attacks/CSV_Injection):
// cells that begin with = + - @, tab (0x09) or carriage return (0x0D) are prefixed with a single
// quote so spreadsheets read them as text; quoting per RFC 4180 section 2.
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { csvField, csvRecord } from './csv-cell';

describe('csvField against formula injection (OWASP CSV Injection)', () => {
  it('prefixes text that starts with = + - @ tab or CR with a single quote', () => {
    expect(csvField('=HYPERLINK("http://evil.test","open")')).toBe(`"'=HYPERLINK(""http://evil.test"",""open"")"`);
    expect(csvField("+cmd|' /C calc'!A0")).toBe("'+cmd|' /C calc'!A0");
    expect(csvField('-2+3+cmd|x!A0')).toBe("'-2+3+cmd|x!A0");
    expect(csvField('@SUM(1+1)*cmd|x!A0')).toBe("'@SUM(1+1)*cmd|x!A0");
    expect(csvField('\t=1+1')).toBe("'\t=1+1");
    expect(csvField('\r=1+1')).toBe(`"'\r=1+1"`);
  });

  it('leaves numbers as numbers: negative ones are not prefixed, non-finite ones are empty', () => {
    expect(csvField(-12.5)).toBe('-12.5');
    expect(csvField(-0.001)).toBe('-0.001');
    expect(csvField(1e-7)).toBe('1e-7');
    expect(csvField(Number.NaN)).toBe('');
    expect(csvField(Number.NEGATIVE_INFINITY)).toBe('');
  });

  it('leaves ordinary text alone, even with the characters inside it', () => {
    expect(csvField('Panel +X')).toBe('Panel +X');
    expect(csvField('2027-03-20')).toBe('2027-03-20');
    expect(csvField('a=b')).toBe('a=b');
  });

  it('quotes a semicolon too, so a reader that splits on it cannot start a formula cell (RFC 4180 quoting: src/app/plots/csv-download.spec.ts)', () => {
    expect(csvField('a;=1+1')).toBe('"a;=1+1"');
  });

  it('round-trips through csv-parse: what a reader gets is the text behind one quote, and the numbers', () => {
    const cells = ['=1+1', '-cmd', 'plain', -3.5, null];
    const [row] = parse(csvRecord(cells)) as string[][];
    expect(row).toEqual(["'=1+1", "'-cmd", 'plain', '-3.5', '']);
  });
});
