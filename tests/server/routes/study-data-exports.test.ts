/**
 * The study's data files: the long choice file (inclusion and why not, task order, positions,
 * seconds per task), the wide respondent file with its R import script, and their codebook.
 * Counts are checked against the database; the R script against the CSV it reads.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import { and, count, eq, isNotNull } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { answers, respondents } from '../../../db/schema/fieldwork';
import { parseChoiceCsv } from '../../../server/engine/estimation/parse-choice-csv';
import { N, useTastesStudy } from './tastes-fixture';

const t = useTestApp({}, { signIn: 'team' });
const extra: Record<'screenedWithTask' | 'excluded' | 'screenedEarly', string> = {
  screenedWithTask: '',
  excluded: '',
  screenedEarly: '',
};

const token = () => randomBytes(16).toString('hex');

const study = useTastesStudy(t, 'exports');

beforeAll(async () => {
  const db = t.deps.db;
  const add = async (
    key: keyof typeof extra,
    values: Partial<typeof respondents.$inferInsert>,
    plan: unknown,
    rows: Partial<typeof answers.$inferInsert>[],
  ) => {
    const [r] = await db
      .insert(respondents)
      .values({
        studyId: study.studyId,
        versionId: study.versionId,
        sessionToken: token(),
        block: 1,
        plan,
        startedAt: new Date(Date.UTC(2026, 0, 2, 9, Object.keys(extra).indexOf(key))),
        ...values,
      })
      .returning({ id: respondents.id });
    extra[key] = r.id;
    if (rows.length > 0)
      await db.insert(answers).values(
        rows.map((a) => ({
          respondentId: r.id,
          studyId: study.studyId,
          clientId: token(),
          screenKey: '',
          ...a,
        })),
      );
  };
  // Shown task 2 first; on its screen: design alternative 2, the status quo, alternative 1.
  await add(
    'screenedWithTask',
    { status: 'screened_out' },
    {
      seed: 9,
      block: 1,
      taskOrder: [2, 1],
      positions: { 'task:2': [1, -1, 0], 'task:1': [0, 1, -1] },
    },
    [
      {
        screenKey: 'task:2',
        taskNumber: 2,
        chosenAlternative: 1,
        chosenPosition: 0,
        responseMs: 2500,
        value: { kind: 'choice', position: 0, certainty: 7 },
      },
    ],
  );
  await add(
    'excluded',
    {
      status: 'completed',
      included: false,
      exclusionReason: 'same position every time',
      durationMs: 61000,
      finishedAt: new Date(Date.UTC(2026, 0, 2, 9, 5)),
    },
    { seed: 10, block: 1, taskOrder: [1, 2], positions: {} },
    [1, 2].map((task) => ({
      screenKey: `task:${task}`,
      taskNumber: task,
      chosenAlternative: -1,
      chosenPosition: 2,
      responseMs: 1500,
      value: { kind: 'choice', position: 2 },
    })),
  );
  await add(
    'screenedEarly',
    { status: 'screened_out', externalId: '@SUM(A1)' },
    { seed: 11, block: 1, taskOrder: [1, 2], positions: {} },
    [
      { screenKey: 'q:age_band', value: { kind: 'single', optionId: 'a65' } },
      { screenKey: 'q:comments', value: { kind: 'text', text: '=cmd|calc' } },
    ],
  );
});

async function csvOf(role: 'analyst' | 'viewer', path: string) {
  const res = await t.team.agents[role].get(`${study.base}/${path}`).expect(200);
  return { res, rows: parse(res.text, { columns: true }) as Record<string, string>[] };
}

async function choiceAnswersInDb(): Promise<number> {
  const [{ n }] = await t.deps.db
    .select({ n: count() })
    .from(answers)
    .where(and(eq(answers.studyId, study.studyId), isNotNull(answers.chosenAlternative)));
  return n;
}

describe('GET /exports/choices.csv (the long choice file)', () => {
  it('has one row per alternative shown of every answered task, counted against the database', async () => {
    const { res, rows } = await csvOf('viewer', 'choices.csv');
    const header = (parse(res.text) as string[][])[0];
    expect(header.slice(0, 13)).toEqual([
      'respondent',
      'number',
      'included',
      'exclusion',
      'version',
      'task',
      'task_shown',
      'alt',
      'alt_position',
      'chosen',
      'holdout',
      'task_seconds',
      'certainty',
    ]);
    expect(header).toContain('monthly_bill_increase');
    // Two designed packages and the status quo on every screen.
    expect(rows).toHaveLength(3 * (await choiceAnswersInDb()));
    expect(rows.filter((r) => r.chosen === '1')).toHaveLength(await choiceAnswersInDb());
  });

  it('marks screened-out and excluded respondents included=false and says why', async () => {
    const { rows } = await csvOf('viewer', 'choices.csv');
    const of = (id: string) => rows.filter((r) => r.respondent === id);
    expect(of(extra.screenedWithTask).every((r) => r.included === 'false')).toBe(true);
    expect(of(extra.screenedWithTask)[0].exclusion).toBe('screened out');
    expect(of(extra.excluded).map((r) => r.exclusion)).toEqual(
      Array(6).fill('excluded by the team: same position every time'),
    );
    const included = rows.filter((r) => r.included === 'true');
    expect(new Set(included.map((r) => r.respondent)).size).toBe(N);
    expect(included.every((r) => r.exclusion === '')).toBe(true);
  });

  it("gives the order the task was shown, each alternative's place on screen and the seconds", async () => {
    const { rows } = await csvOf('viewer', 'choices.csv');
    const task2 = rows.filter((r) => r.respondent === extra.screenedWithTask && r.task === '2');
    expect(
      task2.map((r) => [
        r.alt,
        r.alt_position,
        r.chosen,
        r.task_shown,
        r.task_seconds,
        r.certainty,
      ]),
    ).toEqual([
      ['1', '3', '0', '1', '2.5', '7'],
      ['2', '1', '1', '1', '2.5', '7'],
      ['3', '2', '0', '1', '2.5', '7'],
    ]);
    // A record without positions leaves the column empty rather than guessing.
    const first = rows.find((r) => r.respondent === study.respondentIds[0] && r.task === '1')!;
    // …and a task that asked no certainty question leaves that column empty.
    expect(first).toMatchObject({
      task_shown: '1',
      alt_position: '',
      task_seconds: '4',
      certainty: '',
    });
  });

  it('is read by the command-line estimator, which leaves included=false rows out', async () => {
    const { res } = await csvOf('viewer', 'choices.csv');
    const parsed = parseChoiceCsv(res.text, ['monthly_bill_increase']);
    expect(new Set(parsed.map((r) => r.respondent))).toEqual(new Set(study.respondentIds));
    expect(parsed).toHaveLength(N * 2 * 3);
  });

  it("with a run, is exactly the estimation data: included respondents, the run's columns", async () => {
    const res = await t.team.agents.viewer
      .get(`${study.base}/choices.csv`)
      .query({ runId: study.runId })
      .expect(200);
    expect(res.headers['content-disposition']).toContain('choices-estimated');
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0])).toEqual([
      'respondent',
      'task',
      'alt',
      'chosen',
      'holdout',
      'monthly_bill_increase',
      'river_health_good',
      'asc_current_service',
    ]);
    expect(rows).toHaveLength(N * 2 * 3);
  });
});

/** The column names and classes of the script's col_types vector. */
function scriptColumns(script: string): [string, string][] {
  const block = /col_types <- c\(\n([\s\S]*?)\n\)/.exec(script)![1];
  return block.split(',\n').map((line) => {
    const m = /^\s*"([^"]+)" = "(\w+)"$/.exec(line)!;
    return [m[1], m[2]];
  });
}

const isIso = (s: string) => !Number.isNaN(Date.parse(s)) && /Z$/.test(s);

describe('GET /exports/respondents-wide.csv and .R', () => {
  it('has one row per respondent of every status, counted against the database', async () => {
    const { rows } = await csvOf('analyst', 'respondents-wide.csv');
    const [{ n }] = await t.deps.db
      .select({ n: count() })
      .from(respondents)
      .where(eq(respondents.studyId, study.studyId));
    expect(rows).toHaveLength(n);
    const early = rows.find((r) => r.respondent === extra.screenedEarly)!;
    expect(early).toMatchObject({
      status: 'screened_out',
      included: 'false',
      exclusion: 'screened out',
      external_id: "'@SUM(A1)",
      q_comments: "'=cmd|calc",
      q_age_band: '65 or over',
      task_1: '1',
      choice_1: '',
    });
    const screened = rows.find((r) => r.respondent === extra.screenedWithTask)!;
    expect(screened).toMatchObject({
      task_1: '2',
      choice_1: '2',
      position_1: '1',
      seconds_1: '2.5',
      certainty_1: '7',
    });
    const excluded = rows.find((r) => r.respondent === extra.excluded)!;
    expect(excluded).toMatchObject({ choice_1: '0', choice_2: '0', duration_seconds: '61' });
    // A choice whose task asked no certainty question leaves its certainty cell empty.
    expect(excluded.certainty_1).toBe('');
  });

  it('comes with an R script whose columns, types and factor levels fit the CSV', async () => {
    const { res, rows } = await csvOf('analyst', 'respondents-wide.csv');
    const header = (parse(res.text) as string[][])[0];
    const r = await t.team.agents.analyst.get(`${study.base}/respondents-wide.R`).expect(200);
    expect(r.headers['content-disposition']).toMatch(/respondents-wide-\d{4}-\d\d-\d\d\.R"/);
    const script = r.text;
    const columns = scriptColumns(script);
    expect(columns.map(([name]) => name)).toEqual(header);
    const csvName = /filename="([^"]+)"/.exec(res.headers['content-disposition'])![1];
    expect(script).toContain(`path <- "${csvName}"`);
    // What R's read.csv would do with each colClasses entry, cell by cell.
    for (const [name, type] of columns)
      for (const row of rows) {
        const cell = row[name];
        if (cell === '') continue;
        if (type === 'integer') expect(cell, name).toMatch(/^-?\d+$/);
        if (type === 'numeric') expect(Number.isFinite(Number(cell)), name).toBe(true);
        if (type === 'logical') expect(['true', 'false'], name).toContain(cell);
      }
    expect(Object.fromEntries(columns)).toMatchObject({
      number: 'integer',
      included: 'logical',
      seconds_1: 'numeric',
      certainty_1: 'integer',
      q_household_size: 'numeric',
      q_age_band: 'character',
    });
    expect(script).toContain(
      'd[["q_age_band"]] <- factor(d[["q_age_band"]], levels = c("18–34", "35–64", "65 or over"))',
    );
    const statusLevels = /d\[\["status"\]\], levels = c\(([^)]*)\)/.exec(script)![1];
    for (const row of rows) expect(statusLevels).toContain(`"${row.status}"`);
    expect(script).toMatch(/as\.POSIXct\(d\[\["started_at"\]\]/);
    for (const row of rows) expect(isIso(row.started_at)).toBe(true);
  });

  it('leaves personal columns out of both files for a viewer', async () => {
    const { res } = await csvOf('viewer', 'respondents-wide.csv');
    const header = (parse(res.text) as string[][])[0];
    expect(header).not.toContain('external_id');
    expect(header).not.toContain('q_comments');
    const script = (await t.team.agents.viewer.get(`${study.base}/respondents-wide.R`).expect(200))
      .text;
    expect(scriptColumns(script).map(([name]) => name)).toEqual(header);
    await t.team.outsider.get(`${study.base}/respondents-wide.csv`).expect(404);
    await t.request().get(`${study.base}/respondents-wide.R`).expect(401);
  });
});

describe('GET /exports/codebook.csv and background answers', () => {
  it('documents every column of the long and the wide file', async () => {
    const { rows } = await csvOf('analyst', 'codebook.csv');
    for (const [file, path] of [
      ['choices-long', 'choices.csv'],
      ['respondents-wide', 'respondents-wide.csv'],
    ]) {
      const { res } = await csvOf('analyst', path);
      const header = (parse(res.text) as string[][])[0];
      expect(rows.filter((r) => r.file === file).map((r) => r.column)).toEqual(header);
    }
    expect(rows.find((r) => r.file === 'choices-long' && r.column === 'task_seconds')?.unit).toBe(
      'seconds',
    );
    expect(
      rows.find((r) => r.file === 'choices-long' && r.column === 'river_health_good')?.coding,
    ).toMatch(/^dummy coding: 1 = good, 0 otherwise \(reference level: poor\)$/);
  });

  it('never marks a screened-out respondent included in the background answers', async () => {
    const { rows } = await csvOf('viewer', 'background-answers.csv');
    const early = rows.find((r) => r.respondent === extra.screenedEarly)!;
    expect(early).toMatchObject({ included: 'false', exclusion: 'screened out' });
    expect(rows.filter((r) => r.status !== 'completed').every((r) => r.included === 'false')).toBe(
      true,
    );
  });
});
