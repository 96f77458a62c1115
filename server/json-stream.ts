// Writes a large JSON answer (per-step results) in pieces instead of res.json's one string: the
// text of an answer at the work limit is about 60 MB, and JSON.stringify of it held the event loop
// for most of a second and the process's memory for a copy and its Buffer. Here long arrays are
// written a batch of elements at a time and each piece goes out (compressed as the request
// accepts, http/answer-body.ts) while the next is written, other requests let in between. A
// Float64Array (a column of numbers) is written as the array of its numbers, in one
// JSON.stringify of a plain array (V8's fast path for numbers). The text is the same as
// JSON.stringify's of the value with its Float64Arrays as plain arrays (same key order, undefined
// members left out, toJSON honoured by stringifying such values whole).
import type { Response } from 'express';
import { sendAnswerBytes } from './http/answer-body';

/** Array elements serialised at a time; a batch of profile steps is tens of kilobytes. */
const BATCH = 500;
/** Text is gathered up to this many characters before it becomes a piece. */
const PIECE = 256 * 1024;

const isPlainObject = (v: unknown): v is Record<string, unknown> =>
  v !== null && typeof v === 'object' && !Array.isArray(v) && !ArrayBuffer.isView(v) && typeof (v as { toJSON?: unknown }).toJSON !== 'function';

/** Whether the value holds an array longer than a batch or a Float64Array: only such answers are worth writing in pieces. */
function holdsLongArray(value: unknown, depth = 0): boolean {
  if (depth > 4) return false;
  if (value instanceof Float64Array) return true;
  if (Array.isArray(value)) return value.length > BATCH || value.some((v) => holdsLongArray(v, depth + 1));
  if (!isPlainObject(value)) return false;
  return Object.values(value).some((v) => holdsLongArray(v, depth + 1));
}

/** The JSON text of the value in parts (see the top of the file). */
function* jsonParts(value: unknown, depth = 0): Generator<string> {
  if (value instanceof Float64Array) {
    yield JSON.stringify(Array.from(value));
  } else if (Array.isArray(value) && value.length > BATCH && !holdsLongArray(value[0], depth + 1)) {
    for (let start = 0; start < value.length; start += BATCH) {
      const batch = value.slice(start, start + BATCH).map((item: unknown) => JSON.stringify(item) ?? 'null');
      yield (start === 0 ? '[' : ',') + batch.join(',');
    }
    yield value.length === 0 ? '[]' : ']';
  } else if (Array.isArray(value) && holdsLongArray(value, depth)) {
    yield '[';
    for (const [i, item] of value.entries()) {
      if (i > 0) yield ',';
      if (item === undefined || typeof item === 'function' || typeof item === 'symbol') yield 'null';
      else yield* jsonParts(item, depth + 1);
    }
    yield ']';
  } else if (isPlainObject(value) && holdsLongArray(value, depth)) {
    yield '{';
    let first = true;
    for (const [key, member] of Object.entries(value)) {
      if (member === undefined || typeof member === 'function' || typeof member === 'symbol') continue;
      yield `${first ? '' : ','}${JSON.stringify(key)}:`;
      first = false;
      yield* jsonParts(member, depth + 1);
    }
    yield '}';
  } else {
    yield JSON.stringify(value) ?? 'null';
  }
}

/** The JSON text of the value as UTF-8 pieces of about PIECE characters, each written when asked for. */
export function* jsonPieces(value: unknown): Generator<Uint8Array> {
  let text = '';
  for (const part of jsonParts(value)) {
    text += part;
    if (text.length >= PIECE) {
      yield Buffer.from(text, 'utf8');
      text = '';
    }
  }
  if (text.length > 0) yield Buffer.from(text, 'utf8');
}

/** A rough size of the value's text: each long array as its length times its first element's text. */
function estimatedBytes(value: unknown, depth = 0): number {
  if (value instanceof Float64Array) return value.length * 18;
  if (Array.isArray(value) && value.length > BATCH) return value.length * (JSON.stringify(value[0])?.length ?? 4);
  if (depth > 4 || !(Array.isArray(value) || isPlainObject(value))) return 16;
  return Object.values(value).reduce<number>((sum, v) => sum + estimatedBytes(v, depth + 1), 0);
}

/**
 * Sends `value` as a 200 JSON answer, like res.json, but a piece at a time when it holds long
 * arrays. The pieces are written as they are sent, so an error writing the first one still becomes
 * a normal error answer; a later one cuts the answer (nothing in the value can fail to stringify
 * that did not fail in the first piece, short of a toJSON that throws).
 */
export async function sendJson(res: Response, value: unknown): Promise<void> {
  if (!holdsLongArray(value)) {
    res.json(value);
    return;
  }
  await sendAnswerBytes(res, { type: 'application/json; charset=utf-8', pieces: jsonPieces(value), byteLength: estimatedBytes(value), exact: false });
}
