// The one error type of the API and the middleware that turns every failure into API.md's shape:
// {"error": {"code", "message", "details"?}}. No stack trace ever reaches a client.
import type { ErrorRequestHandler, Request, RequestHandler } from 'express';
import { ZodError, type ZodType, type z } from 'zod';
import type { ErrorBody, ErrorDetail } from '../shared/api/errors';
import { PhysicsError } from '../shared/physics/physics-error';
import type { Logger } from './logger';

export class ApiError extends Error {
  override name = 'ApiError';
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: ErrorDetail[],
    /** Extra headers for the answer, e.g. Retry-After on a 429. */
    readonly headers?: Record<string, string>,
  ) {
    super(message);
  }

  toBody(): ErrorBody {
    return { error: { code: this.code, message: this.message, ...(this.details ? { details: this.details } : {}) } };
  }
}

export const badRequest = (message: string, details?: ErrorDetail[], code = 'invalid_input'): ApiError =>
  new ApiError(400, code, message, details);
export const unauthorized = (message = 'Sign in to continue.', code = 'unauthenticated'): ApiError =>
  new ApiError(401, code, message);
export const forbidden = (message: string, code = 'forbidden'): ApiError => new ApiError(403, code, message);
export const notFound = (message: string, code = 'not_found'): ApiError => new ApiError(404, code, message);
export const conflict = (message: string, code = 'conflict'): ApiError => new ApiError(409, code, message);
export const tooLarge = (message: string): ApiError => new ApiError(413, 'too_large', message);
export const unprocessable = (message: string, details?: ErrorDetail[]): ApiError =>
  new ApiError(422, 'unprocessable', message, details);

// Values of these fields are never repeated back, not even in an error message.
const secretField = /password|secret|token/i;

function describeValue(value: unknown): string {
  if (value === undefined) return 'nothing';
  let shown: string;
  try {
    shown = JSON.stringify(value) ?? String(value);
  } catch {
    // Not serialisable (too deep for the stack, a cycle): say what it is, never String() it, which recurses too.
    shown = Array.isArray(value) ? 'an array' : typeof value === 'object' && value !== null ? 'an object' : typeof value;
  }
  return shown.length > 60 ? shown.slice(0, 57) + '…' : shown;
}

function valueAt(root: unknown, path: readonly PropertyKey[]): unknown {
  let current: unknown = root;
  for (const key of path) {
    if (current === null || typeof current !== 'object') return undefined;
    current = (current as Record<PropertyKey, unknown>)[key];
  }
  return current;
}

/** Turns zod's issues into our details, each naming the field and the value it got. */
export function zodDetails(error: ZodError, input?: unknown): ErrorDetail[] {
  return error.issues.map((issue) => {
    const path = issue.path.map(String).join('.');
    // A refinement's issue carries the object it refined as its input, not the value at the path it
    // names (a cross-field check on a whole model would print the model): look that up in the root,
    // and without the root say nothing rather than the wrong value.
    const refined = issue.code === 'custom';
    const value = !refined && 'input' in issue && issue.input !== undefined ? issue.input : valueAt(input, issue.path);
    let message = issue.message;
    if (issue.code === 'unrecognized_keys') {
      message = `unknown field${issue.keys.length > 1 ? 's' : ''} ${issue.keys.map((k) => JSON.stringify(k)).join(', ')}`;
    } else if (!secretField.test(path) && !(refined && input === undefined)) {
      message = `${message} (got ${describeValue(value)})`;
    }
    return { path: path || undefined, message };
  });
}

function summary(details: ErrorDetail[]): string {
  const first = details[0];
  if (!first) return 'The request is not valid.';
  const lead = first.path ? `${first.path}: ${first.message}` : first.message;
  return details.length > 1 ? `${lead} (and ${details.length - 1} more).` : `${lead}.`;
}

/**
 * Parses a request part with a shared schema, or throws the 400 that names the fields; `at` puts
 * the part's own path in front of them (e.g. "orbit" for "orbit.raanDeg").
 */
export function parse<S extends ZodType>(schema: S, value: unknown, at?: string): z.output<S> {
  const result = schema.safeParse(value, { reportInput: true });
  if (result.success) return result.data;
  const details = zodDetails(result.error, value).map((d) => (at ? { ...d, path: d.path ? `${at}.${d.path}` : at } : d));
  throw badRequest(summary(details), details);
}

/** JSON 404 for an /api path that no router answered. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(notFound(`No API route ${req.method} ${req.originalUrl.split('?')[0]}.`, 'no_route'));
};

interface BodyParserError {
  type?: unknown;
  status?: unknown;
  statusCode?: unknown;
}

/** A 4xx status carried by an error of body-parser, raw-body, zlib under body-parser, or multer's busboy. */
function clientStatus(err: Error): number | null {
  const { status, statusCode } = err as BodyParserError;
  const code = typeof status === 'number' ? status : statusCode;
  return typeof code === 'number' && code >= 400 && code < 500 ? code : null;
}

const encodingOf = (req: Request): string => JSON.stringify(String(req.headers['content-encoding'] ?? 'identity'));

/**
 * Every error of reading a request body as a 4xx: body-parser's by its `type` (every type, even the
 * two it marks 500, stream.encoding.set and stream.not.readable: whatever a client can provoke is
 * answered as the client's), a compressed body that does not decompress (zlib's error, which
 * body-parser marks 400 without a type), and anything else with a 4xx status. Null for an error
 * that is not about the request.
 */
function bodyError(err: unknown, req: Request): ApiError | null {
  if (!(err instanceof Error)) return null;
  const type = (err as BodyParserError).type;
  switch (type) {
    case 'entity.parse.failed':
      return badRequest('The request body is not valid JSON.', undefined, 'invalid_json');
    case 'entity.too.large':
    case 'parameters.too.many':
      return tooLarge('The request body is too large.');
    case 'entity.too.deep':
      return badRequest(err.message, undefined, 'too_deep');
    case 'encoding.unsupported':
      return new ApiError(415, 'unsupported_encoding', `Content-Encoding ${encodingOf(req)} is not supported; send the body as it is, or compressed with gzip, deflate or br.`);
    case 'charset.unsupported':
      return new ApiError(415, 'unsupported_charset', 'The request body must be JSON in UTF-8 (Content-Type: application/json; charset=utf-8).');
    case 'request.aborted':
    case 'request.size.invalid':
      return badRequest('The request body did not arrive whole (it is shorter than its Content-Length).', undefined, 'incomplete_body');
    case 'entity.verify.failed':
    case 'stream.encoding.set':
    case 'stream.not.readable':
      return badRequest('The request body could not be read.', undefined, 'bad_request');
  }
  const status = clientStatus(err);
  if (status === null) return null;
  if (type === undefined && status === 400 && req.headers['content-encoding'] !== undefined) {
    return badRequest(`The request body could not be decompressed as Content-Encoding ${encodingOf(req)} says.`, undefined, 'invalid_encoding');
  }
  return new ApiError(status, 'bad_request', 'The request could not be read.');
}

/** Any failure as API.md's error; null for one that is the server's fault. */
function knownError(err: unknown, req: Request): ApiError | null {
  if (err instanceof ApiError) return err;
  if (err instanceof PhysicsError) {
    // Units that cannot be read and half-given orbit definitions are malformed input (400);
    // everything else the physics refuses is well formed but impossible (422).
    const malformed = err.code === 'invalid_quantity' || err.code === 'invalid_orbit_definition';
    return new ApiError(malformed ? 400 : 422, err.code, err.message, err.details);
  }
  if (err instanceof ZodError) {
    const details = zodDetails(err, req.body);
    return badRequest(summary(details), details);
  }
  return bodyError(err, req);
}

export function errorMiddleware(logger: Logger): ErrorRequestHandler {
  return (err: unknown, req, res, _next) => {
    let apiError = knownError(err, req);
    if (res.headersSent) {
      // The answer has begun (a stream, or the 408 of a stalled body): nothing more can be said, so
      // the connection is closed; a fault of the server is still logged.
      if (!apiError) logger.error('error after the answer began', { method: req.method, path: req.path, error: err instanceof Error ? err : String(err) });
      req.destroy();
      return;
    }
    if (!apiError) {
      logger.error('unhandled error', { method: req.method, path: req.path, error: err instanceof Error ? err : String(err) });
      apiError = new ApiError(500, 'internal', 'Something went wrong on the server. The error was logged.');
    }
    if (apiError.headers) res.set(apiError.headers);
    res.status(apiError.status).json(apiError.toBody());
  };
}
