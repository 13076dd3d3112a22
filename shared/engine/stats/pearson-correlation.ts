/**
 * Pearson's product-moment correlation of paired values (two-pass: means first, then centred
 * sums, which avoids the cancellation of the one-pass formula). Null when fewer than 3 pairs or
 * when either side does not vary.
 */
export function pearsonCorrelation(x: ArrayLike<number>, y: ArrayLike<number>): number | null {
  const n = Math.min(x.length, y.length);
  if (n < 3) return null;
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i] / n;
    my += y[i] / n;
  }
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - mx;
    const dy = y[i] - my;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  const denominator = Math.sqrt(sxx * syy);
  // Relative threshold: a constant column has rounding-level variance.
  if (!(denominator > 1e-12 * (1 + mx * mx + my * my))) return null;
  return sxy / denominator;
}
