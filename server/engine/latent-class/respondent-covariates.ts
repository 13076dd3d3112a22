/**
 * Background variables for the class-membership model from long-format rows: each respondent's
 * value of each covariate column, which must not change between the respondent's rows.
 */
import { ChoiceDataError, type LongChoiceRow } from '../estimation/choice-data';
import type { MembershipCovariates } from './check-latent-class-options';

/**
 * Covariates named `names`, read from row.values[offset + m], with rows of the result in the
 * order of `respondentIds`. Throws ChoiceDataError naming the line where a value changes.
 */
export function extractRespondentCovariates(
  rows: readonly LongChoiceRow[],
  names: readonly string[],
  offset: number,
  respondentIds: readonly string[],
): MembershipCovariates {
  const M = names.length;
  const seen = new Map<string, ArrayLike<number>>();
  rows.forEach((row, i) => {
    const id = String(row.respondent);
    const first = seen.get(id);
    if (!first) {
      seen.set(id, row.values);
      return;
    }
    for (let m = 0; m < M; m++)
      if (row.values[offset + m] !== first[offset + m])
        throw new ChoiceDataError(
          `line ${row.line ?? i + 1}: ${names[m]} changes within respondent ${id}; membership variables describe the respondent`,
          row.line ?? i + 1,
          names[m],
        );
  });
  const values = new Float64Array(respondentIds.length * M);
  respondentIds.forEach((id, n) => {
    const v = seen.get(id);
    if (v) for (let m = 0; m < M; m++) values[n * M + m] = v[offset + m];
  });
  return { names: [...names], values };
}
