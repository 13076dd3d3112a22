/**
 * Every respondent's posterior from the pooled HB draws: mean, SD and 95 % interval of each
 * coefficient β_nk, of each WTP ratio −β_nk/β_n,cost computed draw by draw (Train 2009, §12.7:
 * functions of individual coefficients are summarised over the draws of those coefficients),
 * and, as the "effective draws" diagnostic, the smallest ESS of the respondent's coefficients.
 * Individual posteriors are shrunk toward the population and wide with few tasks.
 */
import type { CheckedHbOptions } from './check-hb-options';
import type { HbChainResult } from './hb-chain-result';
import type { TasteProfile } from '../estimation/taste-profiles';
import { computeEss } from './mcmc-diagnostics';
import { summarizeDraws } from './posterior-summary';

/** A taste profile with the 95 % posterior intervals, and the WTPs' SDs and intervals. */
export interface HbIndividual extends TasteProfile {
  lower: Record<string, number>;
  upper: Record<string, number>;
  wtpSd?: Record<string, number>;
  wtpLower?: Record<string, number>;
  wtpUpper?: Record<string, number>;
}

export interface HbIndividualsResult {
  individuals: HbIndividual[];
  /** N × K posterior means of β_n (coefficient order), for individual predictions. */
  means: Float64Array;
}

export function summarizeHbIndividuals(
  chains: readonly HbChainResult[],
  opts: CheckedHbOptions,
  respondentIds: readonly string[],
): HbIndividualsResult {
  const { layout, retained: S, cost } = opts;
  const { K, random, fixed, names } = layout;
  const Kr = random.length;
  const Kf = fixed.length;
  const N = respondentIds.length;
  const C = chains.length;
  const isRandom = new Int32Array(K).fill(-1);
  random.forEach((k, r) => (isRandom[k] = r));
  const fixedSlot = new Int32Array(K).fill(-1);
  fixed.forEach((k, f) => (fixedSlot[k] = f));
  // draws[k][c·S + s] for the current respondent.
  const draws = Array.from({ length: K }, () => new Float64Array(C * S));
  const ratio = new Float64Array(C * S);
  const means = new Float64Array(N * K);
  const individuals: HbIndividual[] = [];
  for (let n = 0; n < N; n++) {
    for (let c = 0; c < C; c++) {
      const { betas, fixed: fixedDraws } = chains[c];
      for (let s = 0; s < S; s++) {
        const base = s * N * Kr + n * Kr;
        for (let k = 0; k < K; k++)
          draws[k][c * S + s] =
            isRandom[k] >= 0 ? betas[base + isRandom[k]] : fixedDraws[s * Kf + fixedSlot[k]];
      }
    }
    let effectiveDraws = Infinity;
    for (const r of random) {
      const perChain = Array.from({ length: C }, (_, c) => draws[r].subarray(c * S, (c + 1) * S));
      effectiveDraws = Math.min(effectiveDraws, computeEss(perChain));
    }
    const p: HbIndividual = {
      respondent: respondentIds[n],
      mean: {},
      sd: {},
      lower: {},
      upper: {},
      effectiveDraws,
    };
    if (cost >= 0) Object.assign(p, { wtp: {}, wtpSd: {}, wtpLower: {}, wtpUpper: {} });
    for (let k = 0; k < K; k++) {
      if (cost >= 0 && k !== cost) {
        for (let i = 0; i < C * S; i++) ratio[i] = -draws[k][i] / draws[cost][i];
        const w = summarizeDraws(ratio);
        p.wtp![names[k]] = w.mean;
        p.wtpSd![names[k]] = w.sd;
        p.wtpLower![names[k]] = w.lower;
        p.wtpUpper![names[k]] = w.upper;
      }
    }
    for (let k = 0; k < K; k++) {
      const b = summarizeDraws(draws[k]);
      p.mean[names[k]] = means[n * K + k] = b.mean;
      p.sd[names[k]] = b.sd;
      p.lower[names[k]] = b.lower;
      p.upper[names[k]] = b.upper;
    }
    individuals.push(p);
  }
  return { individuals, means };
}
