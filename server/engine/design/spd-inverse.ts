/**
 * Inverse of a symmetric positive-definite K × K matrix through its Cholesky factor
 * (Golub & Van Loan, *Matrix Computations*, 4th ed., §4.2): A = LL', A⁻¹ = L'⁻¹L⁻¹.
 * Returns false (leaving `out` unspecified) when A is singular to working precision.
 * `work` needs K² entries.
 */
import { getCholeskyLogDet } from './cholesky-log-det';

export function invertSpd(
  K: number,
  a: Float64Array,
  out: Float64Array,
  work: Float64Array,
): boolean {
  if (getCholeskyLogDet(K, a, 0, work) === -Infinity) return false;
  // out := L⁻¹ (lower triangular) by forward substitution, column by column.
  out.fill(0, 0, K * K);
  for (let c = 0; c < K; c++) {
    for (let i = c; i < K; i++) {
      let s = i === c ? 1 : 0;
      for (let k = c; k < i; k++) s -= work[i * K + k] * out[k * K + c];
      out[i * K + c] = s / work[i * K + i];
    }
  }
  // A⁻¹ = (L⁻¹)' L⁻¹; fill the lower triangle then mirror, reusing `work` as scratch.
  for (let i = 0; i < K; i++)
    for (let j = 0; j <= i; j++) {
      let s = 0;
      for (let k = i; k < K; k++) s += out[k * K + i] * out[k * K + j];
      work[i * K + j] = s;
    }
  for (let i = 0; i < K; i++)
    for (let j = 0; j <= i; j++) {
      out[i * K + j] = work[i * K + j];
      out[j * K + i] = work[i * K + j];
    }
  return true;
}
