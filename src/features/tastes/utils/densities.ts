/** Plotting range for the respondent page: the population and the respondent's curve. */
import type { TasteCoefficient } from '@shared/schemas/tastes';

/** x range covering both distributions (±3.5 SD). */
export function getPlotRange(c: TasteCoefficient, mean: number, sd: number): [number, number] {
  let lo = Math.min(c.populationMean - 3.5 * c.populationSd, mean - 3.5 * sd);
  let hi = Math.max(c.populationMean + 3.5 * c.populationSd, mean + 3.5 * sd);
  if (c.distribution === 'lognormal') lo = Math.max(lo, 1e-6);
  if (c.distribution === 'neg_lognormal') hi = Math.min(hi, -1e-6);
  if (!(hi > lo)) return [mean - 1, mean + 1];
  return [lo, hi];
}
