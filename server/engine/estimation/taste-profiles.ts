/**
 * Individual taste profiles (Revelt & Train 2000; Train 2009 ch. 11): for respondent n,
 * E[β | y_n] ≈ Σ_r w_r β_r and Var[β | y_n] ≈ Σ_r w_r β_r² − E², with β_r drawn from the
 * estimated population distribution and w_r ∝ Π_t P(y_nt | β_r); the conditional mean of each
 * WTP ratio −β_k/β_cost (ratio per draw, then weighted); and the effective number of draws
 * 1/Σ_r w_r² (Kish's effective sample size) as a diagnostic. Profile draws are separate from
 * estimation draws (own count and seed). Profiles are shrunk toward the population and
 * uncertain with few tasks: always show the conditional SD beside the mean.
 */
import type { DrawsType } from '../draws/uniform-draws';
import type { ChoiceData } from './choice-data';
import { EstimationCancelledError, EstimationOptionsError } from './estimation-errors';
import { createMixedLogitKernel } from './mixed-logit-kernel';
import type { MixedLogitLayout } from './mixed-logit-layout';
import { getPopulationMoments, type PopulationMoment } from './population-moments';
import { createStandardVariates } from './standard-variates';

export interface TasteProfileOptions {
  /** Draws per respondent (default 2000). */
  count?: number;
  /** Default 'halton' (scrambled). */
  type?: DrawsType;
  /** Default 7 (differs from the estimation default on purpose). */
  seed?: number;
  /** Scramble Halton digits / shift Sobol points (default true). */
  scrambled?: boolean;
  /** Cost coefficient name: adds conditional WTP means. */
  cost?: string;
  /** Checked before each chunk of respondents; a fired signal throws EstimationCancelledError. */
  signal?: AbortSignal;
}

export interface TasteProfile {
  respondent: string;
  mean: Record<string, number>;
  sd: Record<string, number>;
  wtp?: Record<string, number>;
  effectiveDraws: number;
}

export interface TasteProfilesResult {
  profiles: TasteProfile[];
  population: PopulationMoment[];
  draws: { type: DrawsType; count: number; seed: number; scrambled: boolean };
}

const CHUNK = 64;

/** Conditional means, SDs and WTP of every respondent in `data` at the estimates θ. */
export function computeTasteProfiles(
  data: ChoiceData,
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
  options: TasteProfileOptions = {},
): TasteProfilesResult {
  const R = options.count ?? 2000;
  if (!Number.isInteger(R) || R < 1)
    throw new EstimationOptionsError('profile draws must be a positive integer', 'profileDraws');
  const draws = {
    type: options.type ?? ('halton' as DrawsType),
    count: R,
    seed: options.seed ?? 7,
    scrambled: options.scrambled ?? true,
  };
  const cost =
    options.cost === undefined ? -1 : layout.coefficients.findIndex((c) => c.name === options.cost);
  if (cost < 0 && options.cost !== undefined)
    throw new EstimationOptionsError(
      `cost coefficient ${options.cost} is not in the model`,
      'cost',
    );
  if (theta.length !== layout.P)
    throw new EstimationOptionsError(`theta must have ${layout.P} values`, 'theta');
  const thetaArray = Float64Array.from(theta);
  const { K } = layout;
  const N = data.taskStart.length - 1;
  const betas = new Float64Array(K * R);
  const w = new Float64Array(R);
  const profiles: TasteProfile[] = [];
  for (let first = 0; first < N; first += CHUNK) {
    if (options.signal?.aborted) throw new EstimationCancelledError();
    const count = Math.min(CHUNK, N - first);
    const variates = createStandardVariates(layout, draws, first, count);
    const kernel = createMixedLogitKernel(data, layout, variates, R, first, count);
    for (let n = 0; n < count; n++) {
      kernel.simulateRespondent(n, thetaArray, betas, w);
      const mean: Record<string, number> = {};
      const sd: Record<string, number> = {};
      const wtp: Record<string, number> = {};
      let sumW2 = 0;
      for (let r = 0; r < R; r++) sumW2 += w[r] * w[r];
      for (let k = 0; k < K; k++) {
        let m1 = 0;
        let ratio = 0;
        let constant = true;
        for (let r = 0; r < R; r++) {
          const b = betas[k * R + r];
          m1 += w[r] * b;
          if (b !== betas[k * R]) constant = false;
          if (cost >= 0) ratio -= (w[r] * b) / betas[cost * R + r];
        }
        // Two passes (Σ w (b − m)², not Σ w b² − m²): no cancellation, and exactly 0 for a
        // coefficient that is the same in every draw (a fixed one).
        let m2 = 0;
        if (!constant) for (let r = 0; r < R; r++) m2 += w[r] * (betas[k * R + r] - m1) ** 2;
        const name = layout.coefficients[k].name;
        mean[name] = constant ? betas[k * R] : m1;
        sd[name] = Math.sqrt(m2);
        if (cost >= 0 && k !== cost) wtp[name] = ratio;
      }
      profiles.push({
        respondent: data.respondentIds[first + n],
        mean,
        sd,
        ...(cost >= 0 ? { wtp } : {}),
        effectiveDraws: 1 / sumW2,
      });
    }
  }
  return { profiles, population: getPopulationMoments(layout, thetaArray), draws };
}
