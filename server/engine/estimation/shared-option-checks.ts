/**
 * Option checks every estimator makes alike (MNL, mixed logit, HB, latent class, taste
 * profiles): integer settings lie in their range, coefficient names are unique and name a data
 * column, the cost coefficient must be
 * one of the model's, and holdout data must have the estimation data's columns. One place, so
 * the messages and fields stay the same everywhere.
 */
import type { ChoiceData } from './choice-data';
import { EstimationOptionsError } from './estimation-errors';

/** Throws unless `value` is an integer in min..max. */
export function assertInteger(value: number, field: string, min: number, max: number): void {
  if (!Number.isInteger(value) || value < min || value > max)
    throw new EstimationOptionsError(
      `${field} must be an integer between ${min} and ${max}`,
      field,
    );
}

/**
 * The data column of coefficient k (its `column`, or else its name), after checking that no
 * earlier coefficient has its name.
 */
export function resolveCoefficientColumn(
  data: Pick<ChoiceData, 'columns'>,
  coefficients: readonly { name: string; column?: string }[],
  k: number,
): number {
  const c = coefficients[k];
  if (coefficients.findIndex((other) => other.name === c.name) !== k)
    throw new EstimationOptionsError(
      `coefficient name ${c.name} is used twice`,
      `coefficients.${k}.name`,
    );
  const col = data.columns.indexOf(c.column ?? c.name);
  if (col < 0)
    throw new EstimationOptionsError(
      `column ${c.column ?? c.name} is not in the data`,
      `coefficients.${k}.column`,
    );
  return col;
}

/** Index of the cost coefficient among `names`; −1 when no cost is given. */
export function resolveCostIndex(names: readonly string[], cost: string | undefined): number {
  if (cost === undefined) return -1;
  const index = names.indexOf(cost);
  if (index < 0)
    throw new EstimationOptionsError(`cost coefficient ${cost} is not in the model`, 'cost');
  return index;
}

/** The holdout data (or null) after checking it has the estimation data's columns. */
export function checkHoldout<H extends Pick<ChoiceData, 'columns'>>(
  data: Pick<ChoiceData, 'columns'>,
  holdout: H | null | undefined,
): H | null {
  if (holdout && holdout.columns.join('\u0000') !== data.columns.join('\u0000'))
    throw new EstimationOptionsError(
      'holdout data must have the same columns as the estimation data',
      'holdout',
    );
  return holdout ?? null;
}
