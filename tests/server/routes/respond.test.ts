import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import type supertest from 'supertest';
import { createTestApp, useTestApp } from '../../support/test-app';
import { signUpOwner } from '../../support/factories';
import { answers, respondents } from '../../../db/schema/fieldwork';
import { answerFor, fullQuestionnaire, insertInvitee, insertStudy } from './respond-fixtures';
import { RESPONDENT_COMPRESSION_THRESHOLD } from '../../../server/app';

const t = useTestApp({}, { signIn: 'owner' });

const TOKEN = 'x-respondent-token';
const lifecycleUrl = (studyId: string, action: string) =>
  `/api/teams/${t.teamId}/studies/${studyId}/lifecycle/${action}`;

async function liveStudy(opts: Parameters<typeof insertStudy>[2] = {}) {
  const study = await insertStudy(t, t.teamId, opts);
  await t.owner.post(lifecycleUrl(study.id, 'go-live')).expect(200);
  return study;
}

function start(publicId: string, body: object = {}) {
  return t.request().post(`/api/r/${publicId}/sessions`).send(body);
}

function answer(publicId: string, token: string, body: object) {
  return t.request().post(`/api/r/${publicId}/answers`).set(TOKEN, token).send(body);
}

async function rowsOf(respondentToken: string) {
  const [r] = await t.deps.db
    .select()
    .from(respondents)
    .where(eq(respondents.sessionToken, respondentToken));
  const rows = await t.deps.db.select().from(answers).where(eq(answers.respondentId, r.id));
  return { respondent: r, answers: rows };
}

type StartedSession = { sessionToken: string; screens: never[] };

/** Sends the answer `answerFor` gives for the session's screen number `index`. */
function answerScreen(publicId: string, session: StartedSession, index: number) {
  return answer(publicId, session.sessionToken, answerFor(session.screens[index]));
}

/** Answers screens in order until `stopAfter` screens are answered (all by default). */
async function walk(publicId: string, session: StartedSession, stopAfter = Infinity) {
  let last: supertest.Response | null = null;
  for (const screen of session.screens.slice(0, stopAfter)) {
    last = await answer(publicId, session.sessionToken, answerFor(screen));
    expect(last.status).toBe(201);
  }
  return last!;
}

describe('GET /api/r/:publicId', () => {
  it('when the study is live, gives its public title (not the internal name) and says it is open', async () => {
    const s = await liveStudy();
    const res = await t.request().get(`/api/r/${s.publicId}`).expect(200);
    expect(res.body).toEqual({
      state: 'live',
      studyName: 'Water services 2026',
      redirectUrl: null,
      page: null,
    });
  });

  it('when the study is a draft, says it is not open and hides its name', async () => {
    const s = await insertStudy(t, t.teamId);
    const res = await t.request().get(`/api/r/${s.publicId}`).expect(200);
    expect(res.body).toEqual({
      state: 'not_open',
      studyName: null,
      redirectUrl: null,
      page: null,
    });
  });

  it('when the link is unknown, returns 404 survey_not_found', async () => {
    const res = await t.request().get('/api/r/nosuchsurvey123').expect(404);
    expect(res.body.error.code).toBe('survey_not_found');
    await t.request().get('/api/r/%27;drop').expect(404);
  });
});

describe('POST /api/r/:publicId/sessions', () => {
  it('starts a session with the whole questionnaire and stores a plan for the least-filled block', async () => {
    const s = await liveStudy();
    const first = (await start(s.publicId).expect(201)).body;
    const second = (await start(s.publicId).expect(201)).body;
    const third = (await start(s.publicId).expect(201)).body;
    const blocks = [];
    for (const x of [first, second, third])
      blocks.push((await rowsOf(x.sessionToken)).respondent.block);
    expect(blocks).toEqual([1, 2, 1]);
    expect(first.sessionToken).toMatch(/^[A-Za-z0-9_-]{32}$/);
    expect(first.status).toBe('in_progress');
    expect(first.answered).toEqual([]);
    // consent, screening, instructions, 2 tasks, 3 background questions
    expect(first.screens.map((x: { kind: string }) => x.kind)).toEqual([
      'consent',
      'question',
      'instructions',
      'task',
      'task',
      'question',
      'question',
      'question',
    ]);
    const task = first.screens[3];
    expect(task.alternatives).toHaveLength(3);
    expect(task.alternatives[2]).toMatchObject({
      index: -1,
      fixed: true,
      label: 'Current service',
    });
  });

  it('when this browser already has a session, resumes the same one', async () => {
    const s = await liveStudy();
    const a = (await start(s.publicId).expect(201)).body;
    const again = (await start(s.publicId, { sessionToken: a.sessionToken }).expect(201)).body;
    expect(again.sessionToken).toBe(a.sessionToken);
    expect(
      await t.deps.db
        .select()
        .from(respondents)
        .where(eq(respondents.sessionToken, a.sessionToken)),
    ).toHaveLength(1);
  });

  it('stores the panel id as external id and resumes personal links by invitee', async () => {
    const s = await liveStudy();
    const panel = (await start(s.publicId, { params: { pid: 'P-77' } }).expect(201)).body;
    expect((await rowsOf(panel.sessionToken)).respondent.externalId).toBe('P-77');

    const inv = await insertInvitee(t, s.id, 'HH-9');
    const viaMail = (await start(s.publicId, { params: { inv: inv.token } }).expect(201)).body;
    const row = (await rowsOf(viaMail.sessionToken)).respondent;
    expect(row.inviteeId).toBe(inv.id);
    expect(row.externalId).toBe('HH-9');
    const otherDevice = (await start(s.publicId, { params: { inv: inv.token } }).expect(201)).body;
    expect(otherDevice.sessionToken).toBe(viaMail.sessionToken);
  });

  it('when the personal link token is unknown, returns 404 and creates nothing', async () => {
    const s = await liveStudy();
    const res = await start(s.publicId, { params: { inv: 'not-a-real-token-123' } }).expect(404);
    expect(res.body.error.code).toBe('invitation_not_found');
    expect(
      await t.deps.db.select().from(respondents).where(eq(respondents.studyId, s.id)),
    ).toHaveLength(0);
  });

  it('when the study is a draft or closed, refuses with a clear code', async () => {
    const draft = await insertStudy(t, t.teamId);
    expect((await start(draft.publicId).expect(409)).body.error.code).toBe('survey_not_open');
    const closed = await liveStudy();
    await t.owner.post(lifecycleUrl(closed.id, 'close')).expect(200);
    expect((await start(closed.publicId).expect(410)).body.error.code).toBe('survey_closed');
  });

  it('when the body is malformed, returns 400 and creates nothing', async () => {
    const s = await liveStudy();
    await start(s.publicId, { sessionToken: 'short' }).expect(400);
    await t
      .request()
      .post(`/api/r/${s.publicId}/sessions`)
      .set('content-type', 'application/json')
      .send('{"x":')
      .expect(400);
    expect(
      await t.deps.db.select().from(respondents).where(eq(respondents.studyId, s.id)),
    ).toHaveLength(0);
  });
});

describe('POST /api/r/:publicId/answers', () => {
  it('walks the whole questionnaire to completion, recording time and on-screen position', async () => {
    const s = await liveStudy({
      settings: { redirects: { complete: 'https://panel.example/done?id={pid}' } },
    });
    const session = (await start(s.publicId, { params: { pid: 'A&B' } }).expect(201)).body;
    const last = await walk(s.publicId, session);
    expect(last.body).toMatchObject({ status: 'completed', nextScreenKey: null, replay: false });
    expect(last.body.redirectUrl).toBe('https://panel.example/done?id=A%26B');
    const { respondent, answers: rows } = await rowsOf(session.sessionToken);
    expect(respondent.status).toBe('completed');
    expect(respondent.durationMs).toBeGreaterThanOrEqual(0);
    expect(rows).toHaveLength(session.screens.length);
    const taskRows = rows.filter((r) => r.taskNumber !== null);
    expect(taskRows).toHaveLength(2);
    for (const r of taskRows) {
      expect(r.chosenPosition).toBe(0);
      expect(r.responseMs).toBe(1500);
      // Position 0 shows the alternative the stored plan put first.
      const plan = respondent.plan as { positions: Record<string, number[]> };
      expect(r.chosenAlternative).toBe(plan.positions[r.screenKey][0]);
    }
  });

  it('when the same client id is sent twice, stores one row and answers the same', async () => {
    const s = await liveStudy();
    const session = (await start(s.publicId).expect(201)).body;
    const body = answerFor(session.screens[0]);
    const a = await answer(s.publicId, session.sessionToken, body).expect(201);
    const b = await answer(s.publicId, session.sessionToken, body).expect(200);
    expect(b.body).toEqual({ ...a.body, replay: true });
    expect((await rowsOf(session.sessionToken)).answers).toHaveLength(1);
  });

  it('when a different answer comes for an answered screen, returns 409 already_answered', async () => {
    const s = await liveStudy();
    const session = (await start(s.publicId).expect(201)).body;
    await answerScreen(s.publicId, session, 0).expect(201);
    const res = await answerScreen(s.publicId, session, 0).expect(409);
    expect(res.body.error.code).toBe('already_answered');
    expect((await rowsOf(session.sessionToken)).answers).toHaveLength(1);
  });

  it('when a screen is skipped, returns 409 out_of_order and stores nothing', async () => {
    const s = await liveStudy();
    const session = (await start(s.publicId).expect(201)).body;
    const res = await answerScreen(s.publicId, session, 2).expect(409);
    expect(res.body.error).toMatchObject({
      code: 'out_of_order',
      fields: [{ path: 'screenKey', message: 'Expected consent' }],
    });
    expect((await rowsOf(session.sessionToken)).answers).toHaveLength(0);
  });

  it('when the body or the value is malformed, returns 400 and stores nothing', async () => {
    const s = await liveStudy();
    const session = (await start(s.publicId).expect(201)).body;
    const tok = session.sessionToken;
    await answer(s.publicId, tok, {
      clientId: 'x',
      screenKey: 'consent',
      value: { kind: 'consent', agreed: true },
      responseMs: 1,
    }).expect(400);
    await answer(s.publicId, tok, {
      ...answerFor(session.screens[0]),
      value: { kind: 'consent', agreed: false },
    }).expect(400);
    const wrongKind = await answer(s.publicId, tok, {
      ...answerFor(session.screens[0]),
      value: { kind: 'ack' },
    }).expect(400);
    expect(wrongKind.body.error.code).toBe('invalid_answer');
    await answer(s.publicId, tok, { ...answerFor(session.screens[0]), responseMs: -5 }).expect(400);
    const unknown = await answer(s.publicId, tok, {
      ...answerFor(session.screens[0]),
      screenKey: 'task:99',
    }).expect(400);
    expect(unknown.body.error.code).toBe('unknown_screen');
    await t
      .request()
      .post(`/api/r/${s.publicId}/answers`)
      .set(TOKEN, tok)
      .set('content-type', 'application/json')
      .send('{')
      .expect(400);
    await walk(s.publicId, session, 3);
    const task = session.screens[3];
    const far = await answer(s.publicId, tok, {
      ...answerFor(task),
      value: { kind: 'choice', position: 3 },
    }).expect(400);
    expect(far.body.error.code).toBe('invalid_answer');
    const age = session.screens.find((x: { key: string }) => x.key === 'q:household_size');
    expect(age).toBeDefined();
    expect((await rowsOf(tok)).answers).toHaveLength(3);
  });

  it('a token reaches only its own session and study', async () => {
    const a = await liveStudy();
    const b = await liveStudy();
    const inA = (await start(a.publicId).expect(201)).body;
    const inB = (await start(b.publicId).expect(201)).body;
    // A's token on B's link, a made-up token, and no token: all 404 and nothing written.
    const cross = await answer(b.publicId, inA.sessionToken, answerFor(inB.screens[0])).expect(404);
    expect(cross.body.error.code).toBe('not_found');
    await answer(a.publicId, 'A'.repeat(32), answerFor(inA.screens[0])).expect(404);
    await t
      .request()
      .post(`/api/r/${a.publicId}/answers`)
      .send(answerFor(inA.screens[0]))
      .expect(404);
    await t.request().get(`/api/r/${b.publicId}/session`).set(TOKEN, inA.sessionToken).expect(404);
    const own = await t
      .request()
      .get(`/api/r/${a.publicId}/session`)
      .set(TOKEN, inA.sessionToken)
      .expect(200);
    expect(own.body.sessionToken).toBe(inA.sessionToken);
    // Resuming with another study's token starts a fresh session instead of reaching it.
    const fresh = (await start(b.publicId, { sessionToken: inA.sessionToken }).expect(201)).body;
    expect(fresh.sessionToken).not.toBe(inA.sessionToken);
    expect((await rowsOf(inA.sessionToken)).answers).toHaveLength(0);
    expect((await rowsOf(inB.sessionToken)).answers).toHaveLength(0);
  });

  it('GET /session resumes at the next unanswered screen', async () => {
    const s = await liveStudy();
    const session = (await start(s.publicId).expect(201)).body;
    await walk(s.publicId, session, 4);
    const res = await t
      .request()
      .get(`/api/r/${s.publicId}/session`)
      .set(TOKEN, session.sessionToken)
      .expect(200);
    expect(res.body.answered).toEqual(
      session.screens.slice(0, 4).map((x: { key: string }) => x.key),
    );
    expect(res.headers['cache-control']).toBe('no-store');
  });

  it('when the respondent has completed, refuses new answers with 409 already_completed', async () => {
    const s = await liveStudy();
    const session = (await start(s.publicId).expect(201)).body;
    await walk(s.publicId, session);
    const res = await answerScreen(s.publicId, session, 1).expect(409);
    expect(res.body.error.code).toBe('already_completed');
  });

  it('when the screening answer screens out, ends the session and redirects with the panel id', async () => {
    const s = await liveStudy({
      settings: { redirects: { screenedOut: 'https://panel.example/out/{pid}' } },
    });
    const session = (await start(s.publicId, { params: { pid: 'Z9' } }).expect(201)).body;
    await answerScreen(s.publicId, session, 0).expect(201);
    const res = await answer(s.publicId, session.sessionToken, {
      ...answerFor(session.screens[1]),
      value: { kind: 'single', optionId: 'no' },
    }).expect(201);
    expect(res.body).toMatchObject({
      status: 'screened_out',
      redirectUrl: 'https://panel.example/out/Z9',
    });
    await answerScreen(s.publicId, session, 2).expect(409);
  });

  it('screens out by the question key even when another page has the same id', async () => {
    const q = fullQuestionnaire();
    q.pages[1] = { ...q.pages[1], id: 'screen1' };
    q.pages.splice(1, 0, { id: 'adult', kind: 'instructions', title: 'First', body: 'Read me' });
    const s = await liveStudy({ questionnaire: q });
    const session = (await start(s.publicId).expect(201)).body;
    await walk(s.publicId, session, 2);
    const res = await answer(s.publicId, session.sessionToken, {
      ...answerFor(session.screens[2]),
      value: { kind: 'single', optionId: 'no' },
    }).expect(201);
    expect(res.body.status).toBe('screened_out');
  });

  it('when the study is closed, refuses answers with 410 survey_closed and stores nothing', async () => {
    const s = await liveStudy();
    const session = (await start(s.publicId).expect(201)).body;
    await t.owner.post(lifecycleUrl(s.id, 'close')).expect(200);
    const res = await answerScreen(s.publicId, session, 0).expect(410);
    expect(res.body.error.code).toBe('survey_closed');
    expect((await rowsOf(session.sessionToken)).answers).toHaveLength(0);
  });

  it('when the study was returned to draft, refuses answers with 409 survey_not_open', async () => {
    const s = await liveStudy();
    const session = (await start(s.publicId).expect(201)).body;
    await t.owner.post(lifecycleUrl(s.id, 'close')).expect(200);
    await t.owner.post(lifecycleUrl(s.id, 'return-to-draft')).expect(200);
    const res = await answerScreen(s.publicId, session, 0).expect(409);
    expect(res.body.error.code).toBe('survey_not_open');
  });

  it('when the quota of completes is reached, closes the study and sends the others to over-quota', async () => {
    const s = await liveStudy({
      settings: { quotaCompletes: 1, redirects: { overQuota: 'https://panel.example/full/{pid}' } },
    });
    const first = (await start(s.publicId).expect(201)).body;
    const second = (await start(s.publicId).expect(201)).body;
    await walk(s.publicId, first);
    const refused = await answer(
      s.publicId,
      second.sessionToken,
      answerFor(second.screens[0]),
    ).expect(410);
    expect(refused.body.error.code).toBe('over_quota');
    expect((await rowsOf(second.sessionToken)).respondent.status).toBe('over_quota');
    const info = await t.request().get(`/api/r/${s.publicId}?pid=K1`).expect(200);
    expect(info.body).toMatchObject({
      state: 'over_quota',
      redirectUrl: 'https://panel.example/full/K1',
      page: { language: 'en', dir: 'ltr', title: 'This survey is full' },
    });
    expect((await start(s.publicId).expect(410)).body.error.code).toBe('over_quota');
  });
});

describe('rate limit on starting sessions', () => {
  it('after the limit, answers 429 rate_limited', async () => {
    const limited = await createTestApp({ RESPONDENT_START_RATE_LIMIT: '2' });
    try {
      const o = await signUpOwner(limited);
      const s = await insertStudy(limited, o.teamId);
      await o.agent.post(`/api/teams/${o.teamId}/studies/${s.id}/lifecycle/go-live`).expect(200);
      await limited.request().post(`/api/r/${s.publicId}/sessions`).send({}).expect(201);
      await limited.request().post(`/api/r/${s.publicId}/sessions`).send({}).expect(201);
      const res = await limited
        .request()
        .post(`/api/r/${s.publicId}/sessions`)
        .send({})
        .expect(429);
      expect(res.body.error.code).toBe('rate_limited');
    } finally {
      await limited.close();
    }
  });
});

describe('compression on the respondent routes', () => {
  it("sends a session that fits in TCP's initial window plain, and stores answers whose receipt goes out plain", async () => {
    const s = await liveStudy();
    const started = await start(s.publicId).set('Accept-Encoding', 'gzip').expect(201);
    // Below ten segments (RFC 6928) a compressed reply arrives no sooner.
    expect(started.text.length).toBeLessThan(RESPONDENT_COMPRESSION_THRESHOLD);
    expect(started.headers['content-encoding']).toBeUndefined();
    const first = started.body.screens[0];
    const res = await answer(s.publicId, started.body.sessionToken, answerFor(first))
      .set('Accept-Encoding', 'gzip')
      .expect(201);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.body).toMatchObject({ screenKey: first.key, replay: false });
    expect((await rowsOf(started.body.sessionToken)).answers).toHaveLength(1);
  });

  it('compresses a session larger than the initial window (a long questionnaire)', async () => {
    const q = fullQuestionnaire();
    const long = Array.from({ length: 4 }, (_, i) => ({
      id: `about-${i}`,
      kind: 'instructions' as const,
      title: `About the water service, part ${i + 1}`,
      body: `Part ${i + 1}. ${'The utility explains how the bill, the supply and the river are linked. '.repeat(70)}`,
    }));
    const s = await liveStudy({
      questionnaire: { ...q, pages: [q.pages[0], ...long, ...q.pages.slice(1)] },
    });
    const started = await start(s.publicId).set('Accept-Encoding', 'gzip').expect(201);
    expect(started.headers['content-encoding']).toBe('gzip');
    expect(JSON.stringify(started.body).length).toBeGreaterThan(RESPONDENT_COMPRESSION_THRESHOLD);
    expect(started.body.screens.map((x: { key: string }) => x.key)).toContain('page:about-3');
  });
});
