/**
 * Densities for the respondent page: the population distribution of a coefficient (from the
 * run's location and spread) and a respondent's conditional distribution, drawn as a normal
 * with their conditional mean and SD — an approximation, since the run stores those two
 * moments and not the weighted draws.
 */
import type { TasteCoefficient } from '@shared/schemas/tastes';

const phi = (z: number) => Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);

export function normalDensity(x: number, mean: number, sd: number): number {
  return sd > 0 ? phi((x - mean) / sd) / sd : 0;
}

/** Density of the population distribution at x (normal, lognormal, triangular, uniform). */
export function populationDensity(c: TasteCoefficient, x: number): number {
  const s = Math.abs(c.spread);
  switch (c.distribution) {
    case 'normal':
      return normalDensity(x, c.location, s);
    case 'lognormal':
      return x > 0 && s > 0 ? phi((Math.log(x) - c.location) / s) / (x * s) : 0;
    case 'neg_lognormal':
      return x < 0 && s > 0 ? phi((Math.log(-x) - c.location) / s) / (-x * s) : 0;
    case 'triangular':
      return s > 0 ? Math.max(0, s - Math.abs(x - c.location)) / (s * s) : 0;
    case 'uniform':
      return s > 0 && Math.abs(x - c.location) <= s ? 1 / (2 * s) : 0;
    default:
      return 0;
  }
}

/** x range covering both distributions (±3.5 SD). */
export function getPlotRange(c: TasteCoefficient, mean: number, sd: number): [number, number] {
  let lo = Math.min(c.populationMean - 3.5 * c.populationSd, mean - 3.5 * sd);
  let hi = Math.max(c.populationMean + 3.5 * c.populationSd, mean + 3.5 * sd);
  if (c.distribution === 'lognormal') lo = Math.max(lo, 1e-6);
  if (c.distribution === 'neg_lognormal') hi = Math.min(hi, -1e-6);
  if (!(hi > lo)) return [mean - 1, mean + 1];
  return [lo, hi];
}
