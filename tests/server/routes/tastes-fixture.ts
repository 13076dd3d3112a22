/**
 * A closed Larkspur Valley Water study with six respondents, their choice and background
 * answers and a finished mixed-logit run whose taste profiles are set by hand, so the tests
 * know every value the API should return.
 */
import { randomBytes } from 'node:crypto';
import { beforeAll } from 'vitest';
import type { Db } from '../../../db/client';
import { runs, tasteProfiles } from '../../../db/schema/models';
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';
import { insertStudyRow } from '../../../scripts/lib/study-factory/insert-study';
import { insertRespondentRow } from '../../../scripts/lib/study-factory/insert-respondent';
import type { FileTestApp } from '../../support/test-app';

export const questionnaire = {
  pages: [
    { id: 'p0', kind: 'consent', title: 'Welcome', body: 'Consent text', agreeLabel: 'I agree' },
    {
      id: 'p1',
      kind: 'question',
      question: {
        key: 'age_band',
        type: 'single',
        text: 'Your age band',
        options: [
          { id: 'a18', label: '18–34' },
          { id: 'a35', label: '35–64' },
          { id: 'a65', label: '65 or over' },
        ],
      },
    },
    {
      id: 'p2',
      kind: 'question',
      question: {
        key: 'household_size',
        type: 'number',
        text: 'People in your home',
        min: 1,
        max: 12,
      },
    },
    {
      id: 'p3',
      kind: 'question',
      question: { key: 'comments', type: 'text', text: 'Anything else?' },
    },
    { id: 'p4', kind: 'tasks', title: 'Choices' },
    { id: 'p5', kind: 'end', title: 'Thanks', body: 'Done' },
  ],
};

export const design = {
  blocks: 1,
  tasks: [1, 2].map((task) => ({
    block: 1,
    task,
    alternatives: [
      { levels: { bill: 'b3', interrupt: 'i2', warn: 'w2', river: 'good', renew: 'r50' } },
      { levels: { bill: 'b6', interrupt: 'i1', warn: 'w0', river: 'fair', renew: 'r80' } },
    ],
  })),
};

/** Coefficients of the run: cost (negative lognormal), river good (normal), status-quo constant. */
export const spec = {
  model: 'mixed',
  coefficients: [
    { name: 'bill', column: 'attr:bill', distribution: 'neg_lognormal' },
    { name: 'river_good', column: 'attr:river:good', distribution: 'normal' },
    { name: 'asc_sq', column: 'asc:fixed', distribution: 'fixed' },
  ],
  correlated: false,
  draws: { type: 'halton', count: 100, seed: 1 },
  profileDraws: 500,
  cost: 'bill',
  starts: 1,
};

export const N = 6;
export const riverGood = (i: number) => i;
export const billMean = (i: number) => -0.1 * (i + 1);
export const effectiveDraws = [10, 50, 100, 200, 25, 300];
export const taskOneChoice = [0, 0, 1, 1, -1, -1];
export const ageBand = ['a18', 'a18', 'a18', 'a35', 'a35', 'a35'];
export const externalIds = ['=HYPERLINK("http://x")', 'EXT-1', 'EXT-2', 'EXT-3', 'EXT-4', 'EXT-5'];

export function makeResults() {
  return {
    model: 'mixed',
    loglik: -40.5,
    loglikNull: -50.2,
    respondents: N,
    observations: 2 * N,
    parameters: 5,
    iterations: 12,
    converged: true,
    convergence: { reason: 'gradient', gradientNorm: 1e-7, relativeChange: 1e-9 },
    rho2: 0.19,
    adjRho2: 0.09,
    aic: 91,
    bic: 93,
    hitRate: 0.6,
    holdoutHitRate: null,
    estimates: [
      { name: 'bill', estimate: -1.2, se: 0.2, robustSe: 0.25 },
      { name: 'river_good', estimate: 2.5, se: 0.5, robustSe: 0.6 },
      { name: 'asc_sq', estimate: -0.4, se: 0.3, robustSe: 0.3 },
      { name: 'sd.bill', estimate: 0.5, se: 0.1, robustSe: 0.1 },
      { name: 'sd.river_good', estimate: 1.7, se: 0.4, robustSe: 0.5 },
    ],
    population: [
      {
        name: 'bill',
        distribution: 'neg_lognormal',
        mean: -0.34,
        sd: 0.18,
        location: -1.2,
        spread: 0.5,
      },
      {
        name: 'river_good',
        distribution: 'normal',
        mean: 2.5,
        sd: 1.7,
        location: 2.5,
        spread: 1.7,
      },
      { name: 'asc_sq', distribution: 'fixed', mean: -0.4, sd: 0, location: -0.4, spread: 0 },
    ],
    wtp: [
      {
        name: 'river_good',
        estimate: 7.3,
        se: 1.1,
        deltaLower: 5.1,
        deltaUpper: 9.5,
        lower: 5.4,
        upper: 9.9,
      },
    ],
    individuals: null,
    draws: { type: 'halton', count: 100, seed: 1 },
    profileDraws: { type: 'halton', count: 500, seed: 7 },
    elapsedSeconds: 3.2,
    columns: [
      { key: 'attr:bill', coefficient: 'bill', label: 'Monthly bill increase (€)' },
      { key: 'attr:river:good', coefficient: 'river_good', label: 'River health: good' },
      { key: 'asc:fixed', coefficient: 'asc_sq', label: 'Constant: Current service' },
    ],
    data: {
      respondents: N,
      tasks: 2 * N,
      holdoutTasks: 0,
      warmupTasksLeftOut: 0,
      respondentsWithoutTasks: 0,
      versions: [1],
    },
  };
}

const token = () => randomBytes(16).toString('hex');

export async function seedTastesStudy(db: Db, teamId: string) {
  const study = await insertStudyRow(db, {
    teamId,
    publicId: token().slice(0, 12),
    name: 'Larkspur Valley Water packages',
    status: 'closed',
    definition: makeStudyDefinition(),
    design,
    questionnaire,
  });
  const respondentIds: string[] = [];
  for (let i = 0; i < N; i++) {
    const answer = (screenKey: string, value: unknown, extra = {}) => ({
      clientId: token(),
      screenKey,
      value,
      ...extra,
    });
    const id = await insertRespondentRow(db, {
      studyId: study.studyId,
      versionId: study.versionId!,
      sessionToken: token(),
      externalId: externalIds[i],
      plan: { seed: i, block: 1, taskOrder: [1, 2], positions: {} },
      startedAt: new Date(Date.UTC(2026, 0, 1, 9, i)),
      flags: i === 2 ? { speeder: true, samePosition: false } : {},
      answers: [
        answer('q:age_band', { kind: 'single', optionId: ageBand[i] }),
        answer('q:household_size', { kind: 'number', number: i + 1 }),
        answer('q:comments', { kind: 'text', text: i === 0 ? '+call me on 555' : 'fine' }),
        answer(
          'task:1',
          { kind: 'choice', position: 0 },
          { taskNumber: 1, chosenAlternative: taskOneChoice[i], responseMs: 4000 },
        ),
        answer(
          'task:2',
          { kind: 'choice', position: 1 },
          { taskNumber: 2, chosenAlternative: 0, responseMs: 3000 },
        ),
      ],
    });
    respondentIds.push(id);
  }
  const insertRun = async (status: 'done' | 'running') => {
    const [run] = await db
      .insert(runs)
      .values({
        studyId: study.studyId,
        teamId,
        name: status === 'done' ? 'Mixed logit, normal river, lognormal bill' : 'Still running',
        model: 'mixed',
        spec,
        dataHash: 'ab'.repeat(32),
        status,
        results: status === 'done' ? makeResults() : null,
        finishedAt: status === 'done' ? new Date() : null,
      })
      .returning({ id: runs.id });
    return run.id;
  };
  const runId = await insertRun('done');
  const runningRunId = await insertRun('running');
  await db.insert(tasteProfiles).values(
    respondentIds.map((respondentId, i) => ({
      runId,
      respondentId,
      mean: { bill: billMean(i), river_good: riverGood(i), asc_sq: -0.4 },
      sd: { bill: 0.05, river_good: 0.5 + i / 10, asc_sq: 0 },
      wtp: { river_good: riverGood(i) / -billMean(i), asc_sq: -0.4 / -billMean(i) },
      effectiveDraws: effectiveDraws[i],
    })),
  );
  return {
    studyId: study.studyId,
    versionId: study.versionId!,
    runId,
    runningRunId,
    respondentIds,
  };
}

export type SeededTastesStudy = Awaited<ReturnType<typeof seedTastesStudy>>;

/**
 * The set-up of the test files that read the seeded study through the API: before their tests,
 * seeds it for `t`'s team and sets `base` to its API path under `section` (`tastes`, `exports`,
 * `shares/simulate` …). Like useTestApp's, the returned object is filled in by the beforeAll, so
 * read it inside hooks and tests only; a file's own beforeAll registered after it sees it filled.
 */
export function useTastesStudy(t: FileTestApp<'team'>, section: string) {
  const study = {} as SeededTastesStudy & { base: string };
  beforeAll(async () => {
    Object.assign(study, await seedTastesStudy(t.deps.db, t.team.teamId));
    study.base = `/api/teams/${t.team.teamId}/studies/${study.studyId}/${section}`;
  });
  return study;
}

/** A share-scenario alternative of the Larkspur definition at middle levels but river and bill. */
export const scenarioLevels = (river: string, bill = 'b3') => ({
  bill,
  interrupt: 'i2',
  warn: 'w2',
  river,
  renew: 'r50',
});
