// The API's JSON body parser: express.json with a limit and a nesting-depth check on the received
// text, made before JSON.parse. The parser itself copes with any depth, but everything after it is
// recursive (zod, JSON.stringify in an error message, Array#toString): a body nested thousands of
// levels deep would end in "Maximum call stack size exceeded". Refused here, no later code sees it.
// Errors carry body-parser's `status` and `type`, so server/errors.ts maps them like its own.
import express, { type RequestHandler } from 'express';
import { TextDecoder } from 'node:util';

/** Deeper than any body of the API (a thermal model is 4 levels) by a wide margin. */
export const MAX_JSON_DEPTH = 64;

/** Larger than any body but a thermal model with per-step loads; uploads go through multer, not this. */
export const JSON_LIMIT = '2mb';

const OPEN_BRACE = 0x7b;
const OPEN_BRACKET = 0x5b;
const CLOSE_BRACE = 0x7d;
const CLOSE_BRACKET = 0x5d;
const QUOTE = 0x22;
const BACKSLASH = 0x5c;

/**
 * Whether arrays and objects in JSON text nest deeper than `max` (strings are skipped, escapes
 * included); works whether the text parses or not. UTF-8 bytes are scanned as they are: every byte
 * of a multi-byte character is above 0x7f, so none looks like a bracket or a quote.
 */
export function jsonDepthOver(text: string | Uint8Array, max: number): boolean {
  const codeAt = typeof text === 'string' ? (i: number) => text.charCodeAt(i) : (i: number) => text[i];
  let depth = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = codeAt(i);
    if (inString) {
      if (c === BACKSLASH) i++;
      else if (c === QUOTE) inString = false;
    } else if (c === QUOTE) {
      inString = true;
    } else if (c === OPEN_BRACE || c === OPEN_BRACKET) {
      if (++depth > max) return true;
    } else if (c === CLOSE_BRACE || c === CLOSE_BRACKET) {
      depth--;
    }
  }
  return false;
}

class BodyError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly type: string,
  ) {
    super(message);
  }
}

function bodyText(body: Buffer, encoding: string | null): string | Uint8Array {
  const label = (encoding ?? 'utf-8').toLowerCase();
  if (label === 'utf-8' || label === 'utf8') return body;
  let decoder: TextDecoder;
  try {
    decoder = new TextDecoder(label);
  } catch {
    throw new BodyError(`The charset ${JSON.stringify(label)} is not supported; send UTF-8.`, 415, 'charset.unsupported');
  }
  return decoder.decode(body);
}

export function jsonBody(): RequestHandler {
  return express.json({
    limit: JSON_LIMIT,
    verify: (_req, _res, body, encoding) => {
      if (jsonDepthOver(bodyText(body, encoding), MAX_JSON_DEPTH)) {
        throw new BodyError(`The request body nests arrays and objects more than ${MAX_JSON_DEPTH} levels deep.`, 400, 'entity.too.deep');
      }
    },
  });
}
