/**
 * Multinomial logit log-likelihood with analytic gradient and Hessian (McFadden 1974; Train
 * 2009 §3.7-3.8). With d_j = x_j − x_chosen and v_j = β·d_j, ln P = −ln(1 + Σ_j e^{v_j}),
 * ∂ln P/∂β = −Σ_j P_j d_j and ∂²ln P/∂β∂β' = −[Σ_j P_j d_j d_j' − (Σ_j P_j d_j)(Σ_j P_j d_j)'].
 */
import { getMaxTaskRows, type ChoiceData } from './choice-data';

/**
 * Returns Σ ln P over all tasks at β (length K = data columns). Adds the gradient into `grad`
 * and the Hessian (K×K) into `hess` when given (both are zeroed first), and per-respondent
 * scores into `scores` (N×K) for clustered robust standard errors. With `weights` (length N)
 * respondent n's terms in the LL, gradient and Hessian count w_n times (the weighted MNL of a
 * latent class M-step); scores stay unweighted.
 */
export function evaluateMnl(
  data: ChoiceData,
  beta: Float64Array,
  grad: Float64Array | null,
  hess: Float64Array | null,
  scores: Float64Array | null = null,
  weights: Float64Array | null = null,
): number {
  const K = data.columns.length;
  const { diffs, diffStart, taskStart } = data;
  const N = taskStart.length - 1;
  grad?.fill(0, 0, K);
  hess?.fill(0, 0, K * K);
  scores?.fill(0, 0, N * K);
  const mean = new Float64Array(K);
  const p = new Float64Array(getMaxTaskRows(data));
  let ll = 0;
  for (let n = 0; n < N; n++) {
    const wn = weights ? weights[n] : 1;
    if (wn === 0 && !scores) continue;
    for (let t = taskStart[n]; t < taskStart[n + 1]; t++) {
      const first = diffStart[t];
      const rows = diffStart[t + 1] - first;
      let maxV = 0;
      for (let j = 0; j < rows; j++) {
        let v = 0;
        for (let k = 0; k < K; k++) v += beta[k] * diffs[(first + j) * K + k];
        p[j] = v;
        if (v > maxV) maxV = v;
      }
      // Shift by max(0, v) so exponentials cannot overflow when a task is predicted badly.
      let denom = Math.exp(-maxV);
      for (let j = 0; j < rows; j++) denom += p[j] = Math.exp(p[j] - maxV);
      ll += wn * (-maxV - Math.log(denom));
      if (!grad && !hess && !scores) continue;
      for (let j = 0; j < rows; j++) p[j] /= denom;
      mean.fill(0);
      for (let j = 0; j < rows; j++)
        for (let k = 0; k < K; k++) mean[k] += p[j] * diffs[(first + j) * K + k];
      for (let k = 0; k < K; k++) {
        if (grad) grad[k] -= wn * mean[k];
        if (scores) scores[n * K + k] -= mean[k];
      }
      if (!hess) continue;
      for (let j = 0; j < rows; j++) {
        const o = (first + j) * K;
        for (let a = 0; a < K; a++) {
          const da = wn * p[j] * diffs[o + a];
          if (da === 0) continue;
          for (let b = 0; b < K; b++) hess[a * K + b] -= da * diffs[o + b];
        }
      }
      for (let a = 0; a < K; a++)
        for (let b = 0; b < K; b++) hess[a * K + b] += wn * mean[a] * mean[b];
    }
  }
  return ll;
}
