// Every API request is answered from one precompiled table (method + path pattern -> declared
// route) by one middleware, instead of a stack of Express routers: Express matched each request
// against ~60 layers in 15 routers before it reached a handler, which was a large part of what a
// small authenticated GET cost (issue 16 item 3; `npm run bench -- auth`). The matching keeps
// Express's rules: static segments compare case-insensitively, one trailing slash is allowed, a
// parameter is one non-empty segment, percent-decoded (a bad escape is a 400), HEAD is answered by
// the GET route, OPTIONS lists the methods of the path, and the first declared route that matches wins.
//
// Under /api/v1 every request, answered or not, goes through the same steps in this order:
// compression, the body idle timeout, the JSON body (only when there is one), cookies,
// authentication (token or session, cross-site refusal), then the route's access rule and its
// handler; a path no route matches is the API's 404 after those steps, as before. A route outside
// /api/v1 (the health check) runs its handler alone; any other /api path is a compressed 404.
import cookieParser from 'cookie-parser';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { AppContext } from '../app-context';
import { authenticate, requireAdminSession, requireUser, signedIn, workspaceAccess } from '../auth/middleware';
import { apiNotFound, badRequest, parse } from '../errors';
import { jsonBody } from '../json-body';
import { pathParam } from '../path-param';
import { bodyIdleTimeout } from '../request-timeouts';
import type { ApiRoute, RouteCall } from './api-route';
import { compressAnswers } from './answer-compression';

const v1 = '/api/v1/';

interface CompiledRoute {
  route: ApiRoute;
  method: string;
  /** Lower-case static segments; null where the segment is a parameter. */
  segments: (string | null)[];
  names: string[];
  access: RequestHandler | null;
  v1: boolean;
}

type Step = (req: Request, res: Response, next: NextFunction) => unknown;

/** Runs the steps one after another, like a router's stack; a throw or a rejection goes to `next`. */
function runSteps(steps: readonly Step[], req: Request, res: Response, next: NextFunction): void {
  let i = 0;
  const step = (err?: unknown): void => {
    if (err !== undefined && err !== null) {
      next(err);
      return;
    }
    const current = steps[i++];
    if (!current) return;
    try {
      const result = current(req, res, step);
      if (result instanceof Promise) result.catch(next);
    } catch (e) {
      next(e);
    }
  };
  step();
}

/** A parameter percent-decoded, or undefined for a bad escape (answered 400 after the common steps, as Express did). */
function decodeParam(text: string): string | undefined {
  try {
    return decodeURIComponent(text);
  } catch {
    return undefined;
  }
}

const badParam: Step = () => {
  throw badRequest('The request could not be read.', undefined, 'bad_request');
};

function accessStep(ctx: AppContext, route: ApiRoute): RequestHandler | null {
  const access = route.access;
  if (access === 'public') return null;
  if (access === 'signed-in') return requireUser;
  if (access === 'admin-session') return requireAdminSession;
  if (!route.path.includes(':workspaceId')) throw new Error(`${route.method} ${route.path}: workspaceRoles needs a :workspaceId in the path`);
  return workspaceAccess(ctx, access.workspaceRoles);
}

function compile(ctx: AppContext, route: ApiRoute): CompiledRoute {
  const parts = route.path.split('/').slice(1);
  return {
    route,
    method: route.method.toUpperCase(),
    segments: parts.map((p) => (p.startsWith(':') ? null : p.toLowerCase())),
    names: parts.filter((p) => p.startsWith(':')).map((p) => p.slice(1)),
    access: accessStep(ctx, route),
    v1: route.path.startsWith(v1),
  };
}

/** The parameters when the path's segments fit the route's (undefined for one that does not decode), else null. */
function matchSegments(compiled: CompiledRoute, parts: readonly string[]): Record<string, string | undefined> | null {
  const { segments } = compiled;
  for (let i = 0; i < segments.length; i++) {
    const want = segments[i];
    const got = parts[i] ?? '';
    if (want === null) {
      if (got === '') return null;
    } else if (got !== want && got.toLowerCase() !== want) {
      return null;
    }
  }
  const params: Record<string, string | undefined> = {};
  let n = 0;
  for (let i = 0; i < segments.length; i++) {
    if (segments[i] === null) params[compiled.names[n++] ?? ''] = decodeParam(parts[i] ?? '');
  }
  return params;
}

function callOf(ctx: AppContext, route: ApiRoute, routes: readonly ApiRoute[], req: Request, res: Response): RouteCall<never, never> {
  return {
    ctx,
    req,
    res,
    routes,
    get auth() {
      return signedIn(req);
    },
    get membership() {
      if (!req.membership) throw new Error(`${route.method} ${route.path} reads the membership but is not declared with workspaceRoles`);
      return req.membership;
    },
    param: (name) => pathParam(req, name),
    body: () => parse(route.body ?? neverSchema(route, 'body'), route.bodyOptional ? (req.body ?? {}) : req.body) as never,
    query: () => parse(route.query ?? neverSchema(route, 'query'), req.query) as never,
  };
}

function neverSchema(route: ApiRoute, part: string): never {
  throw new Error(`${route.method} ${route.path} parses a ${part} it does not declare`);
}

/** The route's handler, its return value sent as JSON with the declared status. */
function handlerStep(ctx: AppContext, route: ApiRoute, routes: readonly ApiRoute[]): Step {
  const status = route.status ?? 200;
  const answer = (res: Response, value: unknown) => {
    if (value !== undefined) res.status(status).json(value);
    else if (status === 204 && !res.headersSent) res.status(204).end();
  };
  return (req, res, next) => {
    const value = route.handle(callOf(ctx, route, routes, req, res));
    if (value instanceof Promise) {
      return value.then((v: unknown) => answer(res, v), next);
    }
    answer(res, value);
    return undefined;
  };
}

function optionsAnswer(methods: Set<string>): Step {
  return (_req, res) => {
    if (methods.has('GET')) methods.add('HEAD');
    const allow = [...methods].sort().join(', ');
    res.status(200).set('Allow', allow).type('text/plain; charset=utf-8').set('X-Content-Type-Options', 'nosniff').end(allow);
  };
}

/** The middleware that answers every declared route; remembers the table for listRoutes. */
export function routeDispatcher(ctx: AppContext, routes: readonly ApiRoute[]): RequestHandler {
  const compiled = routes.map((r) => compile(ctx, r));
  // One bucket per method and number of segments, in declaration order.
  const buckets = new Map<string, CompiledRoute[]>();
  for (const c of compiled) {
    const key = `${c.method} ${c.segments.length}`;
    const bucket = buckets.get(key) ?? [];
    bucket.push(c);
    buckets.set(key, bucket);
  }
  const before: Step[] = [compressAnswers, bodyIdleTimeout(ctx.config), optionalJsonBody(), cookieParser(), authenticate(ctx)];
  const steps = new Map<CompiledRoute, Step[]>(
    compiled.map((c) => [c, [...(c.v1 ? before : []), ...(c.access ? [c.access] : []), handlerStep(ctx, c.route, routes)]]),
  );
  const noRoute: Step[] = [...before, apiNotFound];

  return (req, res, next) => {
    const path = req.path;
    const head = path.slice(0, 5).toLowerCase();
    if (head !== '/api/' && head !== '/api') {
      next();
      return;
    }
    const trimmed = path.length > 1 && path.endsWith('/') ? path.slice(0, -1) : path;
    const parts = trimmed.split('/').slice(1);
    const method = req.method === 'HEAD' ? 'GET' : req.method;
    for (const c of buckets.get(`${method} ${parts.length}`) ?? []) {
      const params = matchSegments(c, parts);
      if (params === null) continue;
      if (Object.values(params).includes(undefined)) {
        runSteps(c.v1 ? [...before, badParam] : [badParam], req, res, next);
        return;
      }
      req.params = params as Record<string, string>;
      runSteps(steps.get(c) ?? noRoute, req, res, next);
      return;
    }
    if (parts[1]?.toLowerCase() !== 'v1') {
      // Another /api path: the API's 404, compressed like every API answer.
      runSteps([compressAnswers, apiNotFound], req, res, next);
      return;
    }
    if (req.method === 'OPTIONS') {
      const methods = new Set(compiled.filter((c) => c.segments.length === parts.length && matchSegments(c, parts) !== null).map((c) => c.method));
      if (methods.size > 0) {
        runSteps([...before, optionsAnswer(methods)], req, res, next);
        return;
      }
    }
    runSteps(noRoute, req, res, next);
  };
}

/** The JSON body parser, skipped for a request without a body (it would only look and go on). */
function optionalJsonBody(): Step {
  const json = jsonBody();
  return (req, res, next) => {
    if (req.headers['transfer-encoding'] === undefined && req.headers['content-length'] === undefined) {
      next();
      return;
    }
    json(req, res, next);
  };
}
