// A temporary binary file of parsed points: the first pass (parse and check, asynchronous, from a
// stream) writes it, and the insert (one synchronous SQLite transaction) reads it back in chunks.
// This keeps memory flat however long the ephemeris is, without holding a transaction open across
// awaits (which would let other requests' statements fall into it).
// Its records are laid out as the stored blocks are (point-blocks.ts), a block per chunk.
import { closeSync, openSync, readSync, writeSync } from 'node:fs';
import { BLOCK_POINTS, POINT_FIELDS } from './point-blocks';

const CHUNK_POINTS = BLOCK_POINTS;

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

  /**
   * Calls `each` with every chunk of CHUNK_POINTS points in order (the last may hold fewer), read
   * back from the file into one reused array (synchronous).
   */
  forEachChunk(each: (values: Float64Array, points: number) => void): void {
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
      if (points > 0) each(chunk, points);
      if (got < bytes.length) return;
      position += got;
    }
  }

  close(): void {
    if (this.fd !== null) closeSync(this.fd);
    this.fd = null;
  }
}
