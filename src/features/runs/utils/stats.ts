/**
 * Small statistics for the estimates view: plotting ranges and
 * histograms scaled as densities, so they can be drawn on one axis with the population density
 * (src/utils/taste-density.ts).
 */
import type { EstimationResult } from '@shared/schemas/estimation-spec';

type Moment = EstimationResult['population'][number];

export { normalCdf, twoSidedP } from '@shared/results/normal-p';

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
