/**
 * One estimation run from a validated specification (shared/schemas/estimation-spec.ts):
 * MNL or panel mixed logit, in preference or WTP space; then, from the covariance the run
 * chose, population mean and median WTP (or the reason it is withheld), derived quantities,
 * LL(C), the optional simulation-noise check and, for the mixed logit, every respondent's taste
 * profile. Hierarchical Bayes and latent class runs go to their own files (run-hb-estimation.ts,
 * run-latent-class-estimation.ts). Returns the plain result object the CLI writes and the job
 * runner stores.
 */
import type { EstimationResult, EstimationSpec } from '../../../shared/schemas/estimation-spec';
import type { BuiltChoiceData } from './build-choice-data';
import { computeDerivedQuantities } from './derived-quantities';
import { fitMixedLogit, type MixedLogitHooks, type MixedLogitResult } from './fit-mixed-logit';
import { fitMnl } from './fit-mnl';
import { computeCaic, computeConstantsLoglik } from './fit-statistics';
import { createMixedLogitLayout, type MixedLogitLayout } from './mixed-logit-layout';
import { getPopulationMoments } from './population-moments';
import { computePopulationWtp, getWtpWithheldReason } from './population-wtp';
import { toResultJson, type FittedModel } from './result-json';
import { selectColumns } from './select-columns';
import { checkSimulationError } from './simulation-error';
import { computeTasteProfiles } from './taste-profiles';
import { toWtpSpace } from './wtp-space-mnl';
import { runHbEstimation, type RunHbOptions } from './run-hb-estimation';
import {
  runLatentClassEstimation,
  type RunLatentClassOptions,
} from './run-latent-class-estimation';
import type { KernelPreference } from '../simd/kernel-choice';
import { computeTasteProfilesInWorkers } from '../parallel/parallel-taste-profiles';

export interface RunEstimationOptions extends MixedLogitHooks, RunHbOptions, RunLatentClassOptions {
  /** Worker threads for the mixed logit, the HB chains and the latent class fit (default 1). */
  threads?: number;
  /** Kernel of the mixed logit's LL (default 'auto': WebAssembly SIMD when it can run). */
  kernel?: KernelPreference;
}

/** Data columns a specification reads, in coefficient order. */
export function getSpecColumns(spec: EstimationSpec): string[] {
  return spec.coefficients.map((c) => c.column ?? c.name);
}

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
  if (spec.model === 'hb' || spec.model === 'latent_class') {
    const result =
      spec.model === 'hb'
        ? await runHbEstimation(spec, built, options)
        : await runLatentClassEstimation(spec, built, options);
    return { ...result, elapsedSeconds: (performance.now() - started) / 1000 };
  }
  const settings = spec.settings;
  const wtpCost = spec.space === 'wtp' ? (spec.cost ?? null) : null;
  const tolerances = {
    tolerance: settings.tolerance,
    gradientTolerance: settings.gradientTolerance,
    covariance: settings.covariance,
  };
  let fitted: FittedModel;
  let mixed: MixedLogitResult | null = null;
  if (spec.model === 'mnl') {
    const columns = coefficients.map((c) => data.columns.indexOf(c.column));
    const sub = selectColumns(data, columns);
    const fit = await fitMnl(sub, {
      ...tolerances,
      maxIterations: settings.maxIterations,
      holdout: holdout ? selectColumns(holdout, columns) : null,
    });
    const layout = createMixedLogitLayout(sub, coefficients, false, wtpCost);
    const inWtp =
      layout.wtpCost >= 0
        ? toWtpSpace(fit.estimates, fit.gradient, fit.inference, layout.wtpCost)
        : null;
    fitted = {
      ...fit,
      layout,
      estimates: inWtp?.theta ?? fit.estimates,
      gradient: inWtp?.gradient ?? fit.gradient,
      inference: inWtp?.inference ?? fit.inference,
      maxIterations: settings.maxIterations ?? 100,
      starts: [{ loglik: fit.loglik, status: fit.status, iterations: fit.iterations }],
      startsAtBest: 1,
      newtonSteps: 0,
      gradientCheck: null,
    };
  } else {
    const fitOptions = {
      coefficients,
      correlated: spec.correlated,
      wtpCost,
      draws: spec.draws,
      starts: spec.starts ?? 3,
      threads: options.threads,
      kernel: options.kernel,
      profileDraws: spec.profileDraws,
      holdout,
      maxIterations: settings.maxIterations,
      ...tolerances,
    };
    mixed = await fitMixedLogit(data, fitOptions, options);
    fitted = { ...mixed, maxIterations: settings.maxIterations ?? 300 };
    if (settings.simulationCheck) {
      const check = await checkSimulationError(data, fitOptions, mixed, options.signal);
      fitted.simulationError = check.result;
      fitted.warnings = [...fitted.warnings, ...check.warnings];
    }
  }
  const layout: MixedLogitLayout = fitted.layout;
  const theta = fitted.estimates;
  const chosen = fitted.inference.chosen;
  const cost = spec.cost ? layout.coefficients.findIndex((c) => c.name === spec.cost) : -1;
  const withheld = cost >= 0 ? getWtpWithheldReason(layout, theta, cost) : null;
  if (withheld)
    fitted.warnings = [
      ...fitted.warnings,
      { code: 'wtp_withheld', message: withheld, parameters: [spec.cost!] },
    ];
  options.onStage?.('wtp');
  const wtp =
    cost >= 0 && !withheld
      ? computePopulationWtp(layout, theta, chosen, cost, { seed: spec.draws.seed })
      : null;
  const derived =
    spec.model === 'mixed'
      ? computeDerivedQuantities(layout, theta, chosen, { seed: spec.draws.seed })
      : [];
  const loglikConstants = built.constants ? computeConstantsLoglik(built.constants) : null;
  let individuals: EstimationResult['individuals'] = null;
  let profileDraws: EstimationResult['profileDraws'] = null;
  let population = getPopulationMoments(layout, theta);
  if (mixed) {
    profileDraws = {
      type: spec.draws.type,
      count: spec.profileDraws,
      seed: spec.draws.seed + 1000,
    };
    const profileOptions = {
      ...profileDraws,
      cost: withheld ? undefined : spec.cost,
      signal: options.signal,
      kernel: options.kernel,
      onNote: options.onNote,
    };
    options.onStage?.('profiles');
    const threads = options.threads ?? 1;
    // Several threads: profiles on worker threads too, so the calling thread stays responsive.
    const profiles =
      threads > 1
        ? await computeTasteProfilesInWorkers(data, layout, theta, { ...profileOptions, threads })
        : computeTasteProfiles(data, layout, theta, profileOptions);
    individuals = profiles.profiles;
    population = profiles.population;
  }
  return toResultJson({
    spec,
    fitted,
    population,
    wtp,
    withheld,
    derived,
    loglikConstants,
    caic: computeCaic(fitted.loglik, layout.P, fitted.observations),
    individuals,
    profileDraws,
    elapsedSeconds: (performance.now() - started) / 1000,
  });
}
