/** Two-sided p-values of z (t) statistics under the normal approximation. */

/**
 * Standard normal CDF through erf by Abramowitz & Stegun (1964) formula 7.1.26
 * (|error| < 1.5e-7, from memory): ample for p-values shown to three decimals.
 */
export function normalCdf(z: number): number {
  const x = Math.abs(z) / Math.SQRT2;
  const t = 1 / (1 + 0.3275911 * x);
  const poly =
    t *
    (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429))));
  const erf = 1 - poly * Math.exp(-x * x);
  return z >= 0 ? 0.5 * (1 + erf) : 0.5 * (1 - erf);
}

/** Two-sided p-value of a z (t) statistic under the normal approximation. */
export function twoSidedP(z: number): number {
  return 2 * (1 - normalCdf(Math.abs(z)));
}
