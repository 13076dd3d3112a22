/**
 * Spreads of random coefficients (SD of a normal, SD of ln β of a lognormal, half-width of a
 * triangular or uniform, Cholesky diagonal) enter the utility only through s·η with η
 * symmetric about zero, so s and −s give the same model: the data identify |s|, not its sign.
 * We show |s| and map the interval of s onto |s|: an interval that excludes zero is mirrored
 * when s < 0, one that contains zero becomes [0, max |end|] (the set of |s| over the interval).
 */
export interface SpreadShown {
  value: number;
  lower: number | null;
  upper: number | null;
}

export function showSpread(
  estimate: number,
  lower: number | null | undefined,
  upper: number | null | undefined,
): SpreadShown {
  const value = Math.abs(estimate);
  if (lower === null || lower === undefined || upper === null || upper === undefined)
    return { value, lower: null, upper: null };
  if (lower <= 0 && upper >= 0)
    return { value, lower: 0, upper: Math.max(Math.abs(lower), Math.abs(upper)) };
  const a = Math.abs(lower);
  const b = Math.abs(upper);
  return { value, lower: Math.min(a, b), upper: Math.max(a, b) };
}

/** The one line shown under every table that lists spreads. */
export const SPREAD_NOTE =
  'Spreads are shown as |s|: the model identifies the size of a spread, not its sign; each interval is the interval of s carried over to |s|.';

/**
 * Is this parameter ("coefficient.sd" or "coefficient.spread") a spread? Cholesky terms are
 * not: flipping the sign of a column of L flips its off-diagonal terms too, so they are read
 * through the implied covariance and correlation matrices instead.
 */
export function isSpreadParameter(name: string): boolean {
  if (name.startsWith('chol.')) return false;
  const part = name.split('.')[1];
  return part === 'sd' || part === 'spread';
}
