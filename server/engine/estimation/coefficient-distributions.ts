/**
 * The population distribution of each coefficient at θ, as a small object with its CDF, mean,
 * median, E[1/β] and whether it can cross zero. Formulas: normal; lognormal (Johnson, Kotz &
 * Balakrishnan 1994, Continuous Univariate Distributions 1, ch. 14: mean e^{b+s²/2}, median
 * e^b, E[1/β] = e^{−b+s²/2}); uniform and symmetric triangular on [b−w, b+w] (Evans, Hastings
 * & Peacock 2000, Statistical Distributions, ch. 40 and 41). Correlated normals have
 * SD √(Σ_l L_il²) (Train 2009 §6.3). The standard normal CDF is 1 − ½erfc(x/√2) with the
 * Chebyshev erfc of Press et al. (1992, Numerical Recipes in C, 2nd ed., §6.2 "erfcc",
 * fractional error < 1.2e-7; coefficients from memory).
 */
import {
  DIST_FIXED,
  DIST_LOGNORMAL,
  DIST_NEG_LOGNORMAL,
  DIST_NORMAL,
  DIST_TRIANGULAR,
  DIST_UNIFORM,
  type MixedLogitLayout,
} from './mixed-logit-layout';

export interface CoefficientDistributionAt {
  code: number;
  /** Location b; for lognormals the mean of ln |β|. */
  b: number;
  /** SD (normal, lognormal of ln|β|) or half-width (triangular, uniform); ≥ 0. */
  s: number;
}

function erfc(x: number): number {
  const z = Math.abs(x);
  const t = 1 / (1 + 0.5 * z);
  const r =
    t *
    Math.exp(
      -z * z -
        1.26551223 +
        t *
          (1.00002368 +
            t *
              (0.37409196 +
                t *
                  (0.09678418 +
                    t *
                      (-0.18628806 +
                        t *
                          (0.27886807 +
                            t *
                              (-1.13520398 +
                                t * (1.48851587 + t * (-0.82215223 + t * 0.17087277)))))))),
    );
  return x >= 0 ? r : 2 - r;
}

export function normalCdf(x: number): number {
  return 0.5 * erfc(-x / Math.SQRT2);
}

/** The distribution of coefficient k (its raw draws in WTP space) at θ. */
export function getCoefficientDistribution(
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
  k: number,
): CoefficientDistributionAt {
  const code = layout.dist[k];
  const b = theta[layout.meanIndex[k]];
  let s = layout.spreadIndex[k] >= 0 ? Math.abs(theta[layout.spreadIndex[k]]) : 0;
  const i = Array.prototype.indexOf.call(layout.block, k) as number;
  if (i >= 0) {
    const B = layout.block.length;
    let v = 0;
    for (let l = 0; l <= i; l++) v += theta[layout.cholIndex[i * B + l]] ** 2;
    s = Math.sqrt(v);
  }
  return { code, b, s };
}

export function cdf(d: CoefficientDistributionAt, x: number): number {
  switch (d.code) {
    case DIST_NORMAL:
      return d.s > 0 ? normalCdf((x - d.b) / d.s) : x >= d.b ? 1 : 0;
    case DIST_LOGNORMAL:
      return x <= 0
        ? 0
        : d.s > 0
          ? normalCdf((Math.log(x) - d.b) / d.s)
          : x >= Math.exp(d.b)
            ? 1
            : 0;
    case DIST_NEG_LOGNORMAL:
      return x >= 0
        ? 1
        : d.s > 0
          ? 1 - normalCdf((Math.log(-x) - d.b) / d.s)
          : x >= -Math.exp(d.b)
            ? 1
            : 0;
    case DIST_UNIFORM:
      return d.s > 0 ? Math.min(1, Math.max(0, (x - d.b + d.s) / (2 * d.s))) : x >= d.b ? 1 : 0;
    case DIST_TRIANGULAR: {
      if (!(d.s > 0)) return x >= d.b ? 1 : 0;
      const u = (x - d.b) / d.s;
      if (u <= -1) return 0;
      if (u >= 1) return 1;
      return u <= 0 ? (u + 1) ** 2 / 2 : 1 - (1 - u) ** 2 / 2;
    }
    default:
      return x >= d.b ? 1 : 0;
  }
}

const sign = (d: CoefficientDistributionAt) => (d.code === DIST_NEG_LOGNORMAL ? -1 : 1);

export function mean(d: CoefficientDistributionAt): number {
  if (d.code === DIST_LOGNORMAL || d.code === DIST_NEG_LOGNORMAL)
    return sign(d) * Math.exp(d.b + (d.s * d.s) / 2);
  return d.b;
}

export function median(d: CoefficientDistributionAt): number {
  if (d.code === DIST_LOGNORMAL || d.code === DIST_NEG_LOGNORMAL) return sign(d) * Math.exp(d.b);
  return d.b;
}

export function sd(d: CoefficientDistributionAt): number {
  switch (d.code) {
    case DIST_LOGNORMAL:
    case DIST_NEG_LOGNORMAL:
      return Math.exp(d.b + (d.s * d.s) / 2) * Math.sqrt(Math.expm1(d.s * d.s));
    case DIST_TRIANGULAR:
      return d.s / Math.sqrt(6);
    case DIST_UNIFORM:
      return d.s / Math.sqrt(3);
    case DIST_FIXED:
      return 0;
    default:
      return d.s;
  }
}

/** True when some of the population has β ≤ 0 and some β ≥ 0 (or β = 0 for everyone). */
export function canCrossZero(d: CoefficientDistributionAt): boolean {
  if (d.code === DIST_LOGNORMAL || d.code === DIST_NEG_LOGNORMAL) return false;
  if (d.code === DIST_NORMAL) return d.s > 0 || d.b === 0;
  return Math.abs(d.b) <= d.s;
}

/** Share of the population whose coefficient has the sign opposite to its mean. */
export function wrongSignShare(d: CoefficientDistributionAt): number {
  if (d.code === DIST_NORMAL) return d.s > 0 ? normalCdf(-Math.abs(d.b) / d.s) : 0;
  if (d.code === DIST_UNIFORM || d.code === DIST_TRIANGULAR) {
    const m = Math.abs(d.b);
    if (!(d.s > m)) return 0;
    return d.code === DIST_UNIFORM ? (d.s - m) / (2 * d.s) : (d.s - m) ** 2 / (2 * d.s * d.s);
  }
  return 0;
}

/**
 * E[1/β] for a distribution that does not cross zero: fixed 1/b; lognormal ±e^{−b+s²/2};
 * uniform ln(hi/lo)/(hi−lo); triangular by composite Simpson on its two linear pieces.
 */
export function meanReciprocal(d: CoefficientDistributionAt): number {
  switch (d.code) {
    case DIST_LOGNORMAL:
    case DIST_NEG_LOGNORMAL:
      return sign(d) * Math.exp(-d.b + (d.s * d.s) / 2);
    case DIST_UNIFORM:
      return d.s > 0 ? Math.log((d.b + d.s) / (d.b - d.s)) / (2 * d.s) : 1 / d.b;
    case DIST_TRIANGULAR: {
      if (!(d.s > 0)) return 1 / d.b;
      const n = 400;
      const lo = d.b - d.s;
      const h = (2 * d.s) / n;
      let sum = 0;
      for (let i = 0; i <= n; i++) {
        const x = lo + i * h;
        const density = (d.s - Math.abs(x - d.b)) / (d.s * d.s);
        sum += (i === 0 || i === n ? 1 : i % 2 ? 4 : 2) * (density / x);
      }
      return (sum * h) / 3;
    }
    default:
      return 1 / d.b;
  }
}
