/**
 * Individual taste profiles (Revelt & Train 2000; Train 2009 ch. 11): for respondent n,
 * E[β | y_n] ≈ Σ_r w_r β_r and Var[β | y_n] ≈ Σ_r w_r β_r² − E², with β_r drawn from the
 * estimated population distribution and w_r ∝ Π_t P(y_nt | β_r); the conditional mean of each
 * WTP ratio −β_k/β_cost (ratio per draw, then weighted); and the effective number of draws
 * 1/Σ_r w_r² (Kish's effective sample size) as a diagnostic (profile-moments.ts). Profile
 * draws are separate from estimation draws (own count and seed) and are generated a chunk of
 * respondents at a time, so memory does not grow with the number of respondents. Profiles
 * are shrunk toward the population and uncertain with few tasks: always show the conditional
 * SD beside the mean. computeTasteProfiles runs on the calling thread;
 * server/engine/parallel/parallel-taste-profiles.ts spreads the same work over worker threads.
 */
import type { DrawsType } from '../draws/uniform-draws';
import { createKernelArena } from '../simd/kernel-arena';
import { chooseKernel, type KernelPreference } from '../simd/kernel-choice';
import { getArenaSlice } from '../simd/arena-kernel';
import { createProfileRunner } from '../simd/profile-runner';
import type { ChoiceData } from './choice-data';
import { EstimationCancelledError, EstimationOptionsError } from './estimation-errors';
import type { MixedLogitLayout } from './mixed-logit-layout';
import { getPopulationMoments, type PopulationMoment } from './population-moments';
import { getProfileWidth } from './profile-moments';
import { resolveCostIndex } from './shared-option-checks';

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
  /** Kernel (default 'auto': WebAssembly SIMD when it can run). */
  kernel?: KernelPreference;
  /** Engine notes worth logging (why SIMD was not used). */
  onNote?: (note: string) => void;
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

/** Respondents whose profile draws are held at once. */
export const PROFILE_CHUNK = 64;

/** Fills defaults and validates; throws EstimationOptionsError naming the field. */
export function checkTasteProfileOptions(
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
  options: TasteProfileOptions,
) {
  const R = options.count ?? 2000;
  if (!Number.isInteger(R) || R < 1)
    throw new EstimationOptionsError('profile draws must be a positive integer', 'profileDraws');
  const draws = {
    type: options.type ?? ('halton' as DrawsType),
    count: R,
    seed: options.seed ?? 7,
    scrambled: options.scrambled ?? true,
  };
  const cost = resolveCostIndex(
    layout.coefficients.map((c) => c.name),
    options.cost,
  );
  if (theta.length !== layout.P)
    throw new EstimationOptionsError(`theta must have ${layout.P} values`, 'theta');
  return { draws, cost, theta: Float64Array.from(theta), kernel: options.kernel ?? 'auto' };
}

/** Profile objects of respondents first.. from packed rows (profile-moments.ts layout). */
export function unpackProfiles(
  layout: MixedLogitLayout,
  packed: Float64Array,
  respondentIds: readonly string[],
  first: number,
  withWtp: boolean,
): TasteProfile[] {
  const { K } = layout;
  const width = getProfileWidth(K);
  const names = layout.coefficients.map((c) => c.name);
  const profiles: TasteProfile[] = [];
  for (let i = 0; i * width < packed.length; i++) {
    const at = i * width;
    const mean: Record<string, number> = {};
    const sd: Record<string, number> = {};
    const wtp: Record<string, number> = {};
    names.forEach((name, k) => {
      mean[name] = packed[at + k];
      sd[name] = packed[at + K + k];
      if (!Number.isNaN(packed[at + 2 * K + k])) wtp[name] = packed[at + 2 * K + k];
    });
    profiles.push({
      respondent: respondentIds[first + i],
      mean,
      sd,
      ...(withWtp ? { wtp } : {}),
      effectiveDraws: packed[at + 3 * K],
    });
  }
  return profiles;
}

/** Conditional means, SDs and WTP of every respondent in `data` at the estimates θ. */
export function computeTasteProfiles(
  data: ChoiceData,
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
  options: TasteProfileOptions = {},
): TasteProfilesResult {
  const opts = checkTasteProfileOptions(layout, theta, options);
  const N = data.taskStart.length - 1;
  const chunk = Math.max(1, Math.min(PROFILE_CHUNK, N));
  const arena = createKernelArena(data, layout, opts.draws.count, [
    { first: 0, count: N, variateRespondents: chunk },
  ]);
  const choice = chooseKernel(opts.kernel, layout);
  const runner = createProfileRunner(
    getArenaSlice(arena, 0, {
      columns: data.columns,
      layout,
      draws: opts.draws,
      kind: choice.kind,
    }),
  );
  for (const note of new Set([choice.note, runner.note])) if (note) options.onNote?.(note);
  const width = getProfileWidth(layout.K);
  const packed = new Float64Array(N * width);
  for (let first = 0; first < N; first += chunk) {
    if (options.signal?.aborted) throw new EstimationCancelledError();
    runner.run(opts.theta, first, Math.min(chunk, N - first), opts.cost, packed, first * width);
  }
  return {
    profiles: unpackProfiles(layout, packed, data.respondentIds, 0, opts.cost >= 0),
    population: getPopulationMoments(layout, opts.theta),
    draws: opts.draws,
  };
}
