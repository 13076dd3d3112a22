import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { answerRevisions, answers, respondents } from '../../../db/schema/fieldwork';
import {
  answerFor,
  fullQuestionnaire,
  sendAnswer,
  startLiveSession,
  type LiveSession,
} from './respond-fixtures';
import type { Questionnaire } from '../../../shared/schemas/questionnaire';

const t = useTestApp({}, { signIn: 'owner' });

type Session = LiveSession;
const liveSession = (questionnaire?: Questionnaire) =>
  startLiveSession(t, t.owner, t.teamId, questionnaire);
const send = (publicId: string, token: string, path: 'answers' | 'revisions', body: object) =>
  sendAnswer(t, publicId, token, path, body);

async function answerUpTo(publicId: string, session: Session, count: number) {
  for (const screen of session.screens.slice(0, count))
    await send(publicId, session.sessionToken, 'answers', answerFor(screen)).expect(201);
}

async function stored(token: string) {
  const [r] = await t.deps.db.select().from(respondents).where(eq(respondents.sessionToken, token));
  const current = await t.deps.db.select().from(answers).where(eq(answers.respondentId, r.id));
  const history = await t.deps.db
    .select()
    .from(answerRevisions)
    .where(eq(answerRevisions.respondentId, r.id));
  return { respondent: r, current, history };
}

const firstTask = (s: Session) => s.screens.findIndex((x) => x.kind === 'task');

describe('POST /api/r/:publicId/revisions', () => {
  it('replaces a choice, keeps the earlier one as history and counts the screen once', async () => {
    const { study, session } = await liveSession();
    const at = firstTask(session);
    await answerUpTo(study.publicId, session, at + 2);
    const task = session.screens[at];
    const revision = answerFor(task, { value: { kind: 'choice', position: 1 } });
    const res = await send(study.publicId, session.sessionToken, 'revisions', revision).expect(201);
    expect(res.body).toMatchObject({ screenKey: task.key, replay: false, status: 'in_progress' });
    // The next screen to answer is still the first unanswered one.
    expect(res.body.nextScreenKey).toBe(session.screens[at + 2].key);

    const { current, history } = await stored(session.sessionToken);
    expect(current).toHaveLength(at + 2);
    const row = current.find((a) => a.screenKey === task.key)!;
    expect(row).toMatchObject({ chosenPosition: 1, revisionCount: 1, clientId: revision.clientId });
    expect(history).toHaveLength(1);
    expect(history[0]).toMatchObject({ screenKey: task.key, chosenPosition: 0 });
  });

  it('when the same revision is sent twice, writes it once and answers the same', async () => {
    const { study, session } = await liveSession();
    await answerUpTo(study.publicId, session, firstTask(session) + 1);
    const revision = answerFor(session.screens[firstTask(session)], {
      value: { kind: 'choice', position: 2 },
    });
    await send(study.publicId, session.sessionToken, 'revisions', revision).expect(201);
    const again = await send(study.publicId, session.sessionToken, 'revisions', revision);
    expect(again.status).toBe(200);
    expect(again.body.replay).toBe(true);
    const { history, current } = await stored(session.sessionToken);
    expect(history).toHaveLength(1);
    expect(current.find((a) => a.clientId === revision.clientId)?.revisionCount).toBe(1);
  });

  it('when the screen is the consent or a screening question, returns 409 revision_not_allowed', async () => {
    const { study, session } = await liveSession();
    await answerUpTo(study.publicId, session, 3);
    for (const screen of session.screens.slice(0, 2)) {
      const res = await send(study.publicId, session.sessionToken, 'revisions', answerFor(screen));
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('revision_not_allowed');
    }
    expect((await stored(session.sessionToken)).history).toHaveLength(0);
  });

  it('when Back is off for choice tasks, refuses task revisions but allows question ones', async () => {
    const q = fullQuestionnaire();
    const { study, session } = await liveSession({
      ...q,
      options: { ...q.options, backOnTasks: false },
    });
    await answerUpTo(study.publicId, session, session.screens.length - 1);
    const task = session.screens[firstTask(session)];
    const refused = await send(study.publicId, session.sessionToken, 'revisions', answerFor(task));
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('revision_not_allowed');
    const question = session.screens.find((s) => s.kind === 'question' && !s.screening)!;
    await send(study.publicId, session.sessionToken, 'revisions', answerFor(question)).expect(201);
  });

  it('when the screen has no answer yet, returns 409 not_answered and stores nothing', async () => {
    const { study, session } = await liveSession();
    await answerUpTo(study.publicId, session, 2);
    const later = session.screens[firstTask(session)];
    const res = await send(study.publicId, session.sessionToken, 'revisions', answerFor(later));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('not_answered');
    expect((await stored(session.sessionToken)).current).toHaveLength(2);
  });

  it('when the value does not fit the screen, returns 400 and changes nothing', async () => {
    const { study, session } = await liveSession();
    await answerUpTo(study.publicId, session, firstTask(session) + 1);
    const task = session.screens[firstTask(session)];
    const res = await send(
      study.publicId,
      session.sessionToken,
      'revisions',
      answerFor(task, { value: { kind: 'choice', position: 5 } }),
    );
    expect(res.status).toBe(400);
    const { current, history } = await stored(session.sessionToken);
    expect(history).toHaveLength(0);
    expect(current.find((a) => a.screenKey === task.key)?.chosenPosition).toBe(0);
  });

  it('when the session has completed, returns 409 already_completed', async () => {
    const { study, session } = await liveSession();
    await answerUpTo(study.publicId, session, session.screens.length);
    const task = session.screens[firstTask(session)];
    const res = await send(study.publicId, session.sessionToken, 'revisions', answerFor(task));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('already_completed');
  });

  it('a token reaches only its own session (another survey or no token: 404)', async () => {
    const a = await liveSession();
    const b = await liveSession();
    await answerUpTo(a.study.publicId, a.session, firstTask(a.session) + 1);
    const task = a.session.screens[firstTask(a.session)];
    const cross = await send(
      b.study.publicId,
      a.session.sessionToken,
      'revisions',
      answerFor(task),
    );
    expect(cross.status).toBe(404);
    await t
      .request()
      .post(`/api/r/${a.study.publicId}/revisions`)
      .send(answerFor(task))
      .expect(404);
    expect((await stored(a.session.sessionToken)).history).toHaveLength(0);
  });

  it('a retry of a client id used on another screen returns 409 client_id_reused', async () => {
    const { study, session } = await liveSession();
    await answerUpTo(study.publicId, session, firstTask(session) + 2);
    const { current } = await stored(session.sessionToken);
    const first = current.find((a) => a.screenKey === session.screens[firstTask(session)].key)!;
    const other = session.screens[firstTask(session) + 1];
    const res = await send(
      study.publicId,
      session.sessionToken,
      'revisions',
      answerFor(other, { clientId: first.clientId }),
    );
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('client_id_reused');
  });
});
