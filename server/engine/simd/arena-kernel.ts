/**
 * A mixed-logit kernel over one slice of a kernel arena, TypeScript or WebAssembly SIMD:
 * fills the slice's standard variates into the arena, then wraps the chosen kernel around
 * the arena's data. Used alike by the worker threads and by the in-process evaluator.
 */
import type { DrawsSpec } from '../draws/uniform-draws';
import { createMixedLogitKernel, type MixedLogitKernel } from '../estimation/mixed-logit-kernel';
import type { MixedLogitLayout } from '../estimation/mixed-logit-layout';
import { fillStandardVariates } from '../estimation/standard-variates';
import type { ArenaPlan } from './arena-plan';
import { getArenaChoiceData, type KernelArena } from './kernel-arena';
import { describeFallback, WTP_SPACE_REASON, type KernelKind } from './kernel-choice';
import { createSimdMixedLogitKernel } from './simd-mixed-logit-kernel';
import { loadSimdKernelModule } from './simd-kernel-module';

export interface ArenaKernel {
  kernel: MixedLogitKernel;
  kind: KernelKind;
  /** Set when SIMD was asked for but this thread had to fall back. */
  note: string | null;
  /** Float32 view of the slice's variates area. */
  variates: Float32Array;
}

/** The shared memory of an arena: a WebAssembly memory, or a bare SharedArrayBuffer. */
export type ArenaMemory = WebAssembly.Memory | SharedArrayBuffer;

/** What a kernel over one slice of an arena is made from. */
export interface ArenaSlice {
  memory: ArenaMemory;
  plan: ArenaPlan;
  sliceIndex: number;
  columns: readonly string[];
  layout: MixedLogitLayout;
  draws: Omit<DrawsSpec, 'dimensions'>;
  kind: KernelKind;
}

/** Slice `sliceIndex` of an arena made in this thread. */
export function getArenaSlice(
  arena: KernelArena,
  sliceIndex: number,
  rest: Omit<ArenaSlice, 'memory' | 'plan' | 'sliceIndex'>,
): ArenaSlice {
  return { memory: arena.memory ?? arena.buffer, plan: arena.plan, sliceIndex, ...rest };
}

export function getArenaBuffer(memory: ArenaMemory): SharedArrayBuffer {
  return memory instanceof WebAssembly.Memory
    ? (memory.buffer as unknown as SharedArrayBuffer)
    : memory;
}

/**
 * Creates the kernel of slice `sliceIndex`. With `fillDraws` the slice's variates (all its
 * respondents) are generated first; taste profiles fill theirs chunk by chunk instead.
 */
export function createArenaKernel(params: ArenaSlice & { fillDraws: boolean }): ArenaKernel {
  const { memory, plan, sliceIndex, layout, draws } = params;
  const slice = plan.slices[sliceIndex];
  const buffer = getArenaBuffer(memory);
  const variates = new Float32Array(
    buffer,
    slice.variates,
    slice.variateRespondents * layout.D * plan.stride,
  );
  if (params.fillDraws) fillStandardVariates(layout, draws, slice.first, slice.count, variates);
  let note: string | null = null;
  if (params.kind === 'simd' && layout.wtpCost >= 0) {
    note = describeFallback(WTP_SPACE_REASON);
  } else if (params.kind === 'simd') {
    const loaded = loadSimdKernelModule();
    if (loaded.module && memory instanceof WebAssembly.Memory) {
      return {
        kernel: createSimdMixedLogitKernel(loaded.module, memory, plan, sliceIndex),
        kind: 'simd',
        note: null,
        variates,
      };
    }
    note = describeFallback(loaded.reason ?? 'no shared WebAssembly memory could be made');
  }
  const data = getArenaChoiceData(buffer, plan, params.columns);
  return {
    kernel: createMixedLogitKernel(data, layout, variates, draws.count, slice.first, slice.count),
    kind: 'typescript',
    note,
    variates,
  };
}
