/**
 * Segment quotas through the respondent API: a full cell screens its next respondents out at
 * the screening answer, a cell never ends above its target when several finish at once, other
 * cells keep taking respondents, and a quota definition with a gap is refused on save.
 */
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import type supertest from 'supertest';
import { useTestApp } from '../../support/test-app';
import { respondents } from '../../../db/schema/fieldwork';
import type { Questionnaire, QuotaCell } from '../../../shared/schemas/questionnaire';
import {
  answerFor,
  expectQuestionnaireRefused,
  fullQuestionnaire,
  insertStudy,
  sendAnswer,
  type LiveScreen,
  type LiveSession,
} from './respond-fixtures';
import { requiredSingleQuestion } from '../../../shared/schemas/required-single-question';

const t = useTestApp({}, { signIn: 'owner' });

/** The fixture's screening page asks an age group instead, with two quota cells. */
function withAgeQuotas(cells: Partial<QuotaCell>[]): Questionnaire {
  const q = fullQuestionnaire();
  return {
    ...q,
    pages: q.pages.map((p) =>
      p.kind === 'screening'
        ? {
            ...p,
            question: requiredSingleQuestion('adult', 'Your age group?', [
              { id: 'no', label: 'Under 18' },
              { id: 'young', label: '18 to 39' },
              { id: 'older', label: '40 or older' },
            ]),
            screenOutOptionIds: ['no'],
            quotaCells: cells.map((c, i) => ({
              id: `c${i}`,
              label: `Cell ${i}`,
              optionIds: [],
              from: null,
              to: null,
              target: 1,
              ...c,
            })),
          }
        : p,
    ),
  };
}

async function liveStudy(questionnaire: Questionnaire, settings: unknown = {}) {
  const study = await insertStudy(t, t.teamId, { questionnaire, settings });
  await t.owner.post(`/api/teams/${t.teamId}/studies/${study.id}/lifecycle/go-live`).expect(200);
  return study;
}

const start = async (publicId: string): Promise<LiveSession> =>
  (await t.request().post(`/api/r/${publicId}/sessions`).send({}).expect(201)).body;

const answer = (publicId: string, s: LiveSession, screen: LiveScreen, over: object = {}) =>
  sendAnswer(t, publicId, s.sessionToken, 'answers', answerFor(screen, over));

const pick = (optionId: string) => ({ value: { kind: 'single', optionId } });

/** Consent, then the screening answer `optionId`; returns the screening receipt. */
async function screenAs(publicId: string, s: LiveSession, optionId: string) {
  await answer(publicId, s, s.screens[0]).expect(201);
  return answer(publicId, s, s.screens[1], pick(optionId));
}

async function finish(publicId: string, s: LiveSession) {
  let last: supertest.Response | null = null;
  for (const screen of s.screens.slice(2)) {
    last = await answer(publicId, s, screen);
    expect(last.status).toBe(201);
  }
  return last!;
}

const statusOf = async (s: LiveSession) =>
  (
    await t.deps.db
      .select({ status: respondents.status })
      .from(respondents)
      .where(eq(respondents.sessionToken, s.sessionToken))
  )[0].status;

describe('segment quotas', () => {
  it('screens out the next respondent of a full cell and keeps the other cell open', async () => {
    const s = await liveStudy(
      withAgeQuotas([
        { optionIds: ['young'], target: 1 },
        { optionIds: ['older'], target: 2 },
      ]),
      { redirects: { overQuota: 'https://panel.example/full' } },
    );
    const first = await start(s.publicId);
    expect((await screenAs(s.publicId, first, 'young')).body.status).toBe('in_progress');
    expect((await finish(s.publicId, first)).body.status).toBe('completed');

    const second = await start(s.publicId);
    const refused = await screenAs(s.publicId, second, 'young');
    expect(refused.status).toBe(201);
    expect(refused.body).toMatchObject({
      status: 'over_quota',
      nextScreenKey: null,
      redirectUrl: 'https://panel.example/full',
    });
    expect(await statusOf(second)).toBe('over_quota');

    const third = await start(s.publicId);
    expect((await screenAs(s.publicId, third, 'older')).body.status).toBe('in_progress');
    expect((await finish(s.publicId, third)).body.status).toBe('completed');
    // The study stays live: only one cell is full. Fieldwork shows completes per cell.
    const info = await t.request().get(`/api/r/${s.publicId}`).expect(200);
    expect(info.body.state).toBe('live');
    const stats = await t.owner.get(`/api/teams/${t.teamId}/studies/${s.id}/fieldwork`).expect(200);
    expect(stats.body.quotas).toEqual([
      {
        question: 'Your age group?',
        cells: [
          { id: 'c0', label: 'Cell 0', target: 1, completed: 1 },
          { id: 'c1', label: 'Cell 1', target: 2, completed: 1 },
        ],
      },
    ]);
    expect(stats.body.counts).toMatchObject({ completed: 2, overQuota: 1 });
  });

  it('lets a cell end at its target when two in it finish at once', async () => {
    const s = await liveStudy(
      withAgeQuotas([
        { optionIds: ['young'], target: 1 },
        { optionIds: ['older'], target: 5 },
      ]),
    );
    const a = await start(s.publicId);
    const b = await start(s.publicId);
    // Both pass screening while the cell is still empty.
    expect((await screenAs(s.publicId, a, 'young')).body.status).toBe('in_progress');
    expect((await screenAs(s.publicId, b, 'young')).body.status).toBe('in_progress');
    for (const screen of a.screens.slice(2, -1)) await answer(s.publicId, a, screen).expect(201);
    for (const screen of b.screens.slice(2, -1)) await answer(s.publicId, b, screen).expect(201);
    const [endA, endB] = await Promise.all([
      answer(s.publicId, a, a.screens.at(-1)!),
      answer(s.publicId, b, b.screens.at(-1)!),
    ]);
    expect([endA.body.status, endB.body.status].sort()).toEqual(['completed', 'over_quota']);
    const statuses = [await statusOf(a), await statusOf(b)].sort();
    expect(statuses).toEqual(['completed', 'over_quota']);
  });

  it('refuses a quota definition with a gap, naming the answer left out, and saves nothing', async () => {
    const res = await expectQuestionnaireRefused(t, withAgeQuotas([{ optionIds: ['young'] }]));
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.fields).toContainEqual({
      path: 'questionnaire.pages.1.quotaCells',
      message: 'The answer "40 or older" is in no quota cell',
    });
  });
});
