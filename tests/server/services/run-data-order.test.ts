/**
 * A run's result does not depend on its respondents' ids (docs/methods.md "Run data order"):
 * the same answers under other random UUIDs give bit-identical estimates for the mixed logit,
 * hierarchical Bayes and latent class models, because respondents are read in respondent-number
 * order. The mixed logit's draws and the sampler's sweeps are assigned by respondent position,
 * so in the id order of runs stored before (kept to recompute them) the same answers under other
 * ids gave other estimates: shown below, so the check can fail. Property of the implementation,
 * no outside source.
 */
import { describe, expect, it } from 'vitest';
import { createPrng } from '../../../server/engine/draws/prng';
import { runEstimation, getSpecColumns } from '../../../server/engine/estimation/run-estimation';
import {
  codeStudyAnswers,
  toBuiltChoiceData,
} from '../../../server/services/choice-data-from-study';
import type {
  RespondentInput,
  VersionInput,
} from '../../../server/services/estimation/code-answers';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import { codeAlternative } from '../../../shared/engine/coding/code-alternative';
import { estimationSpecSchema } from '../../../shared/schemas/estimation-spec';
import type { RunDataOrder } from '../../../shared/schemas/run';
import { makeLarkspurDefinition } from '../../engine/coding/fixtures/larkspur-definition';
import {
  FIXED_COEFFICIENTS,
  TRUE_MNL,
  makeRandomDesign,
  mixedLogitSpec,
} from '../jobs/run-fixtures';

const definition = makeLarkspurDefinition();
const design = makeRandomDesign(definition);
const version: VersionInput = {
  id: 'v1',
  version: 1,
  definition,
  design,
  holdouts: [],
  warmupKeys: [],
};
const N = 60;

/** Each respondent's design-task answers, simulated once from the MNL of the run fixtures. */
const answersByPosition = (() => {
  const plan = buildCodingPlan(definition);
  const beta = plan.columns.map((c) => TRUE_MNL[c.key] ?? 0);
  const prng = createPrng(17);
  const utility = (x: ArrayLike<number>) => Array.from(x).reduce((s, v, k) => s + v * beta[k], 0);
  return Array.from({ length: N }, (_, n) =>
    design.tasks
      .filter((t) => t.block === (n % 2) + 1)
      .map((t) => {
        const u = t.alternatives.map((a, j) => utility(codeAlternative(plan, j, a.levels)));
        u.push(utility(codeAlternative(plan, 'fixed', {})));
        const e = u.map((v) => v - Math.log(-Math.log(prng.nextDouble())));
        const j = e.indexOf(Math.max(...e));
        return {
          screenKey: `task:${t.task}`,
          taskNumber: t.task,
          chosenAlternative: j === t.alternatives.length ? -1 : j,
        };
      }),
  );
})();

/** Random version-4-shaped UUIDs from a seed: another seed, other ids in another id order. */
function uuids(seed: number): string[] {
  const prng = createPrng(seed);
  const hex = () => prng.nextUint32().toString(16).padStart(8, '0');
  return Array.from({ length: N }, () => {
    const [a, b, c, d] = [hex(), hex(), hex(), hex()];
    return `${a}-${b.slice(0, 4)}-4${b.slice(5)}-8${c.slice(1, 4)}-${c.slice(4)}${d}`;
  });
}

/** The same respondents, in order of starting, under the given ids. */
const respondentsWith = (ids: string[]): RespondentInput[] =>
  ids.map((id, n) => ({ id, versionId: 'v1', answers: answersByPosition[n] }));

async function estimate(rawSpec: unknown, ids: string[], order: RunDataOrder) {
  const spec = estimationSpecSchema.parse(rawSpec);
  const prepared = codeStudyAnswers([version], respondentsWith(ids), order);
  const result = await runEstimation(spec, toBuiltChoiceData(prepared, getSpecColumns(spec)), {
    threads: 1,
    kernel: 'typescript',
  });
  return { estimates: result.estimates, loglik: result.loglik };
}

const mixed = mixedLogitSpec(50, 3);
const hb = {
  model: 'hb',
  coefficients: FIXED_COEFFICIENTS.map((c) => ({
    ...c,
    distribution: c.name === 'sq' ? 'fixed' : 'normal',
  })),
  mcmc: { iterations: 300, burnin: 150, thin: 1, chains: 1, seed: 7 },
};
const latentClass = {
  model: 'latent_class',
  coefficients: FIXED_COEFFICIENTS,
  classes: 2,
  starts: 2,
};

describe('run data order', () => {
  const first = uuids(101);
  const second = uuids(202);

  it('gives the two id sets different id orders (else the check below proves nothing)', () => {
    const rank = (ids: string[]) => ids.map((_, n) => n).sort((a, b) => (ids[a] < ids[b] ? -1 : 1));
    expect(rank(first)).not.toEqual(rank(second));
  });

  it.each([
    ['mixed logit', mixed],
    ['hierarchical Bayes', hb],
    ['latent class', latentClass],
  ])(
    '%s: the same answers under other ids give identical estimates',
    async (_name, spec) => {
      const a = await estimate(spec, first, 'respondent-number');
      const b = await estimate(spec, second, 'respondent-number');
      expect(b).toEqual(a);
    },
    120_000,
  );

  it.each([
    ['mixed logit', mixed],
    ['hierarchical Bayes', hb],
  ])(
    '%s: in the id order of older runs, other ids gave other estimates',
    async (_name, spec) => {
      const a = await estimate(spec, first, 'respondent-id');
      const b = await estimate(spec, second, 'respondent-id');
      expect(b.estimates).not.toEqual(a.estimates);
    },
    120_000,
  );
});
