/**
 * Goodness-of-fit summaries for choice models (McFadden's ρ² and its adjusted form as in
 * Ben-Akiva & Lerman 1985 §7.4; AIC, Akaike 1974; BIC, Schwarz 1978, with n = number of
 * choice tasks, common practice, no source) and the null log-likelihood Σ ln(1/J_t).
 */
import type { ChoiceData } from './choice-data';

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
