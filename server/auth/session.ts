/**
 * Sessions are a signed JWT in an httpOnly, SameSite=Lax cookie. The token carries the user's
 * token version: raising it (sign-out, password change) ends every earlier session.
 */
import { createSecretKey, type KeyObject } from 'node:crypto';
import type { Request, Response } from 'express';
import jwt from 'jsonwebtoken';

export const SESSION_COOKIE = 'byrecast_session';
/** Short lifetime; a request in the second half of it renews the cookie. */
export const SESSION_LIFETIME_SECONDS = 2 * 60 * 60;

export interface SessionClaims {
  sub: string;
  ver: number;
  iat: number;
  exp: number;
}

const keys = new Map<string, KeyObject>();

/**
 * The secret as a KeyObject, made once: given a string, jsonwebtoken first tries it as a PEM
 * public or private key and catches the failure on every call (about a millisecond a request).
 */
function keyOf(secret: string): KeyObject {
  let key = keys.get(secret);
  if (!key) {
    key = createSecretKey(Buffer.from(secret, 'utf8'));
    keys.set(secret, key);
  }
  return key;
}

export function issueSession(res: Response, req: Request, secret: string, userId: number, tokenVersion: number): void {
  const token = jwt.sign({ ver: tokenVersion }, keyOf(secret), {
    subject: String(userId),
    expiresIn: SESSION_LIFETIME_SECONDS,
    algorithm: 'HS256',
  });
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: req.secure,
    path: '/',
    maxAge: SESSION_LIFETIME_SECONDS * 1000,
  });
}

export function clearSession(res: Response): void {
  res.clearCookie(SESSION_COOKIE, { path: '/' });
}

/** The verified claims, or null for a missing, expired, altered or foreign-signed token. */
export function readSession(req: Request, secret: string): SessionClaims | null {
  const token = (req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE];
  if (!token) return null;
  try {
    const claims = jwt.verify(token, keyOf(secret), { algorithms: ['HS256'] });
    if (typeof claims === 'string' || typeof claims.sub !== 'string' || typeof claims.ver !== 'number') return null;
    return { sub: claims.sub, ver: claims.ver, iat: claims.iat ?? 0, exp: claims.exp ?? 0 };
  } catch {
    return null;
  }
}
