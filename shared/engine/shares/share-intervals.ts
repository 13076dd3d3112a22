/**
 * Share intervals from coefficient draws (share-draws.ts): for each draw r the sample share
 *   S_rj = (1/N) Σ_n exp(x_j·β_nr) / Σ_i exp(x_i·β_nr),
 * then per alternative the mean over draws and the percentile interval (Hyndman & Fan 1996
 * type 7 quantiles). With parameter draws this is the Krinsky & Robb (1986) interval of the
 * shares; with conditional draws it is the spread of the sample shares over each respondent's
 * conditional distribution, and the mean over draws is the sample-enumeration share averaged
 * over those distributions (Train 2009, §11.6) rather than evaluated at their means.
 * Browser-safe: typed arrays, no Node APIs; no allocation inside the loops.
 */
import { quantile } from '../stats/quantile';
import { fillShiftedExpUtilities } from '../logit/logit-probabilities';
import type { ShareDraws } from './share-draws';

export interface ShareInterval {
  /** Mean share over the draws (length J). */
  mean: Float64Array;
  lower: Float64Array;
  upper: Float64Array;
  /** Row-major R × J sample shares of each draw (for sweeps and exports). */
  drawShares: Float64Array;
}

/**
 * Shares of the J alternatives (row-major J × K coded rows, same column order as the draws)
 * for every draw, and their `level` interval (default 0.95).
 */
export function simulateShareIntervals(
  d: ShareDraws,
  alternativeCount: number,
  alternatives: Float64Array,
  level = 0.95,
): ShareInterval {
  const { respondents: N, draws: R, coefficients: K, betas } = d;
  const J = alternativeCount;
  if (!(Number.isInteger(J) && J >= 2))
    throw new RangeError('a scenario needs at least 2 alternatives');
  if (alternatives.length !== J * K)
    throw new RangeError(`alternatives must hold alternatives × coefficients = ${J * K}`);
  if (!(level > 0 && level < 1)) throw new RangeError('level must lie strictly between 0 and 1');
  const drawShares = new Float64Array(R * J);
  const v = new Float64Array(J);
  for (let n = 0; n < N; n++)
    for (let r = 0; r < R; r++) {
      const b = (n * R + r) * K;
      const denominator = fillShiftedExpUtilities(K, J, alternatives, 0, betas, b, v, 0);
      const o = r * J;
      for (let j = 0; j < J; j++) drawShares[o + j] += v[j] / denominator / N;
    }
  const mean = new Float64Array(J);
  const lower = new Float64Array(J);
  const upper = new Float64Array(J);
  const column = new Float64Array(R);
  for (let j = 0; j < J; j++) {
    let sum = 0;
    for (let r = 0; r < R; r++) {
      column[r] = drawShares[r * J + j];
      sum += column[r];
    }
    column.sort();
    mean[j] = sum / R;
    lower[j] = quantile(column, (1 - level) / 2);
    upper[j] = quantile(column, (1 + level) / 2);
  }
  return { mean, lower, upper, drawShares };
}
