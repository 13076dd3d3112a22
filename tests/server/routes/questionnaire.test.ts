import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { studies } from '../../../db/schema/studies';
import { fullQuestionnaire, insertStudy } from './respond-fixtures';

const t = useTestApp({}, { signIn: 'team' });

const url = (studyId: string) => `/api/teams/${t.team.teamId}/studies/${studyId}/questionnaire`;

describe('GET /questionnaire', () => {
  it('before the first save, shows the default questionnaire with consent, tasks and end; with a cost, a cheap-talk text and a budget reminder before the tasks', async () => {
    const s = await insertStudy(t, t.team.teamId, { questionnaire: null });
    const res = await t.team.agents.viewer.get(url(s.id)).expect(200);
    expect(res.body.saved).toBe(false);
    expect(res.body.editable).toBe(true);
    expect(res.body.questionnaire.pages.map((p: { kind: string }) => p.kind)).toEqual([
      'consent',
      'instructions',
      'instructions',
      'instructions',
      'tasks',
      'end',
    ]);
    expect(
      res.body.questionnaire.pages.map((p: { template?: string }) => p.template ?? null),
    ).toEqual([null, null, 'cheap_talk', 'budget_reminder', null, null]);
    expect(res.body.questionnaire.pages[0].body).toMatch(/ethics approval/);
    expect(res.body.questionnaire.pages[0].body).toMatch(/stop at any time/);
  });

  it('for another team, returns 404', async () => {
    const s = await insertStudy(t, t.team.teamId);
    await t.team.outsider.get(url(s.id)).expect(404);
  });
});

describe('PUT /questionnaire', () => {
  it('saves for owners and editors, and refuses analysts and viewers', async () => {
    const s = await insertStudy(t, t.team.teamId, { questionnaire: null });
    const questionnaire = fullQuestionnaire();
    for (const role of ['analyst', 'viewer'] as const)
      await t.team.agents[role].put(url(s.id)).send({ questionnaire }).expect(403);
    const res = await t.team.agents.editor.put(url(s.id)).send({ questionnaire }).expect(200);
    expect(res.body.saved).toBe(true);
    await t.team.agents.owner.put(url(s.id)).send({ questionnaire }).expect(200);
    const [row] = await t.deps.db.select().from(studies).where(eq(studies.id, s.id));
    expect((row.questionnaire as { pages: unknown[] }).pages).toHaveLength(
      questionnaire.pages.length,
    );
  });

  it('when the consent page is missing or not first, returns 400 with the problem and saves nothing', async () => {
    const s = await insertStudy(t, t.team.teamId, { questionnaire: null });
    const q = fullQuestionnaire();
    const res = await t.team.agents.editor
      .put(url(s.id))
      .send({ questionnaire: { pages: q.pages.slice(1) } })
      .expect(400);
    expect(res.body.error.fields.map((f: { message: string }) => f.message)).toContain(
      'The questionnaire needs exactly one consent page',
    );
    const moved = [q.pages[1], q.pages[0], ...q.pages.slice(2)];
    const res2 = await t.team.agents.editor
      .put(url(s.id))
      .send({ questionnaire: { pages: moved } })
      .expect(400);
    expect(res2.body.error.message).toBe('The consent page must come first');
    const [row] = await t.deps.db.select().from(studies).where(eq(studies.id, s.id));
    expect(row.questionnaire).toEqual({});
  });

  it('when two questions share a key or a number range is upside down, names the problem', async () => {
    const s = await insertStudy(t, t.team.teamId, { questionnaire: null });
    const q = fullQuestionnaire();
    const household = q.pages.find(
      (p) => p.kind === 'question' && p.question.key === 'household_size',
    )!;
    if (household.kind !== 'question' || household.question.type !== 'number')
      throw new Error('fixture');
    household.question.min = 20;
    const res = await t.team.agents.editor.put(url(s.id)).send({ questionnaire: q }).expect(400);
    expect(res.body.error.fields).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ message: 'The minimum must be below the maximum' }),
      ]),
    );
    const dup = fullQuestionnaire();
    const age = dup.pages.find((p) => p.kind === 'question' && p.question.key === 'age_band')!;
    if (age.kind === 'question') age.question.key = 'household_size';
    const res2 = await t.team.agents.editor.put(url(s.id)).send({ questionnaire: dup }).expect(400);
    expect(res2.body.error.message).toBe('Two questions use the key "household_size"');
  });

  it('when the study is live, returns 409 study_frozen', async () => {
    const s = await insertStudy(t, t.team.teamId);
    await t.team.agents.editor
      .post(`/api/teams/${t.team.teamId}/studies/${s.id}/lifecycle/go-live`)
      .expect(200);
    const res = await t.team.agents.editor
      .put(url(s.id))
      .send({ questionnaire: fullQuestionnaire() })
      .expect(409);
    expect(res.body.error.code).toBe('study_frozen');
    const view = await t.team.agents.editor.get(url(s.id)).expect(200);
    expect(view.body.editable).toBe(false);
  });
});
