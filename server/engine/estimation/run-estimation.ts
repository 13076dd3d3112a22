/**
 * One estimation run from a validated specification (shared/schemas/estimation-spec.ts):
 * MNL or panel mixed logit, population moments, WTP (delta method and Krinsky-Robb on the
 * classical covariance) and, for the mixed logit, every respondent's taste profile. Returns
 * the plain result object the CLI writes and the job runner stores.
 */
import type { EstimationResult, EstimationSpec } from '../../../shared/schemas/estimation-spec';
import type { BuiltChoiceData } from './build-choice-data';
import { computeWtp } from './compute-wtp';
import { fitMixedLogit, type MixedLogitHooks } from './fit-mixed-logit';
import { fitMnl } from './fit-mnl';
import { createMixedLogitLayout } from './mixed-logit-layout';
import { getPopulationMoments } from './population-moments';
import { selectColumns } from './select-columns';
import { computeTasteProfiles } from './taste-profiles';
import type { KernelPreference } from '../simd/kernel-choice';
import { computeTasteProfilesInWorkers } from '../parallel/parallel-taste-profiles';

export interface RunEstimationOptions extends MixedLogitHooks {
  /** Worker threads for the mixed logit (default 1). */
  threads?: number;
  /** Kernel of the mixed logit's LL (default 'auto': WebAssembly SIMD when it can run). */
  kernel?: KernelPreference;
}

/** Data columns a specification reads, in coefficient order. */
export function getSpecColumns(spec: EstimationSpec): string[] {
  return spec.coefficients.map((c) => c.column ?? c.name);
}

const finiteOrNull = (x: number): number | null => (Number.isFinite(x) ? x : null);

/** Runs the model of `spec` on data built with the columns of getSpecColumns(spec). */
export async function runEstimation(
  spec: EstimationSpec,
  built: BuiltChoiceData,
  options: RunEstimationOptions = {},
): Promise<EstimationResult> {
  const started = performance.now();
  const coefficients = spec.coefficients.map((c) => ({
    name: c.name,
    column: c.column ?? c.name,
    distribution: c.distribution,
  }));
  const { data, holdout } = built;
  if (spec.model === 'mnl') {
    const columns = coefficients.map((c) => data.columns.indexOf(c.column));
    const fit = fitMnl(selectColumns(data, columns), {
      holdout: holdout ? selectColumns(holdout, columns) : null,
    });
    const layout = createMixedLogitLayout(
      selectColumns(data, columns),
      coefficients.map((c) => ({ ...c, column: c.column })),
      false,
    );
    return {
      model: 'mnl',
      loglik: fit.loglik,
      loglikNull: fit.loglikNull,
      respondents: fit.respondents,
      observations: fit.observations,
      parameters: fit.names.length,
      iterations: fit.iterations,
      converged: fit.converged,
      convergence: {
        reason: fit.converged ? 'newton_decrement' : 'max_iterations',
        gradientNorm: fit.gradientNorm,
        relativeChange: null,
      },
      rho2: fit.rho2,
      adjRho2: fit.adjRho2,
      aic: fit.aic,
      bic: fit.bic,
      hitRate: fit.hitRate,
      holdoutHitRate: fit.holdoutHitRate,
      estimates: coefficients.map((c, k) => ({
        name: c.name,
        estimate: fit.estimates[k],
        se: finiteOrNull(fit.se[k]),
        robustSe: finiteOrNull(fit.robustSe[k]),
      })),
      population: getPopulationMoments(layout, fit.estimates),
      wtp: spec.cost
        ? computeWtp(layout, fit.estimates, fit.covariance, {
            cost: spec.cost,
            seed: spec.draws.seed,
          })
        : null,
      individuals: null,
      draws: null,
      profileDraws: null,
      elapsedSeconds: (performance.now() - started) / 1000,
    };
  }
  const fit = await fitMixedLogit(
    data,
    {
      coefficients,
      correlated: spec.correlated,
      draws: spec.draws,
      starts: spec.starts,
      threads: options.threads,
      kernel: options.kernel,
      profileDraws: spec.profileDraws,
      holdout,
    },
    options,
  );
  const profileDraws = {
    type: spec.draws.type,
    count: spec.profileDraws,
    seed: spec.draws.seed + 1000,
  };
  const profileOptions = {
    ...profileDraws,
    cost: spec.cost,
    signal: options.signal,
    kernel: options.kernel,
    onNote: options.onNote,
  };
  const threads = options.threads ?? 1;
  // Several threads: profiles on worker threads too, so the calling thread stays responsive.
  const profiles =
    threads > 1
      ? await computeTasteProfilesInWorkers(data, fit.layout, fit.estimates, {
          ...profileOptions,
          threads,
        })
      : computeTasteProfiles(data, fit.layout, fit.estimates, profileOptions);
  return {
    model: 'mixed',
    loglik: fit.loglik,
    loglikNull: fit.loglikNull,
    respondents: fit.respondents,
    observations: fit.observations,
    parameters: fit.names.length,
    iterations: fit.iterations,
    converged: fit.converged,
    convergence: {
      reason: fit.convergence.reason,
      gradientNorm: fit.convergence.gradientNorm,
      relativeChange: finiteOrNull(fit.convergence.relativeChange),
    },
    rho2: fit.rho2,
    adjRho2: fit.adjRho2,
    aic: fit.aic,
    bic: fit.bic,
    hitRate: fit.hitRate,
    holdoutHitRate: fit.holdoutHitRate,
    estimates: fit.names.map((name, p) => ({
      name,
      estimate: fit.estimates[p],
      se: finiteOrNull(fit.se[p]),
      robustSe: finiteOrNull(fit.robustSe[p]),
    })),
    population: profiles.population,
    wtp: spec.cost
      ? computeWtp(fit.layout, fit.estimates, fit.covariance, {
          cost: spec.cost,
          seed: spec.draws.seed,
        })
      : null,
    individuals: profiles.profiles,
    draws: { type: spec.draws.type, count: spec.draws.count, seed: spec.draws.seed },
    profileDraws,
    elapsedSeconds: (performance.now() - started) / 1000,
  };
}
