import { createHash, randomBytes } from 'node:crypto';

/** A random single-use link token (32 bytes, base64url) and the SHA-256 the database keeps. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

/** SHA-256 of a token, hex: a stolen database copy cannot be turned back into working links. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
