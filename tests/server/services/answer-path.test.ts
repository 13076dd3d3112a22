/**
 * The fast answer path under concurrency: blocks stay balanced when a panel's respondents
 * arrive at once, a quota of completes is never exceeded however many finish together, and a
 * client id is bound to one screen and one value.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { createTestApp, type TestApp } from '../../support/test-app';
import { signUpOwner } from '../../support/factories';
import { answers, respondentBlockCounts, respondents } from '../../../db/schema/fieldwork';
import { saveAnswer, type AnswerInput } from '../../../server/services/answers';
import { buildSession, createRespondent } from '../../../server/services/respondent-session';
import { goLive } from '../../../server/services/lifecycle';
import { getStudyById } from '../../../db/queries/studies';
import { answerFor, insertStudy } from '../routes/respond-fixtures';

let t: TestApp;
let teamId: string;
beforeAll(async () => {
  t = await createTestApp();
  ({ teamId } = await signUpOwner(t));
});
afterAll(async () => {
  await t.close();
});

async function liveStudy(settings: object = {}) {
  const { id } = await insertStudy(t, teamId, { settings });
  await goLive(t.deps, teamId, id);
  return id;
}

async function newRespondent(studyId: string) {
  const { respondent, sessionToken } = await createRespondent(t.deps.db, { studyId });
  const study = { id: studyId, publicTitle: 'x', status: 'live', settings: {} };
  const session = await buildSession(t.deps.db, study, respondent, { isNew: true });
  return { sessionToken, session, respondent };
}

const answerOf = (screen: Parameters<typeof answerFor>[0]) => answerFor(screen) as AnswerInput;

async function answerUpTo(
  studyId: string,
  r: Awaited<ReturnType<typeof newRespondent>>,
  n: number,
) {
  for (const screen of r.session.screens.slice(0, n))
    await saveAnswer(t.deps.db, {
      studyId,
      sessionToken: r.sessionToken,
      answer: answerOf(screen),
    });
}

describe('block assignment', () => {
  it('keeps the two blocks balanced when 40 sessions start at the same moment', async () => {
    const studyId = await liveStudy();
    const made = await Promise.all(
      Array.from({ length: 40 }, () => createRespondent(t.deps.db, { studyId })),
    );
    const perBlock = [1, 2].map((b) => made.filter((m) => m.respondent.block === b).length);
    expect(perBlock).toEqual([20, 20]);
  });

  it('gives the place back when a respondent is screened out, so the next start takes it', async () => {
    const studyId = await liveStudy();
    const a = await newRespondent(studyId);
    const b = await newRespondent(studyId);
    expect(new Set([a.respondent.block, b.respondent.block])).toEqual(new Set([1, 2]));
    // consent, then "no" to the screening question
    await answerUpTo(studyId, a, 1);
    const screening = a.session.screens[1];
    await saveAnswer(t.deps.db, {
      studyId,
      sessionToken: a.sessionToken,
      answer: { ...answerOf(screening), value: { kind: 'single', optionId: 'no' } },
    });
    const [counts] = await t.deps.db
      .select({ filling: respondentBlockCounts.filling })
      .from(respondentBlockCounts)
      .where(eq(respondentBlockCounts.versionId, a.respondent.versionId));
    expect(counts.filling[a.respondent.block - 1]).toBe(0);
    expect(counts.filling[b.respondent.block - 1]).toBe(1);
    const c = await newRespondent(studyId);
    expect(c.respondent.block).toBe(a.respondent.block);
  });
});

describe('quota of completes', () => {
  it('when 12 respondents finish at once with room for 5, completes exactly 5 and closes the study', async () => {
    const studyId = await liveStudy({ quotaCompletes: 5 });
    const people = await Promise.all(Array.from({ length: 12 }, () => newRespondent(studyId)));
    for (const p of people) await answerUpTo(studyId, p, p.session.screens.length - 1);
    const receipts = await Promise.all(
      people.map((p) =>
        saveAnswer(t.deps.db, {
          studyId,
          sessionToken: p.sessionToken,
          answer: answerOf(p.session.screens[p.session.screens.length - 1]),
        }),
      ),
    );
    expect(receipts.filter((r) => r.status === 'completed')).toHaveLength(5);
    expect(receipts.filter((r) => r.status === 'over_quota')).toHaveLength(7);
    const completed = await t.deps.db
      .select({ id: respondents.id })
      .from(respondents)
      .where(and(eq(respondents.studyId, studyId), eq(respondents.status, 'completed')));
    expect(completed).toHaveLength(5);
    const study = await getStudyById(t.deps.db, { id: studyId, teamId });
    expect(study?.status).toBe('closed');
    expect((study?.settings as { closedReason: string }).closedReason).toBe('quota');
  });
});

describe('client ids', () => {
  it('when a client id comes again with another value, returns 409 naming the screen and changes nothing', async () => {
    const studyId = await liveStudy();
    const r = await newRespondent(studyId);
    const task = r.session.screens.find((s) => s.kind === 'task')!;
    await answerUpTo(studyId, r, r.session.screens.indexOf(task));
    const first = { ...answerOf(task), value: { kind: 'choice' as const, position: 0 } };
    await saveAnswer(t.deps.db, { studyId, sessionToken: r.sessionToken, answer: first });
    await expect(
      saveAnswer(t.deps.db, {
        studyId,
        sessionToken: r.sessionToken,
        answer: { ...first, value: { kind: 'choice', position: 1 } },
      }),
    ).rejects.toMatchObject({
      status: 409,
      code: 'client_id_reused',
      message: expect.stringContaining(`"${task.key}"`),
    });
    const [row] = await t.deps.db
      .select({ position: answers.chosenPosition })
      .from(answers)
      .where(and(eq(answers.respondentId, r.respondent.id), eq(answers.screenKey, task.key)));
    expect(row.position).toBe(0);
  });

  it('when the last answer is sent again after completing, returns the same receipt', async () => {
    const studyId = await liveStudy();
    const r = await newRespondent(studyId);
    const screens = r.session.screens;
    await answerUpTo(studyId, r, screens.length - 1);
    const last = answerOf(screens[screens.length - 1]);
    const done = await saveAnswer(t.deps.db, {
      studyId,
      sessionToken: r.sessionToken,
      answer: last,
    });
    const again = await saveAnswer(t.deps.db, {
      studyId,
      sessionToken: r.sessionToken,
      answer: last,
    });
    expect(done).toMatchObject({ status: 'completed', replay: false, nextScreenKey: null });
    expect(again).toMatchObject({ status: 'completed', replay: true, nextScreenKey: null });
  });
});
