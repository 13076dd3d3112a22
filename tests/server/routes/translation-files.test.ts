import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { createTeamWithAllRoles } from '../../support/factories';
import { studies } from '../../../db/schema/studies';
import { insertStudy } from './respond-fixtures';

const t = useTestApp({}, { signIn: 'team' });

const url = (studyId: string, path = '') =>
  `/api/teams/${t.team.teamId}/studies/${studyId}/texts${path}`;
const translations = async (id: string) =>
  (await t.deps.db.select().from(studies).where(eq(studies.id, id)))[0].translations;

async function studyInGerman() {
  const s = await insertStudy(t, t.team.teamId);
  await t.team.agents.editor
    .put(url(s.id, '/languages'))
    .send({ languages: ['en', 'de'] })
    .expect(200);
  return s;
}

/** Imports a file as one of the team's agents. */
const importFile = (
  role: keyof typeof t.team.agents,
  studyId: string,
  body: { format: string; content: string },
) => t.team.agents[role].post(url(studyId, '/de/file')).send(body);

/** Fills every empty <target> of an exported file, except the units listed. */
function translateXliff(xml: string, skip: string[] = []): string {
  let unit = '';
  return xml
    .split('\n')
    .map((line) => {
      const id = /<unit id="([^"]+)">/.exec(line);
      if (id) unit = id[1];
      if (line.includes('<target></target>') && !skip.includes(unit))
        return line.replace('<target></target>', `<target>DE ${unit}</target>`);
      return line;
    })
    .join('\n');
}

describe('GET /texts/:lang/file', () => {
  it('exports XLIFF 2.0 with the study as <file id> and every text as a unit, for every role', async () => {
    const s = await studyInGerman();
    for (const role of ['owner', 'editor', 'analyst', 'viewer'] as const) {
      const res = await t.team.agents[role].get(url(s.id, '/de/file')).expect(200);
      expect(res.headers['content-type']).toMatch(/application\/xliff\+xml/);
      expect(res.text).toContain('version="2.0" srcLang="en" trgLang="de"');
      expect(res.text).toContain(`<file id="${s.id}">`);
      expect(res.text).toContain('<unit id="study.title">');
    }
    await t.team.outsider.get(url(s.id, '/de/file')).expect(404);
  });

  it('exports CSV with key, where, source and target columns', async () => {
    const s = await studyInGerman();
    const res = await t.team.agents.viewer.get(url(s.id, '/de/file?format=csv')).expect(200);
    expect(res.text.split(/\r?\n/)[0]).toBe('key,where,en,de');
  });

  it('for the source language or a language the study lacks, returns 400 on lang', async () => {
    const s = await studyInGerman();
    for (const lang of ['en', 'fr']) {
      const res = await t.team.agents.viewer.get(url(s.id, `/${lang}/file`)).expect(400);
      expect(res.body.error.fields[0].path).toBe('lang');
    }
  });
});

describe('POST /texts/:lang/file', () => {
  it('imports a translated XLIFF file and reports the texts still missing', async () => {
    const s = await studyInGerman();
    const exported = (await t.team.agents.editor.get(url(s.id, '/de/file')).expect(200)).text;
    const res = await importFile('editor', s.id, {
      format: 'xliff',
      content: translateXliff(exported, ['ui.next']),
    }).expect(200);
    expect(res.body.missing).toEqual([
      { key: 'ui.next', where: expect.stringContaining('next screen'), interface: true },
    ]);
    expect(res.body.extra).toEqual([]);
    expect((await translations(s.id)).de['study.title']).toBe('DE study.title');
  });

  it('reports keys the study does not have, and takes the rest', async () => {
    const s = await studyInGerman();
    const exported = (await t.team.agents.editor.get(url(s.id, '/de/file')).expect(200)).text;
    const withExtra = translateXliff(exported).replace(
      '</file>',
      '<unit id="page.gone.title"><segment><source>Old</source><target>Alt</target></segment></unit></file>',
    );
    const res = await importFile('editor', s.id, { format: 'xliff', content: withExtra }).expect(
      200,
    );
    expect(res.body.extra).toEqual([
      { key: 'page.gone.title', where: '', line: expect.any(Number) },
    ]);
    expect(res.body.missing).toEqual([]);
  });

  it('imports CSV, reading back cells the export protected against formulas', async () => {
    const s = await studyInGerman();
    const csv = 'key,where,en,de\nstudy.title,Title,Water services 2026,"\'=Wasser"\n';
    const res = await importFile('editor', s.id, { format: 'csv', content: csv }).expect(200);
    expect(res.body.imported).toBe(1);
    expect((await translations(s.id)).de['study.title']).toBe('=Wasser');
  });

  it('imports the CSV a translator saved from a spreadsheet with semicolons, a byte-order mark and CRLF', async () => {
    // A comma-decimal locale's list separator (server/lib/csv-dialect.ts).
    const s = await studyInGerman();
    const csv =
      '\uFEFFkey;where;en;de\r\nstudy.title;Title;Water services 2026;"Wasser; Abwasser 2026"\r\n';
    const res = await importFile('editor', s.id, { format: 'csv', content: csv }).expect(200);
    expect(res.body.imported).toBe(1);
    expect((await translations(s.id)).de['study.title']).toBe('Wasser; Abwasser 2026');
  });

  it('refuses another study’s file, the wrong language and a DOCTYPE with a field error, changing nothing', async () => {
    const s = await studyInGerman();
    const other = await studyInGerman();
    const foreign = translateXliff(
      (await t.team.agents.editor.get(url(other.id, '/de/file')).expect(200)).text,
    );
    const wrongStudy = await importFile('editor', s.id, {
      format: 'xliff',
      content: foreign,
    }).expect(400);
    expect(wrongStudy.body.error.message).toBe('This file belongs to another study');
    expect(wrongStudy.body.error.fields[0].path).toBe('file');

    const own = translateXliff(
      (await t.team.agents.editor.get(url(s.id, '/de/file')).expect(200)).text,
    );
    const french = own.replace('trgLang="de"', 'trgLang="fr"');
    const wrongLanguage = await importFile('editor', s.id, {
      format: 'xliff',
      content: french,
    }).expect(400);
    expect(wrongLanguage.body.error.fields[0].path).toBe('language');

    const xxe = own.replace(
      '<?xml version="1.0" encoding="UTF-8"?>',
      '<?xml version="1.0"?><!DOCTYPE x [<!ENTITY e SYSTEM "file:///etc/passwd">]>',
    );
    const doctype = await importFile('editor', s.id, { format: 'xliff', content: xxe }).expect(400);
    expect(doctype.body.error.fields[0]).toEqual({
      path: 'file',
      message: expect.stringMatching(/DOCTYPE/),
    });
    const csvWrong = await importFile('editor', s.id, {
      format: 'csv',
      content: 'key,where,en,fr\nstudy.title,x,y,z\n',
    }).expect(400);
    expect(csvWrong.body.error.fields[0].path).toBe('language');
    expect(await translations(s.id)).toEqual({});
  });

  it('imports for owners as for editors', async () => {
    const s = await studyInGerman();
    const csv = 'key,where,en,de\nstudy.title,Title,Water services 2026,Wasser 2026\n';
    const res = await importFile('owner', s.id, { format: 'csv', content: csv }).expect(200);
    expect(res.body.imported).toBe(1);
    expect((await translations(s.id)).de).toEqual({ 'study.title': 'Wasser 2026' });
  });

  it('refuses analysts and viewers (403) and other teams (404)', async () => {
    const s = await studyInGerman();
    const body = { format: 'csv', content: 'key,where,en,de\nstudy.title,x,y,z\n' };
    for (const role of ['analyst', 'viewer'] as const)
      await t.team.agents[role].post(url(s.id, '/de/file')).send(body).expect(403);
    await t.team.outsider.post(url(s.id, '/de/file')).send(body).expect(404);
    expect(await translations(s.id)).toEqual({});
  });
});

describe('POST /texts/:lang/file with bad input', () => {
  const post = (studyId: string, body: unknown, lang = 'de') =>
    t.team.agents.editor.post(url(studyId, `/${lang}/file`)).send(body as object);

  it('returns 400 with the field for a missing or unknown format, empty or oversized content', async () => {
    const s = await studyInGerman();
    const cases: Array<[unknown, string]> = [
      [{ content: 'x' }, 'format'],
      [{ format: 'docx', content: 'x' }, 'format'],
      [{ format: 'csv', content: '' }, 'content'],
      [{ format: 'csv', content: 'a'.repeat(2_000_001) }, 'content'],
    ];
    for (const [body, field] of cases) {
      const res = await post(s.id, body).expect(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(res.body.error.fields[0].path).toBe(field);
    }
    expect(await translations(s.id)).toEqual({});
  });

  it('refuses what is not XLIFF, malformed XML, a file with no texts and a CSV of other columns, naming the line', async () => {
    const s = await studyInGerman();
    const own = (await t.team.agents.editor.get(url(s.id, '/de/file')).expect(200)).text;
    const cases: Array<[string, string, RegExp]> = [
      ['xliff', 'key,where,en,de\nstudy.title,x,y,z\n', /well-formed|not XLIFF/],
      ['xliff', translateXliff(own).replace('</segment>', ''), /^Line \d+: Not well-formed/],
      ['xliff', own.replace(/<unit[\s\S]*<\/unit>\n/, ''), /Export this study’s file/],
      ['csv', 'name,age\nAna,4\n', /^Line 1: expected the columns key, where, en, de/],
      ['csv', 'key,where,en,de\nstudy.title,"x,y,z\n', /Quote|quote/],
    ];
    for (const [format, content, message] of cases) {
      const res = await post(s.id, { format, content }).expect(400);
      expect(res.body.error.fields[0]).toEqual({
        path: 'file',
        message: expect.stringMatching(message),
      });
    }
    expect(await translations(s.id)).toEqual({});
  });

  it('refuses a file giving a key twice or a text longer than a field takes, by line, taking nothing', async () => {
    const s = await studyInGerman();
    const csv = [
      'key,where,en,de',
      'study.title,Title,Water services 2026,Wasser',
      'ui.next,Button,Next,Weiter',
      'study.title,Title,Water services 2026,Wasser 2026',
      `ui.start,Button,Start,${'x'.repeat(6001)}`,
    ].join('\n');
    const res = await post(s.id, { format: 'csv', content: csv }).expect(400);
    expect(res.body.error.message).toBe(
      'Nothing was imported: 2 texts of the file cannot be taken',
    );
    expect(res.body.error.fields).toEqual([
      {
        path: 'texts.study.title',
        message: 'Line 4: study.title is given again (first on line 2)',
      },
      {
        path: 'texts.ui.start',
        message: 'Line 5: the text of ui.start has 6,001 characters; at most 6,000',
      },
    ]);
    expect(await translations(s.id)).toEqual({});
  });

  it('refuses the source language, a language the study lacks and a malformed tag on lang', async () => {
    const s = await studyInGerman();
    const body = { format: 'csv', content: 'key,where,en,de\nstudy.title,x,y,z\n' };
    for (const lang of ['en', 'fr', 'not a tag']) {
      const res = await post(s.id, body, encodeURIComponent(lang)).expect(400);
      expect(res.body.error.fields[0].path).toBe('lang');
    }
    expect(await translations(s.id)).toEqual({});
  });

  it('refuses a study that is live (409 study_frozen) and one of another team (404)', async () => {
    const s = await studyInGerman();
    await t.deps.db.update(studies).set({ status: 'live' }).where(eq(studies.id, s.id));
    const body = { format: 'csv', content: 'key,where,en,de\nstudy.title,x,y,z\n' };
    const res = await post(s.id, body).expect(409);
    expect(res.body.error.code).toBe('study_frozen');
    const other = await createTeamWithAllRoles(t);
    const theirs = await insertStudy(t, other.teamId);
    await post(theirs.id, body).expect(404);
    expect(await translations(s.id)).toEqual({});
  });
});
