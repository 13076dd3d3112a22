/**
 * Inverse of a symmetric positive-definite K × K matrix through its Cholesky factor
 * (Golub & Van Loan, *Matrix Computations*, 4th ed., §4.2): A = LL', A⁻¹ = L'⁻¹L⁻¹.
 * Reads the lower triangle of `a`; writes the full symmetric inverse into `out`. Returns
 * log det A, or −Infinity (leaving `out` unspecified) when A is singular to working
 * precision. `work` needs K² entries.
 */
import { getSpdLogDet } from '../linalg/cholesky';
import { invertLower } from '../linalg/triangular';

export function invertSpd(
  K: number,
  a: Float64Array,
  aOffset: number,
  out: Float64Array,
  outOffset: number,
  work: Float64Array,
): number {
  const logDet = getSpdLogDet(a, K, work, aOffset);
  if (logDet === -Infinity) return logDet;
  // work := L⁻¹ in place (lower triangular; A⁻¹ below reads only that triangle).
  invertLower(work, K, work);
  // A⁻¹ = (L⁻¹)' L⁻¹.
  for (let i = 0; i < K; i++)
    for (let j = 0; j <= i; j++) {
      let s = 0;
      for (let k = i; k < K; k++) s += work[k * K + i] * work[k * K + j];
      out[outOffset + i * K + j] = s;
      out[outOffset + j * K + i] = s;
    }
  return logDet;
}
