/**
 * Summaries of posterior draws: mean, SD (n − 1 denominator), and the central 95 % interval from
 * the 2.5 % and 97.5 % sample quantiles (Gelman et al. 2013, BDA3, §10.5; quantiles of type 7).
 */
import { quantile } from '../../../shared/engine/stats/quantile';

export interface DrawSummary {
  mean: number;
  sd: number;
  lower: number;
  upper: number;
}

/** Summarises `values` (sorted in place). */
export function summarizeDraws(values: Float64Array): DrawSummary {
  const n = values.length;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += values[i];
  mean /= n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i] - mean) ** 2;
  values.sort();
  return {
    mean,
    sd: n > 1 ? Math.sqrt(ss / (n - 1)) : 0,
    lower: quantile(values, 0.025),
    upper: quantile(values, 0.975),
  };
}

/** Collects one scalar of every kept draw of every chain, chain after chain. */
export function poolDraws(
  chainCount: number,
  perChain: number,
  valueAt: (chain: number, draw: number) => number,
): Float64Array {
  const out = new Float64Array(chainCount * perChain);
  for (let c = 0; c < chainCount; c++)
    for (let s = 0; s < perChain; s++) out[c * perChain + s] = valueAt(c, s);
  return out;
}
