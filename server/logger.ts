// A tiny JSON-lines logger: one object a line on stdout, and in a file when ECLIPTA_LOG_FILE is set.
// Anything that looks like a secret is masked before it is written, as a second line of defence
// behind the rule that callers never log secrets in the first place.
import { appendFileSync } from 'node:fs';
import type { LogLevel } from './config';
import { secretLinkRoutes } from './mail/secret-links';

export type LogFields = Record<string, unknown>;

export interface Logger {
  debug(msg: string, fields?: LogFields): void;
  info(msg: string, fields?: LogFields): void;
  warn(msg: string, fields?: LogFields): void;
  error(msg: string, fields?: LogFields): void;
}

const rank: Record<LogLevel, number> = { debug: 10, info: 20, warn: 30, error: 40 };

const secretKey = /password|secret|^token$|tokenhash|authorization|cookie|smtp_?url/i;
const secretPatterns: [RegExp, string][] = [
  [/ecl_[A-Za-z0-9_-]{16,}/g, '[redacted]'], // our personal API tokens
  [/eyJ[A-Za-z0-9_-]+\.[A-Za-z0-9_-]+\.[A-Za-z0-9_-]+/g, '[redacted]'], // JWTs
  [/(bearer\s+)[^\s"']+/gi, '$1[redacted]'],
  [/(smtps?:\/\/[^:/\s]+:)[^@\s]+@/gi, '$1[redacted]@'], // password inside an SMTP URL
  // single-use links, and the API path that takes an invitation's secret
  [new RegExp(`((?:${[...Object.keys(secretLinkRoutes), 'invitations'].join('|')})\\/)[A-Za-z0-9_-]{16,}`, 'g'), '$1[redacted]'],
];

export function redactText(text: string): string {
  let out = text;
  for (const [pattern, replacement] of secretPatterns) out = out.replace(pattern, replacement);
  return out;
}

export function redact(value: unknown, depth = 0): unknown {
  if (typeof value === 'string') return redactText(value);
  if (depth > 5 || value === null || typeof value !== 'object') return value;
  if (value instanceof Error) {
    return { name: value.name, message: redactText(value.message), stack: value.stack ? redactText(value.stack) : undefined };
  }
  if (Array.isArray(value)) return value.map((v) => redact(v, depth + 1));
  const out: Record<string, unknown> = {};
  for (const [key, v] of Object.entries(value)) {
    out[key] = secretKey.test(key) && v !== null && v !== undefined && typeof v !== 'boolean' ? '[redacted]' : redact(v, depth + 1);
  }
  return out;
}

export interface LoggerOptions {
  level: LogLevel;
  file?: string | null;
  /** Where lines go; stdout unless a test collects them. */
  write?: (line: string) => void;
}

export function createLogger(options: LoggerOptions): Logger {
  const min = rank[options.level];
  const write = options.write ?? ((line: string) => process.stdout.write(line + '\n'));
  const log = (level: LogLevel, msg: string, fields?: LogFields): void => {
    if (rank[level] < min) return;
    const entry = { at: new Date().toISOString(), level, msg: redactText(msg), ...(fields ? (redact(fields) as LogFields) : {}) };
    const line = JSON.stringify(entry);
    write(line);
    if (options.file) {
      try {
        appendFileSync(options.file, line + '\n');
      } catch {
        // A full disk or a removed folder must not take the server down with it.
      }
    }
  };
  return {
    debug: (msg, fields) => log('debug', msg, fields),
    info: (msg, fields) => log('info', msg, fields),
    warn: (msg, fields) => log('warn', msg, fields),
    error: (msg, fields) => log('error', msg, fields),
  };
}
