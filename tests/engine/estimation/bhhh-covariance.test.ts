import { describe, expect, it } from 'vitest';
import { fitMixedLogit } from '../../../server/engine/estimation/fit-mixed-logit';
import {
  negLognormalPrice,
  normalQuality,
  simulateChoiceData,
} from '../../../server/engine/estimation/simulate-choice-data';

describe("fitMixedLogit covariance 'bhhh' (Berndt, Hall, Hall & Hausman 1974; Train 2009 §8.7)", () => {
  const { data, coefficients } = simulateChoiceData({
    respondents: 400,
    tasks: 8,
    alternatives: 3,
    coefficients: [normalQuality, negLognormalPrice(0.5)],
    seed: 41,
  });

  it('gives the same estimates, and standard errors close to the Hessian ones, without 2P extra evaluations', async () => {
    const options = { coefficients, draws: { count: 100 } };
    const hessian = await fitMixedLogit(data, options);
    const bhhh = await fitMixedLogit(data, { ...options, covariance: 'bhhh' });
    expect(bhhh.estimates).toEqual(hessian.estimates);
    expect(hessian.evaluations - bhhh.evaluations).toBe(2 * 4);
    // Information-matrix equality: at the maximum of a correctly specified likelihood the
    // expected OPG equals minus the expected Hessian (Train 2009 §8.7); in a sample of 400
    // the two estimates differ by sampling noise of order 1/√N per element, common practice
    // puts them within ±35 % (no source).
    bhhh.se.forEach((se, p) => {
      expect(se / hessian.se[p]).toBeGreaterThan(0.65);
      expect(se / hessian.se[p]).toBeLessThan(1.35);
    });
  }, 60_000);
});
