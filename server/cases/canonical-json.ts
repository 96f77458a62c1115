// The content hash of a released case: SHA-256 (hex) of its canonical JSON, i.e. JSON.stringify
// with object keys sorted at every level and no whitespace, so any importer can recompute it.
import { createHash } from 'node:crypto';

export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') {
    const text = JSON.stringify(value);
    // undefined and functions have no JSON form; they never occur in stored content.
    if (text === undefined) throw new TypeError('canonicalJson: a value without a JSON form');
    return text;
  }
  if (Array.isArray(value)) return `[${value.map((v) => canonicalJson(v)).join(',')}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
}

export const sha256Hex = (text: string): string => createHash('sha256').update(text, 'utf8').digest('hex');

export const checksumMethod =
  'sha256 (hex) of the canonical JSON of {"case", "inputs", "results"} of this export: object keys sorted by code point at every level, no whitespace, numbers as JSON.stringify writes them';
