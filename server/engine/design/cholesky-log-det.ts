/**
 * Log-determinant of a symmetric positive-definite K × K matrix by Cholesky factorisation
 * (Golub & Van Loan, *Matrix Computations*, 4th ed., §4.2): A = LL', log det A = 2 Σ log L_ii.
 * Reads the lower triangle of `a` (row-major, leading dimension K, starting at `offset`),
 * factorises in place in `work` (length ≥ K²). Returns −Infinity when a pivot is not
 * positive beyond a relative tolerance (singular or indefinite), so callers can map a
 * singular information matrix to an infinite D-error.
 */
export function getCholeskyLogDet(
  K: number,
  a: Float64Array,
  offset: number,
  work: Float64Array,
): number {
  let scale = 0;
  for (let i = 0; i < K; i++) scale = Math.max(scale, Math.abs(a[offset + i * K + i]));
  if (!(scale > 0)) return -Infinity;
  // Pivots below this are rounding noise of a rank-deficient matrix.
  const tiny = scale * 1e-12;
  let logDet = 0;
  for (let j = 0; j < K; j++) {
    const rowJ = j * K;
    let d = a[offset + rowJ + j];
    for (let k = 0; k < j; k++) d -= work[rowJ + k] * work[rowJ + k];
    if (!(d > tiny)) return -Infinity;
    const ljj = Math.sqrt(d);
    work[rowJ + j] = ljj;
    logDet += Math.log(d);
    const inv = 1 / ljj;
    for (let i = j + 1; i < K; i++) {
      const rowI = i * K;
      let s = a[offset + rowI + j];
      for (let k = 0; k < j; k++) s -= work[rowI + k] * work[rowJ + k];
      work[rowI + j] = s * inv;
    }
  }
  return logDet;
}
