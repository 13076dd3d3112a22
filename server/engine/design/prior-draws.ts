/**
 * Coefficient draws from independent normal priors β_k ~ N(mean_k, sd_k²) by the inverse
 * normal transform of scrambled Halton points (Sándor & Wedel 2001; Bliemer, Rose & Hess
 * 2008 [M]), taken from the estimation's own Halton draws (draws/uniform-draws.ts: random
 * digit scrambling seeded by the design's seed, the first HALTON_SKIP points dropped). Only
 * columns with sd > 0 consume a Halton dimension, so the smallest primes go to the uncertain
 * coefficients; columns with sd = 0 repeat their mean.
 */
import { fillUniformDraws } from '../draws/uniform-draws';
import { inverseNormal as getInverseNormal } from '../draws/inverse-normal';

/** Returns R × K row-major draws. R = 1 with all sd = 0 gives the point prior. */
export function buildPriorDraws(
  means: Float64Array,
  sds: Float64Array,
  R: number,
  seed: number,
): Float64Array {
  const K = means.length;
  const random: number[] = [];
  for (let k = 0; k < K; k++) if (sds[k] > 0) random.push(k);
  const draws = new Float64Array(R * K);
  // Laid out [dimension][draw], as for one respondent of the estimation's panel draws.
  const points = new Float64Array(R * random.length);
  if (random.length > 0)
    fillUniformDraws({ type: 'halton', count: R, dimensions: random.length, seed }, 0, 1, points);
  for (let r = 0; r < R; r++) {
    for (let k = 0; k < K; k++) draws[r * K + k] = means[k];
    for (let d = 0; d < random.length; d++) {
      const k = random[d];
      draws[r * K + k] = means[k] + sds[k] * getInverseNormal(points[d * R + r]);
    }
  }
  return draws;
}
