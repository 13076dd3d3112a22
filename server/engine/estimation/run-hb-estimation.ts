/**
 * An HB run from a validated specification: fitHb, then the result in the shape every run has
 * (estimates as posterior means with posterior SDs in the SE column, population moments, WTP
 * with 95 % posterior intervals, the individuals) plus the diagnostics and sampler settings.
 */
import type { EstimationResult, EstimationSpec } from '../../../shared/schemas/estimation-spec';
import { mcmcSchema, hbPriorsSchema } from '../../../shared/schemas/estimation-families';
import type { BuiltChoiceData } from './build-choice-data';
import { fitHb, type HbProgress } from '../hb/fit-hb';
import { finiteOrNull } from './finite-or-null';

export interface RunHbOptions {
  threads?: number;
  signal?: AbortSignal;
  onSamplerProgress?: (progress: HbProgress) => void;
  /** The web process's busy flag: the chains wait while it is set (fit-hb.ts). */
  fieldworkBusy?: Int32Array;
}

export async function runHbEstimation(
  spec: EstimationSpec,
  built: BuiltChoiceData,
  options: RunHbOptions = {},
): Promise<Omit<EstimationResult, 'elapsedSeconds'>> {
  const mcmc = mcmcSchema.parse(spec.mcmc ?? {});
  const priors = hbPriorsSchema.parse(spec.priors ?? {});
  const fit = await fitHb(
    built.data,
    {
      coefficients: spec.coefficients.map((c) => ({
        name: c.name,
        column: c.column ?? c.name,
        distribution: c.distribution,
      })),
      correlated: spec.correlated,
      ...mcmc,
      priors,
      cost: spec.cost,
      holdout: built.holdout,
      threads: options.threads,
    },
    {
      signal: options.signal,
      onProgress: options.onSamplerProgress,
      fieldworkBusy: options.fieldworkBusy,
    },
  );
  const { population, diagnostics, fit: measures, options: used } = fit;
  const estimates = population.coefficients.flatMap((c) =>
    c.spread
      ? [
          { name: `${c.name}.mean`, estimate: c.location.mean, se: c.location.sd, robustSe: null },
          { name: `${c.name}.sd`, estimate: c.spread.mean, se: c.spread.sd, robustSe: null },
        ]
      : [{ name: c.name, estimate: c.location.mean, se: c.location.sd, robustSe: null }],
  );
  const rhat = diagnostics.rhatMax;
  return {
    model: 'hb',
    loglik: measures.loglik,
    loglikNull: measures.loglikNull,
    respondents: measures.respondents,
    observations: measures.observations,
    parameters: measures.parameters,
    iterations: used.iterations,
    converged: !diagnostics.flagged,
    convergence: {
      reason: `largest split R-hat ${Number.isFinite(rhat) ? rhat.toFixed(3) : 'not available'} (limit ${diagnostics.rhatLimit})`,
      gradientNorm: null,
      relativeChange: null,
    },
    rho2: measures.rho2,
    adjRho2: measures.adjRho2,
    aic: measures.aic,
    bic: measures.bic,
    hitRate: measures.hitRate,
    holdoutHitRate: measures.holdoutHitRate,
    estimates: [
      ...estimates,
      ...population.correlations.map((r) => ({
        name: `corr.${r.a}.${r.b}`,
        estimate: r.summary.mean,
        se: r.summary.sd,
        robustSe: null,
      })),
    ],
    population: population.coefficients.map((c) => ({
      name: c.name,
      distribution: c.distribution,
      mean: c.mean.mean,
      sd: c.sd?.mean ?? 0,
      location: c.location.mean,
      spread: c.spread?.mean ?? 0,
    })),
    wtp:
      population.wtp?.map((w) => ({
        name: w.name,
        estimate: w.mean,
        se: w.sd,
        deltaLower: null,
        deltaUpper: null,
        lower: w.lower,
        upper: w.upper,
      })) ?? null,
    individuals: fit.individuals,
    draws: null,
    profileDraws: null,
    logMarginalDensity: finiteOrNull(population.logMarginalDensity),
    individualHitRate: finiteOrNull(measures.individualHitRate),
    individualHoldoutHitRate: measures.individualHoldoutHitRate,
    diagnostics: {
      ...diagnostics,
      rhatMax: finiteOrNull(diagnostics.rhatMax),
      essMin: finiteOrNull(diagnostics.essMin),
      parameters: diagnostics.parameters.map((p) => ({
        name: p.name,
        rhat: finiteOrNull(p.rhat),
        ess: finiteOrNull(p.ess),
      })),
      chains: diagnostics.chains.map((c) => ({
        ...c,
        acceptanceBurnin: finiteOrNull(c.acceptanceBurnin),
      })),
    },
    sampler: {
      iterations: used.iterations,
      burnin: used.burnin,
      thin: used.thin,
      steps: used.steps,
      chains: used.chains,
      seed: used.seed,
      keptPerChain: used.retained,
      correlated: used.correlated,
      priors: used.priors,
      correlations: population.correlations.map((r) => ({ a: r.a, b: r.b, ...r.summary })),
    },
  };
}
