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
import { fastAnswerBatcherOf } from '../../../server/services/answer-fast-path';

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

  it('when the connections are cut while answers of many respondents are stored together, each is stored exactly once after its retries', async () => {
    const study = await insertStudy(t, t.teamId);
    await t.owner.post(`/api/teams/${t.teamId}/studies/${study.id}/lifecycle/go-live`).expect(200);
    const people = await Promise.all(
      Array.from({ length: 24 }, async () => {
        const res = await t.request().post(`/api/r/${study.publicId}/sessions`).send({});
        expect(res.status).toBe(201);
        return res.body as { sessionToken: string; screens: Parameters<typeof answerFor>[0][] };
      }),
    );
    for (const p of people)
      await post(study.publicId, p.sessionToken, answerFor(p.screens[0])).expect(201);
    const second = people.map((p) => ({ p, body: answerFor(p.screens[1]) }));
    const batcher = fastAnswerBatcherOf(t.deps.db);
    const gatheredBefore = batcher.gathered;

    // All 24 at once: two go alone, the others wait and go together. While that batch is in
    // flight the database goes away (connections cut, new ones refused), then comes back.
    const first = Promise.all(
      second.map(({ p, body }) => post(study.publicId, p.sessionToken, body)),
    );
    while (batcher.gathered === gatheredBefore) await new Promise((r) => setImmediate(r));
    t.proxy.refuse();
    const firstStatuses = (await first).map((r) => r.status);
    t.proxy.resume();
    expect(firstStatuses.every((s) => s === 201 || s === 503)).toBe(true);
    expect(firstStatuses).toContain(503);

    // The phones send again until they get a receipt: a stored answer comes back as a replay.
    const final = [];
    for (const { p, body } of second) {
      let res = await post(study.publicId, p.sessionToken, body);
      for (let i = 0; i < 5 && res.status === 503; i++) {
        await sleep(100);
        res = await post(study.publicId, p.sessionToken, body);
      }
      final.push(res.status === 201 || (res.status === 200 && res.body.replay === true));
    }
    expect(final.every(Boolean)).toBe(true);

    const stored = await t.testDb.db
      .select({ clientId: answers.clientId })
      .from(answers)
      .where(eq(answers.studyId, study.id));
    // Two answers per respondent, and each second answer once.
    expect(stored).toHaveLength(2 * people.length);
    const ids = stored.map((a) => a.clientId);
    expect(second.filter((x) => ids.filter((id) => id === x.body.clientId).length !== 1)).toEqual(
      [],
    );
  });
});
