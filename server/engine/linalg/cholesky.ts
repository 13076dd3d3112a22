/**
 * Cholesky factorisation A = L·Lᵀ of a symmetric positive-definite n×n matrix (row-major),
 * the Cholesky-Banachiewicz order (Golub & Van Loan, Matrix Computations, 4th ed., §4.2).
 * Writes L (lower triangle, zeros above) into `out`; returns false if A is not numerically
 * positive definite.
 */
export function choleskyDecompose(a: Float64Array, n: number, out: Float64Array): boolean {
  out.fill(0, 0, n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = a[i * n + j];
      for (let k = 0; k < j; k++) sum -= out[i * n + k] * out[j * n + k];
      if (i === j) {
        if (!(sum > 0)) return false;
        out[i * n + i] = Math.sqrt(sum);
      } else {
        out[i * n + j] = sum / out[j * n + j];
      }
    }
  }
  return true;
}
