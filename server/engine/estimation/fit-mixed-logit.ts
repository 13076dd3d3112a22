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
import { estimateSecondsLeft } from './time-left';
import { selectColumns } from './select-columns';

export type { MixedLogitOptions } from './check-mixed-logit-options';

export interface EstimationProgress {
  iteration: number;
  loglik: number;
  gradientNorm: number;
  /** 1-based start number when several starts run. */
  start: number;
  /** Estimated seconds until the run's results are ready (time-left.ts). */
  secondsLeft: number;
}

export interface MixedLogitHooks {
  onProgress?: (progress: EstimationProgress) => void;
  /** Checked before every evaluation; a fired signal rejects with EstimationCancelledError. */
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
  // Every evaluation goes through here: a cancel is seen within one evaluation, and the
  // evaluation time feeds the time-left estimate.
  let evaluations = 0;
  let evaluationSeconds = 0;
  const evaluate = async (x: Float64Array, g: Float64Array) => {
    if (hooks.signal?.aborted) throw new EstimationCancelledError();
    const started = performance.now();
    const ll = await evaluator.evaluate(x, g);
    evaluationSeconds += (performance.now() - started) / 1000;
    evaluations++;
    return ll;
  };
  const evaluationsAfter =
    (opts.covariance === 'bhhh' ? 1 : 2 * layout.P + 1) + opts.profileDraws / opts.draws.count;
  try {
    const objective = async (x: Float64Array, g: Float64Array) => {
      const ll = await evaluate(x, g);
      for (let p = 0; p < g.length; p++) g[p] = -g[p];
      return Number.isFinite(ll) ? -ll : Infinity;
    };
    const runs: BfgsResult[] = [];
    for (let s = 0; s < opts.starts; s++) {
      const x0 = s === 0 ? theta0 : perturbStart(theta0, s, opts.draws.seed);
      const startedAt = performance.now();
      let initialGradientNorm = NaN;
      runs.push(
        await minimizeBfgs(objective, x0, {
          maxIterations: opts.maxIterations,
          gradientTolerance: opts.gradientTolerance,
          relativeTolerance: opts.relativeTolerance,
          signal: hooks.signal,
          onIteration: (iteration, f, gradientNorm) => {
            if (iteration === 1) initialGradientNorm = gradientNorm;
            const secondsLeft = estimateSecondsLeft({
              iteration,
              maxIterations: opts.maxIterations,
              gradientNorm,
              initialGradientNorm,
              tolerance: opts.gradientTolerance,
              secondsPerIteration: (performance.now() - startedAt) / 1000 / iteration,
              secondsPerEvaluation: evaluationSeconds / Math.max(1, evaluations),
              evaluationsAfter,
              startsLeft: opts.starts - s - 1,
            });
            hooks.onProgress?.({ iteration, loglik: -f, gradientNorm, start: s + 1, secondsLeft });
          },
        }),
      );
    }
    if (hooks.signal?.aborted) throw new EstimationCancelledError();
    const best = runs.reduce((a, b) => (b.f < a.f ? b : a));
    const theta = best.x;
    // BHHH: the information estimated by the outer product of the per-respondent scores
    // (Berndt, Hall, Hall & Hausman 1974; Train 2009 §8.7), valid at the maximum of a correctly
    // specified likelihood; one evaluation instead of the 2P of the numerical Hessian.
    const scores = await evaluator.evaluateScores(theta);
    const opg = outerProductSum(scores, evaluator.respondentCount, layout.P);
    const information =
      opts.covariance === 'bhhh'
        ? opg
        : (await computeNumericalHessian(evaluate, theta)).map((v) => -v);
    const covariance = invertMatrix(information, layout.P);
    if (!covariance || !covariance.every(Number.isFinite)) {
      throw new NonIdentifiedError(
        'not identified: the Hessian is singular at the estimate (a spread may be zero or parameters collinear)',
        layout.names,
      );
    }
    if (hooks.signal?.aborted) throw new EstimationCancelledError();
    // With BHHH the sandwich B⁻¹·B·B⁻¹ is B⁻¹ itself.
    const robustCovariance =
      opts.covariance === 'bhhh' ? covariance : sandwich(covariance, opg, layout.P);
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
      evaluations: evaluations + 1,
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
