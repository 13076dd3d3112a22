/**
 * Identification guards for logit models: a column whose difference to the chosen
 * alternative is zero in every task has no information (common practice, no source), and
 * collinear columns are found on the correlation-form information.
 */
import { analyseInformation, describeDirection } from '../linalg/analyse-information';
import type { ChoiceData } from './choice-data';
import { NonIdentifiedError } from './estimation-errors';
import { evaluateMnl } from './mnl-likelihood';

/** Throws NonIdentifiedError naming every column that never varies within any task. */
export function assertColumnsVary(
  data: ChoiceData,
  columnIndexes: readonly number[],
  names: readonly string[],
): void {
  const K = data.columns.length;
  const rows = data.diffs.length / K;
  const constant = columnIndexes.filter((col) => {
    for (let row = 0; row < rows; row++) if (data.diffs[row * K + col] !== 0) return false;
    return true;
  });
  if (constant.length > 0) {
    const list = constant.map((c) => names[columnIndexes.indexOf(c)]);
    throw new NonIdentifiedError(
      `not identified: ${list.join(', ')} never varies within any task, so its coefficient cannot be estimated`,
      list,
    );
  }
}

/**
 * Collinearity test on the MNL information at β = 0 (all alternatives equally likely: the
 * design's own information, Huber & Zwerina 1996) in correlation form, so it does not depend on
 * the units of the columns (see analyse-information.ts). Throws NonIdentifiedError naming the
 * columns of every (near-)exact linear dependence.
 */
export function assertNotCollinear(data: ChoiceData, names: readonly string[]): void {
  const K = data.columns.length;
  const grad = new Float64Array(K);
  const hess = new Float64Array(K * K);
  evaluateMnl(data, new Float64Array(K), grad, hess);
  const analysis = analyseInformation(
    hess.map((v) => -v),
    K,
  );
  if (analysis.positiveDefinite) return;
  const involved = [
    ...new Set(analysis.weak.flatMap((w) => w.loadings.map((l) => names[l.index]))),
  ];
  throw new NonIdentifiedError(
    `not identified: the columns ${involved.join(', ')} are collinear (linear dependence ${analysis.weak.map((w) => describeDirection(w, names)).join('; ')} ≈ 0 in every task, condition number of the correlation-form information above 1e10), so their coefficients cannot be told apart`,
    involved,
  );
}

/**
 * Tasks predicted with near certainty at β: some |β·d_j| > `limit` (beyond ~35 the fitted
 * probabilities are 0 or 1 to double precision). Returns their indexes.
 */
export function getExtremeTasks(data: ChoiceData, beta: ArrayLike<number>, limit = 30): number[] {
  const K = data.columns.length;
  const out: number[] = [];
  for (let t = 0; t + 1 < data.diffStart.length; t++) {
    for (let row = data.diffStart[t]; row < data.diffStart[t + 1]; row++) {
      let v = 0;
      for (let k = 0; k < K; k++) v += beta[k] * data.diffs[row * K + k];
      if (Math.abs(v) > limit) {
        out.push(t);
        break;
      }
    }
  }
  return out;
}
