/**
 * The one interface the optimiser sees: LL + gradient at θ, and per-respondent scores for the
 * robust covariance. Implemented in-process over one kernel, or across worker threads
 * (server/engine/parallel), so a WASM kernel could later replace either without touching
 * the estimator.
 */
import type { LoglikKernel } from './mixed-logit-kernel';

export interface LoglikEvaluator {
  readonly parameterCount: number;
  readonly respondentCount: number;
  /** Σ_n ln L_n at θ; writes ∂/∂θ into grad. */
  evaluate(theta: Float64Array, grad: Float64Array): Promise<number>;
  /** respondentCount × P matrix of per-respondent gradients at θ. */
  evaluateScores(theta: Float64Array): Promise<Float64Array>;
  close(): Promise<void>;
}

/** Wraps a kernel covering all respondents as an evaluator running on the calling thread. */
export function createInProcessEvaluator(kernel: LoglikKernel): LoglikEvaluator {
  const P = kernel.parameterCount;
  return {
    parameterCount: P,
    respondentCount: kernel.respondentCount,
    evaluate: async (theta, grad) => kernel.evaluate(theta, grad),
    evaluateScores: async (theta) => {
      const scores = new Float64Array(kernel.respondentCount * P);
      kernel.evaluate(theta, new Float64Array(P), scores);
      return scores;
    },
    close: async () => {},
  };
}
