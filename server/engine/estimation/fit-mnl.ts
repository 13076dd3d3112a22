/**
 * Multinomial (conditional) logit by Newton-Raphson with analytic gradient and Hessian and
 * step halving (Train 2009 §8.3.1), on internally scaled columns (parameter-scaling.ts) with
 * every result in the user's units. Converged only when the test of convergence.ts passes;
 * otherwise "stalled" (no step improves the LL) or "iteration_limit". Before any numerics the
 * columns are checked for variation and collinearity (correlation form); when the fit runs away
 * or predicts some task with certainty, a linear program decides whether the data are separated
 * (find-separation.ts): real separation fails the fit naming the columns and tasks, an extreme
 * task alone is a warning. Covariances by inference.ts (classical, BHHH, clustered sandwich
 * with G/(G−1)).
 */
import type { ChoiceData } from './choice-data';
import { assertColumnsVary, assertNotCollinear, getExtremeTasks } from './check-identification';
import {
  DEFAULT_GRADIENT_TOLERANCE,
  DEFAULT_TOLERANCE,
  measureConvergence,
  multiply,
  passesConvergence,
  type ConvergenceMeasures,
  type ConvergenceStatus,
} from './convergence';
import { EstimationOptionsError, NonIdentifiedError } from './estimation-errors';
import { describeTasks, type EstimationWarning } from './estimation-warnings';
import { findSeparation } from './find-separation';
import { computeFitStatistics, computeNullLoglik } from './fit-statistics';
import { computeInference, type CovarianceChoice } from './inference';
import type { FittedWithErrors } from './fitted-model';
import { analyseInformation } from '../linalg/analyse-information';
import { evaluateMnl } from './mnl-likelihood';
import { computeMnlHitRate } from './mnl-hit-rate';
import { getColumnScales, gradientToUser, scaleChoiceData } from './parameter-scaling';
import { checkHoldout } from './shared-option-checks';

export interface MnlOptions {
  /** Newton iterations allowed (default 100). */
  maxIterations?: number;
  /** Newton decrement g′A⁻¹g at convergence (default 1e-7). */
  tolerance?: number;
  /** Largest relative gradient at convergence (default ε^{1/3}). */
  gradientTolerance?: number;
  /** Starting coefficients (default zeros). */
  start?: ArrayLike<number>;
  /** Holdout tasks for an out-of-sample hit rate. */
  holdout?: ChoiceData | null;
  /** Covariance used for inference (default 'robust'). */
  covariance?: CovarianceChoice;
}

export interface CheckedMnlOptions {
  maxIterations: number;
  tolerance: number;
  gradientTolerance: number;
  start: Float64Array;
  holdout: ChoiceData | null;
  covariance: CovarianceChoice;
}

export interface MnlResult extends FittedWithErrors {
  model: 'mnl';
}

/** Fills defaults and validates MNL options before any numerics; throws EstimationOptionsError. */
export function checkMnlOptions(data: ChoiceData, options: MnlOptions = {}): CheckedMnlOptions {
  const K = data.columns.length;
  const maxIterations = options.maxIterations ?? 100;
  const tolerance = options.tolerance ?? DEFAULT_TOLERANCE;
  const gradientTolerance = options.gradientTolerance ?? DEFAULT_GRADIENT_TOLERANCE;
  if (!Number.isInteger(maxIterations) || maxIterations < 1) {
    throw new EstimationOptionsError('maxIterations must be a positive integer', 'maxIterations');
  }
  if (!(tolerance > 0))
    throw new EstimationOptionsError('tolerance must be a positive number', 'tolerance');
  if (!(gradientTolerance > 0))
    throw new EstimationOptionsError(
      'gradientTolerance must be a positive number',
      'gradientTolerance',
    );
  const covariance = options.covariance ?? 'robust';
  if (!['robust', 'classical', 'bhhh'].includes(covariance))
    throw new EstimationOptionsError('covariance must be robust, classical or bhhh', 'covariance');
  const start = new Float64Array(K);
  if (options.start) {
    if (options.start.length !== K)
      throw new EstimationOptionsError(`start must have ${K} values`, 'start');
    for (let k = 0; k < K; k++) {
      if (!Number.isFinite(options.start[k]))
        throw new EstimationOptionsError('start values must be finite', 'start');
      start[k] = options.start[k];
    }
  }
  const holdout = checkHoldout(data, options.holdout);
  return { maxIterations, tolerance, gradientTolerance, start, holdout, covariance };
}

/** Fits the MNL with every data column as one coefficient. */
export async function fitMnl(data: ChoiceData, options: MnlOptions = {}): Promise<MnlResult> {
  const opts = checkMnlOptions(data, options);
  const K = data.columns.length;
  const names = [...data.columns];
  assertColumnsVary(
    data,
    names.map((_, k) => k),
    names,
  );
  const scales = getColumnScales(data);
  const scaled = scaleChoiceData(data, scales);
  assertNotCollinear(scaled, names);
  const scaling = { factor: scales, offset: new Float64Array(K) };
  const beta = Float64Array.from(opts.start, (v, k) => v * scales[k]);
  const grad = new Float64Array(K);
  const hess = new Float64Array(K * K);
  const trial = new Float64Array(K);
  let ll = evaluateMnl(scaled, beta, grad, hess);
  let iterations = 0;
  let status: ConvergenceStatus = 'iteration_limit';
  let measures: ConvergenceMeasures;
  for (;;) {
    const analysis = analyseInformation(
      hess.map((v) => -v),
      K,
    );
    const step = multiply(analysis.inverse, grad);
    measures = measureConvergence(grad, step, beta, ll);
    if (analysis.positiveDefinite && passesConvergence(measures, opts)) {
      status = 'converged';
      // One more full Newton step costs nothing and, by quadratic convergence, leaves an error
      // of order decrement² (Boyd & Vandenberghe 2004 §9.5.3).
      for (let k = 0; k < K; k++) trial[k] = beta[k] + step[k];
      const next = evaluateMnl(scaled, trial, null, null);
      // Near the optimum LL changes below its rounding error: accept ties within it.
      if (next >= ll - 1e-12 * Math.abs(ll)) {
        beta.set(trial);
        ll = evaluateMnl(scaled, beta, grad, hess);
      }
      break;
    }
    if (iterations >= opts.maxIterations || !Number.isFinite(ll)) break;
    iterations++;
    let next = -Infinity;
    for (let lambda = 1, halvings = 0; halvings < 40; halvings++, lambda /= 2) {
      for (let k = 0; k < K; k++) trial[k] = beta[k] + lambda * step[k];
      next = evaluateMnl(scaled, trial, null, null);
      if (Number.isFinite(next) && next > ll) break;
    }
    if (!(Number.isFinite(next) && next > ll)) {
      status = 'stalled';
      break;
    }
    beta.set(trial);
    ll = evaluateMnl(scaled, beta, grad, hess);
  }
  if (!Number.isFinite(ll))
    throw new NonIdentifiedError('the log-likelihood became NaN or infinite during estimation');
  const warnings: EstimationWarning[] = [];
  const extreme = getExtremeTasks(scaled, beta);
  if (status !== 'converged' || extreme.length > 0) {
    const separation = await findSeparation(scaled);
    if (separation) throw separationError(data, separation, names);
  }
  if (extreme.length > 0)
    warnings.push({
      code: 'extreme_tasks',
      message: `${extreme.length} task${extreme.length > 1 ? 's are' : ' is'} predicted with near certainty at the estimate (a utility difference above 30); the estimate exists (the data are not separated), but these choices carry little information and the coefficients may be large.`,
      tasks: describeTasks(data, extreme),
    });
  const N = data.taskStart.length - 1;
  const scores = new Float64Array(N * K);
  evaluateMnl(scaled, beta, null, null, scores);
  const inference = computeInference({
    names,
    information: hess.map((v) => -v),
    scores,
    respondents: N,
    choice: opts.covariance,
    scaling,
  });
  const estimates = beta.map((b, k) => b / scales[k]);
  const gradient = gradientToUser(scaling, grad);
  const loglikNull = computeNullLoglik(data);
  const T = data.altCount.length;
  return {
    model: 'mnl',
    names,
    estimates,
    se: inference.se,
    robustSe: inference.robustSe,
    inference,
    loglik: ll,
    loglikNull,
    iterations,
    converged: status === 'converged',
    status,
    measures,
    gradient,
    gradientNorm: Math.hypot(...gradient),
    respondents: N,
    observations: T,
    ...computeFitStatistics(ll, loglikNull, K, T),
    hitRate: computeMnlHitRate(data, estimates),
    holdoutHitRate: opts.holdout ? computeMnlHitRate(opts.holdout, estimates) : null,
    warnings: [...warnings, ...inference.warnings],
  };
}

function separationError(
  data: ChoiceData,
  separation: { direction: Float64Array; tasks: number[] },
  names: string[],
): NonIdentifiedError {
  const involved = names.filter((_, k) => Math.abs(separation.direction[k]) > 1e-6);
  const tasks = describeTasks(data, separation.tasks, 5);
  const more = separation.tasks.length > 5 ? ` and ${separation.tasks.length - 5} more` : '';
  return new NonIdentifiedError(
    `not identified: perfect prediction (separation) — ${involved.join(', ')} ${involved.length > 1 ? 'together predict' : 'predicts'} the choice in ${separation.tasks.length} task${separation.tasks.length > 1 ? 's' : ''} (${tasks.join('; ')}${more}) without being contradicted in any task, so the likelihood keeps rising as the coefficient${involved.length > 1 ? 's grow' : ' grows'} without bound`,
    involved,
  );
}
