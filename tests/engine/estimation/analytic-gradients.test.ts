import { describe, expect, it } from 'vitest';
import type { CoefficientDistribution } from '../../../server/engine/estimation/mixed-logit-layout';
import { evaluateMnl } from '../../../server/engine/estimation/mnl-likelihood';
import { createKernelFixture, getCentralDifferenceGradient } from './kernel-fixture';

// Central differences with h = 1e-6 have truncation error O(h²·f''') ≈ 1e-12 and rounding
// error ≈ ε·|LL|/h ≈ 1e-8 for |LL| ≈ 100 (Nocedal & Wright 2006 §8.1), hence 1e-6 absolute.
const TOL = 1e-6;

function expectGradientsClose(analytic: Float64Array, numeric: Float64Array): void {
  for (let p = 0; p < analytic.length; p++)
    expect(Math.abs(analytic[p] - numeric[p])).toBeLessThan(
      TOL * Math.max(1, Math.abs(numeric[p])),
    );
}

/** The kernel's analytic gradient at a generic point equals central differences of its LL. */
function expectKernelGradientMatchesNumeric(
  kernel: ReturnType<typeof createKernelFixture>['kernel'],
  P: number,
): void {
  const theta = Float64Array.from({ length: P }, (_, p) => 0.3 + 0.1 * Math.sin(p + 1));
  const grad = new Float64Array(P);
  kernel.evaluate(theta, grad);
  const numeric = getCentralDifferenceGradient(
    (x) => kernel.evaluate(x, new Float64Array(P)),
    theta,
  );
  expectGradientsClose(grad, numeric);
}

describe('analytic gradients match central finite differences', () => {
  it('MNL gradient and Hessian', () => {
    const { data } = createKernelFixture(['fixed', 'fixed', 'fixed']);
    const beta = Float64Array.from([0.4, -0.2, 0.3]);
    const grad = new Float64Array(3);
    const hess = new Float64Array(9);
    evaluateMnl(data, beta, grad, hess);
    expectGradientsClose(
      grad,
      getCentralDifferenceGradient((b) => evaluateMnl(data, b, null, null), beta),
    );
    for (let a = 0; a < 3; a++) {
      const row = getCentralDifferenceGradient((b) => {
        const g = new Float64Array(3);
        evaluateMnl(data, b, g, null);
        return g[a];
      }, beta);
      expectGradientsClose(hess.subarray(a * 3, a * 3 + 3), row);
    }
  });

  const cases: [string, CoefficientDistribution[], boolean][] = [
    ['normal', ['fixed', 'normal'], false],
    ['lognormal', ['fixed', 'lognormal'], false],
    ['neg_lognormal', ['normal', 'neg_lognormal'], false],
    ['triangular', ['fixed', 'triangular'], false],
    ['uniform', ['fixed', 'uniform'], false],
    [
      'all distributions together',
      ['fixed', 'normal', 'lognormal', 'neg_lognormal', 'triangular', 'uniform'],
      false,
    ],
    [
      'correlated normals (Cholesky) with a lognormal',
      ['normal', 'normal', 'normal', 'neg_lognormal'],
      true,
    ],
  ];

  it.each(cases)('mixed logit: %s', (_label, distributions, correlated) => {
    const { kernel, layout } = createKernelFixture(distributions, correlated);
    expectKernelGradientMatchesNumeric(kernel, layout.P);
  });

  const wtpCases: [string, CoefficientDistribution[], boolean][] = [
    [
      'WTP space, lognormal cost, normal and fixed WTPs',
      ['normal', 'fixed', 'neg_lognormal'],
      false,
    ],
    ['WTP space, fixed cost, lognormal and uniform WTPs', ['lognormal', 'uniform', 'fixed'], false],
    ['WTP space, correlated normal WTPs', ['normal', 'normal', 'neg_lognormal'], true],
  ];

  it.each(wtpCases)('mixed logit: %s', (_label, distributions, correlated) => {
    const cost = `x${distributions.length}`;
    const { kernel, layout } = createKernelFixture(distributions, correlated, 40, cost);
    expectKernelGradientMatchesNumeric(kernel, layout.P);
  });

  it('per-respondent scores sum to the gradient', () => {
    const { kernel, layout } = createKernelFixture(['normal', 'neg_lognormal']);
    const theta = Float64Array.from({ length: layout.P }, () => 0.2);
    const grad = new Float64Array(layout.P);
    const scores = new Float64Array(kernel.respondentCount * layout.P);
    kernel.evaluate(theta, grad, scores);
    for (let p = 0; p < layout.P; p++) {
      let s = 0;
      for (let n = 0; n < kernel.respondentCount; n++) s += scores[n * layout.P + p];
      expect(s).toBeCloseTo(grad[p], 10);
    }
  });
});
