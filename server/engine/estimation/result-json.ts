/**
 * Turns a fitted model and what was derived from it into the run's JSON result
 * (estimationResultSchema): typed arrays become plain numbers, values that cannot be computed
 * become null, and the covariance matrices go in whole (classical and robust).
 */
import type { EstimationResult, EstimationSpec } from '../../../shared/schemas/estimation-spec';
import type { DerivedQuantityEstimate } from './derived-quantities';
import type { FittedModelCore, StartSummary } from './fitted-model';
import type { MixedLogitLayout } from './mixed-logit-layout';
import type { PopulationMoment } from './population-moments';
import type { PopulationWtp } from './population-wtp';
import { finiteOrNull } from './finite-or-null';

export interface FittedModel extends FittedModelCore {
  layout: MixedLogitLayout;
  maxIterations: number;
  starts: StartSummary[];
  startsAtBest: number;
  newtonSteps: number;
  gradientCheck: number | null;
  draws?: { type: string; count: number; seed: number };
  simulationError?: EstimationResult['simulationError'];
}

function matrix(m: Float64Array | null, P: number): (number | null)[][] | null {
  if (!m) return null;
  return Array.from({ length: P }, (_, i) =>
    Array.from(m.subarray(i * P, (i + 1) * P), finiteOrNull),
  );
}

export function toResultJson(input: {
  spec: EstimationSpec;
  fitted: FittedModel;
  population: PopulationMoment[];
  wtp: PopulationWtp[] | null;
  withheld: string | null;
  derived: DerivedQuantityEstimate[];
  loglikConstants: number | null;
  caic: number;
  individuals: EstimationResult['individuals'];
  profileDraws: EstimationResult['profileDraws'];
  elapsedSeconds: number;
}): EstimationResult {
  const { spec, fitted: f } = input;
  const P = f.names.length;
  const relative = f.measures.relativeGradient;
  return {
    model: spec.model,
    space: spec.space,
    loglik: f.loglik,
    loglikNull: f.loglikNull,
    respondents: f.respondents,
    observations: f.observations,
    parameters: P,
    iterations: f.iterations,
    converged: f.status === 'converged',
    convergence: {
      reason: f.status,
      gradientNorm: f.gradientNorm,
      relativeChange: null,
    },
    convergenceDetail: {
      status: f.status,
      decrement: finiteOrNull(f.measures.decrement),
      maxRelativeGradient: f.measures.maxRelativeGradient,
      gradient: f.names.map((name, p) => ({
        name,
        value: f.gradient[p],
        relative: relative[p],
      })),
      tolerance: spec.settings.tolerance,
      gradientTolerance: spec.settings.gradientTolerance,
      maxIterations: f.maxIterations,
      starts: f.starts.length,
      startsAtBest: f.startsAtBest,
      startLoglik: f.starts.map((s) => s.loglik),
      newtonSteps: f.newtonSteps,
      gradientCheck: f.gradientCheck,
    },
    warnings: f.warnings,
    rho2: f.rho2,
    adjRho2: f.adjRho2,
    aic: f.aic,
    bic: f.bic,
    fit: {
      loglikConstants: input.loglikConstants,
      rho2Constants: input.loglikConstants === null ? null : 1 - f.loglik / input.loglikConstants,
      caic: input.caic,
      bicN: f.observations,
      bicBasis: 'choice observations',
    },
    hitRate: f.hitRate,
    holdoutHitRate: f.holdoutHitRate,
    estimates: f.names.map((name, p) => ({
      name,
      estimate: f.estimates[p],
      se: finiteOrNull(f.inference.se[p]),
      robustSe: finiteOrNull(f.inference.robustSe[p]),
    })),
    covariance: {
      names: f.names,
      method: f.inference.method,
      used: f.inference.used,
      classical: matrix(f.inference.classical, P),
      robust: matrix(f.inference.robust, P),
      clusters: f.inference.clusters,
      correction: f.inference.correction,
    },
    population: input.population,
    wtp: input.wtp
      ? input.wtp.map((w) => ({
          name: w.name,
          estimate: w.mean.estimate,
          se: w.mean.se,
          deltaLower: w.mean.deltaLower,
          deltaUpper: w.mean.deltaUpper,
          lower: w.mean.lower,
          upper: w.mean.upper,
          median: w.median,
        }))
      : null,
    wtpWithheld: input.withheld,
    derived: input.derived.map((d) => ({ ...d, estimate: d.estimate })),
    simulationError: f.simulationError ?? null,
    individuals: input.individuals,
    draws: f.draws
      ? { type: f.draws.type as 'halton', count: f.draws.count, seed: f.draws.seed }
      : null,
    profileDraws: input.profileDraws,
    elapsedSeconds: input.elapsedSeconds,
  };
}
