// The Arrow IPC stream written straight from the answer's columns (server/http/arrow-stream.ts):
// the same bytes as apache-arrow's own writer (tableToIPC) for the same table, and read back by
// apache-arrow's reader (the one pandas and polars share the format with) into the same numbers,
// texts, missing values and metadata. Checked against the Arrow columnar format spec's framing
// ("Encapsulated message format", "IPC streaming format"): each message starts 0xFFFFFFFF and its
// padded header length, bodies start on 8-byte boundaries, the stream ends 0xFFFFFFFF 0x00000000.
import { Float64, Schema, Table, Utf8, makeVector, tableFromIPC, tableToIPC, vectorFromArray } from 'apache-arrow';
import { describe, expect, it } from 'vitest';
import { arrowStream } from '../../server/http/arrow-stream';

const joined = (pieces: Uint8Array[]): Buffer => Buffer.concat(pieces);

describe('arrowStream', () => {
  const rows = 1000;
  const tS = Float64Array.from({ length: rows }, (_, k) => k * 5.7);
  const absorbed = Float64Array.from({ length: rows }, (_, k) => (k % 7 === 0 ? 0 : Math.sin(k) * 123.456789012345));
  const epochs = Array.from({ length: rows }, (_, k) => (k === 3 ? null : new Date(Date.UTC(2027, 0, 1) + k * 60_000).toISOString()));
  const withGaps = Array.from({ length: rows }, (_, k) => (k % 10 === 0 ? null : k / 3));
  const columns = new Map<string, Float64Array | unknown[]>([['tS', tS], ['nadir.absorbedW', absorbed], ['epoch', epochs], ['altitudeKm', withGaps]]);
  const metadata = new Map([['bodyId', 'earth'], ['periodS', '5739.2']]);

  it('writes the bytes apache-arrow\'s own stream writer writes for the same table', () => {
    const vectors = {
      tS: makeVector(tS), 'nadir.absorbedW': makeVector(absorbed),
      epoch: vectorFromArray(epochs, new Utf8()), altitudeKm: vectorFromArray(withGaps, new Float64()),
    };
    const built = new Table(vectors);
    const theirs = tableToIPC(new Table(new Schema(built.schema.fields, metadata), built.batches.map((b) => b)), 'stream');
    const ours = arrowStream(columns, metadata, rows);
    expect(ours.byteLength).toBe(joined(ours.pieces).length);
    expect(joined(ours.pieces).equals(Buffer.from(theirs))).toBe(true);
  });

  it('reads back into the same numbers, texts, missing values and metadata', () => {
    const table = tableFromIPC(joined(arrowStream(columns, metadata, rows).pieces));
    expect(table.numRows).toBe(rows);
    expect(table.schema.fields.map((f) => f.name)).toEqual(['tS', 'nadir.absorbedW', 'epoch', 'altitudeKm']);
    expect(table.getChild('tS')!.toArray()).toEqual(tS);
    expect(table.getChild('nadir.absorbedW')!.toArray()).toEqual(absorbed);
    expect(table.getChild('epoch')!.toArray()).toEqual(epochs);
    expect([...table.getChild('altitudeKm')!]).toEqual(withGaps);
    expect(table.schema.metadata.get('periodS')).toBe('5739.2');
  });

  it('frames the stream as the spec says', () => {
    const bytes = joined(arrowStream(columns, metadata, rows).pieces);
    let at = 0;
    const lengths: number[] = [];
    for (;;) {
      expect(bytes.readInt32LE(at)).toBe(-1);
      const headerLength = bytes.readInt32LE(at + 4);
      if (headerLength === 0) break;
      expect((at + 8 + headerLength) % 8).toBe(0);
      lengths.push(headerLength);
      at += 8 + headerLength;
      // The schema message has no body; the record batch's body follows its header.
      if (lengths.length === 2) at = bytes.length - 8;
    }
    expect(at).toBe(bytes.length - 8);
    expect(lengths).toHaveLength(2);
  });

  it('refuses a column whose length is not the table\'s', () => {
    expect(() => arrowStream(new Map([['tS', new Float64Array(3)]]), new Map(), 4)).toThrow(/tS/);
  });
});
