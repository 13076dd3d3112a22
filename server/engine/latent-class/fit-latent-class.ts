/**
 * Latent class logit (Kamakura & Russell 1989; Greene & Hensher 2003; Train 2009, §14.3):
 * P(y_n) = Σ_c π_nc Π_t P(y_nt | β_c), class-specific MNL coefficients, membership by an MNL on
 * background answers, estimated by EM from several starts per number of classes
 * (fit-class-count.ts). With a range of class counts every count is fitted and reported (LL,
 * parameters, AIC, BIC, CAIC = −2LL + P(ln n + 1), Bozdogan 1987, n = choice tasks as for the
 * other models) and the lowest BIC is used. An empty class or a failed fit ends the run with the
 * reason, never with a silent answer.
 */
import type { ChoiceData } from '../estimation/choice-data';
import { assertColumnsVary } from '../estimation/check-identification';
import { EstimationCancelledError, EstimationFailedError } from '../estimation/estimation-errors';
import { fitMnl } from '../estimation/fit-mnl';
import {
  computeFitStatistics,
  computeNullLoglik,
  type FitStatistics,
} from '../estimation/fit-statistics';
import { selectColumns } from '../estimation/select-columns';
import {
  checkLatentClassOptions,
  type CheckedLatentClassOptions,
  type LatentClassOptions,
} from './check-latent-class-options';
import { fitClassCount, type ClassCountFit } from './fit-class-count';
import { computeClassMixtureHitRate } from './latent-class-hit-rates';
import { computePosteriors } from './latent-class-state';
import { createMembershipDesign } from './membership-model';
import { summarizeLatentClass, type LatentClassSummary } from './summarize-latent-class';
import type { EstimationWarning } from '../estimation/estimation-warnings';

/** Why standard errors of the chosen model are missing, if any are. */
function describeStandardErrorProblems(fit: ClassCountFit): EstimationWarning[] {
  if (fit.runOff.length > 0) {
    const names = [...new Set(fit.runOff.map((r) => r.name))];
    const list = fit.runOff
      .map((r) => `${r.name} in class ${r.class} (coefficient ${r.estimate.toPrecision(3)})`)
      .join(', ');
    return [
      {
        code: 'membership_separated',
        message: `The class membership model is quasi-separated on ${names.join(', ')}: the answers sort respondents into a class almost with certainty, so ${list} ${fit.runOff.length === 1 ? 'has' : 'have'} no finite estimate and no standard error, and the class shares have no standard errors. The other standard errors hold ${fit.runOff.length === 1 ? 'it' : 'them'} at the value shown. Leave ${names.length === 1 ? 'this background answer' : 'these background answers'} out of the membership model, merge answer options, or use fewer classes.`,
        parameters: fit.runOff.map((r) => `class${r.class}.membership.${r.name}`),
      },
    ];
  }
  if (fit.C > 1 && !fit.covariance)
    return [
      {
        code: 'no_standard_errors',
        message:
          'The observed information matrix is singular at the estimates, so no standard errors are given: some parameters are not identified by these data (for example two classes with nearly the same coefficients). Try fewer classes.',
      },
    ];
  return [];
}

export interface LatentClassProgress {
  classes: number;
  start: number;
  starts: number;
}

export interface LatentClassHooks {
  onProgress?: (progress: LatentClassProgress) => void;
  /** Polled between EM iterations; true stops the fit with EstimationCancelledError. */
  shouldStop?: () => boolean;
}

export interface ClassCountRow {
  classes: number;
  loglik: number | null;
  parameters: number;
  aic: number | null;
  bic: number | null;
  caic: number | null;
  /** Starts whose EM reached the best start's LL (within 0.01), of those run. */
  bestStarts: number;
  starts: number;
  reason: string | null;
}

export interface LatentClassResult extends LatentClassSummary, FitStatistics {
  classCount: number;
  table: ClassCountRow[];
  loglik: number;
  loglikNull: number;
  loglikMnl: number;
  caic: number;
  parameters: number;
  respondents: number;
  observations: number;
  iterations: number;
  converged: boolean;
  /** LL after every EM iteration of the chosen model's best start. */
  trace: number[];
  hitRate: number;
  holdoutHitRate: number | null;
  individualHitRate: number;
  individualHoldoutHitRate: number | null;
  /** Problems the analyst must see: run-off membership coefficients, missing SEs. */
  warnings: EstimationWarning[];
  options: Omit<CheckedLatentClassOptions, 'holdout' | 'membership'> & { membership: string[] };
}

export async function fitLatentClass(
  data: ChoiceData,
  options: LatentClassOptions,
  hooks: LatentClassHooks = {},
): Promise<LatentClassResult> {
  const opts = checkLatentClassOptions(data, options);
  const { names } = opts;
  const columns = [...opts.column];
  assertColumnsVary(data, columns, names);
  const selected = selectColumns(data, columns);
  const mnl = await fitMnl(selected);
  const N = selected.taskStart.length - 1;
  const z = createMembershipDesign(N, opts.membership);
  const Mp = 1 + opts.membership.names.length;
  const T = selected.altCount.length;
  const fits: ClassCountFit[] = [];
  for (const C of opts.classes) {
    fits.push(
      fitClassCount(selected, z, Mp, C, mnl, opts, opts.membership.names, {
        onStart: (start) => {
          if (hooks.shouldStop?.()) throw new EstimationCancelledError();
          hooks.onProgress?.({ classes: C, start, starts: opts.starts });
        },
        shouldStop: hooks.shouldStop,
      }),
    );
    if (hooks.shouldStop?.()) throw new EstimationCancelledError();
  }
  const table = fits.map((f): ClassCountRow => {
    const parameters = f.C * names.length + (f.C - 1) * Mp;
    const ll = f.state?.loglik ?? null;
    const best = f.starts.filter(
      (s) => !s.collapsed && Math.abs(s.loglik - f.bestStartLoglik) < 0.01,
    ).length;
    return {
      classes: f.C,
      loglik: ll,
      parameters,
      aic: ll === null ? null : 2 * parameters - 2 * ll,
      bic: ll === null ? null : parameters * Math.log(T) - 2 * ll,
      caic: ll === null ? null : parameters * (Math.log(T) + 1) - 2 * ll,
      bestStarts: best,
      starts: f.starts.length,
      reason: f.reason,
    };
  });
  const usable = fits.filter((f) => f.state);
  if (usable.length === 0)
    throw new EstimationFailedError(
      `the latent class model failed: ${fits[fits.length - 1].reason}`,
    );
  const chosen = usable.reduce((a, b) =>
    table[fits.indexOf(b)].bic! < table[fits.indexOf(a)].bic! ? b : a,
  );
  const state = chosen.state!;
  computePosteriors(selected, z, state);
  const summary = summarizeLatentClass(
    selected,
    z,
    state,
    chosen.covariance,
    names,
    opts.membership.names,
    opts.cost,
  );
  const row = table[fits.indexOf(chosen)];
  const loglikNull = computeNullLoglik(selected);
  const holdout = opts.holdout ? selectColumns(opts.holdout, columns) : null;
  const index = new Map(selected.respondentIds.map((id, n) => [id, n]));
  const K = names.length;
  const C = state.C;
  const rowOf = (source: Float64Array, d: ChoiceData) => (n: number) => {
    const m = index.get(d.respondentIds[n]);
    return m === undefined ? null : source.subarray(m * C, (m + 1) * C);
  };
  const { holdout: _h, membership, ...kept } = opts;
  return {
    ...summary,
    warnings: describeStandardErrorProblems(chosen),
    classCount: C,
    table,
    loglik: state.loglik,
    loglikNull,
    loglikMnl: mnl.loglik,
    caic: row.caic!,
    parameters: row.parameters,
    respondents: N,
    observations: T,
    ...computeFitStatistics(state.loglik, loglikNull, row.parameters, T),
    iterations: chosen.trace.length - 1,
    converged: chosen.converged,
    trace: chosen.trace,
    hitRate: computeClassMixtureHitRate(selected, state.betas, C, K, rowOf(state.pi, selected)),
    holdoutHitRate: holdout
      ? computeClassMixtureHitRate(holdout, state.betas, C, K, rowOf(state.pi, holdout))
      : null,
    individualHitRate: computeClassMixtureHitRate(
      selected,
      state.betas,
      C,
      K,
      rowOf(state.h, selected),
    ),
    individualHoldoutHitRate: holdout
      ? computeClassMixtureHitRate(holdout, state.betas, C, K, rowOf(state.h, holdout))
      : null,
    options: { ...kept, membership: membership.names },
  };
}
