/**
 * The incremental evaluator used by coordinate exchange must agree with a D-error computed
 * from scratch (Huber & Zwerina 1996 formula, d-error.ts) after any cell change — on the
 * fast path (Sylvester's determinant identity) and on the direct fallback (singular B).
 * Tolerance 1e-9 relative: both compute the same quantity in double precision through
 * different but well-conditioned operations (a few hundred flops each).
 */
import { describe, expect, it } from 'vitest';
import { buildCodingPlan, type CodingPlan } from '../../../shared/engine/coding/coding-plan';
import {
  computeDesignCriterion,
  getDErrorSetup,
} from '../../../server/engine/design/design-criteria';
import {
  buildDesignMatrix,
  getRowsPerTask,
  type LevelGrid,
} from '../../../server/engine/design/design-grid';
import { buildPriorDraws } from '../../../server/engine/design/prior-draws';
import { createPrng } from '../../../server/engine/draws/prng';
import { randomIndex } from '../../../server/engine/draws/random-index';
import { createTaskEvaluator } from '../../../server/engine/design/task-evaluator';
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';
import { makeGrid, makeSymmetricDefinition } from './design-fixtures';

function randomGrid(plan: CodingPlan, S: number, seed: number): LevelGrid {
  const random = createPrng(seed);
  const A = plan.attributes.length;
  const J = plan.designedCount;
  const levels = new Int32Array(S * J * A);
  for (let i = 0; i < levels.length; i++)
    levels[i] = randomIndex(random, plan.attributes[i % A].levelIds.length);
  return { S, J, A, levels };
}

function checkChanges(
  plan: CodingPlan,
  grid: LevelGrid,
  draws: Float64Array,
  R: number,
  seed: number,
) {
  const K = plan.columnCount;
  const Jt = getRowsPerTask(plan);
  const x = buildDesignMatrix(plan, grid);
  const evaluator = createTaskEvaluator(plan, grid.S, x, draws, R);
  evaluator.reset(0);
  const random = createPrng(seed);
  let compared = 0;
  for (let step = 0; step < 24; step++) {
    const s = randomIndex(random, grid.S);
    evaluator.beginTask(s);
    for (let change = 0; change < 3; change++) {
      const j = randomIndex(random, grid.J);
      const a = randomIndex(random, grid.A);
      const cell = (s * grid.J + j) * grid.A + a;
      const from = grid.levels[cell];
      const to =
        (from + 1 + randomIndex(random, plan.attributes[a].levelIds.length - 1)) %
        plan.attributes[a].levelIds.length;
      const predicted = evaluator.evaluateChange(s, j, a, from, to, Infinity);
      grid.levels[cell] = to;
      const fresh = computeDesignCriterion(
        getDErrorSetup(K),
        grid.S,
        Jt,
        buildDesignMatrix(plan, grid),
        draws,
        R,
      );
      if (Number.isFinite(fresh)) {
        expect(Math.abs(predicted - fresh) / fresh).toBeLessThan(1e-9);
        compared++;
      } else expect(predicted).toBe(Infinity);
      evaluator.commitChange(s, j, a, from, to);
    }
    evaluator.endTask(s);
  }
  return compared;
}

describe('createTaskEvaluator', () => {
  it('matches the from-scratch Bayesian D-error with a status quo (fast path)', () => {
    const plan = buildCodingPlan(makeStudyDefinition());
    const K = plan.columnCount;
    const means = Float64Array.from({ length: K }, (_, k) => (k % 2 === 0 ? 0.3 : -0.2));
    means[0] = -0.08; // cost per €
    const sds = Float64Array.from(means, (m) => Math.abs(m) / 2);
    const R = 16;
    expect(
      checkChanges(plan, randomGrid(plan, 14, 1), buildPriorDraws(means, sds, R, 5), R, 2),
    ).toBe(72);
  });

  it('matches the from-scratch D-error when dropping a task leaves B singular (fallback)', () => {
    // 4 parameters and 4 pairs (rank 1 each): without any one task B has rank ≤ 3.
    const plan = buildCodingPlan(makeSymmetricDefinition([3, 3], 2));
    const grid = makeGrid([
      [
        [0, 0],
        [1, 0],
      ],
      [
        [0, 0],
        [2, 0],
      ],
      [
        [0, 0],
        [0, 1],
      ],
      [
        [1, 0],
        [0, 2],
      ],
    ]);
    expect(
      computeDesignCriterion(
        getDErrorSetup(4),
        4,
        2,
        buildDesignMatrix(plan, grid),
        new Float64Array(4),
        1,
      ),
    ).toBeLessThan(Infinity);
    expect(checkChanges(plan, grid, new Float64Array(4), 1, 4)).toBeGreaterThan(10);
  });

  it('stops early with Infinity once the running sum passes the bound', () => {
    const plan = buildCodingPlan(makeSymmetricDefinition([3, 3, 3], 3));
    const grid = randomGrid(plan, 9, 8);
    const x = buildDesignMatrix(plan, grid);
    const evaluator = createTaskEvaluator(plan, 9, x, new Float64Array(6), 1);
    const value = evaluator.reset(0);
    evaluator.beginTask(0);
    const from = grid.levels[0];
    const exact = evaluator.evaluateChange(0, 0, 0, from, (from + 1) % 3, Infinity);
    expect(evaluator.evaluateChange(0, 0, 0, from, (from + 1) % 3, exact * 0.999)).toBe(Infinity);
    expect(evaluator.evaluateChange(0, 0, 0, from, (from + 1) % 3, exact * 1.001)).toBe(exact);
    expect(value).toBeGreaterThan(0);
  });
});
