// The server's settings, read from the environment once at start-up (API.md, "Running").
// A bad value stops the server with a sentence that names the variable and the value.
import { randomBytes } from 'node:crypto';
import { isIP } from 'node:net';
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { makePrivate, privateDir, writePrivateFile } from './private-files';

export type LogLevel = 'debug' | 'info' | 'warn' | 'error';
const logLevels: readonly LogLevel[] = ['debug', 'info', 'warn', 'error'];

export interface Config {
  port: number;
  /** Interface the HTTP server listens on; loopback unless HOST says otherwise. */
  host: string;
  dbPath: string;
  dataDir: string;
  seed: 'demo' | 'none';
  demoPassword: string;
  /** Null until resolveJwtSecret() has run: unset means "generate one and keep it in the data dir". */
  jwtSecret: string | null;
  /** Null means: start the local fake SMTP server and send mail there. */
  smtpUrl: string | null;
  /** Port of the fake SMTP server; 0 picks a free one. */
  fakeSmtpPort: number;
  publicUrl: string;
  sessionHours: number;
  logLevel: LogLevel;
  logFile: string | null;
  /** Built Angular client; served when the folder exists. */
  clientDir: string;
  /** Folder of drizzle-kit's generated SQL. */
  migrationsDir: string;
  /** bcrypt cost; lowered under NODE_ENV=test so the test suite stays fast. */
  bcryptCost: number;
  /** Largest accepted upload (an ephemeris file), MB; beyond it 413. */
  uploadLimitMb: number;
  /**
   * Whether the mail outbox shows invitation and password reset links as sent ("shown", for
   * development and demos) or hides them ("hidden"): they are their recipients' secrets.
   */
  outboxLinks: 'hidden' | 'shown';
  /** Seconds of silence allowed while the headers or the body of a request arrive; then 408 and the connection closes. */
  idleTimeoutS: number;
  /** Seconds a whole request (an upload included) may take to arrive. */
  requestTimeoutS: number;
}

export class ConfigError extends Error {
  override name = 'ConfigError';
}

type Env = Record<string, string | undefined>;

function wholeNumber(env: Env, name: string, fallback: number, min: number, max: number): number {
  const raw = env[name];
  if (raw === undefined || raw.trim() === '') return fallback;
  const value = Number(raw.trim());
  if (!/^\d+$/.test(raw.trim()) || value < min || value > max) {
    throw new ConfigError(`${name} must be a whole number from ${min} to ${max}, not ${JSON.stringify(raw)}.`);
  }
  return value;
}

function positiveNumber(env: Env, name: string, fallback: number, max: number): number {
  const raw = env[name];
  if (raw === undefined || raw.trim() === '') return fallback;
  const value = Number(raw.trim());
  if (!Number.isFinite(value) || value <= 0 || value > max) {
    throw new ConfigError(`${name} must be a number above 0 and at most ${max}, not ${JSON.stringify(raw)}.`);
  }
  return value;
}

function oneOf<T extends string>(env: Env, name: string, allowed: readonly T[], fallback: T): T {
  const raw = env[name];
  if (raw === undefined || raw.trim() === '') return fallback;
  const found = allowed.find((a) => a === raw.trim().toLowerCase());
  if (!found) {
    throw new ConfigError(`${name} must be one of ${allowed.join(', ')}, not ${JSON.stringify(raw)}.`);
  }
  return found;
}

function httpUrl(env: Env, name: string, fallback: string): string {
  const raw = env[name];
  if (raw === undefined || raw.trim() === '') return fallback;
  let url: URL;
  try {
    url = new URL(raw.trim());
  } catch {
    throw new ConfigError(`${name} must be an http or https URL, not ${JSON.stringify(raw)}.`);
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') {
    throw new ConfigError(`${name} must be an http or https URL, not ${JSON.stringify(raw)}.`);
  }
  // Links are built as publicUrl + "/invite/...", so a trailing slash would double up.
  return url.toString().replace(/\/+$/, '');
}

function smtpUrl(env: Env): string | null {
  const raw = env['SMTP_URL'];
  if (raw === undefined || raw.trim() === '') return null;
  let url: URL | null;
  try {
    url = new URL(raw.trim());
  } catch {
    url = null;
  }
  if (!url || (url.protocol !== 'smtp:' && url.protocol !== 'smtps:')) {
    // The value may hold a password, so it is not repeated in full.
    throw new ConfigError(`SMTP_URL must start with smtp:// or smtps://, not ${JSON.stringify(raw.trim().slice(0, 8) + '…')}.`);
  }
  return raw.trim();
}

/** An IP address or a DNS host name (RFC 1123 letters, digits, hyphens and dots). */
function listenHost(env: Env): string {
  const raw = env['HOST'];
  if (raw === undefined || raw.trim() === '') return '127.0.0.1';
  const value = raw.trim();
  const hostName = /^(?=.{1,253}$)[a-z0-9](?:[a-z0-9-]{0,61}[a-z0-9])?(?:\.[a-z0-9](?:[a-z0-9-]{0,61}[a-z0-9])?)*$/i;
  if (isIP(value) === 0 && !hostName.test(value)) {
    throw new ConfigError(`HOST must be an IP address or a host name to listen on, such as 127.0.0.1 or 0.0.0.0, not ${JSON.stringify(raw)}.`);
  }
  return value;
}

function text(env: Env, name: string, fallback: string): string {
  const raw = env[name];
  return raw === undefined || raw === '' ? fallback : raw;
}

export function loadConfig(env: Env = process.env, cwd: string = process.cwd()): Config {
  const port = wholeNumber(env, 'PORT', 4300, 0, 65535);
  const dataDir = path.resolve(cwd, text(env, 'ECLIPTA_DATA_DIR', 'data/'));
  const demoPassword = text(env, 'ECLIPTA_DEMO_PASSWORD', 'eclipta-demo');
  if (demoPassword.length < 10) {
    throw new ConfigError(`ECLIPTA_DEMO_PASSWORD must have at least 10 characters, not ${demoPassword.length}.`);
  }
  const jwtSecret = env['ECLIPTA_JWT_SECRET'];
  if (jwtSecret !== undefined && jwtSecret !== '' && jwtSecret.length < 32) {
    throw new ConfigError(`ECLIPTA_JWT_SECRET must have at least 32 characters, not ${jwtSecret.length}.`);
  }
  const logFile = env['ECLIPTA_LOG_FILE'];
  return {
    port,
    host: listenHost(env),
    dbPath: path.resolve(cwd, text(env, 'ECLIPTA_DB_PATH', 'data/eclipta.db')),
    dataDir,
    seed: oneOf(env, 'ECLIPTA_SEED', ['demo', 'none'] as const, 'demo'),
    demoPassword,
    jwtSecret: jwtSecret ? jwtSecret : null,
    smtpUrl: smtpUrl(env),
    fakeSmtpPort: wholeNumber(env, 'ECLIPTA_FAKE_SMTP_PORT', 0, 0, 65535),
    publicUrl: httpUrl(env, 'ECLIPTA_PUBLIC_URL', `http://localhost:${port}`),
    sessionHours: positiveNumber(env, 'ECLIPTA_SESSION_HOURS', 12, 24 * 90),
    logLevel: oneOf(env, 'ECLIPTA_LOG_LEVEL', logLevels, 'info'),
    logFile: logFile ? path.resolve(cwd, logFile) : null,
    clientDir: path.resolve(cwd, text(env, 'ECLIPTA_CLIENT_DIR', 'dist/client/browser')),
    migrationsDir: path.resolve(cwd, text(env, 'ECLIPTA_MIGRATIONS_DIR', 'migrations')),
    bcryptCost: env['NODE_ENV'] === 'test' ? 4 : 10,
    uploadLimitMb: positiveNumber(env, 'ECLIPTA_UPLOAD_LIMIT_MB', 50, 10000),
    outboxLinks: oneOf(env, 'ECLIPTA_OUTBOX_LINKS', ['hidden', 'shown'] as const, 'hidden'),
    idleTimeoutS: wholeNumber(env, 'ECLIPTA_IDLE_TIMEOUT_S', 30, 1, 3600),
    requestTimeoutS: wholeNumber(env, 'ECLIPTA_REQUEST_TIMEOUT_S', 300, 1, 86400),
  };
}

/**
 * The signing secret: the configured one, or one generated on first start and kept in the data
 * dir (mode 0600) so that sessions survive a restart.
 */
export function resolveJwtSecret(config: Config): string {
  if (config.jwtSecret) return config.jwtSecret;
  const file = path.join(config.dataDir, 'jwt-secret');
  privateDir(config.dataDir);
  if (existsSync(file)) {
    makePrivate(file);
    const kept = readFileSync(file, 'utf8').trim();
    if (kept.length >= 32) return kept;
  }
  const secret = randomBytes(48).toString('base64url');
  writePrivateFile(file, secret + '\n');
  return secret;
}
