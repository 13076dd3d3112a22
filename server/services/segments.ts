/**
 * Segments: one coefficient's conditional means split into groups (the alternative chosen in a
 * task, or the answer to a background question), summarised per group with count, mean, SD,
 * five-number summary (for box plots) and a histogram on bin edges shared by every group (so
 * overlaid histograms are comparable). Pure; the use case that loads the values is in tastes.ts.
 */
import { quantile } from '../../shared/engine/stats/quantile';
import type { SegmentGroup } from '../../shared/schemas/tastes';

/** One group's summary, as the Tastes screen receives it less the group's label. */
export type SegmentSummary = Omit<SegmentGroup, 'label'>;

export interface SegmentsSummary {
  /** Bin edges (bins + 1 values), equal width over the pooled range. */
  edges: number[];
  groups: SegmentSummary[];
}

/**
 * Quantile of sorted values by linear interpolation between order statistics, Hyndman & Fan
 * (1996) definition 7: h = (n − 1)p, Q = x_⌊h⌋ + (h − ⌊h⌋)(x_⌊h⌋+1 − x_⌊h⌋).
 */
export function getQuantile(sorted: readonly number[], p: number): number {
  if (sorted.length === 0) throw new RangeError('no values');
  return quantile(sorted, p);
}

/** Sturges' rule (1926): ⌈log₂ n⌉ + 1 bins, kept between 5 and 30 for readable charts. */
export function getBinCount(n: number): number {
  return Math.min(30, Math.max(5, Math.ceil(Math.log2(Math.max(1, n))) + 1));
}

function getEdges(values: readonly number[], bins: number): number[] {
  let min = Infinity;
  let max = -Infinity;
  for (const v of values) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  if (!Number.isFinite(min)) return [0, 1];
  // A single repeated value still gets a bin of positive width around it.
  if (max === min) {
    min -= 0.5;
    max += 0.5;
  }
  const width = (max - min) / bins;
  return Array.from({ length: bins + 1 }, (_, i) => (i === bins ? max : min + i * width));
}

function getBin(edges: readonly number[], v: number): number {
  const bins = edges.length - 1;
  const i = Math.floor(((v - edges[0]) / (edges[bins] - edges[0])) * bins);
  return Math.min(bins - 1, Math.max(0, i));
}

/**
 * Summarises `values[i]` by `groups[i]` (null = no group, left out). Groups are listed in
 * `order` when given (unknown keys after, in first-seen order); empty listed groups are kept
 * out. Throws when lengths differ or a value is not finite.
 */
export function summarizeSegments(
  values: readonly number[],
  groups: readonly (string | null)[],
  options: { bins?: number; order?: readonly string[] } = {},
): SegmentsSummary {
  if (values.length !== groups.length) throw new RangeError('values and groups differ in length');
  const byGroup = new Map<string, number[]>();
  for (const key of options.order ?? []) byGroup.set(key, []);
  const used: number[] = [];
  values.forEach((v, i) => {
    const key = groups[i];
    if (key === null) return;
    if (!Number.isFinite(v)) throw new RangeError(`value ${i} is not finite`);
    let list = byGroup.get(key);
    if (!list) byGroup.set(key, (list = []));
    list.push(v);
    used.push(v);
  });
  const bins = options.bins ?? getBinCount(used.length);
  const edges = getEdges(used, bins);
  const summaries: SegmentSummary[] = [];
  for (const [key, list] of byGroup) {
    if (list.length === 0) continue;
    const sorted = [...list].sort((a, b) => a - b);
    const n = sorted.length;
    const mean = sorted.reduce((s, v) => s + v, 0) / n;
    const ss = sorted.reduce((s, v) => s + (v - mean) ** 2, 0);
    const histogram = new Array<number>(edges.length - 1).fill(0);
    for (const v of sorted) histogram[getBin(edges, v)]++;
    summaries.push({
      key,
      count: n,
      mean,
      sd: n > 1 ? Math.sqrt(ss / (n - 1)) : null,
      min: sorted[0],
      q1: getQuantile(sorted, 0.25),
      median: getQuantile(sorted, 0.5),
      q3: getQuantile(sorted, 0.75),
      max: sorted[n - 1],
      histogram,
    });
  }
  return { edges, groups: summaries };
}
