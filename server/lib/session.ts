/**
 * Sign-in sessions: a JWT in an httpOnly, SameSite=Lax cookie. The token carries only the user
 * id and a version stamp so a password change signs out older sessions.
 */
import jwt from 'jsonwebtoken';
import type { CookieOptions } from 'express';

export const SESSION_COOKIE = 'cw_session';
export const SESSION_TTL_SECONDS = 60 * 60 * 24 * 7;

export type SessionClaims = { sub: string; pwd: string };

export function signSession(secret: string, claims: SessionClaims): string {
  return jwt.sign(claims, secret, { expiresIn: SESSION_TTL_SECONDS, algorithm: 'HS256' });
}

export function verifySession(secret: string, token: string): SessionClaims | null {
  try {
    const p = jwt.verify(token, secret, { algorithms: ['HS256'] });
    if (typeof p === 'object' && typeof p.sub === 'string' && typeof p.pwd === 'string') {
      return { sub: p.sub, pwd: p.pwd };
    }
    return null;
  } catch {
    return null;
  }
}

export function sessionCookieOptions(secure: boolean): CookieOptions {
  return { httpOnly: true, sameSite: 'lax', secure, path: '/', maxAge: SESSION_TTL_SECONDS * 1000 };
}

/** A short stamp of the password hash: changes whenever the password does. */
export function passwordStamp(passwordHash: string): string {
  return passwordHash.slice(-10);
}
