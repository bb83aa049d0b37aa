import { createHash, randomBytes } from 'node:crypto';

/** A URL-safe random token: 32 bytes = 256 bits (feeds, invitations and resets need at least 128). */
export function newToken(): string {
  return randomBytes(32).toString('base64url');
}

/** Tokens are stored only as their SHA-256, hex; a leaked table does not give working links. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}
