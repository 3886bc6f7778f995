/**
 * Single-use tokens sent by e-mail (invitations, password resets). The raw token exists only in
 * the e-mail; the database keeps its sha-256, so reading the table gives no working link.
 */
import { createHash, randomBytes } from 'node:crypto';

/** sha-256 of a token, hex (64 characters), the form stored in the database. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** A new random token (32 bytes, base64url, 43 characters) and its stored hash. */
export function newEmailToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}
