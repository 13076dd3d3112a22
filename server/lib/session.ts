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

/**
 * Between a right password and the second step of two-step sign-in, the browser holds a short
 * token that names the user and can only finish that sign-in: a different audience and no
 * session id, so it never passes as a session.
 */
export const TWO_STEP_COOKIE = 'cw_two_step';
export const TWO_STEP_TTL_SECONDS = 5 * 60;
const TWO_STEP_AUDIENCE = 'choicewright:two-step';

export function signTwoStepToken(secret: string, userId: string): string {
  return jwt.sign({ sub: userId }, secret, {
    expiresIn: TWO_STEP_TTL_SECONDS,
    algorithm: 'HS256',
    audience: TWO_STEP_AUDIENCE,
  });
}

export function verifyTwoStepToken(secret: string, token: unknown): string | null {
  if (typeof token !== 'string') return null;
  try {
    const p = jwt.verify(token, secret, { algorithms: ['HS256'], audience: TWO_STEP_AUDIENCE });
    return typeof p === 'object' && typeof p.sub === 'string' && !('sid' in p) ? p.sub : null;
  } catch {
    return null;
  }
}

export function twoStepCookieOptions(secure: boolean): CookieOptions {
  return {
    httpOnly: true,
    sameSite: 'strict',
    secure,
    path: '/api/auth',
    maxAge: TWO_STEP_TTL_SECONDS * 1000,
  };
}
