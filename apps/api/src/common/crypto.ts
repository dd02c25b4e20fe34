import { createHash, randomBytes } from 'node:crypto';

/** A 256-bit random token for links and cookies, URL-safe. */
export function randomToken(): string {
  return randomBytes(32).toString('base64url');
}

/** SHA-256 hex digest: what we store instead of the token itself. */
export function sha256(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex');
}
