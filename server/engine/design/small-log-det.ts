/**
 * Log-determinant of a small general n × n matrix (row-major, overwritten) by Gaussian
 * elimination with partial pivoting (Golub & Van Loan, *Matrix Computations*, 4th ed., §3.4).
 * Returns −Infinity when the determinant is not positive: callers use it on matrices whose
 * determinant is positive in exact arithmetic (det(I + MZ) with M, Z positive semi-definite),
 * so a non-positive value means rank loss.
 */
export function getSmallLogDet(n: number, m: Float64Array): number {
  let logDet = 0;
  let sign = 1;
  for (let c = 0; c < n; c++) {
    let pivot = c;
    let best = Math.abs(m[c * n + c]);
    for (let r = c + 1; r < n; r++) {
      const v = Math.abs(m[r * n + c]);
      if (v > best) {
        best = v;
        pivot = r;
      }
    }
    if (!(best > 0)) return -Infinity;
    if (pivot !== c) {
      sign = -sign;
      for (let k = 0; k < n; k++) {
        const t = m[c * n + k];
        m[c * n + k] = m[pivot * n + k];
        m[pivot * n + k] = t;
      }
    }
    const d = m[c * n + c];
    if (d < 0) sign = -sign;
    logDet += Math.log(Math.abs(d));
    for (let r = c + 1; r < n; r++) {
      const f = m[r * n + c] / d;
      if (f === 0) continue;
      for (let k = c; k < n; k++) m[r * n + k] -= f * m[c * n + k];
    }
  }
  return sign > 0 ? logDet : -Infinity;
}
