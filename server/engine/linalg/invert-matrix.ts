/**
 * Inverse of a square n×n matrix (row-major) by Gauss-Jordan elimination with partial
 * pivoting (Golub & Van Loan, Matrix Computations, 4th ed., §3.2). Used for covariance
 * matrices (inverse Hessians), which may be indefinite at a saddle point, so no Cholesky.
 * Returns null when a pivot falls below `relTol` times the largest absolute entry.
 */
export function invertMatrix(a: Float64Array, n: number, relTol = 1e-13): Float64Array | null {
  const work = Float64Array.from(a.subarray(0, n * n));
  const inv = new Float64Array(n * n);
  for (let i = 0; i < n; i++) inv[i * n + i] = 1;
  let scale = 0;
  for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(work[i]));
  if (!(scale > 0) || !Number.isFinite(scale)) return null;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let row = col + 1; row < n; row++) {
      if (Math.abs(work[row * n + col]) > Math.abs(work[pivot * n + col])) pivot = row;
    }
    if (Math.abs(work[pivot * n + col]) <= relTol * scale) return null;
    if (pivot !== col) {
      swapRows(work, n, pivot, col);
      swapRows(inv, n, pivot, col);
    }
    const p = work[col * n + col];
    for (let j = 0; j < n; j++) {
      work[col * n + j] /= p;
      inv[col * n + j] /= p;
    }
    for (let row = 0; row < n; row++) {
      if (row === col) continue;
      const f = work[row * n + col];
      if (f === 0) continue;
      for (let j = 0; j < n; j++) {
        work[row * n + j] -= f * work[col * n + j];
        inv[row * n + j] -= f * inv[col * n + j];
      }
    }
  }
  return inv;
}

function swapRows(m: Float64Array, n: number, a: number, b: number): void {
  for (let j = 0; j < n; j++) {
    const t = m[a * n + j];
    m[a * n + j] = m[b * n + j];
    m[b * n + j] = t;
  }
}

/**
 * Sandwich covariance A⁻¹·B·A⁻¹ for symmetric n×n matrices (row-major), the robust
 * (Huber-White) covariance with A⁻¹ the inverse information and B the score outer product.
 */
export function sandwich(aInv: Float64Array, b: Float64Array, n: number): Float64Array {
  const tmp = new Float64Array(n * n);
  const out = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += aInv[i * n + k] * b[k * n + j];
      tmp[i * n + j] = s;
    }
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += tmp[i * n + k] * aInv[k * n + j];
      out[i * n + j] = s;
    }
  return out;
}

/** Square roots of the diagonal (standard errors from a covariance); NaN where negative. */
export function getDiagonalSqrt(cov: Float64Array, n: number): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = cov[i * n + i] >= 0 ? Math.sqrt(cov[i * n + i]) : NaN;
  return out;
}
