/**
 * The state of a C-class latent class logit and its E-step (Dempster, Laird & Rubin 1977; for
 * logit classes, Train 2009, §14.3 and Bhat 1997): ln L_nc = Σ_t ln P(y_nt | β_c) by the
 * per-respondent logit kernel, posteriors h_nc ∝ π_nc L_nc, and the observed-data log-likelihood
 * Σ_n ln Σ_c π_nc L_nc, all on the log scale so long panels cannot underflow.
 */
import type { ChoiceData } from '../estimation/choice-data';
import { computeRespondentLoglik, getMaxRespondentRows } from '../hb/respondent-logit-loglik';
import { computeMembership } from './membership-model';

export interface LatentClassState {
  C: number;
  K: number;
  /** Membership columns M' = 1 + covariates. */
  Mp: number;
  /** C × K class coefficients. */
  betas: Float64Array;
  /** (C−1) × M' membership parameters (class 1 is the reference). */
  gamma: Float64Array;
  /** N × C prior class probabilities π_nc. */
  pi: Float64Array;
  /** N × C posterior class probabilities h_nc. */
  h: Float64Array;
  /** N × C ln L_nc. */
  lnL: Float64Array;
  loglik: number;
}

export function createLatentClassState(
  N: number,
  C: number,
  K: number,
  Mp: number,
): LatentClassState {
  return {
    C,
    K,
    Mp,
    betas: new Float64Array(C * K),
    gamma: new Float64Array((C - 1) * Mp),
    pi: new Float64Array(N * C),
    h: new Float64Array(N * C),
    lnL: new Float64Array(N * C),
    loglik: -Infinity,
  };
}

/** E-step: recomputes π, ln L, h and the observed LL of `state` in place; returns the LL. */
export function computePosteriors(
  data: ChoiceData,
  z: Float64Array,
  state: LatentClassState,
): number {
  const { C, K, Mp, betas, pi, h, lnL } = state;
  const N = data.taskStart.length - 1;
  const work = new Float64Array(getMaxRespondentRows(data));
  computeMembership(state.gamma, z, N, Mp, C, pi);
  let loglik = 0;
  for (let n = 0; n < N; n++) {
    let max = -Infinity;
    for (let c = 0; c < C; c++) {
      const v = computeRespondentLoglik(
        data.diffs,
        data.diffStart,
        data.taskStart,
        n,
        K,
        betas,
        c * K,
        work,
      );
      lnL[n * C + c] = v;
      const a = v + Math.log(pi[n * C + c]);
      h[n * C + c] = a;
      if (a > max) max = a;
    }
    let sum = 0;
    for (let c = 0; c < C; c++) sum += h[n * C + c] = Math.exp(h[n * C + c] - max);
    for (let c = 0; c < C; c++) h[n * C + c] /= sum;
    loglik += max + Math.log(sum);
  }
  state.loglik = loglik;
  return loglik;
}
