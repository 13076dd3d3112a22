/**
 * What every maximum-likelihood fit returns (the MNL, the panel mixed logit) and what the run's
 * JSON (result-json.ts) reads from either: one definition, so a field added to the fits reaches
 * the result in one place.
 */
import type { ConvergenceMeasures, ConvergenceStatus } from './convergence';
import type { EstimationWarning } from './estimation-warnings';
import type { FitStatistics } from './fit-statistics';
import type { Inference } from './inference';

/** Final LL, status and iterations of one start of a multi-start fit. */
export interface StartSummary {
  loglik: number;
  status: ConvergenceStatus;
  iterations: number;
}

export interface FittedModelCore extends FitStatistics {
  names: string[];
  estimates: Float64Array;
  inference: Inference;
  loglik: number;
  loglikNull: number;
  iterations: number;
  status: ConvergenceStatus;
  measures: ConvergenceMeasures;
  /** Gradient in the user's units at the estimate. */
  gradient: Float64Array;
  /** Euclidean norm of the gradient (user units) at the estimate. */
  gradientNorm: number;
  respondents: number;
  observations: number;
  hitRate: number;
  holdoutHitRate: number | null;
  warnings: EstimationWarning[];
}

/** A fit as the estimator returns it: with its classical and robust standard errors. */
export interface FittedWithErrors extends FittedModelCore {
  se: Float64Array;
  robustSe: Float64Array;
  converged: boolean;
}
