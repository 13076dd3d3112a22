/**
 * The certainty question under each design task: sent with the design tasks only, required
 * there and refused elsewhere, checked against the scale's points, stored with the choice.
 */
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { answers, respondents } from '../../../db/schema/fieldwork';
import type { Questionnaire } from '../../../shared/schemas/questionnaire';
import {
  answerFor,
  fullQuestionnaire,
  sendAnswer,
  startLiveSession,
  type LiveScreen,
  type LiveSession,
} from './respond-fixtures';

const t = useTestApp({}, { signIn: 'owner' });

const scale = { question: 'How sure are you?', points: 5, lowLabel: 'Unsure', highLabel: 'Sure' };
function withCertainty(): Questionnaire {
  const q = fullQuestionnaire();
  return {
    ...q,
    pages: q.pages.map((p) => (p.kind === 'tasks' ? { ...p, certainty: scale } : p)),
  };
}

/** Answers every screen before the first design task; returns that task's screen. */
async function reachFirstTask(publicId: string, session: LiveSession): Promise<LiveScreen> {
  for (const screen of session.screens) {
    if (screen.key.startsWith('task:')) return screen;
    await sendAnswer(t, publicId, session.sessionToken, 'answers', answerFor(screen)).expect(201);
  }
  throw new Error('no design task');
}

async function answersOf(sessionToken: string) {
  const [r] = await t.deps.db
    .select()
    .from(respondents)
    .where(eq(respondents.sessionToken, sessionToken));
  return t.deps.db.select().from(answers).where(eq(answers.respondentId, r.id));
}

describe('certainty after each choice', () => {
  it('is sent with the design tasks and with nothing else', async () => {
    const { session } = await startLiveSession(t, t.owner, t.teamId, withCertainty());
    const tasks = session.screens.filter((s) => s.kind === 'task');
    expect(tasks.length).toBeGreaterThan(0);
    for (const s of tasks)
      expect(s.certainty ?? null, s.key).toEqual(s.key.startsWith('task:') ? scale : null);
  });

  it('is required, bounded by the scale, and stored with the choice', async () => {
    const { study, session } = await startLiveSession(t, t.owner, t.teamId, withCertainty());
    const task = await reachFirstTask(study.publicId, session);
    const send = (value: object) =>
      sendAnswer(t, study.publicId, session.sessionToken, 'answers', {
        ...answerFor(task),
        value,
      });

    const missing = await send({ kind: 'choice', position: 0 }).expect(400);
    expect(missing.body.error).toMatchObject({ code: 'invalid_answer' });
    expect(missing.body.error.message).toMatch(/how sure/i);
    const tooHigh = await send({ kind: 'choice', position: 0, certainty: 6 }).expect(400);
    expect(tooHigh.body.error.message).toMatch(/1 to 5/);
    await send({ kind: 'choice', position: 0, certainty: 0 }).expect(400);
    await send({ kind: 'choice', position: 0, certainty: 2.5 }).expect(400);

    // The refused answers stored nothing for this respondent's task.
    const mine = async () =>
      (await answersOf(session.sessionToken)).filter((r) => r.screenKey === task.key);
    expect(await mine()).toHaveLength(0);

    await send({ kind: 'choice', position: 1, certainty: 4 }).expect(201);
    const saved = await mine();
    expect(saved).toHaveLength(1);
    expect(saved[0].chosenPosition).toBe(1);
    expect(saved[0].value).toMatchObject({ kind: 'choice', position: 1, certainty: 4 });
  });

  it('is refused on a task that does not ask it', async () => {
    const { study, session } = await startLiveSession(t, t.owner, t.teamId);
    const task = await reachFirstTask(study.publicId, session);
    expect(task.certainty).toBeUndefined();
    const res = await sendAnswer(t, study.publicId, session.sessionToken, 'answers', {
      ...answerFor(task),
      value: { kind: 'choice', position: 0, certainty: 3 },
    }).expect(400);
    expect(res.body.error.code).toBe('invalid_answer');
  });
});
