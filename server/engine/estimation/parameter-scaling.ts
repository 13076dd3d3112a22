/**
 * Internal scaling, so that estimation does not depend on the units of the data: every
 * attribute column is divided by the root mean square of its differences to the chosen
 * alternative, and the parameters are mapped to the scaled columns by an affine, diagonal map
 * θ̃ = f·θ + o. Estimation runs on (scaled data, θ̃); results are mapped back, so they are in
 * the user's units. Scaling regressors to comparable magnitudes before optimisation is the
 * advice of Dennis & Schnabel (1983, Numerical Methods for Unconstrained Optimization, §7.1)
 * and Nocedal & Wright (2006, §2.2 "scaling").
 *
 * Per parameter, with c the scale of the coefficient's column:
 *   normal, triangular, uniform location and spread, fixed coefficient: f = c, o = 0;
 *   lognormal location (of ln |β|): f = 1, o = ln c; lognormal spread: f = 1;
 *   Cholesky element L_il: f = c of row i's coefficient.
 * In WTP space a WTP coefficient k is multiplied by c_k / c_cost instead of c_k.
 */
import type { ChoiceData } from './choice-data';
import { DIST_LOGNORMAL, DIST_NEG_LOGNORMAL, type MixedLogitLayout } from './mixed-logit-layout';

export interface ThetaScaling {
  factor: Float64Array;
  offset: Float64Array;
}

/** RMS of each column's differences; 1 for a column that is zero everywhere. */
export function getColumnScales(data: ChoiceData): Float64Array {
  const K = data.columns.length;
  const rows = data.diffs.length / K;
  const sum = new Float64Array(K);
  for (let row = 0; row < rows; row++)
    for (let k = 0; k < K; k++) sum[k] += data.diffs[row * K + k] ** 2;
  return sum.map((s) => (s > 0 && rows > 0 ? Math.sqrt(s / rows) : 1));
}

/** A copy of the data with column k divided by scales[k]. */
export function scaleChoiceData(data: ChoiceData, scales: Float64Array): ChoiceData {
  const K = data.columns.length;
  const diffs = new Float64Array(data.diffs.length);
  for (let i = 0; i < diffs.length; i++) diffs[i] = data.diffs[i] / scales[i % K];
  return { ...data, diffs };
}

/** The map θ → θ̃ of a layout whose coefficient k reads data column layout.column[k]. */
export function createThetaScaling(
  layout: MixedLogitLayout,
  columnScales: Float64Array,
): ThetaScaling {
  const factor = new Float64Array(layout.P).fill(1);
  const offset = new Float64Array(layout.P);
  const costScale = layout.wtpCost >= 0 ? columnScales[layout.column[layout.wtpCost]] : 1;
  const scaleOf = (k: number) =>
    layout.wtpCost >= 0 && k !== layout.wtpCost
      ? columnScales[layout.column[k]] / costScale
      : columnScales[layout.column[k]];
  for (let k = 0; k < layout.K; k++) {
    const c = scaleOf(k);
    const m = layout.meanIndex[k];
    const s = layout.spreadIndex[k];
    if (layout.dist[k] === DIST_LOGNORMAL || layout.dist[k] === DIST_NEG_LOGNORMAL) {
      offset[m] = Math.log(c);
    } else {
      factor[m] = c;
      if (s >= 0) factor[s] = c;
    }
  }
  const B = layout.block.length;
  for (let i = 0; i < B; i++)
    for (let l = 0; l <= i; l++) factor[layout.cholIndex[i * B + l]] = scaleOf(layout.block[i]);
  return { factor, offset };
}

export function toInternal(scaling: ThetaScaling, theta: ArrayLike<number>): Float64Array {
  return Float64Array.from(theta, (v, p) => scaling.factor[p] * v + scaling.offset[p]);
}

export function toUser(scaling: ThetaScaling, internal: ArrayLike<number>): Float64Array {
  return Float64Array.from(internal, (v, p) => (v - scaling.offset[p]) / scaling.factor[p]);
}

/** ∂LL/∂θ = f·∂LL/∂θ̃. */
export function gradientToUser(scaling: ThetaScaling, internal: ArrayLike<number>): Float64Array {
  return Float64Array.from(internal, (g, p) => g * scaling.factor[p]);
}

/** Σ_θ = F⁻¹ Σ_θ̃ F⁻¹ for a P×P covariance (F = diag f). */
export function covarianceToUser(scaling: ThetaScaling, internal: Float64Array): Float64Array {
  const P = scaling.factor.length;
  return internal.map((v, i) => v / (scaling.factor[Math.floor(i / P)] * scaling.factor[i % P]));
}
