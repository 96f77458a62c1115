// How an ephemeris' points are stored: in blocks of BLOCK_POINTS consecutive points, each block
// one row of ephemeris_point_blocks whose `data` is POINT_FIELDS IEEE 754 doubles per point,
// little-endian, in the order t (ms since 1970 UTC), x, y, z (km), vx, vy, vz (km/s; NaN when the
// file gave no velocities). One row per 4,096 points rather than per point: a million-point
// ephemeris is 245 statements and about 56 MB instead of a million rows and about 150 MB, and
// reading it back is a copy per block. The point spool uses the same layout in memory.
import { endianness } from 'node:os';

/** t, x, y, z, vx, vy, vz. */
export const POINT_FIELDS = 7;
export const BLOCK_POINTS = 4096;
const BYTES_PER_POINT = POINT_FIELDS * 8;
const nativeLittleEndian = endianness() === 'LE';

/**
 * The first `points` points of `values` as a block's bytes: on little-endian machines a view of
 * `values` itself, not a copy (SQLite copies a blob when it is bound, so a reused array may be
 * refilled after the statement has run; copies would pile up as garbage outside the JS heap).
 */
export function packPoints(values: Float64Array, points: number): Buffer {
  const count = points * POINT_FIELDS;
  if (nativeLittleEndian) return Buffer.from(values.buffer, values.byteOffset, count * 8);
  const out = Buffer.alloc(count * 8);
  for (let k = 0; k < count; k++) out.writeDoubleLE(values[k], k * 8);
  return out;
}

/** A block's bytes as doubles (POINT_FIELDS per point); a corrupt length is an error. */
export function unpackBlock(data: Uint8Array): Float64Array {
  if (data.length % BYTES_PER_POINT !== 0) throw new Error(`an ephemeris point block of ${data.length} bytes is not a whole number of points`);
  const values = new Float64Array(data.length / 8);
  if (nativeLittleEndian) {
    // Copied, not viewed: SQLite's buffer need not be aligned for doubles.
    new Uint8Array(values.buffer).set(data);
  } else {
    const view = new DataView(data.buffer, data.byteOffset, data.length);
    for (let k = 0; k < values.length; k++) values[k] = view.getFloat64(k * 8, true);
  }
  return values;
}

/**
 * `eclipta_pack_points(t, x, y, z, vx, vy, vz ORDER BY seq)`: an SQL aggregate making a block from
 * point rows (NULL velocities become NaN), for migrations that move points into blocks. Every
 * connection registers it before migrating.
 */
export const packPointsAggregate = {
  varargs: true,
  start: (): number[] => [],
  step: (acc: number[], ...cells: unknown[]): number[] => {
    if (cells.length !== POINT_FIELDS) throw new Error(`eclipta_pack_points takes ${POINT_FIELDS} values a point, not ${cells.length}`);
    for (const cell of cells) acc.push(typeof cell === 'number' ? cell : NaN);
    return acc;
  },
  result: (acc: number[]): Buffer => packPoints(Float64Array.from(acc), acc.length / POINT_FIELDS),
};
