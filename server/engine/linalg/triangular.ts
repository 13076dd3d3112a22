/**
 * Triangular kernels on row-major n×n matrices (Golub & Van Loan, Matrix Computations, 4th ed.,
 * §3.1): forward substitution, the inverse of a lower-triangular matrix, and the products used
 * to turn a Cholesky factor into its matrix. No allocation; callers give the outputs.
 */

/** Solves L·x = b for lower-triangular L (row-major n×n); x may alias b. */
export function solveLower(
  L: Float64Array,
  n: number,
  b: ArrayLike<number>,
  bOffset: number,
  x: Float64Array,
): void {
  for (let i = 0; i < n; i++) {
    let s = b[bOffset + i];
    const row = i * n;
    for (let k = 0; k < i; k++) s -= L[row + k] * x[k];
    x[i] = s / L[row + i];
  }
}

/**
 * Writes L⁻¹ (lower triangular) of lower-triangular L into `out`, or in place when `out` is L
 * itself: row i of L⁻¹ reads only rows above it of L⁻¹ and columns c.. of row i of L, so
 * overwriting row i from the left reads nothing overwritten. In place, the strict upper
 * triangle is left as it was; into another array it is zeroed.
 */
export function invertLower(L: Float64Array, n: number, out: Float64Array): void {
  if (out !== L) out.fill(0, 0, n * n);
  for (let i = 0; i < n; i++) {
    const row = i * n;
    out[row + i] = 1 / L[row + i];
    for (let j = 0; j < i; j++) {
      let s = 0;
      for (let k = j; k < i; k++) s -= L[row + k] * out[k * n + j];
      out[row + j] = s * out[row + i];
    }
  }
}

/** out = A·Aᵀ for lower-triangular A (symmetric result, both triangles written). */
export function multiplyLowerByTranspose(A: Float64Array, n: number, out: Float64Array): void {
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++) {
      let s = 0;
      for (let k = 0; k <= j; k++) s += A[i * n + k] * A[j * n + k];
      out[i * n + j] = s;
      out[j * n + i] = s;
    }
}

/** out = Aᵀ·A for lower-triangular A (symmetric result, both triangles written). */
export function multiplyTransposeByLower(A: Float64Array, n: number, out: Float64Array): void {
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++) {
      let s = 0;
      for (let k = i; k < n; k++) s += A[k * n + i] * A[k * n + j];
      out[i * n + j] = s;
      out[j * n + i] = s;
    }
}

/** out = A·B for lower-triangular A and B (the product is lower triangular). */
export function multiplyLower(
  A: Float64Array,
  B: Float64Array,
  n: number,
  out: Float64Array,
): void {
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = j; k <= i; k++) s += A[i * n + k] * B[k * n + j];
      out[i * n + j] = j <= i ? s : 0;
    }
}
