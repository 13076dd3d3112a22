/**
 * A latent class run from a validated specification: fitLatentClass (on a worker thread when
 * threads > 1), then the result in the shape every run has — estimates named class<c>.<name> and
 * class<c>.share, population moments as share-weighted means and SDs ("discrete"), the
 * individuals with their class probabilities — plus the classes and the class-count table.
 */
import type { EstimationResult, EstimationSpec } from '../../../shared/schemas/estimation-spec';
import { LATENT_CLASS_DEFAULT_STARTS } from '../../../shared/schemas/estimation-families';
import type { BuiltChoiceData } from './build-choice-data';
import type { MembershipCovariates } from '../latent-class/check-latent-class-options';
import type { LatentClassProgress } from '../latent-class/fit-latent-class';
import { fitLatentClassInWorker } from '../latent-class/fit-latent-class-in-worker';

export interface RunLatentClassOptions {
  threads?: number;
  signal?: AbortSignal;
  /** Covariates of the membership model, rows in built.data.respondentIds order. */
  membership?: MembershipCovariates | null;
  onClassProgress?: (progress: LatentClassProgress) => void;
  /** The web process's busy flag: EM waits while it is set (fit-latent-class-in-worker.ts). */
  fieldworkBusy?: Int32Array;
}

export async function runLatentClassEstimation(
  spec: EstimationSpec,
  built: BuiltChoiceData,
  options: RunLatentClassOptions = {},
): Promise<Omit<EstimationResult, 'elapsedSeconds'>> {
  const fit = await fitLatentClassInWorker(
    built.data,
    {
      coefficients: spec.coefficients.map((c) => ({ name: c.name, column: c.column ?? c.name })),
      classes: spec.classes ?? 2,
      starts: spec.starts ?? LATENT_CLASS_DEFAULT_STARTS,
      membership: options.membership ?? null,
      seed: spec.draws.seed,
      cost: spec.cost,
      holdout: built.holdout,
    },
    {
      signal: options.signal,
      onProgress: options.onClassProgress,
      threads: options.threads,
      fieldworkBusy: options.fieldworkBusy,
    },
  );
  return {
    model: 'latent_class',
    loglik: fit.loglik,
    loglikNull: fit.loglikNull,
    respondents: fit.respondents,
    observations: fit.observations,
    parameters: fit.parameters,
    iterations: fit.iterations,
    converged: fit.converged,
    convergence: {
      reason: fit.converged ? 'em_converged' : 'max_iterations',
      gradientNorm: null,
      relativeChange: null,
    },
    rho2: fit.rho2,
    adjRho2: fit.adjRho2,
    aic: fit.aic,
    bic: fit.bic,
    caic: fit.caic,
    hitRate: fit.hitRate,
    holdoutHitRate: fit.holdoutHitRate,
    individualHitRate: fit.individualHitRate,
    individualHoldoutHitRate: fit.individualHoldoutHitRate,
    estimates: fit.classes.flatMap((c) => [
      { name: `class${c.class}.share`, estimate: c.share, se: c.shareSe, robustSe: null },
      ...c.estimates.map((e) => ({
        name: `class${c.class}.${e.name}`,
        estimate: e.estimate,
        se: e.se,
        robustSe: null,
      })),
    ]),
    population: fit.population.map((m) => ({
      name: m.name,
      distribution: 'discrete' as const,
      mean: m.mean,
      sd: m.sd,
      location: m.mean,
      spread: m.sd,
    })),
    wtp: null,
    individuals: fit.individuals,
    draws: null,
    profileDraws: null,
    classes: fit.classes,
    classSelection: fit.table,
    ...(fit.warnings.length > 0 ? { warnings: fit.warnings } : {}),
    membership: fit.options.membership,
  };
}
