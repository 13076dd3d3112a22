/**
 * After a respondent goes back and changes answers: estimation data holds each task once with
 * the latest choice, a resumed session shows the latest answers, and the downloads say what
 * was changed and when (answer-history.csv, the revised_screens column).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import type supertest from 'supertest';
import { parse } from 'csv-parse/sync';
import { useTestApp } from '../../support/test-app';
import { signUpOwner } from '../../support/factories';
import { answers, respondents } from '../../../db/schema/fieldwork';
import { loadStudyChoiceData } from '../../../server/services/choice-data-from-study';
import { answerFor, sendAnswer, startLiveSession, type LiveSession } from './respond-fixtures';

const t = useTestApp();
let owner: supertest.Agent;
let teamId: string;
beforeAll(async () => {
  ({ agent: owner, teamId } = await signUpOwner(t));
});

const send = (publicId: string, token: string, path: 'answers' | 'revisions', body: object) =>
  sendAnswer(t, publicId, token, path, body);

/** A respondent who changes the first task twice and a background question once, then finishes. */
async function respondentWhoRevises() {
  const { study, session } = await startLiveSession(t, owner, teamId);
  const token = session.sessionToken;
  const taskAt = session.screens.findIndex((s) => s.key.startsWith('task:'));
  const question = session.screens.find(
    (s) => s.kind === 'question' && !s.screening && s.question?.type === 'single',
  )!;
  const last = session.screens.length - 1;
  for (const screen of session.screens.slice(0, last))
    await send(study.publicId, token, 'answers', answerFor(screen)).expect(201);
  const task = session.screens[taskAt];
  for (const position of [1, 2])
    await send(
      study.publicId,
      token,
      'revisions',
      answerFor(task, { value: { kind: 'choice', position } }),
    ).expect(201);
  const otherOption = question.question!.options![1].id;
  await send(
    study.publicId,
    token,
    'revisions',
    answerFor(question, { value: { kind: 'single', optionId: otherOption } }),
  ).expect(201);
  const resumed = await t
    .request()
    .get(`/api/r/${study.publicId}/session`)
    .set('x-respondent-token', token);
  await send(study.publicId, token, 'answers', answerFor(session.screens[last])).expect(201);
  return {
    study,
    session,
    token,
    task,
    question,
    otherOption,
    resumed: resumed.body as LiveSession,
  };
}

describe('answers changed through Back', () => {
  it('estimation reads each task once, with the latest choice', async () => {
    const { study, token, task, session } = await respondentWhoRevises();
    const [r] = await t.deps.db
      .select()
      .from(respondents)
      .where(eq(respondents.sessionToken, token));
    const [current] = await t.deps.db
      .select()
      .from(answers)
      .where(eq(answers.respondentId, r.id))
      .then((rows) => rows.filter((a) => a.screenKey === task.key));
    expect(current.chosenPosition).toBe(2);

    const data = await loadStudyChoiceData(t.deps.db, { studyId: study.id });
    const taskRows = data.rows.filter((row) => String(row.task) === String(current.taskNumber));
    // One row per alternative shown (designed ones plus the status quo), one of them chosen.
    expect(taskRows).toHaveLength(task.alternatives!.length);
    expect(taskRows.filter((row) => row.chosen === 1)).toHaveLength(1);
    const chosenAlt =
      current.chosenAlternative === -1 ? taskRows.length : current.chosenAlternative! + 1;
    expect(taskRows.find((row) => row.chosen === 1)!.alt).toBe(chosenAlt);
    const designTasks = session.screens.filter(
      (s) => s.kind === 'task' && s.key.startsWith('task:'),
    );
    expect(data.summary.tasks).toBe(designTasks.length);
  });

  it('a resumed session returns the latest answers of the screens Back leads to', async () => {
    const { resumed, task, question, otherOption } = await respondentWhoRevises();
    expect(resumed.given[task.key]).toEqual({ kind: 'choice', position: 2 });
    expect(resumed.given[question.key]).toEqual({ kind: 'single', optionId: otherOption });
    // The consent and the screening answer cannot be changed, so they are not offered back.
    expect(resumed.given['consent']).toBeUndefined();
    expect(resumed.given['q:adult']).toBeUndefined();
  });

  it('the downloads list every answer of a changed screen with its times, the latest marked current', async () => {
    const { study, task, question } = await respondentWhoRevises();
    const base = `/api/teams/${teamId}/studies/${study.id}/exports`;
    const history = await owner.get(`${base}/answer-history.csv`).expect(200);
    const rows = parse(history.text, { columns: true }) as Record<string, string>[];
    const ofTask = rows.filter((r) => r.screen === task.key);
    expect(ofTask.map((r) => [r.version, r.current])).toEqual([
      ['1', 'false'],
      ['2', 'false'],
      ['3', 'true'],
    ]);
    // Each replaced answer was given before it was replaced, and the next one given then.
    expect(ofTask[0].replaced_at).toBe(ofTask[1].answered_at);
    expect(ofTask[1].replaced_at).toBe(ofTask[2].answered_at);
    expect(ofTask[2].replaced_at).toBe('');
    const ofQuestion = rows.filter((r) => r.screen === question.key);
    expect(ofQuestion).toHaveLength(2);
    const labels = (question.question as unknown as { options: { label: string }[] }).options;
    expect(ofQuestion.map((r) => r.answer)).toEqual([labels[0].label, labels[1].label]);

    const background = await owner.get(`${base}/background-answers.csv`).expect(200);
    const [me] = (parse(background.text, { columns: true }) as Record<string, string>[]).filter(
      (r) => r.status === 'completed',
    );
    expect(me.revised_screens.split('; ').sort()).toEqual(
      [`${task.key} ×2`, `${question.key} ×1`].sort(),
    );
  });
});
