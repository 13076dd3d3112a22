import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { studies, studyVersions } from '../../../db/schema/studies';
import { insertStudy } from './respond-fixtures';

const t = useTestApp({}, { signIn: 'team' });

const url = (studyId: string, path = '') =>
  `/api/teams/${t.team.teamId}/studies/${studyId}/texts${path}`;
type TextRow = { key: string; source: string };

const storedRow = async (id: string) =>
  (await t.deps.db.select().from(studies).where(eq(studies.id, id)))[0];

/** Every text of the study in German (made up: the source text with a prefix). */
async function germanFor(studyId: string): Promise<Record<string, string>> {
  const res = await t.team.agents.editor.get(url(studyId)).expect(200);
  return Object.fromEntries(res.body.texts.map((r: TextRow) => [r.key, `DE ${r.source}`]));
}

describe('GET /texts', () => {
  it('lists every respondent-visible text under keys made of ids, for every role of the team', async () => {
    const s = await insertStudy(t, t.team.teamId);
    for (const role of ['owner', 'editor', 'analyst', 'viewer'] as const) {
      const res = await t.team.agents[role].get(url(s.id)).expect(200);
      expect(res.body.languages).toEqual(['en']);
      expect(res.body.missing).toEqual({ en: 0 });
    }
    const res = await t.team.agents.viewer.get(url(s.id)).expect(200);
    const byKey = new Map(res.body.texts.map((r: TextRow) => [r.key, r.source]));
    expect(byKey.get('study.title')).toBe('Water services 2026');
    expect(byKey.get('page.adult.question')).toBe('Are you 18 or older?');
    expect(byKey.get('page.adult.option.no')).toBe('No');
    expect(byKey.get('fixed.label')).toBeTruthy();
    expect(byKey.get('ui.screened_out_title')).toBe('Thank you for your interest');
    const attributeKeys = [...byKey.keys()].filter((k) => String(k).startsWith('attribute.'));
    expect(attributeKeys.length).toBeGreaterThanOrEqual(5);
    expect([...byKey.keys()].some((k) => String(k).startsWith('level.'))).toBe(true);
  });

  it('for another team, returns 404', async () => {
    const s = await insertStudy(t, t.team.teamId);
    await t.team.outsider.get(url(s.id)).expect(404);
  });
});

describe('PUT /texts/languages', () => {
  it('adds a language (canonical tag) for owners and editors; it lacks every text until translated', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const res = await t.team.agents.editor
      .put(url(s.id, '/languages'))
      .send({ languages: ['en', 'pt-br'] })
      .expect(200);
    expect(res.body.languages).toEqual(['en', 'pt-BR']);
    expect(res.body.missing['pt-BR']).toBe(res.body.texts.length);
    await t.team.agents.owner
      .put(url(s.id, '/languages'))
      .send({ languages: ['en', 'de'] })
      .expect(200);
    expect((await storedRow(s.id)).languages).toEqual(['en', 'de']);
  });

  it('refuses analysts and viewers (403) and other teams (404), changing nothing', async () => {
    const s = await insertStudy(t, t.team.teamId);
    for (const role of ['analyst', 'viewer'] as const)
      await t.team.agents[role]
        .put(url(s.id, '/languages'))
        .send({ languages: ['en', 'de'] })
        .expect(403);
    await t.team.outsider
      .put(url(s.id, '/languages'))
      .send({ languages: ['en', 'de'] })
      .expect(404);
    expect((await storedRow(s.id)).languages).toEqual(['en']);
  });

  it('when a tag is not a known language, returns 400 with the field', async () => {
    const s = await insertStudy(t, t.team.teamId);
    for (const bad of ['xx', 'en_US', 'x-private', '']) {
      const res = await t.team.agents.editor
        .put(url(s.id, '/languages'))
        .send({ languages: ['en', bad] })
        .expect(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(res.body.error.fields[0].path).toBe('languages.1');
      expect(res.body.error.message).toMatch(/not a language tag we know/);
    }
    expect((await storedRow(s.id)).languages).toEqual(['en']);
  });

  it('when a language is listed twice (after canonical casing) or none is given, returns 400', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const twice = await t.team.agents.editor
      .put(url(s.id, '/languages'))
      .send({ languages: ['en', 'de', 'DE'] })
      .expect(400);
    expect(twice.body.error.fields).toEqual([
      { path: 'languages.2', message: 'de is listed twice' },
    ]);
    const none = await t.team.agents.editor
      .put(url(s.id, '/languages'))
      .send({ languages: [] })
      .expect(400);
    expect(none.body.error.fields[0]).toEqual({
      path: 'languages',
      message: 'A study needs at least one language',
    });
  });

  it('renames the source language, but refuses to swap it with a translation', async () => {
    const s = await insertStudy(t, t.team.teamId);
    await t.team.agents.editor
      .put(url(s.id, '/languages'))
      .send({ languages: ['en', 'de'] })
      .expect(200);
    await t.team.agents.editor.put(url(s.id, '/de')).send({ texts: { 'ui.next': 'Weiter' } });
    const res = await t.team.agents.editor
      .put(url(s.id, '/languages'))
      .send({ languages: ['de', 'en'] })
      .expect(400);
    expect(res.body.error.fields[0].path).toBe('languages.0');
    expect((await storedRow(s.id)).languages).toEqual(['en', 'de']);
    await t.team.agents.editor
      .put(url(s.id, '/languages'))
      .send({ languages: ['en-GB', 'de'] })
      .expect(200);
    const row = await storedRow(s.id);
    expect(row.languages).toEqual(['en-GB', 'de']);
    expect(row.translations.de['ui.next']).toBe('Weiter');
  });

  it('when the study is live, returns 409 study_frozen', async () => {
    const s = await insertStudy(t, t.team.teamId);
    await t.deps.db.update(studies).set({ status: 'live' }).where(eq(studies.id, s.id));
    const res = await t.team.agents.editor
      .put(url(s.id, '/languages'))
      .send({ languages: ['en', 'de'] })
      .expect(409);
    expect(res.body.error.code).toBe('study_frozen');
  });
});

describe('PUT /texts/:lang', () => {
  it('saves texts of one language; an empty text removes one', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const added = await t.team.agents.editor
      .put(url(s.id, '/languages'))
      .send({ languages: ['en', 'de'] })
      .expect(200);
    const res = await t.team.agents.editor
      .put(url(s.id, '/de'))
      .send({ texts: { 'study.title': 'Wasserdienste 2026', 'page.adult.option.no': 'Nein' } })
      .expect(200);
    expect(res.body.translations.de).toEqual({
      'study.title': 'Wasserdienste 2026',
      'page.adult.option.no': 'Nein',
    });
    expect(res.body.missing.de).toBe(added.body.missing.de - 2);
    const cleared = await t.team.agents.owner
      .put(url(s.id, '/de'))
      .send({ texts: { 'page.adult.option.no': '  ' } })
      .expect(200);
    expect(cleared.body.translations.de).toEqual({ 'study.title': 'Wasserdienste 2026' });
  });

  it('when a key is not a text of the study, returns 400 naming it and saves nothing', async () => {
    const s = await insertStudy(t, t.team.teamId);
    await t.team.agents.editor.put(url(s.id, '/languages')).send({ languages: ['en', 'de'] });
    const res = await t.team.agents.editor
      .put(url(s.id, '/de'))
      .send({ texts: { 'study.title': 'Titel', 'page.nope.title': 'Falsch' } })
      .expect(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.fields).toEqual([
      { path: 'texts.page.nope.title', message: 'page.nope.title is not a text of this study' },
    ]);
    expect((await storedRow(s.id)).translations).toEqual({});
  });

  it('when the language is not one of the study’s, or not a tag, returns 400 with the field lang', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const other = await t.team.agents.editor
      .put(url(s.id, '/fr'))
      .send({ texts: { 'study.title': 'Titre' } })
      .expect(400);
    expect(other.body.error.fields[0].path).toBe('lang');
    const bad = await t.team.agents.editor
      .put(url(s.id, '/zz-not'))
      .send({ texts: { 'study.title': 'Titre' } })
      .expect(400);
    expect(bad.body.error.fields[0].path).toBe('lang');
  });

  it('in the source language, takes only the app’s own words', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const res = await t.team.agents.editor
      .put(url(s.id, '/en'))
      .send({ texts: { 'study.title': 'Other title' } })
      .expect(400);
    expect(res.body.error.fields[0].message).toMatch(
      /source language on Attributes or Questionnaire/,
    );
    await t.team.agents.editor
      .put(url(s.id, '/en'))
      .send({ texts: { 'ui.next': 'Go on' } })
      .expect(200);
  });

  it('refuses analysts and viewers (403) and other teams (404)', async () => {
    const s = await insertStudy(t, t.team.teamId);
    await t.team.agents.editor.put(url(s.id, '/languages')).send({ languages: ['en', 'de'] });
    for (const role of ['analyst', 'viewer'] as const)
      await t.team.agents[role]
        .put(url(s.id, '/de'))
        .send({ texts: { 'study.title': 'X' } })
        .expect(403);
    await t.team.outsider
      .put(url(s.id, '/de'))
      .send({ texts: { 'study.title': 'X' } })
      .expect(404);
    expect((await storedRow(s.id)).translations).toEqual({});
  });
});

describe('going live with several languages', () => {
  const lifecycle = (studyId: string, path: string) =>
    `/api/teams/${t.team.teamId}/studies/${studyId}/lifecycle${path}`;

  it('is refused while a language lacks texts, listing them; with every text it freezes them', async () => {
    const s = await insertStudy(t, t.team.teamId);
    await t.team.agents.editor.put(url(s.id, '/languages')).send({ languages: ['en', 'de'] });
    const german = await germanFor(s.id);
    const { 'page.adult.option.no': _left, ...allButOne } = german;
    await t.team.agents.editor.put(url(s.id, '/de')).send({ texts: allButOne }).expect(200);
    const refused = await t.team.agents.editor.post(lifecycle(s.id, '/go-live')).expect(422);
    expect(refused.body.error.code).toBe('not_ready');
    expect(refused.body.error.fields).toEqual([
      {
        path: 'texts.de.page.adult.option.no',
        message: expect.stringMatching(/^German \(de\) has no text for .*answer “No”/),
      },
    ]);
    expect((await storedRow(s.id)).status).toBe('draft');

    await t.team.agents.editor
      .put(url(s.id, '/de'))
      .send({ texts: { 'page.adult.option.no': 'Nein' } })
      .expect(200);
    await t.team.agents.editor.post(lifecycle(s.id, '/go-live')).expect(200);
    const [version] = await t.deps.db
      .select()
      .from(studyVersions)
      .where(eq(studyVersions.studyId, s.id));
    expect(version.languages).toEqual(['en', 'de']);
    expect(version.translations.de['page.adult.option.no']).toBe('Nein');
  });

  it('summarises a language that lacks many texts in one problem', async () => {
    const s = await insertStudy(t, t.team.teamId);
    await t.team.agents.editor.put(url(s.id, '/languages')).send({ languages: ['en', 'ar'] });
    const res = await t.team.agents.editor.get(lifecycle(s.id, '/readiness')).expect(200);
    const texts = res.body.problems.filter(
      (p: { code: string }) => p.code === 'missing_translation',
    );
    expect(texts).toEqual([
      {
        code: 'missing_translation',
        path: 'texts.ar',
        message: expect.stringMatching(/^Arabic \(ar\) lacks \d+ texts: study\.title, /),
      },
    ]);
  });
});
