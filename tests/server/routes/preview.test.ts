/**
 * GET /preview: the study as one respondent sees it, built by the same code as a live
 * session. The equality check (no snapshots): for a questionnaire with every page kind, the
 * preview of a block and seed equals, field by field, the session of a live respondent who
 * got that block and seed.
 */
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { respondents } from '../../../db/schema/fieldwork';
import { studies } from '../../../db/schema/studies';
import { createPage } from '../../../shared/schemas/questionnaire-defaults';
import type { Questionnaire, QuestionnairePage } from '../../../shared/schemas/questionnaire';
import {
  defaultCertaintyScale,
  defaultQuestionnaireOptions,
  pageKindLabels,
} from '../../../shared/schemas/questionnaire';
import type { RespondentSession, StudyPreview } from '../../../shared/schemas/respondent';
import { definition, fullQuestionnaire, insertStudy } from './respond-fixtures';

const t = useTestApp({}, { signIn: 'team' });

const url = (studyId: string, query = '') =>
  `/api/teams/${t.team.teamId}/studies/${studyId}/preview${query}`;

/**
 * Every page kind, with a custom title and the certainty question on the choice tasks, and a
 * per-respondent attribute order.
 */
function everyPageKind(): Questionnaire {
  const q = fullQuestionnaire();
  const end = q.pages.pop()!;
  const page = (kind: QuestionnairePage['kind'], id: string) => ({
    ...createPage(kind, definition),
    id,
  });
  const pages = q.pages.map((p): QuestionnairePage =>
    p.kind === 'tasks'
      ? {
          ...p,
          title: 'Which package would your household pick?',
          certainty: defaultCertaintyScale(),
        }
      : p,
  );
  const tasksAt = pages.findIndex((p) => p.kind === 'tasks');
  pages.splice(tasksAt, 0, page('warmup', 'warm'));
  pages.push(
    { id: 'rep', kind: 'repeat', title: 'One more time', repeatOf: 1 },
    page('holdout', 'hold'),
    page('dominance', 'dom'),
    end,
  );
  return {
    pages,
    options: { ...defaultQuestionnaireOptions(), shuffleAttributes: true },
  } as Questionnaire;
}

describe('GET /preview', () => {
  it('equals a live session of the same block and seed, for every page kind', async () => {
    const questionnaire = everyPageKind();
    expect(new Set(questionnaire.pages.map((p) => p.kind))).toEqual(
      new Set(Object.keys(pageKindLabels)),
    );
    const s = await insertStudy(t, t.team.teamId, { questionnaire });
    await t.team.agents.editor
      .post(`/api/teams/${t.team.teamId}/studies/${s.id}/lifecycle/go-live`)
      .expect(200);
    for (let n = 0; n < 2; n++) {
      const live: RespondentSession = (
        await t.request().post(`/api/r/${s.publicId}/sessions`).send({}).expect(201)
      ).body;
      const [row] = await t.deps.db
        .select({ block: respondents.block, plan: respondents.plan })
        .from(respondents)
        .where(eq(respondents.sessionToken, live.sessionToken));
      const seed = (row.plan as { seed: number }).seed;
      const preview: StudyPreview = (
        await t.team.agents.viewer.get(url(s.id, `?block=${row.block}&seed=${seed}`)).expect(200)
      ).body;
      expect(preview).toMatchObject({
        block: row.block,
        blocks: 2,
        seed,
        questionnaireSaved: true,
      });
      expect(preview.survey).toEqual({
        studyName: live.studyName,
        definition: live.definition,
        screens: live.screens,
        end: live.end,
        back: live.back,
        language: live.language,
        dir: live.dir,
        languages: live.languages,
        ui: live.ui,
      });
      const kinds = new Set(
        preview.survey.screens.map((sc) => (sc.kind === 'task' ? sc.taskKind : sc.kind)),
      );
      expect(kinds).toEqual(
        new Set([
          'consent',
          'question',
          'instructions',
          'design',
          'warmup',
          'holdout',
          'repeat',
          'dominance',
        ]),
      );
      // The custom task title is what respondents and the preview show (issue: default text).
      const tasks = preview.survey.screens.filter(
        (sc) => sc.kind === 'task' && sc.taskKind === 'design',
      );
      expect(tasks.map((sc) => (sc.kind === 'task' ? sc.title : ''))).toEqual([
        'Which package would your household pick?',
        'Which package would your household pick?',
      ]);
      // …with the certainty question under each, and the respondent's own attribute order.
      for (const sc of tasks)
        expect(sc.kind === 'task' && sc.certainty).toEqual(defaultCertaintyScale());
      expect(preview.survey.definition.attributes.map((a) => a.id)).toEqual(
        (row.plan as { attributeOrder: string[] }).attributeOrder,
      );
    }
  });

  it('before the questionnaire is saved, previews the default one', async () => {
    const s = await insertStudy(t, t.team.teamId, { questionnaire: null });
    const res = await t.team.agents.analyst.get(url(s.id)).expect(200);
    expect(res.body.questionnaireSaved).toBe(false);
    expect(res.body.survey.screens[0].kind).toBe('consent');
  });

  it('when there is no design, returns 409 saying what to do', async () => {
    const s = await insertStudy(t, t.team.teamId, { withDesign: false });
    const res = await t.team.agents.owner.get(url(s.id)).expect(409);
    expect(res.body.error).toEqual({
      code: 'nothing_to_preview',
      message: 'Create the choice tasks on the Tasks section.',
    });
  });

  it('when the block or seed is not a number, returns 400 with the field', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const res = await t.team.agents.editor.get(url(s.id, '?block=two')).expect(400);
    expect(res.body.error.fields[0].path).toBe('block');
  });

  it('lets every role of the team read it, and nobody else', async () => {
    const s = await insertStudy(t, t.team.teamId);
    for (const role of ['owner', 'editor', 'analyst', 'viewer'] as const)
      await t.team.agents[role].get(url(s.id)).expect(200);
    await t.team.outsider.get(url(s.id)).expect(404);
    await t.request().get(url(s.id)).expect(401);
    const [row] = await t.deps.db.select().from(studies).where(eq(studies.id, s.id));
    expect(row.status).toBe('draft');
  });
});
