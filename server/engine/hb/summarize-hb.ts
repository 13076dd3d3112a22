/**
 * Everything an HB run reports, from the chains' kept draws: population posterior, each
 * respondent's posterior, convergence diagnostics, and fit measures comparable with the MNL and
 * the mixed logit. Pure; runs in a worker thread when the chains did.
 */
import type { ChoiceData } from '../estimation/choice-data';
import {
  computeFitStatistics,
  computeNullLoglik,
  type FitStatistics,
} from '../estimation/fit-statistics';
import type { CheckedHbOptions } from './check-hb-options';
import type { HbChainResult } from './hb-chain-result';
import { computeHbPopulationFit, computeIndividualHitRate } from './hb-fit-measures';
import { summarizeHbDiagnostics, type HbDiagnostics } from './summarize-hb-diagnostics';
import { summarizeHbIndividuals, type HbIndividual } from './summarize-hb-individuals';
import { summarizeHbPopulation, type HbPopulationSummary } from './summarize-hb-population';

export interface HbFitMeasures extends FitStatistics {
  /** Simulated panel LL at the posterior means (comparable with the mixed logit's LL). */
  loglik: number;
  loglikNull: number;
  /** LL of the MNL that gave the starting values. */
  loglikMnl: number;
  parameters: number;
  respondents: number;
  observations: number;
  hitRate: number;
  holdoutHitRate: number | null;
  individualHitRate: number;
  individualHoldoutHitRate: number | null;
}

export interface HbSummary {
  population: HbPopulationSummary;
  individuals: HbIndividual[];
  diagnostics: HbDiagnostics;
  fit: HbFitMeasures;
}

/** `data` and `holdout` carry exactly the model's columns, in coefficient order. */
export function summarizeHb(
  data: ChoiceData,
  holdout: ChoiceData | null,
  opts: CheckedHbOptions,
  chains: readonly HbChainResult[],
): HbSummary {
  const { layout } = opts;
  const Kr = layout.random.length;
  const population = summarizeHbPopulation(chains, opts);
  const { individuals, means } = summarizeHbIndividuals(chains, opts, data.respondentIds);
  const simulated = computeHbPopulationFit(
    data,
    holdout,
    layout,
    { mu: population.muMean, sigma: population.sigmaMean, fixed: population.fixedMean },
    opts.seed,
  );
  const parameters = Kr + (opts.correlated ? (Kr * (Kr + 1)) / 2 : Kr) + layout.fixed.length;
  const loglikNull = computeNullLoglik(data);
  const T = data.altCount.length;
  return {
    population,
    individuals,
    diagnostics: summarizeHbDiagnostics(chains, opts),
    fit: {
      loglik: simulated.loglik,
      loglikNull,
      loglikMnl: chains[0].mnlLoglik,
      parameters,
      respondents: data.taskStart.length - 1,
      observations: T,
      ...computeFitStatistics(simulated.loglik, loglikNull, parameters, T),
      hitRate: simulated.hitRate,
      holdoutHitRate: simulated.holdoutHitRate,
      individualHitRate: computeIndividualHitRate(data, data.respondentIds, means, layout.K),
      individualHoldoutHitRate: holdout
        ? computeIndividualHitRate(holdout, data.respondentIds, means, layout.K)
        : null,
    },
  };
}
