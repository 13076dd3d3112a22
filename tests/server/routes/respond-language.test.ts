import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { respondents } from '../../../db/schema/fieldwork';
import { answerFor, insertStudy } from './respond-fixtures';

const t = useTestApp({}, { signIn: 'owner' });

const TOKEN = 'x-respondent-token';
const studyUrl = (studyId: string, path: string) =>
  `/api/teams/${t.teamId}/studies/${studyId}${path}`;

/** A live study in English and `languages`, every text translated as "<TAG> <source>". */
async function liveInLanguages(...languages: string[]) {
  const study = await insertStudy(t, t.teamId);
  await t.owner
    .put(studyUrl(study.id, '/texts/languages'))
    .send({ languages: ['en', ...languages] })
    .expect(200);
  const view = await t.owner.get(studyUrl(study.id, '/texts')).expect(200);
  for (const lang of languages) {
    const texts = Object.fromEntries(
      view.body.texts.map((r: { key: string; source: string }) => [
        r.key,
        `${lang.toUpperCase()} ${r.source}`,
      ]),
    );
    await t.owner
      .put(studyUrl(study.id, `/texts/${lang}`))
      .send({ texts })
      .expect(200);
  }
  await t.owner.post(studyUrl(study.id, '/lifecycle/go-live')).expect(200);
  return study;
}

const start = (publicId: string, params: Record<string, string> = {}) =>
  t.request().post(`/api/r/${publicId}/sessions`).send({ params });
const choose = (publicId: string, token: string, language: unknown) =>
  t.request().post(`/api/r/${publicId}/language`).set(TOKEN, token).send({ language });
const languageOf = async (token: string) =>
  (await t.deps.db.select().from(respondents).where(eq(respondents.sessionToken, token)))[0]
    .language;

describe('POST /r/:publicId/sessions with ?lang=', () => {
  it('starts the session in the link’s language: every text and the app’s words, stored with it', async () => {
    const s = await liveInLanguages('de');
    const res = await start(s.publicId, { lang: 'de' }).expect(201);
    expect(res.body.language).toBe('de');
    expect(res.body.dir).toBe('ltr');
    expect(res.body.studyName).toBe('DE Water services 2026');
    expect(res.body.screens[0].title).toMatch(/^DE /);
    expect(res.body.ui['ui.next']).toBe('DE Next');
    expect(res.body.end.title).toMatch(/^DE /);
    const task = res.body.screens.find((x: { kind: string }) => x.kind === 'task');
    expect(task.alternatives.map((a: { label: string }) => a.label)).toContain('DE Option A');
    expect(res.body.definition.attributes[0].name).toMatch(/^DE /);
    expect(res.body.languages.map((l: { tag: string }) => l.tag)).toEqual(['en', 'de']);
    expect(await languageOf(res.body.sessionToken)).toBe('de');
  });

  it('without ?lang= starts in the source language', async () => {
    const s = await liveInLanguages('de');
    const res = await start(s.publicId).expect(201);
    expect(res.body.language).toBe('en');
    expect(res.body.studyName).toBe('Water services 2026');
    expect(await languageOf(res.body.sessionToken)).toBe('en');
  });

  it('in a right-to-left language, says so (dir rtl)', async () => {
    const s = await liveInLanguages('ar');
    const res = await start(s.publicId, { lang: 'ar' }).expect(201);
    expect(res.body.dir).toBe('rtl');
    expect(res.body.languages).toContainEqual({ tag: 'ar', name: 'العربية', dir: 'rtl' });
  });

  it('when the link asks for a language the study does not offer, returns 400 on params.lang and makes no respondent', async () => {
    const s = await liveInLanguages('de');
    for (const lang of ['fr', 'not a tag']) {
      const res = await start(s.publicId, { lang }).expect(400);
      expect(res.body.error.code).toBe('unknown_language');
      expect(res.body.error.fields[0].path).toBe('params.lang');
      expect(res.body.error.fields[0].message).toMatch(/German \(de\)/);
    }
    const rows = await t.deps.db.select().from(respondents).where(eq(respondents.studyId, s.id));
    expect(rows).toHaveLength(0);
  });
});

describe('POST /r/:publicId/language', () => {
  it('changes the session’s language before the first answer and answers with the session in it', async () => {
    const s = await liveInLanguages('de');
    const session = (await start(s.publicId).expect(201)).body;
    const res = await choose(s.publicId, session.sessionToken, 'de').expect(200);
    expect(res.body.language).toBe('de');
    expect(res.body.screens[0].title).toMatch(/^DE /);
    expect(await languageOf(session.sessionToken)).toBe('de');
    // Resuming keeps it.
    const again = await t
      .request()
      .get(`/api/r/${s.publicId}/session`)
      .set(TOKEN, session.sessionToken)
      .expect(200);
    expect(again.body.language).toBe('de');
  });

  it('once an answer is stored, returns 409 language_locked and keeps the language', async () => {
    const s = await liveInLanguages('de');
    const session = (await start(s.publicId).expect(201)).body;
    await t
      .request()
      .post(`/api/r/${s.publicId}/answers`)
      .set(TOKEN, session.sessionToken)
      .send(answerFor(session.screens[0]))
      .expect(201);
    const res = await choose(s.publicId, session.sessionToken, 'de').expect(409);
    expect(res.body.error.code).toBe('language_locked');
    expect(await languageOf(session.sessionToken)).toBe('en');
  });

  it('with a bad tag returns 400 on language; with a language not offered, 400 unknown_language', async () => {
    const s = await liveInLanguages('de');
    const session = (await start(s.publicId).expect(201)).body;
    const bad = await choose(s.publicId, session.sessionToken, 'xx').expect(400);
    expect(bad.body.error.fields[0].path).toBe('language');
    const other = await choose(s.publicId, session.sessionToken, 'fr').expect(400);
    expect(other.body.error.code).toBe('unknown_language');
    expect(await languageOf(session.sessionToken)).toBe('en');
  });

  it('without a valid session token of this survey, returns 404', async () => {
    const s = await liveInLanguages('de');
    const other = await liveInLanguages('de');
    const session = (await start(other.publicId).expect(201)).body;
    await choose(s.publicId, session.sessionToken, 'de').expect(404);
    await t.request().post(`/api/r/${s.publicId}/language`).send({ language: 'de' }).expect(404);
  });
});

describe('the language in Responses and downloads', () => {
  it('shows each respondent’s language, filters by it for every role, and writes a language column', async () => {
    const s = await liveInLanguages('ar');
    const en = (await start(s.publicId).expect(201)).body;
    const ar = (await start(s.publicId, { lang: 'ar' }).expect(201)).body;
    const responses = await t.owner.get(studyUrl(s.id, '/responses')).expect(200);
    expect(responses.body.languages).toEqual(['en', 'ar']);
    expect(responses.body.items.map((r: { language: string }) => r.language).sort()).toEqual([
      'ar',
      'en',
    ]);
    const onlyArabic = await t.owner.get(studyUrl(s.id, '/responses?language=ar')).expect(200);
    expect(onlyArabic.body.total).toBe(1);
    expect(onlyArabic.body.items[0].language).toBe('ar');
    const bad = await t.owner.get(studyUrl(s.id, '/responses?language=xx')).expect(400);
    expect(bad.body.error.fields[0].path).toBe('language');

    for (const file of ['background-answers.csv', 'respondents-wide.csv']) {
      const csv = (await t.owner.get(studyUrl(s.id, `/exports/${file}`)).expect(200)).text;
      const [header, ...lines] = csv.trim().split(/\r?\n/);
      const column = header.split(',').indexOf('language');
      expect(column, file).toBeGreaterThan(0);
      expect(lines.map((l) => l.split(',')[column]).sort()).toEqual(['ar', 'en']);
    }
    expect([en.language, ar.language]).toEqual(['en', 'ar']);
  });
});

describe('GET /r/:publicId before a session, with ?lang=', () => {
  it('gives a closed survey’s page in the link’s language, right to left where it is', async () => {
    const s = await liveInLanguages('de', 'ar');
    await t.owner.post(studyUrl(s.id, '/lifecycle/close')).expect(200);
    const de = await t.request().get(`/api/r/${s.publicId}?lang=de`).expect(200);
    expect(de.body).toEqual({
      state: 'closed',
      studyName: 'DE Water services 2026',
      redirectUrl: null,
      page: {
        language: 'de',
        dir: 'ltr',
        title: 'DE This survey has closed',
        body: expect.stringMatching(/^DE /),
      },
    });
    const ar = await t.request().get(`/api/r/${s.publicId}?lang=ar`).expect(200);
    expect(ar.body.page).toMatchObject({ language: 'ar', dir: 'rtl' });
  });

  it('falls back to the source language for no, an unoffered or a malformed ?lang=', async () => {
    const s = await liveInLanguages('de');
    await t.owner.post(studyUrl(s.id, '/lifecycle/close')).expect(200);
    for (const query of ['', '?lang=fr', '?lang=%%%', '?lang=DE-de-x-1'])
      expect((await t.request().get(`/api/r/${s.publicId}${query}`).expect(200)).body.page).toEqual(
        {
          language: 'en',
          dir: 'ltr',
          title: 'This survey has closed',
          body: 'Thank you for your interest. The survey is no longer taking answers.',
        },
      );
  });

  it('has no page while the survey is live', async () => {
    const s = await liveInLanguages('de');
    const res = await t.request().get(`/api/r/${s.publicId}?lang=de`).expect(200);
    expect(res.body).toMatchObject({ state: 'live', page: null });
  });
});
