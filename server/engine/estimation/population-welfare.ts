/**
 * Population-mean compensating variation of a scenario under a panel mixed logit, with an
 * interval from the estimates' covariance. For population parameters θ,
 *   W(θ) = E_β[ CV(β) ] = ∫ [ ln Σ_j exp(x_j′β) − x_sq′β ] / (−β_cost) f(β | θ) dβ
 * (the log-sum formula of Small & Rosen 1981 per taste vector, shared/engine/shares/welfare.ts,
 * averaged over the model's taste distribution; Train 2009, *Discrete Choice Methods with
 * Simulation*, 2nd ed., §3.5 and ch. 6). The integral is simulated with R fixed quasi-random
 * draws (the same draws at every θ, so W is smooth in θ), and its interval comes from
 * Krinsky & Robb (1986) draws θ ~ N(θ̂, V) through propagate-uncertainty.ts, with the delta
 * method beside it.
 * The mean exists only when the cost coefficient keeps its sign in the population (fixed or
 * lognormal): with a normal cost, 1/β_cost has no mean (Daly, Hess & Train 2012,
 * Transportation 39:19-31), so the figure is withheld with the reason.
 */
import { computeCompensatingVariation } from '../../../shared/engine/shares/welfare';
import type { DrawsType } from '../draws/uniform-draws';
import { canCrossZero, getCoefficientDistribution, mean } from './coefficient-distributions';
import { fillCoefficientDraws } from './coefficient-draws';
import type { MixedLogitLayout } from './mixed-logit-layout';
import { propagateUncertainty, type PropagatedEstimate } from './propagate-uncertainty';
import { createStandardVariates, getDrawStride } from './standard-variates';

export interface PopulationWelfareInput {
  layout: MixedLogitLayout;
  /** Estimates in layout order (layout.names) and their covariance (P × P), if known. */
  theta: Float64Array;
  covariance: Float64Array | null;
  /** J alternatives of the scenario, row-major J × K, in the layout's coefficient order. */
  alternativeCount: number;
  alternatives: Float64Array;
  /** Row of the status quo among the alternatives; column of the cost coefficient. */
  baseline: number;
  cost: number;
  /** Simulation draws of the taste distribution (R) and Krinsky–Robb draws of θ. */
  draws: { type: DrawsType; count: number; seed: number };
  parameterDraws: number;
}

export type PopulationWelfare =
  { estimate: PropagatedEstimate; reason: null } | { estimate: null; reason: string };

export function computePopulationWelfare(input: PopulationWelfareInput): PopulationWelfare {
  const { layout, theta, cost } = input;
  const c = getCoefficientDistribution(layout, theta, cost);
  if (canCrossZero(c))
    return {
      estimate: null,
      reason:
        'The cost coefficient reaches zero in the population, so the population mean of the money measure does not exist (use a lognormal or fixed cost).',
    };
  if (mean(c) > 0)
    return {
      estimate: null,
      reason: 'The cost coefficient is positive, so there is no money measure.',
    };
  const { K } = layout;
  const R = input.draws.count;
  const stride = getDrawStride(R);
  const variates = createStandardVariates(layout, input.draws, 0, 1);
  const byCoefficient = new Float64Array(K * R);
  const byDraw = new Float64Array(R * K);
  const welfareAt = (x: Float64Array): Float64Array => {
    fillCoefficientDraws(layout, x, variates, 0, stride, R, byCoefficient);
    for (let k = 0; k < K; k++)
      for (let r = 0; r < R; r++) byDraw[r * K + k] = byCoefficient[k * R + r];
    const cv = computeCompensatingVariation({
      respondents: R,
      coefficients: K,
      betas: byDraw,
      alternativeCount: input.alternativeCount,
      alternatives: input.alternatives,
      baseline: input.baseline,
      cost,
    });
    // A θ draw under which some tastes have a cost coefficient of the wrong sign has no
    // population mean: NaN, which the interval then reports as unknown rather than biased.
    let sum = 0;
    for (let r = 0; r < R; r++) sum += cv[r];
    return Float64Array.of(sum / R);
  };
  const [estimate] = propagateUncertainty(welfareAt, theta, input.covariance, {
    draws: input.parameterDraws,
    seed: input.draws.seed,
  });
  return { estimate, reason: null };
}
