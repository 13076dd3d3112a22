/**
 * Population willingness to pay for each non-cost coefficient k, WTP = −β_k/β_cost, as the
 * MEAN and the MEDIAN of its distribution over the population (not the ratio of mean
 * coefficients, which differs from the mean WTP by e^{s²} under a lognormal cost):
 *  - mean: −E[β_k]·E[1/β_cost] (β_k and β_cost are independent: only normals are correlated,
 *    and a normal cost is withheld); E[1/β] in closed form (coefficient-distributions.ts);
 *  - median: −median(β_k)/β_cost for a fixed cost, −β_k/median(β_cost) for a fixed β_k, and
 *    otherwise the root m of P(WTP ≤ m) = E_cost[F_k(m·|β_cost|)] = ½ (negative cost; the
 *    mirror image for a positive one), the expectation by Gauss-Hermite quadrature for a
 *    lognormal cost and Simpson's rule for a bounded one, the root by bisection;
 *  - in WTP space (Train & Weeks 2005) the WTPs are the model's own coefficients: their mean
 *    and median directly.
 * When the cost coefficient can be zero or change sign in the population (normal, or a
 * triangular/uniform wider than its centre), E[1/β_cost] does not exist: WTP is withheld with
 * the reason (Daly, Hess & Train 2012, Transportation 39:19-31).
 * Intervals by propagate-uncertainty.ts (delta method and Krinsky & Robb) from the covariance
 * the run chose.
 */
import { computeGaussHermite } from '../linalg/gauss-hermite';
import {
  canCrossZero,
  cdf,
  getCoefficientDistribution,
  mean,
  meanReciprocal,
  median,
  type CoefficientDistributionAt,
} from './coefficient-distributions';
import {
  DIST_FIXED,
  DIST_LOGNORMAL,
  DIST_NEG_LOGNORMAL,
  type MixedLogitLayout,
} from './mixed-logit-layout';
import { propagateUncertainty, type PropagatedEstimate } from './propagate-uncertainty';

export interface PopulationWtp {
  name: string;
  mean: PropagatedEstimate;
  median: PropagatedEstimate;
}

const HERMITE = computeGaussHermite(40);

function costNodes(c: CoefficientDistributionAt): { values: Float64Array; weights: Float64Array } {
  if (c.code === DIST_LOGNORMAL || c.code === DIST_NEG_LOGNORMAL) {
    const sign = c.code === DIST_LOGNORMAL ? 1 : -1;
    return {
      values: HERMITE.nodes.map((x) => sign * Math.exp(c.b + c.s * Math.SQRT2 * x)),
      weights: HERMITE.weights.map((w) => w / Math.sqrt(Math.PI)),
    };
  }
  if (c.code === DIST_FIXED || !(c.s > 0))
    return { values: Float64Array.of(c.b), weights: Float64Array.of(1) };
  const n = 200;
  const h = (2 * c.s) / n;
  const values = new Float64Array(n + 1);
  const weights = new Float64Array(n + 1);
  for (let i = 0; i <= n; i++) {
    const x = c.b - c.s + i * h;
    values[i] = x;
    const density = c.code === 5 ? 1 / (2 * c.s) : (c.s - Math.abs(x - c.b)) / (c.s * c.s);
    weights[i] = ((i === 0 || i === n ? 1 : i % 2 ? 4 : 2) * h * density) / 3;
  }
  return { values, weights };
}

function wtpCdf(k: CoefficientDistributionAt, nodes: ReturnType<typeof costNodes>, m: number) {
  let p = 0;
  for (let i = 0; i < nodes.values.length; i++) {
    const c = nodes.values[i];
    p += nodes.weights[i] * (c < 0 ? cdf(k, -m * c) : 1 - cdf(k, -m * c));
  }
  return p;
}

function medianWtp(k: CoefficientDistributionAt, c: CoefficientDistributionAt): number {
  if (k.code === DIST_FIXED || !(k.s > 0)) return -median(k) / median(c);
  if (c.code === DIST_FIXED || !(c.s > 0)) return -median(k) / c.b;
  const nodes = costNodes(c);
  const guess = Math.abs(median(k) / median(c)) + Math.abs(k.s / median(c)) + 1e-300;
  let lo = -guess;
  let hi = guess;
  for (let i = 0; i < 200 && wtpCdf(k, nodes, lo) > 0.5; i++) lo *= 2;
  for (let i = 0; i < 200 && wtpCdf(k, nodes, hi) < 0.5; i++) hi *= 2;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (wtpCdf(k, nodes, mid) < 0.5) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Why WTP cannot be given for this layout at θ, or null when it can. */
export function getWtpWithheldReason(
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
  cost: number,
): string | null {
  if (layout.wtpCost >= 0) return null;
  const c = getCoefficientDistribution(layout, theta, cost);
  if (!canCrossZero(c)) return null;
  const name = layout.coefficients[cost].name;
  if (c.code === DIST_FIXED)
    return `The cost coefficient ${name} is estimated at zero, so WTP is not defined.`;
  return `The cost coefficient ${name} has a ${['fixed', 'normal', 'lognormal', 'negative lognormal', 'triangular', 'uniform'][c.code]} distribution that reaches zero and changes sign in the population, so the mean WTP does not exist and individual WTP is meaningless (a division by values near zero). Use a lognormal (or fixed) cost, or estimate in WTP space.`;
}

/** Mean and median WTP of each non-cost coefficient at θ (a flat vector: means, then medians). */
function wtpVector(layout: MixedLogitLayout, theta: ArrayLike<number>, cost: number): Float64Array {
  const ks = [...Array(layout.K).keys()].filter((k) => k !== cost);
  const out = new Float64Array(2 * ks.length);
  const c = getCoefficientDistribution(layout, theta, cost);
  ks.forEach((k, i) => {
    const d = getCoefficientDistribution(layout, theta, k);
    if (layout.wtpCost >= 0) {
      out[i] = mean(d);
      out[ks.length + i] = median(d);
    } else {
      out[i] = -mean(d) * meanReciprocal(c);
      out[ks.length + i] = medianWtp(d, c);
    }
  });
  return out;
}

export function computePopulationWtp(
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
  covariance: Float64Array | null,
  cost: number,
  options: { seed?: number; draws?: number } = {},
): PopulationWtp[] {
  const ks = [...Array(layout.K).keys()].filter((k) => k !== cost);
  const estimates = propagateUncertainty((x) => wtpVector(layout, x, cost), theta, covariance, {
    seed: options.seed,
    draws: options.draws ?? 2000,
  });
  return ks.map((k, i) => ({
    name: layout.coefficients[k].name,
    mean: estimates[i],
    median: estimates[ks.length + i],
  }));
}
