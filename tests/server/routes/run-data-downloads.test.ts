/**
 * Downloads that must read respondents as a run does: the long choice file of a run fitted on
 * a saved filter holds exactly the run's data (its SHA-256 is the run's data hash), and the
 * answer history lists respondents in respondent-number order (the runs' `dataOrder`), in the
 * same order on every download.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import { answerRevisions } from '../../../db/schema/fieldwork';
import { respondentFilters, runs } from '../../../db/schema/models';
import { insertRespondentRow } from '../../../scripts/lib/study-factory/insert-respondent';
import { loadStudyChoiceData } from '../../../server/services/choice-data-from-study';
import { hashChoiceData } from '../../../server/services/estimation/long-format';
import { RUN_DATA_ORDER } from '../../../shared/schemas/run';
import { useTestApp } from '../../support/test-app';
import { ageBand, makeResults, useTastesStudy, spec } from './tastes-fixture';

const t = useTestApp({}, { signIn: 'team' });
let filteredRunId: string;
let filterId: string;
/** Respondents whose ids sort opposite to their numbers (they started in this order). */
const late = [
  'ffffffff-0000-4000-8000-000000000001',
  '88888888-0000-4000-8000-000000000002',
  '00000000-0000-4000-8000-000000000003',
];
const keys = spec.coefficients.map((c) => c.column);

const study = useTastesStudy(t, 'exports');

beforeAll(async () => {
  const db = t.deps.db;
  [{ id: filterId }] = await db
    .insert(respondentFilters)
    .values({
      studyId: study.studyId,
      name: 'Aged 35–64',
      definition: { conditions: [{ question: 'age_band', values: ['a35'] }] },
    })
    .returning({ id: respondentFilters.id });
  [{ id: filteredRunId }] = await db
    .insert(runs)
    .values({
      studyId: study.studyId,
      teamId: t.team.teamId,
      name: 'Mixed logit, aged 35–64',
      model: 'mixed',
      spec: { ...spec, respondents: { filterId }, dataOrder: RUN_DATA_ORDER },
      dataHash: 'cd'.repeat(32),
      status: 'done',
      results: makeResults(),
      finishedAt: new Date(),
    })
    .returning({ id: runs.id });

  // Each late respondent changed task 1 twice and the age question once; their answers are
  // written in one statement, so they share a created_at and only a tie-break orders them.
  const at = (minute: number) => new Date(Date.UTC(2026, 0, 3, 11, minute));
  const replacedAt = at(30);
  for (const [i, id] of late.entries()) {
    await insertRespondentRow(db, {
      id,
      studyId: study.studyId,
      versionId: study.versionId,
      plan: { seed: 20 + i, block: 1, taskOrder: [1, 2], positions: {} },
      startedAt: new Date(Date.UTC(2026, 0, 2, 9, i)),
      answers: [
        {
          screenKey: 'task:1',
          taskNumber: 1,
          chosenAlternative: 0,
          value: { kind: 'choice', position: 0 },
          revisionCount: 2,
          revisedAt: replacedAt,
        },
        {
          screenKey: 'q:age_band',
          value: { kind: 'single', optionId: 'a65' },
          revisionCount: 1,
          revisedAt: replacedAt,
        },
      ],
    });
    const answerIds = await db.query.answers.findMany({
      where: (a, { eq }) => eq(a.respondentId, id),
      columns: { id: true, screenKey: true },
    });
    const answerOf = (key: string) => answerIds.find((a) => a.screenKey === key)!.id;
    const revision = (screenKey: string, n: number, answered: number, replaced: number) => ({
      answerId: answerOf(screenKey),
      respondentId: id,
      studyId: study.studyId,
      screenKey,
      clientId: `${id}-${screenKey}-${n}`,
      taskNumber: screenKey === 'task:1' ? 1 : null,
      chosenAlternative: screenKey === 'task:1' ? n : null,
      value:
        screenKey === 'task:1'
          ? { kind: 'choice', position: n }
          : { kind: 'single', optionId: 'a18' },
      answeredAt: at(answered),
      replacedAt: at(replaced),
    });
    await db
      .insert(answerRevisions)
      .values([
        revision('task:1', 1, 0, 20),
        revision('task:1', 2, 20, 30),
        revision('q:age_band', 1, 10, 30),
      ]);
  }
});

const rowsOf = (text: string) => parse(text, { columns: true }) as Record<string, string>[];

describe('GET /exports/choices.csv?runId= of a run fitted on a saved filter', () => {
  it("holds exactly the run's respondents and rows, hashing to the run's data", async () => {
    const res = await t.team.agents.analyst
      .get(`${study.base}/choices.csv`)
      .query({ runId: filteredRunId })
      .expect(200);
    const rows = rowsOf(res.text);
    // The filter keeps age band a35: respondents 4 to 6 of the fixture (ageBand).
    const kept = study.respondentIds.filter((_, i) => ageBand[i] === 'a35');
    expect([...new Set(rows.map((r) => r.respondent))]).toEqual(kept);
    const used = await loadStudyChoiceData(t.deps.db, {
      studyId: study.studyId,
      filterId,
      order: RUN_DATA_ORDER,
    });
    expect(rows).toHaveLength(used.rows.length);
    expect(createHash('sha256').update(res.text).digest('hex')).toBe(hashChoiceData(used, keys));
  });

  it('without a filter, still holds every included respondent', async () => {
    const res = await t.team.agents.analyst
      .get(`${study.base}/choices.csv`)
      .query({ runId: study.runId })
      .expect(200);
    const ids = new Set(rowsOf(res.text).map((r) => r.respondent));
    expect(ids).toEqual(new Set([...study.respondentIds, ...late]));
  });
});

describe('GET /exports/answer-history.csv', () => {
  it('lists respondents in respondent-number order, not by id', async () => {
    const res = await t.team.agents.analyst.get(`${study.base}/answer-history.csv`).expect(200);
    const rows = rowsOf(res.text);
    expect([...new Set(rows.map((r) => r.respondent))]).toEqual(late);
    expect([...new Set(rows.map((r) => r.number))]).toEqual(['7', '8', '9']);
  });

  it('orders each respondent’s rows by screen, then oldest first, the current answer last', async () => {
    const res = await t.team.agents.analyst.get(`${study.base}/answer-history.csv`).expect(200);
    const ofFirst = rowsOf(res.text).filter((r) => r.respondent === late[0]);
    expect(ofFirst.map((r) => [r.screen, r.version, r.current])).toEqual([
      ['q:age_band', '1', 'false'],
      ['q:age_band', '2', 'true'],
      ['task:1', '1', 'false'],
      ['task:1', '2', 'false'],
      ['task:1', '3', 'true'],
    ]);
  });

  it('gives the same bytes on every download', async () => {
    const get = () =>
      t.team.agents.analyst
        .get(`${study.base}/answer-history.csv`)
        .expect(200)
        .then((r) => r.text);
    const first = await get();
    for (let i = 0; i < 3; i++) expect(await get()).toBe(first);
  });
});

describe('GET /exports/background-answers.csv', () => {
  it('lists the revised screens of each respondent in one fixed order', async () => {
    const res = await t.team.agents.analyst.get(`${study.base}/background-answers.csv`).expect(200);
    const mine = rowsOf(res.text).filter((r) => late.includes(r.respondent));
    expect(mine.map((r) => r.respondent)).toEqual(late);
    for (const r of mine) expect(r.revised_screens).toBe('q:age_band ×1; task:1 ×2');
  });
});
