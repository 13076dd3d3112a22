/**
 * Convergence diagnostics of MCMC draws, as in Gelman et al. (2013), Bayesian Data Analysis, 3rd
 * ed., §11.4-11.5, and the Stan reference manual's effective sample size: every chain is split
 * into its first and last halves (the middle draw of an odd length dropped), then
 *   split R-hat = sqrt(((n−1)/n·W + B/n) / W), W = mean within-chain variance, B = n·var(chain means);
 *   ESS = m·n / τ, τ = −1 + 2 Σ ρ̂_t over Geyer's (1992) initial positive and monotone sequence,
 *   ρ̂_t = 1 − (W' − mean_c acov_c(t)) / var⁺ with biased autocovariances, τ ≥ 1/log10(m·n).
 * These are ArviZ's rhat(method="split") and ess(method="mean"); the tests compare with values
 * ArviZ 0.23.4 printed (scripts/reference/hb-diagnostics.py).
 */

/** Split chains: for each chain its first ⌊n/2⌋ and last ⌊n/2⌋ draws. */
export function splitChains(chains: readonly Float64Array[]): Float64Array[] {
  return chains.flatMap((c) => {
    const half = Math.floor(c.length / 2);
    return [c.subarray(0, half), c.subarray(c.length - half)];
  });
}

function mean(x: Float64Array): number {
  let s = 0;
  for (let i = 0; i < x.length; i++) s += x[i];
  return s / x.length;
}

function sampleVariance(x: ArrayLike<number>, m: number): number {
  let s = 0;
  for (let i = 0; i < x.length; i++) s += (x[i] - m) ** 2;
  return s / (x.length - 1);
}

/** Split R-hat of one scalar over chains of equal length (NaN for fewer than 4 draws). */
export function computeSplitRhat(chains: readonly Float64Array[]): number {
  const split = splitChains(chains);
  const n = split[0]?.length ?? 0;
  if (n < 2 || split.length < 2) return NaN;
  const means = split.map(mean);
  const W = split.reduce((s, c, j) => s + sampleVariance(c, means[j]), 0) / split.length;
  const grand = means.reduce((a, b) => a + b, 0) / means.length;
  const B = n * sampleVariance(means, grand);
  return Math.sqrt((B / W + n - 1) / n);
}

/** Effective sample size of the mean of one scalar over chains of equal length. */
export function computeEss(chains: readonly Float64Array[]): number {
  const split = splitChains(chains);
  const m = split.length;
  const n = split[0]?.length ?? 0;
  if (n < 4) return NaN;
  // Centred copies in one flat buffer (split j at j·n); plain loops, since typed-array map and
  // iterators are slow paths in V8 and this runs once per respondent and coefficient.
  const centred = new Float64Array(m * n);
  const means = new Float64Array(m);
  let min = Infinity;
  let max = -Infinity;
  for (let j = 0; j < m; j++) {
    const c = split[j];
    let s = 0;
    for (let i = 0; i < n; i++) {
      const x = c[i];
      s += x;
      if (x < min) min = x;
      if (x > max) max = x;
    }
    means[j] = s / n;
    for (let i = 0; i < n; i++) centred[j * n + i] = c[i] - means[j];
  }
  if (max - min < 1e-15) return m * n;
  // Mean over chains of the biased autocovariance at lag t, computed on demand.
  const acov = (t: number) => {
    let s = 0;
    for (let j = 0; j < m; j++) {
      const o = j * n;
      let a = 0;
      for (let i = 0; i + t < n; i++) a += centred[o + i] * centred[o + i + t];
      s += a / n;
    }
    return s / m;
  };
  const meanVar = (acov(0) * n) / (n - 1);
  let varPlus = (meanVar * (n - 1)) / n;
  let grand = 0;
  for (let j = 0; j < m; j++) grand += means[j];
  if (m > 1) varPlus += sampleVariance(means, grand / m);
  const rho = new Float64Array(n);
  let even = 1;
  let odd = 1 - (meanVar - acov(1)) / varPlus;
  rho[0] = even;
  rho[1] = odd;
  let t = 1;
  while (t < n - 3 && even + odd > 0) {
    even = 1 - (meanVar - acov(t + 1)) / varPlus;
    odd = 1 - (meanVar - acov(t + 2)) / varPlus;
    if (even + odd >= 0) {
      rho[t + 1] = even;
      rho[t + 2] = odd;
    }
    t += 2;
  }
  const maxT = t - 2;
  if (even > 0) rho[maxT + 1] = even;
  for (let u = 1; u <= maxT - 2; u += 2) {
    if (rho[u + 1] + rho[u + 2] > rho[u - 1] + rho[u]) {
      rho[u + 1] = (rho[u - 1] + rho[u]) / 2;
      rho[u + 2] = rho[u + 1];
    }
  }
  let sum = 0;
  for (let u = 0; u <= maxT; u++) sum += rho[u];
  const tau = Math.max(-1 + 2 * sum + (maxT + 1 < n ? rho[maxT + 1] : 0), 1 / Math.log10(m * n));
  return (m * n) / tau;
}
