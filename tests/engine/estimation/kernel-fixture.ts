/** Test helper: a small seeded panel with a kernel over all respondents. */
import { createMixedLogitKernel } from '../../../server/engine/estimation/mixed-logit-kernel';
import {
  createMixedLogitLayout,
  type CoefficientDistribution,
} from '../../../server/engine/estimation/mixed-logit-layout';
import { simulateChoiceData } from '../../../server/engine/estimation/simulate-choice-data';
import { createStandardVariates } from '../../../server/engine/estimation/standard-variates';

export function createKernelFixture(
  distributions: CoefficientDistribution[],
  correlated = false,
  R = 40,
  wtpCost: string | null = null,
) {
  const coefficients = distributions.map((distribution, k) => ({
    name: `x${k + 1}`,
    distribution,
    location:
      distribution === 'neg_lognormal' || distribution === 'lognormal' ? -0.7 : 0.5 - 0.3 * k,
    spread: 0.5,
  }));
  const { sim, data } = simulateChoiceData({
    respondents: 25,
    tasks: 5,
    alternatives: 3,
    coefficients,
    seed: 11,
  });
  const layout = createMixedLogitLayout(data, coefficients, correlated, wtpCost);
  const variates = createStandardVariates(layout, { type: 'halton', count: R, seed: 3 }, 0, 25);
  const kernel = createMixedLogitKernel(data, layout, variates, R, 0, 25);
  return { data, layout, kernel, sim };
}

/** Central finite-difference gradient of f at θ (Nocedal & Wright 2006 eq. 8.3). */
export function getCentralDifferenceGradient(
  f: (x: Float64Array) => number,
  theta: Float64Array,
  h = 1e-6,
): Float64Array {
  const g = new Float64Array(theta.length);
  const x = Float64Array.from(theta);
  for (let p = 0; p < theta.length; p++) {
    x[p] = theta[p] + h;
    const up = f(x);
    x[p] = theta[p] - h;
    const down = f(x);
    x[p] = theta[p];
    g[p] = (up - down) / (2 * h);
  }
  return g;
}
