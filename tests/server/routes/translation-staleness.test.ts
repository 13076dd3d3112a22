import { describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { studies } from '../../../db/schema/studies';
import { insertStudy } from './respond-fixtures';
import { draftInGerman, textsUrl } from './texts-fixtures';

const t = useTestApp({}, { signIn: 'team' });
const study = (studyId: string, path = '') =>
  `/api/teams/${t.team.teamId}/studies/${studyId}${path}`;
const texts = (studyId: string, path = '') => textsUrl(t, studyId, path);
const storedRow = async (id: string) =>
  (await t.deps.db.select().from(studies).where(eq(studies.id, id)))[0];

/** A draft in English and German with every German text saved (the source with "DE "). */
async function translatedStudy() {
  const s = await draftInGerman(t);
  const view = await t.team.agents.editor.get(texts(s.id)).expect(200);
  const german = Object.fromEntries(
    view.body.texts.map((r: { key: string; source: string }) => [r.key, `DE ${r.source}`]),
  );
  await t.team.agents.editor.put(texts(s.id, '/de')).send({ texts: german }).expect(200);
  return s;
}

/** The source wording of the survey title changes after the translation was saved. */
const retitle = (studyId: string, publicTitle = 'Water and sewer services 2026') =>
  t.team.agents.editor.patch(study(studyId)).send({ publicTitle }).expect(200);

describe('stale translations', () => {
  it('flags a translation whose source changed, with the wording it was made from; only that one', async () => {
    const s = await translatedStudy();
    expect((await t.team.agents.viewer.get(texts(s.id)).expect(200)).body.stale).toEqual({
      de: {},
    });
    await retitle(s.id);
    const res = await t.team.agents.viewer.get(texts(s.id)).expect(200);
    expect(res.body.stale).toEqual({ de: { 'study.title': 'Water services 2026' } });
    expect(res.body.missing).toEqual({ en: 0, de: 0 });
    // Changing it back makes the translation current again.
    await retitle(s.id, 'Water services 2026');
    expect((await t.team.agents.viewer.get(texts(s.id)).expect(200)).body.stale.de).toEqual({});
  });

  it('is cleared by re-saving the translation', async () => {
    const s = await translatedStudy();
    await retitle(s.id);
    await t.team.agents.editor
      .put(texts(s.id, '/de'))
      .send({ texts: { 'study.title': 'Wasser und Abwasser 2026' } })
      .expect(200);
    expect((await t.team.agents.editor.get(texts(s.id)).expect(200)).body.stale.de).toEqual({});
  });

  it('is cleared by confirming it (owners and editors), keeping its text', async () => {
    const s = await translatedStudy();
    await retitle(s.id);
    for (const role of ['owner', 'editor'] as const) {
      const res = await t.team.agents[role]
        .put(texts(s.id, '/de/confirmed'))
        .send({ keys: ['study.title'] })
        .expect(200);
      expect(res.body.stale.de).toEqual({});
      expect(res.body.translations.de['study.title']).toBe('DE Water services 2026');
    }
    expect((await storedRow(s.id)).translationSources.de['study.title']).toBe(
      'Water and sewer services 2026',
    );
  });

  it('is cleared by importing a file with the text, and kept by one that leaves it out', async () => {
    const s = await translatedStudy();
    await retitle(s.id);
    const csv = (rows: string[]) => ['key,where,en,de', ...rows].join('\n');
    await t.team.agents.editor
      .post(texts(s.id, '/de/file'))
      .send({ format: 'csv', content: csv(['ui.next,Button,Next,Weiter']) })
      .expect(200);
    expect(Object.keys((await t.team.agents.editor.get(texts(s.id))).body.stale.de)).toEqual([
      'study.title',
    ]);
    await t.team.agents.editor
      .post(texts(s.id, '/de/file'))
      .send({ format: 'csv', content: csv(['study.title,Title,x,Wasser und Abwasser']) })
      .expect(200);
    expect((await t.team.agents.editor.get(texts(s.id))).body.stale.de).toEqual({});
  });

  it('does not refuse going live, but the go-live check lists it as a warning', async () => {
    const s = await translatedStudy();
    await retitle(s.id);
    const readiness = await t.team.agents.editor
      .get(study(s.id, '/lifecycle/readiness'))
      .expect(200);
    expect(readiness.body.ready).toBe(true);
    expect(readiness.body.warnings).toEqual([
      {
        code: 'stale_translation',
        path: 'texts.de',
        message:
          'German (de): 1 translation was made from an earlier source wording: Survey title (every screen). Check it on Questionnaire → Languages.',
      },
    ]);
    await t.team.agents.editor.post(study(s.id, '/lifecycle/go-live')).expect(200);
  });

  it('is forgotten with the language: removed and added again, nothing is flagged', async () => {
    const s = await translatedStudy();
    await retitle(s.id);
    await t.team.agents.editor.put(texts(s.id, '/languages')).send({ languages: ['en'] });
    const res = await t.team.agents.editor
      .put(texts(s.id, '/languages'))
      .send({ languages: ['en', 'de'] })
      .expect(200);
    expect(res.body.stale).toEqual({ de: {} });
    expect((await storedRow(s.id)).translationSources).toEqual({});
  });
});

describe('PUT /texts/:lang/confirmed with bad input', () => {
  it('returns 400 with the field for no keys, a key twice, an unknown key or one without a translation', async () => {
    const s = await translatedStudy();
    await t.team.agents.editor.put(texts(s.id, '/de')).send({ texts: { 'ui.next': '' } });
    const cases: Array<[unknown, string, RegExp]> = [
      [{ keys: [] }, 'keys', /Name the texts/],
      [{ keys: ['study.title', 'study.title'] }, 'keys', /listed twice/],
      [{ keys: ['page.gone.title'] }, 'keys.0', /not a text of this study/],
      [{ keys: ['study.title', 'ui.next'] }, 'keys.1', /no German \(de\) text to confirm/],
      [{}, 'keys', /./],
    ];
    for (const [body, path, message] of cases) {
      const res = await t.team.agents.editor
        .put(texts(s.id, '/de/confirmed'))
        .send(body as object)
        .expect(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(res.body.error.fields[0]).toEqual({ path, message: expect.stringMatching(message) });
    }
    for (const lang of ['en', 'fr'])
      expect(
        (
          await t.team.agents.editor
            .put(texts(s.id, `/${lang}/confirmed`))
            .send({ keys: ['study.title'] })
            .expect(400)
        ).body.error.fields[0].path,
      ).toBe('lang');
  });

  it('refuses analysts and viewers (403), other teams (404) and a live study (409), changing nothing', async () => {
    const s = await translatedStudy();
    await retitle(s.id);
    const body = { keys: ['study.title'] };
    for (const role of ['analyst', 'viewer'] as const)
      await t.team.agents[role].put(texts(s.id, '/de/confirmed')).send(body).expect(403);
    await t.team.outsider.put(texts(s.id, '/de/confirmed')).send(body).expect(404);
    await t.deps.db.update(studies).set({ status: 'live' }).where(eq(studies.id, s.id));
    const live = await t.team.agents.editor
      .put(texts(s.id, '/de/confirmed'))
      .send(body)
      .expect(409);
    expect(live.body.error.code).toBe('study_frozen');
    expect((await storedRow(s.id)).translationSources.de['study.title']).toBe(
      'Water services 2026',
    );
  });
});

describe('audit trail of language changes', () => {
  const events = async (studyId: string) =>
    (
      await t.deps.db.execute<{ action: string; actor_id: string; details: object }>(
        sql`select action, actor_id, details from audit_events
            where study_id = ${studyId} order by id`,
      )
    ).rows;

  it('records languages added and removed, texts saved, imported and confirmed, by whom', async () => {
    const s = await translatedStudy();
    await retitle(s.id);
    await t.team.agents.owner
      .put(texts(s.id, '/de/confirmed'))
      .send({ keys: ['study.title'] })
      .expect(200);
    await t.team.agents.editor
      .post(texts(s.id, '/de/file'))
      .send({ format: 'csv', content: 'key,where,en,de\nui.next,Button,Next,Weiter\n' })
      .expect(200);
    await t.team.agents.editor
      .put(texts(s.id, '/languages'))
      .send({ languages: ['en', 'fr'] })
      .expect(200);
    const editor = t.team.users.editor;
    const name = 'Water pilot W-26 (internal)';
    expect(await events(s.id)).toEqual([
      {
        action: 'study.languages_changed',
        actor_id: editor,
        details: { study: name, languages: ['en', 'de'], added: ['de'], removed: [] },
      },
      {
        action: 'study.translations_saved',
        actor_id: editor,
        details: { study: name, language: 'de', saved: expect.any(Number), removed: 0 },
      },
      {
        action: 'study.translations_confirmed',
        actor_id: t.team.users.owner,
        details: { study: name, language: 'de', texts: 1 },
      },
      {
        action: 'study.translations_imported',
        actor_id: editor,
        details: { study: name, language: 'de', format: 'csv', imported: 1, missing: 0, extra: 0 },
      },
      {
        action: 'study.languages_changed',
        actor_id: editor,
        details: { study: name, languages: ['en', 'fr'], added: ['fr'], removed: ['de'] },
      },
    ]);
  });

  it('records nothing for a refused change', async () => {
    const s = await insertStudy(t, t.team.teamId);
    await t.team.agents.viewer
      .put(texts(s.id, '/languages'))
      .send({ languages: ['en', 'de'] })
      .expect(403);
    await t.team.agents.editor
      .put(texts(s.id, '/languages'))
      .send({ languages: ['en', 'xx-nonsense-tag'] })
      .expect(400);
    expect(await events(s.id)).toEqual([]);
  });
});
