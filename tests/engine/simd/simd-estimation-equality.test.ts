import { afterEach, describe, expect, it, vi } from 'vitest';
import { fitMixedLogit } from '../../../server/engine/estimation/fit-mixed-logit';
import {
  negLognormalPrice,
  normalQuality,
  simulateChoiceData,
} from '../../../server/engine/estimation/simulate-choice-data';
import { createLoglikEvaluator } from '../../../server/engine/parallel/create-loglik-evaluator';
import { chooseKernel } from '../../../server/engine/simd/kernel-choice';
import { createKernelFixture } from '../estimation/kernel-fixture';

const { data, coefficients } = simulateChoiceData({
  respondents: 150,
  tasks: 8,
  alternatives: 3,
  coefficients: [
    normalQuality,
    { name: 'comfort', distribution: 'normal', location: -0.4, spread: 0.5 },
    { name: 'access', distribution: 'uniform', location: 0.3, spread: 0.6 },
    negLognormalPrice(0.6),
  ],
  seed: 29,
});

describe('whole estimations with the SIMD and the TypeScript kernel', () => {
  it('agree to 1e-6 in every estimate and standard error (correlated normals, 2 threads)', async () => {
    // Run to a tight gradient tolerance: two optimisations of the same function that differ
    // by rounding in the gradient can only agree to about their convergence tolerance over
    // the curvature (Nocedal & Wright 2006 §3.5), so the default 1e-3 would blur the check.
    const options = {
      coefficients,
      correlated: true,
      draws: { count: 100 },
      threads: 2,
      gradientTolerance: 1e-7,
    };
    const simd = await fitMixedLogit(data, { ...options, kernel: 'simd' });
    const ts = await fitMixedLogit(data, { ...options, kernel: 'typescript' });
    expect(simd.kernel).toBe('simd');
    expect(ts.kernel).toBe('typescript');
    expect(simd.converged && ts.converged).toBe(true);
    expect(Math.abs(simd.loglik - ts.loglik)).toBeLessThan(1e-9 * Math.abs(ts.loglik));
    ts.estimates.forEach((v, p) => {
      expect(Math.abs(simd.estimates[p] - v)).toBeLessThan(1e-6 * Math.max(1, Math.abs(v)));
      expect(Math.abs(simd.se[p] - ts.se[p])).toBeLessThan(1e-6 * Math.max(1, ts.se[p]));
    });
  }, 120_000);
});

describe('WebAssembly without SIMD', () => {
  afterEach(() => vi.restoreAllMocks());

  it('falls back to the TypeScript kernel with a note, and estimates all the same', async () => {
    vi.spyOn(WebAssembly, 'validate').mockReturnValue(false);
    expect(chooseKernel('auto')).toEqual({
      kind: 'typescript',
      note: expect.stringMatching(/no SIMD support.*TypeScript kernel/),
    });
    const { data: small, layout } = createKernelFixture(['normal', 'neg_lognormal']);
    const draws = { type: 'halton' as const, count: 40, seed: 3 };
    const evaluator = await createLoglikEvaluator(small, layout, draws, 1, 'simd');
    expect(evaluator.kernel).toBe('typescript');
    expect(evaluator.notes).toEqual([expect.stringMatching(/no SIMD support/)]);
    const notes: string[] = [];
    const fit = await fitMixedLogit(
      small,
      { coefficients: layout.coefficients.map((c) => ({ ...c })), draws: { count: 40 } },
      { onNote: (note) => notes.push(note) },
    );
    expect(fit.kernel).toBe('typescript');
    expect(notes).toEqual([expect.stringMatching(/WebAssembly SIMD kernel not used/)]);
    await evaluator.close();
  });
});
