/**
 * Welfare of a what-if scenario for the Shares section: the compensating variation against a
 * choice set holding only the status quo (shared/engine/shares/welfare.ts, log-sum formula).
 * MNL: the formula at the estimates, with a Krinsky & Robb (1986) interval from the run's
 * covariance. Mixed logit and HB: each respondent's value from their conditional (posterior)
 * means; latent class: each class's value weighted by the respondent's class probabilities;
 * then averaged over respondents, with an interval from resampling respondents (it shows how
 * much the average depends on who answered). For a mixed logit the estimates' covariance gives
 * a second figure: the population mean of the same formula over the model's taste
 * distribution, with a Krinsky & Robb interval (population-welfare.ts). Recomputing every
 * respondent's profile for each parameter draw would be the conditional counterpart; it needs
 * the choice data and an estimation worker, so the screen says which interval is which.
 */
import { createPrng } from '../engine/draws/prng';
import { createMixedLogitLayout } from '../engine/estimation/mixed-logit-layout';
import { computePopulationWelfare } from '../engine/estimation/population-welfare';
import { propagateUncertainty, quantile } from '../engine/estimation/propagate-uncertainty';
import { computeCompensatingVariation, meanOfFinite } from '../../shared/engine/shares/welfare';
import type { ShareMethod, ShareWelfare } from '../../shared/schemas/shares';
import type { PreparedShareModel, ScenarioShares } from '../../shared/engine/shares/share-model';
import type { RunContext } from './tastes/run-context';
import { covarianceOf, estimateNamesOf, shareSeedOf } from './shares/share-model';

const RESAMPLES = 1000;
const KR_DRAWS = 2000;
/** Population welfare: taste draws per parameter draw, and parameter draws (≈30 ms together). */
const POPULATION_DRAWS = 1000;
const POPULATION_KR_DRAWS = 500;

export type WelfareScenario = {
  /** Coded scenario, J × K, the status quo last when included. */
  rows: Float64Array;
  alternativeCount: number;
  /** The status quo's name when the scenario includes it, else null. */
  baseline: string | null;
  /** Where the coefficients come from (share-betas.ts). */
  method: ShareMethod;
  /** (N·D) × K coefficients: D vectors per respondent, or the estimates once (N = D = 1). */
  betas: Float64Array;
  respondents: number;
  vectorsPerRespondent: number;
  /** N × D weights of each respondent's vectors (latent class probabilities); default 1/D. */
  weights?: Float64Array;
};

export type WelfareOutcome = { welfare: ShareWelfare | null; welfareNote: string | null };

type PopulationPart = Pick<ShareWelfare, 'population' | 'populationNote'>;

/** The mixed logit's population-mean welfare with its interval from the estimates' covariance. */
function populationWelfareOf(ctx: RunContext, rows: Float64Array, J: number): PopulationPart {
  const spec = ctx.spec;
  if (spec.model !== 'mixed')
    return {
      population: null,
      populationNote:
        ctx.run.model === 'hb'
          ? 'Posterior draws are not kept, so the interval resamples respondents.'
          : null,
    };
  const layout = createMixedLogitLayout(
    { columns: spec.coefficients.map((c) => c.column ?? c.name) },
    spec.coefficients,
    spec.correlated,
  );
  const byName = new Map((ctx.results.estimates ?? []).map((e) => [e.name, e.estimate]));
  const theta = Float64Array.from(layout.names, (n) => byName.get(n) ?? NaN);
  if (!theta.every(Number.isFinite))
    return { population: null, populationNote: 'The run does not list every estimate.' };
  const out = computePopulationWelfare({
    layout,
    theta,
    covariance: covarianceOf(ctx, layout.names),
    alternativeCount: J,
    alternatives: rows,
    baseline: J - 1,
    cost: spec.coefficients.findIndex((c) => c.name === spec.cost),
    draws: { type: spec.draws.type, count: POPULATION_DRAWS, seed: spec.draws.seed },
    parameterDraws: POPULATION_KR_DRAWS,
  });
  if (!out.estimate) return { population: null, populationNote: out.reason };
  const e = out.estimate;
  return {
    population: { mean: e.estimate, lower: e.lower, upper: e.upper },
    populationNote:
      e.lower === null
        ? 'The run has no usable covariance of its estimates, so this figure has no interval.'
        : null,
  };
}

const note = (welfareNote: string): WelfareOutcome => ({ welfare: null, welfareNote });

export function computeShareWelfare(ctx: RunContext, s: WelfareScenario): WelfareOutcome {
  const fixed = ctx.definition.fixedAlternative;
  if (!fixed) return note('The study has no status quo or opt-out to compare the scenario with.');
  if (!s.baseline) return note(`Include “${fixed.label}” to compare the scenario with it.`);
  if (!ctx.spec.cost) return note('The run has no cost coefficient, so there is no money measure.');
  if (ctx.spec.space === 'wtp')
    return note('Welfare is computed from preference-space runs; this run is in WTP space.');
  const names = ctx.spec.coefficients.map((c) => c.name);
  const cost = names.indexOf(ctx.spec.cost);
  const costAttribute = ctx.definition.attributes.find((a) => a.isCost);
  const base = {
    coefficients: names.length,
    alternativeCount: s.alternativeCount,
    alternatives: s.rows,
    baseline: s.alternativeCount - 1,
    cost,
  };
  const common = {
    baseline: s.baseline,
    money: costAttribute?.name ?? ctx.spec.cost,
    unit: costAttribute?.unit?.trim() ?? '',
    population: null,
    populationNote: null,
  };
  const seed = shareSeedOf(ctx);
  const D = s.vectorsPerRespondent;
  const perVector = computeCompensatingVariation({
    ...base,
    respondents: s.respondents * D,
    betas: s.betas,
  });
  // A respondent's value: the weighted mean over their vectors (latent class: E_c[CV_c]);
  // without a money metric in any of them (a cost coefficient not negative), none.
  const perRespondent = new Float64Array(s.respondents);
  for (let n = 0; n < s.respondents; n++) {
    let sum = 0;
    for (let d = 0; d < D; d++)
      sum += (s.weights ? s.weights[n * D + d] : 1 / D) * perVector[n * D + d];
    perRespondent[n] = sum;
  }
  if (s.method === 'point_estimates') {
    if (!(perRespondent[0] === perRespondent[0]))
      return note('The cost coefficient is not negative, so there is no money measure.');
    const cv = (theta: Float64Array) =>
      computeCompensatingVariation({ ...base, respondents: 1, betas: theta });
    const [r] = propagateUncertainty(cv, s.betas, covarianceOf(ctx, estimateNamesOf(ctx)), {
      draws: KR_DRAWS,
      seed,
    });
    return {
      welfare: {
        ...common,
        mean: r.estimate,
        lower: r.lower,
        upper: r.upper,
        interval: r.lower === null ? null : 'krinsky_robb',
        respondents: ctx.results.respondents,
        withheld: 0,
      },
      welfareNote: null,
    };
  }
  const { mean, count, left } = meanOfFinite(perRespondent);
  if (count === 0) return note('No respondent has a negative cost coefficient.');
  const values = perRespondent.filter(Number.isFinite);
  const prng = createPrng(seed, 0x77656c66);
  const means = new Float64Array(RESAMPLES);
  for (let b = 0; b < RESAMPLES; b++) {
    let sum = 0;
    for (let i = 0; i < count; i++) sum += values[prng.nextUint32() % count];
    means[b] = sum / count;
  }
  means.sort();
  return {
    welfare: {
      ...common,
      ...populationWelfareOf(ctx, s.rows, s.alternativeCount),
      mean,
      lower: quantile(means, 0.025),
      upper: quantile(means, 0.975),
      interval: 'respondent_resampling',
      respondents: count,
      withheld: left,
    },
    welfareNote: null,
  };
}

/** Welfare of a simulated scenario from the prepared share model it was simulated with. */
export function computeScenarioWelfare(
  ctx: RunContext,
  prepared: Pick<PreparedShareModel, 'model' | 'betas' | 'weights'>,
  shares: Pick<ScenarioShares, 'rows' | 'names' | 'baseline'>,
): WelfareOutcome {
  return computeShareWelfare(ctx, {
    rows: shares.rows,
    alternativeCount: shares.names.length,
    baseline: shares.baseline,
    method: prepared.model.method,
    betas: prepared.betas,
    respondents: prepared.model.respondents,
    vectorsPerRespondent: prepared.model.vectors,
    weights: prepared.weights,
  });
}
