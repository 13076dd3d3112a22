/**
 * MNL choice probabilities and Fisher information of choice tasks (McFadden 1974; Huber &
 * Zwerina 1996, JMR 33(3):307-317, eq. for I(X, β)):
 *   I(X, β) = Σ_s Σ_j P_js (x_js − x̄_s)(x_js − x̄_s)',  x̄_s = Σ_j P_js x_js.
 * Task s occupies rows s·J .. s·J+J−1 of the row-major design matrix `x` (K columns).
 */
import { fillLogitProbabilities } from '../../../shared/engine/logit/logit-probabilities';

/**
 * Adds one task's information Σ_j P_j (x_j − x̄)(x_j − x̄)' to the LOWER triangle of the
 * K × K matrix `out` (row-major at `outOffset`). `work` needs J·(K+1) + K entries.
 */
export function addTaskInformation(
  K: number,
  J: number,
  x: Float64Array,
  xRow: number,
  beta: Float64Array,
  betaOffset: number,
  out: Float64Array,
  outOffset: number,
  work: Float64Array,
): void {
  const p = 0; // work[0 .. J): probabilities
  const mean = J; // work[J .. J+K): x̄
  const dev = J + K; // work[J+K ..): centered rows, J × K
  fillLogitProbabilities(K, J, x, xRow, beta, betaOffset, work, p);
  for (let k = 0; k < K; k++) work[mean + k] = 0;
  for (let j = 0; j < J; j++) {
    const row = (xRow + j) * K;
    const pj = work[p + j];
    for (let k = 0; k < K; k++) work[mean + k] += pj * x[row + k];
  }
  for (let j = 0; j < J; j++) {
    const row = (xRow + j) * K;
    const d = dev + j * K;
    for (let k = 0; k < K; k++) work[d + k] = x[row + k] - work[mean + k];
  }
  for (let j = 0; j < J; j++) {
    const pj = work[p + j];
    const d = dev + j * K;
    for (let i = 0; i < K; i++) {
      const wi = pj * work[d + i];
      if (wi === 0) continue;
      const rowI = outOffset + i * K;
      for (let k = 0; k <= i; k++) out[rowI + k] += wi * work[d + k];
    }
  }
}

/** Copies the lower triangle of a K × K row-major matrix onto its upper triangle. */
export function symmetrizeLower(K: number, a: Float64Array, offset: number): void {
  for (let i = 0; i < K; i++)
    for (let k = 0; k < i; k++) a[offset + k * K + i] = a[offset + i * K + k];
}

/**
 * Full information matrix of S tasks × J alternatives (rows of `x`) at `beta`, written
 * symmetric into `out` (K × K). `work` needs J·(K+1) + K entries.
 */
export function computeInformationMatrix(
  K: number,
  S: number,
  J: number,
  x: Float64Array,
  beta: Float64Array,
  out: Float64Array,
  work: Float64Array,
): void {
  out.fill(0, 0, K * K);
  for (let s = 0; s < S; s++) addTaskInformation(K, J, x, s * J, beta, 0, out, 0, work);
  symmetrizeLower(K, out, 0);
}

/**
 * A criterion of the S·J × K design matrix `x` (S tasks of J rows) averaged over R coefficient vectors (`draws`,
 * row-major R × K; R = 1 is a point prior): `score` reads the information matrix at draw r (its
 * LOWER triangle, row-major K × K) and the draw's offset in `draws`. The Bayesian average of
 * Sándor & Wedel (2001), shared by the D-error and the other design criteria.
 */
export function averageOverDraws(
  design: { K: number; S: number; J: number; x: Float64Array },
  draws: Float64Array,
  R: number,
  score: (info: Float64Array, drawOffset: number) => number,
): number {
  const { K, S, J, x } = design;
  const info = new Float64Array(K * K);
  const work = new Float64Array(J * (K + 1) + K);
  let sum = 0;
  for (let r = 0; r < R; r++) {
    info.fill(0);
    for (let s = 0; s < S; s++) addTaskInformation(K, J, x, s * J, draws, r * K, info, 0, work);
    sum += score(info, r * K);
  }
  return sum / R;
}
