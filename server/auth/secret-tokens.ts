// Random single-use and long-lived secrets. Only their SHA-256 is stored: a leaked database then
// holds nothing that signs anyone in.
import { createHash, randomBytes } from 'node:crypto';

export function sha256Hex(secret: string): string {
  return createHash('sha256').update(secret, 'utf8').digest('hex');
}

/** 32 random bytes, base64url, with an optional prefix that tells what kind of secret it is. */
export function newSecret(prefix = ''): { secret: string; hash: string } {
  const secret = prefix + randomBytes(32).toString('base64url');
  return { secret, hash: sha256Hex(secret) };
}
