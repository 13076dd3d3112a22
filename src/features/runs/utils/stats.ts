/**
 * Small statistics for the estimates view: two-sided normal p-values, plotting ranges and
 * histograms scaled as densities, so they can be drawn on one axis with the population density
 * (src/utils/taste-density.ts).
 */
import type { EstimationResult } from '@shared/schemas/estimation-spec';

type Moment = EstimationResult['population'][number];

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

/** A plotting range covering the bulk of the population distribution and the data. */
export function plotRange(m: Moment, values: number[]): [number, number] {
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

/** Histogram with `bins` equal bins over [lo, hi], heights as densities (area 1). */
export function densityHistogram(
  values: number[],
  lo: number,
  hi: number,
  bins: number,
): { x: number; y: number }[] {
  const finite = values.filter(Number.isFinite);
  const width = (hi - lo) / bins;
  const counts = new Array<number>(bins).fill(0);
  for (const v of finite) counts[Math.min(bins - 1, Math.max(0, Math.floor((v - lo) / width)))]++;
  return counts.map((c, i) => ({
    x: lo + (i + 0.5) * width,
    y: finite.length > 0 ? c / (finite.length * width) : 0,
  }));
}
