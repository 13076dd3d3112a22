/**
 * Rate limits counted in PostgreSQL: shared by every API instance on the database, per address
 * (through TRUST_PROXY), per account, per personal link and per respondent session — and one
 * client over its limit never locks out another.
 */
import { describe, expect, it } from 'vitest';
import supertest from 'supertest';
import { randomBytes } from 'node:crypto';
import { createApp } from '../../../server/app';
import { createTestApp, useTestApp, type TestApp } from '../../support/test-app';
import { signUpOwner, uniqueEmail } from '../../support/factories';

const t = useTestApp({
  AUTH_RATE_LIMIT: '4',
  ACCOUNT_SIGN_IN_LIMIT: '3',
  RESPONDENT_START_RATE_LIMIT: '1000',
  RESPONDENT_SESSION_RATE_LIMIT: '5',
  TRUST_PROXY: 'loopback',
});

// A fresh client address per call, from the IPv6 documentation prefix (RFC 3849). The limiter
// counts IPv6 clients per /56, so the random bits sit inside the first 56; with only 250 IPv4
// test addresses a call now and then hit one that an earlier test had used up.
const address = () =>
  `2001:db8:${randomBytes(3)
    .toString('hex')
    .replace(/^(.{4})/, '$1:')}00::1`;
const wrongSignIn = (app: TestApp['app'], email: string, from: string) =>
  supertest(app)
    .post('/api/auth/sign-in')
    .set('Origin', t.deps.env.APP_URL)
    .set('X-Forwarded-For', from)
    .send({ email, password: 'not the password' });

describe('per-address limits', () => {
  it('are shared by two API instances on the same database', async () => {
    const second = createApp(t.deps);
    const from = address();
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++)
      statuses.push((await wrongSignIn(i % 2 ? second : t.app, uniqueEmail(), from)).status);
    expect(statuses).toEqual([401, 401, 401, 401, 429, 429]);
  });

  it('count each client behind a trusted proxy apart (X-Forwarded-For)', async () => {
    const busy = address();
    for (let i = 0; i < 5; i++) await wrongSignIn(t.app, uniqueEmail(), busy);
    expect((await wrongSignIn(t.app, uniqueEmail(), busy)).status).toBe(429);
    expect((await wrongSignIn(t.app, uniqueEmail(), '198.51.100.7')).status).toBe(401);
  });

  it('ignore X-Forwarded-For when TRUST_PROXY=false: everyone behind it is one client', async () => {
    const direct = await createTestApp({ AUTH_RATE_LIMIT: '3', TRUST_PROXY: 'false' });
    try {
      const call = (from: string) =>
        supertest(direct.app)
          .post('/api/auth/forgot-password')
          .set('X-Forwarded-For', from)
          .send({ email: uniqueEmail() });
      const statuses = [];
      for (let i = 0; i < 4; i++) statuses.push((await call(address())).status);
      expect(statuses).toEqual([202, 202, 202, 429]);
    } finally {
      await direct.close();
    }
  });

  it('answer 429 in the one error shape', async () => {
    const from = address();
    let res = await wrongSignIn(t.app, uniqueEmail(), from);
    while (res.status !== 429) res = await wrongSignIn(t.app, uniqueEmail(), from);
    expect(res.body).toEqual({ error: { code: 'rate_limited', message: expect.any(String) } });
    expect(res.headers['ratelimit-policy']).toBeDefined();
  });
});

describe('per-account sign-in limit', () => {
  it('stops guessing one password from many addresses, and leaves other accounts alone', async () => {
    const victim = await signUpOwner(t);
    const statuses = [];
    for (let i = 0; i < 4; i++)
      statuses.push((await wrongSignIn(t.app, victim.user.email, address())).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
    const other = await signUpOwner(t);
    expect((await wrongSignIn(t.app, other.user.email, address())).status).toBe(401);
  });
});

describe('respondent limits', () => {
  const answer = (token: string) =>
    supertest(t.app)
      .get('/api/r/AbCdEfGh12/session')
      .set('X-Respondent-Token', token)
      .set('X-Forwarded-For', '192.0.2.10');

  it('count per session token: one runaway session does not stop another on the same address', async () => {
    const noisy = randomBytes(24).toString('base64url');
    const statuses = [];
    for (let i = 0; i < 6; i++) statuses.push((await answer(noisy)).status);
    expect(statuses.slice(0, 5).every((s) => s !== 429)).toBe(true);
    expect(statuses[5]).toBe(429);
    const calm = randomBytes(24).toString('base64url');
    expect((await answer(calm)).status).not.toBe(429);
  });

  it('write nothing to the shared counters while a session stays far below its limit', async () => {
    const roomy = await createTestApp({ RESPONDENT_SESSION_RATE_LIMIT: '600' });
    try {
      const written = async () =>
        (
          await roomy.deps.db.execute<{ n: number }>(
            "select count(*)::int as n from rate_limit_counters where key like 'respondent:session:%'" as never,
          )
        ).rows[0].n;
      const token = randomBytes(24).toString('base64url');
      for (let i = 0; i < 20; i++)
        await supertest(roomy.app)
          .get('/api/r/AbCdEfGh12/session')
          .set('X-Respondent-Token', token);
      expect(await written()).toBe(0);
    } finally {
      await roomy.close();
    }
  });

  it('count per session token across two API instances, refusing by the limit plus one budget', async () => {
    const second = createApp(t.deps);
    const token = randomBytes(24).toString('base64url');
    const statuses: number[] = [];
    for (let i = 0; i < 8; i++)
      statuses.push(
        (
          await supertest(i % 2 ? second : t.app)
            .get('/api/r/AbCdEfGh12/session')
            .set('X-Respondent-Token', token)
        ).status,
      );
    // Limit 5, a local budget of ⌊5/4⌋ = 1 hit per instance: refused from the 7th hit at the latest.
    const firstRefused = statuses.indexOf(429);
    expect(firstRefused).toBeGreaterThanOrEqual(5);
    expect(firstRefused).toBeLessThanOrEqual(6);
    expect(statuses.slice(firstRefused).every((s) => s === 429)).toBe(true);
  });

  it('count session starts per personal link token', async () => {
    const start = (inv: string) =>
      supertest(t.app)
        .post('/api/r/AbCdEfGh12/sessions')
        .set('X-Forwarded-For', address())
        .send({ params: { inv } });
    const link = randomBytes(16).toString('base64url');
    const statuses = [];
    for (let i = 0; i < 31; i++) statuses.push((await start(link)).status);
    expect(statuses.filter((s) => s === 429)).toHaveLength(1);
    expect((await start(randomBytes(16).toString('base64url'))).status).not.toBe(429);
  });

  it('never store a token or an address in the counters table', async () => {
    const { rows } = await t.deps.db.execute<{ key: string }>(
      'select key from rate_limit_counters' as never,
    );
    expect(rows.length).toBeGreaterThan(0);
    for (const { key } of rows) expect(key).not.toMatch(/203\.0\.113|192\.0\.2|@example/);
  });
});
