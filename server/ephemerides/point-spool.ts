// A temporary binary file of parsed points: the first pass (parse and check, asynchronous, from a
// stream) writes it, and the insert (one synchronous SQLite transaction) reads it back in chunks.
// This keeps memory flat however long the ephemeris is, without holding a transaction open across
// awaits (which would let other requests' statements fall into it).
import { closeSync, openSync, readSync, writeSync } from 'node:fs';

/** t (ms), x, y, z (km), vx, vy, vz (km/s, NaN when absent). */
export const POINT_FIELDS = 7;
const CHUNK_POINTS = 4096;

export class PointSpool {
  private fd: number | null;
  private readonly buffer = new Float64Array(CHUNK_POINTS * POINT_FIELDS);
  private used = 0;
  private count = 0;

  constructor(readonly path: string) {
    this.fd = openSync(path, 'w+', 0o600);
  }

  get points(): number {
    return this.count;
  }

  push(tMs: number, x: number, y: number, z: number, vx: number, vy: number, vz: number): void {
    const b = this.buffer;
    const i = this.used * POINT_FIELDS;
    b[i] = tMs; b[i + 1] = x; b[i + 2] = y; b[i + 3] = z; b[i + 4] = vx; b[i + 5] = vy; b[i + 6] = vz;
    this.used++;
    this.count++;
    if (this.used === CHUNK_POINTS) this.flush();
  }

  private flush(): void {
    if (this.used === 0 || this.fd === null) return;
    const bytes = new Uint8Array(this.buffer.buffer, 0, this.used * POINT_FIELDS * 8);
    let written = 0;
    while (written < bytes.length) written += writeSync(this.fd, bytes, written, bytes.length - written, null);
    this.used = 0;
  }

  /** Calls `each` with every point in order, from the file, a chunk at a time (synchronous). */
  forEach(each: (values: Float64Array, offset: number) => void): void {
    this.flush();
    if (this.fd === null) throw new Error('the point spool is closed');
    const chunk = new Float64Array(CHUNK_POINTS * POINT_FIELDS);
    const bytes = new Uint8Array(chunk.buffer);
    let position = 0;
    for (;;) {
      let got = 0;
      while (got < bytes.length) {
        const n = readSync(this.fd, bytes, got, bytes.length - got, position + got);
        if (n === 0) break;
        got += n;
      }
      const points = Math.floor(got / (POINT_FIELDS * 8));
      for (let k = 0; k < points; k++) each(chunk, k * POINT_FIELDS);
      if (got < bytes.length) return;
      position += got;
    }
  }

  close(): void {
    if (this.fd !== null) closeSync(this.fd);
    this.fd = null;
  }
}
