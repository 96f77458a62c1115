// Session cookies: a signed JWT (HS256, sub = user id, sid = a row of the sessions table) in an
// httpOnly, SameSite=Strict cookie. The signature proves the cookie is ours; the row says whether
// the session is still open, so sign-out and a password reset end it on the server, for every
// server process that shares the database.
import type { CookieOptions, Response } from 'express';
import { and, eq, isNull, lt, sql } from 'drizzle-orm';
import jwt from 'jsonwebtoken';
import { createSecretKey, type KeyObject } from 'node:crypto';
import type { AppContext } from '../app-context';
import type { Db, DbOrTx } from '../db/database';
import { preparedPer } from '../db/prepared';
import { memoisedRead } from '../db/read-memo';
import { sessions, users, type UserRow } from '../db/schema';

export const sessionCookie = 'eclipta_session';

function cookieOptions(ctx: AppContext): CookieOptions {
  return {
    httpOnly: true,
    sameSite: 'strict',
    secure: ctx.config.publicUrl.startsWith('https:'),
    path: '/',
  };
}

interface SigningKey {
  key: KeyObject;
  /** Tokens whose signature this key has checked, with their claims and expiry (ms since 1970). */
  checked: Map<string, { claims: SessionClaims; expiresAtMs: number }>;
}

// The signing key as a key object, made once per secret: given the secret as a string, jsonwebtoken
// first tries (and fails) to read it as a public key on every call, about a millisecond per request.
const signingKeys = new Map<string, SigningKey>();
function signingKey(secret: string): SigningKey {
  let key = signingKeys.get(secret);
  if (key === undefined) {
    key = { key: createSecretKey(Buffer.from(secret, 'utf8')), checked: new Map() };
    signingKeys.set(secret, key);
  }
  return key;
}
/** How many checked signatures are remembered per key before the memory is emptied. */
const checkedTokensKept = 10_000;

/** Opens a session row for the user and sets its cookie. */
export function startSession(ctx: AppContext, res: Response, user: UserRow): void {
  const hours = ctx.config.sessionHours;
  const now = Date.now();
  // Rows of sessions long over are of no use to anyone; each sign-in tidies its own user's.
  ctx.db.delete(sessions).where(and(eq(sessions.userId, user.id), lt(sessions.expiresAt, new Date(now).toISOString()))).run();
  const row = ctx.db
    .insert(sessions)
    .values({ userId: user.id, expiresAt: new Date(now + hours * 3600 * 1000).toISOString() })
    .returning()
    .get();
  const token = jwt.sign({ sid: row.id }, signingKey(ctx.jwtSecret).key, {
    algorithm: 'HS256',
    subject: user.id,
    expiresIn: Math.round(hours * 3600),
  });
  res.cookie(sessionCookie, token, { ...cookieOptions(ctx), maxAge: hours * 3600 * 1000 });
}

/** Tells the browser to drop the cookie (the row, if any, is ended by endSessions). */
export function clearSessionCookie(ctx: AppContext, res: Response): void {
  res.clearCookie(sessionCookie, cookieOptions(ctx));
}

/** Ends open sessions on the server: one (sign-out) or all of a user's (a new password). Answers how many. */
export function endSessions(db: DbOrTx, which: { sessionId: string } | { userId: string }): number {
  const whose = 'sessionId' in which ? eq(sessions.id, which.sessionId) : eq(sessions.userId, which.userId);
  return db.update(sessions).set({ endedAt: new Date().toISOString() }).where(and(whose, isNull(sessions.endedAt))).run().changes;
}

export interface SessionClaims {
  userId: string;
  sessionId: string;
}

/**
 * The claims of a well-signed, unexpired session token, or null for a forged, expired or malformed
 * one. A token whose signature was checked before is not checked again until it expires: only the
 * signature and the expiry are remembered, never whether the session is open (sessionUser reads
 * the row on every request, so sign-out and a reset still end the session at once).
 */
export function readSession(ctx: AppContext, token: string, now = Date.now()): SessionClaims | null {
  const signing = signingKey(ctx.jwtSecret);
  const known = signing.checked.get(token);
  if (known !== undefined) {
    if (now < known.expiresAtMs) return known.claims;
    signing.checked.delete(token);
    return null;
  }
  try {
    const payload = jwt.verify(token, signing.key, { algorithms: ['HS256'] });
    if (typeof payload === 'string' || typeof payload.sub !== 'string' || typeof payload['sid'] !== 'string') return null;
    const claims = { userId: payload.sub, sessionId: payload['sid'] };
    if (typeof payload.exp === 'number') {
      if (signing.checked.size >= checkedTokensKept) signing.checked.clear();
      signing.checked.set(token, { claims, expiresAtMs: payload.exp * 1000 });
    }
    return claims;
  } catch {
    return null;
  }
}

const openSessionUser = preparedPer((db: Db) =>
  db
    .select({ user: users, expiresAt: sessions.expiresAt })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(and(eq(sessions.id, sql.placeholder('sessionId')), eq(sessions.userId, sql.placeholder('userId')), isNull(sessions.endedAt)))
    .prepare(),
);

/**
 * The user of an open, unexpired session row matching the claims; undefined otherwise. The row is
 * read again after any write to the database (memoisedRead), so an ended session is refused at
 * once; its expiry is checked against the clock on every request.
 */
export function sessionUser(db: Db, claims: SessionClaims, now = new Date()): UserRow | undefined {
  const found = memoisedRead(db, `session ${claims.sessionId} ${claims.userId}`, () =>
    openSessionUser(db).get({ sessionId: claims.sessionId, userId: claims.userId }) ?? null,
  );
  if (!found || Date.parse(found.expiresAt) <= now.getTime()) return undefined;
  return found.user;
}
