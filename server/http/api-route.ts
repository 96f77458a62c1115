// One declaration per route: what the route is (method, path, summary, tag), who may call it, its
// zod schemas from shared/api/ and its handler, in one object. The same list registers the route
// in the dispatcher (server/http/route-dispatch.ts) and describes it in the OpenAPI document
// (server/openapi/openapi-document.ts), so a route cannot be answered without being documented.
// Each feature declares its routes in server/routes/<feature>.ts; server/routes/api-routes.ts
// gathers them. Handlers stay thin: parse, call a work function, answer.
import type { Request, Response } from 'express';
import type { z, ZodObject, ZodType } from 'zod';
import type { Role } from '../../shared/api/workspaces';
import type { AppContext } from '../app-context';
import type { RequestAuth } from '../auth/request-auth';

export type ApiMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

/**
 * Who may call a route; the dispatcher refuses everyone else before the handler runs.
 * - 'public': no credentials needed (health, sign-in, password reset, invitation links); a bad API
 *   token is still a 401 and a cross-site change still a 403 (authenticate runs for every route).
 * - 'signed-in': any session or API token (401 otherwise); rules about the object the route loads
 *   (a mission's or a case's workspace and role) are the work function's (missionFor, caseFor).
 * - 'admin-session': the instance administrator signed in with a password, never an API token.
 * - { workspaceRoles }: a member of the path's :workspaceId (404 for anyone else, never 403) with
 *   one of these roles (403 naming the role otherwise); the handler gets `call.membership`.
 */
export type RouteAccess = 'public' | 'signed-in' | 'admin-session' | { workspaceRoles: readonly Role[] };

/** What a body or query schema gives once parsed; `never` when the route declares none. */
export type Parsed<S> = S extends ZodType ? z.output<S> : never;

/** What a handler is given: the request, the answer, the app and the declared schemas ready to parse. */
export interface RouteCall<B = unknown, Q = unknown> {
  ctx: AppContext;
  req: Request;
  res: Response;
  /** The caller (a 401 when there is none, which only a public route can meet). */
  readonly auth: RequestAuth;
  /** The caller's membership of the path's :workspaceId on a { workspaceRoles } route. */
  readonly membership: { workspaceId: string; role: Role };
  /** A path parameter as one string ('' when absent). */
  param(name: string): string;
  /** The body parsed with the declared `body` schema: the 400 naming each field when it does not fit. */
  body(): Parsed<B>;
  /** The query parsed with the declared `query` schema, likewise. */
  query(): Parsed<Q>;
  /** Every route the dispatcher serves (for the document that describes them). */
  routes: readonly ApiRoute[];
}

interface RouteFields {
  method: ApiMethod;
  /** The full path as the client sends it, e.g. "/api/v1/cases/:id"; `:name` is a parameter. */
  path: string;
  summary: string;
  tag: string;
  access: RouteAccess;
  /** multipart/form-data uploads describe their text fields with `body` and add a binary `file`. */
  bodyKind?: 'json' | 'multipart';
  /** An absent body is read as {} (every field optional), not refused. */
  bodyOptional?: true;
  /** The success status; 200 when absent. A handler answering nothing on a 204 route gets an empty 204. */
  status?: number;
  /** The answer's schema; absent for 204 and for files described by `produces`. */
  response?: ZodType;
  /** Media type of the answer when it is not JSON (text/csv, application/x-ndjson). */
  produces?: string[];
  /** Per-step results: also answered as columnar JSON (?layout=columns) and as an Apache Arrow stream (API.md "Answer formats"). */
  perStep?: true;
}

/** A declared route as the dispatcher and the OpenAPI document see it. */
export interface ApiRoute extends RouteFields {
  body?: ZodType;
  query?: ZodObject;
  /**
   * The route's work. What it returns (other than undefined) is sent as JSON with `status`; a
   * handler that answers itself (a stream, a file, sendPerStep) returns nothing.
   */
  handle(call: RouteCall<ZodType | undefined, ZodObject | undefined>): unknown;
}

/** Declares a route; `call.body()` and `call.query()` are typed by the schemas given. */
export function route<B extends ZodType | undefined = undefined, Q extends ZodObject | undefined = undefined>(
  declaration: RouteFields & { body?: B; query?: Q; handle(call: RouteCall<B, Q>): unknown },
): ApiRoute {
  return declaration;
}
