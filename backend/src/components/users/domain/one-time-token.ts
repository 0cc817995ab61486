import { createHash, randomBytes } from 'node:crypto';

/** A random URL-safe token and the SHA-256 that is stored in its place. */
export function newOneTimeToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
