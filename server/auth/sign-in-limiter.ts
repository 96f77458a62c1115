// Slows down password guessing: after `maxFailures` failed sign-ins for one e-mail from one
// address within the window, further tries are refused until the oldest failure ages out.
// In-process by design for now: with several server processes each keeps its own count, which
// still bounds guessing per process; a shared store can replace this class without changing routes.
import { ApiError } from '../errors';

export interface SignInLimiterOptions {
  maxFailures: number;
  windowMs: number;
  now?: () => number;
}

export class SignInLimiter {
  private readonly failures = new Map<string, number[]>();
  private readonly now: () => number;

  constructor(private readonly options: SignInLimiterOptions = { maxFailures: 5, windowMs: 15 * 60 * 1000 }) {
    this.now = options.now ?? Date.now;
  }

  private key(email: string, ip: string): string {
    return `${email.toLowerCase()}\u0000${ip}`;
  }

  private recent(key: string): number[] {
    const cutoff = this.now() - this.options.windowMs;
    const kept = (this.failures.get(key) ?? []).filter((t) => t > cutoff);
    if (kept.length > 0) this.failures.set(key, kept);
    else this.failures.delete(key);
    return kept;
  }

  /** Throws the 429 when this e-mail and address have used up their tries. */
  check(email: string, ip: string): void {
    const recent = this.recent(this.key(email, ip));
    const oldest = recent[0];
    if (recent.length < this.options.maxFailures || oldest === undefined) return;
    const waitMs = oldest + this.options.windowMs - this.now();
    const minutes = Math.max(1, Math.ceil(waitMs / 60_000));
    throw new ApiError(
      429,
      'rate_limited',
      `Too many sign-in attempts for this account. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
      undefined,
      { 'Retry-After': String(Math.max(1, Math.ceil(waitMs / 1000))) },
    );
  }

  recordFailure(email: string, ip: string): void {
    const key = this.key(email, ip);
    const recent = this.recent(key);
    recent.push(this.now());
    this.failures.set(key, recent);
    // Bound the memory a flood of invented e-mails could take.
    if (this.failures.size > 50_000) {
      const first = this.failures.keys().next();
      if (!first.done) this.failures.delete(first.value);
    }
  }

  recordSuccess(email: string, ip: string): void {
    this.failures.delete(this.key(email, ip));
  }
}
