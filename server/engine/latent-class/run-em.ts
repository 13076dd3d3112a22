/**
 * One EM run of the latent class logit from given starting values (Dempster, Laird & Rubin 1977;
 * Train 2009, §14.3): E-step posteriors, then an M-step that maximises each class's weighted MNL
 * Σ_n h_nc ln L_n(β_c) by Newton-Raphson with step halving and the membership model by its own
 * Newton steps. Every M-step increases the expected complete-data log-likelihood, so the observed
 * LL never falls (a generalised EM: one Newton step per M-step is enough, and the Newton polish on
 * the observed LL after EM brings the final digits, fit-class-count.ts); the trace of LLs is kept so the tests can check that. Bounded
 * by maxIterations; stops when the LL rises by less than tolerance·(1 + |LL|). A class whose
 * posterior mass falls below one respondent has emptied: the run reports it as collapsed.
 */
import type { ChoiceData } from '../estimation/choice-data';
import { evaluateMnl } from '../estimation/mnl-likelihood';
import { invertMatrix } from '../linalg/invert-matrix';
import { computePosteriors, type LatentClassState } from './latent-class-state';
import { maximizeMembership } from './membership-model';

export interface EmOutcome {
  iterations: number;
  converged: boolean;
  /** Observed LL after each E-step. */
  trace: number[];
  /** Why the start failed (an empty class, a singular class Hessian), or null. */
  collapsed: string | null;
}

/** Runs EM on `state` (its betas and gamma are the start) until convergence or the bound. */
export function runEm(
  data: ChoiceData,
  z: Float64Array,
  state: LatentClassState,
  options: { maxIterations: number; tolerance: number },
  shouldStop?: () => boolean,
): EmOutcome {
  const N = data.taskStart.length - 1;
  const { C, K, Mp } = state;
  const weights = new Float64Array(N);
  const trace: number[] = [];
  let previous = computePosteriors(data, z, state);
  trace.push(previous);
  for (let it = 1; it <= options.maxIterations; it++) {
    if (shouldStop?.()) return { iterations: it - 1, converged: false, trace, collapsed: null };
    for (let c = 0; c < C; c++) {
      let mass = 0;
      for (let n = 0; n < N; n++) mass += weights[n] = state.h[n * C + c];
      if (mass < 1)
        return {
          iterations: it - 1,
          converged: false,
          trace,
          collapsed: `class ${c + 1} of ${C} became empty (its posterior mass fell to ${mass.toPrecision(2)} respondents)`,
        };
      if (!maximizeWeightedMnl(data, weights, state.betas.subarray(c * K, (c + 1) * K)))
        return {
          iterations: it - 1,
          converged: false,
          trace,
          collapsed: `the coefficients of class ${c + 1} of ${C} are not identified by its members`,
        };
    }
    maximizeMembership(state.h, z, N, Mp, C, state.gamma, state.pi);
    const loglik = computePosteriors(data, z, state);
    trace.push(loglik);
    if (!Number.isFinite(loglik))
      return {
        iterations: it,
        converged: false,
        trace,
        collapsed: 'the log-likelihood became NaN or infinite',
      };
    if (Math.abs(loglik - previous) < options.tolerance * (1 + Math.abs(loglik)))
      return { iterations: it, converged: true, trace, collapsed: null };
    previous = loglik;
  }
  return { iterations: options.maxIterations, converged: false, trace, collapsed: null };
}

/**
 * One Newton-Raphson step with step halving on the weighted MNL Σ_n w_n ln L_n(β): the objective
 * never falls. Returns false if the Hessian is singular (the class's members cannot identify β).
 */
function maximizeWeightedMnl(data: ChoiceData, weights: Float64Array, beta: Float64Array): boolean {
  const K = beta.length;
  const grad = new Float64Array(K);
  const hess = new Float64Array(K * K);
  const trial = new Float64Array(K);
  const f = evaluateMnl(data, beta, grad, hess, null, weights);
  const inv = invertMatrix(
    hess.map((x) => -x),
    K,
  );
  if (!inv) return false;
  const step = new Float64Array(K);
  let decrement = 0;
  for (let a = 0; a < K; a++) {
    for (let b = 0; b < K; b++) step[a] += inv[a * K + b] * grad[b];
    decrement += step[a] * grad[a];
  }
  if (!(decrement > 1e-13)) return true;
  for (let halvings = 0, lambda = 1; halvings < 30; halvings++, lambda /= 2) {
    for (let k = 0; k < K; k++) trial[k] = beta[k] + lambda * step[k];
    if (evaluateMnl(data, trial, null, null, null, weights) >= f) {
      beta.set(trial);
      return true;
    }
  }
  return true;
}
