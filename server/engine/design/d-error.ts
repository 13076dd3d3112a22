/**
 * D-error of a choice design (Huber & Zwerina 1996, JMR 33(3):307-317):
 * D-error = det(I(X, β))^(−1/K); D₀ at β = 0, D_p at a point prior. Bayesian D-error
 * (Sándor & Wedel 2001, JMR 38(4):430-444): D_B = ∫ det(I(X, β))^(−1/K) π(β) dβ, here the
 * average over R prior draws. A singular information matrix gives Infinity.
 */
import { getSpdLogDet } from '../linalg/cholesky';
import { averageOverDraws } from './mnl-information';

/** Maps log det I to det(I)^(−1/K), Infinity when singular. */
export function getDErrorFromLogDet(K: number, logDet: number): number {
  return logDet === -Infinity ? Infinity : Math.exp(-logDet / K);
}

/**
 * D-error at each of R coefficient vectors (`draws`, row-major R × K), averaged; with R = 1
 * this is the point-prior D-error. `x` is the S·J × K design matrix (J rows per task,
 * including any opt-out / status quo row).
 */
export function computeBayesianDError(
  K: number,
  S: number,
  J: number,
  x: Float64Array,
  draws: Float64Array,
  R: number,
): number {
  const chol = new Float64Array(K * K);
  return averageOverDraws({ K, S, J, x }, draws, R, (info) =>
    getDErrorFromLogDet(K, getSpdLogDet(info, K, chol, 0)),
  );
}

/** Point-prior D-error det(I(X, β))^(−1/K) (β = zeros gives D₀). */
export function computeDError(
  K: number,
  S: number,
  J: number,
  x: Float64Array,
  beta: Float64Array,
): number {
  return computeBayesianDError(K, S, J, x, beta, 1);
}
