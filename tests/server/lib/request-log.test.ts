/**
 * Log hygiene: every kind of secret the product moves — session cookies, bearer headers,
 * respondent session tokens, personal-link, reset, unsubscribe and invitation tokens, file keys,
 * query parameters, and SQL parameters of a failed query — is sent through the real app, and
 * none of them may appear anywhere in what the logger writes.
 */
import { describe, expect, it } from 'vitest';
import { Writable } from 'node:stream';
import { randomBytes } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { signUpOwner } from '../../support/factories';
import { insertStudy } from '../routes/respond-fixtures';
import { RESPONDENT_LOG_SAMPLE } from '../../../server/lib/request-log';

const lines: string[] = [];
const sink = new Writable({
  write(chunk, _enc, done) {
    lines.push(String(chunk));
    done();
  },
});
const secret = (label: string) => `${label}${randomBytes(18).toString('base64url')}`;
const logText = () => lines.join('');

const t = useTestApp({ LOG_LEVEL: 'info' }, { logDestination: sink });

describe('the access log', () => {
  it('never contains a token, whatever carries it', async () => {
    const owner = await signUpOwner(t);
    const publicId = 'AbCdEfGh12';
    const secrets: Record<string, string> = {
      bearer: secret('bearer'),
      respondent: secret('resp'),
      invitee: secret('inv'),
      reset: secret('reset'),
      unsubscribe: secret('unsub'),
      invitation: secret('invite'),
      fileKey: secret('file'),
      query: secret('query'),
      cookie: secret('cookie'),
    };
    const anon = t.request();
    await owner.agent.get('/api/auth/me').expect(200);
    await anon.get('/api/auth/me').set('Authorization', `Bearer ${secrets.bearer}`);
    await anon.get('/api/auth/me').set('Cookie', `cw_session=${secrets.cookie}`);
    await anon.get(`/api/r/${publicId}/session`).set('X-Respondent-Token', secrets.respondent);
    await anon.get(`/api/r/${publicId}?inv=${secrets.invitee}`);
    await anon
      .post('/api/auth/reset-password')
      .send({ token: secrets.reset, password: 'x'.repeat(12) });
    await anon.get(`/reset-password?token=${secrets.reset}`);
    await anon.get(`/api/unsubscribe/${secrets.unsubscribe}`);
    await anon.post(`/api/unsubscribe/${secrets.unsubscribe}`);
    await anon.get(`/api/invitations/${secrets.invitation}`);
    await anon.get(`/api/files/${secrets.fileKey}.png`);
    await owner.agent.get(`/api/teams/${owner.teamId}/studies?token=${secrets.query}`);
    await anon.get(`/api/no-such-route/${secrets.query}?token=${secrets.query}`);
    await new Promise((r) => setImmediate(r));

    const text = logText();
    expect(lines.length).toBeGreaterThan(10);
    for (const [kind, value] of Object.entries(secrets))
      expect(text.includes(value), `${kind} token in the log`).toBe(false);
    // The signed session cookie the app itself set is nowhere either.
    const setCookie = (
      await t.request().post('/api/auth/sign-in').send({
        email: owner.user.email,
        password: 'correct horse battery',
      })
    ).headers['set-cookie'] as unknown as string[];
    const jwt = setCookie[0]!.split(';')[0]!.split('=')[1]!;
    await new Promise((r) => setImmediate(r));
    expect(logText().includes(jwt)).toBe(false);
    // What it does say: the route patterns.
    expect(text).toContain('/api/unsubscribe/:token');
    expect(text).toContain('/api/invitations/:token');
    expect(text).toContain('/api/r/:publicId/session');
    expect(text).toContain('/api/teams/:teamId/studies');
  });

  it('logs a failed query by its codes, not its parameters', async () => {
    const value = secret('param');
    const err = await t.deps.db.execute(sql`select ${value}::int`).catch((e: unknown) => e);
    t.deps.logger.error({ err }, 'query failed');
    await new Promise((r) => setImmediate(r));
    expect(logText()).toContain('Database query failed');
    expect(logText()).toContain('22P02');
    expect(logText().includes(value)).toBe(false);
  });
});

describe('the access log under a panel launch', () => {
  const linesOf = (route: string, from: number) =>
    lines
      .slice(from)
      .map(
        (l) =>
          JSON.parse(l) as { req?: { route: string }; res?: { statusCode: number } } & Record<
            string,
            unknown
          >,
      )
      .filter((l) => l.req?.route === route);

  it('keeps one successful respondent request in RESPONDENT_LOG_SAMPLE, every failed one, and every other request', async () => {
    const owner = await signUpOwner(t);
    const study = await insertStudy(t, owner.teamId);
    await owner.agent
      .post(`/api/teams/${owner.teamId}/studies/${study.id}/lifecycle/go-live`)
      .expect(200);
    const from = lines.length;
    for (let i = 0; i < 2 * RESPONDENT_LOG_SAMPLE; i++)
      await t.request().get(`/api/r/${study.publicId}`).expect(200);
    for (let i = 0; i < 3; i++) await t.request().get('/api/r/NoSuchLink123').expect(404);
    for (let i = 0; i < 3; i++) await owner.agent.get('/api/auth/me').expect(200);
    await new Promise((r) => setImmediate(r));

    const link = linesOf('/api/r/:publicId', from);
    const ok = link.filter((l) => l.res?.statusCode === 200);
    expect(ok).toHaveLength(2);
    for (const l of ok) expect(l).toMatchObject({ sampledOneIn: RESPONDENT_LOG_SAMPLE, level: 30 });
    const missing = link.filter((l) => l.res?.statusCode === 404);
    expect(missing).toHaveLength(3);
    for (const l of missing) expect(l).toMatchObject({ level: 40 });
    expect(missing[0]).not.toHaveProperty('sampledOneIn');
    expect(linesOf('/api/auth/me', from)).toHaveLength(3);
  });
});
