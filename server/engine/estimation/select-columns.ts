/** Restricts choice data to some columns (e.g. the coefficients of a model) without copying rows' layout. */
import type { ChoiceData } from './choice-data';

/** Returns a new ChoiceData with only the given columns, in the given order. */
export function selectColumns(data: ChoiceData, columnIndexes: readonly number[]): ChoiceData {
  const K = data.columns.length;
  const rows = data.diffs.length / K;
  const Ks = columnIndexes.length;
  const diffs = new Float64Array(rows * Ks);
  for (let row = 0; row < rows; row++) {
    for (let k = 0; k < Ks; k++) diffs[row * Ks + k] = data.diffs[row * K + columnIndexes[k]];
  }
  return { ...data, columns: columnIndexes.map((c) => data.columns[c]), diffs };
}
