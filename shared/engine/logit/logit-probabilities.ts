/**
 * Multinomial logit probabilities of J alternatives (McFadden 1974): P_j = e^{v_j} / Σ_i e^{v_i}
 * with v_j = x_j·β. One kernel for the design engine's Fisher information and the share
 * simulator. The utilities are shifted by their maximum before exponentiating, so that no
 * exponential overflows when a utility is large (common practice, no source).
 */

/**
 * Writes e^{v_j − max v} of the J alternatives in rows `xRow` .. `xRow + J − 1` of the
 * row-major matrix `x` (K columns), under coefficients `beta[betaOffset ..]`, into
 * `out[outOffset ..]`, and returns their sum (the probabilities are out[j] / sum).
 */
export function fillShiftedExpUtilities(
  K: number,
  J: number,
  x: Float64Array,
  xRow: number,
  beta: Float64Array,
  betaOffset: number,
  out: Float64Array,
  outOffset: number,
): number {
  let max = -Infinity;
  for (let j = 0; j < J; j++) {
    const row = (xRow + j) * K;
    let v = 0;
    for (let k = 0; k < K; k++) v += x[row + k] * beta[betaOffset + k];
    out[outOffset + j] = v;
    if (v > max) max = v;
  }
  let sum = 0;
  for (let j = 0; j < J; j++) {
    const e = Math.exp(out[outOffset + j] - max);
    out[outOffset + j] = e;
    sum += e;
  }
  return sum;
}

/** The same alternatives' probabilities themselves, written into `out[outOffset ..]`. */
export function fillLogitProbabilities(...args: Parameters<typeof fillShiftedExpUtilities>): void {
  const sum = fillShiftedExpUtilities(...args);
  const [, J, , , , , out, outOffset] = args;
  for (let j = 0; j < J; j++) out[outOffset + j] /= sum;
}
