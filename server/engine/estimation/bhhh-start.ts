/**
 * The first inverse Hessian of BFGS for a maximum-likelihood fit: the inverse of the BHHH
 * matrix B = Σ_n s_n s_nᵀ of the per-respondent scores at the starting point (Berndt, Hall,
 * Hall & Hausman 1974, Annals of Economic and Social Measurement 3:653-665; Train 2009,
 * Discrete Choice Methods with Simulation, 2nd ed., §8.3.2). By the information identity B/N
 * estimates the information per respondent near the true parameters, so B⁻¹ starts BFGS with
 * the curvature of −LL in every direction at once, where the scaled identity of N&W eq. 6.20
 * knows one number and BFGS has to learn the rest one rank-two update at a time.
 * It changes the path to the optimum, never the optimum or the convergence test.
 * B must be positive definite (analyse-information.ts: no direction with a relative eigenvalue
 * ≤ 1e-10); otherwise there is no inverse and BFGS starts from the scaled identity, with a note.
 */
import { analyseInformation } from '../linalg/analyse-information';
import { choleskyDecompose } from '../linalg/cholesky';
import { outerProductSum } from './inference';
import type { LoglikEvaluator } from './loglik-evaluator';

export type BhhhStart =
  { inverseHessian: Float64Array; note: null } | { inverseHessian: null; note: string };

/** B⁻¹ at θ from one evaluation of the scores (θ in the evaluator's own, internal units). */
export async function computeBhhhStart(
  evaluator: LoglikEvaluator,
  theta: Float64Array,
): Promise<BhhhStart> {
  const scores = await evaluator.evaluateScores(theta);
  return getBhhhInverseHessian(scores, evaluator.respondentCount, evaluator.parameterCount);
}

/** B⁻¹ from an N × P score matrix (row-major), exactly symmetric; or why there is none. */
export function getBhhhInverseHessian(scores: Float64Array, N: number, P: number): BhhhStart {
  const analysis = analyseInformation(outerProductSum(scores, N, P), P);
  if (!analysis.positiveDefinite)
    return {
      inverseHessian: null,
      note: `the BHHH matrix at the starting values is singular (condition number ${analysis.conditionNumber.toExponential(1)}); BFGS starts from a scaled identity`,
    };
  // The eigen-sum of analyseInformation is symmetric only up to rounding; BFGS wants it exact.
  const h = analysis.inverse;
  for (let i = 0; i < P; i++)
    for (let j = 0; j < i; j++) {
      const v = (h[i * P + j] + h[j * P + i]) / 2;
      h[i * P + j] = v;
      h[j * P + i] = v;
    }
  if (!choleskyDecompose(h, P, new Float64Array(P * P)))
    return {
      inverseHessian: null,
      note: 'the inverse BHHH matrix at the starting values is not numerically positive definite; BFGS starts from a scaled identity',
    };
  return { inverseHessian: h, note: null };
}
