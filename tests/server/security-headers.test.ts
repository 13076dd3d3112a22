/**
 * HTTP security headers on every kind of response: a public API route, a refused API call, a
 * respondent route and a sign-in failure. Expected values follow OWASP ASVS 4.0.3 §14.4 (HTTP
 * security headers: 14.4.3 a Content-Security-Policy, 14.4.4 nosniff, 14.4.5
 * Strict-Transport-Security, 14.4.6 a Referrer-Policy, 14.4.7 framing only by the app itself;
 * section numbers from memory) as helmet sets them, with the app's own CSP (server/app.ts).
 */
import { describe, expect, it } from 'vitest';
import type { Response } from 'supertest';
import { useTestApp } from '../support/test-app';

const t = useTestApp();

function expectSecurityHeaders(res: Response) {
  const h = res.headers;
  const csp = Object.fromEntries(
    String(h['content-security-policy'])
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .map(([name, ...values]) => [name, values.join(' ')]),
  );
  expect(csp['default-src']).toBe("'self'");
  expect(csp['script-src']).toBe("'self'");
  expect(csp['object-src']).toBe("'none'");
  expect(csp['base-uri']).toBe("'self'");
  expect(csp['frame-ancestors']).toBe("'self'");
  expect(csp['connect-src']).toBe("'self'");
  expect(h['x-content-type-options']).toBe('nosniff');
  expect(h['strict-transport-security']).toMatch(/max-age=\d{8,}/);
  expect(h['referrer-policy']).toBe('no-referrer');
  expect(h['x-frame-options']).toBe('SAMEORIGIN');
  expect(h['cross-origin-opener-policy']).toBe('same-origin');
  expect(h['x-powered-by']).toBeUndefined();
}

describe('security headers', () => {
  it('are sent on a public route', async () => {
    expectSecurityHeaders(await t.request().get('/api/health').expect(200));
  });

  it('are sent on a refused call and an unknown route', async () => {
    expectSecurityHeaders(await t.request().get('/api/teams').expect(401));
    expectSecurityHeaders(await t.request().get('/api/no-such-route').expect(404));
  });

  it('are sent on a failed sign-in and on a respondent link that does not exist', async () => {
    expectSecurityHeaders(
      await t
        .request()
        .post('/api/auth/sign-in')
        .set('Origin', t.deps.env.APP_URL)
        .send({ email: 'nobody@example.org', password: 'not the password' })
        .expect(401),
    );
    expectSecurityHeaders(await t.request().get('/api/r/unknown-link/study').expect(404));
  });
});
