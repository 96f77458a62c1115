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
  /** Where lines go, each as it is logged (a test collecting them); stdout in batches otherwise. */
  write?: (line: string) => void;
}

/**
 * Lines for stdout and the log file, gathered and written together once the current work is done
 * (setImmediate), at once for an error or past 64 kB, and before the process exits: a write to a
 * pipe is synchronous in Node on Linux, which one line a request paid for on every request.
 */
function batchedWriter(file: string | null | undefined): { add: (line: string, now: boolean) => void } {
  let lines: string[] = [];
  let size = 0;
  let scheduled = false;
  const flush = () => {
    scheduled = false;
    if (lines.length === 0) return;
    const text = lines.join('\n') + '\n';
    lines = [];
    size = 0;
    process.stdout.write(text);
    if (file) {
      try {
        appendFileSync(file, text);
      } catch {
        // A full disk or a removed folder must not take the server down with it.
      }
    }
  };
  process.on('exit', flush);
  return {
    add(line, now) {
      lines.push(line);
      size += line.length;
      if (now || size > 65_536) flush();
      else if (!scheduled) {
        scheduled = true;
        setImmediate(flush);
      }
    },
  };
}

export function createLogger(options: LoggerOptions): Logger {
  const min = rank[options.level];
  const given = options.write;
  const batch = given ? null : batchedWriter(options.file);
  const log = (level: LogLevel, msg: string, fields?: LogFields): void => {
    if (rank[level] < min) return;
    const entry = { at: new Date().toISOString(), level, msg: redactText(msg), ...(fields ? (redact(fields) as LogFields) : {}) };
    const line = JSON.stringify(entry);
    if (batch) {
      batch.add(line, rank[level] >= rank.error);
      return;
    }
    given?.(line);
    if (options.file) {
      try {
        appendFileSync(options.file, line + '\n');
      } catch {
        // as above
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
