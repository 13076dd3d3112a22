/**
 * One draw from a multivariate normal N(μ, LLᵀ): x = μ + L z with z standard normal by
 * inversion (Φ⁻¹ of the seeded uniforms, AS241). The Krinsky & Robb (1986, Review of Economics
 * and Statistics 68:715–719) draws of WTP intervals, of derived quantities and of share
 * intervals all take their draws from here, so they see the same stream for the same seed.
 */
import { inverseNormal } from './inverse-normal';
import type { Prng } from './prng';

/**
 * Writes one draw into `out[outOffset … outOffset + P)`. `lower` is the row-major P × P lower
 * Cholesky factor (entries above the diagonal are ignored); `z` is scratch of length ≥ P and
 * holds the standard normal variates afterwards. Consumes exactly P uniforms of `prng`.
 */
export function drawMultivariateNormal(
  mean: ArrayLike<number>,
  lower: ArrayLike<number>,
  P: number,
  prng: Prng,
  z: Float64Array,
  out: Float64Array,
  outOffset = 0,
): void {
  for (let p = 0; p < P; p++) z[p] = inverseNormal(prng.nextDouble());
  for (let i = 0; i < P; i++) {
    let v = mean[i];
    for (let j = 0; j <= i; j++) v += lower[i * P + j] * z[j];
    out[outOffset + i] = v;
  }
}
