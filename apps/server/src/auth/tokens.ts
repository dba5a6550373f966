import { createHash, randomBytes } from 'node:crypto';

/** SHA-256 (hex) of a link token: what the database stores instead of the token. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** A new single-use link token: 32 random bytes in base64url, and the hash to store. */
export function newLinkToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}
