/**
 * Design criteria computed from the MNL information matrix I(X, β) and its inverse, the
 * asymptotic variance–covariance matrix Ω = I⁻¹ of one respondent answering the design once
 * (McFadden 1974; Huber & Zwerina 1996):
 * - D-error det(I)^(−1/K) (Huber & Zwerina 1996, JMR 33(3):307-317);
 * - A-error tr(Ω)/K (Rose & Bliemer 2009, Transport Reviews 29(5):587-617, from memory);
 * - S-estimate max_k t²·Ω_kk/β_k² over coefficients with a non-zero prior mean: the design
 *   replications at which every such coefficient reaches |t| = t (Rose & Bliemer 2013,
 *   "Sample size requirements for stated choice experiments", Transportation 40:1021-1041);
 * - C-error Σ_k Var(w_k), w_k = −β_k/β_cost over the non-cost attribute columns, each
 *   variance by the delta method (`scoreCError`; Scarpa & Rose 2008, "Design efficiency for
 *   non-market valuation with choice modelling", Australian J. of Agricultural and Resource
 *   Economics 52(3):253-282).
 * Bayesian versions average the criterion over prior draws, as the Bayesian D-error does
 * (Sándor & Wedel 2001). A singular I gives Infinity. docs/methods.md, "Design criteria".
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import type { DesignCriterion } from '../../../shared/schemas/design-spec';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import { getSpdLogDet } from '../linalg/cholesky';
import { getDErrorFromLogDet } from './d-error';
import { averageOverDraws } from './mnl-information';
import { invertSpd } from './spd-inverse';

export interface CriterionSetup {
  criterion: DesignCriterion;
  K: number;
  /** Target t-ratio of the S-estimate. */
  tValue: number;
  /** Columns the S-estimate covers (non-zero prior mean). */
  sColumns: number[];
  /** Cost column (linear cost attribute) or −1; the C-error's denominator. */
  costColumn: number;
  /** Non-cost attribute columns whose WTP the C-error sums. */
  wtpColumns: number[];
}

/** Why a criterion cannot be computed for this study and these priors, or null when it can. */
export function getCriterionUnavailableReason(
  setup: CriterionSetup,
  criterion: DesignCriterion,
  priorMeans: Float64Array,
): string | null {
  if (criterion === 's_estimate' && setup.sColumns.length === 0)
    return 'The S-estimate needs a prior with a non-zero mean for at least one coefficient.';
  if (criterion === 'c_error') {
    if (setup.costColumn < 0)
      return 'The C-error needs a cost attribute with linear coding (Attributes).';
    if (priorMeans[setup.costColumn] === 0)
      return 'The C-error needs a non-zero prior mean for the cost coefficient.';
    if (setup.wtpColumns.length === 0)
      return 'The C-error needs at least one attribute besides the cost.';
  }
  return null;
}

/** Resolves the columns each criterion reads from the coding plan and the prior means. */
export function buildCriterionSetup(
  plan: CodingPlan,
  definition: StudyDefinition,
  criterion: DesignCriterion,
  priorMeans: Float64Array,
  tValue: number,
): CriterionSetup {
  const cost = definition.attributes.find((a) => a.isCost && a.coding === 'linear');
  const costColumn = cost ? plan.columns.findIndex((c) => c.key === `attr:${cost.id}`) : -1;
  const sColumns: number[] = [];
  const wtpColumns: number[] = [];
  plan.columns.forEach((column, k) => {
    if (priorMeans[k] !== 0) sColumns.push(k);
    if (column.kind !== 'constant' && k !== costColumn) wtpColumns.push(k);
  });
  return { criterion, K: plan.columnCount, tValue, sColumns, costColumn, wtpColumns };
}

/**
 * Scores information matrices under one criterion. `score` reads the LOWER triangle of the
 * K × K matrix at `offset` (left unchanged) and the draw's coefficients at `betaOffset`.
 */
export interface CriterionScorer {
  score(info: Float64Array, offset: number, beta: Float64Array, betaOffset: number): number;
}

function scoreSEstimate(s: CriterionSetup, cov: Float64Array, beta: Float64Array, o: number) {
  let max = 0;
  for (const k of s.sColumns) {
    const b = beta[o + k];
    if (b === 0) return Infinity;
    max = Math.max(max, (s.tValue * s.tValue * cov[k * s.K + k]) / (b * b));
  }
  return max;
}

/**
 * Σ_k Var(w_k) with w_k = −β_k/β_c and gradient g = (−1/β_c, β_k/β_c²) on (β_k, β_c):
 * Var(w_k) = Ω_kk/β_c² − 2β_k·Ω_kc/β_c³ + β_k²·Ω_cc/β_c⁴ (delta method).
 */
function scoreCError(s: CriterionSetup, cov: Float64Array, beta: Float64Array, o: number) {
  const K = s.K;
  const c = s.costColumn;
  const bc = beta[o + c];
  if (bc === 0) return Infinity;
  let sum = 0;
  for (const k of s.wtpColumns) {
    const bk = beta[o + k];
    const gk = -1 / bc;
    const gc = bk / (bc * bc);
    sum += gk * gk * cov[k * K + k] + 2 * gk * gc * cov[k * K + c] + gc * gc * cov[c * K + c];
  }
  return sum;
}

/** Creates a scorer with its own work buffers (none allocated per call). */
export function createCriterionScorer(setup: CriterionSetup): CriterionScorer {
  const K = setup.K;
  const work = new Float64Array(K * K);
  const cov = new Float64Array(K * K);
  return {
    score(info, offset, beta, betaOffset) {
      if (setup.criterion === 'd_error')
        return getDErrorFromLogDet(K, getSpdLogDet(info, K, work, offset));
      if (invertSpd(K, info, offset, cov, 0, work) === -Infinity) return Infinity;
      if (setup.criterion === 'a_error') {
        let trace = 0;
        for (let k = 0; k < K; k++) trace += cov[k * K + k];
        return trace / K;
      }
      if (setup.criterion === 's_estimate') return scoreSEstimate(setup, cov, beta, betaOffset);
      return scoreCError(setup, cov, beta, betaOffset);
    },
  };
}

/**
 * The criterion of the S·J × K design matrix `x` averaged over R coefficient draws
 * (row-major R × K); R = 1 is the point-prior value.
 */
export function computeDesignCriterion(
  setup: CriterionSetup,
  S: number,
  J: number,
  x: Float64Array,
  draws: Float64Array,
  R: number,
): number {
  const scorer = createCriterionScorer(setup);
  return averageOverDraws({ K: setup.K, S, J, x }, draws, R, (info, drawOffset) =>
    scorer.score(info, 0, draws, drawOffset),
  );
}

/**
 * The setup of the D-error, which reads no column lists or t-value: with computeDesignCriterion
 * it gives the D-error averaged over R coefficient vectors (R = 1: the point-prior D-error).
 */
export function getDErrorSetup(K: number): CriterionSetup {
  return { criterion: 'd_error', K, tValue: 0, sColumns: [], costColumn: -1, wtpColumns: [] };
}

/** Point-prior D-error det(I(X, β))^(−1/K) (β = zeros gives D₀). */
export function computeDError(
  K: number,
  S: number,
  J: number,
  x: Float64Array,
  beta: Float64Array,
): number {
  return computeDesignCriterion(getDErrorSetup(K), S, J, x, beta, 1);
}
