import { describe, expect, it } from 'vitest';
import { createLoglikEvaluator } from '../../../server/engine/parallel/create-loglik-evaluator';
import { splitRespondents } from '../../../server/engine/parallel/worker-pool-evaluator';
import { createKernelFixture } from './kernel-fixture';

describe('worker-thread evaluator (piscina, TypeScript workers, prebuilt)', () => {
  it('returns the same LL, gradient and per-respondent scores as the in-process kernel', async () => {
    const { data, layout } = createKernelFixture(['normal', 'neg_lognormal', 'triangular']);
    const draws = { type: 'halton' as const, count: 40, seed: 3 };
    const theta = Float64Array.from({ length: layout.P }, (_, p) => 0.2 + 0.05 * p);
    const single = await createLoglikEvaluator(data, layout, draws, 1);
    const pooled = await createLoglikEvaluator(data, layout, draws, 2);
    try {
      const g1 = new Float64Array(layout.P);
      const g2 = new Float64Array(layout.P);
      const ll1 = await single.evaluate(theta, g1);
      const ll2 = await pooled.evaluate(theta, g2);
      // Only the order of the final sum differs: agreement to rounding (common practice, no source).
      expect(Math.abs(ll2 - ll1)).toBeLessThan(1e-10 * Math.abs(ll1));
      g1.forEach((v, p) =>
        expect(Math.abs(g2[p] - v)).toBeLessThan(1e-10 * Math.max(1, Math.abs(v))),
      );
      expect([...(await pooled.evaluateScores(theta))]).toEqual([
        ...(await single.evaluateScores(theta)),
      ]);
    } finally {
      await pooled.close();
      await single.close();
    }
  });

  it('splits respondents into contiguous slices of about equal work', () => {
    const { data } = createKernelFixture(['normal']);
    const slices = splitRespondents(data, 2);
    expect(slices).toHaveLength(2);
    expect(slices[0].first).toBe(0);
    expect(slices[1].first).toBe(slices[0].count);
    expect(slices[0].count + slices[1].count).toBe(data.taskStart.length - 1);
    expect(Math.abs(slices[0].count - slices[1].count)).toBeLessThanOrEqual(1);
  });
});
