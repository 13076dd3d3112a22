/**
 * Population mean and SD of every coefficient implied by the estimated mixed-logit
 * parameters (for density charts and population WTP):
 *   normal N(b, s²): b, |s|;  lognormal: e^{b+s²/2}, √((e^{s²}−1)·e^{2b+s²})  (Johnson, Kotz &
 *   Balakrishnan 1994, Continuous Univariate Distributions 1, ch. 14), negated for
 *   neg_lognormal;  triangular on [b−s, b+s]: b, |s|/√6;  uniform: b, |s|/√3;  fixed: b, 0;
 *   correlated normals: b_i, √(Σ_l L_il²). Also the Jacobian of the means with respect to θ
 *   for the delta method.
 */
import {
  DIST_FIXED,
  DIST_LOGNORMAL,
  DIST_NEG_LOGNORMAL,
  DIST_TRIANGULAR,
  DIST_UNIFORM,
  DISTRIBUTIONS,
  type CoefficientDistribution,
  type MixedLogitLayout,
} from './mixed-logit-layout';

export interface PopulationMoment {
  name: string;
  distribution: CoefficientDistribution;
  mean: number;
  sd: number;
  /** Location b and spread s as estimated (for lognormals: of ln |β|); spread 0 if fixed. */
  location: number;
  spread: number;
}

/** Mean and SD of each coefficient's population distribution at θ. */
export function getPopulationMoments(
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
): PopulationMoment[] {
  const B = layout.block.length;
  return layout.coefficients.map((c, k) => {
    const code = layout.dist[k];
    const b = theta[layout.meanIndex[k]];
    let s = layout.spreadIndex[k] >= 0 ? theta[layout.spreadIndex[k]] : 0;
    const i = Array.prototype.indexOf.call(layout.block, k) as number;
    if (i >= 0) {
      let v = 0;
      for (let l = 0; l <= i; l++) v += theta[layout.cholIndex[i * B + l]] ** 2;
      s = Math.sqrt(v);
    }
    let mean = b;
    let sd = Math.abs(s);
    if (code === DIST_LOGNORMAL || code === DIST_NEG_LOGNORMAL) {
      const m = Math.exp(b + (s * s) / 2);
      mean = code === DIST_LOGNORMAL ? m : -m;
      sd = Math.sqrt(Math.expm1(s * s)) * m;
    } else if (code === DIST_TRIANGULAR) sd = Math.abs(s) / Math.sqrt(6);
    else if (code === DIST_UNIFORM) sd = Math.abs(s) / Math.sqrt(3);
    else if (code === DIST_FIXED) sd = 0;
    return { name: c.name, distribution: DISTRIBUTIONS[code], mean, sd, location: b, spread: s };
  });
}

/** Population means (length K) and their Jacobian ∂mean_k/∂θ_p (K × P, row-major). */
export function getPopulationMeanJacobian(
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
): { means: Float64Array; jacobian: Float64Array } {
  const { K, P } = layout;
  const means = new Float64Array(K);
  const jacobian = new Float64Array(K * P);
  for (let k = 0; k < K; k++) {
    const code = layout.dist[k];
    const b = theta[layout.meanIndex[k]];
    if (code === DIST_LOGNORMAL || code === DIST_NEG_LOGNORMAL) {
      const s = theta[layout.spreadIndex[k]];
      const m = (code === DIST_LOGNORMAL ? 1 : -1) * Math.exp(b + (s * s) / 2);
      means[k] = m;
      jacobian[k * P + layout.meanIndex[k]] = m;
      jacobian[k * P + layout.spreadIndex[k]] = s * m;
    } else {
      means[k] = b;
      jacobian[k * P + layout.meanIndex[k]] = 1;
    }
  }
  return { means, jacobian };
}
