/**
 * Sign-in sessions: a JWT in an httpOnly, SameSite=Lax cookie naming a server-side session row
 * (db/schema/accounts.ts, user_sessions). The token alone proves nothing: the row must still be
 * open — not revoked, not idle past the idle timeout, not past its absolute end.
 */
import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { CookieOptions } from 'express';
import { boundedMemo } from './bounded-memo';

/**
 * The HMAC key of a secret, made once: given the secret as a string, jsonwebtoken first tries
 * to read it as a PEM public or private key, which throws, on every sign and verify (about half
 * a millisecond of CPU per signed-in request). A secret key object of the same bytes (UTF-8, as
 * jsonwebtoken would take them) signs and verifies the same tokens. The secret comes from the
 * settings, so the memo holds one entry in practice.
 */
const keyOf: (secret: string) => KeyObject = boundedMemo(
  (secret) => createSecretKey(Buffer.from(secret, 'utf8')),
  4,
);

export const SESSION_COOKIE = 'cw_session';

export type SessionClaims = { sub: string; sid: string };

export function signSession(secret: string, claims: SessionClaims, ttlSeconds: number): string {
  return jwt.sign(claims, keyOf(secret), { expiresIn: ttlSeconds, algorithm: 'HS256' });
}

export function verifySession(secret: string, token: string): SessionClaims | null {
  try {
    const p = jwt.verify(token, keyOf(secret), { algorithms: ['HS256'] });
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
  return jwt.sign({ sub: userId }, keyOf(secret), {
    expiresIn: TWO_STEP_TTL_SECONDS,
    algorithm: 'HS256',
    audience: TWO_STEP_AUDIENCE,
  });
}

export function verifyTwoStepToken(secret: string, token: unknown): string | null {
  if (typeof token !== 'string') return null;
  try {
    const p = jwt.verify(token, keyOf(secret), {
      algorithms: ['HS256'],
      audience: TWO_STEP_AUDIENCE,
    });
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
