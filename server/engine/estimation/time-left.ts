/**
 * Estimated time left of a mixed-logit estimation, from its iterations and evaluation time
 * (shown for long runs). BFGS is assumed to keep reducing the gradient norm at the average
 * log-rate seen so far (from its first value to now), so reaching the tolerance takes
 * ln(g/tol)/rate more iterations (at most the iteration limit), each at the mean seconds per
 * iteration so far; then the standard errors cost their evaluations (2P + 1 for the
 * numerical Hessian, 1 for BHHH scores) and the taste profiles about profileDraws/draws
 * evaluations without gradient. Common practice, no source: an honest "about", not a promise.
 */
export interface TimeLeftInput {
  iteration: number;
  maxIterations: number;
  gradientNorm: number;
  initialGradientNorm: number;
  tolerance: number;
  secondsPerIteration: number;
  secondsPerEvaluation: number;
  /** Evaluations still needed after the optimisation (standard errors, profiles). */
  evaluationsAfter: number;
  /** Further starts still to run, each about as long as this one. */
  startsLeft: number;
}

export function estimateSecondsLeft(p: TimeLeftInput): number {
  const done = Math.max(1, p.iteration);
  const fallen = Math.log(p.initialGradientNorm / p.gradientNorm);
  const rate = fallen > 0 ? fallen / done : 0;
  const toGo = Math.log(p.gradientNorm / p.tolerance);
  const cap = Math.max(0, p.maxIterations - p.iteration);
  const iterationsLeft = toGo <= 0 ? 0 : rate > 0 ? Math.min(cap, toGo / rate) : cap;
  const thisStart = iterationsLeft * p.secondsPerIteration;
  const otherStarts = p.startsLeft * (p.iteration + iterationsLeft) * p.secondsPerIteration;
  return thisStart + otherStarts + p.evaluationsAfter * p.secondsPerEvaluation;
}
