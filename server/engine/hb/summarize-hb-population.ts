/**
 * Population-level summaries of pooled HB draws: for each coefficient the posterior of its
 * location μ_k (of ln |β| for lognormals), spread √Σ_kk, and of the population mean and SD of β
 * computed per draw (normal: μ, √Σ; lognormal: ±e^{μ+Σ/2}, √(e^Σ − 1)·e^{μ+Σ/2}, Johnson, Kotz &
 * Balakrishnan 1994, ch. 14); correlations; WTP per draw as the ratio of population means
 * −E[β_k]/E[β_cost] (as compute-wtp.ts, here with its full posterior); the posterior mean of the
 * log-likelihood and the Newton & Raftery (1994, JRSS B 56:3-48) harmonic-mean estimate of the log
 * marginal density, log m = −log mean_s exp(−LL_s), the measure Rossi, Allenby & McCulloch (2005,
 * §6.6) report for hierarchical models; it is known to be unstable, so read it as a rough guide.
 */
import type { CheckedHbOptions } from './check-hb-options';
import { HB_FIXED, HB_LOGNORMAL, HB_NEG_LOGNORMAL, HB_NORMAL } from './check-hb-options';
import type { HbChainResult } from './hb-chain-result';
import { poolDraws, summarizeDraws, type DrawSummary } from './posterior-summary';

export interface HbCoefficientSummary {
  name: string;
  distribution: 'normal' | 'lognormal' | 'neg_lognormal' | 'fixed';
  location: DrawSummary;
  spread: DrawSummary | null;
  mean: DrawSummary;
  sd: DrawSummary | null;
}

export interface HbPopulationSummary {
  coefficients: HbCoefficientSummary[];
  correlations: { a: string; b: string; summary: DrawSummary }[];
  /** Posterior means of μ (Kr), Σ (Kr²) and the fixed coefficients (Kf). */
  muMean: Float64Array;
  sigmaMean: Float64Array;
  fixedMean: Float64Array;
  wtp: ({ name: string } & DrawSummary)[] | null;
  loglikMean: number;
  logMarginalDensity: number;
}

const DIST = ['normal', 'lognormal', 'neg_lognormal', 'fixed'] as const;

export function summarizeHbPopulation(
  chains: readonly HbChainResult[],
  opts: CheckedHbOptions,
): HbPopulationSummary {
  const { layout, retained: S } = opts;
  const { K, random, fixed, transform, names } = layout;
  const Kr = random.length;
  const Kf = fixed.length;
  const C = chains.length;
  const slot = new Int32Array(K);
  random.forEach((k, r) => (slot[k] = r));
  fixed.forEach((k, f) => (slot[k] = f));
  const mu = (c: number, s: number, r: number) => chains[c].mu[s * Kr + r];
  const sig = (c: number, s: number, i: number, j: number) =>
    chains[c].sigma[s * Kr * Kr + i * Kr + j];
  /** Population mean of β_k at draw s of chain c. */
  const popMean = (c: number, s: number, k: number) => {
    if (transform[k] === HB_FIXED) return chains[c].fixed[s * Kf + slot[k]];
    const r = slot[k];
    if (transform[k] === HB_NORMAL) return mu(c, s, r);
    const m = Math.exp(mu(c, s, r) + sig(c, s, r, r) / 2);
    return transform[k] === HB_LOGNORMAL ? m : -m;
  };
  const coefficients = names.map((name, k): HbCoefficientSummary => {
    const r = slot[k];
    const isFixed = transform[k] === HB_FIXED;
    const logn = transform[k] === HB_LOGNORMAL || transform[k] === HB_NEG_LOGNORMAL;
    return {
      name,
      distribution: DIST[transform[k]],
      location: summarizeDraws(
        poolDraws(C, S, (c, s) => (isFixed ? popMean(c, s, k) : mu(c, s, r))),
      ),
      spread: isFixed
        ? null
        : summarizeDraws(poolDraws(C, S, (c, s) => Math.sqrt(sig(c, s, r, r)))),
      mean: summarizeDraws(poolDraws(C, S, (c, s) => popMean(c, s, k))),
      sd: isFixed
        ? null
        : summarizeDraws(
            poolDraws(C, S, (c, s) => {
              const v = sig(c, s, r, r);
              return logn ? Math.sqrt(Math.expm1(v)) * Math.abs(popMean(c, s, k)) : Math.sqrt(v);
            }),
          ),
    };
  });
  const correlations: HbPopulationSummary['correlations'] = [];
  if (opts.correlated)
    for (let i = 0; i < Kr; i++)
      for (let j = 0; j < i; j++)
        correlations.push({
          a: names[random[i]],
          b: names[random[j]],
          summary: summarizeDraws(
            poolDraws(
              C,
              S,
              (c, s) => sig(c, s, i, j) / Math.sqrt(sig(c, s, i, i) * sig(c, s, j, j)),
            ),
          ),
        });
  const mean = (len: number, get: (c: number, s: number, i: number) => number) => {
    const out = new Float64Array(len);
    for (let i = 0; i < len; i++)
      out[i] = poolDraws(C, S, (c, s) => get(c, s, i)).reduce((a, b) => a + b, 0) / (C * S);
    return out;
  };
  const cost = opts.cost;
  const loglik = poolDraws(C, S, (c, s) => chains[c].loglik[s]);
  return {
    coefficients,
    correlations,
    muMean: mean(Kr, mu),
    sigmaMean: mean(Kr * Kr, (c, s, i) => chains[c].sigma[s * Kr * Kr + i]),
    fixedMean: mean(Kf, (c, s, f) => chains[c].fixed[s * Kf + f]),
    wtp:
      cost < 0
        ? null
        : names.flatMap((name, k) =>
            k === cost
              ? []
              : [
                  {
                    name,
                    ...summarizeDraws(
                      poolDraws(C, S, (c, s) => -popMean(c, s, k) / popMean(c, s, cost)),
                    ),
                  },
                ],
          ),
    loglikMean: loglik.reduce((a, b) => a + b, 0) / loglik.length,
    logMarginalDensity: getHarmonicMeanLogDensity(loglik),
  };
}

/** −log mean exp(−LL_s), by the log-sum-exp shift. */
export function getHarmonicMeanLogDensity(loglik: Float64Array): number {
  let max = -Infinity;
  for (let i = 0; i < loglik.length; i++) max = Math.max(max, -loglik[i]);
  let sum = 0;
  for (let i = 0; i < loglik.length; i++) sum += Math.exp(-loglik[i] - max);
  return -(max + Math.log(sum / loglik.length));
}
