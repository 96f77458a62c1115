// The hand-written line reader of csv-ephemeris.ts against csv-parse itself: every text is read
// twice, once as it is (plain lines split by hand until a quote or a bare CR hands over) and once
// behind a first comment line holding a quote, which hands the whole file to csv-parse at once; the
// checker must be told exactly the same rows, values and problems either way, however the bytes
// are cut into chunks. csv-parse with csvParseOptions is the reference (common practice, no source).
import { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { readCsvEphemeris } from './csv-ephemeris';
import type { EphemerisChecker } from './ephemeris-checker';

/** A checker that writes down what it is told. */
function recordingChecker(): { checker: EphemerisChecker; calls: unknown[] } {
  const calls: unknown[] = [];
  const fake = {
    problems: [] as unknown[],
    get full() {
      return fake.problems.length >= 20;
    },
    get clean() {
      return fake.problems.length === 0;
    },
    problem(row: number, column: string | undefined, value: string | undefined, message: string) {
      fake.problems.push(row);
      calls.push(['problem', row, column, value, message]);
    },
    number(row: number, column: string, text: string) {
      const value = Number(text.trim());
      if (text.trim() === '' || !Number.isFinite(value)) {
        fake.problem(row, column, text, 'not a number');
        return null;
      }
      return value;
    },
    point(row: number, column: string, epochText: string, tMs: number | null, ...values: unknown[]) {
      calls.push(['point', row, column, epochText, tMs, ...values]);
    },
  };
  return { checker: fake as unknown as EphemerisChecker, calls };
}

async function read(bytes: Buffer, chunk: number): Promise<unknown[]> {
  const pieces: Buffer[] = [];
  for (let at = 0; at < bytes.length; at += chunk) pieces.push(bytes.subarray(at, at + chunk));
  const { checker, calls } = recordingChecker();
  await readCsvEphemeris(Readable.from(pieces), checker, Date.parse('2027-03-20T12:00:00Z'));
  return calls;
}

const row = (i: number) => `2027-03-20T12:00:${String(i % 60).padStart(2, '0')}.000Z,${6878 + i / 7},${-i * 1.5e-3},0.125`;
const plain = ['epoch,x,y,z', ...Array.from({ length: 40 }, (_, i) => row(i))];

const samples: [string, string][] = [
  ['plain LF with a final line break', plain.join('\n') + '\n'],
  ['plain LF without a final line break', plain.join('\n')],
  ['CRLF', plain.join('\r\n') + '\r\n'],
  ['a BOM, comments, empty lines', '\ufeff# made by hand\n' + plain.slice(0, 5).join('\n') + '\n\n# more\n' + plain.slice(5).join('\n') + ' # trailing comment\n'],
  ['x_km units in the header and velocities', 'epoch,x_km,y (km),z [km],vx,vy,vz\n2027-03-20T12:00:00Z,6878,0,0,0,7.6,0\n2027-03-20T12:00:10Z,6877.9,76,0,-0.08,7.6,0\n'],
  ['a quoted field half way down', plain.slice(0, 20).join('\n') + '\n"2027-03-20T12:00:30.000Z",6878.5,"1.5",0\n' + plain.slice(20).join('\n') + '\n'],
  ['a stray quote that csv-parse cannot read past', plain.slice(0, 30).join('\n') + '\n2027-03-20T12:00:30Z,68"78,0,0\n' + plain.slice(30).join('\n') + '\n'],
  ['lines ended by CR alone', plain.join('\r') + '\r'],
  ['missing and extra columns, bad numbers', plain.slice(0, 3).join('\n') + '\n2027-03-20T12:01:00Z,1,2\n2027-03-20T12:01:10Z,1,2,3,4\n2027-03-20T12:01:20Z,abc,2,3\n'],
  ['semicolons', 'epoch;x;y;z\n2027-03-20T12:00:00Z;1;2;3\n'],
  ['non-ASCII text in a cell', plain.slice(0, 4).join('\n') + '\n2027-03-20T12:01:00Z,6878,Süd☀,0\n' + plain.slice(4).join('\n') + '\n'],
  ['t seconds instead of epochs', 't,x,y,z\n0,6878,0,0\n10,6877.9,76,0\n20,6877.6,152,0\n'],
  ['empty', ''],
];

describe('readCsvEphemeris: the plain-line reader tells the checker what csv-parse would', () => {
  for (const [name, text] of samples) {
    it(name, async () => {
      // The quoted comment goes after a BOM (csv-parse drops a BOM only at the very start) and ends
      // as the file's lines end (csv-parse takes the line ending from the first line).
      const ending = text.includes('\r\n') ? '\r\n' : text.includes('\r') ? '\r' : '\n';
      const bom = text.startsWith('\ufeff') ? '\ufeff' : '';
      const reference = (await read(Buffer.from(`${bom}# "${ending}${text.slice(bom.length)}`), 1 << 20))
        // csv-parse's own messages count that extra line
        .map((call) => (call as unknown[]).map((v) => (typeof v === 'string' ? v.replace(/at line (\d+)/, (_, n: string) => `at line ${Number(n) - 1}`) : v)));
      expect(reference.length).toBeGreaterThan(0);
      // whole, in odd-sized chunks that cut CRLFs and multi-byte characters, and a byte at a time
      for (const chunk of [1 << 20, 7, 1]) expect(await read(Buffer.from(text), chunk), `${name}, chunks of ${chunk}`).toEqual(reference);
    });
  }
});
