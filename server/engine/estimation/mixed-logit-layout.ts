/**
 * Parameter layout of a panel mixed logit (Train 2009 §6.2, ch. 10): each coefficient is
 * fixed or random with a location parameter b and a spread s:
 *   normal        β = b + s·η,            η ~ N(0, 1)
 *   lognormal     β = exp(b + s·η)        (b, s: mean and SD of ln β)
 *   neg_lognormal β = −exp(b + s·η)       (for a cost coefficient)
 *   triangular    β = b + s·t,            t triangular on [−1, 1] (SD = |s|/√6)
 *   uniform       β = b + s·u,            u uniform on [−1, 1]    (SD = |s|/√3)
 * With `correlated`, the normal coefficients share β = b + L·η with L lower-triangular
 * (Cholesky factor of their covariance, Train 2009 §6.3); its elements are parameters.
 * θ = [locations of all K coefficients, spreads of the uncorrelated random ones, L row-wise].
 * The sign of a spread is not identified (the distribution depends on |s|); estimates are
 * reported as found and population SDs use |s|.
 *
 * WTP space (Train & Weeks 2005, "Discrete choice models in preference space and
 * willingness-to-pay space", in Scarpa & Alberini (eds.), Applications of Simulation Methods in
 * Environmental and Resource Economics, ch. 1): with `wtpCost` set, every non-cost coefficient's
 * draw is a willingness to pay w_k and enters utility as β_k = −β_cost·w_k; the cost keeps its
 * own distribution (fixed or lognormal, so its sign never changes).
 */
import type { ChoiceData } from './choice-data';
import {
  DIST_FIXED,
  DIST_LOGNORMAL,
  DIST_NEG_LOGNORMAL,
  DIST_NORMAL,
  DIST_TRIANGULAR,
  DIST_UNIFORM,
} from './distribution-codes';
import { EstimationOptionsError } from './estimation-errors';
import { resolveCoefficientColumn } from './shared-option-checks';
import { COEFFICIENT_DISTRIBUTIONS } from '../../../shared/schemas/estimation-spec';

/** Index of a name in this list = its DIST_* code. */
export const DISTRIBUTIONS = COEFFICIENT_DISTRIBUTIONS;
export type CoefficientDistribution = (typeof DISTRIBUTIONS)[number];

export * from './distribution-codes';

export interface CoefficientSpec {
  /** Name used in results (e.g. "bill"). */
  name: string;
  /** Data column holding the attribute (defaults to the name). */
  column?: string;
  distribution: CoefficientDistribution;
}

export interface MixedLogitLayout {
  coefficients: readonly CoefficientSpec[];
  /** Number of coefficients K. */
  K: number;
  /** Data column index of each coefficient. */
  column: Int32Array;
  /** Distribution code (DIST_*) of each coefficient. */
  dist: Int8Array;
  /** Draw dimension of each random coefficient, −1 if fixed. */
  dimension: Int32Array;
  /** Number of random dimensions D. */
  D: number;
  meanIndex: Int32Array;
  /** θ index of the spread, −1 for fixed coefficients and members of the correlated block. */
  spreadIndex: Int32Array;
  correlated: boolean;
  /** Coefficient indexes of the correlated normal block, in coefficient order. */
  block: Int32Array;
  /** blockSize×blockSize θ indexes of L (−1 above the diagonal). */
  cholIndex: Int32Array;
  /** Number of parameters P. */
  P: number;
  /** Parameter names: "x" (fixed), "x.mean"/"x.sd" (normal, lognormal), "x.mean"/"x.spread" (triangular, uniform), "chol.a.b". */
  names: string[];
  /** WTP space: coefficient index of the cost; −1 in preference space. */
  wtpCost: number;
}

/** Builds the layout; throws EstimationOptionsError for unknown columns, names or distributions. */
export function createMixedLogitLayout(
  data: Pick<ChoiceData, 'columns'>,
  coefficients: readonly CoefficientSpec[],
  correlated: boolean,
  wtpCost: string | null = null,
): MixedLogitLayout {
  const K = coefficients.length;
  if (K === 0)
    throw new EstimationOptionsError('at least one coefficient is required', 'coefficients');
  const column = new Int32Array(K);
  const dist = new Int8Array(K);
  coefficients.forEach((c, k) => {
    if (!c.name)
      throw new EstimationOptionsError(
        `coefficients[${k}].name is required`,
        `coefficients.${k}.name`,
      );
    column[k] = resolveCoefficientColumn(data, coefficients, k);
    const code = DISTRIBUTIONS.indexOf(c.distribution);
    if (code < 0)
      throw new EstimationOptionsError(
        `unknown distribution ${String(c.distribution)}`,
        `coefficients.${k}.distribution`,
      );
    dist[k] = code;
  });
  const block = correlated ? [...dist.keys()].filter((k) => dist[k] === DIST_NORMAL) : [];
  if (correlated && block.length < 2) {
    throw new EstimationOptionsError(
      'correlated needs at least two normal coefficients',
      'correlated',
    );
  }
  const names = coefficients.map((c) =>
    dist[coefficients.indexOf(c)] === DIST_FIXED ? c.name : `${c.name}.mean`,
  );
  const dimension = new Int32Array(K).fill(-1);
  const spreadIndex = new Int32Array(K).fill(-1);
  let D = 0;
  for (let k = 0; k < K; k++) {
    if (dist[k] === DIST_FIXED) continue;
    dimension[k] = D++;
    if (block.includes(k)) continue;
    spreadIndex[k] = names.length;
    names.push(
      `${coefficients[k].name}.${dist[k] === DIST_TRIANGULAR || dist[k] === DIST_UNIFORM ? 'spread' : 'sd'}`,
    );
  }
  const cost = wtpCost === null ? -1 : coefficients.findIndex((c) => c.name === wtpCost);
  if (wtpCost !== null) {
    if (cost < 0)
      throw new EstimationOptionsError(`cost coefficient ${wtpCost} is not in the model`, 'cost');
    if (
      dist[cost] !== DIST_FIXED &&
      dist[cost] !== DIST_LOGNORMAL &&
      dist[cost] !== DIST_NEG_LOGNORMAL
    )
      throw new EstimationOptionsError(
        'in WTP space the cost coefficient must be fixed or lognormal, so its sign never changes',
        'cost',
      );
    if (K < 2)
      throw new EstimationOptionsError('WTP space needs a coefficient besides the cost', 'space');
  }
  const B = block.length;
  const cholIndex = new Int32Array(B * B).fill(-1);
  for (let i = 0; i < B; i++) {
    for (let j = 0; j <= i; j++) {
      cholIndex[i * B + j] = names.length;
      names.push(`chol.${coefficients[block[i]].name}.${coefficients[block[j]].name}`);
    }
  }
  return {
    coefficients,
    K,
    column,
    dist,
    dimension,
    D,
    meanIndex: Int32Array.from({ length: K }, (_, k) => k),
    spreadIndex,
    correlated: B > 0,
    block: Int32Array.from(block),
    cholIndex,
    P: names.length,
    names,
    wtpCost: cost,
  };
}
