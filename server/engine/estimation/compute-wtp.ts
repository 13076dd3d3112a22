/**
 * Population willingness to pay WTP_k = −β_k / β_cost with delta-method standard errors
 * (Var = ∇g' Σ ∇g; docs/methods.md "Willingness to pay"; Hole 2007, Health Econ 16:827-840) and Krinsky & Robb
 * (1986, REStat 68:715-719) percentile intervals from seeded draws θ ~ N(θ̂, Σ).
 * For random coefficients the ratio of the population MEANS is used (for lognormals
 * ±exp(b + s²/2)): a ratio of means, not the mean of individual ratios, which may not exist
 * when the cost coefficient can be near zero; individual ratios are in the taste profiles.
 */
import { inverseNormal } from '../draws/inverse-normal';
import { drawMultivariateNormal } from '../../../shared/engine/random/multivariate-normal';
import { createPrng } from '../draws/prng';
import { choleskyDecompose } from '../linalg/cholesky';
import { EstimationOptionsError } from './estimation-errors';
import type { MixedLogitLayout } from './mixed-logit-layout';
import { getPopulationMeanJacobian } from './population-moments';
import { quantile } from '../../../shared/engine/stats/quantile';

export interface WtpOptions {
  /** Name of the cost coefficient. */
  cost: string;
  /** Krinsky-Robb draws (default 10000). */
  draws?: number;
  seed?: number;
  /** Interval coverage (default 0.95). */
  level?: number;
}

export interface WtpEstimate {
  name: string;
  estimate: number;
  se: number;
  /** Delta-method interval estimate ± z·se. */
  deltaLower: number;
  deltaUpper: number;
  /** Krinsky-Robb percentile interval (NaN if the covariance is not positive definite). */
  lower: number;
  upper: number;
}

/** WTP of every non-cost coefficient at θ with covariance Σ (P × P). */
export function computeWtp(
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
  covariance: Float64Array,
  options: WtpOptions,
): WtpEstimate[] {
  const c = layout.coefficients.findIndex((x) => x.name === options.cost);
  if (c < 0)
    throw new EstimationOptionsError(
      `cost coefficient ${options.cost} is not in the model`,
      'cost',
    );
  const draws = options.draws ?? 10_000;
  const level = options.level ?? 0.95;
  if (!Number.isInteger(draws) || draws < 100)
    throw new EstimationOptionsError('draws must be an integer ≥ 100', 'draws');
  if (!(level > 0 && level < 1))
    throw new EstimationOptionsError('level must lie in (0, 1)', 'level');
  const { P, K } = layout;
  const { means, jacobian } = getPopulationMeanJacobian(layout, theta);
  const z = inverseNormal(0.5 + level / 2);
  const kr = krinskyRobb(layout, theta, covariance, c, draws, options.seed ?? 1);
  const out: WtpEstimate[] = [];
  for (let k = 0; k < K; k++) {
    if (k === c) continue;
    const wtp = -means[k] / means[c];
    // ∇g = −J_k/μ_c + μ_k J_c/μ_c²
    const grad = new Float64Array(P);
    for (let p = 0; p < P; p++)
      grad[p] = -jacobian[k * P + p] / means[c] + (means[k] * jacobian[c * P + p]) / means[c] ** 2;
    let variance = 0;
    for (let a = 0; a < P; a++)
      for (let b = 0; b < P; b++) variance += grad[a] * covariance[a * P + b] * grad[b];
    const se = Math.sqrt(variance);
    const sorted = kr[k].sort((x, y) => x - y);
    out.push({
      name: layout.coefficients[k].name,
      estimate: wtp,
      se,
      deltaLower: wtp - z * se,
      deltaUpper: wtp + z * se,
      lower: quantile(sorted, (1 - level) / 2),
      upper: quantile(sorted, (1 + level) / 2),
    });
  }
  return out;
}

function krinskyRobb(
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
  covariance: Float64Array,
  c: number,
  draws: number,
  seed: number,
): Float64Array[] {
  const { P, K } = layout;
  const L = new Float64Array(P * P);
  const out = Array.from({ length: K }, () => new Float64Array(draws));
  // Without a positive-definite covariance there is no sampling distribution: intervals NaN.
  if (!choleskyDecompose(covariance, P, L)) return out.map((a) => a.fill(NaN));
  const prng = createPrng(seed, 0x6b72);
  const e = new Float64Array(P);
  const x = new Float64Array(P);
  for (let d = 0; d < draws; d++) {
    drawMultivariateNormal(theta, L, P, prng, e, x);
    const { means } = getPopulationMeanJacobian(layout, x);
    for (let k = 0; k < K; k++) out[k][d] = -means[k] / means[c];
  }
  return out;
}
