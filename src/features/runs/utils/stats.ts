/**
 * Small statistics for the estimates view: p-values (shared/results/normal-p.ts), plotting
 * ranges (shared/results/taste-density.ts) and histograms scaled as densities, so they can be
 * drawn on one axis with the population density.
 */

export { normalCdf, twoSidedP } from '@shared/results/normal-p';
export { plotRange } from '@shared/results/taste-density';

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
