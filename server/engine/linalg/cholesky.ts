/**
 * Cholesky factorisation A = L·Lᵀ of a symmetric positive-definite n×n matrix (row-major),
 * the Cholesky-Banachiewicz order (Golub & Van Loan, Matrix Computations, 4th ed., §4.2).
 * Reads A's lower triangle from `a` starting at `aOffset` and writes L (lower triangle, zeros
 * above) into `out`; returns false when A is not numerically positive definite: a pivot not
 * above `relativeTolerance` × A's largest diagonal entry (0: any positive pivot passes).
 */
export function choleskyDecompose(
  a: Float64Array,
  n: number,
  out: Float64Array,
  aOffset = 0,
  relativeTolerance = 0,
): boolean {
  out.fill(0, 0, n * n);
  let scale = 0;
  for (let i = 0; i < n; i++) scale = Math.max(scale, Math.abs(a[aOffset + i * n + i]));
  const tiny = scale * relativeTolerance;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = a[aOffset + i * n + j];
      for (let k = 0; k < j; k++) sum -= out[i * n + k] * out[j * n + k];
      if (i === j) {
        if (!(sum > tiny)) return false;
        out[i * n + i] = Math.sqrt(sum);
      } else {
        out[i * n + j] = sum / out[j * n + j];
      }
    }
  }
  return true;
}

/** Pivots below this share of the largest diagonal entry are rounding noise of a rank-deficient matrix. */
const SINGULAR_PIVOT = 1e-12;

/**
 * log det A = 2 Σ log L_ii of a symmetric positive-definite n×n matrix (lower triangle of `a`
 * from `aOffset`), factorised into `work` (length ≥ n²). −Infinity when A is singular or
 * indefinite beyond rounding, so a singular information matrix maps to an infinite D-error.
 */
export function getSpdLogDet(a: Float64Array, n: number, work: Float64Array, aOffset = 0): number {
  if (!choleskyDecompose(a, n, work, aOffset, SINGULAR_PIVOT)) return -Infinity;
  let half = 0;
  for (let i = 0; i < n; i++) half += Math.log(work[i * n + i]);
  return 2 * half;
}
