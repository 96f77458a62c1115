// Rate limits of the anonymous doors (sign-in, invitation acceptance, password reset requests):
// each limit allows `max` attempts per key within a sliding window. Attempts are rows of
// rate_limit_hits, so a restart forgets nothing and every server process on the database counts
// together. The limits themselves are the tables below, one place for all of them.
import type { Request } from 'express';
import { and, count, eq, gt, lt, min } from 'drizzle-orm';
import type { Db } from '../db/database';
import { preparedPer } from '../db/prepared';
import { rateLimitHits } from '../db/schema';
import { ApiError } from '../errors';

export interface Limit {
  /** Stored name of the counter. */
  bucket: string;
  max: number;
  windowMs: number;
  /** What the 429 says before "Try again in N minutes." */
  refusal: string;
}

const minutes = (n: number) => n * 60 * 1000;

/** Failed password checks (sign-in and accepting an invitation with an existing account). */
export const signInLimits = {
  /** One account from one client: guessing one password. */
  accountClient: { bucket: 'sign-in:account+client', max: 5, windowMs: minutes(15), refusal: 'Too many sign-in attempts for this account.' },
  /** One client across accounts: trying one password on many accounts. */
  client: { bucket: 'sign-in:client', max: 15, windowMs: minutes(15), refusal: 'Too many failed sign-in attempts from your network address.' },
} as const satisfies Record<string, Limit>;

/** Password reset requests, counted whether or not the address has an account. */
export const resetLimits = {
  address: { bucket: 'reset:address', max: 3, windowMs: minutes(60), refusal: 'Too many password reset requests for this address.' },
  client: { bucket: 'reset:client', max: 10, windowMs: minutes(60), refusal: 'Too many password reset requests from your network address.' },
  everyone: { bucket: 'reset:all', max: 200, windowMs: minutes(60), refusal: 'Too many password reset requests right now.' },
} as const satisfies Record<string, Limit>;

/** A limit and the key it counts by for one request. */
export type LimitKey = readonly [Limit, string];

const longestWindowMs = Math.max(...[...Object.values(signInLimits), ...Object.values(resetLimits)].map((l) => l.windowMs));

export class RateLimiter {
  private recorded = 0;

  constructor(
    private readonly db: Db,
    private readonly now: () => number = Date.now,
  ) {}

  /** Throws the 429 (with Retry-After) for the first of the limits that is used up. */
  check(keys: readonly LimitKey[]): void {
    const now = this.now();
    for (const [limit, key] of keys) {
      const since = now - limit.windowMs;
      const found = this.db
        .select({ n: count(), oldest: min(rateLimitHits.atMs) })
        .from(rateLimitHits)
        .where(and(eq(rateLimitHits.bucket, limit.bucket), eq(rateLimitHits.key, key), gt(rateLimitHits.atMs, since)))
        .get();
      if (!found || found.n < limit.max || found.oldest === null) continue;
      const waitMs = found.oldest + limit.windowMs - now;
      const wait = Math.max(1, Math.ceil(waitMs / 60_000));
      throw new ApiError(429, 'rate_limited', `${limit.refusal} Try again in ${wait} minute${wait === 1 ? '' : 's'}.`, undefined, {
        'Retry-After': String(Math.max(1, Math.ceil(waitMs / 1000))),
      });
    }
  }

  /** Counts one attempt against each limit. */
  record(keys: readonly LimitKey[]): void {
    const atMs = this.now();
    this.db.transaction((tx) => {
      for (const [limit, key] of keys) tx.insert(rateLimitHits).values({ bucket: limit.bucket, key, atMs }).run();
      // Now and then, forget attempts older than any window.
      if (++this.recorded % 500 === 1) tx.delete(rateLimitHits).where(lt(rateLimitHits.atMs, atMs - longestWindowMs)).run();
    });
  }

  /** Forgets a key's attempts (a right password clears that account's failures from that client). */
  clear(limit: Limit, key: string): void {
    this.db.delete(rateLimitHits).where(and(eq(rateLimitHits.bucket, limit.bucket), eq(rateLimitHits.key, key))).run();
  }
}

/**
 * The sign-in limits around one password check of an account (by e-mail) from a client: sign-in
 * and accepting an invitation with an existing account both go through it. A right password
 * forgets that account's failures from that client, not the client's failures on other accounts.
 */
/** One limiter per database handle, shared by the routes that count attempts. */
export const rateLimiterOf = preparedPer((db: Db) => new RateLimiter(db));

export function passwordCheckLimits(limiter: RateLimiter, email: string, client: string) {
  const accountClient = `${email.toLowerCase()} ${client}`;
  const keys: LimitKey[] = [
    [signInLimits.accountClient, accountClient],
    [signInLimits.client, client],
  ];
  return {
    /** Throws the 429 when a limit is used up. */
    check: () => limiter.check(keys),
    failed: () => limiter.record(keys),
    succeeded: () => limiter.clear(signInLimits.accountClient, accountClient),
  };
}

/** The address a request came from, the key of the per-client limits. */
export function clientAddress(req: Request): string {
  return req.ip ?? req.socket.remoteAddress ?? 'unknown';
}
