/**
 * Diagnostics on designs whose properties are known by construction.
 */
import { describe, expect, it } from 'vitest';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import { diagnoseDesign } from '../../../server/engine/design/diagnostics/diagnose-design';
import { writeDesign } from '../../../server/engine/design/design-grid';
import {
  makeCheckAGrid,
  makeFoldoverGrid,
  makeGrid,
  makeSymmetricDefinition,
} from './design-fixtures';

describe('diagnoseDesign', () => {
  const foldDef = makeSymmetricDefinition([2, 2, 2], 2);
  const foldPlan = buildCodingPlan(foldDef);
  const foldDesign = writeDesign(foldPlan, makeFoldoverGrid(), Int32Array.of(1, 1, 2, 2), 2);

  it('finds no overlap, orthogonal columns and equal probabilities in the fold-over design', () => {
    const d = diagnoseDesign(foldDef, foldDesign);
    // Fold-over pairs differ on every attribute; the OMEP columns are orthogonal, and the
    // fold-over rows are their negatives, so column correlations vanish (by construction).
    expect(d.overlap.map((o) => o.share)).toEqual([0, 0, 0]);
    d.correlations.forEach((row, i) =>
      row.forEach((r, k) => expect(r).toBeCloseTo(i === k ? 1 : 0, 14)),
    );
    expect(d.choiceProbabilities.every((t) => t.probabilities.every((p) => p === 0.5))).toBe(true);
    expect(d.levelBalance[0].levels.map((l) => l.count)).toEqual([4, 4]);
    expect(d.levelBalance[0].byBlock).toEqual([
      [2, 2],
      [2, 2],
    ]);
    expect(d.tasksPerBlock).toEqual([2, 2]);
    expect(d.identified).toBe(true);
  });

  it('reports D_p at the prior means (Check A′) beside D₀ (Check A)', () => {
    const def = makeSymmetricDefinition([3, 3, 3], 3);
    const plan = buildCodingPlan(def);
    const design = writeDesign(plan, makeCheckAGrid(), new Int32Array(9).fill(1), 1);
    const means = [-1, 0, -1, 0, -1, 0];
    const d = diagnoseDesign(def, design, {
      kind: 'fixed',
      columns: plan.columns.map((c, k) => ({ key: c.key, mean: means[k] })),
    });
    // docs/methods.md "Design check values" Check A [C] 0.19245008972987526 and Check A′ [C] 0.3771383902767846.
    expect(d.dErrorZero).toBeCloseTo(0.19245008972987526, 14);
    expect(d.dErrorAtMeans).toBeCloseTo(0.3771383902767846, 13);
    expect(d.dError).toBe(d.dErrorAtMeans);
    // Utilities (−1, 0, +1) shifted cyclically: each task shows one alternative of each
    // total utility −3, 0, +3, so probabilities are e^(−3), 1, e^3 over their sum.
    const z = Math.exp(-3) + 1 + Math.exp(3);
    const expected = [Math.exp(-3) / z, 1 / z, Math.exp(3) / z].sort();
    expect([...d.choiceProbabilities[0].probabilities].sort()[2]).toBeCloseTo(expected[2], 14);
  });

  it('flags a design that cannot identify its parameters, keeping the result JSON-safe', () => {
    const def = makeSymmetricDefinition([2, 2], 2);
    const grid = makeGrid([
      [
        [0, 0],
        [1, 0],
      ],
      [
        [1, 0],
        [0, 0],
      ],
    ]);
    const d = diagnoseDesign(def, writeDesign(buildCodingPlan(def), grid, Int32Array.of(1, 1), 1));
    expect(d.identified).toBe(false);
    expect(d.dError).toBeNull();
    expect(d.overlap[1].share).toBe(1);
    expect(d.warnings.some((w) => /cannot identify/.test(w))).toBe(true);
    expect(JSON.parse(JSON.stringify(d))).toEqual(d);
  });
});
