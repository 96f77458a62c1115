// Sends a large answer that a route writes piece by piece (per-step JSON, columnar JSON, an Arrow
// stream), compressed here rather than by the compression middleware, so the effort can follow
// the answer's size and the compressing can run beside the writing:
// - brotli when the request accepts it, else gzip, else none (answers under 1 kB go as they are);
// - the effort by size: from 1 MB the fastest settings (brotli quality 1, gzip level 1: on the
//   8.4 MB compute answer brotli 1 writes 1.1 MB in ~27 ms where quality 4 takes ~125 ms for 1.0 MB),
//   smaller answers a middle setting (brotli 4, gzip 4), which costs a millisecond or two there;
// - the compressor works in libuv's thread pool on one piece while the route formats the next (one
//   piece ahead, so memory stays at about two pieces), with an output buffer large enough that a
//   piece is compressed in one go instead of returning to the busy main thread every 16 kB;
// - uncompressed, a batch of pieces goes to the socket corked (one writev, no joined copy);
// - the bytes go out without Express's res.send, which hashes the whole body for an ETag (a sha1 of
//   8 MB for the compute answer) that a POST answer never uses.
import type { Writable } from 'node:stream';
import { setImmediate as yieldToOthers } from 'node:timers/promises';
import { constants, createBrotliCompress, createGzip } from 'node:zlib';
import type { Request, Response } from 'express';

/** Under this many bytes an answer goes uncompressed (as the compression middleware's threshold). */
const SMALL = 1024;
/** From this many bytes the fastest settings. */
const LARGE = 1_000_000;
const CHUNK = 256 * 1024;

type Encoding = 'br' | 'gzip' | 'identity';

/** The weight Accept-Encoding gives a coding (its own entry, else "*"; identity is acceptable unless refused). */
function weight(header: string, coding: string): number {
  let named: number | null = null;
  let any: number | null = null;
  for (const entry of header.split(',')) {
    const [name = '', ...params] = entry.trim().toLowerCase().split(';');
    const q = params.map((p) => /^\s*q=([\d.]+)\s*$/.exec(p)?.[1]).find((v) => v !== undefined);
    const value = q === undefined ? 1 : Number(q);
    if (name.trim() === coding) named = value;
    else if (name.trim() === '*') any = value;
  }
  return named ?? any ?? (coding === 'identity' ? 1 : 0);
}

/** The coding of highest weight; at equal weight brotli, then gzip (browsers list gzip first). */
function chooseEncoding(req: Request): Encoding {
  const header = req.headers['accept-encoding'];
  if (typeof header !== 'string') return 'identity';
  const ranked = (['br', 'gzip'] as const).map((coding) => ({ coding, q: weight(header, coding) }));
  const best = ranked.reduce((a, b) => (b.q > a.q ? b : a));
  return best.q > 0 && best.q >= weight(header, 'identity') ? best.coding : 'identity';
}

function compressor(encoding: 'br' | 'gzip', sizeHint: number): Writable & NodeJS.ReadableStream {
  const large = sizeHint >= LARGE;
  return encoding === 'br'
    ? createBrotliCompress({ chunkSize: CHUNK, params: { [constants.BROTLI_PARAM_QUALITY]: large ? 1 : 4, [constants.BROTLI_PARAM_SIZE_HINT]: sizeHint } })
    : createGzip({ chunkSize: CHUNK, level: large ? 1 : 4 });
}

// One 'drain' and one 'close' listener per sink for its whole life, however often it is awaited:
// the compression middleware moves a response's 'drain' listeners onto its own stream, where
// removing them from the response does not reach, so adding and removing one per wait leaked.
const waiters = new WeakMap<Writable, Set<() => void>>();

/** Resolves when the sink takes more (its 'drain'), or the client is gone (the answer's 'close'). */
export function drained(sink: Writable, res: Response): Promise<void> {
  let pending = waiters.get(sink);
  if (!pending) {
    const set = new Set<() => void>();
    const wake = () => {
      const now = [...set];
      set.clear();
      for (const resolve of now) resolve();
    };
    sink.on('drain', wake);
    res.on('close', wake);
    if (sink !== res) sink.on('close', wake);
    waiters.set(sink, set);
    pending = set;
  }
  if (res.destroyed || res.writableFinished) return Promise.resolve();
  const set = pending;
  return new Promise((resolve) => set.add(resolve));
}

/** Marks the answer as compressed here, for the compression middleware's filter to leave alone. */
export const answerCompressedHere = (res: Response): boolean => res.locals['compressedHere'] === true;

export interface AnswerBytes {
  /** The media type (Content-Type). */
  type: string;
  /** The bytes in pieces; a generator may format each piece as it is asked for. */
  pieces: Iterable<Uint8Array>;
  /** The exact length when known (sent as Content-Length uncompressed), else an estimate. */
  byteLength: number;
  exact: boolean;
}

/** Sends the pieces as the answer's body (the status is the caller's), compressed as the request accepts. */
/** The pieces in batches of at least CHUNK bytes (the last may be less), empty ones left out. */
function* batches(pieces: Iterable<Uint8Array>): Generator<Uint8Array[]> {
  let held: Uint8Array[] = [];
  let heldBytes = 0;
  for (const piece of pieces) {
    if (piece.byteLength === 0) continue;
    held.push(piece);
    heldBytes += piece.byteLength;
    if (heldBytes >= CHUNK) {
      yield held;
      held = [];
      heldBytes = 0;
    }
  }
  if (heldBytes > 0) yield held;
}

/**
 * Writes one batch: to the compressor as one buffer (each write is a trip to the thread pool), to
 * the socket corked (one writev, no copy). False when the sink asks to wait for 'drain'.
 */
function writeBatch(sink: Writable, batch: Uint8Array[], compressed: boolean): boolean {
  if (compressed) return sink.write(batch.length === 1 ? batch[0] : Buffer.concat(batch));
  sink.cork();
  for (const piece of batch) sink.write(piece);
  sink.uncork();
  return !sink.writableNeedDrain;
}

/** Sends the pieces as the answer's body (the status is the caller's), compressed as the request accepts. */
export async function sendAnswerBytes(res: Response, body: AnswerBytes): Promise<void> {
  // The first piece before any header: an error formatting it still becomes a normal error answer.
  const pieces = batches(body.pieces);
  let next = pieces.next();
  const encoding = body.byteLength < SMALL ? 'identity' : chooseEncoding(res.req);
  res.locals['compressedHere'] = true;
  res.type(body.type);
  res.vary('Accept-Encoding');
  let sink: Writable = res;
  if (encoding === 'identity') {
    if (body.exact) res.set('Content-Length', String(body.byteLength));
  } else {
    res.set('Content-Encoding', encoding);
    res.removeHeader('Content-Length');
    const zipped = compressor(encoding, body.byteLength);
    zipped.pipe(res);
    res.on('close', () => zipped.destroy());
    sink = zipped;
  }
  let gone = false;
  res.on('close', () => (gone = true));
  let sinceYield = 0;
  try {
    while (!next.done) {
      const batch = next.value;
      const waiting = writeBatch(sink, batch, sink !== res) ? null : drained(sink, res);
      sinceYield += batch.reduce((sum, piece) => sum + piece.byteLength, 0);
      // The iterator formats the next pieces while these are compressed or sent.
      next = pieces.next();
      if (waiting) {
        await waiting;
        sinceYield = 0;
      } else if (sinceYield >= CHUNK) {
        // Let other requests in between large pieces even when nothing pushes back.
        sinceYield = 0;
        await yieldToOthers();
      }
      if (gone) return;
    }
  } catch (error) {
    // Bytes may be out already: no error answer can follow, the client sees a cut answer.
    res.destroy(error as Error);
    return;
  }
  sink.end();
}
