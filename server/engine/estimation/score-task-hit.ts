/**
 * Hit credit of one choice task from predicted probabilities: 1 when the chosen alternative has
 * the highest probability, 1/m when it ties with m − 1 others (within a relative 1e-12), else 0;
 * the hit rate is the mean credit over tasks (common practice, no source).
 */

/** `others[0..rows−1]`: probabilities of the non-chosen alternatives; `chosen`: of the chosen one. */
export function scoreTaskHit(others: ArrayLike<number>, rows: number, chosen: number): number {
  let best = chosen;
  for (let j = 0; j < rows; j++) best = Math.max(best, others[j]);
  const near = (p: number) => p >= best * (1 - 1e-12);
  if (!near(chosen)) return 0;
  let ties = 1;
  for (let j = 0; j < rows; j++) if (near(others[j])) ties++;
  return 1 / ties;
}

/** Logit probabilities of one task at β: others[j] for the non-chosen rows; returns the chosen one's. */
export function computeTaskProbabilities(
  diffs: Float64Array,
  rowStart: number,
  rows: number,
  K: number,
  beta: ArrayLike<number>,
  others: Float64Array,
): number {
  let max = 0;
  for (let j = 0; j < rows; j++) {
    let v = 0;
    for (let k = 0; k < K; k++) v += beta[k] * diffs[(rowStart + j) * K + k];
    others[j] = v;
    if (v > max) max = v;
  }
  let den = Math.exp(-max);
  for (let j = 0; j < rows; j++) den += others[j] = Math.exp(others[j] - max);
  for (let j = 0; j < rows; j++) others[j] /= den;
  return Math.exp(-max) / den;
}
