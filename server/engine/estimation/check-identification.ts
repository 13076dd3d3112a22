/**
 * Identification guards for logit models: a column whose difference to the chosen
 * alternative is zero in every task has no information (common practice, no source).
 */
import type { ChoiceData } from './choice-data';
import { NonIdentifiedError } from './estimation-errors';

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

/** Largest |β·d_j| over all tasks: beyond ~35 the fitted probabilities are 0 or 1 to double precision. */
export function getMaxAbsUtilityDifference(data: ChoiceData, beta: Float64Array): number {
  const K = data.columns.length;
  const rows = data.diffs.length / K;
  let max = 0;
  for (let row = 0; row < rows; row++) {
    let v = 0;
    for (let k = 0; k < K; k++) v += beta[k] * data.diffs[row * K + k];
    max = Math.max(max, Math.abs(v));
  }
  return max;
}
