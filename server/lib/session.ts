/**
 * Sign-in sessions: a JWT in an httpOnly, SameSite=Lax cookie naming a server-side session row
 * (db/schema/accounts.ts, user_sessions). The token alone proves nothing: the row must still be
 * open — not revoked, not idle past the idle timeout, not past its absolute end.
 */
import jwt from 'jsonwebtoken';
import type { CookieOptions } from 'express';

export const SESSION_COOKIE = 'cw_session';

export type SessionClaims = { sub: string; sid: string };

export function signSession(secret: string, claims: SessionClaims, ttlSeconds: number): string {
  return jwt.sign(claims, secret, { expiresIn: ttlSeconds, algorithm: 'HS256' });
}

export function verifySession(secret: string, token: string): SessionClaims | null {
  try {
    const p = jwt.verify(token, secret, { algorithms: ['HS256'] });
    if (typeof p === 'object' && typeof p.sub === 'string' && typeof p.sid === 'string') {
      return { sub: p.sub, sid: p.sid };
    }
    return null;
  } catch {
    return null;
  }
}

export function sessionCookieOptions(secure: boolean, ttlSeconds: number): CookieOptions {
  return { httpOnly: true, sameSite: 'lax', secure, path: '/', maxAge: ttlSeconds * 1000 };
}
