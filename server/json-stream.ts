// Writes a large JSON answer (per-step results) in pieces instead of res.json's one string: the
// text of an answer at the work limit is about 60 MB, and JSON.stringify of it held the event loop
// for most of a second and the process's memory for a copy and its Buffer. Here long arrays are
// written a batch of elements at a time, waiting for the socket to drain and letting other requests
// in between batches. The text is the same as JSON.stringify's (same key order, undefined members
// left out, toJSON honoured by stringifying such values whole).
import { setImmediate as yieldToOthers } from 'node:timers/promises';
import type { Response } from 'express';

/** Array elements serialised at a time; a batch of profile steps is tens of kilobytes. */
const BATCH = 500;
/** Pieces are gathered up to this many characters before a write. */
const FLUSH_AT = 64 * 1024;

const isPlainObject = (v: unknown): v is Record<string, unknown> =>
  v !== null && typeof v === 'object' && !Array.isArray(v) && typeof (v as { toJSON?: unknown }).toJSON !== 'function';

/** Whether the value holds an array longer than a batch: only such answers are worth streaming. */
function holdsLongArray(value: unknown, depth = 0): boolean {
  if (depth > 4) return false;
  if (Array.isArray(value)) return value.length > BATCH;
  if (!isPlainObject(value)) return false;
  return Object.values(value).some((v) => holdsLongArray(v, depth + 1));
}

class Writer {
  private pending = '';
  private closed = false;

  constructor(private readonly res: Response) {
    res.on('close', () => (this.closed = true));
  }

  get gone(): boolean {
    return this.closed;
  }

  push(text: string): void {
    this.pending += text;
  }

  /** Writes what was gathered once it is long enough (or always, with `force`), then lets others run. */
  async flush(force = false): Promise<void> {
    if (this.closed || (!force && this.pending.length < FLUSH_AT)) return;
    const text = this.pending;
    this.pending = '';
    if (!this.res.write(text)) {
      await new Promise<void>((resolve) => {
        const done = () => {
          this.res.off('drain', done);
          this.res.off('close', done);
          resolve();
        };
        this.res.on('drain', done);
        this.res.on('close', done);
      });
    } else {
      await yieldToOthers();
    }
  }
}

async function writeValue(w: Writer, value: unknown): Promise<void> {
  if (w.gone) return;
  if (Array.isArray(value) && value.length > BATCH) {
    w.push('[');
    for (let start = 0; start < value.length && !w.gone; start += BATCH) {
      const batch = value.slice(start, start + BATCH).map((item: unknown) => JSON.stringify(item) ?? 'null');
      w.push((start > 0 ? ',' : '') + batch.join(','));
      await w.flush();
    }
    w.push(']');
    return;
  }
  if (isPlainObject(value) && holdsLongArray(value)) {
    w.push('{');
    let first = true;
    for (const [key, member] of Object.entries(value)) {
      if (member === undefined || typeof member === 'function' || typeof member === 'symbol') continue;
      w.push(`${first ? '' : ','}${JSON.stringify(key)}:`);
      first = false;
      await writeValue(w, member);
    }
    w.push('}');
    return;
  }
  w.push(JSON.stringify(value) ?? 'null');
}

/**
 * Sends `value` as a 200 JSON answer, like res.json, but a piece at a time when it holds long
 * arrays. The value is complete before the first byte goes out, so an error still becomes a
 * normal error answer; only the writing is spread out.
 */
export async function sendJson(res: Response, value: unknown): Promise<void> {
  if (!holdsLongArray(value)) {
    res.json(value);
    return;
  }
  res.status(200).type('application/json');
  const w = new Writer(res);
  await writeValue(w, value);
  await w.flush(true);
  if (!w.gone) res.end();
}
