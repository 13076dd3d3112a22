/**
 * Goodness-of-fit summaries for choice models (McFadden's ρ² and its adjusted form as in
 * Ben-Akiva & Lerman 1985 §7.4, against LL(0) and against the constants-only LL(C); AIC,
 * Akaike 1974; BIC, Schwarz 1978, and CAIC = −2LL + K(ln n + 1), Bozdogan 1987,
 * Psychometrika 52:345-370, with n = number of choice tasks, common practice, no source), the
 * null log-likelihood Σ ln(1/J_t) and LL(C).
 */
import { analyseInformation } from '../linalg/analyse-information';
import type { ChoiceData } from './choice-data';
import { multiply } from './convergence';
import { evaluateMnl } from './mnl-likelihood';

export interface FitStatistics {
  rho2: number;
  adjRho2: number;
  aic: number;
  bic: number;
}

/** LL(0): every alternative equally likely in every task. */
export function computeNullLoglik(data: ChoiceData): number {
  let ll = 0;
  for (let t = 0; t < data.altCount.length; t++) ll -= Math.log(data.altCount[t]);
  return ll;
}

/**
 * LL(C): the MNL with only the alternatives' constants, maximised by Newton's method (pseudo-
 * inverse steps, so an alternative that is never chosen drives its constant toward −∞ and LL
 * toward its supremum, which is LL(C)).
 */
export function computeConstantsLoglik(constants: ChoiceData): number {
  const K = constants.columns.length;
  const beta = new Float64Array(K);
  const grad = new Float64Array(K);
  const hess = new Float64Array(K * K);
  let ll = evaluateMnl(constants, beta, grad, hess);
  for (let iteration = 0; iteration < 100; iteration++) {
    const step = multiply(
      analyseInformation(
        hess.map((v) => -v),
        K,
      ).inverse,
      grad,
    );
    let moved = false;
    for (let lambda = 1, h = 0; h < 30; h++, lambda /= 2) {
      const trial = beta.map((b, k) => b + lambda * step[k]);
      const next = evaluateMnl(constants, trial, null, null);
      if (next > ll) {
        beta.set(trial);
        moved = next - ll > 1e-12 * Math.abs(ll);
        ll = evaluateMnl(constants, beta, grad, hess);
        break;
      }
    }
    if (!moved) break;
  }
  return ll;
}

/** CAIC = −2LL + K(ln n + 1) (Bozdogan 1987). */
export function computeCaic(loglik: number, parameters: number, observations: number): number {
  return parameters * (Math.log(observations) + 1) - 2 * loglik;
}

/** ρ² = 1 − LL/LL0, adjusted ρ² = 1 − (LL − K)/LL0, AIC = 2K − 2LL, BIC = K ln n − 2LL. */
export function computeFitStatistics(
  loglik: number,
  loglikNull: number,
  parameters: number,
  observations: number,
): FitStatistics {
  return {
    rho2: 1 - loglik / loglikNull,
    adjRho2: 1 - (loglik - parameters) / loglikNull,
    aic: 2 * parameters - 2 * loglik,
    bic: parameters * Math.log(observations) - 2 * loglik,
  };
}
