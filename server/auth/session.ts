// Session cookies: a signed JWT (HS256, sub = user id) in an httpOnly, SameSite=Strict cookie.
// Sessions are stateless so that a second server process accepts them too; a password reset
// ends older sessions through users.passwordChangedAt.
import type { CookieOptions, Response } from 'express';
import jwt from 'jsonwebtoken';
import type { AppContext } from '../app-context';
import type { UserRow } from '../db/schema';

export const sessionCookie = 'eclipta_session';

function cookieOptions(ctx: AppContext): CookieOptions {
  return {
    httpOnly: true,
    sameSite: 'strict',
    secure: ctx.config.publicUrl.startsWith('https:'),
    path: '/',
  };
}

export function startSession(ctx: AppContext, res: Response, user: UserRow): void {
  const hours = ctx.config.sessionHours;
  const token = jwt.sign({}, ctx.jwtSecret, {
    algorithm: 'HS256',
    subject: user.id,
    expiresIn: Math.round(hours * 3600),
  });
  res.cookie(sessionCookie, token, { ...cookieOptions(ctx), maxAge: hours * 3600 * 1000 });
}

export function endSession(ctx: AppContext, res: Response): void {
  res.clearCookie(sessionCookie, cookieOptions(ctx));
}

export interface SessionClaims {
  userId: string;
  issuedAtS: number;
}

/** The claims of a valid session token, or null for a forged, expired or malformed one. */
export function readSession(ctx: AppContext, token: string): SessionClaims | null {
  try {
    const payload = jwt.verify(token, ctx.jwtSecret, { algorithms: ['HS256'] });
    if (typeof payload === 'string' || typeof payload.sub !== 'string' || typeof payload.iat !== 'number') return null;
    return { userId: payload.sub, issuedAtS: payload.iat };
  } catch {
    return null;
  }
}

/** False when the password changed after the session began (iat has whole seconds only). */
export function sessionStillValid(user: UserRow, claims: SessionClaims): boolean {
  if (!user.passwordChangedAt) return true;
  return claims.issuedAtS >= Math.floor(Date.parse(user.passwordChangedAt) / 1000);
}
