/**
 * Searching by another criterion than the D-error: the direct evaluator must agree with the
 * criterion computed from scratch (design-criteria.ts) after any cell change, the search must
 * never end above its start, and the D-error default must leave existing designs unchanged.
 * Tolerance 1e-9 relative: the same quantity through two well-conditioned paths (K ≤ 8).
 */
import { describe, expect, it } from 'vitest';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import { getCodedColumns } from '../../../shared/engine/coding/coded-columns';
import type { DesignCriterion } from '../../../shared/schemas/design-spec';
import { createCriterionEvaluator } from '../../../server/engine/design/criterion-evaluator';
import {
  buildCriterionSetup,
  computeDesignCriterion,
  createCriterionScorer,
} from '../../../server/engine/design/design-criteria';
import { buildDesignMatrix, getRowsPerTask } from '../../../server/engine/design/design-grid';
import { generateDesign } from '../../../server/engine/design/generate-design';
import { buildPriorDraws } from '../../../server/engine/design/prior-draws';
import { createPrng } from '../../../server/engine/draws/prng';
import { randomIndex } from '../../../server/engine/draws/random-index';
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';

const definition = makeStudyDefinition();
const plan = buildCodingPlan(definition);
const K = plan.columnCount;
const priorColumns = getCodedColumns(definition).map((c) => ({
  key: c.key,
  mean: c.key === 'attr:bill' ? -0.1 : c.key === 'asc:fixed' ? 0.5 : 0.2,
  sd: 0.05,
}));
const means = Float64Array.from(priorColumns, (c) => c.mean);
const sds = Float64Array.from(priorColumns, (c) => c.sd);

function checkChanges(criterion: DesignCriterion, R: number) {
  const S = 12;
  const random = createPrng(3);
  const A = plan.attributes.length;
  const J = plan.designedCount;
  const levels = new Int32Array(S * J * A);
  for (let i = 0; i < levels.length; i++)
    levels[i] = randomIndex(random, plan.attributes[i % A].levelIds.length);
  const grid = { S, J, A, levels };
  const draws = R > 1 ? buildPriorDraws(means, sds, R, 4) : means;
  const setup = buildCriterionSetup(plan, definition, criterion, means, 1.96);
  const x = buildDesignMatrix(plan, grid);
  const evaluator = createCriterionEvaluator(plan, S, x, draws, R, createCriterionScorer(setup));
  evaluator.reset(0);
  let compared = 0;
  for (let step = 0; step < 8; step++) {
    const s = randomIndex(random, S);
    evaluator.beginTask(s);
    for (let change = 0; change < 3; change++) {
      const j = randomIndex(random, J);
      const a = randomIndex(random, A);
      const L = plan.attributes[a].levelIds.length;
      const cell = (s * J + j) * A + a;
      const from = levels[cell];
      const to = (from + 1 + randomIndex(random, L - 1)) % L;
      const predicted = evaluator.evaluateChange(s, j, a, from, to, Infinity);
      levels[cell] = to;
      const fresh = computeDesignCriterion(
        setup,
        S,
        getRowsPerTask(plan),
        buildDesignMatrix(plan, grid),
        draws,
        R,
      );
      expect(Math.abs(predicted - fresh) / fresh).toBeLessThan(1e-9);
      compared++;
      evaluator.commitChange(s, j, a, from, to);
    }
    evaluator.endTask(s);
  }
  return compared;
}

describe('createCriterionEvaluator', () => {
  it.each(['a_error', 's_estimate', 'c_error'] as const)(
    'matches the from-scratch %s after cell changes (Bayesian, 8 draws)',
    (criterion) => {
      expect(checkChanges(criterion, 8)).toBe(24);
    },
  );
});

describe('generateDesign with a criterion', () => {
  const spec = {
    method: 'd_efficient',
    tasks: 12,
    blocks: 2,
    starts: 2,
    seed: 7,
    priors: { kind: 'fixed', columns: priorColumns.map(({ key, mean }) => ({ key, mean })) },
  } as const;
  const byD = generateDesign(definition, spec);
  const valueOf = (d: typeof byD, c: DesignCriterion) =>
    d.diagnostics.criteria!.values.find((v) => v.criterion === c)!.value!;

  it('keeps the D-error search the default, reporting every criterion', () => {
    expect(byD.spec.criterion).toBe('d_error');
    expect(byD.diagnostics.criteria!.searched).toBe('d_error');
    expect(valueOf(byD, 'd_error')).toBe(byD.diagnostics.dError);
    for (const c of ['a_error', 's_estimate', 'c_error'] as const)
      expect(valueOf(byD, c)).toBeGreaterThan(0);
    const explicit = generateDesign(definition, { ...spec, criterion: 'd_error' });
    expect(explicit.design).toEqual(byD.design);
  });

  it.each(['a_error', 's_estimate', 'c_error'] as const)(
    'searching by %s gives a design no worse than the D-error design on that criterion',
    (criterion) => {
      const byC = generateDesign(definition, { ...spec, criterion });
      expect(byC.diagnostics.criteria!.searched).toBe(criterion);
      expect(valueOf(byC, criterion)).toBeLessThanOrEqual(valueOf(byD, criterion) * (1 + 1e-9));
    },
  );

  it('matches the S-estimate of the sample-size guide at the prior means', () => {
    // Same formula (Rose & Bliemer 2013); the guide uses z = 1.959963…, the criterion t = 1.96.
    const guide = byD.diagnostics.sampleSize.coefficients;
    const max = Math.max(...guide.map((c) => c.replicationsForT ?? 0));
    const ratio = (1.96 / 1.959963984540054) ** 2;
    expect(valueOf(byD, 's_estimate') / (max * ratio)).toBeCloseTo(1, 10);
  });

  it('refuses the S-estimate with zero priors, naming the field', () => {
    expect(() =>
      generateDesign(definition, { ...spec, priors: { kind: 'zero' }, criterion: 's_estimate' }),
    ).toThrow(/non-zero mean/);
    expect(() =>
      generateDesign(definition, { ...spec, priors: { kind: 'zero' }, criterion: 'c_error' }),
    ).toThrow(
      expect.objectContaining({
        code: 'invalid_spec',
        fields: { criterion: expect.stringMatching(/cost coefficient/) },
      }),
    );
    expect(K).toBeGreaterThan(5);
  });
});
