/**
 * Gamma and chi-square variates from the seeded generator: Marsaglia & Tsang, "A simple method
 * for generating gamma variables", ACM TOMS 26(3):363-372, 2000 (squeeze-free form), with the
 * normal variate by inversion (AS241) and, for shape a < 1, the boost Gamma(a) = Gamma(a + 1)·U^{1/a}
 * (same paper, §6). Used by the Bartlett construction of Wishart draws.
 */
import { inverseNormal } from './inverse-normal';
import type { Prng } from './prng';

/** Rejections allowed before giving up: the acceptance rate is above 0.95 for every shape ≥ 1. */
const MAX_TRIES = 1000;

/** A standard normal variate, Φ⁻¹(U) with U from the generator. */
export function drawStandardNormal(prng: Prng): number {
  return inverseNormal(prng.nextDouble());
}

/** A Gamma(shape, 1) variate; shape must be positive and finite. */
export function drawGamma(shape: number, prng: Prng): number {
  if (!(shape > 0) || !Number.isFinite(shape)) throw new RangeError('gamma shape must be positive');
  if (shape < 1) return drawGamma(shape + 1, prng) * prng.nextDouble() ** (1 / shape);
  const d = shape - 1 / 3;
  const c = 1 / Math.sqrt(9 * d);
  for (let tries = 0; tries < MAX_TRIES; tries++) {
    const x = drawStandardNormal(prng);
    const t = 1 + c * x;
    if (t <= 0) continue;
    const v = t * t * t;
    const u = prng.nextDouble();
    if (Math.log(u) < 0.5 * x * x + d - d * v + d * Math.log(v)) return d * v;
  }
  throw new Error('gamma sampler did not accept within its bound');
}

/** A chi-square variate with `df` degrees of freedom: 2·Gamma(df/2, 1). */
export function drawChiSquare(df: number, prng: Prng): number {
  return 2 * drawGamma(df / 2, prng);
}
