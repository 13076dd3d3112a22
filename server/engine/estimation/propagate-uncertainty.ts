/**
 * Standard errors and intervals of functions of the estimates, g(θ̂), by two methods:
 *  - delta method: Var g = J Σ J′ with J by central differences, step 1e-4·SE_p (Greene 2018,
 *    Econometric Analysis, 8th ed., §4.6); interval ĝ ± z·se;
 *  - simulation (Krinsky & Robb 1986, REStat 68:715-719): g at seeded draws θ ~ N(θ̂, Σ), the
 *    SD of the draws and their percentile interval (Hyndman & Fan 1996 type 7 quantiles).
 * Σ is whichever covariance the run chose (classical or robust). Where Σ is unknown for a
 * parameter g depends on, the delta result is null; the simulation needs Σ positive definite.
 */
import { inverseNormal } from '../draws/inverse-normal';
import { drawMultivariateNormal } from '../../../shared/engine/random/multivariate-normal';
import { createPrng } from '../draws/prng';
import { choleskyDecompose } from '../linalg/cholesky';
import { quantile } from '../../../shared/engine/stats/quantile';
import { finiteOrNull } from './finite-or-null';

export interface PropagatedEstimate {
  estimate: number;
  se: number | null;
  deltaLower: number | null;
  deltaUpper: number | null;
  simulatedSe: number | null;
  lower: number | null;
  upper: number | null;
}

export interface PropagateOptions {
  draws?: number;
  seed?: number;
  level?: number;
}

export { quantile };

export function propagateUncertainty(
  fn: (theta: Float64Array) => Float64Array,
  theta: ArrayLike<number>,
  covariance: Float64Array | null,
  options: PropagateOptions = {},
): PropagatedEstimate[] {
  const P = theta.length;
  const base = Float64Array.from(theta);
  const values = fn(base);
  const M = values.length;
  const level = options.level ?? 0.95;
  const z = inverseNormal(0.5 + level / 2);
  const se = new Float64Array(M).fill(NaN);
  if (covariance) {
    const jacobian = new Float64Array(M * P);
    const x = Float64Array.from(base);
    for (let p = 0; p < P; p++) {
      const v = covariance[p * P + p];
      const h =
        1e-4 * (v > 0 && Number.isFinite(v) ? Math.sqrt(v) : Math.max(Math.abs(base[p]), 1) * 1e-2);
      x[p] = base[p] + h;
      const up = fn(x);
      x[p] = base[p] - h;
      const down = fn(x);
      x[p] = base[p];
      for (let m = 0; m < M; m++) jacobian[m * P + p] = (up[m] - down[m]) / (2 * h);
    }
    for (let m = 0; m < M; m++) {
      let variance = 0;
      for (let a = 0; a < P; a++) {
        const ja = jacobian[m * P + a];
        if (ja === 0) continue;
        for (let b = 0; b < P; b++) {
          const jb = jacobian[m * P + b];
          if (jb !== 0) variance += ja * covariance[a * P + b] * jb;
        }
      }
      se[m] = variance >= 0 ? Math.sqrt(variance) : NaN;
    }
  }
  const simulated = simulate(fn, base, covariance, M, options);
  return Array.from(values, (estimate, m) => ({
    estimate,
    se: finiteOrNull(se[m]),
    deltaLower: finiteOrNull(estimate - z * se[m]),
    deltaUpper: finiteOrNull(estimate + z * se[m]),
    simulatedSe: simulated ? finiteOrNull(simulated.sd[m]) : null,
    lower: simulated ? finiteOrNull(quantile(simulated.sorted[m], (1 - level) / 2)) : null,
    upper: simulated ? finiteOrNull(quantile(simulated.sorted[m], (1 + level) / 2)) : null,
  }));
}

function simulate(
  fn: (theta: Float64Array) => Float64Array,
  theta: Float64Array,
  covariance: Float64Array | null,
  M: number,
  options: PropagateOptions,
): { sd: Float64Array; sorted: Float64Array[] } | null {
  const P = theta.length;
  const L = new Float64Array(P * P);
  if (!covariance || !covariance.every(Number.isFinite)) return null;
  if (!choleskyDecompose(covariance, P, L)) return null;
  const draws = options.draws ?? 2000;
  const prng = createPrng(options.seed ?? 1, 0x6b72);
  const e = new Float64Array(P);
  const x = new Float64Array(P);
  const out = Array.from({ length: M }, () => new Float64Array(draws));
  for (let d = 0; d < draws; d++) {
    drawMultivariateNormal(theta, L, P, prng, e, x);
    const g = fn(x);
    for (let m = 0; m < M; m++) out[m][d] = g[m];
  }
  const sd = new Float64Array(M);
  for (let m = 0; m < M; m++) {
    let s1 = 0;
    for (const v of out[m]) s1 += v;
    const mean = s1 / draws;
    let s2 = 0;
    for (const v of out[m]) s2 += (v - mean) ** 2;
    sd[m] = Math.sqrt(s2 / (draws - 1));
    out[m].sort();
  }
  return { sd, sorted: out };
}
