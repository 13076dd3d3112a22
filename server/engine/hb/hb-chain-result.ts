/** What one HB chain returns: the kept draws, a thinned trace of the whole run, acceptance. */

export interface HbChainTrace {
  /** Iteration (1-based) of each trace point; burn-in included. */
  iteration: Int32Array;
  /** points × Kr population means μ. */
  mu: Float64Array;
  /** points × Kr diagonal of Σ. */
  sigmaDiag: Float64Array;
  /** Share of respondents whose proposal was accepted at that iteration. */
  acceptance: Float64Array;
  /** Proposal scale ρ at that iteration. */
  scale: Float64Array;
}

export interface HbChainResult {
  chain: number;
  /** retained × Kr draws of μ (α scale). */
  mu: Float64Array;
  /** retained × Kr² draws of Σ (α scale). */
  sigma: Float64Array;
  /** retained × Kf draws of the fixed coefficients. */
  fixed: Float64Array;
  /** retained total log-likelihoods Σ_n ln P(y_n | β_n). */
  loglik: Float64Array;
  /** retained × N × Kr individual coefficients β_n (after the lognormal transforms). */
  betas: Float32Array;
  trace: HbChainTrace;
  /** Acceptance rate of the respondent-level step during burn-in and after it. */
  acceptanceBurnin: number;
  acceptance: number;
  /** Acceptance rate of the fixed-coefficient step after burn-in (null without fixed ones). */
  acceptanceFixed: number | null;
  /** Proposal scale ρ after burn-in (then fixed). */
  scale: number;
  mnlLoglik: number;
}

/** Buffers of a chain result that can be moved between threads instead of copied. */
export function getTransferables(r: HbChainResult): ArrayBuffer[] {
  return [r.mu, r.sigma, r.fixed, r.loglik, r.betas, ...Object.values(r.trace)].map(
    (a) => (a as Float64Array).buffer as ArrayBuffer,
  );
}
