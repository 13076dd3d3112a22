/**
 * Closing without losing: answers given before a close that arrive after it (a phone that was
 * offline) are stored for the grace period; answers given after the close are refused with a
 * reason; the phone's own session resumes after the close so its outbox can be sent.
 */
import { describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { answers, respondents } from '../../../db/schema/fieldwork';
import { studies } from '../../../db/schema/studies';
import { answerFor, insertStudy } from './respond-fixtures';

const t = useTestApp({}, { signIn: 'owner' });

const lifecycleUrl = (studyId: string, action: string) =>
  `/api/teams/${t.teamId}/studies/${studyId}/lifecycle/${action}`;
const answer = (publicId: string, token: string, body: object) =>
  t.request().post(`/api/r/${publicId}/answers`).set('x-respondent-token', token).send(body);

/** A live study with one started session, then closed `minutesAgo` minutes ago. */
async function closedWithSession(minutesAgo: number, settings: object = {}) {
  const study = await insertStudy(t, t.teamId, { settings });
  await t.owner.post(lifecycleUrl(study.id, 'go-live')).expect(200);
  const session = (await t.request().post(`/api/r/${study.publicId}/sessions`).send({}).expect(201))
    .body;
  // The session started before the close; move both into the past together.
  await t.deps.db
    .update(respondents)
    .set({ startedAt: new Date(Date.now() - (minutesAgo + 5) * 60_000) })
    .where(eq(respondents.sessionToken, session.sessionToken));
  await t.owner.post(lifecycleUrl(study.id, 'close')).expect(200);
  const closedAt = new Date(Date.now() - minutesAgo * 60_000).toISOString();
  await t.deps.db
    .update(studies)
    .set({ settings: sql`${studies.settings} || ${JSON.stringify({ closedAt })}::jsonb` })
    .where(eq(studies.id, study.id));
  return { study, session };
}

async function storedCount(token: string) {
  const [r] = await t.deps.db
    .select({ id: respondents.id, status: respondents.status })
    .from(respondents)
    .where(eq(respondents.sessionToken, token));
  const rows = await t.deps.db.select().from(answers).where(eq(answers.respondentId, r.id));
  return { status: r.status, answers: rows.length };
}

describe('POST /api/r/:publicId/answers after the study closed', () => {
  it('stores every answer given before the close and completes the respondent', async () => {
    const { study, session } = await closedWithSession(60);
    const givenBeforeClose = 61 * 60_000;
    for (const screen of session.screens) {
      const res = await answer(
        study.publicId,
        session.sessionToken,
        answerFor(screen, { ageMs: givenBeforeClose }),
      );
      expect(res.status).toBe(201);
    }
    expect(await storedCount(session.sessionToken)).toEqual({
      status: 'completed',
      answers: session.screens.length,
    });
  });

  it('refuses an answer given after the close with 410 and says why, storing nothing', async () => {
    const { study, session } = await closedWithSession(10);
    const res = await answer(
      study.publicId,
      session.sessionToken,
      answerFor(session.screens[0], { ageMs: 60_000 }),
    ).expect(410);
    expect(res.body.error).toMatchObject({ code: 'survey_closed' });
    expect(res.body.error.message).toMatch(/closed before this answer was given/);
    expect((await storedCount(session.sessionToken)).answers).toBe(0);
  });

  it('refuses answers once the grace period is over, whenever they were given', async () => {
    const { study, session } = await closedWithSession(3 * 60, { lateAnswerGraceHours: 2 });
    const res = await answer(
      study.publicId,
      session.sessionToken,
      answerFor(session.screens[0], { ageMs: 4 * 3600_000 }),
    ).expect(410);
    expect(res.body.error.message).toMatch(/too long ago/);
    expect((await storedCount(session.sessionToken)).answers).toBe(0);
  });
});

describe('POST /api/r/:publicId/sessions after the study closed', () => {
  it("resumes the phone's own session (survey shown as closed); a new visitor is refused", async () => {
    const { study, session } = await closedWithSession(5);
    const resumed = await t
      .request()
      .post(`/api/r/${study.publicId}/sessions`)
      .send({ sessionToken: session.sessionToken })
      .expect(201);
    expect(resumed.body).toMatchObject({ sessionToken: session.sessionToken, surveyOpen: false });
    const fresh = await t.request().post(`/api/r/${study.publicId}/sessions`).send({}).expect(410);
    expect(fresh.body.error.code).toBe('survey_closed');
  });
});
