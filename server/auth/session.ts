/**
 * Sessions are a signed JWT in an httpOnly, SameSite=Lax cookie. The token carries the user's
 * token version: raising it (sign-out, password change) ends every earlier session.
 */
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

export function issueSession(res: Response, req: Request, secret: string, userId: number, tokenVersion: number): void {
  const token = jwt.sign({ ver: tokenVersion }, secret, {
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
    const claims = jwt.verify(token, secret, { algorithms: ['HS256'] });
    if (typeof claims === 'string' || typeof claims.sub !== 'string' || typeof claims.ver !== 'number') return null;
    return { sub: claims.sub, ver: claims.ver, iat: claims.iat ?? 0, exp: claims.exp ?? 0 };
  } catch {
    return null;
  }
}
