// One route of the API as the OpenAPI document describes it. Each feature lists its routes in a file
// of its own (<feature>-api-routes.ts) with the zod schemas of shared/api/; openapi-document.ts
// turns the lists into OpenAPI 3, and a test checks that every route the app answers is listed.
import type { ZodObject, ZodType } from 'zod';

export type ApiMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface ApiRoute {
  method: ApiMethod;
  /** The full path as Express has it, e.g. "/api/v1/cases/:id". */
  path: string;
  summary: string;
  tag: string;
  /** Answered without credentials (health, sign-in, password reset, invitation links). */
  public?: boolean;
  body?: ZodType;
  /** multipart/form-data uploads describe their text fields with `body` and add a binary `file`. */
  bodyKind?: 'json' | 'multipart';
  query?: ZodObject;
  status?: number;
  /** The answer's schema; absent for 204 and for files described by `produces`. */
  response?: ZodType;
  /** Media type of the answer when it is not JSON (text/csv, application/x-ndjson). */
  produces?: string[];
  /** Per-step results: also answered as columnar JSON (?layout=columns) and as an Apache Arrow stream (API.md "Answer formats"). */
  perStep?: true;
}
