import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { fitMnl } from '../../../server/engine/estimation/fit-mnl';
import { computeNumericalHessian } from '../../../server/engine/estimation/numerical-hessian';
import { fitLatentClass } from '../../../server/engine/latent-class/fit-latent-class';
import {
  computePosteriors,
  createLatentClassState,
} from '../../../server/engine/latent-class/latent-class-state';
import { createMembershipDesign } from '../../../server/engine/latent-class/membership-model';
import {
  computeObservedDerivatives,
  getTheta,
  setTheta,
} from '../../../server/engine/latent-class/observed-information';
import { runEm } from '../../../server/engine/latent-class/run-em';
import { simulateTwoClasses, TWO_CLASS_TRUTH } from './latent-class-fixture';

const coefficients = TWO_CLASS_TRUTH.names.map((name) => ({ name }));
const sim = simulateTwoClasses(500, 8, 7);
const { data } = buildChoiceData(TWO_CLASS_TRUTH.names, sim.rows);
const membership = { names: ['filters_water'], values: sim.covariate };

describe('latent class logit', () => {
  it('with one class equals the MNL to 1e-8 (estimates, SEs and LL)', async () => {
    // With C = 1 the model is the MNL (h_n1 = 1): EM's M-step is the MNL's Newton-Raphson and
    // the observed information is the MNL's Hessian (the Louis terms cancel).
    const mnl = await fitMnl(data);
    const lc = await fitLatentClass(data, { coefficients, classes: 1 });
    lc.classes[0].estimates.forEach((e, k) => {
      expect(e.estimate).toBeCloseTo(mnl.estimates[k], 8);
      expect(e.se!).toBeCloseTo(mnl.se[k], 8);
    });
    expect(lc.loglik).toBeCloseTo(mnl.loglik, 8);
    expect(lc.classes[0].share).toBe(1);
  });

  it('never lowers the log-likelihood across EM steps (generalised EM, Dempster, Laird & Rubin 1977)', async () => {
    const N = data.taskStart.length - 1;
    const z = createMembershipDesign(N, membership);
    const state = createLatentClassState(N, 3, 3, 2);
    // A poor, asymmetric start so EM has a long way to climb.
    state.betas.set([0.1, 0.1, 0.1, 2, -2, 0, -1, 1, -0.5]);
    const outcome = runEm(data, z, state, { maxIterations: 150, tolerance: 1e-12 });
    expect(outcome.collapsed).toBeNull();
    expect(outcome.trace.length).toBeGreaterThan(20);
    for (let i = 1; i < outcome.trace.length; i++)
      // Rounding of a sum over 4000 tasks: relative 1e-12.
      expect(outcome.trace[i]).toBeGreaterThanOrEqual(
        outcome.trace[i - 1] - 1e-12 * Math.abs(outcome.trace[i - 1]),
      );
    const fit = await fitLatentClass(data, { coefficients, classes: 2, starts: 4, membership });
    for (let i = 1; i < fit.trace.length; i++)
      expect(fit.trace[i]).toBeGreaterThanOrEqual(
        fit.trace[i - 1] - 1e-12 * Math.abs(fit.trace[i - 1]),
      );
  }, 120_000);

  it('recovers two classes (shares within 0.05, estimates within 2 SE) whatever their labels', async () => {
    const fit = await fitLatentClass(data, { coefficients, classes: 2, starts: 5, membership });
    // Match the fitted classes to the true ones by the better of the two labellings.
    const cost = (order: number[]) =>
      order.reduce(
        (s, truth, c) =>
          s +
          fit.classes[c].estimates.reduce(
            (a, e, k) => a + (e.estimate - TWO_CLASS_TRUTH.betas[truth][k]) ** 2,
            0,
          ),
        0,
      );
    const order = cost([0, 1]) <= cost([1, 0]) ? [0, 1] : [1, 0];
    const trueShare2 = Array.from(
      sim.covariate,
      (x) => 1 / (1 + Math.exp(-(TWO_CLASS_TRUTH.gamma[0] + TWO_CLASS_TRUTH.gamma[1] * x))),
    );
    const share2 = trueShare2.reduce((a, b) => a + b, 0) / trueShare2.length;
    fit.classes.forEach((cls, c) => {
      const truth = order[c];
      expect(Math.abs(cls.share - (truth === 1 ? share2 : 1 - share2))).toBeLessThan(0.05);
      expect(cls.shareSe).toBeGreaterThan(0);
      cls.estimates.forEach((e, k) => {
        expect(
          Math.abs(e.estimate - TWO_CLASS_TRUTH.betas[truth][k]),
          `${cls.class} ${e.name}`,
        ).toBeLessThan(2 * e.se!);
      });
    });
    // The covariate moves respondents toward the true class 2 (γ₁ = 1.3): the fitted class 2's
    // covariate effect against class 1 has the sign of the truth and lies within 2 SE of ±1.3.
    const effect = fit.classes[1].membership[1];
    const trueEffect = order[1] === 1 ? TWO_CLASS_TRUTH.gamma[1] : -TWO_CLASS_TRUTH.gamma[1];
    expect(Math.abs(effect.estimate - trueEffect)).toBeLessThan(2 * effect.se!);
    // Posterior class probabilities sum to one and the likeliest class agrees with the truth often.
    const agree = fit.individuals.filter(
      (p, n) => order[p.likeliestClass - 1] === sim.classOf[n],
    ).length;
    expect(agree / fit.individuals.length).toBeGreaterThan(0.7);
    expect(fit.individuals[0].classProbabilities.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
  }, 120_000);

  it('observed information: the analytic gradient and Hessian match central differences of the LL', async () => {
    const N = data.taskStart.length - 1;
    const z = createMembershipDesign(N, membership);
    const state = createLatentClassState(N, 2, 3, 2);
    state.betas.set([1, -0.3, -0.2, 0.3, -0.8, -0.4]);
    state.gamma.set([-0.5, 1]);
    computePosteriors(data, z, state);
    const theta = getTheta(state);
    const { grad, hess } = computeObservedDerivatives(data, z, state);
    const llAt = (x: Float64Array) => {
      setTheta(state, x);
      return computePosteriors(data, z, state);
    };
    const gradientAt = async (x: Float64Array, g: Float64Array) => {
      const ll = llAt(x);
      g.set(computeObservedDerivatives(data, z, state).grad);
      return ll;
    };
    // Central differences have error O(h²) ≈ 1e-8 relative here (Nocedal & Wright 2006, §8.1).
    theta.forEach((x, p) => {
      const h = 1e-5;
      const up = Float64Array.from(theta);
      const down = Float64Array.from(theta);
      up[p] = x + h;
      down[p] = x - h;
      expect(grad[p]).toBeCloseTo((llAt(up) - llAt(down)) / (2 * h), 4);
    });
    const numeric = await computeNumericalHessian(gradientAt, theta);
    numeric.hessian.forEach((v, i) => expect(hess[i]).toBeCloseTo(v, 3));
  }, 60_000);
});

describe('latent class EM with an empty class', () => {
  it('stops the start and names the class that emptied', () => {
    const N = data.taskStart.length - 1;
    const z = createMembershipDesign(N, { names: [], values: new Float64Array(0) });
    const state = createLatentClassState(N, 2, 3, 1);
    // Class 2 predicts the opposite of every choice with certainty: no respondent belongs to it.
    state.betas.set([1, -0.5, -0.3, -60, 60, 30]);
    const outcome = runEm(data, z, state, { maxIterations: 50, tolerance: 1e-10 });
    expect(outcome.collapsed).toMatch(/class 2 of 2 became empty/);
  });
});
