/**
 * Skip logic through the respondent API: a page whose rule does not match is stored as
 * skipped and may not be answered; a page whose rule matches may not be skipped; the answer a
 * rule reads stands (no revision) and comes back with the session so a resumed phone skips alike.
 */
import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { useTestApp } from '../../support/test-app';
import type { Questionnaire, QuestionnairePage } from '../../../shared/schemas/questionnaire';
import {
  answerFor,
  expectQuestionnaireRefused,
  fullQuestionnaire,
  insertStudy,
  sendAnswer,
  type LiveSession,
} from './respond-fixtures';
import { requiredSingleQuestion } from '../../../shared/schemas/required-single-question';

const t = useTestApp({}, { signIn: 'owner' });

const garden: QuestionnairePage = {
  id: 'garden',
  kind: 'question',
  question: requiredSingleQuestion('garden', 'Does your home have a garden?', [
    { id: 'yes', label: 'Yes' },
    { id: 'no', label: 'No' },
  ]),
};
const watering: QuestionnairePage = {
  id: 'watering',
  kind: 'question',
  question: {
    type: 'number',
    key: 'watering_days',
    text: 'On how many days a week do you water the garden in summer?',
    help: '',
    required: true,
    min: 0,
    max: 7,
    integer: true,
    unit: 'days',
  },
  showIf: { questionKey: 'garden', optionIds: ['yes'], min: null, max: null },
};

/** The fixture's questionnaire with the garden question and its follow-up after screening. */
function withGardenPages(pages = [garden, watering]): Questionnaire {
  const q = fullQuestionnaire();
  return { ...q, pages: [...q.pages.slice(0, 2), ...pages, ...q.pages.slice(2)] };
}

async function liveSession() {
  const study = await insertStudy(t, t.teamId, { questionnaire: withGardenPages() });
  await t.owner.post(`/api/teams/${t.teamId}/studies/${study.id}/lifecycle/go-live`).expect(200);
  const session: LiveSession = (
    await t.request().post(`/api/r/${study.publicId}/sessions`).send({}).expect(201)
  ).body;
  const send = (path: 'answers' | 'revisions', body: object) =>
    sendAnswer(t, study.publicId, session.sessionToken, path, body);
  // Consent and the screening question first.
  for (const screen of session.screens.slice(0, 2))
    await send('answers', answerFor(screen)).expect(201);
  return { study, session, send };
}

const screenOf = (s: LiveSession, key: string) => s.screens.find((x) => x.key === key)!;

describe('skip logic', () => {
  it('sends the rule with the page and marks the question it reads', async () => {
    const { session } = await liveSession();
    expect(screenOf(session, 'q:watering_days')).toMatchObject({
      showIf: { questionKey: 'garden', optionIds: ['yes'] },
    });
    expect(screenOf(session, 'q:garden')).toMatchObject({ decidesSkips: true });
  });

  it('without a garden: the follow-up is skipped, and an answer to it is refused', async () => {
    const { study, session, send } = await liveSession();
    const no = { value: { kind: 'single' as const, optionId: 'no' } };
    await send('answers', answerFor(screenOf(session, 'q:garden'), no)).expect(201);
    const follow = screenOf(session, 'q:watering_days');
    const refused = await send('answers', answerFor(follow)).expect(400);
    expect(refused.body.error).toMatchObject({
      code: 'invalid_answer',
      fields: [{ path: 'value', message: 'Skip this page: the earlier answer hides it' }],
    });
    const skipped = await send('answers', answerFor(follow, { value: { kind: 'skipped' } }));
    expect(skipped.status).toBe(201);
    expect(skipped.body.status).toBe('in_progress');
    // The answer the rule read stands, and comes back with the session for another phone.
    const revise = await send(
      'revisions',
      answerFor(screenOf(session, 'q:garden'), { value: { kind: 'single', optionId: 'yes' } }),
    );
    expect(revise.status).toBe(409);
    const again = await t
      .request()
      .get(`/api/r/${study.publicId}/session`)
      .set('x-respondent-token', session.sessionToken)
      .expect(200);
    expect(again.body.given['q:garden']).toEqual({ kind: 'single', optionId: 'no' });
  });

  it('with a garden: the follow-up may not be skipped, and its answer is stored', async () => {
    const { session, send } = await liveSession();
    const yes = { value: { kind: 'single' as const, optionId: 'yes' } };
    await send('answers', answerFor(screenOf(session, 'q:garden'), yes)).expect(201);
    const follow = screenOf(session, 'q:watering_days');
    const refused = await send('answers', answerFor(follow, { value: { kind: 'skipped' } }));
    expect(refused.status).toBe(400);
    expect(refused.body.error.message).toBe('This question applies to you: please answer it.');
    await send('answers', answerFor(follow, { value: { kind: 'number', number: 3 } })).expect(201);
  });

  it('exports a skipped page apart from an unanswered one, with a flag beside the answer', async () => {
    const study = await insertStudy(t, t.teamId, { questionnaire: withGardenPages() });
    await t.owner.post(`/api/teams/${t.teamId}/studies/${study.id}/lifecycle/go-live`).expect(200);
    // Three respondents: no garden (page skipped), a garden (answered 3), and one who stops
    // after screening (never reaches either page).
    const start = async (garden: 'yes' | 'no' | null) => {
      const s: LiveSession = (
        await t.request().post(`/api/r/${study.publicId}/sessions`).send({}).expect(201)
      ).body;
      const send = (body: object) =>
        sendAnswer(t, study.publicId, s.sessionToken, 'answers', body).expect(201);
      for (const screen of s.screens.slice(0, 2)) await send(answerFor(screen));
      if (garden === null) return;
      const gardenValue = { kind: 'single' as const, optionId: garden };
      await send(answerFor(screenOf(s, 'q:garden'), { value: gardenValue }));
      const follow = screenOf(s, 'q:watering_days');
      await send(
        answerFor(follow, {
          value: garden === 'no' ? { kind: 'skipped' } : { kind: 'number', number: 3 },
        }),
      );
    };
    await start('no');
    await start('yes');
    await start(null);
    const base = `/api/teams/${t.teamId}/studies/${study.id}/exports`;
    const csv = async (path: string) => {
      const text = (await t.owner.get(`${base}/${path}`).expect(200)).text;
      const [head, ...rows] = parse(text) as string[][];
      return rows.map((r) => Object.fromEntries(head.map((h, i) => [h, r[i]])));
    };
    const pick = (rows: Record<string, string>[], answer: string) =>
      rows.map((r) => [r[answer], r[`${answer}_skipped`]]);
    expect(pick(await csv('background-answers.csv'), 'watering_days')).toEqual([
      ['', '1'],
      ['3', '0'],
      ['', ''],
    ]);
    expect(pick(await csv('respondents-wide.csv'), 'q_watering_days')).toEqual([
      ['', '1'],
      ['3', '0'],
      ['', ''],
    ]);
    // Questions without a rule get no flag column.
    expect(Object.keys((await csv('background-answers.csv'))[0])).not.toContain('garden_skipped');
  });

  it('refuses a skip of a page without a rule', async () => {
    const { session, send } = await liveSession();
    const res = await send(
      'answers',
      answerFor(screenOf(session, 'q:garden'), { value: { kind: 'skipped' } }),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe('This screen cannot be skipped.');
  });

  it('refuses a rule that reads a later question, and saves nothing', async () => {
    const res = await expectQuestionnaireRefused(t, withGardenPages([watering, garden]));
    expect(res.body.error.fields).toContainEqual({
      path: 'questionnaire.pages.2.showIf.questionKey',
      message: '"garden" comes after this page: a page can depend only on earlier questions',
    });
  });
});
