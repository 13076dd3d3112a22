/**
 * Taste profiles on worker threads: the same work as computeTasteProfiles
 * (estimation/taste-profiles.ts), with the respondents split into one slice per thread over a
 * kernel arena whose variates area holds one chunk of respondents per thread. Respondents go
 * out in ranges of RANGE, so a cancel is seen after at most one range per thread.
 */
import type { ChoiceData } from '../estimation/choice-data';
import { EstimationCancelledError } from '../estimation/estimation-errors';
import type { MixedLogitLayout } from '../estimation/mixed-logit-layout';
import { getPopulationMoments } from '../estimation/population-moments';
import { getProfileWidth } from '../estimation/profile-moments';
import {
  checkTasteProfileOptions,
  PROFILE_CHUNK,
  unpackProfiles,
  type TasteProfileOptions,
  type TasteProfilesResult,
} from '../estimation/taste-profiles';
import { createKernelArena } from '../simd/kernel-arena';
import { chooseKernel } from '../simd/kernel-choice';
import { createSlicePool, splitRespondents } from './worker-pool-evaluator';
import { getSliceSetup, type InitSliceResult } from './worker-messages';

/** Respondents per message to a worker. */
const RANGE = 4 * PROFILE_CHUNK;
let keyCounter = 0;

/** computeTasteProfiles on `threads` worker threads. */
export async function computeTasteProfilesInWorkers(
  data: ChoiceData,
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
  options: TasteProfileOptions & { threads: number },
): Promise<TasteProfilesResult> {
  const opts = checkTasteProfileOptions(layout, theta, options);
  const N = data.taskStart.length - 1;
  const slices = splitRespondents(data, Math.max(1, Math.min(options.threads, N)));
  const arena = createKernelArena(
    data,
    layout,
    opts.draws.count,
    slices.map((s) => ({ ...s, variateRespondents: Math.min(PROFILE_CHUNK, s.count) })),
  );
  const choice = chooseKernel(opts.kernel, layout);
  const key = `profiles-${process.pid}-${++keyCounter}`;
  const pools = slices.map(() => createSlicePool());
  const width = getProfileWidth(layout.K);
  const packed = new Float64Array(N * width);
  try {
    const inits = (await Promise.all(
      pools.map((pool, i) =>
        pool.run({
          kind: 'profiles-init',
          key,
          ...getSliceSetup(arena, i, data.columns, layout),
          draws: opts.draws,
          kernel: choice.kind,
        }),
      ),
    )) as InitSliceResult[];
    for (const note of new Set([choice.note, ...inits.map((r) => r.note)]))
      if (note) options.onNote?.(note);
    await Promise.all(
      slices.map(async (slice, i) => {
        for (let first = slice.first; first < slice.first + slice.count; first += RANGE) {
          if (options.signal?.aborted) throw new EstimationCancelledError();
          const count = Math.min(RANGE, slice.first + slice.count - first);
          const rows = (await pools[i].run({
            kind: 'profiles',
            key,
            theta: opts.theta,
            first,
            count,
            cost: opts.cost,
          })) as Float64Array;
          packed.set(rows, first * width);
        }
      }),
    );
  } finally {
    await Promise.all(pools.map((pool) => pool.destroy()));
  }
  return {
    profiles: unpackProfiles(layout, packed, data.respondentIds, 0, opts.cost >= 0),
    population: getPopulationMoments(layout, opts.theta),
    draws: opts.draws,
  };
}
