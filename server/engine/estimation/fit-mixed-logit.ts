/**
 * Panel mixed logit by simulated maximum likelihood (Train 2009, Discrete Choice Methods with
 * Simulation, ch. 6, 9 and 10): BFGS with the analytic simulated gradient from MNL starting
 * values, optional extra starts, standard errors from the inverse of a central-difference
 * Hessian of the analytic gradient and robust sandwich standard errors from the outer product
 * of per-respondent scores (Train 2009 §8.7, §10.2).
 */
import { getDiagonalSqrt, invertMatrix, sandwich } from '../linalg/invert-matrix';
import { createLoglikEvaluator } from '../parallel/create-loglik-evaluator';
import type { KernelKind } from '../simd/kernel-choice';
import { minimizeBfgs, type BfgsResult, type BfgsStopReason } from './bfgs';
import { assertColumnsVary } from './check-identification';
import { checkMixedLogitOptions, type MixedLogitOptions } from './check-mixed-logit-options';
import type { ChoiceData } from './choice-data';
import { EstimationCancelledError, NonIdentifiedError } from './estimation-errors';
import { fitMnl, outerProductSum } from './fit-mnl';
import { computeFitStatistics, computeNullLoglik, type FitStatistics } from './fit-statistics';
import type { MixedLogitLayout } from './mixed-logit-layout';
import { computeMixedHitRate } from './mixed-logit-hit-rate';
import { getMixedLogitStart, perturbStart } from './mixed-logit-start';
import { computeNumericalHessian } from './numerical-hessian';
import { selectColumns } from './select-columns';

export type { MixedLogitOptions } from './check-mixed-logit-options';

export interface EstimationProgress {
  iteration: number;
  loglik: number;
  gradientNorm: number;
  /** 1-based start number when several starts run. */
  start: number;
}

export interface MixedLogitHooks {
  onProgress?: (progress: EstimationProgress) => void;
  /** Checked every iteration; a fired signal rejects with EstimationCancelledError. */
  signal?: AbortSignal;
  /** Engine notes worth logging (e.g. why the WebAssembly SIMD kernel was not used). */
  onNote?: (note: string) => void;
}

export interface MixedLogitResult extends FitStatistics {
  model: 'mixed';
  layout: MixedLogitLayout;
  names: string[];
  estimates: Float64Array;
  se: Float64Array;
  robustSe: Float64Array;
  covariance: Float64Array;
  robustCovariance: Float64Array;
  loglik: number;
  loglikNull: number;
  /** LL of the MNL used for the starting values. */
  loglikMnl: number;
  iterations: number;
  evaluations: number;
  converged: boolean;
  convergence: {
    reason: BfgsStopReason;
    gradientNorm: number;
    relativeChange: number;
    iterations: number;
  };
  /** Final LL, convergence flag and iterations of every start, in start order. */
  starts: { loglik: number; converged: boolean; iterations: number }[];
  draws: { type: string; count: number; seed: number; scrambled: boolean };
  /** Kernel that evaluated the LL: 'simd' (WebAssembly) or 'typescript'. */
  kernel: KernelKind;
  respondents: number;
  observations: number;
  hitRate: number;
  holdoutHitRate: number | null;
}

/** Fits the panel mixed logit; respects hooks.signal and reports progress per iteration. */
export async function fitMixedLogit(
  data: ChoiceData,
  options: MixedLogitOptions,
  hooks: MixedLogitHooks = {},
): Promise<MixedLogitResult> {
  const opts = checkMixedLogitOptions(data, options);
  const { layout } = opts;
  const names = layout.coefficients.map((c) => c.name);
  assertColumnsVary(data, [...layout.column], names);
  const mnl = fitMnl(selectColumns(data, [...layout.column]));
  const theta0 = opts.start ?? getMixedLogitStart(layout, mnl.estimates);
  const evaluator = await createLoglikEvaluator(
    data,
    layout,
    opts.draws,
    opts.threads,
    opts.kernel,
  );
  for (const note of evaluator.notes) hooks.onNote?.(note);
  try {
    const objective = async (x: Float64Array, g: Float64Array) => {
      const ll = await evaluator.evaluate(x, g);
      for (let p = 0; p < g.length; p++) g[p] = -g[p];
      return Number.isFinite(ll) ? -ll : Infinity;
    };
    const runs: BfgsResult[] = [];
    for (let s = 0; s < opts.starts; s++) {
      const x0 = s === 0 ? theta0 : perturbStart(theta0, s, opts.draws.seed);
      runs.push(
        await minimizeBfgs(objective, x0, {
          maxIterations: opts.maxIterations,
          gradientTolerance: opts.gradientTolerance,
          relativeTolerance: opts.relativeTolerance,
          signal: hooks.signal,
          onIteration: (iteration, f, gradientNorm) =>
            hooks.onProgress?.({ iteration, loglik: -f, gradientNorm, start: s + 1 }),
        }),
      );
    }
    if (hooks.signal?.aborted) throw new EstimationCancelledError();
    const best = runs.reduce((a, b) => (b.f < a.f ? b : a));
    const theta = best.x;
    const hessian = await computeNumericalHessian((x, g) => evaluator.evaluate(x, g), theta);
    const covariance = invertMatrix(
      hessian.map((v) => -v),
      layout.P,
    );
    if (!covariance || !covariance.every(Number.isFinite)) {
      throw new NonIdentifiedError(
        'not identified: the Hessian is singular at the estimate (a spread may be zero or parameters collinear)',
        layout.names,
      );
    }
    if (hooks.signal?.aborted) throw new EstimationCancelledError();
    const scores = await evaluator.evaluateScores(theta);
    const robustCovariance = sandwich(
      covariance,
      outerProductSum(scores, evaluator.respondentCount, layout.P),
      layout.P,
    );
    const loglik = -best.f;
    const loglikNull = computeNullLoglik(data);
    const T = data.altCount.length;
    return {
      model: 'mixed',
      layout,
      names: [...layout.names],
      estimates: theta,
      se: getDiagonalSqrt(covariance, layout.P),
      robustSe: getDiagonalSqrt(robustCovariance, layout.P),
      covariance,
      robustCovariance,
      loglik,
      loglikNull,
      loglikMnl: mnl.loglik,
      iterations: runs.reduce((a, r) => a + r.iterations, 0),
      evaluations: runs.reduce((a, r) => a + r.evaluations, 0) + 2 * layout.P + 1,
      converged: best.converged,
      convergence: {
        reason: best.reason,
        gradientNorm: best.gradientNorm,
        relativeChange: best.relativeChange,
        iterations: best.iterations,
      },
      starts: runs.map((r) => ({ loglik: -r.f, converged: r.converged, iterations: r.iterations })),
      draws: { ...opts.draws },
      kernel: evaluator.kernel,
      respondents: data.taskStart.length - 1,
      observations: T,
      ...computeFitStatistics(loglik, loglikNull, layout.P, T),
      hitRate: computeMixedHitRate(data, layout, theta, opts.draws),
      holdoutHitRate: opts.holdout
        ? computeMixedHitRate(opts.holdout, layout, theta, opts.draws)
        : null,
    };
  } finally {
    await evaluator.close();
  }
}
