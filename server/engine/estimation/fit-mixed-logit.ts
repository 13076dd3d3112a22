/**
 * Panel mixed logit by simulated maximum likelihood (Train 2009, Discrete Choice Methods with
 * Simulation, ch. 6, 9 and 10), in preference or WTP space (Train & Weeks 2005): on internally
 * scaled columns and parameters (parameter-scaling.ts; the kernel never sees the user's units),
 * BFGS with the analytic simulated gradient from the MNL start plus seeded perturbed starts,
 * each from the inverse BHHH matrix at its start (bhhh-start.ts),
 * then the verdict and a few Newton steps with the real information (refine-estimate.ts), and
 * covariances by inference.ts. Everything is reported in the user's units.
 */
import { createLoglikEvaluator } from '../parallel/create-loglik-evaluator';
import { waitWhileBusy } from '../parallel/fieldwork-yield';
import type { KernelKind } from '../simd/kernel-choice';
import { minimizeBfgs, type BfgsResult } from './bfgs';
import { computeBhhhStart } from './bhhh-start';
import { assertColumnsVary } from './check-identification';
import { checkMixedLogitOptions, type MixedLogitOptions } from './check-mixed-logit-options';
import type { ChoiceData } from './choice-data';
import type { ConvergenceStatus } from './convergence';
import { EstimationCancelledError } from './estimation-errors';
import type { EstimationWarning } from './estimation-warnings';
import { fitMnl } from './fit-mnl';
import { computeFitStatistics, computeNullLoglik } from './fit-statistics';
import { computeInference } from './inference';
import type { MixedLogitLayout } from './mixed-logit-layout';
import type { FittedWithErrors, StartSummary } from './fitted-model';
import { computeMixedHitRate } from './mixed-logit-hit-rate';
import { assertCheckpointFits, type MixedLogitCheckpoint } from './mixed-logit-checkpoint';
import { getMixedLogitStart, perturbStart } from './mixed-logit-start';
import {
  createThetaScaling,
  getColumnScales,
  gradientToUser,
  scaleChoiceData,
  toInternal,
  toUser,
} from './parameter-scaling';
import { refineEstimate } from './refine-estimate';
import { selectColumns } from './select-columns';
import { estimateSecondsLeft } from './time-left';

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

/** Stages after the optimisation, reported so a run never goes silent at the end. */
export type EstimationStage = 'standard_errors' | 'wtp' | 'profiles';

export interface MixedLogitHooks {
  onProgress?: (progress: EstimationProgress) => void;
  /** Called as each stage after the optimisation starts. */
  onStage?: (stage: EstimationStage) => void;
  /** Checked before every evaluation; a fired signal rejects with EstimationCancelledError. */
  signal?: AbortSignal;
  /** Engine notes worth logging (e.g. why the WebAssembly SIMD kernel was not used). */
  onNote?: (note: string) => void;
  /** Where an earlier, interrupted fit of the same data and options stood: go on from there. */
  resume?: MixedLogitCheckpoint;
  /** Called after every BFGS iteration with where the fit stands (the caller picks what to keep). */
  onCheckpoint?: (checkpoint: MixedLogitCheckpoint) => void;
  /**
   * The web process's busy flag (parallel/fieldwork-yield.ts): before every evaluation the fit
   * waits while it is set (and with it the slice threads), and says so in a note. Waiting
   * changes no number of the fit.
   */
  fieldworkBusy?: Int32Array;
}

export interface MixedLogitResult extends FittedWithErrors {
  model: 'mixed';
  layout: MixedLogitLayout;
  /** LL of the MNL used for the starting values. */
  loglikMnl: number;
  evaluations: number;
  newtonSteps: number;
  /** Largest relative disagreement of analytic and finite-difference slopes (null with BHHH). */
  gradientCheck: number | null;
  /** Every start, in start order. */
  starts: StartSummary[];
  /** Number of starts whose LL is within 0.001 of the best. */
  startsAtBest: number;
  draws: { type: string; count: number; seed: number; scrambled: boolean };
  /** Kernel that evaluated the LL: 'simd' (WebAssembly) or 'typescript'. */
  kernel: KernelKind;
}

/** Two starts "reach the same optimum" when their LLs differ by less than this. */
export const SAME_OPTIMUM = 1e-3;

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
  const mnl = await fitMnl(selectColumns(data, [...layout.column]), { covariance: 'classical' });
  const scales = getColumnScales(data);
  const scaled = scaleChoiceData(data, scales);
  const scaling = createThetaScaling(layout, scales);
  const theta0 = opts.start
    ? toInternal(scaling, opts.start)
    : getMixedLogitStart(
        layout,
        Array.from(mnl.estimates, (b, k) => b * scales[layout.column[k]]),
      );
  const tolerances = {
    maxIterations: opts.maxIterations,
    tolerance: opts.tolerance,
    gradientTolerance: opts.gradientTolerance,
  };
  const assertNotCancelled = () => {
    if (hooks.signal?.aborted) throw new EstimationCancelledError();
  };
  const pool = await createLoglikEvaluator(scaled, layout, opts.draws, opts.threads, opts.kernel);
  for (const note of pool.notes) hooks.onNote?.(note);
  // Every evaluation goes through here: a cancel is seen within one evaluation (the
  // standard errors' too), and the evaluation time feeds the time-left estimate.
  let evaluations = 0;
  let evaluationSeconds = 0;
  let waitedMs = 0;
  const waitForFieldwork = () => {
    if (!hooks.fieldworkBusy) return;
    const waited = waitWhileBusy(hooks.fieldworkBusy);
    // One note the first time, so that a slow run says why; the total when the fit ends.
    if (waited > 0 && waitedMs === 0)
      hooks.onNote?.('waiting while respondents keep the web process busy');
    waitedMs += waited;
  };
  const evaluator = {
    ...pool,
    async evaluate(x: Float64Array, g: Float64Array) {
      assertNotCancelled();
      waitForFieldwork();
      const started = performance.now();
      const ll = await pool.evaluate(x, g);
      evaluationSeconds += (performance.now() - started) / 1000;
      evaluations++;
      return ll;
    },
    async evaluateScores(x: Float64Array) {
      assertNotCancelled();
      waitForFieldwork();
      return pool.evaluateScores(x);
    },
  };
  // After BFGS: the standard errors (2P + 1 evaluations for the Hessian, 1 for BHHH) and the
  // taste profiles (about profileDraws/draws evaluations' worth).
  const evaluationsAfter =
    (opts.covariance === 'bhhh' ? 1 : 2 * layout.P + 1) + opts.profileDraws / opts.draws.count;
  try {
    const objective = async (x: Float64Array, g: Float64Array) => {
      const ll = await evaluator.evaluate(x, g);
      for (let p = 0; p < g.length; p++) g[p] = -g[p];
      return Number.isFinite(ll) ? -ll : Infinity;
    };
    const resume = hooks.resume;
    if (resume) assertCheckpointFits(resume, layout.P, opts.starts);
    const runs: BfgsResult[] = resume ? [...resume.finished] : [];
    let scoreEvaluations = 0;
    for (let s = runs.length; s < opts.starts; s++) {
      const x0 = s === 0 ? theta0 : perturbStart(theta0, s, opts.draws.seed);
      const from = resume?.start === s ? (resume.current ?? undefined) : undefined;
      // A resumed start carries its inverse Hessian in its state.
      let initialInverseHessian: Float64Array | undefined;
      if (!from && opts.initialInverseHessian === 'bhhh') {
        const bhhh = await computeBhhhStart(evaluator, x0);
        scoreEvaluations++;
        if (bhhh.note) hooks.onNote?.(`start ${s + 1}: ${bhhh.note}`);
        initialInverseHessian = bhhh.inverseHessian ?? undefined;
      }
      const startedAt = performance.now();
      const firstIteration = from?.iterations ?? 0;
      let initialGradientNorm = NaN;
      const onCheckpoint = hooks.onCheckpoint;
      runs.push(
        await minimizeBfgs(objective, x0, {
          ...tolerances,
          signal: hooks.signal,
          resume: from,
          initialInverseHessian,
          onState: onCheckpoint
            ? (state) => onCheckpoint({ start: s, finished: [...runs], current: state })
            : undefined,
          onIteration: (iteration, f, gradientNorm) => {
            // A resumed start measures its pace from the iterations it does itself.
            if (iteration === firstIteration + 1) initialGradientNorm = gradientNorm;
            const secondsLeft = estimateSecondsLeft({
              iteration,
              maxIterations: opts.maxIterations,
              gradientNorm,
              initialGradientNorm,
              tolerance: opts.gradientTolerance,
              secondsPerIteration:
                (performance.now() - startedAt) / 1000 / (iteration - firstIteration),
              secondsPerEvaluation: evaluationSeconds / Math.max(1, evaluations),
              evaluationsAfter,
              startsLeft: opts.starts - s - 1,
            });
            hooks.onProgress?.({ iteration, loglik: -f, gradientNorm, start: s + 1, secondsLeft });
          },
        }),
      );
    }
    assertNotCancelled();
    const best = runs.reduce((a, b) => (b.f < a.f ? b : a));
    hooks.onStage?.('standard_errors');
    const refined = await refineEstimate(
      evaluator,
      best.x,
      tolerances,
      opts.covariance === 'bhhh',
      assertNotCancelled,
    );
    const status: ConvergenceStatus = refined.converged
      ? 'converged'
      : best.reason === 'converged'
        ? 'stalled'
        : best.reason;
    const inference = computeInference({
      names: layout.names,
      information: refined.information,
      scores: refined.scores,
      respondents: evaluator.respondentCount,
      choice: opts.covariance,
      scaling,
    });
    const loglik = refined.loglik;
    const startLoglik = runs.map((r) => -r.f);
    startLoglik[runs.indexOf(best)] = loglik;
    const startsAtBest = startLoglik.filter((ll) => loglik - ll < SAME_OPTIMUM).length;
    const warnings: EstimationWarning[] = [
      ...mnl.warnings.filter((w) => w.code === 'extreme_tasks'),
    ];
    if (startsAtBest < runs.length)
      warnings.push({
        code: 'starts_disagree',
        message: `Only ${startsAtBest} of ${runs.length} starting points reached the best log-likelihood (within ${SAME_OPTIMUM}); the others ended at ${startLoglik
          .filter((ll) => loglik - ll >= SAME_OPTIMUM)
          .map((ll) => ll.toFixed(3))
          .join(', ')}. The likelihood has several local optima: try more starting points.`,
      });
    if (refined.gradientCheck !== null && refined.gradientCheck > 1e-3)
      warnings.push({
        code: 'gradient_check',
        message: `The analytic gradient disagrees with finite differences of the log-likelihood by up to ${(100 * refined.gradientCheck).toFixed(2)} % at the estimate; treat the results with care and report the problem.`,
      });
    const estimates = toUser(scaling, refined.theta);
    const gradient = gradientToUser(scaling, refined.gradient);
    const loglikNull = computeNullLoglik(data);
    const T = data.altCount.length;
    return {
      model: 'mixed',
      layout,
      names: [...layout.names],
      estimates,
      se: inference.se,
      robustSe: inference.robustSe,
      inference,
      loglik,
      loglikNull,
      loglikMnl: mnl.loglik,
      iterations: runs.reduce((a, r) => a + r.iterations, 0),
      evaluations:
        runs.reduce((a, r) => a + r.evaluations, 0) + scoreEvaluations + refined.evaluations,
      converged: status === 'converged',
      status,
      measures: refined.measures,
      gradient,
      gradientNorm: Math.hypot(...gradient),
      newtonSteps: refined.newtonSteps,
      gradientCheck: refined.gradientCheck,
      starts: runs.map((r, i) => ({
        loglik: startLoglik[i],
        status: r === best ? status : r.reason,
        iterations: r.iterations,
      })),
      startsAtBest,
      draws: { ...opts.draws },
      kernel: pool.kernel,
      respondents: data.taskStart.length - 1,
      observations: T,
      ...computeFitStatistics(loglik, loglikNull, layout.P, T),
      hitRate: computeMixedHitRate(scaled, layout, refined.theta, opts.draws),
      holdoutHitRate: opts.holdout
        ? computeMixedHitRate(
            scaleChoiceData(opts.holdout, scales),
            layout,
            refined.theta,
            opts.draws,
          )
        : null,
      warnings: [...warnings, ...inference.warnings],
    };
  } finally {
    if (waitedMs > 0)
      hooks.onNote?.(`waited ${(waitedMs / 1000).toFixed(1)} s in all for fieldwork`);
    await pool.close();
  }
}
