// Who is calling, and may they: authentication (session cookie or personal API token), the
// cross-site check for cookie-borne changes, and the workspace membership and role checks.
import type { Request, RequestHandler } from 'express';
import { and, eq, sql } from 'drizzle-orm';
import type { Role } from '../../shared/api/workspaces';
import { roleLabels } from '../../shared/api/plain-lists';
import type { AppContext } from '../app-context';
import { pathParam } from '../path-param';
import type { DbOrTx } from '../db/database';
import { preparedPer } from '../db/prepared';
import { memberships } from '../db/schema';
import { ApiError, forbidden, notFound, unauthorized } from '../errors';
import { findApiToken, tokenPrefix, touchApiToken } from './api-tokens';
import type { RequestAuth } from './request-auth';
import { clearSessionCookie, readSession, sessionCookie, sessionUser } from './session';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

const tokenProblems = {
  unknown: 'This API token is not valid.',
  revoked: 'This API token was revoked.',
  expired: 'This API token has expired.',
} as const;

function bearerSecret(req: Request): string | null {
  const header = req.get('authorization');
  if (header === undefined) return null;
  const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
  if (!match?.[1]) throw new ApiError(401, 'invalid_token', 'Send a personal API token as "Authorization: Bearer <token>".');
  return match[1];
}

/**
 * True when a change could come from another site: an Origin that is not this server's full origin
 * (scheme, host and port) -- the public URL's, or the one the request itself was addressed to, as
 * behind the development proxy -- or, without an Origin, a browser's Sec-Fetch-Site saying the
 * request was started by another site.
 */
function foreignOrigin(ctx: AppContext, req: Request): boolean {
  const origin = req.get('origin');
  if (origin === undefined) {
    const fetchSite = req.get('sec-fetch-site')?.trim().toLowerCase();
    return fetchSite === 'cross-site' || fetchSite === 'same-site';
  }
  const claimed = originOf(origin);
  if (claimed === null || claimed === 'null') return true;
  if (claimed === originOf(ctx.config.publicUrl)) return false;
  const host = req.get('host');
  return host === undefined || claimed !== originOf(`${req.protocol}://${host}`);
}

/** The normalised origin of a URL (lower-case host, no default port), or null when it is none. */
function originOf(url: string): string | null {
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}

/**
 * Sets req.auth when the request carries a valid token or session; answers 401 for a bad token
 * (a script should hear that its token failed, not get anonymous answers) and 403 for a write
 * with a read-only token or from a foreign origin.
 */
export function authenticate(ctx: AppContext): RequestHandler {
  return (req, res, next) => {
    const secret = bearerSecret(req);
    if (secret !== null) {
      const found = secret.startsWith(tokenPrefix) ? findApiToken(ctx.db, secret) : ({ ok: false, reason: 'unknown' } as const);
      if (!found.ok) throw new ApiError(401, 'invalid_token', tokenProblems[found.reason]);
      const user = found.user;
      if (found.row.readOnly && req.method !== 'GET' && req.method !== 'HEAD') {
        throw forbidden('This API token is read-only.', 'read_only_token');
      }
      touchApiToken(ctx.db, found.row);
      req.auth = { user, kind: 'token', readOnly: found.row.readOnly, tokenId: found.row.id };
      next();
      return;
    }

    // Changes that a browser could be tricked into sending (cookie or no cookie) must come from our own pages.
    if (!safeMethods.has(req.method) && foreignOrigin(ctx, req)) {
      throw forbidden('This request came from another site and was refused.', 'cross_site');
    }

    const cookies: unknown = req.cookies;
    const cookie =
      cookies !== null && typeof cookies === 'object' ? (cookies as Record<string, unknown>)[sessionCookie] : undefined;
    if (typeof cookie === 'string' && cookie !== '') {
      const claims = readSession(ctx, cookie);
      const user = claims ? sessionUser(ctx.db, claims) : undefined;
      if (claims && user) {
        req.auth = { user, kind: 'session', readOnly: false, sessionId: claims.sessionId };
      } else {
        // A stale cookie (signed out, password reset, expired) would otherwise be sent, and refused, on every request.
        clearSessionCookie(ctx, res);
      }
    }
    next();
  };
}

/** The caller of a route behind requireUser (or workspaceAccess); a 401 if there is none. */
export function signedIn(req: Request): RequestAuth {
  if (!req.auth) throw unauthorized();
  return req.auth;
}

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.auth) throw unauthorized();
  next();
};

export const requireAdmin: RequestHandler = (req, _res, next) => {
  if (!req.auth) throw unauthorized();
  if (!req.auth.user.isAdmin) throw forbidden('Only an instance administrator may do this.');
  next();
};

/**
 * The instance administrator signed in with a password, not an API token: for what holds other
 * users' mail, which no script (and no leaked token, read-only or not) may read.
 */
export const requireAdminSession: RequestHandler = (req, res, next) => {
  if (req.auth?.kind === 'token') {
    throw forbidden('API tokens cannot open the mail outbox; sign in as the instance administrator.', 'session_required');
  }
  requireAdmin(req, res, next);
};

const membershipRole = preparedPer((db: DbOrTx) =>
  db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, sql.placeholder('userId')), eq(memberships.workspaceId, sql.placeholder('workspaceId'))))
    .prepare(),
);

/** The user's role in a workspace, or null when they are not a member (inside a transaction too). */
export function memberRole(db: DbOrTx, userId: string, workspaceId: string): Role | null {
  const row = membershipRole(db).get({ userId, workspaceId });
  return row ? row.role : null;
}

export function noWorkspace(workspaceId: string): ApiError {
  return notFound(`No workspace with id ${JSON.stringify(workspaceId.slice(0, 80))}.`);
}

export function roleRefused(role: Role, allowed: readonly Role[]): ApiError {
  const needs = allowed.length === 1 ? `the ${roleLabels[allowed[0]!]} role` : `one of the roles ${allowed.map((r) => roleLabels[r]).join(', ')}`;
  return forbidden(`Your role in this workspace is ${roleLabels[role]}; this needs ${needs}.`);
}

/**
 * Checks the :workspaceId of the route: 404 for a non-member (a workspace's existence is not
 * revealed), 403 naming the role for a member whose role is not allowed. Includes requireUser.
 */
export function workspaceAccess(ctx: AppContext, allowed: readonly Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.auth) throw unauthorized();
    const workspaceId = pathParam(req, 'workspaceId');
    if (workspaceId === '') throw new Error('workspaceAccess used on a route without :workspaceId');
    const role = memberRole(ctx.db, req.auth.user.id, workspaceId);
    if (!role) throw noWorkspace(workspaceId);
    if (!allowed.includes(role)) throw roleRefused(role, allowed);
    req.membership = { workspaceId, role };
    next();
  };
}
