/**
 * The convergence test every estimator applies, on the internally scaled parameters θ̃:
 *  - the Newton decrement g′A⁻¹g (A = the information, −Hessian, or its BHHH or BFGS
 *    approximation) ≤ `tolerance`: twice the log-likelihood still to gain under a quadratic
 *    model (Boyd & Vandenberghe 2004, Convex Optimization, §9.5.1);
 *  - and the largest relative gradient |g_p|·max(|θ̃_p|, 1) / max(|LL|, 1) ≤
 *    `gradientTolerance` (Dennis & Schnabel 1983, Numerical Methods for Unconstrained
 *    Optimization, §7.2), which does not depend on the units of θ or of LL.
 * A change in LL alone never counts: it is small whenever the steps are, converged or not.
 */

export type ConvergenceStatus = 'converged' | 'stalled' | 'iteration_limit';

export interface ConvergenceTolerances {
  /** Newton decrement g′A⁻¹g (default 1e-7: LL within 5e-8 of the optimum). */
  tolerance: number;
  /** Largest relative gradient (default ε^{1/3} ≈ 6e-6, Dennis & Schnabel §7.2). */
  gradientTolerance: number;
  maxIterations: number;
}

export const DEFAULT_TOLERANCE = 1e-7;
export const DEFAULT_GRADIENT_TOLERANCE = Math.cbrt(Number.EPSILON);

export interface ConvergenceMeasures {
  decrement: number;
  maxRelativeGradient: number;
  /** Per parameter relative gradient. */
  relativeGradient: Float64Array;
}

/** g′·step (step = A⁻¹g, given) and the relative gradients. */
export function measureConvergence(
  gradient: ArrayLike<number>,
  step: ArrayLike<number> | null,
  theta: ArrayLike<number>,
  loglik: number,
): ConvergenceMeasures {
  const P = gradient.length;
  const relativeGradient = new Float64Array(P);
  let decrement = step ? 0 : Infinity;
  const denominator = Math.max(Math.abs(loglik), 1);
  let maxRelativeGradient = 0;
  for (let p = 0; p < P; p++) {
    if (step) decrement += gradient[p] * step[p];
    relativeGradient[p] = (Math.abs(gradient[p]) * Math.max(Math.abs(theta[p]), 1)) / denominator;
    maxRelativeGradient = Math.max(maxRelativeGradient, relativeGradient[p]);
  }
  return { decrement: Math.abs(decrement), maxRelativeGradient, relativeGradient };
}

export function passesConvergence(m: ConvergenceMeasures, t: ConvergenceTolerances): boolean {
  return m.decrement <= t.tolerance && m.maxRelativeGradient <= t.gradientTolerance;
}

/** y = A x for a P×P row-major A. */
export function multiply(a: Float64Array, x: ArrayLike<number>): Float64Array {
  const P = x.length;
  const out = new Float64Array(P);
  for (let i = 0; i < P; i++) {
    let s = 0;
    for (let j = 0; j < P; j++) s += a[i * P + j] * x[j];
    out[i] = s;
  }
  return out;
}
