/**
 * A closed Larkspur Valley Water study of the study factory with simulated respondents for run
 * tests: one frozen version (definition, its seeded random design of 16 tasks in 2 blocks, a
 * questionnaire with one warm-up and one holdout task), completed respondents whose design
 * choices follow a known MNL (Gumbel errors from a seeded generator), plus an excluded and an
 * unfinished respondent. Rows are written directly: the fieldwork code is not under test here.
 */
import { randomBytes } from 'node:crypto';
import { beforeAll } from 'vitest';
import type { Db } from '../../../db/client';
import { respondentFilters } from '../../../db/schema/models';
import { createPrng } from '../../../server/engine/draws/prng';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import { codeAlternative } from '../../../shared/engine/coding/code-alternative';
import type { Design } from '../../../shared/schemas/design';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';
import { makeStudyDesign } from '../../../scripts/lib/study-factory/design';
import { insertStudyRow } from '../../../scripts/lib/study-factory/insert-study';
import { insertRespondentRow } from '../../../scripts/lib/study-factory/insert-respondent';
import type { FileTestApp } from '../../support/test-app';

/** True MNL coefficients by coded-column key (bill, interruptions, warning effects, river, renew, SQ). */
export const TRUE_MNL: Record<string, number> = {
  'attr:bill': -0.15,
  'attr:interrupt': -0.3,
  'attr:warn:w6': -0.4,
  'attr:warn:w2': 0.1,
  'attr:river:fair': 0.5,
  'attr:river:good': 0.9,
  'attr:renew:r20': -0.3,
  'attr:renew:r80': 0.3,
  'asc:fixed': 0.2,
};

/** Three fixed coefficients of the seeded study (an MNL or a latent class specification). */
export const FIXED_COEFFICIENTS = [
  { name: 'bill', column: 'attr:bill', distribution: 'fixed' },
  { name: 'river_good', column: 'attr:river:good', distribution: 'fixed' },
  { name: 'sq', column: 'asc:fixed', distribution: 'fixed' },
];

/** A panel mixed logit of the seeded study with normal bill and river tastes and `draws` draws. */
export function mixedLogitSpec(draws: number, seed: number, randomInterrupt = false) {
  return {
    model: 'mixed',
    coefficients: [
      { name: 'bill', column: 'attr:bill', distribution: 'normal' },
      { name: 'river_good', column: 'attr:river:good', distribution: 'normal' },
      {
        name: 'interrupt',
        column: 'attr:interrupt',
        ...(randomInterrupt ? { distribution: 'normal' } : {}),
      },
    ],
    draws: { count: draws, seed },
  };
}

export const WARMUP_PAGE = 'wu1';
export const HOLDOUT_PAGE = 'ho1';

export function makeQuestionnaire() {
  const alternatives = [
    { levels: { bill: 'b3', interrupt: 'i2', warn: 'w2', river: 'fair', renew: 'r50' } },
    { levels: { bill: 'b10', interrupt: 'i1', warn: 'w0', river: 'good', renew: 'r80' } },
  ];
  return {
    pages: [
      {
        id: 'c1',
        kind: 'consent',
        title: 'Welcome',
        body: 'We ask about water services.',
        agreeLabel: 'I agree',
      },
      {
        id: 'q1',
        kind: 'question',
        question: {
          key: 'filter_tap',
          type: 'single',
          text: 'Do you filter your tap water?',
          options: [
            { id: 'yes', label: 'Yes' },
            { id: 'no', label: 'No' },
          ],
        },
      },
      { id: WARMUP_PAGE, kind: 'warmup', title: 'A first example', alternatives },
      { id: 't1', kind: 'tasks', title: 'Choices' },
      { id: HOLDOUT_PAGE, kind: 'holdout', title: 'One more choice', alternatives },
      { id: 'e1', kind: 'end', title: 'Thank you', body: 'Done.' },
    ],
  };
}

export type SeededStudy = {
  studyId: string;
  versionId: string;
  definition: StudyDefinition;
  design: Design;
  /** Completed, included respondents in id order, which is the order they were simulated in. */
  respondentIds: string[];
  excludedId: string;
  unfinishedId: string;
};

/**
 * The n-th simulated respondent's id: the study's id with n in the last group, so that id order
 * is simulation order and a test that picks respondents by position picks the same people (with
 * random ids, which respondents a test picked varied from run to run against the simulated
 * classes).
 */
export function respondentIdOf(studyId: string, n: number): string {
  return `${studyId.slice(0, 24)}${(n + 1).toString(16).padStart(12, '0')}`;
}

/** Picks an alternative with logit probabilities by adding Gumbel errors. */
function choose(utilities: number[], prng: ReturnType<typeof createPrng>): number {
  let best = 0;
  let bestU = -Infinity;
  utilities.forEach((u, j) => {
    const e = -Math.log(-Math.log(prng.nextDouble()));
    if (u + e > bestU) {
      bestU = u + e;
      best = j;
    }
  });
  return best;
}

export async function seedRunStudy(
  db: Db,
  params: {
    teamId: string;
    respondents?: number;
    seed?: number;
    beta?: Record<string, number>;
    /**
     * Tastes of a second class: most of the respondents who filter their tap water (every third,
     * but not every fourth of them) and a few who do not (every fifth), so filtering predicts the
     * class without deciding it.
     */
    filterBeta?: Record<string, number>;
  },
): Promise<SeededStudy> {
  const definition = makeStudyDefinition();
  const design = makeStudyDesign(definition);
  const plan = buildCodingPlan(definition);
  const beta = plan.columns.map((c) => (params.beta ?? TRUE_MNL)[c.key] ?? 0);
  const filterBeta = params.filterBeta
    ? plan.columns.map((c) => params.filterBeta![c.key] ?? 0)
    : beta;
  let tastes = beta;
  const utility = (x: Float64Array) => x.reduce((s, v, k) => s + v * tastes[k], 0);
  const prng = createPrng(params.seed ?? 5);
  const study = await insertStudyRow(db, {
    teamId: params.teamId,
    name: 'Larkspur packages (test)',
    status: 'closed',
    definition,
    design,
    questionnaire: makeQuestionnaire(),
  });
  const total = (params.respondents ?? 60) + 2;
  const ids: string[] = [];
  let excludedId = '';
  let unfinishedId = '';
  const holdoutAlts = makeQuestionnaire().pages[4].alternatives as {
    levels: Record<string, string>;
  }[];
  for (let n = 0; n < total; n++) {
    const block = (n % 2) + 1;
    tastes = (n % 3 === 0 ? n % 4 !== 0 : n % 5 === 1) ? filterBeta : beta;
    const excluded = n === total - 2;
    const unfinished = n === total - 1;
    const screens = [
      { key: `warmup:${WARMUP_PAGE}`, taskNumber: null, alts: holdoutAlts },
      ...design.tasks
        .filter((t) => t.block === block)
        .map((t) => ({ key: `task:${t.task}`, taskNumber: t.task, alts: t.alternatives })),
      { key: `holdout:${HOLDOUT_PAGE}`, taskNumber: null, alts: holdoutAlts },
    ];
    const choices = screens.map((s) => {
      const u = s.alts.map((a, j) => utility(codeAlternative(plan, j, a.levels)));
      u.push(utility(codeAlternative(plan, 'fixed', {})));
      const j = choose(u, prng);
      return {
        clientId: `${s.key}-${n}`,
        screenKey: s.key,
        taskNumber: s.taskNumber,
        chosenAlternative: j === s.alts.length ? -1 : j,
        chosenPosition: j,
        value: null,
      };
    });
    const filterTap = {
      clientId: `q-${n}`,
      screenKey: 'q:filter_tap',
      value: { kind: 'single', optionId: n % 3 === 0 ? 'yes' : 'no' },
    };
    const id = await insertRespondentRow(db, {
      id: respondentIdOf(study.studyId, n),
      studyId: study.studyId,
      versionId: study.versionId!,
      sessionToken: randomBytes(12).toString('hex'),
      block,
      status: unfinished ? 'in_progress' : 'completed',
      included: !excluded,
      exclusionReason: excluded ? 'speeder' : null,
      answers: [...choices, filterTap],
    });
    if (excluded) excludedId = id;
    else if (unfinished) unfinishedId = id;
    else ids.push(id);
  }
  ids.sort();
  return {
    studyId: study.studyId,
    versionId: study.versionId!,
    definition,
    design,
    respondentIds: ids,
    excludedId,
    unfinishedId,
  };
}

/**
 * The set-up of the run test files: before their tests (within `timeout` ms), seeds the study
 * with `respondents` completed respondents for `t`'s team and sets `base` to its runs API path.
 * Like useTestApp's, the returned object is filled in by the beforeAll, so read it inside hooks
 * and tests only; a file's own beforeAll registered after it sees it filled.
 */
export function useRunStudy(t: FileTestApp<'team'>, respondents: number, timeout?: number) {
  const study = {} as SeededStudy & { base: string };
  beforeAll(async () => {
    Object.assign(study, await seedRunStudy(t.deps.db, { teamId: t.team.teamId, respondents }));
    study.base = `/api/teams/${t.team.teamId}/studies/${study.studyId}/runs`;
  }, timeout);
  return study;
}

/** A saved filter keeping respondents who filter their tap water. */
export async function seedTapFilter(db: Db, studyId: string) {
  const [row] = await db
    .insert(respondentFilters)
    .values({
      studyId,
      name: 'Filters tap water',
      definition: { conditions: [{ question: 'filter_tap', values: ['yes'] }] },
    })
    .returning({ id: respondentFilters.id });
  return row.id;
}
