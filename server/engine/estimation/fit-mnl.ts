/**
 * Multinomial (conditional) logit by Newton-Raphson with analytic gradient and Hessian and
 * step halving (Train 2009 §8.3.1), classical standard errors from the inverse information and
 * respondent-clustered robust (sandwich) standard errors without finite-sample correction
 * (White 1982; the "cluster" variance of Lin & Wei 1989). Stops on NaN; detects columns that
 * never vary and perfect prediction (coefficients diverging while LL → 0, Albert & Anderson 1984).
 */
import { getDiagonalSqrt, invertMatrix, sandwich } from '../linalg/invert-matrix';
import type { ChoiceData } from './choice-data';
import { assertColumnsVary, getMaxAbsUtilityDifference } from './check-identification';
import { EstimationOptionsError, NonIdentifiedError } from './estimation-errors';
import { computeFitStatistics, computeNullLoglik, type FitStatistics } from './fit-statistics';
import { evaluateMnl } from './mnl-likelihood';
import { computeMnlHitRate } from './mnl-hit-rate';

export interface MnlOptions {
  /** Newton iterations allowed (default 100). */
  maxIterations?: number;
  /** Stop when the Newton decrement g'H⁻¹g falls below this (default 1e-12). */
  tolerance?: number;
  /** Starting coefficients (default zeros). */
  start?: ArrayLike<number>;
  /** Holdout tasks for an out-of-sample hit rate. */
  holdout?: ChoiceData | null;
}

export interface CheckedMnlOptions {
  maxIterations: number;
  tolerance: number;
  start: Float64Array;
  holdout: ChoiceData | null;
}

export interface MnlResult extends FitStatistics {
  model: 'mnl';
  names: string[];
  estimates: Float64Array;
  se: Float64Array;
  robustSe: Float64Array;
  /** K×K row-major inverse information. */
  covariance: Float64Array;
  robustCovariance: Float64Array;
  loglik: number;
  loglikNull: number;
  iterations: number;
  converged: boolean;
  /** Euclidean norm of the gradient at the estimate. */
  gradientNorm: number;
  respondents: number;
  observations: number;
  hitRate: number;
  holdoutHitRate: number | null;
}

/** Fills defaults and validates MNL options before any numerics; throws EstimationOptionsError. */
export function checkMnlOptions(data: ChoiceData, options: MnlOptions = {}): CheckedMnlOptions {
  const K = data.columns.length;
  const maxIterations = options.maxIterations ?? 100;
  const tolerance = options.tolerance ?? 1e-12;
  if (!Number.isInteger(maxIterations) || maxIterations < 1) {
    throw new EstimationOptionsError('maxIterations must be a positive integer', 'maxIterations');
  }
  if (!(tolerance > 0))
    throw new EstimationOptionsError('tolerance must be a positive number', 'tolerance');
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
  const holdout = options.holdout ?? null;
  if (holdout && holdout.columns.join('\u0000') !== data.columns.join('\u0000')) {
    throw new EstimationOptionsError(
      'holdout data must have the same columns as the estimation data',
      'holdout',
    );
  }
  return { maxIterations, tolerance, start, holdout };
}

/** Fits the MNL with every data column as one coefficient. */
export function fitMnl(data: ChoiceData, options: MnlOptions = {}): MnlResult {
  const opts = checkMnlOptions(data, options);
  const K = data.columns.length;
  const names = [...data.columns];
  assertColumnsVary(
    data,
    names.map((_, k) => k),
    names,
  );
  const beta = Float64Array.from(opts.start);
  const grad = new Float64Array(K);
  const hess = new Float64Array(K * K);
  const trial = new Float64Array(K);
  let ll = evaluateMnl(data, beta, grad, hess);
  let iterations = 0;
  let converged = false;
  while (iterations < opts.maxIterations && Number.isFinite(ll)) {
    const info = negate(hess);
    const infoInv = invertMatrix(info, K);
    if (!infoInv && getMaxAbsUtilityDifference(data, beta) > 35) throw separationError(beta, names);
    if (!infoInv)
      throw new NonIdentifiedError(
        `not identified: the information matrix is singular (collinear columns among ${names.join(', ')})`,
        names,
      );
    const step = new Float64Array(K);
    let decrement = 0;
    for (let a = 0; a < K; a++) {
      for (let b = 0; b < K; b++) step[a] += infoInv[a * K + b] * grad[b];
      decrement += step[a] * grad[a];
    }
    iterations++;
    let lambda = 1;
    let next = -Infinity;
    for (let halvings = 0; halvings < 40; halvings++, lambda /= 2) {
      for (let k = 0; k < K; k++) trial[k] = beta[k] + lambda * step[k];
      next = evaluateMnl(data, trial, null, null);
      if (Number.isFinite(next) && next >= ll - 1e-12 * Math.abs(ll)) break;
    }
    if (!(next >= ll - 1e-12 * Math.abs(ll))) break;
    beta.set(trial);
    ll = evaluateMnl(data, beta, grad, hess);
    // The Newton step is always taken, so the tolerance bounds the error left after it.
    if (decrement < opts.tolerance) {
      converged = true;
      break;
    }
    if (getMaxAbsUtilityDifference(data, beta) > 35 && ll > -1e-6 * data.altCount.length) {
      throw separationError(beta, names);
    }
  }
  if (!Number.isFinite(ll))
    throw new NonIdentifiedError('the log-likelihood became NaN or infinite during estimation');
  // Probabilities within e^-35 of 0 or 1 mean (quasi-)separation even if Newton stopped moving.
  if (getMaxAbsUtilityDifference(data, beta) > 35) throw separationError(beta, names);
  const covariance = invertMatrix(negate(hess), K);
  if (!covariance)
    throw new NonIdentifiedError(
      'not identified: the information matrix is singular at the estimate',
      names,
    );
  const N = data.taskStart.length - 1;
  const scores = new Float64Array(N * K);
  evaluateMnl(data, beta, null, null, scores);
  const robustCovariance = sandwich(covariance, outerProductSum(scores, N, K), K);
  const loglikNull = computeNullLoglik(data);
  const T = data.altCount.length;
  return {
    model: 'mnl',
    names,
    estimates: beta,
    se: getDiagonalSqrt(covariance, K),
    robustSe: getDiagonalSqrt(robustCovariance, K),
    covariance,
    robustCovariance,
    loglik: ll,
    loglikNull,
    iterations,
    converged,
    gradientNorm: Math.hypot(...grad),
    respondents: N,
    observations: T,
    ...computeFitStatistics(ll, loglikNull, K, T),
    hitRate: computeMnlHitRate(data, beta),
    holdoutHitRate: opts.holdout ? computeMnlHitRate(opts.holdout, beta) : null,
  };
}

function negate(m: Float64Array): Float64Array {
  return m.map((x) => -x);
}

/** Σ_n s_n s_n' for the N×P score rows (the "meat" of the sandwich). */
export function outerProductSum(scores: Float64Array, N: number, P: number): Float64Array {
  const out = new Float64Array(P * P);
  for (let n = 0; n < N; n++)
    for (let a = 0; a < P; a++) {
      const sa = scores[n * P + a];
      for (let b = 0; b < P; b++) out[a * P + b] += sa * scores[n * P + b];
    }
  return out;
}

function separationError(beta: Float64Array, names: string[]): NonIdentifiedError {
  let worst = 0;
  for (let k = 1; k < beta.length; k++) if (Math.abs(beta[k]) > Math.abs(beta[worst])) worst = k;
  return new NonIdentifiedError(
    `not identified: perfect prediction (separation) — the coefficients diverge (largest: ${names[worst]}); some attribute or combination predicts every choice`,
    [names[worst]],
  );
}
