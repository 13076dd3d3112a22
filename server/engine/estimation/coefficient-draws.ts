/**
 * A panel mixed logit's coefficient draws at θ from standard variates (layout in
 * mixed-logit-layout.ts; Train 2009 §6.2–6.3): fixed β = b; normal b + s·η; lognormal
 * exp(b + s·η); negative lognormal −exp(b + s·η); triangular and uniform b + s·t with the
 * variate already on [−1, 1]; the correlated normal block b + L·η. The likelihood kernel and
 * the population welfare both draw coefficients through this one function.
 */
import { DIST_FIXED, DIST_LOGNORMAL, DIST_NEG_LOGNORMAL } from './distribution-codes';
import type { MixedLogitLayout } from './mixed-logit-layout';

/**
 * Writes the raw coefficient draws into `out` (K × R, coefficient-major). The variates of
 * dimension d start at `drawBase + d·stride` (standard-variates.ts layout).
 */
export function fillCoefficientDraws(
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
  variates: ArrayLike<number>,
  drawBase: number,
  stride: number,
  R: number,
  out: Float64Array,
): void {
  const { K, dist, dimension, meanIndex, spreadIndex, block, cholIndex } = layout;
  for (let k = 0; k < K; k++) {
    const base = k * R;
    const m = theta[meanIndex[k]];
    const code = dist[k];
    if (code === DIST_FIXED) {
      out.fill(m, base, base + R);
      continue;
    }
    if (spreadIndex[k] < 0) continue; // correlated block, filled below
    const s = theta[spreadIndex[k]];
    const eta = drawBase + dimension[k] * stride;
    if (code === DIST_LOGNORMAL) {
      for (let r = 0; r < R; r++) out[base + r] = Math.exp(m + s * variates[eta + r]);
    } else if (code === DIST_NEG_LOGNORMAL) {
      for (let r = 0; r < R; r++) out[base + r] = -Math.exp(m + s * variates[eta + r]);
    } else {
      for (let r = 0; r < R; r++) out[base + r] = m + s * variates[eta + r];
    }
  }
  const blockSize = block.length;
  for (let i = 0; i < blockSize; i++) {
    const base = block[i] * R;
    out.fill(theta[meanIndex[block[i]]], base, base + R);
    for (let l = 0; l <= i; l++) {
      const c = theta[cholIndex[i * blockSize + l]];
      const eta = drawBase + dimension[block[l]] * stride;
      for (let r = 0; r < R; r++) out[base + r] += c * variates[eta + r];
    }
  }
}
