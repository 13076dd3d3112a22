/**
 * A cost of order 10^5 (prices in yen, won or house prices): the fit must reach the true
 * optimum and say converged. The true optimum is the same model fitted with the cost column
 * divided by 10^5 (the maximum likelihood is invariant to the units, Greene 2018 §14.4.5);
 * a false convergence of the earlier engine ended 0.03 LL units short at 10^4 (measured with
 * scripts/check-scaled-price.ts).
 */
import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { fitMixedLogit } from '../../../server/engine/estimation/fit-mixed-logit';
import {
  fixedComfort,
  fixedPrice,
  normalQuality,
  simulateChoiceData,
} from '../../../server/engine/estimation/simulate-choice-data';

describe('a cost column of order 10^5', () => {
  it('reaches the optimum of the well-scaled model (LL to 1e-6) and reports converged', async () => {
    const { sim, data, coefficients } = simulateChoiceData({
      respondents: 150,
      tasks: 8,
      alternatives: 3,
      coefficients: [normalQuality, fixedComfort, fixedPrice(-0.8, 'cost')],
      seed: 2024,
    });
    const big = sim.rows.map((r) => ({
      ...r,
      values: [r.values[0], r.values[1], r.values[2] * 1e5],
    }));
    const options = { coefficients, draws: { count: 100, seed: 1 }, starts: 1 };
    const reference = await fitMixedLogit(data, options);
    const fit = await fitMixedLogit(buildChoiceData(sim.columns, big).data, options);
    expect(fit.converged).toBe(true);
    expect(fit.status).toBe('converged');
    expect(Math.abs(fit.loglik - reference.loglik)).toBeLessThan(1e-6);
    expect(Math.abs((fit.estimates[2] * 1e5) / reference.estimates[2] - 1)).toBeLessThan(1e-5);
  }, 60_000);
});
