import { beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import {
  codeStudyAnswers,
  hashChoiceData,
  hashChoiceDataInTurns,
  loadStudyChoiceData,
  toBuiltChoiceData,
  toLongCsvRows,
  toLongCsvText,
} from '../../../server/services/choice-data-from-study';
import type { VersionInput } from '../../../server/services/estimation/code-answers';
import { StudyDataError } from '../../../server/services/estimation/study-data-error';
import { HASH_SLICE_ROWS } from '../../../server/services/estimation/long-format';
import { listStudyRespondents } from '../../../db/queries/study-respondents';
import { eq } from 'drizzle-orm';
import { respondents } from '../../../db/schema/fieldwork';
import { parseChoiceCsv } from '../../../server/engine/estimation/parse-choice-csv';
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';
import { useTestApp } from '../../support/test-app';
import { createBareTeam } from '../../support/factories';
import { seedRunStudy, seedTapFilter, type SeededStudy } from '../jobs/run-fixtures';

const definition = makeStudyDefinition();
const packageA = { bill: 'b6', interrupt: 'i2', warn: 'w0', river: 'good', renew: 'r80' };
const packageB = { bill: 'b15', interrupt: 'i1', warn: 'w2', river: 'fair', renew: 'r50' };
const holdoutAlts = [
  { levels: { bill: 'b3', interrupt: 'i4', warn: 'w6', river: 'poor', renew: 'r20' } },
  { levels: packageB },
];

function makeVersion(overrides: Partial<VersionInput> = {}): VersionInput {
  return {
    id: 'v1',
    version: 1,
    definition,
    design: {
      blocks: 1,
      tasks: [
        { block: 1, task: 1, alternatives: [{ levels: packageA }, { levels: packageB }] },
        { block: 1, task: 2, alternatives: [{ levels: packageB }, { levels: packageA }] },
      ],
    },
    holdouts: [{ screenKey: 'holdout:h', alternatives: holdoutAlts }],
    warmupKeys: ['warmup:w'],
    ...overrides,
  };
}

const answersOf = (t1: number, t2: number) => [
  { screenKey: 'warmup:w', taskNumber: null, chosenAlternative: 0 },
  { screenKey: 'task:2', taskNumber: 2, chosenAlternative: t2 },
  { screenKey: 'task:1', taskNumber: 1, chosenAlternative: t1 },
  { screenKey: 'holdout:h', taskNumber: null, chosenAlternative: 1 },
  { screenKey: 'repeat:r', taskNumber: 1, chosenAlternative: 0 },
];

describe('codeStudyAnswers', () => {
  it('codes each alternative with the attribute codings and the status-quo constant', () => {
    const prepared = codeStudyAnswers(
      [makeVersion()],
      [{ id: 'r1', versionId: 'v1', answers: answersOf(0, -1) }],
    );
    // Columns: bill, interruptions (linear), warning days (effects, base 0 days = last),
    // river (dummy, reference poor), renewables (dummy, reference 50 %), status-quo constant.
    expect(prepared.columns.map((c) => c.key)).toEqual([
      'attr:bill',
      'attr:interrupt',
      'attr:warn:w6',
      'attr:warn:w2',
      'attr:river:fair',
      'attr:river:good',
      'attr:renew:r20',
      'attr:renew:r80',
      'asc:fixed',
    ]);
    expect(prepared.columns.map((c) => c.code)).toEqual([
      'monthly_bill_increase',
      'supply_interruptions_per_year',
      'taste_odour_warning_days_6_days',
      'taste_odour_warning_days_2_days',
      'river_health_fair',
      'river_health_good',
      'renewable_pumping_energy_20',
      'renewable_pumping_energy_80',
      'asc_current_service',
    ]);
    expect(prepared.columns.find((c) => c.isCost)?.key).toBe('attr:bill');
    const task1 = prepared.rows.filter((r) => r.task === 1);
    // Hand-coded from the level codes (dummy / effects / linear) of each attribute.
    expect(Array.from(task1[0].values)).toEqual([6, 2, -1, -1, 0, 1, 0, 1, 0]);
    expect(Array.from(task1[1].values)).toEqual([15, 1, 0, 1, 1, 0, 0, 0, 0]);
    expect(Array.from(task1[2].values)).toEqual([0, 4, 1, 0, 0, 0, 1, 0, 1]);
    expect(task1.map((r) => r.chosen)).toEqual([1, 0, 0]);
    const task2 = prepared.rows.filter((r) => r.task === 2);
    expect(task2.map((r) => r.chosen)).toEqual([0, 0, 1]);
    expect(task2.map((r) => r.alt)).toEqual([1, 2, 3]);
  });

  it('leaves warm-up tasks and repeated tasks out and keeps holdout tasks apart', () => {
    const prepared = codeStudyAnswers(
      [makeVersion()],
      [{ id: 'r1', versionId: 'v1', answers: answersOf(1, 0) }],
    );
    expect(prepared.summary).toMatchObject({
      respondents: 1,
      tasks: 2,
      holdoutTasks: 1,
      warmupTasksLeftOut: 1,
      versions: [1],
    });
    expect([...new Set(prepared.rows.map((r) => r.task))]).toEqual([1, 2, 'h1']);
    const holdout = prepared.rows.filter((r) => r.holdout);
    expect(holdout).toHaveLength(3);
    expect(holdout.map((r) => r.chosen)).toEqual([0, 1, 0]);
    const built = toBuiltChoiceData(
      prepared,
      prepared.columns.map((c) => c.key),
    );
    expect(built.data.taskIds).toEqual(['1', '2']);
    expect(built.holdout?.taskIds).toEqual(['h1']);
  });

  it('codes labeled alternatives with constants for all but the first label', () => {
    const labeled = makeStudyDefinition({
      alternatives: {
        count: 2,
        labeled: true,
        labels: [
          { id: 'mains', name: 'Mains upgrade', omittedAttributeIds: [] },
          { id: 'bore', name: 'Borehole', omittedAttributeIds: ['river'] },
        ],
      },
      fixedAlternative: null,
    });
    const prepared = codeStudyAnswers(
      [makeVersion({ definition: labeled, holdouts: [], warmupKeys: [] })],
      [{ id: 'r1', versionId: 'v1', answers: answersOf(1, 0) }],
    );
    expect(prepared.columns.map((c) => c.key).slice(-1)).toEqual(['asc:bore']);
    const task1 = prepared.rows.filter((r) => r.task === 1);
    expect(task1).toHaveLength(2);
    // Borehole: river omitted (zeros), its constant 1; Mains: constant 0.
    expect(Array.from(task1[0].values)).toEqual([6, 2, -1, -1, 0, 1, 0, 1, 0]);
    expect(Array.from(task1[1].values)).toEqual([15, 1, 0, 1, 0, 0, 0, 0, 1]);
  });

  it('codes an opt-out as zeros with its own constant', () => {
    const optOut = makeStudyDefinition({
      fixedAlternative: { kind: 'opt_out', label: 'Neither package', levels: {} },
    });
    const prepared = codeStudyAnswers(
      [makeVersion({ definition: optOut, holdouts: [], warmupKeys: [] })],
      [{ id: 'r1', versionId: 'v1', answers: answersOf(-1, 0) }],
    );
    expect(prepared.columns.at(-1)).toMatchObject({
      key: 'asc:fixed',
      code: 'asc_neither_package',
    });
    const optOutRow = prepared.rows.find((r) => r.task === 1 && r.alt === 3)!;
    expect(Array.from(optOutRow.values)).toEqual([0, 0, 0, 0, 0, 0, 0, 0, 1]);
    expect(optOutRow.chosen).toBe(1);
  });

  it('counts respondents without a usable task and leaves them out', () => {
    const prepared = codeStudyAnswers(
      [makeVersion()],
      [
        { id: 'r1', versionId: 'v1', answers: answersOf(0, 1) },
        { id: 'r2', versionId: 'v1', answers: [answersOf(0, 1)[0]] },
      ],
    );
    expect(prepared.summary).toMatchObject({ respondents: 1, respondentsWithoutTasks: 1 });
    expect(prepared.rows.every((r) => r.respondent === 'r1')).toBe(true);
  });

  it('keeps the respondents in the order read (respondent number), so the hash follows it', () => {
    const r1 = { id: 'b', versionId: 'v1', answers: answersOf(0, 1) };
    const r2 = { id: 'a', versionId: 'v1', answers: answersOf(1, -1) };
    const one = codeStudyAnswers([makeVersion()], [r1, r2]);
    expect([...new Set(one.rows.map((r) => r.respondent))]).toEqual(['b', 'a']);
    expect(hashChoiceData(codeStudyAnswers([makeVersion()], [r1, r2]))).toBe(hashChoiceData(one));
    const other = codeStudyAnswers([makeVersion()], [r1, { ...r2, answers: answersOf(0, -1) }]);
    expect(hashChoiceData(other)).not.toBe(hashChoiceData(one));
    expect(hashChoiceData(one)).toBe(createHash('sha256').update(toLongCsvText(one)).digest('hex'));
  });

  it('takes the same hash in slices, across slice boundaries and quoted cells, as of the whole CSV', async () => {
    const r1 = { id: 'b', versionId: 'v1', answers: answersOf(0, 1) };
    const one = codeStudyAnswers([makeVersion()], [r1]);
    const rowsPer = one.rows.length;
    // Two and a half slices of rows, with respondent ids that need quoting ("r,7").
    const count = Math.ceil((2.5 * HASH_SLICE_ROWS) / rowsPer) * rowsPer;
    const big = {
      ...one,
      rows: Array.from({ length: count }, (_, i) => ({
        ...one.rows[i % rowsPer],
        respondent: `r,${Math.floor(i / rowsPer)}`,
      })),
    };
    const whole = createHash('sha256').update(toLongCsvText(big)).digest('hex');
    expect(toLongCsvText(big)).toContain('"r,7"');
    expect(hashChoiceData(big)).toBe(whole);
    expect(await hashChoiceDataInTurns(big)).toBe(whole);
    expect(await hashChoiceDataInTurns(one)).toBe(hashChoiceData(one));
  });

  it('orders respondents by id in the data order of runs stored before (respondent-id)', () => {
    const r1 = { id: 'b', versionId: 'v1', answers: answersOf(0, 1) };
    const r2 = { id: 'a', versionId: 'v1', answers: answersOf(1, -1) };
    const one = codeStudyAnswers([makeVersion()], [r1, r2], 'respondent-id');
    const two = codeStudyAnswers([makeVersion()], [r2, r1], 'respondent-id');
    expect([...new Set(one.rows.map((r) => r.respondent))]).toEqual(['a', 'b']);
    expect(hashChoiceData(one)).toBe(hashChoiceData(two));
  });

  it('pools versions with different designs: each respondent is coded with their version', () => {
    // Version 2 is a redesign: same attributes, task 1 shows other packages.
    const v2 = makeVersion({
      id: 'v2',
      version: 2,
      design: {
        blocks: 1,
        tasks: [
          { block: 1, task: 1, alternatives: [{ levels: packageB }, { levels: packageB }] },
          { block: 1, task: 2, alternatives: [{ levels: packageA }, { levels: packageA }] },
        ],
      },
    });
    const prepared = codeStudyAnswers(
      [makeVersion(), v2],
      [
        { id: 'r1', versionId: 'v1', answers: answersOf(0, 1) },
        { id: 'r2', versionId: 'v2', answers: answersOf(0, 1) },
        { id: 'r3', versionId: 'v2', answers: answersOf(1, 0) },
      ],
    );
    expect(prepared.summary.versions).toEqual([1, 2]);
    expect(prepared.summary.respondentsPerVersion).toEqual([
      { version: 1, respondents: 1 },
      { version: 2, respondents: 2 },
    ]);
    const bill = prepared.columns.findIndex((c) => c.key === 'attr:bill');
    const billOf = (respondent: string) =>
      prepared.rows
        .filter((r) => r.respondent === respondent && r.task === 1 && Number(r.alt) <= 2)
        .map((r) => r.values[bill]);
    expect(billOf('r1')).toEqual([6, 15]);
    expect(billOf('r2')).toEqual([15, 15]);
  });

  it('refuses versions that code their attributes differently', () => {
    const v2 = makeVersion({
      id: 'v2',
      version: 2,
      definition: makeStudyDefinition({ fixedAlternative: null }),
    });
    expect(() => codeStudyAnswers([makeVersion(), v2], [])).toThrow(StudyDataError);
  });
});

describe('toLongCsvRows', () => {
  it('writes the long format the command-line estimator reads, with codes as headers', () => {
    const prepared = codeStudyAnswers(
      [makeVersion()],
      [{ id: 'r1', versionId: 'v1', answers: answersOf(0, 1) }],
    );
    const table = toLongCsvRows(prepared, ['attr:bill', 'asc:fixed']);
    expect(table.header).toEqual([
      'respondent',
      'task',
      'alt',
      'chosen',
      'holdout',
      'monthly_bill_increase',
      'asc_current_service',
    ]);
    expect(table.rows[0]).toEqual(['r1', 1, 1, 1, 0, 6, 0]);
    const parsed = parseChoiceCsv(toLongCsvText(prepared), ['monthly_bill_increase']);
    expect(parsed).toHaveLength(prepared.rows.length);
    expect(parsed.filter((r) => r.holdout)).toHaveLength(3);
  });
});

describe('loadStudyChoiceData', () => {
  const t = useTestApp();
  let seeded: SeededStudy;
  beforeAll(async () => {
    const team = await createBareTeam(t);
    seeded = await seedRunStudy(t.deps.db, { teamId: team.id, respondents: 10 });
  });

  it('uses only included, completed respondents, in respondent-number order', async () => {
    // The fixture's ids follow the order of starting; the first respondent starting last makes
    // id order and respondent-number order differ.
    await t.deps.db
      .update(respondents)
      .set({ startedAt: new Date(Date.now() + 3_600_000) })
      .where(eq(respondents.id, seeded.respondentIds[0]));
    const prepared = await loadStudyChoiceData(t.deps.db, { studyId: seeded.studyId });
    const ids = [...new Set(prepared.rows.map((r) => String(r.respondent)))];
    const numbered = await listStudyRespondents(t.deps.db, { studyId: seeded.studyId });
    const inNumberOrder = [...numbered].sort((a, b) => a.number - b.number).map((r) => r.id);
    expect(ids).toEqual([...seeded.respondentIds.slice(1), seeded.respondentIds[0]]);
    expect(ids).toEqual(inNumberOrder.filter((id) => seeded.respondentIds.includes(id)));
    // Runs stored before the data order read them by id.
    const byId = await loadStudyChoiceData(t.deps.db, {
      studyId: seeded.studyId,
      order: 'respondent-id',
    });
    expect([...new Set(byId.rows.map((r) => String(r.respondent)))]).toEqual(seeded.respondentIds);
    expect(ids).not.toContain(seeded.excludedId);
    expect(ids).not.toContain(seeded.unfinishedId);
    expect(prepared.summary).toMatchObject({
      respondents: 10,
      tasks: 80,
      holdoutTasks: 10,
      warmupTasksLeftOut: 10,
    });
  });

  it('narrows the respondents to a saved filter', async () => {
    const filterId = await seedTapFilter(t.deps.db, seeded.studyId);
    const prepared = await loadStudyChoiceData(t.deps.db, { studyId: seeded.studyId, filterId });
    expect(prepared.summary.respondents).toBeGreaterThan(0);
    expect(prepared.summary.respondents).toBeLessThan(10);
  });
});
