import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { EstimationCancelledError } from '../../../server/engine/estimation/estimation-errors';
import {
  fitMixedLogit,
  type EstimationProgress,
} from '../../../server/engine/estimation/fit-mixed-logit';
import {
  fixedComfort,
  negLognormalPrice,
  normalQuality,
  simulateChoiceData,
} from '../../../server/engine/estimation/simulate-choice-data';
import type { TrueCoefficient } from '../../../server/engine/estimation/simulate-panel-choices';

const truth: TrueCoefficient[] = [normalQuality, fixedComfort, negLognormalPrice(0.6)];

describe('fitMixedLogit', () => {
  const { sim, data, coefficients } = simulateChoiceData({
    respondents: 400,
    tasks: 10,
    alternatives: 3,
    coefficients: truth,
    seed: 77,
  });
  /** The same panel cut to its first `n` respondents, for the quicker checks. */
  const firstRespondents = (n: number) =>
    buildChoiceData(
      sim.columns,
      sim.rows.filter((r) => Number(r.respondent) <= n),
    ).data;

  it('recovers known parameters (normal + neg_lognormal cost) within two standard errors', async () => {
    // "Within two SEs" is common practice, no source.
    const progress: EstimationProgress[] = [];
    const fit = await fitMixedLogit(
      data,
      { coefficients, draws: { count: 200 }, starts: 1 },
      { onProgress: (p) => progress.push(p) },
    );
    expect(fit.converged).toBe(true);
    expect(fit.names).toEqual(['quality.mean', 'comfort', 'price.mean', 'quality.sd', 'price.sd']);
    const trueTheta = [1.0, 0.5, -0.5, 0.8, 0.6];
    trueTheta.forEach((value, p) => {
      expect(Math.abs(fit.estimates[p] - value)).toBeLessThan(2 * fit.se[p]);
      expect(fit.robustSe[p]).toBeGreaterThan(0);
    });
    expect(fit.loglik).toBeGreaterThan(fit.loglikMnl);
    expect(fit.loglik).toBeGreaterThan(fit.loglikNull);
    expect(fit.rho2).toBeCloseTo(1 - fit.loglik / fit.loglikNull, 12);
    expect(fit.hitRate).toBeGreaterThan(1 / 3);
    expect(progress.length).toBe(fit.iterations);
    expect(progress.map((p) => p.iteration)).toEqual(progress.map((_, i) => i + 1));
    // BFGS with a sufficient-decrease line search never lowers the LL between iterations.
    for (let i = 1; i < progress.length; i++)
      expect(progress[i].loglik).toBeGreaterThanOrEqual(progress[i - 1].loglik);
  });

  it('reaches the same optimum from the inverse BHHH matrix as from the scaled identity', async () => {
    // Both runs end when the Newton decrement g′A⁻¹g with the real information A is ≤ 1e-7
    // (convergence.ts). Under the quadratic model at the optimum θ*, that puts each run's LL
    // within 1e-7 / 2 of LL*, and (θ − θ*)′A(θ − θ*) ≤ 1e-7, so two runs differ in θ_p by at most
    // 2·√1e-7·√(A⁻¹)_pp = 2·√1e-7·SE_p (Boyd & Vandenberghe 2004, Convex Optimization, §9.5.1).
    const options = {
      coefficients,
      draws: { count: 200 },
      starts: 1,
      covariance: 'classical' as const,
    };
    const identity = await fitMixedLogit(data, { ...options, initialInverseHessian: 'identity' });
    const bhhh = await fitMixedLogit(data, { ...options, initialInverseHessian: 'bhhh' });
    for (const fit of [identity, bhhh]) {
      expect(fit.converged).toBe(true);
      expect(fit.measures.decrement).toBeLessThanOrEqual(1e-7);
    }
    expect(Math.abs(bhhh.loglik - identity.loglik)).toBeLessThanOrEqual(1e-7 / 2);
    identity.estimates.forEach((v, p) => {
      const se = Math.max(identity.se[p], bhhh.se[p]);
      expect(Math.abs(bhhh.estimates[p] - v)).toBeLessThanOrEqual(2 * Math.sqrt(1e-7) * se);
    });
    // One evaluation of the scores at the start, counted with the others.
    expect(bhhh.evaluations).toBeGreaterThan(bhhh.iterations + 1);
  });

  it('gives the same estimates on 2 worker threads as in-process (threads only split the sum)', async () => {
    const small = firstRespondents(60);
    const options = { coefficients, draws: { count: 50 } };
    const one = await fitMixedLogit(small, options);
    const two = await fitMixedLogit(small, { ...options, threads: 2 });
    expect(two.loglik).toBeCloseTo(one.loglik, 6);
    one.estimates.forEach((v, p) => expect(two.estimates[p]).toBeCloseTo(v, 4));
    one.robustSe.forEach((v, p) => expect(two.robustSe[p]).toBeCloseTo(v, 4));
  });

  it('runs several starts and keeps the best', async () => {
    const small = firstRespondents(60);
    const fit = await fitMixedLogit(small, { coefficients, draws: { count: 50 }, starts: 3 });
    expect(fit.starts).toHaveLength(3);
    expect(fit.loglik).toBe(Math.max(...fit.starts.map((s) => s.loglik)));
    expect(fit.startsAtBest).toBe(fit.starts.filter((s) => fit.loglik - s.loglik < 1e-3).length);
  });

  it('stops with EstimationCancelledError when the signal fires', async () => {
    const controller = new AbortController();
    const run = fitMixedLogit(
      data,
      { coefficients, draws: { count: 50 } },
      { signal: controller.signal, onProgress: () => controller.abort() },
    );
    await expect(run).rejects.toBeInstanceOf(EstimationCancelledError);
  });

  it('is deterministic for a given seed and changes with another seed', async () => {
    const small = firstRespondents(40);
    const a = await fitMixedLogit(small, { coefficients, draws: { count: 30, seed: 5 } });
    const b = await fitMixedLogit(small, { coefficients, draws: { count: 30, seed: 5 } });
    const c = await fitMixedLogit(small, { coefficients, draws: { count: 30, seed: 6 } });
    expect([...b.estimates]).toEqual([...a.estimates]);
    expect(c.loglik).not.toBe(a.loglik);
  });

  it.each(['sobol', 'mlhs', 'random'] as const)('fits with %s draws', async (type) => {
    const small = firstRespondents(60);
    const fit = await fitMixedLogit(small, { coefficients, draws: { type, count: 50 } });
    expect(fit.draws.type).toBe(type);
    expect(Number.isFinite(fit.loglik)).toBe(true);
    expect(fit.se.every((s) => s > 0)).toBe(true);
  });

  it('fits correlated normals and names the Cholesky elements', async () => {
    const corrTruth: TrueCoefficient[] = [
      { name: 'a', distribution: 'normal', location: 0.8, spread: 0.5 },
      { name: 'b', distribution: 'normal', location: -0.6, spread: 0.5 },
      { name: 'price', distribution: 'fixed', location: -0.7 },
    ];
    const correlatedPanel = simulateChoiceData({
      respondents: 150,
      tasks: 8,
      alternatives: 3,
      coefficients: corrTruth,
      seed: 3,
    });
    const fit = await fitMixedLogit(correlatedPanel.data, {
      coefficients: correlatedPanel.coefficients,
      correlated: true,
      draws: { count: 100 },
    });
    expect(fit.names).toEqual(['a.mean', 'b.mean', 'price', 'chol.a.a', 'chol.b.a', 'chol.b.b']);
    expect(fit.converged).toBe(true);
  });
});
