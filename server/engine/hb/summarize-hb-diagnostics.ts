/**
 * Convergence diagnostics of an HB run: split R-hat and ESS (mcmc-diagnostics.ts) of every
 * population mean μ_k and variance Σ_kk over the kept draws of all chains; a run whose largest
 * R-hat exceeds 1.05 is flagged (Gelman et al. 2013, BDA3, §11.4, suggest 1.1; Vehtari et al. 2021,
 * Bayesian Analysis 16:667-718, argue for a stricter bound, here the product's 1.05); and per chain
 * the acceptance rates, the final proposal scale and a thinned trace of the whole run.
 */
import type { CheckedHbOptions } from './check-hb-options';
import type { HbChainResult } from './hb-chain-result';
import { computeEss, computeSplitRhat } from './mcmc-diagnostics';

export const RHAT_LIMIT = 1.05;

export interface HbDiagnostics {
  parameters: { name: string; rhat: number; ess: number }[];
  rhatMax: number;
  essMin: number;
  /** True when some R-hat exceeds RHAT_LIMIT: the chains may not have converged. */
  flagged: boolean;
  rhatLimit: number;
  chains: {
    chain: number;
    acceptanceBurnin: number;
    acceptance: number;
    acceptanceFixed: number | null;
    scale: number;
    trace: {
      iteration: number[];
      acceptance: number[];
      mean: Record<string, number[]>;
      variance: Record<string, number[]>;
    };
  }[];
}

const round = (x: number) => Number(x.toPrecision(5));

export function summarizeHbDiagnostics(
  chains: readonly HbChainResult[],
  opts: CheckedHbOptions,
): HbDiagnostics {
  const { layout, retained: S } = opts;
  const Kr = layout.random.length;
  const series = (get: (c: HbChainResult, s: number) => number) =>
    chains.map((c) => Float64Array.from({ length: S }, (_, s) => get(c, s)));
  const parameters = [...layout.random].flatMap((k, r) => {
    const name = layout.names[k];
    const mean = series((c, s) => c.mu[s * Kr + r]);
    const variance = series((c, s) => c.sigma[s * Kr * Kr + r * Kr + r]);
    return [
      { name: `${name}.mean`, rhat: computeSplitRhat(mean), ess: computeEss(mean) },
      { name: `${name}.variance`, rhat: computeSplitRhat(variance), ess: computeEss(variance) },
    ];
  });
  const rhats = parameters.map((p) => p.rhat).filter(Number.isFinite);
  const rhatMax = rhats.length > 0 ? Math.max(...rhats) : NaN;
  return {
    parameters,
    rhatMax,
    essMin: Math.min(...parameters.map((p) => p.ess)),
    flagged: rhatMax > RHAT_LIMIT,
    rhatLimit: RHAT_LIMIT,
    chains: chains.map((c) => {
      const points = c.trace.iteration.findIndex((i) => i === 0);
      const P = points < 0 ? c.trace.iteration.length : points;
      const column = (values: Float64Array, r: number) =>
        Array.from({ length: P }, (_, p) => round(values[p * Kr + r]));
      return {
        chain: c.chain + 1,
        acceptanceBurnin: c.acceptanceBurnin,
        acceptance: c.acceptance,
        acceptanceFixed: c.acceptanceFixed,
        scale: c.scale,
        trace: {
          iteration: Array.from(c.trace.iteration.subarray(0, P)),
          acceptance: Array.from(c.trace.acceptance.subarray(0, P), round),
          mean: Object.fromEntries(
            [...layout.random].map((k, r) => [layout.names[k], column(c.trace.mu, r)]),
          ),
          variance: Object.fromEntries(
            [...layout.random].map((k, r) => [layout.names[k], column(c.trace.sigmaDiag, r)]),
          ),
        },
      };
    }),
  };
}
