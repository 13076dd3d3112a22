import { beforeAll, describe, expect, it } from 'vitest';
import type supertest from 'supertest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { createTeamWithAllRoles } from '../../support/factories';
import { studies } from '../../../db/schema/studies';
import { listQuestionAnswers } from '../../../db/queries/study-answers';
import { syntheticChoiceCsv } from '../../../scripts/lib/synthetic-choice-file';
import type { ImportAttribute, ImportPreview } from '../../../shared/schemas/study-import';
import type { Role } from '../../../shared/permissions';

const t = useTestApp({ IMPORT_MAX_MB: '0.05' });
let team: Awaited<ReturnType<typeof createTeamWithAllRoles>>;
beforeAll(async () => {
  team = await createTeamWithAllRoles(t);
});

const base = () => `/api/teams/${team.teamId}/imports`;
const countStudies = async () =>
  (await t.deps.db.select().from(studies).where(eq(studies.teamId, team.teamId))).length;

function upload(
  agent: supertest.Agent,
  url: string,
  files: { choices?: string | Buffer; background?: string | Buffer },
  setup?: unknown,
) {
  let req = agent.post(url);
  if (setup !== undefined)
    req = req.field('setup', typeof setup === 'string' ? setup : JSON.stringify(setup));
  for (const [field, text] of Object.entries(files))
    req = req.attach(field, typeof text === 'string' ? Buffer.from(text, 'utf8') : text, {
      filename: `${field}.csv`,
      contentType: 'text/csv',
    });
  return req;
}

const small = [
  'respondent,task,alt,chosen,bill,river',
  'A,1,1,1,3,poor',
  'A,1,2,0,6,good',
  'A,2,1,0,0,fair',
  'A,2,2,1,10,good',
  'B,1,1,0,3,poor',
  'B,1,2,1,6,good',
  'B,2,1,1,0,fair',
  'B,2,2,0,10,good',
].join('\n');

const setupFor = (attributes: ImportAttribute[]) => ({ name: 'Imported water study', attributes });

describe('POST /imports/preview', () => {
  it('when the file is valid, infers the attributes and counts, and saves nothing', async () => {
    const before = await countStudies();
    const res = await upload(team.agents.editor, `${base()}/preview`, { choices: small }).expect(
      200,
    );
    const body = res.body as ImportPreview;
    expect(body).toMatchObject({
      rows: 8,
      respondents: 2,
      tasks: 4,
      alternativesPerTask: 2,
      choiceSets: 2,
      problemCount: 0,
      problems: [],
    });
    expect(body.attributes).toEqual([
      {
        column: 'bill',
        name: 'Bill',
        kind: 'numeric',
        coding: 'linear',
        isCost: true,
        levels: [0, 3, 6, 10].map((v) => ({ raw: String(v), label: '', value: v })),
      },
      {
        column: 'river',
        name: 'River',
        kind: 'categorical',
        coding: 'dummy',
        isCost: false,
        levels: ['poor', 'good', 'fair'].map((v) => ({ raw: v, label: v })),
      },
    ]);
    expect(await countStudies()).toBe(before);
  });

  it('when rows are bad, lists each problem with its line and column', async () => {
    const text = [
      'respondent,task,alt,chosen,bill,river',
      'A,1,1,0,3,poor', // 2: task A/1 has no chosen alternative
      'A,1,2,0,6,good',
      'A,2,1,1,0,fair', // 4: task A/2 has two chosen
      'A,2,2,1,ten,good', // 5: not numeric
      'B,1,1,1,3,poor',
      'B,1,2,0,6,', // 7: B has no river here but has one elsewhere
      'B,1,2,0,6,good', // 8: duplicate of line 7 (same respondent, task, alt)
      'B,2,1,1,0,fair',
      'B,2,2,0,10,good',
      'B,3,1,1', // 11: field count
    ].join('\n');
    const body = (
      await upload(team.agents.editor, `${base()}/preview`, { choices: text }).expect(200)
    ).body as ImportPreview;
    const found = body.problems.map((p) => [p.line, p.column, p.code]);
    expect(found).toEqual(
      expect.arrayContaining([
        [2, 'chosen', 'chosen_count'],
        [4, 'chosen', 'chosen_count'],
        [5, 'bill', 'not_numeric'],
        [7, 'river', 'inconsistent_attributes'],
        [8, 'alt', 'duplicate_row'],
        [11, null, 'field_count'],
      ]),
    );
    expect(body.problemCount).toBe(body.problems.length);
    expect(body.problems.find((p) => p.code === 'not_numeric')?.message).toContain('“ten”');
  });

  it('counts lines as an editor shows them: empty lines and line breaks inside quotes included', async () => {
    const text = [
      'respondent,task,alt,chosen,bill,river',
      'A,1,1,1,3,"poor',
      'water"', // line 3 belongs to the quoted cell that starts on line 2
      'A,1,2,0,6,good',
      '',
      'A,2,1,1,0,fair',
      'A,2,2,1,10,good', // line 7: the task of line 6 has two chosen
    ].join('\n');
    const body = (
      await upload(team.agents.editor, `${base()}/preview`, { choices: text }).expect(200)
    ).body as ImportPreview;
    expect(body.problems.map((p) => [p.line, p.column, p.code])).toEqual([
      [6, 'chosen', 'chosen_count'],
    ]);
  });

  it('reads a semicolon file with a byte-order mark and CRLF line ends as its comma twin', async () => {
    // How a spreadsheet set to a comma-decimal locale saves "CSV UTF-8" (server/lib/csv-dialect.ts).
    const semicolons = '\uFEFF' + small.replaceAll(',', ';').replaceAll('\n', '\r\n') + '\r\n';
    const [comma, semi] = await Promise.all(
      [small, semicolons].map(
        async (choices) =>
          (await upload(team.agents.editor, `${base()}/preview`, { choices }).expect(200))
            .body as ImportPreview,
      ),
    );
    expect(semi).toEqual(comma);
    expect(semi.problemCount).toBe(0);
  });

  it('reads decimal commas of a semicolon file as numbers, and a background file likewise', async () => {
    const choices = small.replaceAll(',', ';').replace(/;3;/g, ';2,5;');
    const body = (
      await upload(team.agents.editor, `${base()}/preview`, {
        choices,
        background: 'respondent;income\nA;1,5\nB;2\n',
      }).expect(200)
    ).body as ImportPreview;
    expect(body.problems).toEqual([]);
    expect(body.attributes.find((a) => a.column === 'bill')).toMatchObject({
      kind: 'numeric',
      isCost: true,
      levels: [0, 2.5, 6, 10].map((v) => ({ raw: String(v), label: '', value: v })),
    });
    expect(body.background?.columns).toEqual([
      expect.objectContaining({ column: 'income', type: 'number' }),
    ]);
  });

  it('reads a choice file a Windows spreadsheet saved in Windows-1252 with its levels intact', async () => {
    // latin1 and Windows-1252 agree on é and è (0xE9, 0xE8).
    const accents = small.replaceAll('poor', 'pollué').replaceAll('good', 'très bon');
    const [utf8, windows] = await Promise.all(
      [Buffer.from(accents, 'utf8'), Buffer.from(accents, 'latin1')].map(
        async (choices) =>
          (await upload(team.agents.editor, `${base()}/preview`, { choices }).expect(200))
            .body as ImportPreview,
      ),
    );
    expect(windows).toEqual(utf8);
    expect(windows.attributes.find((a) => a.column === 'river')?.levels.map((l) => l.raw)).toEqual([
      'pollué',
      'très bon',
      'fair',
    ]);
  });

  it('finds respondent, task, alt and chosen whatever the case of their headings', async () => {
    const capitalised = small.replace('respondent,task,alt,chosen', 'Respondent,Task,ALT,Chosen');
    const [plain, capitals] = await Promise.all(
      [small, capitalised].map(
        async (choices) =>
          (await upload(team.agents.editor, `${base()}/preview`, { choices }).expect(200))
            .body as ImportPreview,
      ),
    );
    expect(capitals).toEqual({ ...plain, columns: expect.any(Array) });
    expect(capitals.attributes.map((a) => a.column)).toEqual(['bill', 'river']);
  });

  it('reads a choice file saved as "Unicode text" (UTF-16 with its mark, tab separated)', async () => {
    const tabs = small.replaceAll(',', '\t').replaceAll('poor', 'zła');
    const unicode = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(tabs, 'utf16le')]);
    const [utf8, utf16] = await Promise.all(
      [Buffer.from(tabs, 'utf8'), unicode].map(
        async (choices) =>
          (await upload(team.agents.editor, `${base()}/preview`, { choices }).expect(200))
            .body as ImportPreview,
      ),
    );
    expect(utf16).toEqual(utf8);
    expect(utf16.problemCount).toBe(0);
    expect(utf16.attributes.find((a) => a.column === 'river')?.levels[0].raw).toBe('zła');
  });

  it('keeps a quoted semicolon inside a cell of a semicolon file, and names the line of a field-count error', async () => {
    const text = [
      'respondent;task;alt;chosen;bill;river',
      'A;1;1;1;3;"poor; muddy"',
      'A;1;2;0;6;good',
      'A;2;1;0;0;fair',
      'A;2;2;1;10;good',
      'A;3;1;1;10', // line 6: one field short
    ].join('\n');
    const body = (
      await upload(team.agents.editor, `${base()}/preview`, { choices: text }).expect(200)
    ).body as ImportPreview;
    expect(body.attributes.find((a) => a.column === 'river')?.levels.map((l) => l.raw)).toContain(
      'poor; muddy',
    );
    expect(body.problems.map((p) => [p.line, p.code])).toEqual([[6, 'field_count']]);
  });

  it('when a key column is missing, names it on line 1 and reads no further', async () => {
    const body = (
      await upload(team.agents.editor, `${base()}/preview`, {
        choices: 'respondent,task,option,chosen,bill\nA,1,1,1,3\n',
      }).expect(200)
    ).body as ImportPreview;
    expect(body.problems).toEqual([
      expect.objectContaining({ line: 1, column: 'alt', code: 'missing_column' }),
    ]);
    expect(body.rows).toBe(0);
  });

  it('when an edited set-up makes a column numeric, reports its text values', async () => {
    const setup = setupFor([
      {
        column: 'river',
        name: 'River health',
        kind: 'numeric',
        coding: 'linear',
        isCost: false,
        levels: [
          { raw: '1', label: '', value: 1 },
          { raw: '2', label: '', value: 2 },
        ],
      },
    ]);
    const body = (
      await upload(team.agents.editor, `${base()}/preview`, { choices: small }, setup).expect(200)
    ).body as ImportPreview;
    expect(body.problems.map((p) => [p.line, p.column, p.code])).toEqual([
      [2, 'river', 'not_numeric'],
      [3, 'river', 'not_numeric'],
      [4, 'river', 'not_numeric'],
    ]);
  });

  it('when no file is sent, returns 400 naming the field', async () => {
    const res = await team.agents.editor.post(`${base()}/preview`).field('x', '1').expect(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_input' });
    expect(res.body.error.fields).toEqual([{ path: 'choices', message: 'Choose a file' }]);
  });

  it('when the file is larger than the cap, returns 413 naming the field', async () => {
    const res = await upload(team.agents.editor, `${base()}/preview`, {
      choices: syntheticChoiceCsv(100),
    }).expect(413);
    expect(res.body.error).toMatchObject({ code: 'file_too_large' });
    expect(res.body.error.fields[0].path).toBe('choices');
  });
});

describe('POST /imports', () => {
  const inferred = async (choices: string) =>
    (
      (await upload(team.agents.owner, `${base()}/preview`, { choices }).expect(200))
        .body as ImportPreview
    ).attributes;

  it('when the file has problems, returns 422 with line and column and saves nothing', async () => {
    const before = await countStudies();
    const bad = small.replace('A,1,2,0,6,good', 'A,1,2,1,6,good');
    const res = await upload(
      team.agents.editor,
      base(),
      { choices: bad },
      setupFor(await inferred(small)),
    ).expect(422);
    expect(res.body.error).toMatchObject({ code: 'import_problems' });
    expect(res.body.error.message).toContain('nothing was saved');
    expect(res.body.error.fields).toEqual([
      {
        path: 'choices[line 2].chosen',
        message: expect.stringContaining('2 alternatives are chosen'),
      },
    ]);
    expect(await countStudies()).toBe(before);
  });

  it('when the set-up is not valid JSON, returns 400 on the setup field', async () => {
    const res = await upload(team.agents.editor, base(), { choices: small }, '{nope').expect(400);
    expect(res.body.error.fields[0]).toMatchObject({ path: 'setup' });
  });

  it('when an attribute has one level, returns 400 naming that field', async () => {
    const [bill] = await inferred(small);
    const res = await upload(
      team.agents.editor,
      base(),
      { choices: small },
      setupFor([{ ...bill, levels: bill.levels.slice(0, 1) }]),
    ).expect(400);
    expect(res.body.error.fields[0]).toMatchObject({ path: 'setup.attributes.0.levels' });
  });

  it('when the background file names an unknown respondent, returns 422 with its line', async () => {
    const res = await upload(
      team.agents.editor,
      base(),
      { choices: small, background: 'respondent,household\nA,2\nZ,3\n' },
      setupFor(await inferred(small)),
    ).expect(422);
    expect(res.body.error.fields).toEqual([
      { path: 'background[line 3].respondent', message: expect.stringContaining('“Z”') },
    ]);
  });

  it('reads a tab-separated background file beside a comma-separated choice file', async () => {
    const res = await upload(
      team.agents.editor,
      `${base()}/preview`,
      { choices: small, background: 'respondent\thousehold\tnote\nA\t2\t"one, two"\nB\t3\t\n' },
      setupFor(await inferred(small)),
    ).expect(200);
    const body = res.body as ImportPreview;
    expect(body.problems).toEqual([]);
    expect(body.background?.columns.map((c) => c.column)).toEqual(['household', 'note']);
  });

  it('when all is well, creates a closed study marked imported that cannot go live', async () => {
    const res = await upload(
      team.agents.editor,
      base(),
      { choices: small, background: 'respondent,household,tenure\nA,2,owner\nB,,renter\n' },
      setupFor(await inferred(small)),
    ).expect(201);
    expect(res.body).toMatchObject({ respondents: 2, tasks: 4, rows: 8 });
    const study = (
      await team.agents.viewer
        .get(`/api/teams/${team.teamId}/studies/${res.body.studyId}`)
        .expect(200)
    ).body;
    expect(study).toMatchObject({ status: 'closed', source: 'imported', currentVersion: 1 });
    expect(study.counts).toMatchObject({ respondents: 2 });
    // Background answers are stored as fielded ones (q:<key>), empty cells left unanswered.
    const background = await listQuestionAnswers(t.deps.db, { studyId: res.body.studyId });
    expect(background.map((a) => [a.screenKey, a.value]).sort()).toEqual([
      ['q:household', { kind: 'number', number: 2 }],
      ['q:tenure', { kind: 'single', optionId: 'o1' }],
      ['q:tenure', { kind: 'single', optionId: 'o2' }],
    ]);
    const live = await team.agents.editor
      .post(`/api/teams/${team.teamId}/studies/${res.body.studyId}/lifecycle/go-live`)
      .expect(409);
    expect(live.body.error.code).toBe('study_imported');
  });
});

describe('roles', () => {
  const cases: [Role | 'outsider', number][] = [
    ['owner', 200],
    ['editor', 200],
    ['analyst', 403],
    ['viewer', 403],
    // Another team's member does not learn that the team exists.
    ['outsider', 404],
  ];
  it.each(cases)('preview as %s answers %i', async (role, status) => {
    const agent = role === 'outsider' ? team.outsider : team.agents[role];
    await upload(agent, `${base()}/preview`, { choices: small }).expect(status);
  });
  it.each(cases)('save as %s answers %i', async (role, status) => {
    const agent = role === 'outsider' ? team.outsider : team.agents[role];
    const before = await countStudies();
    const attributes = (
      (await upload(team.agents.owner, `${base()}/preview`, { choices: small }).expect(200))
        .body as ImportPreview
    ).attributes;
    await upload(agent, base(), { choices: small }, setupFor(attributes)).expect(
      status === 200 ? 201 : status,
    );
    expect(await countStudies()).toBe(before + (status === 200 ? 1 : 0));
  });
});
