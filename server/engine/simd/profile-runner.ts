/**
 * Taste profiles over one slice of a kernel arena, streaming respondents: the slice's
 * variates area holds one chunk of respondents' profile draws at a time, so memory stays
 * flat however many respondents there are. The chosen kernel (WebAssembly SIMD or
 * TypeScript) simulates each respondent; profile-moments.ts turns the draws into numbers.
 */
import { createMixedLogitKernel, type MixedLogitKernel } from '../estimation/mixed-logit-kernel';
import { getProfileWidth, summariseProfileDraws } from '../estimation/profile-moments';
import { fillStandardVariates } from '../estimation/standard-variates';
import { H_COUNT, H_FIRST, HEADER_WORDS } from './arena-header';
import { createArenaKernel, getArenaBuffer, type ArenaSlice } from './arena-kernel';
import { getArenaChoiceData } from './kernel-arena';
import type { KernelKind } from './kernel-choice';

export interface ProfileRunner {
  kind: KernelKind;
  note: string | null;
  /**
   * Packed profiles (getProfileWidth(K) values each) of respondents first..first+count−1,
   * which must lie in the runner's slice, into out[offset..].
   */
  run(
    theta: Float64Array,
    first: number,
    count: number,
    cost: number,
    out: Float64Array,
    offset: number,
  ): void;
}

export function createProfileRunner(params: ArenaSlice): ProfileRunner {
  const { plan, layout, draws } = params;
  const made = createArenaKernel({ ...params, fillDraws: false });
  const slice = plan.slices[params.sliceIndex];
  const buffer = getArenaBuffer(params.memory);
  const header = new Uint32Array(buffer, slice.header, HEADER_WORDS);
  const data =
    made.kind === 'typescript'
      ? getArenaChoiceData(buffer as SharedArrayBuffer, plan, params.columns)
      : null;
  const { K } = layout;
  const R = draws.count;
  const width = getProfileWidth(K);
  const betas = new Float64Array(K * R);
  const weights = new Float64Array(R);
  const chunk = slice.variateRespondents;
  return {
    kind: made.kind,
    note: made.note,
    run(theta, first, count, cost, out, offset) {
      if (first < slice.first || first + count > slice.first + slice.count)
        throw new RangeError('respondents outside the runner’s slice');
      for (let c = 0; c < count; c += chunk) {
        const m = Math.min(chunk, count - c);
        fillStandardVariates(layout, draws, first + c, m, made.variates);
        // The WebAssembly kernel reads the chunk from the header; the TypeScript one is made per chunk.
        header[H_FIRST] = first + c;
        header[H_COUNT] = m;
        const kernel: MixedLogitKernel = data
          ? createMixedLogitKernel(data, layout, made.variates, R, first + c, m)
          : made.kernel;
        for (let n = 0; n < m; n++) {
          kernel.simulateRespondent(n, theta, betas, weights);
          summariseProfileDraws(betas, weights, K, R, cost, out, offset + (c + n) * width);
        }
      }
    },
  };
}
