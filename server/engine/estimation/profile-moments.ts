/**
 * One respondent's taste-profile numbers from their simulated draws (Revelt & Train 2000;
 * Train 2009 ch. 11): conditional mean Σ_r w_r β_r and SD √(Σ_r w_r (β_r − mean)²) of each
 * coefficient, the conditional mean of each WTP ratio −β_k/β_cost (ratio per draw, then
 * weighted), and the effective number of draws 1/Σ_r w_r² (Kish's effective sample size).
 * Packed as [mean (K), sd (K), wtp (K; NaN for the cost itself or without cost), effective
 * draws], so worker threads can return many respondents in one flat buffer.
 */

/** Values per respondent in the packed layout. */
export function getProfileWidth(K: number): number {
  return 3 * K + 1;
}

/**
 * Writes the packed profile of one respondent into out[offset..]: `betas` is K × R
 * (coefficient-major), `weights` the normalised w_r, `cost` the cost coefficient's index or −1.
 */
export function summariseProfileDraws(
  betas: Float64Array,
  weights: Float64Array,
  K: number,
  R: number,
  cost: number,
  out: Float64Array,
  offset: number,
): void {
  let sumW2 = 0;
  for (let r = 0; r < R; r++) sumW2 += weights[r] * weights[r];
  for (let k = 0; k < K; k++) {
    let m1 = 0;
    let ratio = 0;
    let constant = true;
    for (let r = 0; r < R; r++) {
      const b = betas[k * R + r];
      m1 += weights[r] * b;
      if (b !== betas[k * R]) constant = false;
      if (cost >= 0) ratio -= (weights[r] * b) / betas[cost * R + r];
    }
    // Two passes (Σ w (b − m)², not Σ w b² − m²): no cancellation, and exactly 0 for a
    // coefficient that is the same in every draw (a fixed one).
    let m2 = 0;
    if (!constant) for (let r = 0; r < R; r++) m2 += weights[r] * (betas[k * R + r] - m1) ** 2;
    out[offset + k] = constant ? betas[k * R] : m1;
    out[offset + K + k] = Math.sqrt(m2);
    out[offset + 2 * K + k] = cost >= 0 && k !== cost ? ratio : NaN;
  }
  out[offset + 3 * K] = 1 / sumW2;
}
