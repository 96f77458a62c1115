// The JSON of a large answer written in pieces (server/json-stream.ts) is JSON.stringify's text of
// the same value with each Float64Array as a plain array: key order, undefined members left out,
// null for undefined array entries and for NaN, toJSON (dates) honoured, non-ASCII names whole
// across piece boundaries (common practice, no source: the reference is JSON.stringify itself).
import { describe, expect, it } from 'vitest';
import { jsonPieces } from '../../server/json-stream';

const text = (value: unknown): string => Buffer.concat([...jsonPieces(value)]).toString('utf8');
const plain = (value: unknown): unknown =>
  JSON.parse(JSON.stringify(value, (_k, v: unknown) => (v instanceof Float64Array ? Array.from(v) : v)));

describe('jsonPieces', () => {
  const steps = 40_000;
  const column = Float64Array.from({ length: steps }, (_, k) => (k === 5 ? NaN : Math.cos(k) * 1e3 / 7));
  const value = {
    bodyId: 'earth',
    skipped: undefined,
    at: new Date(Date.UTC(2027, 2, 20, 12)),
    profile: {
      tS: column,
      surfaces: [{ name: 'Sonnensegel "süd" ☀', solarWm2: column, note: undefined }, { name: 'nadir', solarWm2: column.map((v) => -v) }],
    },
    points: Array.from({ length: 1200 }, (_, k) => ({ k, name: `π ${k}`, gone: undefined })),
    list: [1, undefined, 'two'],
  };

  it('writes JSON.stringify\'s text, a Float64Array as its plain array, in several pieces', () => {
    const pieces = [...jsonPieces(value)];
    expect(pieces.length).toBeGreaterThan(2);
    const expected = JSON.stringify(value, (_k, v: unknown) => (v instanceof Float64Array ? Array.from(v) : v));
    expect(text(value)).toBe(expected);
    expect(JSON.parse(text(value))).toEqual(plain(value));
  });

  it('writes a value without long arrays as one piece of JSON.stringify\'s text', () => {
    const small = { a: [1, 2, 3], b: { c: 'd' } };
    expect([...jsonPieces(small)]).toHaveLength(1);
    expect(text(small)).toBe(JSON.stringify(small));
  });
});
