/**
 * Database faults, fast versions of what bench:faults does to a whole deployment: the app
 * reaches its own test database through a TCP proxy this file controls, so "PostgreSQL
 * restarts" cut every connection without touching the shared cluster.
 */
import { describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { answers, respondents } from '../../../db/schema/fieldwork';
import { teams } from '../../../db/schema/accounts';
import { isDatabaseUnavailable } from '../../../server/lib/db-errors';
import { answerFor, insertStudy } from '../routes/respond-fixtures';

const t = useTestApp({}, { signIn: 'owner', faultProxy: true });

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function startRespondent() {
  const study = await insertStudy(t, t.teamId);
  await t.owner.post(`/api/teams/${t.teamId}/studies/${study.id}/lifecycle/go-live`).expect(200);
  const res = await t.request().post(`/api/r/${study.publicId}/sessions`).send({}).expect(201);
  return { publicId: study.publicId, session: res.body };
}

function post(publicId: string, token: string, body: object) {
  return t.request().post(`/api/r/${publicId}/answers`).set('x-respondent-token', token).send(body);
}

describe('pool errors', () => {
  it('when every backend is terminated (pg_terminate_backend), the next requests succeed without a restart', async () => {
    await Promise.all([1, 2, 3].map(() => t.request().get('/api/health').expect(200)));
    expect(t.proxy.open).toBeGreaterThan(0);
    await t.testDb.db.execute(sql`
      select pg_terminate_backend(pid) from pg_stat_activity
       where datname = current_database() and pid <> pg_backend_pid()`);
    await sleep(200);
    const health = await t.request().get('/api/health');
    expect(health.body).toEqual({ status: 'ok', database: 'ok' });
    const { session } = await startRespondent();
    expect(session.sessionToken).toBeTruthy();
  });

  it('when a connection dies between two statements of a transaction, nothing is committed and the pool recovers', async () => {
    const name = `Fault team ${Date.now()}`;
    const failed = await t.deps.db
      .transaction(async (tx) => {
        await tx.insert(teams).values({ name });
        t.proxy.cut();
        await sleep(100);
        await tx.select().from(teams);
      })
      .then(
        () => null,
        (err: unknown) => err,
      );
    expect(failed).toBeInstanceOf(Error);
    expect(isDatabaseUnavailable(failed)).toBe(true);
    expect(await t.testDb.db.select().from(teams).where(eq(teams.name, name))).toHaveLength(0);
    const [{ one }] = (await t.deps.db.execute<{ one: number }>(sql`select 1 as one`)).rows;
    expect(one).toBe(1);
  });
});

describe('PostgreSQL restart while respondents answer', () => {
  it('answers 503 with Retry-After while the database is down, then stores the retried answer exactly once', async () => {
    const { publicId, session } = await startRespondent();
    await post(publicId, session.sessionToken, answerFor(session.screens[0])).expect(201);
    const next = answerFor(session.screens[1]);

    t.proxy.refuse();
    const down = await post(publicId, session.sessionToken, next);
    expect(down.status).toBe(503);
    expect(down.headers['retry-after']).toBe('2');
    expect(down.body.error.code).toBe('service_unavailable');
    const health = await t.request().get('/api/health');
    expect(health.status).toBe(503);

    t.proxy.resume();
    await post(publicId, session.sessionToken, next).expect(201);
    const replay = await post(publicId, session.sessionToken, next).expect(200);
    expect(replay.body.replay).toBe(true);

    const [r] = await t.testDb.db
      .select({ id: respondents.id })
      .from(respondents)
      .where(eq(respondents.sessionToken, session.sessionToken));
    const stored = await t.testDb.db
      .select({ screenKey: answers.screenKey })
      .from(answers)
      .where(eq(answers.respondentId, r.id));
    expect(stored.map((a) => a.screenKey).sort()).toEqual(
      [session.screens[0].key, session.screens[1].key].sort(),
    );
  });
});
