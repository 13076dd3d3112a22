/**
 * Sample-size guide: S-estimate (Rose & Bliemer 2013, formula from memory) and its power
 * version (de Bekker-Grob et al. 2015, formula from memory) on a design whose values were
 * computed by hand (docs/methods.md, "Sample-size guide"), and the level-count floor
 * N ≥ 500·c/(t·a) as summarised by de Bekker-Grob et al. 2015 (examples computed by hand).
 */
import { describe, expect, it } from 'vitest';
import { diagnoseDesign } from '../../../server/engine/design/diagnostics/diagnose-design';
import { getLevelCountSampleSize } from '../../../server/engine/design/diagnostics/sample-size';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import { writeDesign } from '../../../server/engine/design/design-grid';
import { buildDesignMatrix } from '../../../server/engine/design/design-grid';
import { computeInformationMatrix } from '../../../server/engine/design/mnl-information';
import { makeFoldoverGrid, makeSymmetricDefinition } from './design-fixtures';

describe('S-estimate (Check F)', () => {
  const definition = makeSymmetricDefinition([2, 2, 2], 2);
  const plan = buildCodingPlan(definition);
  const grid = makeFoldoverGrid();
  const design = writeDesign(plan, grid, new Int32Array(4).fill(1), 1);
  const priors = {
    kind: 'fixed' as const,
    columns: plan.columns.map((c) => ({ key: c.key, mean: 0.3 })),
  };

  it('has the one-replication information of docs/methods.md "Design criteria"', () => {
    const info = new Float64Array(9);
    const x = buildDesignMatrix(plan, grid);
    computeInformationMatrix(
      3,
      4,
      2,
      x,
      Float64Array.of(0.3, 0.3, 0.3),
      info,
      new Float64Array(11),
    );
    // Check F [C]: diag(I1) = 3.232328, off-diagonal −0.428220 (6 decimals quoted).
    expect(info[0]).toBeCloseTo(3.232328, 6);
    expect(info[1]).toBeCloseTo(-0.42822, 6);
  });

  it('gives se₁ = 0.5678208, N = 13.762 -> 14 at t = 1.96 and 28.118 -> 29 at 80 % power', () => {
    const { sampleSize } = diagnoseDesign(definition, design, priors);
    const first = sampleSize.coefficients[0];
    expect(first.standardErrorOne).toBeCloseTo(0.5678208, 7);
    expect(first.replicationsForT).toBeCloseTo(13.762, 3);
    expect(first.replicationsForPower).toBeCloseTo(28.118, 3);
    expect(sampleSize.sEstimateReplications).toBe(14);
    expect(sampleSize.sEstimateRespondents).toBe(14);
    expect(sampleSize.powerRespondents).toBe(29);
  });

  it('reports the same S-estimate, 13.762, as the design criterion at t = 1.96', () => {
    // docs/methods.md, "Design criteria" (by hand): max_k 1.96²·Σ₁,kk/0.3² = 13.762.
    const { criteria } = diagnoseDesign(definition, design, priors);
    const s = criteria!.values.find((v) => v.criterion === 's_estimate')!;
    expect(s.value).toBeCloseTo(13.762, 3);
    expect(criteria!.values.find((v) => v.criterion === 'c_error')!.unavailable).toMatch(/cost/);
  });

  it('multiplies replications by the number of blocks for respondents', () => {
    const blocked = writeDesign(plan, grid, Int32Array.of(1, 2, 1, 2), 2);
    expect(diagnoseDesign(definition, blocked, priors).sampleSize.sEstimateRespondents).toBe(28);
  });

  it('has no S-estimate under zero priors (t-ratio of a zero coefficient never grows)', () => {
    const { sampleSize } = diagnoseDesign(definition, design);
    expect(sampleSize.sEstimateReplications).toBeNull();
    expect(sampleSize.coefficients.every((c) => c.replicationsForT === null)).toBe(true);
  });
});

describe('getLevelCountSampleSize (N ≥ 500·c/(t·a), de Bekker-Grob et al. 2015)', () => {
  it.each([
    // By hand: 500·4/(8·3) = 83.3 → 84; 500·5/(12·2) = 104.2 → 105; 500·3/(10·3) = 50.
    [4, 8, 3, 84],
    [5, 12, 2, 105],
    [3, 10, 3, 50],
  ])('c = %i, t = %i, a = %i -> %i', (c, t, a, n) => {
    expect(getLevelCountSampleSize(c, t, a)).toBe(n);
  });
});
