/**
 * Densities of a random coefficient for the charts: the population distribution (from a run's
 * location and spread) and one respondent's conditional distribution (from the conditional
 * mean and SD the run stores). One module for the estimates view and the respondent page.
 */
const phi = (z: number) => Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);

export function normalDensity(x: number, mean: number, sd: number): number {
  return sd > 0 ? phi((x - mean) / sd) / sd : 0;
}

/** Density at x of exp(N(mu, sigma²)); zero for x ≤ 0. */
function lognormalDensity(x: number, mu: number, sigma: number): number {
  return x > 0 && sigma > 0 ? phi((Math.log(x) - mu) / sigma) / (x * sigma) : 0;
}

type Population = { distribution: string; location: number; spread: number };

/**
 * Density of the population distribution at x. Parameterisation as the engine's (location and
 * spread; a lognormal's are those of ln |β|, a triangular's and uniform's spread is the half
 * width): Train (2009) §6.2.
 */
export function populationDensity(c: Population, x: number): number {
  const s = Math.abs(c.spread);
  switch (c.distribution) {
    case 'normal':
      return normalDensity(x, c.location, s);
    case 'lognormal':
      return lognormalDensity(x, c.location, s);
    case 'neg_lognormal':
      return lognormalDensity(-x, c.location, s);
    case 'triangular':
      return s > 0 ? Math.max(0, s - Math.abs(x - c.location)) / (s * s) : 0;
    case 'uniform':
      return s > 0 && Math.abs(x - c.location) <= s ? 1 / (2 * s) : 0;
    default:
      return 0;
  }
}

/**
 * A respondent's conditional distribution drawn from its mean and SD. The run keeps these two
 * moments, not the weighted draws, so the curve is a two-moment fit: a normal for coefficients
 * on the whole line, and for (negative) lognormal coefficients a lognormal on the same
 * half-line with the same mean and SD (σ² = ln(1 + sd²/mean²), μ = ln|mean| − σ²/2; the
 * lognormal's moments, Johnson, Kotz & Balakrishnan 1994, ch. 14), so the curve never puts
 * mass on the wrong sign.
 */
export function conditionalDensity(
  distribution: string,
  mean: number,
  sd: number,
  x: number,
): number {
  const positive = distribution === 'lognormal';
  const negative = distribution === 'neg_lognormal';
  if (!positive && !negative) return normalDensity(x, mean, sd);
  const m = Math.abs(mean);
  if (!(m > 0) || !(sd > 0)) return 0;
  const sigma2 = Math.log(1 + (sd * sd) / (m * m));
  const mu = Math.log(m) - sigma2 / 2;
  return lognormalDensity(positive ? x : -x, mu, Math.sqrt(sigma2));
}

/** Words for the curve a conditionalDensity draws, for legends. */
export function conditionalCurveLabel(distribution: string): string {
  return distribution === 'lognormal' || distribution === 'neg_lognormal'
    ? 'This respondent (lognormal, same mean and SD)'
    : 'This respondent (normal, same mean and SD)';
}

/** A plotting range covering the bulk of the population distribution and the data. */
export function plotRange(
  m: Pick<Population, 'distribution' | 'location' | 'spread'> & { mean: number; sd: number },
  values: number[],
): [number, number] {
  const finite = values.filter(Number.isFinite);
  let lo = m.mean - 3.5 * m.sd;
  let hi = m.mean + 3.5 * m.sd;
  if (m.distribution === 'lognormal') lo = Math.max(lo, 0);
  if (m.distribution === 'neg_lognormal') hi = Math.min(hi, 0);
  if (m.distribution === 'triangular' || m.distribution === 'uniform') {
    lo = m.location - Math.abs(m.spread);
    hi = m.location + Math.abs(m.spread);
  }
  for (const v of finite) {
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  if (!(hi > lo)) return [lo - 1, hi + 1];
  const pad = (hi - lo) * 0.05;
  return [lo - pad, hi + pad];
}
