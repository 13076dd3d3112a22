import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { answers } from '../../../db/schema/fieldwork';
import { saveAnswer } from '../../../server/services/answers';
import { buildSession, createRespondent } from '../../../server/services/respondent-session';
import { goLive } from '../../../server/services/lifecycle';
import { answerFor, insertStudy } from '../routes/respond-fixtures';

const t = useTestApp({}, { signIn: 'owner' });
let studyId: string;
beforeAll(async () => {
  studyId = (await insertStudy(t, t.teamId)).id;
  await goLive(t.deps, t.teamId, studyId);
});

async function newRespondent() {
  const { respondent, sessionToken } = await createRespondent(t.deps.db, { studyId });
  const study = { id: studyId, publicTitle: 'x', status: 'live', settings: {} };
  const session = await buildSession(t.deps.db, study, respondent);
  return { sessionToken, session, respondent };
}

type NewSession = Awaited<ReturnType<typeof newRespondent>>['session'];

/** The answer to the session's first screen, as saveAnswer takes it. */
const firstScreenAnswer = (session: NewSession) =>
  answerFor(session.screens[0]) as Parameters<typeof saveAnswer>[1]['answer'];

const storedAnswersOf = (respondentId: string) =>
  t.deps.db.select().from(answers).where(eq(answers.respondentId, respondentId));

describe('saveAnswer under concurrency', () => {
  it('when the same answer arrives many times at once, stores exactly one row', async () => {
    const { sessionToken, session, respondent } = await newRespondent();
    const answer = firstScreenAnswer(session);
    const receipts = await Promise.all(
      Array.from({ length: 8 }, () => saveAnswer(t.deps.db, { studyId, sessionToken, answer })),
    );
    expect(receipts.filter((r) => !r.replay)).toHaveLength(1);
    expect(await storedAnswersOf(respondent.id)).toHaveLength(1);
  });

  it('when two different answers race for one screen, keeps one and refuses the other', async () => {
    const { sessionToken, session, respondent } = await newRespondent();
    const results = await Promise.allSettled(
      [0, 1].map(() =>
        saveAnswer(t.deps.db, {
          studyId,
          sessionToken,
          answer: firstScreenAnswer(session),
        }),
      ),
    );
    expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
    const refused = results.find((r) => r.status === 'rejected') as PromiseRejectedResult;
    expect(refused.reason.code).toBe('already_answered');
    expect(await storedAnswersOf(respondent.id)).toHaveLength(1);
  });

  it('a client id reused for another screen is refused', async () => {
    const { sessionToken, session } = await newRespondent();
    const first = firstScreenAnswer(session);
    await saveAnswer(t.deps.db, { studyId, sessionToken, answer: first });
    const second = { ...(answerFor(session.screens[1]) as typeof first), clientId: first.clientId };
    await expect(
      saveAnswer(t.deps.db, { studyId, sessionToken, answer: second }),
    ).rejects.toMatchObject({
      code: 'client_id_reused',
    });
  });
});
