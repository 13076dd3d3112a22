/**
 * The session and two-step tokens are HS256 JWTs (RFC 7519) keyed by the secret's UTF-8 bytes:
 * checked against jsonwebtoken given the secret as a plain string (its documented use), both
 * ways, so the key object made once in server/lib/session.ts signs and verifies the same tokens.
 */
import { describe, expect, it } from 'vitest';
import jwt from 'jsonwebtoken';
import {
  signSession,
  signTwoStepToken,
  verifySession,
  verifyTwoStepToken,
} from '../../../server/lib/session';

// Non-ASCII on purpose: the key is the secret's UTF-8 bytes, as jsonwebtoken takes a string.
const secret = 'test-secret-ümlaut-0123456789-0123456789-0123456789';
const claims = { sub: 'user-1', sid: 'session-1' };

describe('session tokens', () => {
  it('verify with jsonwebtoken given the secret as a string', () => {
    const token = signSession(secret, claims, 60);
    expect(jwt.verify(token, secret, { algorithms: ['HS256'] })).toMatchObject(claims);
    expect(() => jwt.verify(token, `${secret}x`, { algorithms: ['HS256'] })).toThrow(
      'invalid signature',
    );
  });

  it("accept jsonwebtoken's tokens of the same secret and refuse another secret's", () => {
    expect(verifySession(secret, jwt.sign(claims, secret))).toEqual(claims);
    expect(verifySession(secret, jwt.sign(claims, `${secret}x`))).toBeNull();
    expect(verifySession(`${secret}x`, signSession(secret, claims, 60))).toBeNull();
  });
});

describe('two-step tokens', () => {
  it('round-trip through jsonwebtoken with the secret as a string', () => {
    const token = signTwoStepToken(secret, 'user-1');
    expect(jwt.verify(token, secret, { audience: 'choicewright:two-step' })).toMatchObject({
      sub: 'user-1',
    });
    const theirs = jwt.sign({ sub: 'user-2' }, secret, { audience: 'choicewright:two-step' });
    expect(verifyTwoStepToken(secret, theirs)).toBe('user-2');
    expect(verifyTwoStepToken(`${secret}x`, theirs)).toBeNull();
  });
});
